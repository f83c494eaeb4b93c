import { Column, Entity, JoinColumn, ManyToOne } from 'typeorm';
import type { SignatureMeaning } from '@meritline/shared';
import { SignatureColumns } from '../database/signed-record-columns.js';
import { ValidationStudy } from '../studies/validation-study.entity.js';

@Entity('study_signatures')
export class StudySignature extends SignatureColumns<SignatureMeaning> {
  @Column({ name: 'study_id', type: 'uuid' })
  studyId: string;

  @ManyToOne(() => ValidationStudy, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'study_id' })
  study: ValidationStudy;

  @Column({ type: 'text', nullable: true })
  comment: string | null;

  /** Why the signer approved although the study does not meet all its criteria. */
  @Column({ type: 'text', nullable: true })
  justification: string | null;

  /** The study data as signed, kept for the diff between submissions. */
  @Column({ name: 'data_snapshot', type: 'simple-json', nullable: true })
  dataSnapshot: Record<string, unknown> | null;

  /** The result as signed with `dataSnapshot`. */
  @Column({ name: 'result_snapshot', type: 'simple-json', nullable: true })
  resultSnapshot: Record<string, unknown> | null;

  /** The title and record fields (conclusion, instrument, dates) as signed with `dataSnapshot`. */
  @Column({ name: 'meta_snapshot', type: 'simple-json', nullable: true })
  metaSnapshot: Record<string, unknown> | null;
}
