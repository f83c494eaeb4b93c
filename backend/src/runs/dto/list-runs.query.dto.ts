import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsIn, IsOptional, IsUUID } from 'class-validator';
import { CursorParam, PageSizeParam } from '../../common/keyset.js';
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

  @CursorParam('nextCursor or prevCursor of the page before; the first page without it.')
  cursor?: string;

  @PageSizeParam(20)
  pageSize: number = 20;
}
