import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listMethods, signedIn } from './support/flows.js';
import { createTestApp, DEMO, DEMO_PASSWORD, type TestApp } from './support/test-app.js';

type BodyParser = Parameters<ReturnType<ReturnType<TestApp['http']>['get']>['parse']>[0];
const binary: BodyParser = (res, done) => {
  const chunks: Buffer[] = [];
  res.on('data', (chunk: Buffer) => chunks.push(chunk));
  res.on('end', () => done(null, Buffer.concat(chunks)));
};
const OUTPUT = fileURLToPath(new URL('../test-output/', import.meta.url));
const scratch = mkdtempSync(join(tmpdir(), 'meritline-assessment-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));
/** poppler's words on the file: pdfsig exits 0 for valid and broken signatures alike. */
const poppler = (tool: string, bytes: Buffer) => {
  const file = join(scratch, `${tool}.pdf`);
  writeFileSync(file, bytes);
  const run = spawnSync(tool, tool === 'pdftotext' ? [file, '-'] : [file], { encoding: 'utf8' });
  return `${run.stdout}${run.stderr}`.replace(/\s+/g, ' ');
};
const STATEMENT = 'The new detector raises the sensitivity; recovery and precision are unchanged. Fit for use.';

type Row = Record<string, unknown>;
type Version = { id: string; number: number; status: string };
type MethodBody = { id: string; name: string; versions: Version[] };

const CAFFEINE = 'Caffeine in energy drinks by HPLC-UV';
const NITRATE = 'Nitrate in drinking water by ion chromatography';
const UNKNOWN_ID = '00000000-0000-4000-8000-000000000000';

describe('comparing method versions', () => {
  let t: TestApp;
  let caffeine: MethodBody;
  let nitrate: MethodBody;
  const version = (method: MethodBody, number: number) => method.versions.find((v) => v.number === number) as Version;
  /** The answer to a comparison request; its status is checked by the caller. */
  const compare = async (query: Row, email: string = DEMO.quality, status = 200) => {
    const res = await t
      .http()
      .get('/api/method-versions/compare')
      .query(query)
      .set(await signedIn(t, email));
    expect(res.status, JSON.stringify(res.body).slice(0, 400)).toBe(status);
    return res;
  };

  beforeAll(async () => {
    t = await createTestApp();
    const methods = await listMethods<MethodBody>(t, DEMO.quality);
    caffeine = methods.find((m) => m.name === CAFFEINE) as MethodBody;
    nitrate = methods.find((m) => m.name === NITRATE) as MethodBody;
  });
  afterAll(() => t.close());

  describe('GET /api/method-versions/compare', () => {
    it('compares the last two demo versions: the new detector changes the slope, the recovery stays equivalent', async () => {
      const res = await compare({ from: version(caffeine, 2).id, to: version(caffeine, 3).id });
      const body = res.body;
      expect(body.method).toMatchObject({ name: CAFFEINE, xUnit: 'mg/L' });
      expect(body.from).toMatchObject({ versionId: version(caffeine, 2).id, number: 2, studyStatus: 'approved' });
      expect(body.to).toMatchObject({ number: 3, status: 'active', studyId: expect.any(String) });
      expect(body.missing).toEqual([]);
      expect(body.alpha).toBe(0.05);
      expect(body.recoveryMarginPct).toBe(5);
      expect(body.tests.slope).toMatchObject({ available: true, verdict: 'different', df: 32 });
      expect(body.tests.slope.changePct).toBeGreaterThan(10);
      expect(body.tests.recovery.tost).toMatchObject({ available: true, verdict: 'equivalent', margin: 5 });
      expect(body.tests.recovery.verdict).toBe('equivalent');
      expect(body.tests.intermediatePrecision.dfNote).toMatch(/effective degrees of freedom/);
      expect(body.tests.repeatability.available).toBe(true);
      expect(body.changes).toContainEqual({ aspect: 'Kind of change', from: 'Sample preparation', to: 'Instrument', changed: true });
      expect(body.figures.find((f: Row) => f.figure === 'calibration.slope')).toMatchObject({ label: 'Slope', ratio: expect.any(Number) });
      expect(JSON.stringify(body.changes)).not.toMatch(/calibration\.|precision\./);
    });

    it('lets a reviewer compare, with a margin and a study picked for each side', async () => {
      const first = await compare({ from: version(caffeine, 1).id, to: version(caffeine, 2).id });
      const res = await compare(
        {
          from: version(caffeine, 1).id,
          to: version(caffeine, 2).id,
          fromStudy: first.body.from.studyId,
          toStudy: first.body.to.studyId,
          margin: 0.2,
        },
        DEMO.reviewer,
      );
      expect(res.body.recoveryMarginPct).toBe(0.2);
      expect(res.body.tests.recovery.tost.verdict).toBe('inconclusive');
      expect(res.body.tests.slope.verdict).toBe('no-difference');
    });

    it('shows what exists when a version has no approved study, and says what is missing', async () => {
      const created = await t
        .http()
        .post(`/api/methods/${caffeine.id}/versions`)
        .set(await signedIn(t, DEMO.quality))
        .send({
          changeSummary: 'Proposal: a shorter column for faster runs.',
          changeKind: 'column-or-consumable',
          revalidationScope: ['linearity'],
        })
        .expect(201);
      const res = await compare({ from: version(caffeine, 3).id, to: created.body.id });
      expect(res.body.to).toMatchObject({ number: 4, studyId: null, status: 'draft' });
      expect(res.body.missing).toEqual([expect.stringMatching(/Version 4 has no approved validation study/)]);
      expect(res.body.tests.slope).toEqual({ available: false, reason: expect.stringMatching(/Version 4/) });
      expect(res.body.figures.find((f: Row) => f.figure === 'calibration.slope')).toMatchObject({ to: null, difference: null });
      expect(res.body.changes).toContainEqual(expect.objectContaining({ aspect: 'Kind of change', to: 'Column or consumable' }));
    });

    it('refuses anonymous callers (401) and analysts and administrators (403)', async () => {
      const query = { from: version(caffeine, 2).id, to: version(caffeine, 3).id };
      await t.http().get('/api/method-versions/compare').query(query).expect(401);
      await compare(query, DEMO.analyst, 403);
      await compare(query, DEMO.admin, 403);
    });

    it.each([
      ['a missing version', (): Row => ({ to: version(caffeine, 3).id }), 'from'],
      ['a version id that is not one', (): Row => ({ from: 'v2', to: version(caffeine, 3).id }), 'from'],
      ['an unknown version', (): Row => ({ from: version(caffeine, 2).id, to: UNKNOWN_ID }), 'to'],
      ['the same version twice', (): Row => ({ from: version(caffeine, 3).id, to: version(caffeine, 3).id }), 'to'],
      ['versions of two methods', (): Row => ({ from: version(nitrate, 2).id, to: version(caffeine, 3).id }), 'to'],
      ['a margin of 0', (): Row => ({ from: version(caffeine, 2).id, to: version(caffeine, 3).id, margin: 0 }), 'margin'],
      ['a negative margin', (): Row => ({ from: version(caffeine, 2).id, to: version(caffeine, 3).id, margin: -5 }), 'margin'],
      [
        'a margin that is not a number',
        (): Row => ({ from: version(caffeine, 2).id, to: version(caffeine, 3).id, margin: 'wide' }),
        'margin',
      ],
      ['a margin above 50 points', (): Row => ({ from: version(caffeine, 2).id, to: version(caffeine, 3).id, margin: 51 }), 'margin'],
      [
        'a study of another version',
        (): Row => ({ from: version(caffeine, 2).id, to: version(caffeine, 3).id, fromStudy: UNKNOWN_ID }),
        'fromStudy',
      ],
    ])('answers 422 naming the field for %s', async (_case, query, field) => {
      const res = await compare(query(), DEMO.quality, 422);
      expect(res.body.statusCode).toBe(422);
      expect(res.body.errors.map((e: Row) => e.field)).toContain(field);
    });
  });

  describe('GET /api/methods/:id/trend', () => {
    it('gives the figures of every version in order', async () => {
      const res = await t
        .http()
        .get(`/api/methods/${caffeine.id}/trend`)
        .set(await signedIn(t, DEMO.reviewer))
        .expect(200);
      expect(res.body.method.name).toBe(CAFFEINE);
      const [v1, v2, v3] = res.body.points as Row[];
      expect([v1.number, v2.number, v3.number]).toEqual([1, 2, 3]);
      expect(v3.slope as number).toBeGreaterThan((v2.slope as number) * 1.1);
      expect(v3).toMatchObject({ slopeCi: [expect.any(Number), expect.any(Number)], loq: expect.any(Number), rsdI: expect.any(Number) });
      expect(v1.meanRecoveryPct as number).toBeGreaterThan(95);
      const v4 = res.body.points[3];
      expect(v4).toMatchObject({ number: 4, studyId: null, slope: null });
    });

    it('refuses anonymous (401), analysts (403), a malformed id and an unknown method (404)', async () => {
      await t.http().get(`/api/methods/${caffeine.id}/trend`).expect(401);
      await t
        .http()
        .get(`/api/methods/${caffeine.id}/trend`)
        .set(await signedIn(t, DEMO.analyst))
        .expect(403);
      const malformed = await t
        .http()
        .get('/api/methods/not-an-id/trend')
        .set(await signedIn(t, DEMO.quality));
      expect([400, 422]).toContain(malformed.status);
      await t
        .http()
        .get(`/api/methods/${UNKNOWN_ID}/trend`)
        .set(await signedIn(t, DEMO.quality))
        .expect(404);
    });
  });

  describe('POST /api/method-versions/:id/assessment', () => {
    const assess = async (versionId: string, body: Row, email: string = DEMO.quality) =>
      t
        .http()
        .post(`/api/method-versions/${versionId}/assessment`)
        .set(await signedIn(t, email))
        .send(body)
        .buffer(true)
        .parse(binary);
    const lockOf = async (versionId: string) =>
      (
        await t
          .http()
          .get(`/api/method-versions/${versionId}`)
          .set(await signedIn(t, DEMO.quality))
      ).body.lockVersion as number;

    it('signs the assessment of version 3 against version 2: a PDF pdfsig accepts, stored and verifiable', async () => {
      const v3 = version(caffeine, 3).id;
      const res = await assess(v3, { statement: STATEMENT, password: DEMO_PASSWORD, lockVersion: await lockOf(v3) });
      expect(res.status, res.body.toString().slice(0, 300)).toBe(201);
      expect(res.headers['content-type']).toBe('application/pdf');
      expect(res.headers['x-assessment-id']).toMatch(/^[0-9a-f-]{36}$/);
      const pdf = res.body as Buffer;
      mkdirSync(OUTPUT, { recursive: true });
      writeFileSync(join(OUTPUT, 'change-assessment.pdf'), pdf);
      spawnSync('pdftoppm', ['-png', '-r', '70', join(OUTPUT, 'change-assessment.pdf'), join(OUTPUT, 'change-assessment')]);
      expect(poppler('pdfsig', pdf)).toMatch(/Signature is Valid/);
      const text = poppler('pdftotext', pdf);
      expect(text).toContain('Change assessment');
      expect(text).toContain('significantly different');
      expect(text).toContain('equivalent within the margin');
      expect(text).toContain(STATEMENT);
      expect(text).not.toMatch(/calibration\.slope|no-difference/);

      const verified = await t
        .http()
        .post('/api/reports/verify')
        .attach('file', pdf, { filename: 'a.pdf', contentType: 'application/pdf' });
      expect(verified.body).toMatchObject({
        valid: true,
        kind: 'change-assessment',
        reportId: res.headers['x-assessment-id'],
        methodName: CAFFEINE,
        methodVersion: 3,
        studyTitle: 'Change assessment of version 3 against version 2',
      });
      const changed = Buffer.from(pdf);
      changed[changed.indexOf('(Change assessment: ') + 8] = 'X'.charCodeAt(0);
      const refused = await t
        .http()
        .post('/api/reports/verify')
        .attach('file', changed, { filename: 'a.pdf', contentType: 'application/pdf' });
      expect(refused.body).toMatchObject({ valid: false, reason: expect.stringMatching(/changed since it was signed/) });
      const trail = await t
        .http()
        .get('/api/audit')
        .query({ record: `method-version:${v3}` })
        .set(await signedIn(t, DEMO.quality));
      expect(trail.body.items.map((e: Row) => e.action)).toContain('signature.change-assessed');
    });

    it('refuses anonymous (401), reviewers and analysts (403), a wrong password (401), an unknown version (404), a stale lock (409)', async () => {
      const v3 = version(caffeine, 3).id;
      const body = { statement: STATEMENT, password: DEMO_PASSWORD, lockVersion: await lockOf(v3) };
      await t.http().post(`/api/method-versions/${v3}/assessment`).send(body).expect(401);
      expect((await assess(v3, body, DEMO.reviewer)).status).toBe(403);
      expect((await assess(v3, body, DEMO.analyst)).status).toBe(403);
      const wrong = await assess(v3, { ...body, password: 'not the password' });
      expect(wrong.status).toBe(401);
      expect(JSON.parse(wrong.body.toString()).message).toMatch(/not signed/);
      expect((await assess(UNKNOWN_ID, body)).status).toBe(404);
      expect((await assess(v3, { ...body, lockVersion: body.lockVersion + 5 })).status).toBe(409);
    });

    it.each([
      ['a short statement', { statement: 'Fine.' }, 'statement'],
      ['no password', { password: undefined }, 'password'],
      ['no lock version', { lockVersion: undefined }, 'lockVersion'],
      ['a margin of 0', { margin: 0 }, 'margin'],
      ['an earlier version of another method', { compareWith: 'nitrate' }, 'compareWith'],
      ['the version itself', { compareWith: 'self' }, 'compareWith'],
    ])('answers 422 naming the field for %s, signing nothing', async (_case, change, field) => {
      const v3 = version(caffeine, 3).id;
      const wanted = (change as Row).compareWith;
      const compareWith = wanted === 'nitrate' ? version(nitrate, 1).id : wanted === 'self' ? v3 : undefined;
      const res = await assess(v3, {
        statement: STATEMENT,
        password: DEMO_PASSWORD,
        lockVersion: await lockOf(v3),
        ...change,
        ...(compareWith ? { compareWith } : {}),
      });
      expect(res.status).toBe(422);
      expect(JSON.parse(res.body.toString()).errors.map((e: Row) => e.field)).toContain(field);
    });

    it('refuses to assess a first version, which has nothing earlier', async () => {
      const v1 = version(caffeine, 1).id;
      const res = await assess(v1, { statement: STATEMENT, password: DEMO_PASSWORD, lockVersion: await lockOf(v1) });
      expect(res.status).toBe(422);
      expect(JSON.parse(res.body.toString()).errors[0]).toMatchObject({ field: 'compareWith', code: 'no_earlier_version' });
    });
  });

  it('documents the routes with their success and error bodies in the OpenAPI description', async () => {
    const docs = (await t.http().get('/api/docs-json').expect(200)).body;
    const compareDoc = docs.paths['/api/method-versions/compare'].get;
    expect(Object.keys(compareDoc.responses)).toEqual(expect.arrayContaining(['200', '401', '403', '422']));
    expect(compareDoc.parameters.map((p: Row) => p.name)).toEqual(expect.arrayContaining(['from', 'to', 'fromStudy', 'toStudy', 'margin']));
    expect(Object.keys(docs.paths['/api/methods/{id}/trend'].get.responses)).toEqual(expect.arrayContaining(['200', '404']));
    const assessDoc = docs.paths['/api/method-versions/{id}/assessment'].post;
    expect(Object.keys(assessDoc.responses)).toEqual(expect.arrayContaining(['201', '401', '403', '404', '409', '422']));
  });
});
