import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';
import { binaryColumnType } from '../database/column-types.js';

/** The signed results report of a released run, stored once; re-downloads return these bytes. */
@Entity('run_results_reports')
export class RunResultsReport {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'run_id', type: 'uuid', unique: true })
  runId: string;

  @Column({ name: 'method_version_id', type: 'uuid' })
  methodVersionId: string;

  @Column({ type: binaryColumnType })
  pdf: Buffer;

  @Column({ type: 'varchar', length: 64, unique: true })
  sha256: string;

  @Column({ name: 'size_bytes', type: Number })
  sizeBytes: number;

  @Column({ name: 'signed_at', type: Date })
  signedAt: Date;

  @CreateDateColumn({ name: 'created_at' })
  createdAt: Date;
}
