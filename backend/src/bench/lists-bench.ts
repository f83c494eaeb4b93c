/**
 * List latency at laboratory scale: builds a database with many studies, runs, a review queue and a long audit
 * trail (bulk inserts, the audit chain hashed as the service hashes it), starts the app in-process on a port
 * and times the first and a deep page of each list, then the verification of the whole trail while the health
 * route is polled. Usage: node dist/bench/lists-bench.js [--studies 10000] [--runs 10000] [--queue 300]
 * [--audit 1000000] [--requests 50] [--keep] [--postgres-only]. Runs on SQLite; on PostgreSQL too when
 * TEST_POSTGRES_URL is set (a database of its own per run).
 */
import 'reflect-metadata';
import { NestFactory } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { spawnSync } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { cpus, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import pg from 'pg';
import { DataSource } from 'typeorm';
import { AuditEntry } from '../audit/audit-entry.entity.js';
import { auditHash, GENESIS_HASH } from '../audit/audit.service.js';
import { encodeCursor } from '../common/keyset.js';
import { configureApp } from '../configure-app.js';
import { ValidationStudy } from '../studies/validation-study.entity.js';

const { values: args } = parseArgs({
  options: {
    studies: { type: 'string', default: '10000' },
    runs: { type: 'string', default: '10000' },
    queue: { type: 'string', default: '300' },
    audit: { type: 'string', default: '1000000' },
    requests: { type: 'string', default: '50' },
    keep: { type: 'boolean', default: false },
    'postgres-only': { type: 'boolean', default: false },
  },
});
const SIZES = {
  studies: Number(args.studies),
  runs: Number(args.runs),
  queue: Number(args.queue),
  audit: Number(args.audit),
  requests: Number(args.requests),
};
const print = (line: string) => process.stdout.write(`${line}\n`);
const PASSWORD = 'meritline-demo';
const DAY_MS = 86_400_000;
/** Requests per list before timing starts (JIT, page cache). */
const WARM_UP = 10;

type Row = Record<string, unknown>;

/** Multi-row INSERTs in one transaction, with the driver's placeholders. */
async function insertRows(ds: DataSource, table: string, rows: Row[], postgres: boolean) {
  if (!rows.length) return;
  const columns = Object.keys(rows[0]);
  const perStatement = Math.max(1, Math.floor((postgres ? 60_000 : 30_000) / columns.length));
  const runner = ds.createQueryRunner();
  await runner.startTransaction();
  try {
    for (let start = 0; start < rows.length; start += perStatement) {
      const chunk = rows.slice(start, start + perStatement);
      const params: unknown[] = [];
      const tuples = chunk.map((row) => {
        const marks = columns.map((column) => {
          params.push(row[column]);
          return postgres ? `$${params.length}` : '?';
        });
        return `(${marks.join(', ')})`;
      });
      await runner.query(`INSERT INTO ${table} (${columns.map((c) => `"${c}"`).join(', ')}) VALUES ${tuples.join(', ')}`, params);
    }
    await runner.commitTransaction();
  } catch (error) {
    await runner.rollbackTransaction();
    throw error;
  } finally {
    await runner.release();
  }
}

/** A date as the driver stores it, so the app reads back exactly what it would have written. */
const when = (ds: DataSource, date: Date): unknown =>
  ds.driver.preparePersistentValue(date, ds.getRepository(ValidationStudy).metadata.findColumnWithPropertyName('createdAt')!);

/** Copies of a demo row with new ids and spread dates; the JSON columns (data, result) stay as stored. */
async function cloneRows(
  ds: DataSource,
  table: string,
  template: Row,
  count: number,
  vary: (i: number) => Row,
  postgres: boolean,
  batch = 1000,
) {
  for (let start = 0; start < count; start += batch) {
    const rows = Array.from({ length: Math.min(batch, count - start) }, (_, k) => ({ ...template, id: randomUUID(), ...vary(start + k) }));
    await insertRows(ds, table, rows, postgres);
  }
}

async function buildData(ds: DataSource) {
  const postgres = ds.options.type === 'postgres';
  const now = Date.now();
  const [study] = (await ds.query(
    `SELECT * FROM validation_studies WHERE result IS NOT NULL ORDER BY LENGTH(result) DESC LIMIT 1`,
  )) as Row[];
  const resultBytes = Buffer.byteLength(String(study.result));
  const authors = ((await ds.query(`SELECT id FROM users`)) as { id: string }[]).map((u) => u.id);
  const statuses = ['draft', 'returned', 'approved'];
  const queueEvery = Math.max(1, Math.floor(SIZES.studies / Math.max(1, SIZES.queue)));
  let queued = 0;
  await cloneRows(
    ds,
    'validation_studies',
    study,
    SIZES.studies,
    (i) => {
      const submitted = i % queueEvery === 0 && queued < SIZES.queue;
      if (submitted) queued++;
      const updated = new Date(now - (SIZES.studies - i) * 60_000);
      return {
        title: `Bench study ${String(i).padStart(6, '0')} of ${['nitrate', 'lead', 'tartrazine', 'chloride'][i % 4]}`,
        status: submitted ? 'submitted' : statuses[i % 3],
        author_id: authors[i % authors.length],
        editor_ids: '[]',
        created_at: when(ds, new Date(updated.getTime() - DAY_MS)),
        updated_at: when(ds, updated),
        submitted_at: submitted ? when(ds, updated) : null,
        approved_at: null,
        copied_from_id: null,
      };
    },
    postgres,
    500,
  );
  const [run] = (await ds.query(`SELECT * FROM runs ORDER BY LENGTH(result) DESC LIMIT 1`)) as Row[];
  const runQueueEvery = Math.max(1, Math.floor(SIZES.runs / Math.max(1, Math.floor(SIZES.queue / 3))));
  await cloneRows(
    ds,
    'runs',
    { ...run, supersedes_id: null, superseded_by_id: null },
    SIZES.runs,
    (i) => {
      const created = new Date(now - (SIZES.runs - i) * 60_000);
      const submitted = i % runQueueEvery === 0;
      return {
        title: `Bench batch ${String(i).padStart(6, '0')}`,
        status: i % 7 === 0 ? 'rejected' : 'accepted',
        author_id: authors[i % authors.length],
        created_at: when(ds, created),
        review_status: submitted ? 'submitted' : 'calculated',
        submitted_at: submitted ? when(ds, created) : null,
        released_at: null,
      };
    },
    postgres,
  );

  const repo = ds.getRepository(AuditEntry);
  const [last] = await repo.find({ order: { seq: 'DESC' }, take: 1 });
  let seq = last?.seq ?? 0;
  let prevHash = last?.hash ?? GENESIS_HASH;
  const atColumn = repo.metadata.findColumnWithPropertyName('at')!;
  const start = now - SIZES.audit * 1000;
  for (let done = 0; done < SIZES.audit;) {
    const rows: Row[] = [];
    for (const end = Math.min(SIZES.audit, done + 20_000); done < end; done++) {
      seq++;
      const entry = {
        seq,
        at: new Date(start + done * 1000),
        actorId: authors[seq % authors.length],
        actorName: 'Bench Analyst',
        action: 'study.updated',
        entity: 'study',
        entityId: randomUUID(),
        changes: { title: { from: `Title ${seq - 1}`, to: `Title ${seq}` } },
        reason: null,
        prevHash,
      };
      const hash = auditHash(entry);
      rows.push({
        seq,
        at: ds.driver.preparePersistentValue(entry.at, atColumn),
        actor_id: entry.actorId,
        actor_name: entry.actorName,
        action: entry.action,
        entity: entry.entity,
        entity_id: entry.entityId,
        changes: JSON.stringify(entry.changes),
        reason: null,
        prev_hash: prevHash,
        hash,
      });
      prevHash = hash;
    }
    await insertRows(ds, 'audit_entries', rows, postgres);
  }
  await ds.query('ANALYZE');
  return { resultBytes, queued };
}

const percentile = (sorted: number[], p: number) => sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];

async function timeRequests(base: string, path: string, token: string) {
  const times: number[] = [];
  let bytes = 0;
  for (let i = 0; i < SIZES.requests + WARM_UP; i++) {
    const started = performance.now();
    const res = await fetch(`${base}${path}`, { headers: { Authorization: `Bearer ${token}` } });
    const body = await res.text();
    if (!res.ok) throw new Error(`${path}: ${res.status} ${body.slice(0, 300)}`);
    if (i >= WARM_UP) times.push(performance.now() - started);
    bytes = body.length;
  }
  times.sort((a, b) => a - b);
  return { p50: percentile(times, 50), p95: percentile(times, 95), bytes };
}

async function login(base: string, email: string) {
  const res = await fetch(`${base}/api/auth/login`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email, password: PASSWORD }),
  });
  if (!res.ok) throw new Error(`login ${email}: ${res.status}`);
  return ((await res.json()) as { accessToken: string }).accessToken;
}

/** A cursor that starts the page after the row at `position` of the list's order. */
async function deepCursor(ds: DataSource, sql: string, position: number, sort: string, order: 'asc' | 'desc') {
  const rows = (await ds.query(sql.replace('$OFFSET', String(position)))) as { id: string }[];
  if (!rows[0]) throw new Error(`no row at ${position}: ${sql}`);
  return encodeURIComponent(encodeCursor({ id: rows[0].id, dir: 'after', sort, order }));
}

async function measure(databaseUrl: string, label: string) {
  const dir = mkdtempSync(join(tmpdir(), 'meritline-lists-bench-'));
  Object.assign(process.env, { NODE_ENV: 'test', DATABASE_URL: databaseUrl, DATA_DIR: dir, SMTP_URL: '' });
  const builtAt = performance.now();
  // Imported once the URL is set: entity column types follow the database of the process.
  const { AppModule } = await import('../app.module.js');
  const app = configureApp(await NestFactory.create<NestExpressApplication>(AppModule, { bodyParser: false, logger: ['error'] }));
  await app.listen(0, '127.0.0.1');
  const address = app.getHttpServer().address() as { port: number };
  const base = `http://127.0.0.1:${address.port}`;
  const ds = app.get(DataSource);
  const built = await buildData(ds);
  const buildSeconds = (performance.now() - builtAt) / 1000;
  print(`${label}: built in ${buildSeconds.toFixed(0)} s (result JSON ${built.resultBytes} bytes, ${built.queued} studies queued)`);

  const analyst = await login(base, 'analyst@meritline.test');
  const reviewer = await login(base, 'reviewer@meritline.test');
  const quality = await login(base, 'quality@meritline.test');
  const deepStudies = Math.floor(SIZES.studies * 0.8);
  const deepRuns = Math.floor(SIZES.runs * 0.8);
  const studyCursor = await deepCursor(
    ds,
    'SELECT id FROM validation_studies ORDER BY updated_at DESC, id DESC LIMIT 1 OFFSET $OFFSET',
    deepStudies,
    'updatedAt',
    'desc',
  );
  const titleCursor = await deepCursor(
    ds,
    'SELECT id FROM validation_studies ORDER BY title ASC, id ASC LIMIT 1 OFFSET $OFFSET',
    deepStudies,
    'title',
    'asc',
  );
  const runCursor = await deepCursor(
    ds,
    'SELECT id FROM runs ORDER BY created_at DESC, id DESC LIMIT 1 OFFSET $OFFSET',
    deepRuns,
    'createdAt',
    'desc',
  );
  const queueCursor = await deepCursor(
    ds,
    `SELECT id FROM validation_studies WHERE status = 'submitted' ORDER BY submitted_at ASC, id ASC LIMIT 1 OFFSET $OFFSET`,
    Math.floor(built.queued * 0.8),
    'study',
    'asc',
  );
  const [{ seq: maxSeq }] = (await ds.query('SELECT MAX(seq) AS seq FROM audit_entries')) as { seq: number }[];
  const auditDeep = Math.floor(Number(maxSeq) * 0.2);

  const lists: [string, string, string][] = [
    ['studies, first page', '/api/studies?pageSize=20', analyst],
    [`studies, after row ${deepStudies}`, `/api/studies?pageSize=20&cursor=${studyCursor}`, analyst],
    [`studies by title, after row ${deepStudies}`, `/api/studies?pageSize=20&sort=title&order=asc&cursor=${titleCursor}`, analyst],
    ['studies, approved, first page', '/api/studies?pageSize=20&status=approved', analyst],
    ['runs, first page', '/api/runs?pageSize=20', analyst],
    [`runs, after row ${deepRuns}`, `/api/runs?pageSize=20&cursor=${runCursor}`, analyst],
    ['review queue, first page', '/api/reviews/queue?pageSize=20', reviewer],
    ['review queue, deep page', `/api/reviews/queue?pageSize=20&cursor=${queueCursor}`, reviewer],
    ['audit trail, first page', '/api/audit?pageSize=50', quality],
    [`audit trail, before seq ${auditDeep}`, `/api/audit?pageSize=50&cursor=${auditDeep}`, quality],
  ];
  const latencies: Record<string, { p50: number; p95: number; bytes: number }> = {};
  for (const [name, path, token] of lists) {
    latencies[name] = await timeRequests(base, path, token);
    print(
      `${label}: ${name}: p50 ${latencies[name].p50.toFixed(1)} ms, p95 ${latencies[name].p95.toFixed(1)} ms, ${latencies[name].bytes} bytes`,
    );
  }

  let peakRss = process.memoryUsage().rss;
  const rssBefore = peakRss;
  let maxHealthMs = 0;
  let healthChecks = 0;
  let verifying = true;
  const sampler = setInterval(() => (peakRss = Math.max(peakRss, process.memoryUsage().rss)), 50);
  const poll = (async () => {
    while (verifying) {
      const started = performance.now();
      await (await fetch(`${base}/api/health`)).text();
      maxHealthMs = Math.max(maxHealthMs, performance.now() - started);
      healthChecks++;
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
  })();
  const verifyStarted = performance.now();
  const verifyRes = await fetch(`${base}/api/audit/verify`, { headers: { Authorization: `Bearer ${quality}` } });
  const verification = (await verifyRes.json()) as { ok: boolean; rows: number };
  const verifySeconds = (performance.now() - verifyStarted) / 1000;
  verifying = false;
  await poll;
  clearInterval(sampler);
  print(
    `${label}: audit verify ${verification.rows} rows ok=${verification.ok} in ${verifySeconds.toFixed(1)} s, ` +
      `RSS ${(rssBefore / 2 ** 20).toFixed(0)} → peak ${(peakRss / 2 ** 20).toFixed(0)} MB, health max ${maxHealthMs.toFixed(0)} ms over ${healthChecks} checks`,
  );
  await app.close();
  rmSync(dir, { recursive: true, force: true });
  return {
    database: label,
    buildSeconds,
    resultBytes: built.resultBytes,
    queued: built.queued,
    latencies,
    verify: {
      rows: verification.rows,
      ok: verification.ok,
      seconds: verifySeconds,
      rssBeforeMb: rssBefore / 2 ** 20,
      peakRssMb: peakRss / 2 ** 20,
      maxHealthMs,
      healthChecks,
    },
  };
}

async function main() {
  const results = [];
  if (!args['postgres-only']) {
    const sqliteDir = mkdtempSync(join(tmpdir(), 'meritline-lists-sqlite-'));
    try {
      results.push(await measure(`sqlite:${join(sqliteDir, 'bench.sqlite')}`, 'SQLite'));
    } finally {
      if (args.keep) print(`SQLite database kept in ${sqliteDir}`);
      else rmSync(sqliteDir, { recursive: true, force: true });
    }
  }
  const postgresUrl = process.env.TEST_POSTGRES_URL;
  if (postgresUrl && !args['postgres-only']) {
    // A process of its own: the entities were already bound to SQLite in this one.
    const child = spawnSync(
      process.execPath,
      [...process.execArgv, fileURLToPath(import.meta.url), ...process.argv.slice(2), '--postgres-only'],
      {
        stdio: 'inherit',
      },
    );
    if (child.status !== 0) throw new Error(`the PostgreSQL run failed (${child.status})`);
  }
  if (postgresUrl && args['postgres-only']) {
    const name = `meritline_lists_bench_${Date.now()}`;
    const admin = new pg.Client({ connectionString: postgresUrl });
    await admin.connect();
    await admin.query(`CREATE DATABASE ${name}`);
    try {
      const url = new URL(postgresUrl);
      url.pathname = `/${name}`;
      results.push(await measure(url.toString(), 'PostgreSQL'));
    } finally {
      await admin.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
      await admin.end();
    }
  }
  const report = {
    at: new Date().toISOString(),
    machine: { cpus: cpus().length, model: cpus()[0]?.model, loadavg: loadavg() },
    sizes: SIZES,
    results,
  };
  mkdirSync('test-output', { recursive: true });
  writeFileSync(`test-output/lists-bench${args['postgres-only'] ? '-postgres' : ''}.json`, `${JSON.stringify(report, null, 2)}\n`);
  print(JSON.stringify(report, null, 2));
}

await main();
