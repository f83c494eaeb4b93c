import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { ArrayMaxSize, ArrayUnique, IsArray, IsIn, IsOptional, ValidateNested } from 'class-validator';
import { METHOD_CHANGE_KINDS, REVALIDATION_FAMILIES, type MethodChangeKind, type RevalidationFamily } from '@meritline/shared';
import { CriterionDto } from './criterion.dto.js';
import { MethodVersionSettingsDto } from './method-version-settings.dto.js';
import { RequiredText } from './text.decorators.js';

export const MAX_CRITERIA = 40;

export class CreateMethodVersionDto {
  @ApiProperty({ example: 'New analytical column; range extended to 50 mg/L.' })
  @RequiredText(2000, 'Say what changes in this version.')
  changeSummary: string;

  @ApiProperty({ enum: METHOD_CHANGE_KINDS, description: 'What kind of change this version makes.' })
  @IsIn(METHOD_CHANGE_KINDS, {
    message:
      'Choose the kind of change: instrument, column or consumable, sample preparation, range, calibration model, criteria or other.',
  })
  changeKind: MethodChangeKind;

  @ApiPropertyOptional({
    enum: REVALIDATION_FAMILIES,
    isArray: true,
    description: 'Families of figures a study of this version must show again before it is activated; none when left out.',
  })
  @IsOptional()
  @IsArray({ message: 'List the families of figures to show again.' })
  @ArrayUnique({ message: 'Name each family of figures once.' })
  @IsIn(REVALIDATION_FAMILIES, {
    each: true,
    message: 'The families to show again are linearity, detection-limits, recovery and precision.',
  })
  revalidationScope?: RevalidationFamily[];

  @ApiPropertyOptional({ type: [CriterionDto], description: 'Copied from the latest version when left out.' })
  @IsOptional()
  @IsArray()
  @ArrayMaxSize(MAX_CRITERIA)
  @ValidateNested({ each: true })
  @Type(() => CriterionDto)
  criteria?: CriterionDto[];

  @ApiPropertyOptional({ type: MethodVersionSettingsDto, description: 'Copied from the latest version when left out.' })
  @IsOptional()
  @ValidateNested()
  @Type(() => MethodVersionSettingsDto)
  settings?: MethodVersionSettingsDto;
}
