import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { RunStatus } from '@meritline/shared';
import { MethodVersion } from '../methods/method-version.entity.js';

/** A routine batch: the run's calibration, check standards and unknowns. */
@Entity('runs')
export class Run {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'method_version_id', type: 'uuid' })
  methodVersionId: string;

  @ManyToOne(() => MethodVersion, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'method_version_id' })
  methodVersion: MethodVersion;

  @Column({ type: 'varchar', length: 200 })
  title: string;

  @Column({ type: 'varchar', length: 10 })
  status: RunStatus;

  @Column({ type: 'varchar', length: 30 })
  model: string;

  @Column({ type: 'simple-json' })
  data: Record<string, unknown>;

  @Column({ type: 'simple-json' })
  result: Record<string, unknown>;

  @Column({ name: 'rejection_reasons', type: 'simple-json' })
  rejectionReasons: string[];

  @Column({ name: 'engine_version', type: 'varchar', length: 20 })
  engineVersion: string;

  @Column({ name: 'data_hash', type: 'varchar', length: 64 })
  dataHash: string;

  @Column({ name: 'author_id', type: 'uuid' })
  authorId: string;

  @CreateDateColumn({ name: 'created_at' })
  createdAt: Date;
}
