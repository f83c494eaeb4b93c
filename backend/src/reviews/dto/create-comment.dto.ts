import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import type { StudySection } from '@meritline/shared';
import { IsIn, IsOptional, IsString, IsUUID, Matches, MaxLength } from 'class-validator';
import { STUDY_SECTIONS } from '@meritline/shared';

export class CreateCommentDto {
  @ApiProperty({ enum: STUDY_SECTIONS })
  @IsIn(STUDY_SECTIONS, { message: `section must be one of: ${STUDY_SECTIONS.join(', ')}.` })
  section: StudySection;

  @ApiProperty({ maxLength: 4000 })
  @IsString()
  @Matches(/\S/, { message: 'Write the comment before posting it.' })
  @MaxLength(4000)
  body: string;

  @ApiPropertyOptional({ description: 'Reply to this thread (the id of its first comment).' })
  @IsOptional()
  @IsUUID()
  @MaxLength(36)
  threadId?: string;
}
