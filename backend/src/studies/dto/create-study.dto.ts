import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsObject, IsOptional, IsUUID, ValidateNested } from 'class-validator';
import { RequiredText } from '../../methods/dto/text.decorators.js';
import { StudyMetaDto } from './study-meta.dto.js';

export class CreateStudyDto {
  @ApiProperty({ description: 'The method version the study validates (draft or active).' })
  @IsUUID('all', { message: 'Choose a method version.' })
  methodVersionId: string;

  @ApiProperty({ example: 'Nitrate by IC: validation after the column change' })
  @RequiredText(200, 'Give the study a title.')
  title: string;

  @ApiProperty({
    type: 'object',
    additionalProperties: true,
    description:
      'The study in the engine’s input format (standards, blanks, recovery, precision, unknowns, lowSpikes…). The method version’s criteria replace any given here.',
  })
  @IsObject({ message: 'The study data must be an object.' })
  data: Record<string, unknown>;

  @ApiPropertyOptional({ type: StudyMetaDto })
  @IsOptional()
  @ValidateNested()
  @Type(() => StudyMetaDto)
  meta?: StudyMetaDto;
}
