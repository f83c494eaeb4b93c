import { Column, Entity, JoinColumn, ManyToOne } from 'typeorm';
import type { RunSignatureMeaning } from '@meritline/shared';
import { SignatureColumns } from '../database/signed-record-columns.js';
import { Run } from './run.entity.js';

@Entity('run_signatures')
export class RunSignature extends SignatureColumns<RunSignatureMeaning> {
  @Column({ name: 'run_id', type: 'uuid' })
  runId: string;

  @ManyToOne(() => Run, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'run_id' })
  run: Run;
}
