import { ApiPropertyOptional } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { IsBoolean, IsIn, IsISO8601, IsOptional, IsUUID } from 'class-validator';
import { STUDY_SORTS, STUDY_STATUSES, type StudySort, type StudyStatus } from '@meritline/shared';
import { CursorParam, PageSizeParam } from '../../common/keyset.js';
import { OptionalText } from '../../methods/dto/text.decorators.js';

export class ListStudiesQueryDto {
  @ApiPropertyOptional({ enum: STUDY_STATUSES })
  @IsOptional()
  @IsIn(STUDY_STATUSES, { message: `The status must be one of ${STUDY_STATUSES.join(', ')}.` })
  status?: StudyStatus;

  @ApiPropertyOptional()
  @IsOptional()
  @IsUUID('all')
  methodId?: string;

  @ApiPropertyOptional()
  @IsOptional()
  @IsUUID('all')
  methodVersionId?: string;

  @ApiPropertyOptional()
  @IsOptional()
  @IsUUID('all')
  authorId?: string;

  @ApiPropertyOptional({ description: 'Only my studies (overrides authorId).' })
  @IsOptional()
  @Transform(({ value }) => (value === 'true' ? true : value === 'false' ? false : value))
  @IsBoolean({ message: 'mine must be true or false.' })
  mine?: boolean;

  @ApiPropertyOptional({ description: 'Changed on or after this date (YYYY-MM-DD) or instant.', example: '2026-11-01' })
  @IsOptional()
  @IsISO8601({ strict: true }, { message: 'Give the date as YYYY-MM-DD.' })
  from?: string;

  @ApiPropertyOptional({ description: 'Changed on or before this date (YYYY-MM-DD, the whole day) or instant.', example: '2026-11-30' })
  @IsOptional()
  @IsISO8601({ strict: true }, { message: 'Give the date as YYYY-MM-DD.' })
  to?: string;

  @ApiPropertyOptional({ description: 'Text the title contains.' })
  @OptionalText(200)
  q?: string;

  @ApiPropertyOptional({ enum: STUDY_SORTS, default: 'updatedAt' })
  @IsOptional()
  @IsIn(STUDY_SORTS, { message: `Sort by one of ${STUDY_SORTS.join(', ')}.` })
  sort?: StudySort;

  @ApiPropertyOptional({ enum: ['desc', 'asc'], default: 'desc' })
  @IsOptional()
  @IsIn(['desc', 'asc'], { message: 'The order is asc or desc.' })
  order?: 'asc' | 'desc';

  @CursorParam('nextCursor or prevCursor of the page before; the first page without it.')
  cursor?: string;

  @PageSizeParam(20)
  pageSize?: number;
}
