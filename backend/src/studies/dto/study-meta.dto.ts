import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsISO8601, IsOptional } from 'class-validator';
import { OptionalText } from '../../methods/dto/text.decorators.js';

const ISO_DATE = { message: 'Give the date as YYYY-MM-DD.' };

export class StudyMetaDto {
  @ApiPropertyOptional({ example: 'IC-2 (conductivity detector)' })
  @OptionalText(120)
  instrument?: string;

  @ApiPropertyOptional({ example: '2026-11-02', format: 'date' })
  @IsOptional()
  @IsISO8601({ strict: true }, ISO_DATE)
  startedOn?: string;

  @ApiPropertyOptional({ example: '2026-11-06', format: 'date' })
  @IsOptional()
  @IsISO8601({ strict: true }, ISO_DATE)
  finishedOn?: string;

  @ApiPropertyOptional({ description: 'The analyst’s conclusion on fitness for purpose.' })
  @OptionalText(4000)
  conclusion?: string;
}
