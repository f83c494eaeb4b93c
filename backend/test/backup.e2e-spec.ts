import { cpSync, existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditService } from '../src/audit/audit.service.js';
import { signIn, startBuiltServer } from '../src/bench/built-server.js';
import type { BackupManifest } from '../src/cli/backup.js';
import { bearer, createStudy } from './support/review-fixtures.js';
import { cli } from './support/backup-cli.js';
import { createTestApp, DEMO, DEMO_PASSWORD, postgresServerUrl, type TestApp } from './support/test-app.js';

const Sqlite = createRequire(import.meta.url)('better-sqlite3') as new (
  path: string,
  options?: { readonly?: boolean },
) => {
  prepare(sql: string): { run(...params: unknown[]): unknown; get(...params: unknown[]): unknown };
  close(): void;
};

function readOne<T>(path: string, sql: string, ...params: unknown[]): T {
  const db = new Sqlite(path, { readonly: true });
  try {
    return db.prepare(sql).get(...params) as T;
  } finally {
    db.close();
  }
}

interface AuditRow {
  seq: number;
  action: string;
  entity_id: string | null;
  hash: string;
}

describe.skipIf(postgresServerUrl)('online backup and verified restore (SQLite)', () => {
  let t: TestApp;
  let live: Record<string, string>;
  let key: string;
  let backupDir: string;
  let manifest: BackupManifest;
  let ackedBeforeBackup: number;
  const work = mkdtempSync(join(tmpdir(), 'meritline-backup-'));
  const databasePath = () => t.databaseUrl.slice('sqlite:'.length);
  const as = async (email: string) => bearer(await t.tokenFor(email));
  const maxSeq = () => readOne<{ n: number }>(databasePath(), 'SELECT max(seq) AS n FROM audit_entries').n;
  const createMethod = async (name: string) =>
    t
      .http()
      .post('/api/methods')
      .set(await as(DEMO.analyst))
      .send({ name, analyte: 'Nitrite', matrix: 'Surface water', technique: 'UV-Vis', xUnit: 'mg/L', yUnit: 'AU', purpose: 'assay' })
      .expect(201);
  const approveNewStudy = async () => {
    const study = await createStudy(t, { author: DEMO.analyst });
    await t
      .http()
      .post(`/api/studies/${study.id}/submit`)
      .set(await as(DEMO.analyst))
      .send({ password: DEMO_PASSWORD })
      .expect(200);
    await t
      .http()
      .post(`/api/studies/${study.id}/approve`)
      .set(await as(DEMO.reviewer))
      .send({ password: DEMO_PASSWORD })
      .expect(200);
    // An approval writes a signed checkpoint in the background; this one is awaited.
    await t.app.get(AuditService).checkpoint();
  };

  beforeAll(async () => {
    t = await createTestApp();
    const dataDir = t.dataDir;
    live = { NODE_ENV: 'test', DATABASE_URL: `sqlite:${databasePath()}`, DATA_DIR: dataDir };
    key = readFileSync(join(dataDir, 'audit-hmac-key'), 'utf8').trim();
    await approveNewStudy();
    await createMethod('Backup trial method before');
    backupDir = join(work, 'backup');

    ackedBeforeBackup = maxSeq();
    let backingUp = true;
    const backup = cli(['backup', '--to', backupDir], live).finally(() => (backingUp = false));
    let duringBackup = 0;
    while (backingUp) await createMethod(`Backup trial method during ${duringBackup++}`);
    const result = await backup;
    expect(result.output).toMatch(/audit trail verified/);
    expect(result.code).toBe(0);
    expect(duringBackup).toBeGreaterThan(0);
    manifest = JSON.parse(readFileSync(join(backupDir, 'manifest.json'), 'utf8')) as BackupManifest;

    // After the backup: more rows and a checkpoint that counts them, which the restored trail must not see.
    await approveNewStudy();
    await createMethod('Backup trial method after');
  }, 120_000);

  afterAll(async () => {
    await t?.close();
    rmSync(work, { recursive: true, force: true });
  });

  it('should take a consistent copy while the server writes, with its checkpoints and a list of what to keep apart', () => {
    expect(manifest.database).toBe('sqlite');
    expect(manifest.auditEntries).toBeGreaterThanOrEqual(ackedBeforeBackup);
    expect(manifest.auditEntries).toBeLessThan(maxSeq());
    expect(manifest.checkpoints).toBeGreaterThanOrEqual(1);
    expect(manifest.keepApart.join(' ')).toMatch(/AUDIT_HMAC_KEY/);
    expect(readFileSync(join(backupDir, 'audit-checkpoints.jsonl'), 'utf8')).not.toContain(key);
  });

  it('should refuse to restore over the file of a running server, even with --force', async () => {
    const before = maxSeq();
    const result = await cli(['restore', '--from', backupDir, '--force'], live);
    expect(result.code).toBe(1);
    expect(result.output).toMatch(/open by a running Meritline server/);
    expect(maxSeq()).toBe(before);
    await t.http().get('/api/health').expect(200);
  });

  it('should refuse a restore whose checkpoints do not verify with the key given, writing nothing', async () => {
    const target = join(work, 'wrong-key');
    const env = { NODE_ENV: 'test', DATABASE_URL: `sqlite:${join(target, 'db.sqlite')}`, DATA_DIR: target, AUDIT_HMAC_KEY: 'w'.repeat(48) };
    const result = await cli(['restore', '--from', backupDir], env);
    expect(result.code).toBe(1);
    expect(result.output).toMatch(/audit trail does not verify.*AUDIT_HMAC_KEY/s);
    expect(existsSync(join(target, 'db.sqlite'))).toBe(false);
  });

  it('should refuse a backup changed after it was made, and one whose audit entry was edited with its manifest updated', async () => {
    const env = (name: string) => ({
      NODE_ENV: 'test',
      DATABASE_URL: `sqlite:${join(work, name, 'db.sqlite')}`,
      DATA_DIR: join(work, name),
      AUDIT_HMAC_KEY: key,
    });
    const changed = join(work, 'changed-backup');
    cpSync(backupDir, changed, { recursive: true });
    const db = new Sqlite(join(changed, 'meritline.sqlite'));
    db.prepare("UPDATE audit_entries SET reason = 'edited afterwards' WHERE seq = 3").run();
    db.close();
    const byBytes = await cli(['restore', '--from', changed], env('changed-target'));
    expect(byBytes.code).toBe(1);
    expect(byBytes.output).toMatch(/meritline\.sqlite has changed since the backup was made/);

    const forged = JSON.parse(readFileSync(join(changed, 'manifest.json'), 'utf8')) as BackupManifest;
    forged.files['meritline.sqlite'] = createHash('sha256')
      .update(readFileSync(join(changed, 'meritline.sqlite')))
      .digest('hex');
    writeFileSync(join(changed, 'manifest.json'), JSON.stringify(forged));
    const byChain = await cli(['restore', '--from', changed], env('forged-target'));
    expect(byChain.code).toBe(1);
    expect(byChain.output).toMatch(/audit trail does not verify: entry 3/);
    expect(existsSync(join(work, 'forged-target', 'db.sqlite'))).toBe(false);
  });

  it('should restore into a new place where the server starts with exactly the audit entries of backup time, chain intact', async () => {
    const target = join(work, 'restored');
    const env = {
      NODE_ENV: 'test',
      DATABASE_URL: `sqlite:${join(target, 'db.sqlite')}`,
      DATA_DIR: target,
      AUDIT_HMAC_KEY: key,
      SMTP_URL: '',
    };
    const result = await cli(['restore', '--from', backupDir], env);
    expect(result.output).toMatch(new RegExp(`${manifest.auditEntries} audit entries, chain verified`));
    expect(result.code).toBe(0);
    const again = await cli(['restore', '--from', backupDir], env);
    expect(again.code).toBe(1);
    expect(again.output).toMatch(/exists; pass --force/);

    const server = await startBuiltServer(env);
    try {
      const quality = { Authorization: `Bearer ${await signIn(server.base, DEMO.quality, DEMO_PASSWORD)}` };
      const verify = (await (await fetch(`${server.base}/api/audit/verify`, { headers: quality })).json()) as { ok: boolean; rows: number };
      // The restored trail: the entries of backup time, then this sign-in.
      expect(verify).toEqual({ ok: true, rows: manifest.auditEntries! + 1 });
      const newest = (await (await fetch(`${server.base}/api/audit?pageSize=2`, { headers: quality })).json()) as {
        items: { seq: number; action: string; entityId: string | null }[];
      };
      const entryAt = (path: string) =>
        readOne<AuditRow>(path, 'SELECT seq, action, entity_id, hash FROM audit_entries WHERE seq = ?', manifest.auditEntries);
      const original = entryAt(databasePath());
      expect(newest.items[0]).toMatchObject({ seq: original.seq + 1, action: 'auth.signed-in' });
      expect(newest.items[1]).toMatchObject({ seq: original.seq, action: original.action, entityId: original.entity_id });
      expect(entryAt(join(target, 'db.sqlite')).hash).toBe(original.hash);
    } finally {
      await server.stop();
    }

    // Over the stopped installation with --force: the database replaced is kept beside, and the restored one verifies.
    const forced = await cli(['restore', '--from', backupDir, '--force'], env);
    expect(forced.code, forced.output).toBe(0);
    expect(readdirSync(target).filter((f) => f.startsWith('db.sqlite.before-restore-'))).toHaveLength(1);
  }, 120_000);
});
