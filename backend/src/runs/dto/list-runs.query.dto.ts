import { ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsIn, IsInt, IsOptional, IsString, IsUUID, Max, MaxLength, Min } from 'class-validator';
import { MAX_CURSOR_LENGTH } from '../../common/keyset.js';
import type { RunStatus } from '@meritline/shared';

export class ListRunsQueryDto {
  @ApiPropertyOptional({ format: 'uuid' })
  @IsOptional()
  @IsUUID('all')
  methodVersionId?: string;

  @ApiPropertyOptional({ format: 'uuid' })
  @IsOptional()
  @IsUUID('all')
  methodId?: string;

  @ApiPropertyOptional({ enum: ['accepted', 'rejected'] })
  @IsOptional()
  @IsIn(['accepted', 'rejected'], { message: 'Status is accepted or rejected.' })
  status?: RunStatus;

  @ApiPropertyOptional({ description: 'nextCursor or prevCursor of the page before; the first page without it.' })
  @IsOptional()
  @IsString()
  @MaxLength(MAX_CURSOR_LENGTH, { message: 'The page cursor is too long; start again from the first page.' })
  cursor?: string;

  @ApiPropertyOptional({ default: 20 })
  @IsOptional()
  @Type(() => Number)
  @IsInt()
  @Min(1)
  @Max(100)
  pageSize: number = 20;
}
