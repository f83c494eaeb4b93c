import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, DEMO, type TestApp } from './support/test-app.js';

/* eslint-disable @typescript-eslint/no-explicit-any -- reference files are plain JSON */
const reference = (name: string): any => JSON.parse(readFileSync(new URL(`../../reference-checks/data/${name}`, import.meta.url), 'utf8'));
// Miller & Miller, Statistics and Chemometrics for Analytical Chemistry: the fluorescence calibration worked example
// (data confirmed in stored copies; the file's values are recomputed and agree with the printed ones at printed precision).
const miller = reference('calibration_miller_fluorescence.json');
// NIST StRD linear regression "Norris" (certified values, 15 digits).
const norris = reference('nist_strd_norris.json');
// NIST StRD one-way ANOVA "SiRstv" (certified values).
const sirstv = reference('nist_strd_anova_sirstv.json');
/* eslint-enable @typescript-eslint/no-explicit-any */

const CLI = fileURLToPath(new URL('../../shared/dist/cli.js', import.meta.url));
const pairs = (x: number[], y: number[]) => x.map((xi, i) => ({ x: xi, y: y[i] }));
const close = (actual: number, expected: number, relative = 1e-9) =>
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(Math.abs(expected) * relative);

describe('POST /api/evaluate', () => {
  let t: TestApp;
  const evaluate = async (body: unknown, email: string = DEMO.reviewer) =>
    t
      .http()
      .post('/api/evaluate')
      .set('Authorization', `Bearer ${await t.tokenFor(email)}`)
      .send(body as object);

  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('should answer 422 naming the body, not 500, when the body is not a JSON object', async () => {
    const token = await t.tokenFor(DEMO.analyst);
    for (const [contentType, body] of [
      ['text/plain', '{a:1}'],
      ['application/x-www-form-urlencoded', 'standards=1'],
      ['application/json', '[{"x":1,"y":2}]'],
    ]) {
      const res = await t.http().post('/api/evaluate').set('Authorization', `Bearer ${token}`).set('Content-Type', contentType).send(body);
      expect(res.status, contentType).toBe(422);
      expect(res.body.errors[0]).toMatchObject({ field: 'body', code: 'notAnObject' });
    }
  });

  it('should refuse anonymous callers', async () => {
    await t.http().post('/api/evaluate').send({ standards: [] }).expect(401);
  });

  it('should reproduce the Miller & Miller fluorescence example: line, intervals, detection limits and inverse prediction', async () => {
    const res = await evaluate({
      standards: pairs(miller.data.x, miller.data.y),
      unknowns: [
        { id: 'y0 = 13.5', y: [13.5] },
        { id: 'y0 = 2.9', y: [2.9, 2.9, 2.9] },
      ],
    });
    expect(res.status).toBe(200);
    const { calibration, detection, unknowns } = res.body;
    const c = miller.computed;
    close(calibration.slope, c.slope_b);
    close(calibration.intercept, c.intercept_a);
    close(calibration.r, c.r);
    close(calibration.r2, c.r_squared);
    close(calibration.sYX, c['s_y/x']);
    close(calibration.seSlope, c.s_b);
    close(calibration.seIntercept, c.s_a);
    close(calibration.ciSlope[0], c.b_CI95[0]);
    close(calibration.ciIntercept[1], c.a_CI95[1]);
    // ICH Q2(R2): DL = 3.3 σ/S and QL = 10 σ/S, with σ = s_y/x or σ = s_a.
    close(detection.sdResidual.lod, c['ICH_DL 3.3 s_y/x / b']);
    close(detection.sdResidual.loq, c['ICH_QL 10 s_y/x / b']);
    close(detection.sdIntercept.lod, c['ICH_DL 3.3 s_a / b (sigma = SE of intercept)']);
    // Inverse prediction x0 = (y0 − a)/b and its standard deviation s_x0 (m = 1 and m = 3 readings).
    const one = c.inverse_prediction.find(
      (p: { y0: number; m_replicates_of_unknown: number }) => p.y0 === 13.5 && p.m_replicates_of_unknown === 1,
    );
    const three = c.inverse_prediction.find(
      (p: { y0: number; m_replicates_of_unknown: number }) => p.y0 === 2.9 && p.m_replicates_of_unknown === 3,
    );
    close(unknowns[0].x0, one.x0);
    close(unknowns[0].sX0, one.s_x0);
    close(unknowns[1].sX0, three.s_x0);
  });

  it('should reproduce the certified NIST StRD Norris regression', async () => {
    const res = await evaluate({ standards: pairs(norris.data.x, norris.data.y) });
    expect(res.status).toBe(200);
    const certified = norris.certified;
    close(res.body.calibration.intercept, Number(certified.parameters.B0.estimate));
    close(res.body.calibration.slope, Number(certified.parameters.B1.estimate));
    close(res.body.calibration.seIntercept, Number(certified.parameters.B0.sd));
    close(res.body.calibration.seSlope, Number(certified.parameters.B1.sd));
    close(res.body.calibration.sYX, Number(certified.residual_standard_deviation));
    close(res.body.calibration.r2, Number(certified.r_squared));
  });

  it('should reproduce the certified NIST StRD SiRstv one-way ANOVA as precision', async () => {
    const precision = (sirstv.data.group as number[]).map((group, i) => ({ group: `instrument ${group}`, value: sirstv.data.value[i] }));
    const res = await evaluate({ precision }, DEMO.analyst);
    expect(res.status).toBe(200);
    close(res.body.precision.msWithin, Number(sirstv.certified.within.ms));
    close(res.body.precision.msBetween, Number(sirstv.certified.between.ms));
    close(res.body.precision.F, Number(sirstv.certified.between.F));
    expect(res.body.calibration).toBeNull();
  });

  it('should answer exactly what the command-line engine prints for the same study', async () => {
    const study = {
      model: 'linear',
      weighting: '1/x',
      standards: pairs(miller.data.x, miller.data.y).slice(1),
      blanks: [2.0, 2.2, 1.9],
      criteria: [{ figure: 'calibration.r2', op: '>=', value: 0.995 }],
    };
    const res = await evaluate(study);
    const dir = mkdtempSync(join(tmpdir(), 'meritline-evaluate-'));
    try {
      writeFileSync(join(dir, 'study.json'), JSON.stringify(study));
      expect(res.body).toEqual(JSON.parse(execFileSync(process.execPath, [CLI, join(dir, 'study.json')], { encoding: 'utf8' })));
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('should answer a study the engine cannot evaluate with 422 and one entry per field', async () => {
    const res = await evaluate({ model: 'spline', standards: [{ x: 1, y: 'high' }, { x: 2 }], confidence: 2 });
    expect(res.status).toBe(422);
    expect(res.body).toMatchObject({ statusCode: 422, message: expect.any(String) });
    expect(res.body.errors).toEqual(
      expect.arrayContaining([
        { field: 'model', code: 'invalid_value', message: expect.any(String) },
        { field: 'standards[0].y', code: 'not_number', message: expect.any(String) },
        { field: 'standards[1].y', code: 'required', message: expect.any(String) },
        { field: 'confidence', code: 'out_of_range', message: expect.any(String) },
      ]),
    );
    const tooFew = await evaluate({ standards: [{ x: 1, y: 2 }] });
    expect(tooFew.status).toBe(422);
    expect(tooFew.body.errors[0]).toMatchObject({ field: 'standards', code: 'too_few' });
    const notAnObject = await evaluate([1, 2, 3]);
    expect(notAnObject.status).toBe(422);
  });

  it('should answer malformed JSON with 400 and a body over 5 MB with 413', async () => {
    const token = await t.tokenFor(DEMO.reviewer);
    await t
      .http()
      .post('/api/evaluate')
      .set('Authorization', `Bearer ${token}`)
      .set('Content-Type', 'application/json')
      .send('{"standards": [')
      .expect(400);
    const big = { standards: Array.from({ length: 200_000 }, (_, i) => ({ x: i, y: i * 2.000001 })) };
    await t.http().post('/api/evaluate').set('Authorization', `Bearer ${token}`).send(big).expect(413);
  });
});
