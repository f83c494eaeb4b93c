import { Column, Entity } from 'typeorm';
import { StoredPdfColumns } from '../database/signed-record-columns.js';

export const CHANGE_ASSESSED = 'change-assessed';

/** A quality manager's signed assessment of a method version against an earlier one. */
@Entity('change_assessments')
export class ChangeAssessment extends StoredPdfColumns {
  /** The newer version, the one the assessment is stored against. */
  @Column({ name: 'method_version_id', type: 'uuid' })
  methodVersionId: string;

  @Column({ name: 'compared_version_id', type: 'uuid' })
  comparedVersionId: string;

  @Column({ name: 'from_study_id', type: 'uuid', nullable: true })
  fromStudyId: string | null;

  @Column({ name: 'to_study_id', type: 'uuid', nullable: true })
  toStudyId: string | null;

  @Column({ name: 'signer_id', type: 'uuid' })
  signerId: string;

  @Column({ name: 'signer_name', type: 'varchar', length: 120 })
  signerName: string;

  @Column({ type: 'varchar', length: 30 })
  meaning: typeof CHANGE_ASSESSED;

  @Column({ type: 'text' })
  statement: string;
}
