import { Column, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { Role, RunSignatureMeaning } from '@meritline/shared';
import { Run } from './run.entity.js';

/** An electronic signature on a run: who, as what, meaning what, when, over which content. */
@Entity('run_signatures')
export class RunSignature {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'run_id', type: 'uuid' })
  runId: string;

  @ManyToOne(() => Run, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'run_id' })
  run: Run;

  @Column({ name: 'signer_id', type: 'uuid' })
  signerId: string;

  @Column({ name: 'signer_name', type: 'varchar', length: 120 })
  signerName: string;

  @Column({ name: 'signer_role', type: 'varchar', length: 20 })
  signerRole: Role;

  @Column({ type: 'varchar', length: 30 })
  meaning: RunSignatureMeaning;

  @Column({ name: 'signed_at', type: Date })
  signedAt: Date;

  /** SHA-256 of the canonical JSON of { data, result } at signing. */
  @Column({ name: 'content_hash', type: 'varchar', length: 64 })
  contentHash: string;
}
