import { Column, CreateDateColumn, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { MethodVersion } from './method-version.entity.js';

/** The columns of a record the engine evaluates on a method version: a validation study or a routine run. */
export abstract class EvaluatedRecordColumns {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'method_version_id', type: 'uuid' })
  methodVersionId: string;

  @ManyToOne(() => MethodVersion, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'method_version_id' })
  methodVersion: MethodVersion;

  @Column({ type: 'varchar', length: 200 })
  title: string;

  /** The input in the engine's format, as entered. */
  @Column({ type: 'simple-json' })
  data: Record<string, unknown>;

  @Column({ name: 'engine_version', type: 'varchar', length: 20 })
  engineVersion: string;

  /** SHA-256 of the canonical JSON of `data`. */
  @Column({ name: 'data_hash', type: 'varchar', length: 64 })
  dataHash: string;

  @Column({ name: 'author_id', type: 'uuid' })
  authorId: string;

  @CreateDateColumn({ name: 'created_at' })
  createdAt: Date;
}
