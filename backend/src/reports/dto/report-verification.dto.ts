import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';

/** The answer to "is this file a report we issued, unchanged?" */
export class ReportVerificationDto {
  @ApiProperty({ description: 'True only for a byte-identical copy of an issued report.' })
  valid: boolean;

  @ApiPropertyOptional({ description: 'Why the file is not a valid report (only when valid is false).' })
  reason?: string;

  @ApiPropertyOptional({
    enum: ['validation-report', 'change-assessment', 'results-report', 'self-qualification'],
    description: 'What kind of signed document the file is.',
  })
  kind?: 'validation-report' | 'change-assessment' | 'results-report' | 'self-qualification';

  @ApiPropertyOptional({ format: 'uuid', description: 'Results reports: the released run.' })
  runId?: string;

  @ApiPropertyOptional()
  runTitle?: string;

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

  @ApiPropertyOptional({ format: 'uuid' })
  qualificationId?: string;

  @ApiPropertyOptional({ description: 'Checks passed (self-qualification).' })
  passed?: number;

  @ApiPropertyOptional({ description: 'Checks run (self-qualification).' })
  total?: number;

  @ApiPropertyOptional({ description: 'SHA-256 of the report file (hex).' })
  sha256?: string;
}
