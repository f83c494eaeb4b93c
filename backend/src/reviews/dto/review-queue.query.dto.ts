import { ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsIn, IsInt, IsOptional, IsString, Max, MaxLength, Min } from 'class-validator';
import type { ReviewQueueKind } from '@meritline/shared';
import { MAX_CURSOR_LENGTH } from '../../common/keyset.js';

export class ReviewQueueQueryDto {
  @ApiPropertyOptional({ enum: ['study', 'run'], description: 'Only validation studies or only routine runs.' })
  @IsOptional()
  @IsIn(['study', 'run'], { message: 'Choose study or run.' })
  kind?: ReviewQueueKind;

  @ApiPropertyOptional({ description: 'nextCursor of the page before; the first page without it.' })
  @IsOptional()
  @IsString()
  @MaxLength(MAX_CURSOR_LENGTH, { message: 'The page cursor is too long; start again from the first page.' })
  cursor?: string;

  @ApiPropertyOptional({ default: 50, minimum: 1, maximum: 100 })
  @IsOptional()
  @Type(() => Number)
  @Max(100)
  @Min(1)
  @IsInt()
  pageSize?: number;
}
