import { ApiProperty, PartialType, PickType } from '@nestjs/swagger';
import { IsIn } from 'class-validator';
import { TEMPLATE_KEYS } from '../criteria-templates.js';
import { CreateMethodVersionDto } from './create-method-version.dto.js';
import { RequiredText } from './text.decorators.js';

export class CreateMethodDto extends PartialType(PickType(CreateMethodVersionDto, ['changeSummary', 'criteria', 'settings'] as const)) {
  @ApiProperty({ example: 'Nitrate in drinking water by ion chromatography' })
  @RequiredText(160, 'Give the method a name.')
  name: string;

  @ApiProperty({ example: 'Nitrate' })
  @RequiredText(120, 'Name the analyte.')
  analyte: string;

  @ApiProperty({ example: 'Drinking water' })
  @RequiredText(120, 'Name the matrix.')
  matrix: string;

  @ApiProperty({ example: 'Ion chromatography, suppressed conductivity' })
  @RequiredText(80, 'Name the technique.')
  technique: string;

  @ApiProperty({ example: 'mg/L', description: 'Unit of concentration (x).' })
  @RequiredText(30, 'Give the concentration unit.')
  xUnit: string;

  @ApiProperty({ example: 'µS·min', description: 'Unit of the instrument response (y).' })
  @RequiredText(30, 'Give the response unit.')
  yUnit: string;

  @ApiProperty({ enum: TEMPLATE_KEYS, description: 'Key of the criteria template the method starts from.' })
  @IsIn(TEMPLATE_KEYS, { message: `Choose a purpose: ${TEMPLATE_KEYS.join(', ')}.` })
  purpose: string;
}
