import { Inject, Injectable, Optional, Logger, type OnApplicationBootstrap, type OnApplicationShutdown } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { createHash, createHmac, timingSafeEqual } from 'node:crypto';
import { appendFileSync, existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { appConfig, type AppConfigType } from '../config/app.config.js';
import { DataSource, MoreThan, type EntityManager } from 'typeorm';
import type { QueryDeepPartialEntity } from 'typeorm/query-builder/QueryPartialEntity.js';
import { canonicalJson } from '@meritline/shared';
import { writeTransaction } from '../database/write-transaction.js';
import { AuditEntry, type FieldChanges } from './audit-entry.entity.js';

export const GENESIS_HASH = '0'.repeat(64);
/** The PostgreSQL advisory lock key that serialises appends to the chain (any fixed number no other lock uses). */
const AUDIT_CHAIN_LOCK = 7_204_311_889;

export interface AuditRecord {
  actor: { id: string; name: string } | { id: null; name: string };
  action: string;
  entity: string;
  entityId?: string | null;
  changes?: FieldChanges | null;
  reason?: string | null;
}

/** The changes of a record that did not exist before: each field from nothing to its value. */
export const createdFields = (fields: Record<string, unknown>): FieldChanges =>
  Object.fromEntries(Object.entries(fields).map(([field, to]) => [field, { from: null, to }]));

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

export interface AuditCheckpoint {
  at: string;
  rows: number;
  head: string;
  mac: string;
}

const DAY_MS = 24 * 60 * 60_000;

@Injectable()
export class AuditService implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly logger = new Logger(AuditService.name);
  private timer: NodeJS.Timeout | null = null;

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    // Absent when the demo seeder builds its own instance: it then writes no checkpoints.
    @Optional() @Inject(appConfig.KEY) private readonly config?: AppConfigType,
  ) {}

  onApplicationBootstrap() {
    if (!this.config) return;
    this.timer = setInterval(
      () => void this.checkpoint().catch((e: Error) => this.logger.error(`Audit checkpoint failed: ${e.message}`)),
      DAY_MS,
    );
    this.timer.unref();
  }

  onApplicationShutdown() {
    if (this.timer) clearInterval(this.timer);
  }

  private get checkpointFile() {
    return this.config ? join(this.config.dataDir, 'audit-checkpoints.jsonl') : null;
  }

  private mac(at: string, rows: number, head: string) {
    return createHmac('sha256', this.config?.auditHmacKey ?? '')
      .update(`${at}|${rows}|${head}`)
      .digest('hex');
  }

  /**
   * Writes the head hash and row count, keyed with a secret outside the database, to a file in the data folder.
   * Queued behind the write in progress, so it records committed rows only. Verification then detects removed
   * entries and any rewrite of the entries before the checkpoint, even with their hashes recomputed.
   */
  checkpoint(): Promise<AuditCheckpoint | null> {
    const file = this.checkpointFile;
    if (!file) return Promise.resolve(null);
    return writeTransaction(this.dataSource, async (manager) => {
      const [last] = await manager.getRepository(AuditEntry).find({ order: { seq: 'DESC' }, take: 1 });
      const at = new Date().toISOString();
      const rows = last?.seq ?? 0;
      const head = last?.hash ?? GENESIS_HASH;
      const checkpoint = { at, rows, head, mac: this.mac(at, rows, head) };
      appendFileSync(file, `${JSON.stringify(checkpoint)}\n`, { mode: 0o600 });
      return checkpoint;
    });
  }

  private readCheckpoints(): { checkpoints: AuditCheckpoint[]; forged: number } {
    const file = this.checkpointFile;
    if (!file || !existsSync(file)) return { checkpoints: [], forged: 0 };
    const checkpoints: AuditCheckpoint[] = [];
    let forged = 0;
    for (const line of readFileSync(file, 'utf8').split('\n')) {
      if (!line.trim()) continue;
      try {
        const c = JSON.parse(line) as AuditCheckpoint;
        const expected = Buffer.from(this.mac(c.at, c.rows, c.head), 'hex');
        const given = Buffer.from(String(c.mac), 'hex');
        if (given.length === expected.length && timingSafeEqual(given, expected)) checkpoints.push(c);
        else forged++;
      } catch {
        forged++;
      }
    }
    return { checkpoints, forged };
  }

  /** Pass the caller's transaction manager so the entry commits or rolls back with the change it records. */
  async record(record: AuditRecord, manager?: EntityManager): Promise<AuditEntry> {
    if (record.action === 'study.approved' && this.config) {
      void this.checkpoint().catch((e: Error) => this.logger.error(`Audit checkpoint failed: ${e.message}`));
    }
    return manager ? this.append(record, manager) : writeTransaction(this.dataSource, (m) => this.append(record, m));
  }

  /** An e-signature refused for a wrong password, kept in a transaction of its own: what it would have signed does not happen. */
  signatureRefused(actor: AuditRecord['actor'], signed: { entity: string; entityId: string | null; meaning: string }): Promise<AuditEntry> {
    const { entity, entityId, meaning } = signed;
    return this.record({
      actor,
      action: 'signature.failed',
      entity,
      entityId,
      changes: { meaning: { from: null, to: meaning } },
      reason: 'Password not correct.',
    });
  }

  private async append(record: AuditRecord, manager: EntityManager): Promise<AuditEntry> {
    // SQLite writes take turns in this process (writeTransaction). PostgreSQL may have several server processes
    // writing at once: the chain head is locked until this transaction ends, so the next entry reads it committed.
    if (manager.connection.options.type === 'postgres') await manager.query('SELECT pg_advisory_xact_lock($1)', [AUDIT_CHAIN_LOCK]);
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

  /** Walks the whole chain by seq in bounded batches and reports every broken entry, not only the first. */
  /** `manager`: read within that transaction (a backup verifies the very snapshot it archives). */
  async verify(manager: EntityManager = this.dataSource.manager): Promise<AuditVerification> {
    const repo = manager.getRepository(AuditEntry);
    const broken: AuditBreak[] = [];
    let prevHash = GENESIS_HASH;
    let expectedSeq = 1;
    let rows = 0;
    const { checkpoints, forged } = this.readCheckpoints();
    if (forged) broken.push({ seq: 0, reason: `${forged} checkpoint(s) in the checkpoint file do not carry a valid signature` });
    const heads = new Map<number, AuditCheckpoint>();
    for (const c of checkpoints) heads.set(c.rows, c);
    const batch = 500;
    for (let after = 0; ;) {
      const entries = await repo.find({ where: { seq: MoreThan(after) }, order: { seq: 'ASC' }, take: batch });
      for (const entry of entries) {
        rows++;
        const anchored = heads.get(entry.seq);
        if (anchored && anchored.head !== entry.hash) {
          broken.push({ seq: entry.seq, reason: `the chain up to this entry differs from the signed checkpoint of ${anchored.at}` });
        }
        if (entry.seq !== expectedSeq) broken.push({ seq: entry.seq, reason: `entry ${expectedSeq} is missing` });
        else if (entry.prevHash !== prevHash) broken.push({ seq: entry.seq, reason: 'link to the previous entry does not match' });
        if (auditHash(entry) !== entry.hash) broken.push({ seq: entry.seq, reason: 'content does not match its hash' });
        prevHash = entry.hash;
        expectedSeq = entry.seq + 1;
      }
      if (entries.length < batch) break;
      after = entries[entries.length - 1].seq;
      // Let other requests in between batches: the walk over a long trail must not hold the event loop.
      await new Promise<void>((resolve) => setImmediate(resolve));
    }
    const latest = checkpoints.reduce<AuditCheckpoint | null>((max, c) => (!max || c.rows > max.rows ? c : max), null);
    if (latest && latest.rows > expectedSeq - 1) {
      broken.push({
        seq: expectedSeq,
        reason: `entries removed: the signed checkpoint of ${latest.at} counted ${latest.rows} entries, ${expectedSeq - 1} remain`,
      });
    }
    if (!broken.length) return { ok: true, rows };
    return { ok: false, rows, brokenAt: broken[0].seq, reason: broken[0].reason, broken };
  }
}
