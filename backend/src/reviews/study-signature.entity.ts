import { Column, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { Role, SignatureMeaning } from '@meritline/shared';
import { ValidationStudy } from '../studies/validation-study.entity.js';

/** An electronic signature: who, as what, meaning what, when, over which content. */
@Entity('study_signatures')
export class StudySignature {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'study_id', type: 'uuid' })
  studyId: string;

  @ManyToOne(() => ValidationStudy, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'study_id' })
  study: ValidationStudy;

  @Column({ name: 'signer_id', type: 'uuid' })
  signerId: string;

  @Column({ name: 'signer_name', type: 'varchar', length: 120 })
  signerName: string;

  @Column({ name: 'signer_role', type: 'varchar', length: 20 })
  signerRole: Role;

  @Column({ type: 'varchar', length: 30 })
  meaning: SignatureMeaning;

  @Column({ name: 'signed_at', type: Date })
  signedAt: Date;

  /** SHA-256 of the canonical JSON of { data, result } at signing. */
  @Column({ name: 'content_hash', type: 'varchar', length: 64 })
  contentHash: string;

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
