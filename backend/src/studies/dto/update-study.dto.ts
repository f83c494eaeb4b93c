import { ApiProperty, ApiPropertyOptional, PartialType, PickType } from '@nestjs/swagger';
import { IsInt, Min } from 'class-validator';
import { OptionalText } from '../../methods/dto/text.decorators.js';
import { CreateStudyDto } from './create-study.dto.js';

export class UpdateStudyDto extends PartialType(PickType(CreateStudyDto, ['title', 'data', 'meta'] as const)) {
  @ApiProperty({ description: 'The lockVersion you read; a stale one is refused with 409.' })
  @Min(1)
  @IsInt({ message: 'Send the lockVersion you read.' })
  lockVersion: number;

  @ApiPropertyOptional({ description: 'Why the data change; required once the study has been returned.' })
  @OptionalText(500)
  reason?: string;
}
