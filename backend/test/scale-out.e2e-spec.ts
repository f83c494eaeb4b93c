import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { calibrationData } from './support/review-fixtures.js';
import { createPostgresDatabase, DEMO, DEMO_PASSWORD, postgresServerUrl } from './support/test-app.js';

const MAIN = fileURLToPath(new URL('../dist/main.js', import.meta.url));
const STUDIES = 80;

interface Server {
  child: ChildProcess;
  base: string;
  output: string[];
}

interface Reply {
  status: number;
  body: Record<string, unknown>;
}

function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const server = createServer().listen(0, '127.0.0.1', () => {
      const { port } = server.address() as { port: number };
      server.close(() => resolve(port));
    });
  });
}

async function startServer(env: Record<string, string>): Promise<Server> {
  const port = await freePort();
  const child = spawn(process.execPath, [MAIN], { env: { ...process.env, ...env, PORT: String(port) }, stdio: ['ignore', 'pipe', 'pipe'] });
  const output: string[] = [];
  child.stdout!.on('data', (chunk: Buffer) => output.push(chunk.toString()));
  child.stderr!.on('data', (chunk: Buffer) => output.push(chunk.toString()));
  const base = `http://127.0.0.1:${port}`;
  for (let attempt = 0; attempt < 240; attempt++) {
    if (child.exitCode !== null) break;
    if (
      await fetch(`${base}/api/health`)
        .then((r) => r.ok)
        .catch(() => false)
    )
      return { child, base, output };
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  child.kill();
  throw new Error(`The built server did not start:\n${output.join('')}`);
}

function stopServer(server: Server): Promise<void> {
  if (server.child.exitCode !== null) return Promise.resolve();
  return new Promise((resolve) => {
    server.child.once('exit', () => resolve());
    server.child.kill('SIGTERM');
  });
}

describe.skipIf(!postgresServerUrl)('two server processes writing to one PostgreSQL database at once', () => {
  const dir = mkdtempSync(join(tmpdir(), 'meritline-scale-out-'));
  let database: Awaited<ReturnType<typeof createPostgresDatabase>>;
  const servers: Server[] = [];
  const token: Record<'analyst' | 'reviewer' | 'quality', string> = { analyst: '', reviewer: '', quality: '' };

  /** Request number `i` goes to server i mod 2, so every burst is spread over both processes. */
  async function call(i: number, method: string, path: string, who: keyof typeof token, body?: unknown): Promise<Reply> {
    const res = await fetch(`${servers[i % 2].base}${path}`, {
      method,
      headers: { Authorization: `Bearer ${token[who]}`, ...(body === undefined ? {} : { 'Content-Type': 'application/json' }) },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    return { status: res.status, body: (await res.json().catch(() => ({}))) as Record<string, unknown> };
  }

  const statuses = (replies: Reply[]) => replies.map((r) => r.status);

  async function onDatabase<T>(work: (client: pg.Client) => Promise<T>): Promise<T> {
    const client = new pg.Client({ connectionString: database.url });
    await client.connect();
    try {
      return await work(client);
    } finally {
      await client.end();
    }
  }

  beforeAll(async () => {
    if (!existsSync(MAIN)) throw new Error('The built server is missing: run npm run build -w backend first.');
    database = await createPostgresDatabase();
    const env = {
      NODE_ENV: 'test',
      DATABASE_URL: database.url,
      DATA_DIR: dir,
      SMTP_URL: '',
      JWT_SECRET: 'scale-out-test-secret-shared-by-both-processes',
      AUDIT_HMAC_KEY: 'scale-out-test-audit-key-shared-by-both-processes',
    };
    // The first process migrates and seeds; the second finds the schema in place, as a second node of a deployment would.
    servers.push(await startServer(env));
    servers.push(await startServer({ ...env, SEED_DEMO: 'false' }));
    for (const who of Object.keys(token) as (keyof typeof token)[]) {
      const res = await fetch(`${servers[0].base}/api/auth/login`, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json' },
        body: JSON.stringify({ email: DEMO[who], password: DEMO_PASSWORD }),
      });
      expect(res.status).toBe(200);
      token[who] = ((await res.json()) as { accessToken: string }).accessToken;
    }
  }, 120_000);

  afterAll(async () => {
    await Promise.all(servers.map(stopServer));
    await database?.drop();
    rmSync(dir, { recursive: true, force: true });
  });

  it('should take concurrent creations, edits, submissions, comments and approvals on both processes into one audit chain', async () => {
    expect((await call(1, 'GET', '/api/auth/me', 'analyst')).status).toBe(200);
    const method = await call(0, 'POST', '/api/methods', 'quality', {
      name: 'Nitrate in drinking water, two-node check',
      analyte: 'Nitrate',
      matrix: 'Drinking water',
      technique: 'UV-Vis',
      xUnit: 'mg/L',
      yUnit: 'AU',
      purpose: 'environmental',
      criteria: [{ figure: 'calibration.r2', op: '>=', value: 0.995 }],
      settings: { requiresQualityRelease: false },
    });
    expect(method.status).toBe(201);
    const methodVersionId = (method.body.versions as { id: string }[])[0].id;

    const created = await Promise.all(
      Array.from({ length: STUDIES }, (_, i) =>
        call(i, 'POST', '/api/studies', 'analyst', { methodVersionId, title: `Two-node study ${i + 1}`, data: calibrationData() }),
      ),
    );
    expect(statuses(created)).toEqual(Array(STUDIES).fill(201));
    const studies = created.map((r) => r.body as { id: string; lockVersion: number });

    // Submissions (0–59) and, on 60–69, the same edit sent to both processes with the same lock version.
    const submitted = studies.slice(0, 60);
    const contested = studies.slice(60, 70);
    const [submissions, edits] = await Promise.all([
      Promise.all(submitted.map((s, i) => call(i, 'POST', `/api/studies/${s.id}/submit`, 'analyst', { password: DEMO_PASSWORD }))),
      Promise.all(
        contested.flatMap((s, i) =>
          [0, 1].map((server) =>
            call(server, 'PATCH', `/api/studies/${s.id}`, 'analyst', { title: `Renamed on ${server} ${i}`, lockVersion: s.lockVersion }),
          ),
        ),
      ),
    ]);
    expect(statuses(submissions)).toEqual(Array(submitted.length).fill(200));
    for (let i = 0; i < contested.length; i++) expect(statuses(edits.slice(2 * i, 2 * i + 2)).sort()).toEqual([200, 409]);

    // Two people approve each of 0–9 at the same moment, one on each process; comments go to 10–59 meanwhile.
    const approvedIds = submitted.slice(0, 10).map((s) => s.id);
    const [approvals, comments] = await Promise.all([
      Promise.all(
        approvedIds.flatMap((id) => [
          call(0, 'POST', `/api/studies/${id}/approve`, 'reviewer', { password: DEMO_PASSWORD }),
          call(1, 'POST', `/api/studies/${id}/approve`, 'quality', { password: DEMO_PASSWORD }),
        ]),
      ),
      Promise.all(
        submitted
          .slice(10)
          .map((s, i) =>
            call(i, 'POST', `/api/studies/${s.id}/comments`, 'reviewer', { section: 'standards', body: `Checked on node ${i % 2}.` }),
          ),
      ),
    ]);
    expect(statuses(comments)).toEqual(Array(50).fill(201));
    for (let i = 0; i < approvedIds.length; i++) expect(statuses(approvals.slice(2 * i, 2 * i + 2)).sort()).toEqual([200, 409]);

    await onDatabase(async (client) => {
      const signatures = await client.query<{ n: string }>(
        "SELECT COUNT(*) AS n FROM study_signatures WHERE meaning = 'reviewed-and-approved' AND study_id = ANY($1::uuid[])",
        [approvedIds],
      );
      expect(Number(signatures.rows[0].n)).toBe(approvedIds.length);
      const count = await client.query<{ n: string }>('SELECT COUNT(*) AS n FROM validation_studies WHERE method_version_id = $1', [
        methodVersionId,
      ]);
      expect(Number(count.rows[0].n)).toBe(STUDIES);
      const forks = await client.query('SELECT prev_hash FROM audit_entries GROUP BY prev_hash HAVING COUNT(*) > 1');
      expect(forks.rows).toEqual([]);
      const chain = await client.query<{ rows: string; last: number }>('SELECT COUNT(*) AS rows, MAX(seq) AS last FROM audit_entries');
      expect(Number(chain.rows[0].rows)).toBe(chain.rows[0].last);
    });
    for (const server of [0, 1]) {
      const verify = await call(server, 'GET', '/api/audit/verify', 'quality');
      expect(verify.body).toMatchObject({ ok: true });
    }
  }, 240_000);
});
