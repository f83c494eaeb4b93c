import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsIn, IsOptional } from 'class-validator';
import type { ReviewQueueKind } from '@meritline/shared';

export class ReviewQueueQueryDto {
  @ApiPropertyOptional({ enum: ['study', 'run'], description: 'Only validation studies or only routine runs.' })
  @IsOptional()
  @IsIn(['study', 'run'], { message: 'Choose study or run.' })
  kind?: ReviewQueueKind;
}
