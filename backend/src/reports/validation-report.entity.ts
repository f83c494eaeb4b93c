import { Column, Entity } from 'typeorm';
import { StoredPdfColumns } from '../database/signed-record-columns.js';

/** The signed PDF issued for an approved study. */
@Entity('validation_reports')
export class ValidationReport extends StoredPdfColumns {
  @Column({ name: 'study_id', type: 'uuid', unique: true })
  studyId: string;

  @Column({ name: 'method_version_id', type: 'uuid' })
  methodVersionId: string;
}
