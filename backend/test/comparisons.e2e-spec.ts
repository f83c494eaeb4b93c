import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, DEMO, type TestApp } from './support/test-app.js';

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
  const auth = async (email: string) => ({ Authorization: `Bearer ${await t.tokenFor(email)}` });
  const version = (method: MethodBody, number: number) => method.versions.find((v) => v.number === number) as Version;
  /** The answer to a comparison request; its status is checked by the caller. */
  const compare = async (query: Row, email: string = DEMO.quality, status = 200) => {
    const res = await t
      .http()
      .get('/api/method-versions/compare')
      .query(query)
      .set(await auth(email));
    expect(res.status, JSON.stringify(res.body).slice(0, 400)).toBe(status);
    return res;
  };

  beforeAll(async () => {
    t = await createTestApp();
    const methods = (
      await t
        .http()
        .get('/api/methods')
        .set(await auth(DEMO.quality))
        .expect(200)
    ).body as MethodBody[];
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
        .set(await auth(DEMO.quality))
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
        .set(await auth(DEMO.reviewer))
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
        .set(await auth(DEMO.analyst))
        .expect(403);
      const malformed = await t
        .http()
        .get('/api/methods/not-an-id/trend')
        .set(await auth(DEMO.quality));
      expect([400, 422]).toContain(malformed.status);
      await t
        .http()
        .get(`/api/methods/${UNKNOWN_ID}/trend`)
        .set(await auth(DEMO.quality))
        .expect(404);
    });
  });
});
