import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Transform, Type } from 'class-transformer';
import { IsBoolean, IsIn, IsInt, IsOptional, IsString, MaxLength, Min, ValidateIf } from 'class-validator';
import { OptionalText } from '../../methods/dto/text.decorators.js';
import { IMPORT_SECTIONS, type ImportSection } from '@meritline/shared';

/** The text fields of the multipart import request (the file itself travels as `file`). */
export class ImportStudyDto {
  @ApiProperty({ type: 'string', format: 'binary', description: 'CSV (separator , ; or tab) or XLSX (first worksheet), at most 5 MB.' })
  @IsOptional()
  file?: unknown;

  @ApiProperty({ enum: IMPORT_SECTIONS })
  @IsIn(IMPORT_SECTIONS, { message: `Choose the section: ${IMPORT_SECTIONS.join(', ')}.` })
  section: ImportSection;

  @ApiPropertyOptional({
    description: 'JSON: { "<target field>": "<column header>" }; auto-mapped when left out.',
    example: '{"x":"Conc (mg/L)","y":"Area"}',
  })
  @IsOptional()
  @IsString()
  @MaxLength(4000)
  mapping?: string;

  @ApiPropertyOptional({ description: 'true: answer the preview and save nothing.' })
  @IsOptional()
  @Transform(({ value }) => (value === 'true' ? true : value === 'false' ? false : value))
  @IsBoolean({ message: 'dryRun must be true or false.' })
  dryRun?: boolean;

  @ApiPropertyOptional({ description: 'The study’s lockVersion; required unless dryRun.' })
  @ValidateIf((dto: ImportStudyDto) => dto.dryRun !== true)
  @Type(() => Number)
  @Min(1)
  @IsInt({ message: 'Send the lockVersion you read.' })
  lockVersion?: number;

  @ApiPropertyOptional({ description: 'Why the data change; required once the study has been returned.' })
  @OptionalText(500)
  reason?: string;
}
