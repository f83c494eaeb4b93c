import { Column, Entity } from 'typeorm';
import type { RunReviewStatus, RunStatus } from '@meritline/shared';
import { EvaluatedRecordColumns } from '../methods/evaluated-record-columns.js';

/** A routine batch: the run's calibration, check standards and unknowns. */
@Entity('runs')
export class Run extends EvaluatedRecordColumns {
  @Column({ type: 'varchar', length: 10 })
  status: RunStatus;

  @Column({ type: 'varchar', length: 30 })
  model: string;

  @Column({ type: 'simple-json' })
  result: Record<string, unknown>;

  @Column({ name: 'rejection_reasons', type: 'simple-json' })
  rejectionReasons: string[];

  @Column({ name: 'review_status', type: 'varchar', length: 12, default: 'calculated' })
  reviewStatus: RunReviewStatus;

  @Column({ name: 'lock_version', type: 'integer', default: 1 })
  lockVersion: number;

  @Column({ name: 'submitted_at', type: Date, nullable: true })
  submittedAt: Date | null;

  @Column({ name: 'released_at', type: Date, nullable: true })
  releasedAt: Date | null;

  @Column({ name: 'return_comment', type: 'text', nullable: true })
  returnComment: string | null;

  @Column({ name: 'supersedes_id', type: 'uuid', nullable: true })
  supersedesId: string | null;

  @Column({ name: 'superseded_by_id', type: 'uuid', nullable: true })
  supersededById: string | null;

  @Column({ name: 'supersede_reason', type: 'text', nullable: true })
  supersedeReason: string | null;
}
