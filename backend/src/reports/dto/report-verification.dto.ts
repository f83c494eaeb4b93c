import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';

/** The answer to "is this file a report we issued, unchanged?" */
export class ReportVerificationDto {
  @ApiProperty({ description: 'True only for a byte-identical copy of an issued report.' })
  valid: boolean;

  @ApiPropertyOptional({ description: 'Why the file is not a valid report (only when valid is false).' })
  reason?: string;

  @ApiPropertyOptional({ format: 'uuid' })
  studyId?: string;

  @ApiPropertyOptional()
  studyTitle?: string;

  @ApiPropertyOptional({ format: 'uuid' })
  reportId?: string;

  @ApiPropertyOptional()
  methodName?: string;

  @ApiPropertyOptional({ description: 'Method version number.' })
  methodVersion?: number;

  @ApiPropertyOptional({ format: 'date-time' })
  signedAt?: string;

  @ApiPropertyOptional({ enum: ['self-qualification'], description: 'Set when the file is a self-qualification report.' })
  kind?: 'self-qualification';

  @ApiPropertyOptional({ format: 'uuid' })
  qualificationId?: string;

  @ApiPropertyOptional({ description: 'Checks passed (self-qualification).' })
  passed?: number;

  @ApiPropertyOptional({ description: 'Checks run (self-qualification).' })
  total?: number;

  @ApiPropertyOptional({ description: 'SHA-256 of the report file (hex).' })
  sha256?: string;
}
