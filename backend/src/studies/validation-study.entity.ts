import type { StudyMeta, StudyStatus } from '@meritline/shared';
import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn, VersionColumn } from 'typeorm';
import { MethodVersion } from '../methods/method-version.entity.js';
import { User } from '../users/user.entity.js';

@Entity('validation_studies')
export class ValidationStudy {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'method_version_id', type: 'uuid' })
  methodVersionId: string;

  @ManyToOne(() => MethodVersion, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'method_version_id' })
  methodVersion: MethodVersion;

  @Column({ type: 'varchar', length: 200 })
  title: string;

  @Column({ type: 'varchar', length: 12 })
  status: StudyStatus;

  /** The study in the engine's input format. */
  @Column({ type: 'simple-json' })
  data: Record<string, unknown>;

  /** The engine's result for exactly `data`; null while the data cannot be evaluated yet. */
  @Column({ type: 'simple-json', nullable: true })
  result: Record<string, unknown> | null;

  /** Why the data cannot be evaluated yet (typed engine errors), shown beside the draft. */
  @Column({ name: 'result_errors', type: 'simple-json', nullable: true })
  resultErrors: { field: string; code: string; message: string }[] | null;

  @Column({ name: 'engine_version', type: 'varchar', length: 20 })
  engineVersion: string;

  /** SHA-256 of the canonical JSON of `data`. */
  @Column({ name: 'data_hash', type: 'varchar', length: 64 })
  dataHash: string;

  @Column({ type: 'simple-json' })
  meta: StudyMeta;

  @Column({ name: 'author_id', type: 'uuid' })
  authorId: string;

  @ManyToOne(() => User, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'author_id' })
  author: User;

  /** Everyone who changed `data` (segregation of duties: none of them may approve). */
  @Column({ name: 'editor_ids', type: 'simple-json' })
  editorIds: string[];

  @Column({ name: 'copied_from_id', type: 'uuid', nullable: true })
  copiedFromId: string | null;

  @Column({ name: 'submitted_at', type: Date, nullable: true })
  submittedAt: Date | null;

  @Column({ name: 'approved_at', type: Date, nullable: true })
  approvedAt: Date | null;

  @CreateDateColumn({ name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at' })
  updatedAt: Date;

  @VersionColumn({ name: 'lock_version' })
  lockVersion: number;
}
