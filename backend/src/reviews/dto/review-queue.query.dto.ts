import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsIn, IsOptional } from 'class-validator';
import type { ReviewQueueKind } from '@meritline/shared';
import { CursorParam, PageSizeParam } from '../../common/keyset.js';

export class ReviewQueueQueryDto {
  @ApiPropertyOptional({ enum: ['study', 'run'], description: 'Only validation studies or only routine runs.' })
  @IsOptional()
  @IsIn(['study', 'run'], { message: 'Choose study or run.' })
  kind?: ReviewQueueKind;

  @CursorParam('nextCursor of the page before; the first page without it.')
  cursor?: string;

  @PageSizeParam(50)
  pageSize?: number;
}
