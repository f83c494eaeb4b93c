import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, Unique, VersionColumn } from 'typeorm';
import type { MethodChangeKind, MethodVersionSettings, MethodVersionStatus, RevalidationFamily } from '@meritline/shared';
import { Method } from './method.entity.js';

/** Study criteria in the engine's format: { figure, op, value, level? }. */
export type CriteriaSet = { figure: string; op: string; value: number | [number, number]; level?: string | number; label?: string }[];

@Entity('method_versions')
@Unique(['methodId', 'number'])
export class MethodVersion {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'method_id', type: 'uuid' })
  methodId: string;

  @ManyToOne(() => Method, (method) => method.versions, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'method_id' })
  method: Method;

  @Column({ type: Number })
  number: number;

  @Column({ name: 'change_summary', type: 'text' })
  changeSummary: string;

  /** Null for the first version of a method. */
  @Column({ name: 'change_kind', type: 'varchar', length: 30, nullable: true })
  changeKind: MethodChangeKind | null;

  /** Families of figures a study of this version must show again before it is activated. */
  @Column({ name: 'revalidation_scope', type: 'simple-json', nullable: true })
  revalidationScope: RevalidationFamily[] | null;

  /** Set when a quality manager activated the version without a study covering its scope. */
  @Column({ name: 'activation_justification', type: 'text', nullable: true })
  activationJustification: string | null;

  @Column({ type: 'varchar', length: 10 })
  status: MethodVersionStatus;

  @Column({ type: 'simple-json' })
  criteria: CriteriaSet;

  @Column({ type: 'simple-json' })
  settings: MethodVersionSettings;

  @Column({ name: 'created_by_id', type: 'uuid' })
  createdById: string;

  @CreateDateColumn({ name: 'created_at' })
  createdAt: Date;

  @VersionColumn({ name: 'lock_version' })
  lockVersion: number;
}
