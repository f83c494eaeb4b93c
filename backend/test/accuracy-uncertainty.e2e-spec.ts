import { execFileSync } from 'node:child_process';
import { copyFileSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { formatNumber, formatPercent } from '../src/reports/pdf/index.js';
import { binary } from './support/flows.js';
import { createTestApp, DEMO, type TestApp } from './support/test-app.js';

/* eslint-disable @typescript-eslint/no-explicit-any -- reference files and API bodies are plain JSON */
type Row = Record<string, any>;
// β-expectation tolerance limits of a 3-level accuracy profile (Mee 1984 formula, written from memory; every number
// recomputed with numpy/scipy in the reference file; the data are synthetic).
const profileReference = JSON.parse(
  readFileSync(new URL('../../reference-checks/data/tolerance_interval_accuracy_profile.json', import.meta.url), 'utf8'),
).synthetic_profile;

const CLI = fileURLToPath(new URL('../../shared/dist/cli.js', import.meta.url));
const OUTPUT = fileURLToPath(new URL('../test-output/', import.meta.url));
const UNKNOWN_ID = '00000000-0000-4000-8000-000000000000';
const DEMO_ACCURACY_TITLE = 'Tartrazine in soft drinks: accuracy profile and uncertainty';

const accuracy = profileReference.levels.flatMap((level: Row, l: number) =>
  level.y.flatMap((series: number[], s: number) =>
    series.map((found) => ({ level: `L${l + 1}`, series: `day ${s + 1}`, nominal: level.nominal, found })),
  ),
);
// Invented results on an invented certified reference material.
const referenceMaterial = { certified: 50.5, uCertified: 0.2, results: [50.1, 50.6, 49.8, 50.3] };

const scratch = mkdtempSync(join(tmpdir(), 'meritline-accuracy-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));
const pdftotext = (file: string, page?: number) =>
  execFileSync('pdftotext', [...(page ? ['-f', String(page), '-l', String(page)] : []), file, '-'], { encoding: 'utf8' }).replace(
    /\s+/g,
    ' ',
  );

describe('accuracy profile, trueness and measurement uncertainty through the API', () => {
  let t: TestApp;
  let versionId: string;
  let headers: Record<string, string>;

  beforeAll(async () => {
    t = await createTestApp();
    headers = { Authorization: `Bearer ${await t.tokenFor(DEMO.analyst)}` };
    const methods = (await t.http().get('/api/methods').set(headers).expect(200)).body as Row[];
    versionId = methods.find((m) => m.analyte === 'Tartrazine')!.versions[0].id;
  });
  afterAll(() => t.close());

  const create = (data: Row, extra: Row = {}) =>
    t
      .http()
      .post('/api/studies')
      .set(headers)
      .send({ methodVersionId: versionId, title: 'Accuracy profile check', data, ...extra });

  it('should add the three result sections, identical to the command-line engine on the stored data', async () => {
    const res = await create({
      accuracy,
      accuracyProfile: { beta: profileReference.beta, lambda: profileReference.lambda_pct },
      referenceMaterial,
      uncertainty: { coverageFactor: 2 },
    }).expect(201);
    const { result, data } = res.body;
    expect(result.accuracyProfile).toBeDefined();
    expect(result.trueness).toBeDefined();
    expect(result.uncertainty).toBeDefined();
    const file = join(scratch, 'study.json');
    writeFileSync(file, JSON.stringify(data));
    expect(JSON.parse(execFileSync(process.execPath, [CLI, file], { encoding: 'utf8' }))).toEqual(result);

    result.accuracyProfile.levels.forEach((level: Row, i: number) => {
      const expected = profileReference.levels[i];
      expect(level.lower).toBeCloseTo(expected.lower, 6);
      expect(level.upper).toBeCloseTo(expected.upper, 6);
      expect(level.lowerPct).toBeCloseTo(expected.rel_tolerance_lower_pct, 6);
      expect(level.within).toBe(expected.within_acceptance);
    });
    // Trueness: mean 50.2, difference -0.3, U = 2·√(s²/n + 0.2²) (common practice; worked by hand from the invented numbers).
    const s = Math.sqrt([50.1, 50.6, 49.8, 50.3].reduce((sum, v) => sum + (v - 50.2) ** 2, 0) / 3);
    expect(result.trueness.difference).toBeCloseTo(-0.3, 10);
    expect(result.trueness.UDifference).toBeCloseTo(2 * Math.sqrt((s * s) / 4 + 0.04), 10);
    expect(result.trueness.significant).toBe(false);
  });

  it('should give a study without options of its own the method version’s β, λ and k, and let the study’s own win', async () => {
    const TARTRAZINE_IN_SYRUP = {
      analyte: 'Tartrazine',
      matrix: 'Syrup',
      technique: 'UV-Vis',
      xUnit: 'mg/L',
      yUnit: 'AU',
      purpose: 'environmental',
    };
    const method = await t
      .http()
      .post('/api/methods')
      .set(headers)
      .send({
        name: 'Tartrazine in syrups by UV-Vis',
        ...TARTRAZINE_IN_SYRUP,
        criteria: [{ figure: 'accuracyProfile.validFrom', op: '<=', value: 50 }],
        settings: { accuracyBeta: 0.95, accuracyLambdaPct: 5, coverageFactor: 3 },
      });
    expect(method.status, JSON.stringify(method.body)).toBe(201);
    const version = method.body.versions[0];
    expect(version.settings).toMatchObject({ accuracyBeta: 0.95, accuracyLambdaPct: 5, coverageFactor: 3 });
    const byVersion = await create({ accuracy }, { methodVersionId: version.id }).expect(201);
    expect(byVersion.body.data.accuracyProfile).toEqual({ beta: 0.95, lambda: 5 });
    expect(byVersion.body.result.accuracyProfile).toMatchObject({ beta: 0.95, lambda: 5, validFrom: expect.any(Number) });
    expect(byVersion.body.result.uncertainty.coverageFactor).toBe(3);
    // The criterion names a catalogue figure and is judged on the value in the result.
    expect(byVersion.body.result.verdict.criteria[0]).toMatchObject({
      figure: 'accuracyProfile.validFrom',
      value: byVersion.body.result.accuracyProfile.validFrom,
      pass: true,
    });
    const own = await create({ accuracy, accuracyProfile: { beta: 0.8 } }, { methodVersionId: version.id }).expect(201);
    expect(own.body.result.accuracyProfile).toMatchObject({ beta: 0.8, lambda: 5 });

    const refused = await t
      .http()
      .post('/api/methods')
      .set(headers)
      .send({
        name: 'Tartrazine, bad settings',
        ...TARTRAZINE_IN_SYRUP,
        settings: { accuracyBeta: 1.5, accuracyLambdaPct: 0, coverageFactor: 9 },
      })
      .expect(422);
    expect(refused.body.errors.map((e: Row) => e.field).sort()).toEqual([
      'settings.accuracyBeta',
      'settings.accuracyLambdaPct',
      'settings.coverageFactor',
    ]);
  });

  it('should refuse a bad design or bad options with 422 naming the field, and save nothing', async () => {
    const oneSeries = accuracy.map((item: Row) => ({ ...item, series: 'day 1' }));
    const oneReplicate = accuracy.filter((_: Row, i: number) => i % 3 === 0);
    const cases: [Row, string, string][] = [
      [{ accuracy: oneSeries }, 'accuracy', 'too_few_series'],
      [{ accuracy: oneReplicate }, 'accuracy', 'too_few_replicates'],
      [{ accuracy, accuracyProfile: { beta: 1.2 } }, 'accuracyProfile.beta', 'out_of_range'],
      [{ accuracy, accuracyProfile: { beta: 0 } }, 'accuracyProfile.beta', 'out_of_range'],
      [{ accuracy, accuracyProfile: { lambda: 0 } }, 'accuracyProfile.lambda', 'not_positive'],
      [{ accuracy, accuracyProfile: { lambda: -5 } }, 'accuracyProfile.lambda', 'not_positive'],
      [{ accuracyProfile: { beta: 0.8 } }, 'accuracy', 'required'],
      [{ accuracy: [{ ...accuracy[0], nominal: 'ten' }] }, 'accuracy[0].nominal', 'not_number'],
    ];
    const before = (await t.http().get('/api/studies?pageSize=100').set(headers).expect(200)).body.total;
    for (const [data, field, code] of cases) {
      const res = await create(data);
      expect(res.status, JSON.stringify(data).slice(0, 80)).toBe(422);
      expect(res.body.errors).toEqual(expect.arrayContaining([expect.objectContaining({ field, code })]));
    }
    expect((await t.http().get('/api/studies?pageSize=100').set(headers).expect(200)).body.total).toBe(before);
  });

  it('should refuse the same bad design on an update (422, nothing changed), and answer 401, 403, 404 and 409', async () => {
    const study = (await create({ accuracy }).expect(201)).body;
    const patch = (id: string, body: Row, auth: Record<string, string> = headers) =>
      t.http().patch(`/api/studies/${id}`).set(auth).send(body);
    const bad = await patch(study.id, { lockVersion: study.lockVersion, data: { accuracy, accuracyProfile: { beta: 1 } } }).expect(422);
    expect(bad.body.errors[0]).toMatchObject({ field: 'accuracyProfile.beta' });
    const after = (await t.http().get(`/api/studies/${study.id}`).set(headers).expect(200)).body;
    expect(after.dataHash).toBe(study.dataHash);
    expect(after.lockVersion).toBe(study.lockVersion);

    const good = { lockVersion: study.lockVersion, data: { accuracy, accuracyProfile: { beta: 0.95 } } };
    await t.http().patch(`/api/studies/${study.id}`).send(good).expect(401);
    await patch(study.id, good, { Authorization: `Bearer ${await t.tokenFor(DEMO.reviewer)}` }).expect(403);
    await patch(UNKNOWN_ID, good).expect(404);
    const saved = await patch(study.id, good).expect(200);
    expect(saved.body.result.accuracyProfile.beta).toBe(0.95);
    await patch(study.id, good).expect(409);
  });

  it('should import the accuracy design from a CSV with the lab’s own headers, and refuse a file with a bad cell', async () => {
    const study = (await create({}).expect(201)).body;
    const csv = [
      'Level;Day;Target (mg/L);Measured (mg/L)',
      ...accuracy.map((a: Row) => `${a.level};${a.series};${a.nominal};${a.found}`),
    ].join('\r\n');
    const upload = (body: string, fields: Row) => {
      const request = t.http().post(`/api/studies/${study.id}/imports`).set(headers).attach('file', Buffer.from(body), 'accuracy.csv');
      for (const [key, value] of Object.entries(fields)) request.field(key, String(value));
      return request;
    };
    const preview = await upload(csv, { section: 'accuracy', dryRun: true }).expect(200);
    expect(preview.body).toMatchObject({
      mapping: { level: 'Level', series: 'Day', nominal: 'Target (mg/L)', found: 'Measured (mg/L)' },
      errors: [],
      rowCount: accuracy.length,
    });
    const imported = await upload(csv, { section: 'accuracy', lockVersion: study.lockVersion }).expect(200);
    expect(imported.body.data.accuracy).toEqual(accuracy);
    expect(imported.body.result.accuracyProfile.levels).toHaveLength(3);

    const broken = csv.replace(/;10;9\.8/, ';10;n/a');
    const refused = await upload(broken, { section: 'accuracy', lockVersion: imported.body.lockVersion }).expect(422);
    expect(refused.body.errors[0]).toMatchObject({ field: 'rows[0].found', code: 'not_number' });
  });

  it('should print the accuracy profile, trueness and uncertainty section of the seeded study in the report, with the API’s numbers', async () => {
    const list = (
      await t
        .http()
        .get(`/api/studies?q=${encodeURIComponent('accuracy profile')}`)
        .set(headers)
        .expect(200)
    ).body.items as Row[];
    const seeded = (
      await t
        .http()
        .get(`/api/studies/${list.find((s) => s.title === DEMO_ACCURACY_TITLE)!.id}`)
        .set(headers)
        .expect(200)
    ).body;
    const { accuracyProfile, uncertainty, trueness } = seeded.result;
    const res = await t.http().get(`/api/studies/${seeded.id}/report`).set(headers).buffer(true).parse(binary).expect(200);
    const file = join(scratch, 'accuracy-draft.pdf');
    writeFileSync(file, res.body as Buffer);
    const text = pdftotext(file);
    expect(text).toContain('5 Accuracy profile, trueness and measurement uncertainty');
    expect(text).toContain('5.1 Accuracy profile');
    // The summary names the validity domain too.
    expect(text).toContain(
      `valid from ${formatNumber(accuracyProfile.validFrom, 4)} mg/L to ${formatNumber(accuracyProfile.validTo, 4)} mg/L (β 80.0 %, ±10.0 %)`,
    );
    expect(text).toContain('5.2 Trueness against a reference material');
    expect(text).toContain('5.3 Measurement uncertainty');
    expect(text).toContain(
      `Validity domain: from ${formatNumber(accuracyProfile.validFrom, 4)} mg/L (lower limit of quantitation) to ${formatNumber(accuracyProfile.validTo, 4)} mg/L`,
    );
    const top = uncertainty.byLevel.at(-1);
    expect(text).toContain(`${formatNumber(top.concentration, 4)} relative`);
    expect(text).toContain(formatPercent(top.UPct));
    expect(text).toContain(`Measurement uncertainty by level (k = ${formatNumber(uncertainty.coverageFactor, 3)})`);
    expect(text).toContain(`Difference ${formatNumber(trueness.difference, 3)} mg/L`);
    expect(text).toContain(trueness.significant ? 'the method shows a bias on this material' : 'no bias is shown on this material');
    expect(text).not.toMatch(/accuracyProfile\.|uncertainty\.byLevel|trueness\./);

    const pages = Number(/Pages:\s+(\d+)/.exec(execFileSync('pdfinfo', [file], { encoding: 'utf8' }))?.[1]);
    const plotPage = Array.from({ length: pages }, (_, i) => i + 1).find((page) => pdftotext(file, page).includes('Validity domain:'))!;
    mkdirSync(OUTPUT, { recursive: true });
    const prefix = join(scratch, 'report-page-accuracy-profile');
    execFileSync('pdftoppm', ['-png', '-r', '60', '-f', String(plotPage), '-l', String(plotPage), '-singlefile', file, prefix]);
    copyFileSync(`${prefix}.png`, join(OUTPUT, 'report-page-accuracy-profile.png'));
  });
});
