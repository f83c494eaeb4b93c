import type { StudyMeta, StudyStatus } from '@meritline/shared';
import { Column, Entity, JoinColumn, ManyToOne, UpdateDateColumn, VersionColumn } from 'typeorm';
import { EvaluatedRecordColumns } from '../methods/evaluated-record-columns.js';
import { User } from '../users/user.entity.js';

@Entity('validation_studies')
export class ValidationStudy extends EvaluatedRecordColumns {
  @Column({ type: 'varchar', length: 12 })
  status: StudyStatus;

  /** The engine's result for exactly `data`; null while the data cannot be evaluated yet. */
  @Column({ type: 'simple-json', nullable: true })
  result: Record<string, unknown> | null;

  /** Why the data cannot be evaluated yet (typed engine errors), shown beside the draft. */
  @Column({ name: 'result_errors', type: 'simple-json', nullable: true })
  resultErrors: { field: string; code: string; message: string }[] | null;

  @Column({ type: 'simple-json' })
  meta: StudyMeta;

  @ManyToOne(() => User, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'author_id' })
  author: User;

  /** Everyone who changed `data` (segregation of duties: none of them may approve). */
  @Column({ name: 'editor_ids', type: 'simple-json' })
  editorIds: string[];

  @Column({ name: 'copied_from_id', type: 'uuid', nullable: true })
  copiedFromId: string | null;

  @Column({ name: 'submitted_at', type: Date, nullable: true })
  submittedAt: Date | null;

  @Column({ name: 'approved_at', type: Date, nullable: true })
  approvedAt: Date | null;

  @UpdateDateColumn({ name: 'updated_at' })
  updatedAt: Date;

  @VersionColumn({ name: 'lock_version' })
  lockVersion: number;
}

/** The fields of a new draft: its author the only editor so far, never submitted. */
export const newDraftFields = (authorId: string) =>
  ({ status: 'draft', authorId, editorIds: [authorId], submittedAt: null, approvedAt: null }) satisfies Partial<ValidationStudy>;
