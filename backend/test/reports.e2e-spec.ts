import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { copyFileSync, mkdirSync, mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Response } from 'supertest';
import { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEntry } from '../src/audit/audit-entry.entity.js';
import { formatEstimate, formatNumber } from '../src/reports/pdf/index.js';
import { ReportsService } from '../src/reports/reports.service.js';
import { createSelfSignedP12 } from '../src/reports/signing/self-signed-certificate.js';
import { ValidationReport } from '../src/reports/validation-report.entity.js';
import { ValidationStudy } from '../src/studies/validation-study.entity.js';
import { createStudy } from './support/review-fixtures.js';
import { binary, pdfsig, scratchFolder } from './support/flows.js';
import { createTestApp, DEMO, DEMO_PASSWORD, type TestApp } from './support/test-app.js';

/* eslint-disable @typescript-eslint/no-explicit-any -- reference files and API bodies are plain JSON */
const reference = (name: string): any => JSON.parse(readFileSync(new URL(`../../reference-checks/data/${name}`, import.meta.url), 'utf8'));
// Miller & Miller, Statistics and Chemometrics for Analytical Chemistry: the fluorescence calibration worked example
// (data confirmed in stored copies; printed b = 1.93, a = 1.52 recalled from memory; the file recomputes them).
const miller = reference('calibration_miller_fluorescence.json');
// ICH Q2(R2) detection limit 3.3 σ/S applied to the same example (residual SD), recomputed in the reference file.
const ich = reference('detection_limits.json').ICH_Q2.example_miller_fluorescence;

const CLI = fileURLToPath(new URL('../../shared/dist/cli.js', import.meta.url));
const OUTPUT = fileURLToPath(new URL('../test-output/', import.meta.url));
const UNKNOWN_ID = '00000000-0000-4000-8000-000000000000';
const DEMO_APPROVED_TITLE = 'Nitrate by IC after the column change';

const scratch = scratchFolder('meritline-reports-');
const saved = scratch.saved;
const pdftotext = (file: string, page?: number) =>
  execFileSync('pdftotext', [...(page ? ['-f', String(page), '-l', String(page)] : []), file, '-'], { encoding: 'utf8' }).replace(
    /\s+/g,
    ' ',
  );
const pageCount = (file: string) => Number(/Pages:\s+(\d+)/.exec(execFileSync('pdfinfo', [file], { encoding: 'utf8' }))?.[1]);

afterAll(scratch.remove);

/** The textbook data do not meet every criterion of the method version, so approving them needs a written reason. */
const JUSTIFICATION = 'Textbook calibration used to check the report layout, not for routine use.';
describe('validation reports', () => {
  let t: TestApp;
  let ds: DataSource;
  const token: Record<keyof typeof DEMO, string> = { analyst: '', analyst2: '', reviewer: '', quality: '', admin: '' };
  const as = (who: keyof typeof DEMO) => ({ Authorization: `Bearer ${token[who]}` });
  const download = (studyId: string, who: keyof typeof DEMO = 'analyst') =>
    t.http().get(`/api/studies/${studyId}/report`).set(as(who)).buffer(true).parse(binary);
  const verify = (bytes: Buffer, name = 'report.pdf') =>
    t.http().post('/api/reports/verify').attach('file', bytes, { filename: name, contentType: 'application/pdf' });
  const reportCount = () => ds.getRepository(ValidationReport).count();

  /** A study on a seeded method version, created, submitted and approved through the API. */
  const approvedStudy = async (): Promise<any> => {
    const methods = (await t.http().get('/api/methods').set(as('analyst')).expect(200)).body as any[];
    const version = methods.flatMap((m) => m.versions.map((v: any) => ({ ...v, method: m }))).find((v) => v.status === 'active');
    const created = await t
      .http()
      .post('/api/studies')
      .set(as('analyst'))
      .send({
        methodVersionId: version.id,
        title: 'Fluorescein calibration check (textbook data)',
        data: {
          units: { x: 'pg/mL', y: 'intensity' },
          standards: miller.data.x.map((x: number, i: number) => ({ x, y: miller.data.y[i] })),
        },
        meta: {
          instrument: 'FL-1 spectrofluorimeter',
          startedOn: '2026-11-02',
          finishedOn: '2026-11-03',
          conclusion: 'Linear over 0 to 12 pg/mL.',
        },
      })
      .expect(201);
    const id = created.body.id as string;
    await t.http().post(`/api/studies/${id}/submit`).set(as('analyst')).send({ password: DEMO_PASSWORD }).expect(200);
    let approved = await t
      .http()
      .post(`/api/studies/${id}/approve`)
      .set(as('reviewer'))
      .send({ password: DEMO_PASSWORD, comment: 'Checked against the bench sheets.', justification: JUSTIFICATION })
      .expect(200);
    if (approved.body.status !== 'approved')
      approved = await t
        .http()
        .post(`/api/studies/${id}/approve`)
        .set(as('quality'))
        .send({ password: DEMO_PASSWORD, justification: JUSTIFICATION })
        .expect(200);
    expect(approved.body.status).toBe('approved');
    return (await t.http().get(`/api/studies/${id}`).set(as('analyst')).expect(200)).body;
  };

  let study: any;
  let first: Response;
  let reportFile: string;

  beforeAll(async () => {
    t = await createTestApp();
    ds = t.app.get(DataSource);
    for (const who of Object.keys(DEMO) as (keyof typeof DEMO)[]) token[who] = await t.tokenFor(DEMO[who]);
    study = await approvedStudy();
    first = await download(study.id).expect(200);
    reportFile = saved('report.pdf', first.body);
  });
  afterAll(() => t.close());

  describe('issuing and downloading', () => {
    it('should store one signed report against the method version, with its SHA-256, size and an audit entry', async () => {
      expect(first.headers['content-type']).toBe('application/pdf');
      const stored = await ds.getRepository(ValidationReport).findOneByOrFail({ studyId: study.id });
      expect(stored).toMatchObject({
        methodVersionId: study.methodVersionId,
        sizeBytes: first.body.length,
        sha256: createHash('sha256').update(first.body).digest('hex'),
      });
      expect(Buffer.compare(stored.pdf, first.body)).toBe(0);
      const fileName = `meritline-${study.method.name.toLowerCase().replace(/[^a-z0-9]+/g, '-')}-v${study.methodVersion.number}-${stored.id.slice(0, 8)}.pdf`;
      expect(first.headers['content-disposition']).toBe(`attachment; filename="${fileName}"`);
      const audit = await ds.getRepository(AuditEntry).findBy({ action: 'report.issued', entityId: stored.id });
      expect(audit).toHaveLength(1);
      expect(audit[0].changes).toMatchObject({ studyId: { to: study.id }, sha256: { to: stored.sha256 } });
    });

    it('should return identical bytes on every download, for every signed-in role, and never issue twice', async () => {
      const count = await reportCount();
      for (const who of ['analyst', 'reviewer', 'quality', 'admin', 'analyst2'] as const) {
        const again = await download(study.id, who).expect(200);
        expect(Buffer.compare(again.body, first.body)).toBe(0);
      }
      const service = t.app.get(ReportsService);
      const [a, b] = await Promise.all([service.issueForStudy(study.id), service.issueForStudy(study.id)]);
      expect(a.id).toBe(b.id);
      expect(await reportCount()).toBe(count);
    });

    it('should issue a report on first download for a seeded approved study that has none yet', async () => {
      const seeded = await ds.getRepository(ValidationStudy).findOneByOrFail({ title: DEMO_APPROVED_TITLE });
      expect(await ds.getRepository(ValidationReport).countBy({ studyId: seeded.id })).toBe(0);
      const res = await download(seeded.id, 'reviewer').expect(200);
      expect(pdfsig(saved('seeded.pdf', res.body))).toContain('Signature is Valid.');
      expect(await ds.getRepository(ValidationReport).countBy({ studyId: seeded.id })).toBe(1);
    });

    it('should refuse to issue a signed report for a study that is not approved', async () => {
      const draft = await ds.getRepository(ValidationStudy).findOneByOrFail({ status: 'draft' });
      const count = await reportCount();
      await expect(t.app.get(ReportsService).issueForStudy(draft.id)).rejects.toThrow(/only an approved study/i);
      expect(await reportCount()).toBe(count);
    });

    it('should refuse anonymous callers (401), malformed ids (400) and unknown studies (404), storing nothing', async () => {
      const count = await reportCount();
      const audits = await ds.getRepository(AuditEntry).count();
      await t.http().get(`/api/studies/${study.id}/report`).expect(401);
      await t.http().get(`/api/studies/${study.id}/report`).set('Authorization', 'Bearer not.a.token').expect(401);
      const unknown = await t.http().get(`/api/studies/${UNKNOWN_ID}/report`).set(as('analyst')).expect(404);
      expect(unknown.body).toEqual({ statusCode: 404, message: 'Study not found.' });
      await t.http().get('/api/studies/not-a-uuid/report').set(as('analyst')).expect(400);
      expect(await reportCount()).toBe(count);
      expect(await ds.getRepository(AuditEntry).count()).toBe(audits);
    });
  });

  describe('the digital signature', () => {
    it('should be a valid PKCS#7 detached signature over the whole document (pdfsig)', () => {
      const out = pdfsig(reportFile);
      expect(out).toContain('Signature Type: adbe.pkcs7.detached');
      expect(out).toContain('Signing Hash Algorithm: SHA-256');
      expect(out).toContain('Total document signed');
      expect(out).toContain('Signature is Valid.');
      expect(out).toContain('Signer Certificate Common Name: Riverbend Water & Food Testing Laboratory');
    });

    it('should break when one byte inside the signed range changes (pdfsig: Digest Mismatch)', () => {
      const bytes = Buffer.from(first.body);
      const [start, length] = /\/ByteRange \[(\d+) (\d+)/.exec(bytes.toString('latin1'))!.slice(1).map(Number);
      const at = bytes.indexOf('(Method validation report: ');
      expect(at).toBeGreaterThan(start);
      expect(at).toBeLessThan(start + length);
      bytes[at + 8] = 'N'.charCodeAt(0);
      const out = pdfsig(saved('tampered.pdf', bytes));
      expect(out).toContain('Digest Mismatch');
      expect(out).not.toContain('Signature is Valid.');
    });
  });

  describe('content', () => {
    it('should print the method, the version, the slope and the reported LOD as the API gives them', () => {
      const text = pdftotext(reportFile);
      const result = study.result;
      expect(text).toContain(study.method.name);
      expect(text).toContain(`version ${study.methodVersion.number}`);
      expect(text).toContain(study.id);

      // The slope is printed to its standard error: 1.930 (s_b = 0.041), which rounds to Miller & Miller's printed b = 1.93.
      const slope = formatEstimate(result.calibration.slope, result.calibration.seSlope).value;
      expect(slope).toBe('1.930');
      expect(Number(slope).toFixed(2)).toBe('1.93');
      expect(Math.abs(result.calibration.slope - miller.computed.slope_b)).toBeLessThan(1e-12);
      expect(text).toContain(`y = ${slope} · x + ${formatEstimate(result.calibration.intercept, result.calibration.seIntercept).value}`);

      const basis = result.detection.flagBasis as string;
      const limits = result.detection[basis];
      const reportedLod = limits.lod ?? limits.detectableX ?? limits.mdl;
      expect(text).toContain(`Reported LOD ${formatNumber(reportedLod, 3)} pg/mL`);
      // ICH Q2(R2) residual-SD limit of the textbook example: 3.3 × 0.43285 / 1.93036 = 0.740 pg/mL.
      expect(formatNumber(result.detection.sdResidual.lod, 3)).toBe(formatNumber(ich.DL_residual_sd, 3));
      expect(text).toContain(`Residual SD of the calibration, ICH Q2(R2) — 0.740 2.24`);
    });

    it('should print the criteria as evaluated in words, never as paths into the result', () => {
      const text = pdftotext(reportFile);
      const printed = text.slice(text.indexOf('Acceptance criteria as evaluated'));
      expect(printed).toContain('Acceptance criteria as evaluated');
      expect(printed).toMatch(/Coefficient of determination R² at least 0\.99/);
      expect(printed).not.toMatch(/calibration\.r2|recovery\.overall|abs<=|>= 0/);
    });

    it('should carry every section, the signatures, the review comment, the data hash on every page and the caution', () => {
      const text = pdftotext(reportFile);
      for (const heading of [
        '1 Summary',
        '2 Calibration',
        '3 Detection and quantitation limits',
        '4 Recovery and precision',
        '5 Accuracy profile, trueness and measurement uncertainty',
        '6 Outliers and exclusions',
        '7 Statistical methods and references',
        '8 Electronic signatures and review',
        '9 Caution',
      ]) {
        expect(text).toContain(heading);
      }
      expect(text).toContain('Lack-of-fit test: not evaluated');
      expect(text).toContain('Alma Ruiz');
      expect(text).toContain('Priya Nair');
      expect(text).toContain('Checked against the bench sheets.');
      expect(text).toContain('does not replace');
      for (let page = 1; page <= pageCount(reportFile); page++) {
        const pageText = pdftotext(reportFile, page);
        expect(pageText).toContain(`Data SHA-256 ${study.dataHash}`);
        expect(pageText).toContain(`page ${page} of ${pageCount(reportFile)}`);
      }
    });

    it('should attach the study data, whose SHA-256 is the printed hash and from which the CLI recomputes the result', () => {
      const dir = join(scratch.dir, 'attachment');
      mkdirSync(dir, { recursive: true });
      execFileSync('pdfdetach', ['-saveall', '-o', dir, reportFile]);
      const data = readFileSync(join(dir, 'study-data.json'));
      expect(createHash('sha256').update(data).digest('hex')).toBe(study.dataHash);
      expect(JSON.parse(execFileSync(process.execPath, [CLI, join(dir, 'study-data.json')], { encoding: 'utf8' }))).toEqual(study.result);
    });

    it('should render page 1 and the calibration page as images for a visual check', () => {
      const calibrationPage = Array.from({ length: pageCount(reportFile) }, (_, i) => i + 1).find((page) =>
        pdftotext(reportFile, page).includes('Figure 1. Calibration'),
      )!;
      mkdirSync(OUTPUT, { recursive: true });
      for (const [page, name] of [
        [1, 'report-page-1'],
        [calibrationPage, 'report-page-calibration'],
      ] as const) {
        const prefix = join(scratch.dir, name);
        execFileSync('pdftoppm', ['-png', '-r', '60', '-f', String(page), '-l', String(page), '-singlefile', reportFile, prefix]);
        copyFileSync(`${prefix}.png`, join(OUTPUT, `${name}.png`));
        expect(statSync(join(OUTPUT, `${name}.png`)).size).toBeGreaterThan(10_000);
      }
    });
  });

  describe('verifying a copy', () => {
    it('should confirm a byte-identical copy to anyone, without signing in', async () => {
      const stored = await ds.getRepository(ValidationReport).findOneByOrFail({ studyId: study.id });
      const res = await verify(first.body).expect(200);
      expect(res.body).toEqual({
        valid: true,
        kind: 'validation-report',
        studyId: study.id,
        studyTitle: study.title,
        reportId: stored.id,
        methodName: study.method.name,
        methodVersion: study.methodVersion.number,
        signedAt: stored.signedAt.toISOString(),
        sha256: stored.sha256,
      });
    });

    it('should reject a modified copy and say that it was changed after signing', async () => {
      const bytes = Buffer.from(first.body);
      bytes[bytes.indexOf('(Method validation report: ') + 8] = 'N'.charCodeAt(0);
      const res = await verify(bytes).expect(200);
      expect(res.body).toEqual({ valid: false, reason: expect.stringMatching(/changed since it was signed/) });
    });

    it('should reject files that are not PDFs, and PDFs it never issued', async () => {
      const text = await verify(Buffer.from('plain text, not a report'), 'notes.txt').expect(200);
      expect(text.body).toEqual({ valid: false, reason: expect.stringMatching(/not a PDF/) });
      const submitted = await ds.getRepository(ValidationStudy).findOneByOrFail({ status: 'submitted' });
      const draft = await download(submitted.id).expect(200);
      const unknown = await verify(draft.body).expect(200);
      expect(unknown.body).toEqual({ valid: false, reason: expect.stringMatching(/does not match any report issued/) });
    });

    it('should answer 400 without a file and 413 above 20 MB', async () => {
      const res = await t.http().post('/api/reports/verify').field('note', 'no file').expect(400);
      expect(res.body).toEqual({ statusCode: 400, message: 'Attach the PDF to check as the form field "file".' });
      await verify(Buffer.alloc(20 * 1024 * 1024 + 1, 0x20)).expect(413);
    });
  });

  describe('draft preview', () => {
    it('should list excluded blanks, recovery and precision results with their reasons among the exclusions', async () => {
      const created = await createStudy(t, { author: DEMO.analyst });
      const draft = (await t.http().get(`/api/studies/${created.id}`).set(as('analyst')).expect(200)).body;
      const data = {
        ...draft.data,
        blanks: [0.0011, 0.0018, { value: 0.0095, excluded: { reason: 'Carry-over from the top standard' } }, 0.0014],
        recovery: [
          { id: 'S1', added: 1, found: 0.98 },
          { id: 'S2', added: 1, found: 1.02 },
          { id: 'S3', added: 1, found: 0.61, excluded: { reason: 'Vial S3 spilt before injection' } },
        ],
        precision: [
          { group: 'day 1', value: 5.02 },
          { group: 'day 1', value: 4.98 },
          { group: 'day 1', value: 5.9, excluded: { reason: 'Wrong dilution on day 1' } },
        ],
      };
      await t.http().patch(`/api/studies/${draft.id}`).set(as('analyst')).send({ lockVersion: draft.lockVersion, data }).expect(200);
      const text = pdftotext(saved('draft-exclusions.pdf', (await download(draft.id, 'analyst').expect(200)).body));
      expect(text).toContain('Excluded replicate results');
      expect(text).toMatch(/Recovery, S3 \(row 3\)[\s\S]*Vial S3 spilt before injection/);
      expect(text).toMatch(/Precision, series day 1 \(row 3\)[\s\S]*Wrong dilution on day 1/);
      expect(text).toMatch(/Method blank \(row 3\)[\s\S]*Carry-over from the top standard/);
      expect(text).toContain('1 method blank excluded by the analyst');
    });

    it('should list excluded low-level spike results and MDL blanks with their reasons and count only the rows used', async () => {
      const created = await createStudy(t, { author: DEMO.analyst });
      const draft = (await t.http().get(`/api/studies/${created.id}`).set(as('analyst')).expect(200)).body;
      // Invented results (mg/L): the fourth spike was spiked twice, the second blank came from a contaminated vial.
      const lowSpikes = {
        spiked: [0.21, 0.18, 0.24, { value: 0.43, excluded: { reason: 'Spiked twice by mistake' } }, 0.2, 0.17, 0.22, 0.19],
        blanks: [0.02, { value: 0.11, excluded: { reason: 'Contaminated vial' } }, 0.03, null, 0.01],
      };
      await t
        .http()
        .patch(`/api/studies/${draft.id}`)
        .set(as('analyst'))
        .send({ lockVersion: draft.lockVersion, data: { ...draft.data, lowSpikes } })
        .expect(200);
      const file = saved('draft-low-spike-exclusions.pdf', (await download(draft.id, 'analyst').expect(200)).body);
      const text = pdftotext(file);
      expect(text).toMatch(/Low-level spike \(row 4\)[\s\S]*Spiked twice by mistake/);
      expect(text).toMatch(/Method blank for the MDL \(row 2\)[\s\S]*Contaminated vial/);
      expect(text).toMatch(/from 7 spiked samples \(1 more excluded/);
      expect(text).toMatch(/from 4 method blanks \(1 more excluded/);
      expect(text).toMatch(/excluded: spike 4/);
      expect(text).toContain('1 low-level spike result excluded by the analyst');
      const page = Array.from({ length: pageCount(file) }, (_, i) => i + 1).find((p) =>
        pdftotext(file, p).includes('Excluded replicate results'),
      )!;
      const prefix = join(scratch.dir, 'report-page-low-spike-exclusions');
      execFileSync('pdftoppm', ['-png', '-r', '70', '-f', String(page), '-l', String(page), '-singlefile', file, prefix]);
      mkdirSync(OUTPUT, { recursive: true });
      copyFileSync(`${prefix}.png`, join(OUTPUT, 'report-page-low-spike-exclusions.png'));
    });

    it('should mark every page DRAFT, carry no signature and store nothing', async () => {
      const submitted = await ds.getRepository(ValidationStudy).findOneByOrFail({ status: 'submitted' });
      const count = await reportCount();
      const res = await download(submitted.id, 'reviewer').expect(200);
      expect(res.headers['content-disposition']).toMatch(/^attachment; filename="meritline-.+-v\d+-[0-9a-f]{8}-draft\.pdf"$/);
      const file = saved('draft.pdf', res.body);
      expect(pdfsig(file)).toContain('does not contain any signatures');
      for (let page = 1; page <= pageCount(file); page++) expect(pdftotext(file, page)).toContain('DRAFT — not approved');
      expect(pdftotext(file)).toContain('Draft preview: not approved');
      expect(await reportCount()).toBe(count);
      const again = await download(submitted.id, 'reviewer').expect(200);
      expect(again.body.length).toBeGreaterThan(10_000);
    });
  });
});

describe('signing certificates in production', () => {
  const production = {
    NODE_ENV: 'production',
    JWT_SECRET: 'a-production-secret-of-at-least-32-characters',
    AUDIT_HMAC_KEY: 'an-audit-chain-key-of-at-least-32-characters',
    MAIL_DISABLED: 'true',
  };

  it('should refuse to start without a laboratory certificate, so that no approval waits on a report that cannot be signed', async () => {
    try {
      await expect(createTestApp(production)).rejects.toThrow(/SIGNING_P12_PATH/);
    } finally {
      for (const key of Object.keys(production)) delete process.env[key];
    }
  });

  it('should sign with the configured PKCS#12 certificate and passphrase', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'meritline-p12-'));
    const p12Path = join(dir, 'lab.p12');
    writeFileSync(p12Path, createSelfSignedP12('Riverbend Configured Signer', 'configured-passphrase'));
    const t = await createTestApp({ ...production, SIGNING_P12_PATH: p12Path, SIGNING_P12_PASSPHRASE: 'configured-passphrase' });
    try {
      const seeded = await t.app.get(DataSource).getRepository(ValidationStudy).findOneByOrFail({ title: DEMO_APPROVED_TITLE });
      const res = await t
        .http()
        .get(`/api/studies/${seeded.id}/report`)
        .set('Authorization', `Bearer ${await t.tokenFor(DEMO.reviewer)}`)
        .buffer(true)
        .parse(binary)
        .expect(200);
      const out = pdfsig(saved('configured.pdf', res.body));
      expect(out).toContain('Signer Certificate Common Name: Riverbend Configured Signer');
      expect(out).toContain('Signature is Valid.');
    } finally {
      await t.close();
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
