import { ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsIn, IsInt, IsOptional, IsString, IsUUID, Matches, Max, MaxLength, Min } from 'class-validator';
import { AUDIT_PAGE_SIZE_MAX, AUDIT_RECORD_KINDS, AUDIT_TEXT_QUERY_MAX } from '@meritline/shared';

export const RECORD_PATTERN = new RegExp(`^(${AUDIT_RECORD_KINDS.join('|')}):([0-9a-fA-F-]{36})$`);
const DAY_PATTERN = /^\d{4}-\d{2}-\d{2}$/;
const DAY_MESSAGE = 'Give the day as YYYY-MM-DD.';

export class AuditTrailQueryDto {
  @ApiPropertyOptional({ description: 'A record as kind:id, e.g. study:3f2c…', example: 'study:00000000-0000-0000-0000-000000000000' })
  @IsOptional()
  @IsString()
  @MaxLength(60)
  @Matches(RECORD_PATTERN, { message: `Name the record as kind:id, where kind is one of ${AUDIT_RECORD_KINDS.join(', ')}.` })
  record?: string;

  @ApiPropertyOptional({ description: 'The person who acted (user id).' })
  @IsOptional()
  @IsUUID('all', { message: 'Choose the person from the list.' })
  user?: string;

  @ApiPropertyOptional({ example: 'study.approved' })
  @IsOptional()
  @IsString()
  @MaxLength(60)
  @Matches(/^[a-z-]+(\.[a-z-]+)?$/, { message: 'Choose the action from the list.' })
  action?: string;

  @ApiPropertyOptional({ description: 'First day (YYYY-MM-DD, UTC), inclusive.' })
  @IsOptional()
  @Matches(DAY_PATTERN, { message: DAY_MESSAGE })
  from?: string;

  @ApiPropertyOptional({ description: 'Last day (YYYY-MM-DD, UTC), inclusive.' })
  @IsOptional()
  @Matches(DAY_PATTERN, { message: DAY_MESSAGE })
  to?: string;

  @ApiPropertyOptional({ description: 'Free text: person, action words, reason or changed values.' })
  @IsOptional()
  @IsString()
  @MaxLength(AUDIT_TEXT_QUERY_MAX)
  q?: string;

  @ApiPropertyOptional({ description: 'Sequence number from nextCursor: returns the entries older than it.' })
  @IsOptional()
  @Type(() => Number)
  @IsInt()
  @Min(1)
  cursor?: number;

  @ApiPropertyOptional({ description: 'Page number (1 = newest) when not paging by cursor.' })
  @IsOptional()
  @Type(() => Number)
  @IsInt()
  @Min(1)
  @Max(100_000)
  page?: number;

  @ApiPropertyOptional({ default: 50, maximum: AUDIT_PAGE_SIZE_MAX })
  @IsOptional()
  @Type(() => Number)
  @IsInt()
  @Min(1)
  @Max(AUDIT_PAGE_SIZE_MAX)
  pageSize?: number;
}

export class AuditExportQueryDto extends AuditTrailQueryDto {
  @ApiPropertyOptional({ enum: ['csv', 'pdf'] })
  @IsIn(['csv', 'pdf'], { message: 'Choose CSV or PDF.' })
  format: 'csv' | 'pdf';
}
