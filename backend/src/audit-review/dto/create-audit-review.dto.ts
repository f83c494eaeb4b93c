import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsIn, IsNotEmpty, IsOptional, IsString, Matches, MaxLength } from 'class-validator';
import type { AuditReviewScope } from '@meritline/shared';
import { RECORD_PATTERN } from './audit-trail-query.dto.js';

const DAY_PATTERN = /^\d{4}-\d{2}-\d{2}$/;

export class CreateAuditReviewDto {
  @ApiProperty({ enum: ['period', 'record'] })
  @IsIn(['period', 'record'], { message: 'Choose whether a period or a record was reviewed.' })
  scope: AuditReviewScope;

  @ApiPropertyOptional({ example: '2026-11-01' })
  @IsOptional()
  @Matches(DAY_PATTERN, { message: 'Give the day as YYYY-MM-DD.' })
  periodFrom?: string;

  @ApiPropertyOptional({ example: '2026-11-30' })
  @IsOptional()
  @Matches(DAY_PATTERN, { message: 'Give the day as YYYY-MM-DD.' })
  periodTo?: string;

  @ApiPropertyOptional({ example: 'study:00000000-0000-0000-0000-000000000000' })
  @IsOptional()
  @IsString()
  @MaxLength(60)
  @Matches(RECORD_PATTERN, { message: 'Name the record as kind:id.' })
  record?: string;

  @ApiPropertyOptional()
  @IsOptional()
  @IsString()
  @MaxLength(1000)
  comment?: string;

  @ApiProperty({ description: 'Your password, as your electronic signature.' })
  @IsString()
  @IsNotEmpty({ message: 'Enter your password to sign.' })
  @MaxLength(200)
  password: string;
}
