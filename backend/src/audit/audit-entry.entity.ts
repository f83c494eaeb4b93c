import { Column, Entity, PrimaryColumn } from 'typeorm';
import type { FieldChanges } from '@meritline/shared';

export type { FieldChanges };

/** Append-only; each row's hash covers the previous row's hash, so any edit breaks the chain. */
@Entity('audit_entries')
export class AuditEntry {
  @PrimaryColumn({ type: Number })
  seq: number;

  @Column({ type: Date })
  at: Date;

  @Column({ name: 'actor_id', type: 'uuid', nullable: true })
  actorId: string | null;

  @Column({ name: 'actor_name', type: 'varchar', length: 254 })
  actorName: string;

  @Column({ type: 'varchar', length: 60 })
  action: string;

  @Column({ type: 'varchar', length: 40 })
  entity: string;

  @Column({ name: 'entity_id', type: 'varchar', length: 64, nullable: true })
  entityId: string | null;

  @Column({ type: 'simple-json', nullable: true })
  changes: FieldChanges | null;

  @Column({ type: 'text', nullable: true })
  reason: string | null;

  @Column({ name: 'prev_hash', type: 'varchar', length: 64 })
  prevHash: string;

  @Column({ type: 'varchar', length: 64 })
  hash: string;
}
