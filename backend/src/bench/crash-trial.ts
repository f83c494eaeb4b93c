import { mkdtempSync, rmSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { signIn, startBuiltServer } from './built-server.js';

interface ReadOnlyFile {
  prepare(sql: string): { all(...params: unknown[]): unknown[] };
  close(): void;
}
const Sqlite = createRequire(import.meta.url)('better-sqlite3') as new (path: string, options: { readonly: boolean }) => ReadOnlyFile;

const DEMO_PASSWORD = 'meritline-demo';

export interface CrashTrialResult {
  killAfterMs: number;
  /** Writes answered 2xx before the kill. */
  acknowledged: number;
  /** Writes refused on purpose (a name already taken: 409). */
  refused: number;
  /** Writes whose answer the kill cut off: either outcome is allowed, but whole. */
  cutOff: number;
  missing: string[];
  halfSaved: string[];
  refusedButSaved: string[];
  auditOk: boolean;
  auditRows: number;
  restartMs: number;
}

type Outcome = { name: string; status: number | 'cut-off'; id?: string };

/**
 * Starts the built server on a fresh SQLite file, creates methods from several writers at once (each a method,
 * its first version and an audit entry in one transaction, with some refused duplicates between them),
 * SIGKILLs the process mid-load, restarts it on the same file and checks what survived.
 */
export async function crashTrial(options: {
  trial: number;
  /** Kill this long after the first acknowledged writes, so a slow, busy machine still kills mid-load. */
  killAfterMs: number;
  acknowledgedBeforeKill?: number;
  writers?: number;
}): Promise<CrashTrialResult> {
  const dir = mkdtempSync(join(tmpdir(), 'meritline-crash-'));
  const env = { NODE_ENV: 'test', DATABASE_URL: `sqlite:${join(dir, 'crash.sqlite')}`, DATA_DIR: dir, SMTP_URL: '' };
  try {
    const first = await startBuiltServer(env);
    const token = await signIn(first.base, 'analyst@meritline.test', DEMO_PASSWORD);
    const outcomes: Outcome[] = [];
    let killed = false;
    let loadRunning: () => void = () => undefined;
    const enoughAcknowledged = new Promise<void>((resolve) => (loadRunning = resolve));
    const record = (outcome: Outcome) => {
      outcomes.push(outcome);
      if (outcomes.filter((o) => o.status === 201).length >= (options.acknowledgedBeforeKill ?? 1)) loadRunning();
    };
    const create = async (name: string): Promise<Outcome> => {
      try {
        const res = await fetch(`${first.base}/api/methods`, {
          method: 'POST',
          headers: { 'Content-Type': 'application/json', Authorization: `Bearer ${token}` },
          body: JSON.stringify({
            name,
            analyte: 'Nitrate',
            matrix: 'Drinking water',
            technique: 'UV-Vis',
            xUnit: 'mg/L',
            yUnit: 'AU',
            purpose: 'assay',
          }),
        });
        const body = (await res.json()) as { id?: string };
        return { name, status: res.status, id: body.id };
      } catch {
        return { name, status: 'cut-off' };
      }
    };
    const writer = async (w: number) => {
      for (let i = 0; !killed; i++) {
        const name = `Crash trial ${options.trial} writer ${w} method ${i}`;
        const created = await create(name);
        record(created);
        if (i % 4 === 3 && created.status === 201 && !killed) record(await create(name));
      }
    };
    const writers = Array.from({ length: options.writers ?? 6 }, (_, w) => writer(w));
    let fallback: NodeJS.Timeout | undefined;
    await Promise.race([enoughAcknowledged, new Promise((resolve) => (fallback = setTimeout(resolve, 60_000)))]);
    clearTimeout(fallback);
    await new Promise((resolve) => setTimeout(resolve, options.killAfterMs));
    killed = true;
    await first.stop('SIGKILL');
    await Promise.all(writers);

    const restartedAt = Date.now();
    const second = await startBuiltServer(env);
    const restartMs = Date.now() - restartedAt;
    try {
      const quality = await signIn(second.base, 'quality@meritline.test', DEMO_PASSWORD);
      const verify = (await (
        await fetch(`${second.base}/api/audit/verify`, { headers: { Authorization: `Bearer ${quality}` } })
      ).json()) as {
        ok: boolean;
        rows: number;
      };
      const db = new Sqlite(join(dir, 'crash.sqlite'), { readonly: true });
      try {
        const methods = db.prepare("SELECT id, name FROM methods WHERE name LIKE 'Crash trial %'").all() as { id: string; name: string }[];
        const versions = new Set(
          (db.prepare('SELECT method_id FROM method_versions WHERE number = 1').all() as { method_id: string }[]).map((r) => r.method_id),
        );
        const audited = new Set(
          (db.prepare("SELECT entity_id FROM audit_entries WHERE action = 'method.created'").all() as { entity_id: string }[]).map(
            (r) => r.entity_id,
          ),
        );
        const ids = new Set(methods.map((m) => m.id));
        const everyMethod = new Set((db.prepare('SELECT id FROM methods').all() as { id: string }[]).map((r) => r.id));
        const acknowledged = outcomes.filter((o) => o.status === 201);
        const refused = outcomes.filter((o) => o.status === 409);
        const unexpected = outcomes.filter((o) => o.status !== 201 && o.status !== 409 && o.status !== 'cut-off');
        if (unexpected.length) throw new Error(`Unexpected answers: ${unexpected.map((o) => o.status).join(', ')}`);
        const savedTimes = (name: string) => methods.filter((m) => m.name === name).length;
        return {
          killAfterMs: options.killAfterMs,
          acknowledged: acknowledged.length,
          refused: refused.length,
          cutOff: outcomes.filter((o) => o.status === 'cut-off').length,
          missing: acknowledged.filter((o) => !o.id || !ids.has(o.id)).map((o) => o.name),
          halfSaved: [
            ...methods.filter((m) => !versions.has(m.id) || !audited.has(m.id)).map((m) => m.name),
            ...[...audited].filter((id) => !everyMethod.has(id)).map((id) => `audit entry without its method ${id}`),
          ],
          refusedButSaved: refused.filter((o) => savedTimes(o.name) !== 1).map((o) => o.name),
          auditOk: verify.ok,
          auditRows: verify.rows,
          restartMs,
        };
      } finally {
        db.close();
      }
    } finally {
      await second.stop('SIGTERM');
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
