import { Injectable, Logger } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { createHash } from 'node:crypto';
import { DataSource, type EntityManager } from 'typeorm';
import type { QueryDeepPartialEntity } from 'typeorm/query-builder/QueryPartialEntity.js';
import { canonicalJson } from '@meritline/shared';
import { writeTransaction } from '../database/write-transaction.js';
import { AuditEntry, type FieldChanges } from './audit-entry.entity.js';

export const GENESIS_HASH = '0'.repeat(64);

export interface AuditRecord {
  actor: { id: string; name: string } | { id: null; name: string };
  action: string;
  entity: string;
  entityId?: string | null;
  changes?: FieldChanges | null;
  reason?: string | null;
}

export interface AuditBreak {
  seq: number;
  reason: string;
}

export type AuditVerification =
  { ok: true; rows: number } | { ok: false; rows: number; brokenAt: number; reason: string; broken: AuditBreak[] };

export function auditHash(entry: Omit<AuditEntry, 'hash'>): string {
  const content = canonicalJson({
    seq: entry.seq,
    at: entry.at.toISOString(),
    actorId: entry.actorId,
    actorName: entry.actorName,
    action: entry.action,
    entity: entry.entity,
    entityId: entry.entityId,
    changes: entry.changes,
    reason: entry.reason,
  });
  return createHash('sha256')
    .update(entry.prevHash + content)
    .digest('hex');
}

@Injectable()
export class AuditService {
  private readonly logger = new Logger(AuditService.name);

  constructor(@InjectDataSource() private readonly dataSource: DataSource) {}

  /** Pass the caller's transaction manager so the entry commits or rolls back with the change it records. */
  async record(record: AuditRecord, manager?: EntityManager): Promise<AuditEntry> {
    for (let attempt = 0; ; attempt++) {
      try {
        return await (manager ? this.append(record, manager) : writeTransaction(this.dataSource, (m) => this.append(record, m)));
      } catch (error) {
        if (attempt >= 5 || !/unique|duplicate|constraint/i.test((error as Error).message)) throw error;
        this.logger.warn('Audit sequence taken by a concurrent writer; retrying.');
      }
    }
  }

  private async append(record: AuditRecord, manager: EntityManager): Promise<AuditEntry> {
    const repo = manager.getRepository(AuditEntry);
    const [last] = await repo.find({ order: { seq: 'DESC' }, take: 1 });
    const entry = repo.create({
      seq: (last?.seq ?? 0) + 1,
      at: new Date(),
      actorId: record.actor.id,
      actorName: record.actor.name,
      action: record.action,
      entity: record.entity,
      entityId: record.entityId ?? null,
      changes: record.changes ? (JSON.parse(JSON.stringify(record.changes)) as FieldChanges) : null,
      reason: record.reason ?? null,
      prevHash: last?.hash ?? GENESIS_HASH,
    });
    entry.hash = auditHash(entry);
    await repo.insert(entry as QueryDeepPartialEntity<AuditEntry>);
    return entry;
  }

  list(filter: { entity?: string; entityId?: string; limit?: number }): Promise<AuditEntry[]> {
    return this.dataSource.getRepository(AuditEntry).find({
      where: { ...(filter.entity ? { entity: filter.entity } : {}), ...(filter.entityId ? { entityId: filter.entityId } : {}) },
      order: { seq: 'DESC' },
      take: Math.min(filter.limit ?? 500, 5000),
    });
  }

  /** Walks the whole chain and reports every broken entry, not only the first. */
  async verify(): Promise<AuditVerification> {
    const repo = this.dataSource.getRepository(AuditEntry);
    const broken: AuditBreak[] = [];
    let prevHash = GENESIS_HASH;
    let expectedSeq = 1;
    let rows = 0;
    const batch = 1000;
    for (let offset = 0; ; offset += batch) {
      const entries = await repo.find({ order: { seq: 'ASC' }, skip: offset, take: batch });
      for (const entry of entries) {
        rows++;
        if (entry.seq !== expectedSeq) broken.push({ seq: entry.seq, reason: `entry ${expectedSeq} is missing` });
        else if (entry.prevHash !== prevHash) broken.push({ seq: entry.seq, reason: 'link to the previous entry does not match' });
        if (auditHash(entry) !== entry.hash) broken.push({ seq: entry.seq, reason: 'content does not match its hash' });
        prevHash = entry.hash;
        expectedSeq = entry.seq + 1;
      }
      if (entries.length < batch) break;
    }
    if (!broken.length) return { ok: true, rows };
    return { ok: false, rows, brokenAt: broken[0].seq, reason: broken[0].reason, broken };
  }
}
