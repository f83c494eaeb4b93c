import { Column, Entity } from 'typeorm';
import { StoredPdfColumns } from '../database/signed-record-columns.js';

/** The signed results report of a released run. */
@Entity('run_results_reports')
export class RunResultsReport extends StoredPdfColumns {
  @Column({ name: 'run_id', type: 'uuid', unique: true })
  runId: string;

  @Column({ name: 'method_version_id', type: 'uuid' })
  methodVersionId: string;
}
