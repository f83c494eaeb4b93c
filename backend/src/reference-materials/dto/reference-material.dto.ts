import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import {
  CERTIFIED_VALUE_KINDS,
  type CertificateFileDto,
  type CertifiedValueKind,
  type ReferenceMaterialDto as Shape,
  type ReferenceMaterialStatus,
} from '@meritline/shared';

export class CertificateFileResponseDto implements CertificateFileDto {
  @ApiProperty() fileName: string;
  @ApiProperty() sizeBytes: number;
  @ApiProperty() sha256: string;
  @ApiProperty({ format: 'date-time' }) uploadedAt: string;
}

export class ReferenceMaterialResponseDto implements Shape {
  @ApiProperty() id: string;
  @ApiProperty() name: string;
  @ApiProperty() analyte: string;
  @ApiProperty() supplier: string;
  @ApiProperty() lot: string;
  @ApiProperty() certificateNumber: string;
  @ApiProperty({ enum: CERTIFIED_VALUE_KINDS }) valueKind: CertifiedValueKind;
  @ApiProperty() certifiedValue: number;
  @ApiProperty() unit: string;
  @ApiProperty({ nullable: true, type: Number }) expandedUncertainty: number | null;
  @ApiProperty({ nullable: true, type: Number }) coverageFactor: number | null;
  @ApiProperty({ description: 'u as stated, or U/k.' }) standardUncertainty: number;
  @ApiProperty({ format: 'date' }) receivedOn: string;
  @ApiProperty({ format: 'date', nullable: true, type: String }) openedOn: string | null;
  @ApiProperty({ format: 'date' }) expiresOn: string;
  @ApiProperty() storage: string;
  @ApiProperty({ enum: ['in-use', 'expired', 'withdrawn'] }) status: ReferenceMaterialStatus;
  @ApiProperty() daysToExpiry: number;
  @ApiProperty() expiringSoon: boolean;
  @ApiProperty({ nullable: true, type: String }) withdrawnReason: string | null;
  @ApiProperty({ nullable: true, type: String, format: 'date-time' }) withdrawnAt: string | null;
  @ApiPropertyOptional({ type: CertificateFileResponseDto, nullable: true }) certificate: CertificateFileResponseDto | null;
  @ApiProperty() lockVersion: number;
  @ApiProperty({ format: 'date-time' }) createdAt: string;
  @ApiProperty({ format: 'date-time' }) updatedAt: string;
}
