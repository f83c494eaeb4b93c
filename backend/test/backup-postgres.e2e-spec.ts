import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signIn, startBuiltServer } from '../src/bench/built-server.js';
import { cli } from './support/backup-cli.js';
import type { TestApp } from './support/test-app.js';

const serverUrl = process.env.TEST_POSTGRES_URL;

async function admin<T>(work: (client: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: serverUrl });
  await client.connect();
  try {
    return await work(client);
  } finally {
    await client.end();
  }
}

function databaseUrl(name: string) {
  const url = new URL(serverUrl!);
  url.pathname = `/${name}`;
  return url.toString();
}

describe.skipIf(!serverUrl)('online backup (pg_dump) and verified restore (pg_restore) on PostgreSQL', () => {
  const stamp = Date.now();
  const source = `meritline_backup_src_${stamp}`;
  const target = `meritline_backup_dst_${stamp}`;
  const work = mkdtempSync(join(tmpdir(), 'meritline-pg-backup-'));
  let t: TestApp;
  let live: Record<string, string>;
  let key: string;
  let ackedBeforeBackup: number;
  let verifiedAtBackup: number;
  const maxSeq = async () => {
    const client = new pg.Client({ connectionString: databaseUrl(source) });
    await client.connect();
    try {
      return Number((await client.query('SELECT max(seq) AS n FROM audit_entries')).rows[0].n);
    } finally {
      await client.end();
    }
  };

  beforeAll(async () => {
    await admin((c) => c.query(`CREATE DATABASE ${source}`));
    await admin((c) => c.query(`CREATE DATABASE ${target}`));
    process.env.DATABASE_URL = databaseUrl(source);
    // Entities read DATABASE_URL at import time (binary column type), so import after setting it.
    const support = await import('./support/test-app.js');
    t = await support.createTestApp({ DATABASE_URL: databaseUrl(source) });
    const dataDir = t.dataDir;
    live = { NODE_ENV: 'test', DATABASE_URL: databaseUrl(source), DATA_DIR: dataDir };
    key = readFileSync(join(dataDir, 'audit-hmac-key'), 'utf8').trim();
    const { AuditService } = await import('../src/audit/audit.service.js');
    const token = await t.tokenFor(support.DEMO.analyst);
    const createMethod = (name: string) =>
      t
        .http()
        .post('/api/methods')
        .set('Authorization', `Bearer ${token}`)
        .send({ name, analyte: 'Nitrite', matrix: 'Surface water', technique: 'UV-Vis', xUnit: 'mg/L', yUnit: 'AU', purpose: 'assay' })
        .expect(201);
    await createMethod('PostgreSQL backup method before');
    await t.app.get(AuditService).checkpoint();

    ackedBeforeBackup = await maxSeq();
    let backingUp = true;
    const backup = cli(['backup', '--to', join(work, 'backup')], live).finally(() => (backingUp = false));
    let during = 0;
    while (backingUp) await createMethod(`PostgreSQL backup method during ${during++}`);
    const result = await backup;
    expect(result.code, result.output).toBe(0);
    // The chain is verified in the very snapshot pg_dump archives, while methods go on being created.
    verifiedAtBackup = Number(/audit trail verified: (\d+) entries/.exec(result.output)?.[1]);
    expect(verifiedAtBackup).toBeGreaterThanOrEqual(ackedBeforeBackup);

    await createMethod('PostgreSQL backup method after');
    await t.app.get(AuditService).checkpoint();
  }, 180_000);

  afterAll(async () => {
    await t?.close();
    for (const name of [source, target]) await admin((c) => c.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`));
    rmSync(work, { recursive: true, force: true });
  });

  it('should refuse to restore into a database that is not empty', async () => {
    const result = await cli(['restore', '--from', join(work, 'backup')], { ...live, AUDIT_HMAC_KEY: key });
    expect(result.code).toBe(1);
    expect(result.output).toMatch(/target database is not empty/);
  });

  it('should restore into a new database where the server starts with the audit entries of backup time, chain intact', async () => {
    const dataDir = join(work, 'restored');
    const env = { NODE_ENV: 'test', DATABASE_URL: databaseUrl(target), DATA_DIR: dataDir, AUDIT_HMAC_KEY: key, SMTP_URL: '' };
    const result = await cli(['restore', '--from', join(work, 'backup')], env);
    expect(result.code, result.output).toBe(0);
    const rows = Number(/: (\d+) audit entries, chain verified/.exec(result.output)?.[1]);
    expect(rows).toBe(verifiedAtBackup);
    expect(rows).toBeLessThan(await maxSeq());

    const server = await startBuiltServer(env);
    try {
      const quality = { Authorization: `Bearer ${await signIn(server.base, 'quality@meritline.test', 'meritline-demo')}` };
      const verify = (await (await fetch(`${server.base}/api/audit/verify`, { headers: quality })).json()) as { ok: boolean; rows: number };
      // The entries of backup time, then this sign-in.
      expect(verify).toEqual({ ok: true, rows: rows + 1 });
    } finally {
      await server.stop();
    }
  }, 120_000);
});
