import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { AuditRecordKind, AuditReviewScope } from '@meritline/shared';

/** A quality manager's signed statement that a period or a record of the audit trail was reviewed. */
@Entity('audit_reviews')
export class AuditReview {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'varchar', length: 10 })
  scope: AuditReviewScope;

  @Column({ name: 'period_from', type: 'varchar', length: 10, nullable: true })
  periodFrom: string | null;

  @Column({ name: 'period_to', type: 'varchar', length: 10, nullable: true })
  periodTo: string | null;

  @Column({ name: 'record_kind', type: 'varchar', length: 20, nullable: true })
  recordKind: AuditRecordKind | null;

  @Column({ name: 'record_id', type: 'varchar', length: 64, nullable: true })
  recordId: string | null;

  @Column({ type: 'varchar', length: 300 })
  subject: string;

  @Column({ name: 'reviewer_id', type: 'uuid' })
  reviewerId: string;

  @Column({ name: 'reviewer_name', type: 'varchar', length: 120 })
  reviewerName: string;

  @Column({ name: 'reviewed_at', type: Date })
  reviewedAt: Date;

  @Column({ type: 'text', nullable: true })
  comment: string | null;

  @Column({ name: 'last_seq', type: Number })
  lastSeq: number;

  @Column({ type: Number })
  entries: number;

  @Column({ name: 'chain_intact', type: Boolean })
  chainIntact: boolean;
}
