import { Column, Entity, PrimaryColumn } from 'typeorm';
import type { QualificationCheckResult, QualificationInstallation } from '@meritline/shared';
import { binaryColumnType } from '../database/column-types.js';

/** One run of the published checks through the engine of this installation, with its signed report. */
@Entity('qualification_runs')
export class QualificationRun {
  @PrimaryColumn({ type: 'uuid' })
  id: string;

  @Column({ name: 'ran_at', type: Date })
  ranAt: Date;

  @Column({ name: 'ran_by_id', type: 'uuid' })
  ranById: string;

  @Column({ name: 'ran_by_name', type: 'varchar', length: 120 })
  ranByName: string;

  @Column({ type: 'simple-json' })
  installation: QualificationInstallation;

  @Column({ type: Number })
  total: number;

  @Column({ type: Number })
  passed: number;

  @Column({ name: 'all_passed', type: Boolean })
  allPassed: boolean;

  @Column({ type: 'simple-json' })
  results: { checks: QualificationCheckResult[]; minDigits: number | null };

  @Column({ type: binaryColumnType, select: false })
  pdf: Buffer;

  @Column({ type: 'varchar', length: 64 })
  sha256: string;

  @Column({ name: 'size_bytes', type: Number })
  sizeBytes: number;
}
