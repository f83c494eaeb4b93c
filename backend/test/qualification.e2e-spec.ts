import { execFileSync, spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ENGINE_VERSION, QUALIFICATION_CHECKS, type QualificationRunDetailDto } from '@meritline/shared';
import { bearer } from './support/review-fixtures.js';
import { createTestApp, DEMO, postgresServerUrl, type TestApp } from './support/test-app.js';

type BodyParser = Parameters<ReturnType<ReturnType<TestApp['http']>['get']>['parse']>[0];
const binary: BodyParser = (res, done) => {
  const chunks: Buffer[] = [];
  res.on('data', (chunk: Buffer) => chunks.push(chunk));
  res.on('end', () => done(null, Buffer.concat(chunks)));
};
const scratch = mkdtempSync(join(tmpdir(), 'meritline-qualification-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));
/** pdfsig exits 0 for valid and broken signatures alike, so its words are what count. */
const pdfsig = (file: string) => {
  const run = spawnSync('pdfsig', [file], { encoding: 'utf8' });
  return `${run.stdout}${run.stderr}`;
};

describe('self-qualification of the calculations', () => {
  let t: TestApp;
  let as: (who: keyof typeof DEMO) => Record<string, string>;
  let run: QualificationRunDetailDto;
  let pdf: Buffer;

  beforeAll(async () => {
    t = await createTestApp();
    const tokens = Object.fromEntries(await Promise.all(Object.entries(DEMO).map(async ([k, email]) => [k, await t.tokenFor(email)])));
    as = (who) => bearer(tokens[who] as string);
  });
  afterAll(() => t.close());

  it('should refuse anonymous callers (401), analysts and reviewers (403)', async () => {
    await t.http().post('/api/qualification').expect(401);
    await t.http().get('/api/qualification').expect(401);
    await t.http().post('/api/qualification').set(as('analyst')).expect(403);
    await t.http().post('/api/qualification').set(as('reviewer')).expect(403);
    await t.http().get('/api/qualification').set(as('analyst')).expect(403);
  });

  it('should run every published check through the engine and pass them all', async () => {
    run = (await t.http().post('/api/qualification').set(as('quality')).expect(201)).body;
    expect(run).toMatchObject({ total: QUALIFICATION_CHECKS.length, passed: QUALIFICATION_CHECKS.length, failed: 0, allPassed: true });
    expect(run.installation).toMatchObject({ engineVersion: ENGINE_VERSION, nodeVersion: process.version, productVersion: '0.1.0' });
    expect(run.installation.databaseKind).toMatch(postgresServerUrl ? /^PostgreSQL \d+\.\d+/ : /^SQLite \d+\.\d+/);
    expect(run.checks.map((c) => c.id)).toEqual(QUALIFICATION_CHECKS.map((c) => c.id));
    expect(run.minDigits).toBeGreaterThanOrEqual(9);
    const list = await t.http().get('/api/qualification').set(as('admin')).expect(200);
    expect(list.body[0]).toMatchObject({ id: run.id, allPassed: true, sha256: run.sha256 });
    expect(list.body[0].checks).toBeUndefined();
  });

  it('should store a signed PDF that pdfsig accepts and that lists every check with its source', async () => {
    const res = await t.http().get(`/api/qualification/${run.id}/report`).set(as('admin')).buffer(true).parse(binary).expect(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    pdf = res.body as Buffer;
    const file = join(scratch, 'qualification.pdf');
    writeFileSync(file, pdf);
    mkdirSync(new URL('../test-output/', import.meta.url), { recursive: true });
    writeFileSync(new URL('../test-output/self-qualification.pdf', import.meta.url), pdf);
    expect(pdfsig(file)).toContain('Signature is Valid.');
    const text = execFileSync('pdftotext', [file, '-'], { encoding: 'utf8' });
    // Long ids wrap at their hyphens, which pdftotext then joins: compare without hyphens.
    const compact = text.replace(/[\s-]+/g, '');
    for (const check of QUALIFICATION_CHECKS) expect(compact, check.id).toContain(check.id.replace(/-/g, ''));
    const words = text.replace(/\s+/g, ' ');
    for (const check of QUALIFICATION_CHECKS) expect(words).toContain(check.source.slice(0, 40));
    expect(words).toContain('All checks passed');
    expect(words).toContain(`${QUALIFICATION_CHECKS.length} of ${QUALIFICATION_CHECKS.length} checks agree`);
    expect(words).toContain(process.version);
    expect(words).toMatch(/Source revision/);
  });

  it('should confirm the report on the public verify route and refuse a changed copy', async () => {
    const ok = await t.http().post('/api/reports/verify').attach('file', pdf, 'qualification.pdf').expect(200);
    expect(ok.body).toEqual({
      valid: true,
      kind: 'self-qualification',
      qualificationId: run.id,
      signedAt: run.ranAt,
      passed: run.passed,
      total: run.total,
      sha256: run.sha256,
    });
    const changed = Buffer.from(pdf);
    changed[changed.length - 20] ^= 1;
    const refused = await t.http().post('/api/reports/verify').attach('file', changed, 'qualification.pdf').expect(200);
    expect(refused.body.valid).toBe(false);
  });

  it('should record the run in the audit trail and answer 404 for an unknown report', async () => {
    const trail = await t.http().get('/api/audit?action=qualification.run').set(as('quality')).expect(200);
    expect(trail.body.items[0]).toMatchObject({ entityId: run.id, actionText: 'Self-qualification of the calculations run' });
    await t.http().get('/api/qualification/00000000-0000-4000-8000-000000000000/report').set(as('quality')).expect(404);
    await t.http().get('/api/qualification/not-an-id/report').set(as('quality')).expect(400);
  });
});
