import 'reflect-metadata';
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { copyFileSync, existsSync, mkdirSync, readdirSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join, resolve } from 'node:path';
import { parseArgs } from 'node:util';
import { DataSource } from 'typeorm';
import { AuditService, type AuditVerification } from '../audit/audit.service.js';
import { ConfigError, loadAppConfig, type AppConfig } from '../config/app.config.js';
import { typeormOptions } from '../database/typeorm-options.js';

/**
 * Online backup and verified restore of the database with the signed audit checkpoints it needs.
 * A backup is a folder: the database (SQLite copy or pg_dump archive), the checkpoint file and a manifest.
 * The audit key, the JWT secret and the signing certificate are never written into it: they are kept apart.
 */

interface SqliteHandle {
  exec(sql: string): void;
  pragma(sql: string, options?: { simple: boolean }): unknown;
  close(): void;
}
const Sqlite = createRequire(import.meta.url)('better-sqlite3') as new (
  path: string,
  options?: { readonly?: boolean; timeout?: number; fileMustExist?: boolean },
) => SqliteHandle;

const CHECKPOINTS = 'audit-checkpoints.jsonl';
const MANIFEST = 'manifest.json';
const SQLITE_FILE = 'meritline.sqlite';
const POSTGRES_FILE = 'meritline.pgdump';

export interface BackupManifest {
  format: 1;
  createdAt: string;
  database: 'sqlite' | 'postgres';
  files: Record<string, string>;
  auditEntries: number | null;
  checkpoints: number;
  keepApart: string[];
}

const KEEP_APART = [
  'AUDIT_HMAC_KEY (or the audit-hmac-key file of the data folder): without it the checkpoints of this backup cannot be verified',
  'JWT_SECRET (or the jwt-secret file of the data folder): without it everyone signs in again, nothing else is lost',
  'the laboratory signing certificate (SIGNING_P12_PATH and its passphrase): needed to sign new reports',
];

class BackupError extends Error {}

function say(line: string) {
  process.stdout.write(`${line}\n`);
}

function sha256(file: string): string {
  return createHash('sha256').update(readFileSync(file)).digest('hex');
}

/** Complete lines only: a line being appended while we read is left for the next backup. */
function committedCheckpoints(config: AppConfig): string {
  const file = join(config.dataDir, CHECKPOINTS);
  if (!existsSync(file)) return '';
  const text = readFileSync(file, 'utf8');
  return text.slice(0, text.lastIndexOf('\n') + 1);
}

function countLines(text: string) {
  return text.split('\n').filter((line) => line.trim()).length;
}

function sqliteInUse(path: string): boolean {
  // A connection in WAL mode holds a shared lock on the file as long as it is open; an exclusive lock then fails at once.
  const db = new Sqlite(path, { timeout: 0, fileMustExist: true });
  try {
    db.pragma('locking_mode = EXCLUSIVE');
    db.exec('BEGIN EXCLUSIVE');
    db.exec('COMMIT');
    return false;
  } catch (error) {
    if (/locked|busy/i.test((error as Error).message)) return true;
    throw error;
  } finally {
    db.close();
  }
}

/** The backup's own checkpoints anchor the chain, read with the installation's key. */
async function verifyDatabase(config: AppConfig, database: AppConfig['database'], checkpointDir: string): Promise<AuditVerification> {
  const base = typeormOptions(database);
  const dataSource = new DataSource(
    base.type === 'better-sqlite3'
      ? { ...base, migrationsRun: false, enableWAL: false, readonly: true }
      : { ...base, migrationsRun: false },
  );
  await dataSource.initialize();
  try {
    if (base.type === 'better-sqlite3') {
      const rows = (await dataSource.query('PRAGMA integrity_check')) as { integrity_check: string }[];
      const problems = rows.map((r) => r.integrity_check).filter((r) => r !== 'ok');
      if (problems.length) throw new BackupError(`The database file is damaged (integrity check: ${problems.slice(0, 3).join('; ')}).`);
    }
    return await new AuditService(dataSource, { ...config, dataDir: checkpointDir }).verify();
  } finally {
    await dataSource.destroy();
  }
}

/** pg_dump reads the snapshot this transaction exports, so the chain verified here is the one in the archive. */
async function dumpPostgres(config: AppConfig, url: string, file: string, checkpointDir: string): Promise<AuditVerification> {
  const dataSource = new DataSource({ ...typeormOptions({ type: 'postgres', url }), migrationsRun: false });
  await dataSource.initialize();
  const runner = dataSource.createQueryRunner();
  try {
    await runner.startTransaction('REPEATABLE READ');
    const [{ snapshot }] = (await runner.query('SELECT pg_export_snapshot() AS snapshot')) as { snapshot: string }[];
    pgTool('pg_dump', ['--format=custom', '--no-owner', `--snapshot=${snapshot}`, `--file=${file}`, `--dbname=${url}`]);
    return await new AuditService(dataSource, { ...config, dataDir: checkpointDir }).verify(runner.manager);
  } finally {
    if (runner.isTransactionActive) await runner.rollbackTransaction();
    await runner.release();
    await dataSource.destroy();
  }
}

function assertChain(verification: AuditVerification) {
  if (verification.ok) return;
  const hint = verification.broken.some((b) => b.seq === 0) ? ' Is AUDIT_HMAC_KEY the key of the installation that made the backup?' : '';
  throw new BackupError(`The audit trail does not verify: entry ${verification.brokenAt}, ${verification.reason}.${hint}`);
}

function pgTool(name: 'pg_dump' | 'pg_restore', args: string[]) {
  const result = spawnSync(name, args, { encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 });
  if (result.error) throw new BackupError(`${name} could not run (${result.error.message}); install the PostgreSQL client tools.`);
  if (result.status !== 0) throw new BackupError(`${name} failed: ${result.stderr.trim()}`);
  return result.stdout;
}

async function backup(config: AppConfig, to: string) {
  if (config.database.type === 'sqlite' && !existsSync(config.database.path)) {
    throw new BackupError(`There is no database at ${config.database.path}: check DATABASE_URL.`);
  }
  if (existsSync(to) && readdirSync(to).length) throw new BackupError(`${to} is not empty; give a new folder for the backup.`);
  mkdirSync(to, { recursive: true });
  // Read before the database snapshot: every checkpoint then names entries that the snapshot holds.
  const checkpoints = committedCheckpoints(config);
  writeFileSync(join(to, CHECKPOINTS), checkpoints, { mode: 0o600 });
  let auditEntries: number;
  let dataFile: string;
  if (config.database.type === 'sqlite') {
    dataFile = SQLITE_FILE;
    const live = new Sqlite(config.database.path, { timeout: 10_000, fileMustExist: true });
    try {
      // One read transaction: a consistent copy while the server goes on writing (WAL lets both run).
      live.exec(`VACUUM INTO '${join(to, dataFile).replaceAll("'", "''")}'`);
    } finally {
      live.close();
    }
    const verification = await verifyDatabase(config, { type: 'sqlite', path: join(to, dataFile) }, to);
    assertChain(verification);
    auditEntries = verification.rows;
  } else {
    dataFile = POSTGRES_FILE;
    const verification = await dumpPostgres(config, config.database.url, join(to, dataFile), to);
    assertChain(verification);
    auditEntries = verification.rows;
    pgTool('pg_restore', ['--list', join(to, dataFile)]);
  }
  const manifest: BackupManifest = {
    format: 1,
    createdAt: new Date().toISOString(),
    database: config.database.type,
    files: { [dataFile]: sha256(join(to, dataFile)), [CHECKPOINTS]: sha256(join(to, CHECKPOINTS)) },
    auditEntries,
    checkpoints: countLines(checkpoints),
    keepApart: KEEP_APART,
  };
  writeFileSync(join(to, MANIFEST), `${JSON.stringify(manifest, null, 2)}\n`);
  say(`Backup written to ${to}`);
  say(`  audit trail verified: ${auditEntries} entries`);
  say(`  ${manifest.checkpoints} signed checkpoint(s) included`);
  say('Keep apart from the backup, in your secret store:');
  for (const item of KEEP_APART) say(`  - ${item}`);
}

function readManifest(from: string): BackupManifest {
  const file = join(from, MANIFEST);
  if (!existsSync(file)) throw new BackupError(`${from} holds no ${MANIFEST}: not a Meritline backup folder.`);
  const manifest = JSON.parse(readFileSync(file, 'utf8')) as BackupManifest;
  for (const [name, expected] of Object.entries(manifest.files)) {
    if (!existsSync(join(from, name))) throw new BackupError(`${name} is missing from the backup.`);
    if (sha256(join(from, name)) !== expected) throw new BackupError(`${name} has changed since the backup was made (SHA-256 differs).`);
  }
  return manifest;
}

/** Keeps what is replaced beside it, so a restore can be undone by hand. */
function setAside(file: string, stamp: string) {
  if (existsSync(file)) renameSync(file, `${file}.before-restore-${stamp}`);
}

async function restoreSqlite(config: AppConfig, from: string, target: string, force: boolean) {
  if (existsSync(target)) {
    if (sqliteInUse(target)) throw new BackupError(`${target} is open by a running Meritline server: stop it before restoring.`);
    if (!force) throw new BackupError(`${target} exists; pass --force to replace it (it is kept beside as .before-restore-…).`);
  }
  mkdirSync(dirname(target), { recursive: true });
  const staging = `${target}.restoring-${process.pid}`;
  copyFileSync(join(from, SQLITE_FILE), staging);
  try {
    const verification = await verifyDatabase(config, { type: 'sqlite', path: staging }, from);
    assertChain(verification);
    const stamp = new Date().toISOString().replace(/[:.]/g, '-');
    if (existsSync(target)) {
      // Fold a write-ahead log left by a crash into the file set aside, so it stays complete.
      const old = new Sqlite(target, { timeout: 0 });
      old.pragma('wal_checkpoint(TRUNCATE)');
      old.close();
      setAside(target, stamp);
      for (const suffix of ['-wal', '-shm']) rmSync(`${target}${suffix}`, { force: true });
    }
    renameSync(staging, target);
    setAside(join(config.dataDir, CHECKPOINTS), stamp);
    copyFileSync(join(from, CHECKPOINTS), join(config.dataDir, CHECKPOINTS));
    return verification.rows;
  } finally {
    rmSync(staging, { force: true });
  }
}

async function restorePostgres(config: AppConfig, from: string, url: string) {
  const probe = new DataSource({ type: 'postgres', url });
  await probe.initialize();
  const [{ tables }] = (await probe.query(
    `SELECT count(*)::int AS tables FROM information_schema.tables WHERE table_schema = 'public'`,
  )) as {
    tables: number;
  }[];
  await probe.destroy();
  if (tables > 0)
    throw new BackupError('The target database is not empty: create a new database, restore into it, then point DATABASE_URL at it.');
  pgTool('pg_restore', ['--no-owner', '--exit-on-error', '--single-transaction', `--dbname=${url}`, join(from, POSTGRES_FILE)]);
  const checkpointFile = join(config.dataDir, CHECKPOINTS);
  const verification = await verifyDatabase(config, config.database, from);
  assertChain(verification);
  setAside(checkpointFile, new Date().toISOString().replace(/[:.]/g, '-'));
  mkdirSync(config.dataDir, { recursive: true });
  copyFileSync(join(from, CHECKPOINTS), checkpointFile);
  return verification.rows;
}

async function restore(config: AppConfig, from: string, force: boolean) {
  const manifest = readManifest(from);
  if (manifest.database !== config.database.type) {
    throw new BackupError(`The backup is of a ${manifest.database} database but DATABASE_URL names ${config.database.type}.`);
  }
  mkdirSync(config.dataDir, { recursive: true });
  const rows =
    config.database.type === 'sqlite'
      ? await restoreSqlite(config, from, config.database.path, force)
      : await restorePostgres(config, from, config.database.url);
  say(`Restored the backup of ${manifest.createdAt}: ${rows} audit entries, chain verified.`);
}

const USAGE = `Usage (with the installation's DATABASE_URL, DATA_DIR and AUDIT_HMAC_KEY in the environment):
  npm run backup -- --to <new folder>
  npm run restore -- --from <backup folder> [--force]`;

async function main() {
  const [command, ...rest] = process.argv.slice(2);
  const { values } = parseArgs({
    args: rest,
    options: { to: { type: 'string' }, from: { type: 'string' }, force: { type: 'boolean', default: false } },
  });
  const config = loadAppConfig();
  // npm runs scripts from the project folder; folders given on the command line are meant from where it was typed.
  const here = process.env.INIT_CWD ?? process.cwd();
  if (command === 'backup' && values.to) return backup(config, resolve(here, values.to));
  if (command === 'restore' && values.from) return restore(config, resolve(here, values.from), values.force);
  throw new BackupError(USAGE);
}

try {
  await main();
} catch (error) {
  if (!(error instanceof BackupError || error instanceof ConfigError || (error as { code?: string }).code?.startsWith('ERR_PARSE_ARGS')))
    throw error;
  console.error(`Meritline: ${(error as Error).message}`);
  process.exit(1);
}
