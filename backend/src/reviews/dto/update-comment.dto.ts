import { ApiProperty } from '@nestjs/swagger';
import { IsBoolean } from 'class-validator';

export class UpdateCommentDto {
  @ApiProperty()
  @IsBoolean()
  resolved: boolean;
}
