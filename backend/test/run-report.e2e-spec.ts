import { execFileSync, spawnSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addValidatedVersion, bearer, binary, postRun, releaseRun, runAction, sqlQuery, submitRun } from './support/flows.js';
import { evaluateStudy, topDownUncertainty, type StudyInput } from '@meritline/shared';
import { createTestApp, DEMO, DEMO_PASSWORD, type TestApp } from './support/test-app.js';

/*
 * Standards: the fluorescence example of Miller & Miller, Statistics and Chemometrics for Analytical
 * Chemistry (x 0–12 pg/ml); the validation's uncertainty levels, check standards and unknowns are invented.
 * U = k·u_c with k = 2 (GUM, JCGM 100:2008 §6.2); with no bias u_c is the intermediate-precision SD:
 * 0.1 pg/ml at 2 pg/ml (absolute U = 0.2 pg/ml) and 3 % at 10 pg/ml (relative U = 6 %), computed by hand.
 */
const X = [0, 2, 4, 6, 8, 10, 12];
const Y = [2.1, 5.0, 9.0, 12.6, 17.3, 21.0, 24.7];
const pairs = X.map((x, i) => ({ x, y: Y[i] }));
const OUTPUT = fileURLToPath(new URL('../test-output/', import.meta.url));

const pdfsig = (file: string) => {
  const run = spawnSync('pdfsig', [file], { encoding: 'utf8' });
  return `${run.stdout}${run.stderr}`;
};
const pdftotext = (file: string) => execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' });

describe('signed results report of a routine run', () => {
  let t: TestApp;
  let analyst: string;
  let reviewer: string;
  let versionId: string;
  let plainVersionId: string;

  const runInput = (methodVersionId: string, title: string, checkY = 13.1) => ({
    methodVersionId,
    title,
    data: {
      model: 'linear',
      standards: pairs,
      checks: [{ id: 'CCV-1', nominal: 6, y: [checkY] }],
      unknowns: [
        { id: 'S-1', y: [13.5, 13.5] },
        { id: 'S-2', y: [6.5] },
        { id: 'S-3', y: [3.0] },
        { id: 'S-4', y: [13.5], dilution: 2 },
      ],
    },
  });
  async function newRun(methodVersionId: string, title: string, checkY?: number) {
    const res = await postRun(t, analyst, runInput(methodVersionId, title, checkY)).expect(201);
    return res.body as {
      id: string;
      result: { unknowns: { id: string; reported: string; uncertainty: { value: { U: number } | null; basis: string } }[] };
    };
  }
  async function released(methodVersionId: string, title: string) {
    const run = await newRun(methodVersionId, title);
    await releaseRun(t, run.id, reviewer, await submitRun(t, run.id, analyst));
    return run;
  }
  const report = (id: string, token = analyst) => t.http().get(`/api/runs/${id}/report`).set(bearer(token)).buffer(true).parse(binary);

  async function seedVersion(name: string, withUncertainty: boolean): Promise<string> {
    const study: StudyInput = { model: 'linear', units: { x: 'pg/ml', y: 'intensity' }, standards: pairs };
    const result = evaluateStudy(study);
    if (withUncertainty) {
      result.uncertainty = topDownUncertainty(
        [
          { level: 'low', concentration: 2, sRw: 0.1, biasPct: [0], uReferencePct: 0 },
          { level: 'high', concentration: 10, sRw: 0.3, biasPct: [0], uReferencePct: 0 },
        ],
        { relativeAbove: 5 },
      );
    }
    const method = { analyte: 'fluorescein', technique: 'fluorimetry', xUnit: 'pg/ml', yUnit: 'intensity' };
    const version = await addValidatedVersion(t, { name, method, study, result });
    return version.id;
  }

  beforeAll(async () => {
    t = await createTestApp();
    [analyst, reviewer] = await Promise.all([t.tokenFor(DEMO.analyst), t.tokenFor(DEMO.reviewer)]);
    versionId = await seedVersion('Fluorescein with uncertainty', true);
    plainVersionId = await seedVersion('Fluorescein without uncertainty', false);
    mkdirSync(OUTPUT, { recursive: true });
  });
  afterAll(async () => {
    await t?.close();
  });

  it('should carry U (k = 2) with each quantified result: absolute below 5 pg/ml, relative at and above, the basis in words', async () => {
    const run = await newRun(versionId, 'U batch');
    const [s1, s2, s3, s4] = run.result.unknowns;
    // S-1 reads about 6.2 pg/ml: 6 % of it. S-2 about 2.6 pg/ml: 0.2 pg/ml. S-3 is below the LOQ: no U.
    expect(s1.uncertainty.value!.U).toBeCloseTo(0.06 * 6.2072, 3);
    expect(s1.reported).toBe('6.21 ± 0.37 pg/ml');
    expect(s2.uncertainty.value!.U).toBeCloseTo(0.2, 12);
    expect(s3.uncertainty.value).toBeNull();
    expect(s3.reported).toMatch(/^< /);
    // Diluted twofold: measured 6.2 pg/ml, so relative; U applies to the dilution-corrected 12.4 pg/ml.
    expect(s4.uncertainty.value!.U).toBeCloseTo(0.06 * 2 * 6.2072, 3);
    expect(s1.uncertainty.basis).toBe(
      'Expanded uncertainty U (k = 2) from the top-down uncertainty of the validation study “Fluorescein with uncertainty validation” (intermediate precision and bias): 0.20 pg/ml absolute below 5.00 pg/ml in the measured solution, times the dilution factor; 6.0 % of the result at and above 5.00 pg/ml.',
    );
    const plain = await newRun(plainVersionId, 'No U batch');
    expect(plain.result.unknowns[0].uncertainty).toEqual({
      value: null,
      basis:
        'The validation study “Fluorescein without uncertainty validation” has no measurement uncertainty, so none is stated with the results.',
    });
  });

  it('should refuse the report of a run that is not released (409 with the reason) and store nothing', async () => {
    const run = await newRun(versionId, 'Not yet released');
    const res = await t.http().get(`/api/runs/${run.id}/report`).set(bearer(analyst)).expect(409);
    expect(res.body.message).toMatch(/only after a second person has released the run/);
    expect(await sqlQuery(t, 'select id from run_results_reports where run_id = ?', [run.id])).toEqual([]);
  });

  it('should refuse the report of a run its check standards rejected (409)', async () => {
    const run = await newRun(versionId, 'Rejected batch', 16);
    const version = await submitRun(t, run.id, analyst);
    const refused = await runAction(t, run.id, 'release', reviewer, { password: DEMO_PASSWORD, version }).expect(422);
    expect(refused.body.errors[0].field).toBe('status');
    await report(run.id).expect(409);
  });

  it('should refuse anonymous callers (401), a role outside the lab (403), malformed ids (400) and unknown runs (404)', async () => {
    const run = await released(versionId, 'Refusals');
    await t.http().get(`/api/runs/${run.id}/report`).expect(401);
    const admin = await t.tokenFor(DEMO.admin);
    await report(run.id, admin).expect(403);
    await report('not-a-uuid').expect(400);
    await report('00000000-0000-4000-8000-000000000000').expect(404);
  });

  describe('method blanks and QC samples', () => {
    const withControls = (controls: object) => ({
      ...runInput(versionId, 'Controls'),
      data: { ...runInput(versionId, 'Controls').data, ...controls },
    });
    const preview = (controls: object) => t.http().post('/api/runs/preview').set(bearer(analyst)).send(withControls(controls));

    // Miller & Miller line: b = 1.93, a = 1.52, s_y/x = 0.433; LOD = 3.3·s_y/x / b ≈ 0.74 pg/ml (ICH Q2(R2)).
    it('should accept a run whose blank stays below the LOD and whose QC sample recovers within the window', async () => {
      const res = await preview({ blanks: [{ id: 'MB-1', y: [2.5] }], qcSamples: [{ id: 'QC-6', known: 6, y: [13.1] }] }).expect(200);
      expect(res.body.status).toBe('accepted');
      expect(res.body.result.blanks).toEqual([expect.objectContaining({ id: 'MB-1', limitBasis: 'lod', pass: true })]);
      expect(res.body.result.blanks[0].found).toBeCloseTo((2.5 - 1.5179) / 1.9304, 3);
      expect(res.body.result.qcSamples[0]).toMatchObject({ id: 'QC-6', known: 6, pass: true });
      expect(res.body.result.qcWindow).toMatchObject({ low: 90, high: 110 });
      expect(res.body.result.unknowns.map((u: { id: string }) => u.id)).toEqual(['S-1', 'S-2', 'S-3', 'S-4']);
    });

    it('should reject a run whose blank reads above the LOD or whose QC sample misses the window, with the reason in words', async () => {
      const res = await preview({ blanks: [{ id: 'MB-1', y: [3.5] }], qcSamples: [{ id: 'QC-6', known: 6, y: [15] }] }).expect(200);
      expect(res.body.status).toBe('rejected');
      expect(res.body.rejectionReasons).toEqual([
        expect.stringMatching(/^Method blank MB-1 read 1\.0\d pg\/ml, not below the LOD of the validation of 0\.740 pg\/ml/),
        expect.stringMatching(/^QC sample QC-6 recovered 116\.\d % of its known 6 pg\/ml, outside the window of 90 to 110 %/),
      ]);
      const limited = await preview({ blanks: [{ id: 'MB-1', y: [3.5], limit: 1.5 }] }).expect(200);
      expect(limited.body.status).toBe('accepted');
      expect(limited.body.result.blanks[0]).toMatchObject({ limit: 1.5, limitBasis: 'set', pass: true });
    });

    it('should print the blanks, the QC samples and their window on the run sheet', async () => {
      const saved = await postRun(
        t,
        analyst,
        withControls({ blanks: [{ id: 'MB-1', y: [2.5] }], qcSamples: [{ id: 'QC-6', known: 6, y: [13.1] }] }),
      ).expect(201);
      const sheet = await t.http().get(`/api/runs/${saved.body.id}/sheet`).set(bearer(analyst)).buffer(true).parse(binary).expect(200);
      const file = `${OUTPUT}run-sheet-controls.pdf`;
      writeFileSync(file, sheet.body as Buffer);
      const text = pdftotext(file);
      expect(text).toContain('Method blanks and QC samples');
      expect(text).toMatch(/MB-1\s+0\.5\d+\s+0\.740 \(LOD\)\s+below the limit/);
      expect(text).toMatch(/QC window: 90 to 110 % recovery/);
      expect(text).toContain('Uncertainty: Expanded uncertainty U (k = 2)');
    });

    it('should refuse malformed blanks and QC samples with the field (422) and save nothing', async () => {
      const bad = await preview({ blanks: [{ id: 'MB-1', y: [2.5], limit: -1 }], qcSamples: [{ id: 'QC-6', y: [13] }] }).expect(422);
      expect(bad.body.errors.map((e: { field: string }) => e.field)).toEqual(['data.blanks[0].limit', 'data.qcSamples[0].known']);
      const empty = await preview({ qcSamples: [{ id: 'QC-6', known: 6, y: [] }] }).expect(422);
      expect(empty.body.errors[0].field).toBe('data.qcSamples[0].y');
      const count = (await sqlQuery(t, 'select id from runs')).length;
      await postRun(t, analyst, withControls({ blanks: 'none' })).expect(422);
      expect(await sqlQuery(t, 'select id from runs')).toHaveLength(count);
    });
  });

  describe('a released run', () => {
    let runId: string;
    let pdf: Buffer;
    let file: string;

    beforeAll(async () => {
      runId = (await released(versionId, 'Fluorescein batch 12')).id;
      const res = await report(runId, reviewer).expect(200);
      expect(res.headers['content-type']).toBe('application/pdf');
      pdf = res.body as Buffer;
      file = `${OUTPUT}run-results-report.pdf`;
      writeFileSync(file, pdf);
    });

    it('should be signed with the laboratory certificate, valid for pdfsig', () => {
      const out = pdfsig(file);
      expect(out).toContain('Signature is Valid.');
      expect(out).toContain('Total document signed');
    });

    it('should list each sample with result, U, "<" values, dilution, method and version, the release signature and the caution', () => {
      const text = pdftotext(file);
      expect(text).toContain('Fluorescein with uncertainty, version 1');
      expect(text).toMatch(/S-1\s+6\.21\s+0\.37\s+1/);
      expect(text).toMatch(/S-2\s+2\.58\s+0\.20\s+1/);
      expect(text).toMatch(/S-3\s+< 2\.2\s+—\s+1/);
      expect(text).toMatch(/S-4\s+12\.41\s+0\.74\s+2/);
      expect(text).toMatch(/Priya Nair\s+Reviewer\s+Reviewed the run and released its results\s+\d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC/);
      expect(text).toContain('qualified person reviews them before release');
    });

    it('should store the report once: the same bytes again, one row, one audit entry', async () => {
      const again = await report(runId).expect(200);
      expect(Buffer.compare(again.body as Buffer, pdf)).toBe(0);
      expect(await sqlQuery(t, 'select id from run_results_reports where run_id = ?', [runId])).toHaveLength(1);
      expect(await sqlQuery(t, "select seq from audit_entries where action = 'run-report.issued'")).toHaveLength(1);
    });

    it('should be recognised by the public verify route, and a changed copy should not', async () => {
      const res = await t.http().post('/api/reports/verify').attach('file', pdf, 'report.pdf').expect(200);
      expect(res.body).toMatchObject({ valid: true, kind: 'results-report', runId, runTitle: 'Fluorescein batch 12', methodVersion: 1 });
      const changed = Buffer.from(pdf);
      const at = changed.indexOf('Fluorescein batch 12');
      changed[at] = 'X'.charCodeAt(0);
      const bad = await t.http().post('/api/reports/verify').attach('file', changed, 'changed.pdf').expect(200);
      expect(bad.body.valid).toBe(false);
      expect(bad.body.reason).toMatch(/changed since it was signed/);
    });

    it('should export CSV and XLSX with the report columns leading', async () => {
      const csv = await t.http().get(`/api/runs/${runId}/export?format=csv`).set(bearer(analyst)).expect(200);
      const rows = Papa.parse<Record<string, string>>(csv.text.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: true });
      expect(rows.meta.fields!.slice(0, 14)).toEqual([
        'Sample',
        'Result',
        'Unit',
        'Expanded uncertainty U',
        'Coverage factor k',
        'Dilution factor',
        'Method',
        'Method version',
        'Run date',
        'Released by',
        'Released at',
        'Signature meaning',
        'Remarks',
        'Uncertainty basis',
      ]);
      expect(rows.data[0]).toMatchObject({
        Sample: 'S-1',
        Result: '6.21',
        Unit: 'pg/ml',
        'Expanded uncertainty U': '0.37',
        'Released by': 'Priya Nair',
      });
      expect(rows.data[2]).toMatchObject({ Sample: 'S-3', Result: '< 2.2', 'Expanded uncertainty U': '' });
      const xlsx = await t.http().get(`/api/runs/${runId}/export?format=xlsx`).set(bearer(analyst)).buffer(true).parse(binary).expect(200);
      const workbook = new ExcelJS.Workbook();
      await workbook.xlsx.load(xlsx.body as ArrayBuffer);
      const header = (workbook.getWorksheet('Results')!.getRow(1).values as string[]).slice(1, 15);
      expect(header).toEqual(rows.meta.fields!.slice(0, 14));
    });
  });
});
