import { ApiProperty } from '@nestjs/swagger';
import type { QualificationInstallation, QualificationRunDetailDto, QualificationRunDto } from '@meritline/shared';
import { describedList } from '../../common/openapi/api-responses.js';

class QualificationInstallationDto implements QualificationInstallation {
  @ApiProperty() productVersion: string;
  @ApiProperty() engineVersion: string;
  @ApiProperty() gitRevision: string;
  @ApiProperty() nodeVersion: string;
  @ApiProperty() databaseKind: string;
  @ApiProperty() laboratoryName: string;
}

export class QualificationRunResponseDto implements QualificationRunDto {
  @ApiProperty() id: string;
  @ApiProperty({ format: 'date-time' }) ranAt: string;
  @ApiProperty() ranByName: string;
  @ApiProperty({ type: QualificationInstallationDto }) installation: QualificationInstallationDto;
  @ApiProperty() total: number;
  @ApiProperty() passed: number;
  @ApiProperty() failed: number;
  @ApiProperty() allPassed: boolean;
  @ApiProperty({ type: Number, nullable: true, description: 'The fewest digits of agreement over the certified values.' })
  minDigits: number | null;
  @ApiProperty({ description: 'SHA-256 of the signed PDF.' }) sha256: string;
  @ApiProperty() sizeBytes: number;
}

export class QualificationRunDetailResponseDto extends QualificationRunResponseDto implements QualificationRunDetailDto {
  @ApiProperty(
    describedList(
      'Each check: { id, quantity, source, expected, obtained, digits, tolerance, toleranceKind, requiredDigits, pass }, its source named.',
    ),
  )
  checks: QualificationRunDetailDto['checks'];
}
