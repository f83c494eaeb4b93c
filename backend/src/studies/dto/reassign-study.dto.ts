import { ApiProperty } from '@nestjs/swagger';
import { IsInt, IsUUID, Min } from 'class-validator';
import { RequiredText } from '../../methods/dto/text.decorators.js';

export class ReassignStudyDto {
  @ApiProperty({ format: 'uuid', description: 'The active analyst who takes the draft over.' })
  @IsUUID('4', { message: 'Choose the analyst who takes the study over.' })
  authorId: string;

  @ApiProperty({ maxLength: 500, description: 'Why the draft changes hands; kept in the audit trail.' })
  @RequiredText(500, 'Say why the study changes hands.')
  reason: string;

  @ApiProperty({ description: 'The lockVersion you read; a stale one is refused with 409.' })
  @Min(1)
  @IsInt({ message: 'Send the lockVersion you read.' })
  lockVersion: number;
}
