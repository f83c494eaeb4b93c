import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn, VersionColumn } from 'typeorm';
import type { CertifiedValueKind } from '@meritline/shared';
import { binaryColumnType } from '../database/column-types.js';

@Entity('reference_materials')
export class ReferenceMaterial {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'varchar', length: 160 })
  name: string;

  @Column({ type: 'varchar', length: 120 })
  analyte: string;

  @Column({ type: 'varchar', length: 160 })
  supplier: string;

  @Column({ type: 'varchar', length: 80 })
  lot: string;

  @Column({ name: 'certificate_number', type: 'varchar', length: 80 })
  certificateNumber: string;

  @Column({ name: 'value_kind', type: 'varchar', length: 10 })
  valueKind: CertifiedValueKind;

  @Column({ name: 'certified_value', type: 'double precision' })
  certifiedValue: number;

  @Column({ type: 'varchar', length: 30 })
  unit: string;

  @Column({ name: 'expanded_uncertainty', type: 'double precision', nullable: true })
  expandedUncertainty: number | null;

  @Column({ name: 'coverage_factor', type: 'double precision', nullable: true })
  coverageFactor: number | null;

  @Column({ name: 'standard_uncertainty', type: 'double precision', nullable: true })
  standardUncertainty: number | null;

  @Column({ name: 'received_on', type: 'varchar', length: 10 })
  receivedOn: string;

  @Column({ name: 'opened_on', type: 'varchar', length: 10, nullable: true })
  openedOn: string | null;

  @Column({ name: 'expires_on', type: 'varchar', length: 10 })
  expiresOn: string;

  @Column({ type: 'varchar', length: 500, default: '' })
  storage: string;

  @Column({ name: 'withdrawn_at', type: Date, nullable: true })
  withdrawnAt: Date | null;

  @Column({ name: 'withdrawn_reason', type: 'text', nullable: true })
  withdrawnReason: string | null;

  /** Loaded only for the download. */
  @Column({ name: 'certificate_pdf', type: binaryColumnType, nullable: true, select: false })
  certificatePdf?: Buffer | null;

  @Column({ name: 'certificate_file_name', type: 'varchar', length: 200, nullable: true })
  certificateFileName: string | null;

  @Column({ name: 'certificate_size_bytes', type: Number, nullable: true })
  certificateSizeBytes: number | null;

  @Column({ name: 'certificate_sha256', type: 'varchar', length: 64, nullable: true })
  certificateSha256: string | null;

  @Column({ name: 'certificate_uploaded_at', type: Date, nullable: true })
  certificateUploadedAt: Date | null;

  /** Set when the quality managers were told the expiry is near, so they are told once. */
  @Column({ name: 'expiry_notice_sent_at', type: Date, nullable: true })
  expiryNoticeSentAt: Date | null;

  @Column({ name: 'created_by_id', type: 'uuid' })
  createdById: string;

  @CreateDateColumn({ name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at' })
  updatedAt: Date;

  @VersionColumn({ name: 'lock_version' })
  lockVersion: number;
}
