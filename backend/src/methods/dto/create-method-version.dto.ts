import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { ArrayMaxSize, IsArray, IsOptional, ValidateNested } from 'class-validator';
import { CriterionDto } from './criterion.dto.js';
import { MethodVersionSettingsDto } from './method-version-settings.dto.js';
import { RequiredText } from './text.decorators.js';

export const MAX_CRITERIA = 40;

export class CreateMethodVersionDto {
  @ApiProperty({ example: 'New analytical column; range extended to 50 mg/L.' })
  @RequiredText(2000, 'Say what changes in this version.')
  changeSummary: string;

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
