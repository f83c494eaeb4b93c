import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import { execFileSync } from 'node:child_process';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ENGINE_VERSION, type StudyInput } from '@meritline/shared';
import { runCsv } from '../src/runs/run-export.js';
import { RunsService } from '../src/runs/runs.service.js';
import { addValidatedVersion, bearer, binary, sqlQuery, tokensFor, type ValidatedVersion } from './support/flows.js';
import { queryDatabase } from './support/review-fixtures.js';
import { createTestApp, DEMO, DEMO_PASSWORD, type TestApp } from './support/test-app.js';

const OUTPUT = fileURLToPath(new URL('../test-output', import.meta.url));

/* eslint-disable @typescript-eslint/no-explicit-any -- reference files are plain JSON */
const reference = (name: string): any => JSON.parse(readFileSync(new URL(`../../reference-checks/data/${name}`, import.meta.url), 'utf8'));

/*
 * Reference data, with its provenance in each file:
 * - Miller & Miller, Statistics and Chemometrics for Analytical Chemistry, fluorescence example:
 *   x0 and the 95 % interval of inverse prediction, ICH Q2(R2) DL and QL from s_y/x.
 * - Miller & Miller weighted regression example: the same absorbance standards unweighted
 *   (intercept not significant) and weighted by 1/s².
 * - NIST StRD Pontius: certified quadratic coefficients.
 */
const miller = reference('calibration_miller_fluorescence.json');
const millerWeighted = reference('calibration_miller_weighted.json');
const pontius = reference('nist_strd_pontius.json');
const FLUORESCENCE = { x: miller.data.x as number[], y: miller.data.y as number[] };
const ABSORBANCE = {
  x: millerWeighted.data.x as number[],
  y: millerWeighted.data.y as number[],
  s: millerWeighted.data.s as number[],
  unweighted: { a: millerWeighted.computed.unweighted_intercept as number, b: millerWeighted.computed.unweighted_slope as number },
};
const PONTIUS_X = pontius.data.x as number[];
const PONTIUS_Y = pontius.data.y as number[];
const PONTIUS_CERTIFIED = {
  B0: Number(pontius.certified.parameters.B0.estimate),
  B1: Number(pontius.certified.parameters.B1.estimate),
  B2: Number(pontius.certified.parameters.B2.estimate),
};
const inverse = (y0: number, m: number) =>
  miller.computed.inverse_prediction.find((p: any) => p.y0 === y0 && p.m_replicates_of_unknown === m);
const weightedInverse = (y0: number) => millerWeighted.computed.inverse_prediction.find((p: any) => p.y0 === y0);
/* eslint-enable @typescript-eslint/no-explicit-any */

const pairs = (x: number[], y: number[]) => x.map((xi, i) => ({ x: xi, y: y[i] }));
const close = (actual: number, expected: number, relative = 1e-9) =>
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(Math.abs(expected) * relative + 1e-15);

describe('routine runs', () => {
  let t: TestApp;
  let analyst: string;
  let reviewer: string;
  let quality: string;
  let admin: string;
  const versions: Record<string, string> = {};

  const addVersion = async (key: string, options: Omit<ValidatedVersion, 'name' | 'studyTitle'>) => {
    versions[key] = (await addValidatedVersion(t, { name: `${key} method`, studyTitle: `${key} validation`, ...options })).id;
  };

  const auth = (token: string) => ({ Authorization: `Bearer ${token}` });
  const post = (body: unknown, token = analyst) =>
    t
      .http()
      .post('/api/runs')
      .set(auth(token))
      .send(body as object);
  const query = <T>(sql: string, parameters: unknown[] = []): Promise<T[]> => queryDatabase<T>(t, sql, ...parameters);
  const tableCounts = async () => ({
    runs: (await sqlQuery<{ n: number }>(t, 'select count(*) as n from runs'))[0].n,
    audit: (await sqlQuery<{ n: number }>(t, 'select count(*) as n from audit_entries'))[0].n,
  });
  /** Sends a refused request and checks that neither the runs nor the audit trail changed. */
  async function refused(body: unknown, status: number, token = analyst) {
    const before = await tableCounts();
    const res = await post(body, token).expect(status);
    expect(await tableCounts()).toEqual(before);
    return res.body as { statusCode: number; message: string; errors?: { field: string; code: string; message: string }[] };
  }
  const fieldsOf = (body: { errors?: { field: string }[] }) => (body.errors ?? []).map((e) => e.field);

  const fluorescenceRun = (overrides: Record<string, unknown> = {}) => ({
    methodVersionId: versions.fluorescence,
    title: 'Fluorescein batch 7',
    data: {
      model: 'linear',
      standards: pairs(FLUORESCENCE.x, FLUORESCENCE.y),
      checks: [{ id: 'CCV-1', nominal: 6, y: [13.1] }],
      unknowns: [
        { id: 'S-1', y: [13.5, 13.5, 13.5, 13.5] },
        { id: 'S-2', y: [2.9] },
        { id: 'S-3', y: [23.0] },
        { id: 'S-4', y: [13.5], dilution: 5 },
        { id: 'S-5', y: [30] },
      ],
      ...overrides,
    },
  });

  beforeAll(async () => {
    t = await createTestApp();
    [analyst, reviewer, quality, admin] = await tokensFor(t, DEMO.analyst, DEMO.reviewer, DEMO.quality, DEMO.admin);

    const fluorescence: StudyInput = {
      model: 'linear',
      units: { x: 'pg/ml', y: 'intensity' },
      standards: pairs(FLUORESCENCE.x, FLUORESCENCE.y),
    };
    await addVersion('fluorescence', { method: { xUnit: 'pg/ml', yUnit: 'intensity' }, study: fluorescence });
    const absorbance: StudyInput = { model: 'linear', standards: pairs(ABSORBANCE.x, ABSORBANCE.y) };
    await addVersion('absorbance', { method: { xUnit: 'µg/ml' }, study: absorbance });
    await addVersion('absorbanceStrict', { method: { xUnit: 'µg/ml' }, study: absorbance, onePointMaxInterceptPct: 1 });
    await addVersion('absorbanceChart', { method: { xUnit: 'µg/ml' }, study: absorbance });
    await addVersion('weighted', {
      method: { xUnit: 'µg/ml' },
      study: {
        model: 'linear',
        weighting: '1/s2',
        standards: ABSORBANCE.x.map((x, i) => ({ x, y: ABSORBANCE.y[i], sd: ABSORBANCE.s[i] })),
      },
    });
    await addVersion('pontius', {
      method: { xUnit: 'load', yUnit: 'deflection' },
      study: { model: 'quadratic', standards: pairs(PONTIUS_X, PONTIUS_Y) },
    });
    await addVersion('draft', { method: {}, study: absorbance, status: 'draft' });
    await addVersion('retired', { method: {}, study: absorbance, status: 'retired' });
    await addVersion('unvalidated', { method: {}, study: absorbance, studyStatus: 'submitted' });
  });
  afterAll(async () => {
    await t?.close();
  });

  describe('run options', () => {
    it('should refuse one-point where the validation intercept is significant (Miller & Miller fluorescence, t = 5.15) and give the reason', async () => {
      const res = await t.http().get(`/api/method-versions/${versions.fluorescence}/run-options`).set(bearer(analyst)).expect(200);
      const models = Object.fromEntries(res.body.models.map((m: { model: string }) => [m.model, m]));
      expect(models['one-point']).toMatchObject({ allowed: false, reason: expect.stringMatching(/differs significantly from zero/) });
      expect(models['two-point'].allowed).toBe(true);
      expect(models.linear).toMatchObject({ allowed: true, weighting: 'none' });
      expect(models.quadratic).toMatchObject({ allowed: false, reason: expect.stringMatching(/straight line/) });
      // ICH Q2(R2) DL = 3.3 s_y/x / b, QL = 10 s_y/x / b on the fluorescence standards.
      close(res.body.lod, miller.computed['ICH_DL 3.3 s_y/x / b'], 1e-9);
      close(res.body.loq, miller.computed['ICH_QL 10 s_y/x / b'], 1e-9);
      expect(res.body.validatedRange).toEqual({ low: 0, high: 12, basis: 'standards' });
      expect(res.body).toMatchObject({ usable: true, checkTolerancePct: 10, lockVersion: 1 });
    });

    it('should offer one-point where the intercept is not significant and within the limit, and refuse it above a stricter limit', async () => {
      const open = await t.http().get(`/api/method-versions/${versions.absorbance}/run-options`).set(bearer(reviewer)).expect(200);
      expect(open.body.models.find((m: { model: string }) => m.model === 'one-point')).toEqual({ model: 'one-point', allowed: true });
      // a/(a + b·x_max) = 0.013286/(0.013286 + 0.72543) = 1.8 % of the top response.
      const strict = await t.http().get(`/api/method-versions/${versions.absorbanceStrict}/run-options`).set(bearer(quality)).expect(200);
      expect(strict.body.models.find((m: { model: string }) => m.model === 'one-point')).toMatchObject({
        allowed: false,
        reason: expect.stringMatching(/1\.8 % of the top standard's response, above this version's limit of 1 %/),
      });
    });

    it('should offer only the validated quadratic and weighting on curved and weighted versions', async () => {
      const curved = await t.http().get(`/api/method-versions/${versions.pontius}/run-options`).set(bearer(analyst)).expect(200);
      expect(curved.body.models.filter((m: { allowed: boolean }) => m.allowed)).toEqual([
        { model: 'quadratic', allowed: true, weighting: 'none' },
      ]);
      const weighted = await t.http().get(`/api/method-versions/${versions.weighted}/run-options`).set(bearer(analyst)).expect(200);
      expect(weighted.body.models.find((m: { model: string }) => m.model === 'linear')).toEqual({
        model: 'linear',
        allowed: true,
        weighting: '1/s2',
      });
    });

    it('should mark draft, retired and never-validated versions unusable with the reason', async () => {
      for (const [key, pattern] of [
        ['draft', /is a draft/],
        ['retired', /is retired/],
        ['unvalidated', /no approved validation study/],
      ] as const) {
        const res = await t.http().get(`/api/method-versions/${versions[key]}/run-options`).set(bearer(analyst)).expect(200);
        expect(res.body.usable).toBe(false);
        expect(res.body.reason).toMatch(pattern);
        expect(res.body.models.every((m: { allowed: boolean }) => !m.allowed)).toBe(true);
      }
      const choices = await t.http().get('/api/runs/method-choices').set(bearer(analyst)).expect(200);
      const all = choices.body.flatMap((m: { versions: { id: string; usable: boolean }[] }) => m.versions);
      expect(all.find((v: { id: string }) => v.id === versions.retired).usable).toBe(false);
      expect(all.find((v: { id: string }) => v.id === versions.absorbance).usable).toBe(true);
    });

    it('should answer 404 for an unknown version and 401/403 for the wrong caller', async () => {
      const unknown = '00000000-0000-4000-8000-000000000000';
      await t.http().get(`/api/method-versions/${unknown}/run-options`).set(bearer(analyst)).expect(404);
      await t.http().get(`/api/method-versions/${unknown}/control-chart`).set(bearer(analyst)).expect(404);
      await t.http().get(`/api/method-versions/${versions.absorbance}/run-options`).expect(401);
      await t.http().get(`/api/method-versions/${versions.absorbance}/control-chart`).expect(401);
      await t.http().get(`/api/method-versions/${versions.absorbance}/run-options`).set(bearer(admin)).expect(403);
    });
  });

  describe('calibrating a run', () => {
    let linearRunId: string;

    it('should read unknowns off a straight line with the inverse-prediction interval of Miller & Miller', async () => {
      const res = await post(fluorescenceRun()).expect(201);
      linearRunId = res.body.id;
      expect(res.body).toMatchObject({
        status: 'accepted',
        model: 'linear',
        rejectionReasons: [],
        engineVersion: ENGINE_VERSION,
        author: { name: 'Alma Ruiz' },
      });
      const [s1, s2, s3, s4, s5] = res.body.result.unknowns;
      // Miller & Miller: y0 = 13.5 with m = 4 gives x0 = 6.2072 and a 95 % half-width of 0.36146.
      close(s1.x0, inverse(13.5, 4).x0);
      close((s1.ci[1] - s1.ci[0]) / 2, inverse(13.5, 4)['CI95_halfwidth t(0.975,5)*s_x0'], 1e-8);
      expect(s1.reported).toBe('6.21 ± 0.36 pg/ml');
      expect(s1.flags).toEqual([]);
      // y0 = 2.9 reads 0.716 pg/ml: below the ICH Q2 LOD of the validation (0.740), reported as "< LOQ".
      close(s2.x0, inverse(2.9, 1).x0);
      expect(s2.flags).toEqual(['belowLod', 'belowLoq']);
      expect(s2.reported).toBe('< 2.2 pg/ml');
      expect(s2.remarks[0]).toMatch(/Not detected: below the LOD/);
      // y0 = 23.0 gives 11.1286 ± 0.67656 (m = 1).
      close(s3.x0, inverse(23.0, 1).x0);
      expect(s3.reported).toBe('11.13 ± 0.68 pg/ml');
      // A 1 in 5 dilution multiplies the reading and its interval: 5 × (6.2072 ± 0.61631).
      close(s4.x0, 5 * inverse(13.5, 1).x0);
      expect(s4.reported).toBe('31.0 ± 3.1 pg/ml');
      // y0 = 30 reads 14.75 pg/ml, above the top standard (12): reported as "> 12", diluted 1 in 2 next time.
      expect(s5.flags).toEqual(['aboveTopStandard', 'outsideValidatedRange']);
      expect(s5.reported).toBe('> 12.0 pg/ml');
      expect(s5.suggestedDilution).toBe(2);
      expect(res.body.result.checks).toEqual([
        { id: 'CCV-1', nominal: 6, yMean: 13.1, found: expect.any(Number), recoveryPct: expect.any(Number), pass: true },
      ]);
      close(res.body.result.checks[0].recoveryPct, 100, 1e-12);
      expect(res.body.result.onePointBias).toBeNull();
      expect(res.body.data.units).toEqual({ x: 'pg/ml', y: 'intensity' });
    });

    it('should record the creation in the audit trail', async () => {
      const rows = await query<{ entityId: string; actorName: string }>(
        'select actor_name as "actorName", entity_id as "entityId" from audit_entries where action = \'run.created\'',
      );
      expect(rows).toContainEqual(expect.objectContaining({ entityId: linearRunId, actorName: 'Alma Ruiz' }));
    });

    it('should reject a run whose check standard recovers outside the window, on every result', async () => {
      const res = await post(
        fluorescenceRun({
          checks: [
            { id: 'CCV-1', nominal: 6, y: [13.1] },
            { id: 'CCV-2', nominal: 6, y: [15] },
          ],
        }),
      ).expect(201);
      expect(res.body.status).toBe('rejected');
      // (15 − a)/b = 6.984 pg/ml: 116.4 % of 6.
      expect(res.body.rejectionReasons).toEqual([
        expect.stringMatching(
          /^Check standard CCV-2 recovered 116\.4 % of its nominal 6 pg\/ml, outside the acceptance window of 90 to 110 %\.$/,
        ),
      ]);
      expect(res.body.result.checks.map((c: { pass: boolean }) => c.pass)).toEqual([true, false]);
      for (const u of res.body.result.unknowns) {
        expect(u.reportable).toBe(false);
        expect(u.remarks).toContain('Not reportable: the run was rejected.');
      }
    });

    it('should calibrate two-point through the two standards (line through two points, common practice)', async () => {
      const res = await post({
        methodVersionId: versions.absorbance,
        title: 'Two-point batch',
        data: {
          model: 'two-point',
          standards: [
            { x: 2, y: 0.158 },
            { x: 10, y: 0.739 },
          ],
          checks: [{ id: 'C', nominal: 6, y: [0.472] }],
          unknowns: [{ id: 'U', y: [0.5] }],
        },
      }).expect(201);
      const x0 = 2 + ((0.5 - 0.158) * (10 - 2)) / (0.739 - 0.158);
      close(res.body.result.unknowns[0].x0, x0, 1e-12);
      expect(res.body.result.unknowns[0].ci).toBeNull();
      expect(res.body.result.unknowns[0].reported).toBe('6.71 µg/ml');
      close(res.body.result.calibration.slope, (0.739 - 0.158) / 8, 1e-12);
      close(res.body.result.checks[0].recoveryPct, (100 * (2 + ((0.472 - 0.158) * 8) / 0.581)) / 6, 1e-12);
    });

    it('should read each unknown off the pair of standards that brackets it', async () => {
      const res = await post({
        methodVersionId: versions.absorbance,
        title: 'Bracketed batch',
        data: {
          model: 'two-point',
          twoPoint: { bracketing: true },
          standards: pairs(ABSORBANCE.x.slice(1), ABSORBANCE.y.slice(1)),
          checks: [{ id: 'C', nominal: 6, y: [0.472] }],
          unknowns: [
            { id: 'low', y: [0.2] },
            { id: 'high', y: [0.5] },
          ],
        },
      }).expect(201);
      const [low, high] = res.body.result.unknowns;
      close(low.x0, 2 + ((0.2 - 0.158) * 2) / (0.301 - 0.158), 1e-12);
      close(high.x0, 6 + ((0.5 - 0.472) * 2) / (0.577 - 0.472), 1e-12);
      close(res.body.result.checks[0].recoveryPct, 100, 1e-12);
    });

    it('should show the bias of a one-point line against the validation line at each unknown', async () => {
      const res = await post({
        methodVersionId: versions.absorbance,
        title: 'One-point batch',
        data: {
          model: 'one-point',
          standards: [{ x: 6, y: 0.472 }],
          checks: [{ id: 'C', nominal: 6, y: [0.47] }],
          unknowns: [
            { id: 'low', y: [0.158] },
            { id: 'top', y: [0.739] },
          ],
        },
      }).expect(201);
      const { onePointBias, unknowns } = res.body.result;
      // One-point reading y0·x_s/y_s; the validation line y = a + b·x rescaled through today's standard
      // reads (y0 − a')/b'. Their difference is (x_s − x)·a/(a + b·x_s) (common practice algebra).
      const { a, b } = ABSORBANCE.unweighted;
      const xa = a / b;
      const slope = 0.472 / (6 + xa);
      for (const [i, y0] of [0.158, 0.739].entries()) {
        const onePoint = (y0 * 6) / 0.472;
        const regression = y0 / slope - xa;
        close(unknowns[i].x0, onePoint, 1e-12);
        close(onePointBias.items[i].regression, regression, 1e-9);
        close(onePointBias.items[i].bias, ((6 - regression) * a) / (a + b * 6), 1e-9);
      }
      expect(onePointBias.items[0].bias).toBeGreaterThan(0);
      expect(onePointBias.items[1].bias).toBeLessThan(0);
      close(onePointBias.referenceLine.intercept / onePointBias.referenceLine.slope, xa, 1e-12);
    });

    it('should read weighted unknowns with the interval of the Miller & Miller 1/s² example', async () => {
      const res = await post({
        methodVersionId: versions.weighted,
        title: 'Weighted batch',
        data: {
          model: 'linear',
          weighting: '1/s2',
          standards: ABSORBANCE.x.map((x, i) => ({ x, y: ABSORBANCE.y[i], sd: ABSORBANCE.s[i] })),
          checks: [{ id: 'C', nominal: 6, y: [0.45] }],
          unknowns: [
            { id: 'A', y: [0.1] },
            { id: 'B', y: [0.6] },
          ],
        },
      }).expect(201);
      const [a, b] = res.body.result.unknowns;
      // Published x0: 1.23 and 8.01; half-widths recomputed with w0 interpolated at x0, t(0.975; 4).
      close(a.x0, weightedInverse(0.1).weighted_x0, 1e-9);
      close((a.ci[1] - a.ci[0]) / 2, weightedInverse(0.1)['weighted_CI95_halfwidth (t(0.975,4))'], 1e-6);
      close(b.x0, weightedInverse(0.6).weighted_x0, 1e-9);
      close((b.ci[1] - b.ci[0]) / 2, weightedInverse(0.6)['weighted_CI95_halfwidth (t(0.975,4))'], 1e-6);
      expect(b.reported).toBe('8.01 ± 0.75 µg/ml');
      // The validation's LOQ (10 s_y/x / b of the unweighted line, ICH Q2(R2)) is 2.0 µg/ml: 1.23 is detected, not quantified.
      expect(a.flags).toEqual(['belowLoq']);
      expect(a.reported).toBe('< 2.0 µg/ml');
      expect(res.body.result.weighting).toBe('1/s2');
    });

    it('should fit the quadratic with the NIST StRD Pontius certified coefficients and read unknowns off it', async () => {
      const res = await post({
        methodVersionId: versions.pontius,
        title: 'Load cell check',
        data: {
          model: 'quadratic',
          standards: pairs(PONTIUS_X, PONTIUS_Y),
          checks: [{ id: 'C', nominal: 1500000, y: [1.09148] }],
          unknowns: [{ id: 'L', y: [1.5] }],
        },
      }).expect(201);
      const { calibration, unknowns } = res.body.result;
      close(calibration.intercept, PONTIUS_CERTIFIED.B0, 1e-9);
      close(calibration.slope, PONTIUS_CERTIFIED.B1, 1e-9);
      close(calibration.curvature, PONTIUS_CERTIFIED.B2, 1e-8);
      const { B0, B1, B2 } = PONTIUS_CERTIFIED;
      const x = unknowns[0].x0;
      close(B0 + B1 * x + B2 * x * x, 1.5, 1e-9);
      expect(res.body.status).toBe('accepted');
    });
  });

  describe('refusals', () => {
    it('should refuse runs on draft, retired and never-validated versions with the reason on methodVersionId', async () => {
      for (const [key, pattern] of [
        ['draft', /is a draft/],
        ['retired', /is retired/],
        ['unvalidated', /no approved validation study/],
      ] as const) {
        const body = await refused({ ...fluorescenceRun(), methodVersionId: versions[key] }, 422);
        expect(body.errors).toEqual([{ field: 'methodVersionId', code: 'not_usable', message: expect.stringMatching(pattern) }]);
      }
      const missing = await refused({ ...fluorescenceRun(), methodVersionId: '00000000-0000-4000-8000-000000000000' }, 422);
      expect(fieldsOf(missing)).toEqual(['methodVersionId']);
    });

    it('should refuse one-point where the validation does not justify it, with the reason on data.model', async () => {
      const body = await refused(fluorescenceRun({ model: 'one-point', standards: [{ x: 6, y: 12.6 }] }), 422);
      expect(body.errors).toContainEqual({
        field: 'data.model',
        code: 'not_allowed',
        message: expect.stringMatching(/differs significantly from zero/),
      });
    });

    it('should refuse a one-point standard at zero or below concentration', async () => {
      for (const x of [0, -1]) {
        const body = await refused(
          {
            methodVersionId: versions.absorbance,
            title: 'x',
            data: {
              model: 'one-point',
              standards: [{ x, y: 0.009 }],
              checks: [{ id: 'C', nominal: 6, y: [0.47] }],
              unknowns: [{ id: 'U', y: [0.1] }],
            },
          },
          422,
        );
        expect(body.errors).toEqual([{ field: 'data.standards[0].x', code: 'not_positive', message: expect.stringMatching(/above zero/) }]);
      }
    });

    it('should refuse two standards at the same concentration, and a third level without bracketing', async () => {
      const same = await refused(
        {
          methodVersionId: versions.absorbance,
          title: 'x',
          data: {
            model: 'two-point',
            standards: [
              { x: 5, y: 0.36 },
              { x: 5, y: 0.37 },
            ],
            checks: [{ id: 'C', nominal: 5, y: [0.36] }],
            unknowns: [{ id: 'U', y: [0.1] }],
          },
        },
        422,
      );
      expect(same.errors).toEqual([
        { field: 'data.standards[1].x', code: 'all_x_equal', message: expect.stringMatching(/same concentration/) },
      ]);
      const three = await refused(
        {
          methodVersionId: versions.absorbance,
          title: 'x',
          data: {
            model: 'two-point',
            standards: pairs([2, 4, 6], [0.158, 0.301, 0.472]),
            checks: [{ id: 'C', nominal: 5, y: [0.36] }],
            unknowns: [{ id: 'U', y: [0.1] }],
          },
        },
        422,
      );
      expect(three.errors).toEqual([expect.objectContaining({ field: 'data.standards', code: 'too_many_levels' })]);
    });

    it('should refuse an unknown without responses, a check without responses and a non-positive nominal', async () => {
      const noResponses = await refused(fluorescenceRun({ unknowns: [{ id: 'S-1', y: [] }] }), 422);
      expect(fieldsOf(noResponses)).toEqual(['data.unknowns[0].y']);
      const emptyCheck = await refused(fluorescenceRun({ checks: [{ id: 'C', nominal: 6, y: [] }] }), 422);
      expect(fieldsOf(emptyCheck)).toEqual(['data.checks[0].y']);
      for (const nominal of [0, -2]) {
        const bad = await refused(fluorescenceRun({ checks: [{ id: 'C', nominal, y: [13] }] }), 422);
        expect(fieldsOf(bad)).toEqual(['data.checks[0].nominal']);
      }
      const noChecks = await refused(fluorescenceRun({ checks: [] }), 422);
      expect(fieldsOf(noChecks)).toEqual(['data.checks']);
    });

    it('should refuse a response outside the range where the quadratic can be inverted', async () => {
      // Pontius: the fitted parabola peaks near 42 deflection units; 50 has no real root.
      const body = await refused(
        {
          methodVersionId: versions.pontius,
          title: 'x',
          data: {
            model: 'quadratic',
            standards: pairs(PONTIUS_X, PONTIUS_Y),
            checks: [{ id: 'C', nominal: 1500000, y: [1.0915] }],
            unknowns: [{ id: 'L', y: [50] }],
          },
        },
        422,
      );
      expect(body.errors).toEqual([expect.objectContaining({ field: 'data.unknowns[0].y', code: 'not_invertible' })]);
    });

    it('should refuse a model or weighting the validation does not support', async () => {
      const quadratic = await refused(fluorescenceRun({ model: 'quadratic' }), 422);
      expect(quadratic.errors).toContainEqual(expect.objectContaining({ field: 'data.model', code: 'not_allowed' }));
      const weighting = await refused(fluorescenceRun({ weighting: '1/x' }), 422);
      expect(weighting.errors).toEqual([
        expect.objectContaining({
          field: 'data.weighting',
          message: expect.stringMatching(/validated with weighting none|takes no weighting|weighting none/),
        }),
      ]);
      const unknownModel = await refused(fluorescenceRun({ model: 'cubic' }), 422);
      expect(fieldsOf(unknownModel)).toEqual(['data.model']);
      const extra = await refused(fluorescenceRun({ recovery: [0.1, 0.2] }), 422);
      expect(fieldsOf(extra)).toEqual(['data.recovery']);
    });

    it('should refuse bad request shapes with field messages', async () => {
      const body = await refused({ methodVersionId: 'nope', title: '', data: 'x' }, 422);
      expect(fieldsOf(body).sort()).toEqual(['data', 'methodVersionId', 'title']);
      const tooLong = await refused({ ...fluorescenceRun(), title: 'x'.repeat(201) }, 422);
      expect(fieldsOf(tooLong)).toEqual(['title']);
    });

    it('should answer 409 when the method version changed since the analyst loaded it', async () => {
      const body = await refused({ ...fluorescenceRun(), methodVersionLockVersion: 7 }, 409);
      expect(body.message).toMatch(/was changed after you opened it/);
      await post({ ...fluorescenceRun(), methodVersionLockVersion: 1 }).expect(201);
    });

    it('should refuse anonymous callers (401) and roles other than analyst (403)', async () => {
      await refused(fluorescenceRun(), 401, 'not-a-token');
      await refused(fluorescenceRun(), 403, reviewer);
      await refused(fluorescenceRun(), 403, admin);
      await t.http().get('/api/runs').expect(401);
      await t.http().get('/api/runs').set(bearer(admin)).expect(403);
      await t.http().post('/api/runs/preview').set(bearer(quality)).send(fluorescenceRun()).expect(403);
    });
  });

  describe('reading runs back', () => {
    it('should preview a run without saving it', async () => {
      const before = await tableCounts();
      const res = await t.http().post('/api/runs/preview').set(bearer(analyst)).send(fluorescenceRun()).expect(200);
      expect(res.body.result.unknowns[0].reported).toBe('6.21 ± 0.36 pg/ml');
      expect(res.body).not.toHaveProperty('id');
      expect(await tableCounts()).toEqual(before);
    });

    it('should list runs newest first, filtered by version, method and status, page by page', async () => {
      const all = await t.http().get('/api/runs').query({ methodVersionId: versions.fluorescence }).set(bearer(reviewer)).expect(200);
      expect(all.body.total).toBe(3);
      expect(all.body.items.map((r: { status: string }) => r.status)).toEqual(['accepted', 'rejected', 'accepted']);
      expect(all.body.items[0]).toMatchObject({
        title: 'Fluorescein batch 7',
        model: 'linear',
        versionNumber: 1,
        unknownCount: 5,
        checkCount: 1,
        author: { name: 'Alma Ruiz' },
      });
      const rejected = await t
        .http()
        .get('/api/runs')
        .query({ methodVersionId: versions.fluorescence, status: 'rejected' })
        .set(bearer(analyst))
        .expect(200);
      expect(rejected.body.total).toBe(1);
      const [{ id: methodId }] = await sqlQuery<{ id: string }>(t, 'select method_id as id from method_versions where id = ?', [
        versions.absorbance,
      ]);
      const firstPage = await t.http().get('/api/runs').query({ methodId, pageSize: 2 }).set(bearer(analyst)).expect(200);
      expect(firstPage.body).toMatchObject({ total: 3, totalIsCapped: false, pageSize: 2, prevCursor: null });
      const byMethod = await t
        .http()
        .get('/api/runs')
        .query({ methodId, pageSize: 2, cursor: firstPage.body.nextCursor })
        .set(bearer(analyst))
        .expect(200);
      expect(byMethod.body).toMatchObject({ total: 3, pageSize: 2, nextCursor: null });
      expect(byMethod.body.items).toHaveLength(1);
      const ids = (body: { items: { id: string }[] }) => body.items.map((run) => run.id);
      expect(new Set([...ids(firstPage.body), ...ids(byMethod.body)]).size).toBe(3);
      const back = await t
        .http()
        .get('/api/runs')
        .query({ methodId, pageSize: 2, cursor: byMethod.body.prevCursor })
        .set(bearer(analyst))
        .expect(200);
      expect(ids(back.body)).toEqual(ids(firstPage.body));
      for (const item of firstPage.body.items) {
        expect(item).not.toHaveProperty('data');
        expect(item).not.toHaveProperty('result');
      }
      const badCursor = await t.http().get('/api/runs').query({ cursor: 'garbage' }).set(bearer(analyst)).expect(422);
      expect(fieldsOf(badCursor.body)).toEqual(['cursor']);
      await t.http().get('/api/runs').query({ page: 2 }).set(bearer(analyst)).expect(422);
      const bad = await t.http().get('/api/runs').query({ status: 'pending', pageSize: 1000 }).set(bearer(analyst)).expect(422);
      expect(fieldsOf(bad.body).sort()).toEqual(['pageSize', 'status']);
    });

    it('should answer 404 for an unknown run and 400 for a malformed id', async () => {
      await t.http().get('/api/runs/00000000-0000-4000-8000-000000000000').set(bearer(analyst)).expect(404);
      await t.http().get('/api/runs/00000000-0000-4000-8000-000000000000/export?format=csv').set(bearer(analyst)).expect(404);
      await t.http().get('/api/runs/00000000-0000-4000-8000-000000000000/sheet').set(bearer(analyst)).expect(404);
      await t.http().get('/api/runs/not-a-uuid').set(bearer(analyst)).expect(400);
    });
  });

  describe('exports', () => {
    let runId: string;
    let rejectedId: string;

    beforeAll(async () => {
      const list = await t.http().get('/api/runs').query({ methodVersionId: versions.fluorescence }).set(bearer(analyst)).expect(200);
      runId = list.body.items.find((r: { status: string }) => r.status === 'accepted').id;
      rejectedId = list.body.items.find((r: { status: string }) => r.status === 'rejected').id;
      // Results leave Meritline only from a run a second person released.
      const submitted = await t
        .http()
        .post(`/api/runs/${runId}/submit`)
        .set(bearer(analyst))
        .send({ password: DEMO_PASSWORD, version: 1 })
        .expect(200);
      await t
        .http()
        .post(`/api/runs/${runId}/release`)
        .set(bearer(reviewer))
        .send({ password: DEMO_PASSWORD, version: submitted.body.lockVersion })
        .expect(200);
    });

    it('should export the results as CSV with units in the headers and one row per unknown', async () => {
      const res = await t.http().get(`/api/runs/${runId}/export`).query({ format: 'csv' }).set(bearer(reviewer)).expect(200);
      expect(res.headers['content-type']).toMatch(/^text\/csv/);
      expect(res.headers['content-disposition']).toMatch(/attachment; filename="run-fluorescein-batch-7-\d{4}-\d{2}-\d{2}\.csv"/);
      const parsed = Papa.parse<Record<string, string>>(res.text.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: true });
      expect(parsed.data).toHaveLength(5);
      expect(parsed.meta.fields).toContain('Concentration (pg/ml)');
      expect(parsed.data[0]).toMatchObject({ Sample: 'S-1', Replicates: '4', Reported: '6.21 ± 0.36 pg/ml', Reportable: 'yes' });
      expect(parsed.data[1]).toMatchObject({ Sample: 'S-2', Reported: '< 2.2 pg/ml', Flags: 'below LOD; below LOQ' });
      // A rejected run is never released, so its export is refused; the CSV it would give still marks every row not reportable.
      const refusedExport = await t.http().get(`/api/runs/${rejectedId}/export?format=csv`).set(bearer(analyst)).expect(409);
      expect(refusedExport.body.message).toMatch(/released/);
      const rejected = { text: runCsv(await t.app.get(RunsService).findOne(rejectedId), []) };
      const rows = Papa.parse<Record<string, string>>(rejected.text.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: true }).data;
      expect(rows.every((r) => r.Reportable === 'no: run rejected')).toBe(true);
    });

    it('should export an XLSX workbook that reads back with exceljs', async () => {
      const res = await t.http().get(`/api/runs/${runId}/export?format=xlsx`).set(bearer(analyst)).buffer(true).parse(binary).expect(200);
      const workbook = new ExcelJS.Workbook();
      await workbook.xlsx.load(res.body as ArrayBuffer);
      expect(workbook.worksheets.map((s) => s.name)).toEqual(['Results', 'Check standards', 'Standards', 'Run']);
      const results = workbook.getWorksheet('Results')!;
      const header = (results.getRow(1).values as unknown[]).slice(1);
      const row = Object.fromEntries(header.map((h, i) => [h, results.getRow(2).getCell(i + 1).value]));
      expect(row).toMatchObject({ Sample: 'S-1', Reported: '6.21 ± 0.36 pg/ml', 'Concentration (pg/ml)': 6.20722 });
      expect(workbook.getWorksheet('Check standards')!.getRow(2).getCell(1).value).toBe('CCV-1');
      await t.http().get(`/api/runs/${runId}/export?format=pdf`).set(bearer(analyst)).expect(422);
    });

    it('should print a run sheet whose text carries the title, a reported unknown and the caution', async () => {
      const res = await t.http().get(`/api/runs/${runId}/sheet`).set(bearer(quality)).buffer(true).parse(binary).expect(200);
      expect(res.headers['content-type']).toBe('application/pdf');
      mkdirSync(OUTPUT, { recursive: true });
      const file = join(OUTPUT, 'run-sheet.pdf');
      writeFileSync(file, res.body as Buffer);
      const text = execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' });
      expect(text).toContain('Fluorescein batch 7');
      expect(text).toContain('6.21 ± 0.36 pg/ml');
      expect(text).toMatch(/Run accepted/);
      expect(text).toMatch(/regulations that apply/);
      await t.http().get(`/api/runs/${runId}/sheet`).expect(401);
      await t.http().get(`/api/runs/${runId}/sheet`).set(bearer(admin)).expect(403);
    });
  });

  describe('slope control chart', () => {
    it('should chart the seeded nitrate runs of the active version, with the rejected run left off and the recent drift flagged', async () => {
      const choices = await t.http().get('/api/runs/method-choices').set(bearer(quality)).expect(200);
      const nitrate = choices.body.find((m: { name: string }) => m.name === 'Nitrate in drinking water by ion chromatography');
      const active = nitrate.versions.find((v: { status: string }) => v.status === 'active');
      const runs = await t.http().get('/api/runs').query({ methodVersionId: active.id, pageSize: 100 }).set(bearer(quality)).expect(200);
      expect(runs.body.items.filter((r: { status: string }) => r.status === 'rejected')).toHaveLength(1);
      const chart = await t.http().get(`/api/method-versions/${active.id}/control-chart`).set(bearer(quality)).expect(200);
      expect(chart.body.n).toBe(runs.body.total - 1);
      expect(chart.body.limits.action[0]).toBeLessThan(chart.body.mean);
      expect(chart.body.points.at(-1).flags).toContain('sevenOnOneSide');
      const options = await t.http().get(`/api/method-versions/${active.id}/run-options`).set(bearer(analyst)).expect(200);
      expect(options.body).toMatchObject({ usable: true, checkTolerancePct: 10 });
      expect(options.body.models.find((m: { model: string }) => m.model === 'one-point').allowed).toBe(true);
    });

    it('should give no limits below three accepted runs, with a message', async () => {
      const res = await t.http().get(`/api/method-versions/${versions.absorbanceChart}/control-chart`).set(bearer(analyst)).expect(200);
      expect(res.body).toMatchObject({
        n: 0,
        limits: null,
        mean: null,
        sd: null,
        points: [],
        message: expect.stringMatching(/at least 3 accepted runs/),
      });
    });

    it('should draw mean ± 2s and ± 3s of the accepted slopes and flag seven runs in a row on one side (common practice)', async () => {
      const top = [0.7, 0.704, 0.698, 0.702, 0.699, 0.701, 0.703, 0.697, 0.742, 0.745, 0.741, 0.744, 0.746, 0.743, 0.747];
      for (const [i, y] of top.entries()) {
        await post({
          methodVersionId: versions.absorbanceChart,
          title: `Chart run ${i + 1}`,
          data: {
            model: 'two-point',
            standards: [
              { x: 0, y: 0 },
              { x: 10, y },
            ],
            checks: [{ id: 'C', nominal: 5, y: [y / 2] }],
            unknowns: [{ id: 'U', y: [0.3] }],
          },
        }).expect(201);
      }
      // A rejected run stays off the chart.
      await post({
        methodVersionId: versions.absorbanceChart,
        title: 'Rejected chart run',
        data: {
          model: 'two-point',
          standards: [
            { x: 0, y: 0 },
            { x: 10, y: 0.9 },
          ],
          checks: [{ id: 'C', nominal: 5, y: [0.3] }],
          unknowns: [{ id: 'U', y: [0.3] }],
        },
      }).expect(201);
      const res = await t.http().get(`/api/method-versions/${versions.absorbanceChart}/control-chart`).set(bearer(reviewer)).expect(200);
      const slopes = top.map((y) => y / 10);
      const mean = slopes.reduce((a, b) => a + b, 0) / slopes.length;
      const sd = Math.sqrt(slopes.reduce((ss, s) => ss + (s - mean) ** 2, 0) / (slopes.length - 1));
      expect(res.body.n).toBe(15);
      close(res.body.mean, mean, 1e-12);
      close(res.body.sd, sd, 1e-9);
      close(res.body.limits.warning[0], mean - 2 * sd, 1e-9);
      close(res.body.limits.action[1], mean + 3 * sd, 1e-9);
      expect(res.body.slopeUnit).toBe('AU per µg/ml');
      const flags = res.body.points.map((p: { flags: string[] }) => p.flags.includes('sevenOnOneSide'));
      // Eight low slopes, then seven high ones: the 7th and 8th low and the 7th high complete a run of seven.
      expect(flags).toEqual([false, false, false, false, false, false, true, true, false, false, false, false, false, false, true]);
      expect(res.body.message).toMatch(/7 or more runs in a row on one side of the mean/);
      expect(res.body.points.map((p: { title: string }) => p.title)).not.toContain('Rejected chart run');
    });
  });
});
