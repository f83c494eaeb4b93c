import ExcelJS from 'exceljs';
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listMethods, signedIn } from './support/flows.js';
import { queryDatabase } from './support/review-fixtures.js';
import { createTestApp, DEMO, type TestApp } from './support/test-app.js';

const fixture = (name: string) => readFileSync(new URL(`./fixtures/${name}`, import.meta.url));
const UNKNOWN_ID = '00000000-0000-4000-8000-000000000000';
const BASE_DATA = {
  standards: [1, 2, 4, 6, 8, 10, 12].flatMap((x) => [
    { x, y: 0.0018 + 0.0505 * x },
    { x, y: 0.0021 + 0.0504 * x },
  ]),
  blanks: [0.0017, 0.0021, 0.0015],
};

describe('importing CSV and XLSX files into a study', () => {
  let t: TestApp;
  let studyId: string;
  let dyeVersionId: string;
  const rows = (sql: string, ...params: unknown[]) => queryDatabase(t, sql, ...params);
  const stored = async (id: string) => (await rows('SELECT data, data_hash, lock_version FROM validation_studies WHERE id = ?', id))[0];
  const lockOf = async (id: string) => (await stored(id)).lock_version as number;
  const upload = async (
    id: string,
    file: Buffer,
    filename: string,
    fields: Record<string, string | number | boolean>,
    email: string = DEMO.analyst,
  ) => {
    const request = t
      .http()
      .post(`/api/studies/${id}/imports`)
      .set(await signedIn(t, email))
      .attach('file', file, filename);
    for (const [key, value] of Object.entries(fields)) request.field(key, String(value));
    return request;
  };

  beforeAll(async () => {
    t = await createTestApp();
    const methods = await listMethods(t, DEMO.analyst);
    dyeVersionId = methods.find((m) => m.analyte === 'Tartrazine')!.versions[0].id;
    studyId = (
      await t
        .http()
        .post('/api/studies')
        .set(await signedIn(t, DEMO.analyst))
        .send({ methodVersionId: dyeVersionId, title: 'Import target', data: BASE_DATA })
        .expect(201)
    ).body.id;
  });
  afterAll(() => t.close());

  it('should preview a comma-separated file on a dry run, mapping its headers, and save nothing', async () => {
    const before = await stored(studyId);
    const res = await upload(studyId, fixture('standards-comma.csv'), 'standards.csv', { section: 'standards', dryRun: true });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      section: 'standards',
      columns: ['Conc (mg/L)', 'Absorbance (AU)', 'Vial'],
      mapping: { x: 'Conc (mg/L)', y: 'Absorbance (AU)', id: 'Vial' },
      errors: [],
      rowCount: 10,
    });
    expect(res.body.rows[0]).toEqual({ x: 1, y: 0.0523, id: 'A1' });
    expect(await stored(studyId)).toEqual(before);
  });

  it('should replace the section on a real import, recompute the result and record the import', async () => {
    const lockVersion = await lockOf(studyId);
    const res = await upload(studyId, fixture('standards-comma.csv'), 'standards.csv', { section: 'standards', lockVersion });
    expect(res.status).toBe(200);
    expect(res.body.lockVersion).toBe(lockVersion + 1);
    expect(res.body.data.standards).toHaveLength(10);
    expect(res.body.data.blanks).toEqual(BASE_DATA.blanks);
    expect(res.body.result.calibration.n).toBe(10);
    const [entry] = await rows(`SELECT changes FROM audit_entries WHERE entity_id = ? AND action = 'study.imported'`, studyId);
    expect(JSON.parse(entry.changes as string)).toMatchObject({
      section: { to: 'standards' },
      rowCount: { from: 14, to: 10 },
      file: { to: 'standards.csv' },
    });
  });

  it('should read semicolons with decimal commas and an XLSX workbook made here', async () => {
    const semicolon = await upload(studyId, fixture('standards-semicolon-decimal-comma.csv'), 'export.csv', {
      section: 'standards',
      lockVersion: await lockOf(studyId),
    });
    expect(semicolon.status).toBe(200);
    expect(semicolon.body.data.standards.slice(0, 2)).toEqual([
      { x: 1, y: 0.0521 },
      { x: 2, y: 0.1029 },
    ]);

    const workbook = new ExcelJS.Workbook();
    workbook.addWorksheet('Blanks').addRows([['Blank response'], [0.0016], [0.0019], [0.0022], [0.0014]]);
    const xlsx = Buffer.from(await workbook.xlsx.writeBuffer());
    const res = await upload(studyId, xlsx, 'blanks.xlsx', { section: 'blanks', lockVersion: await lockOf(studyId) });
    expect(res.status).toBe(200);
    expect(res.body.data.blanks).toEqual([0.0016, 0.0019, 0.0022, 0.0014]);
    expect(res.body.result.detection.blankSd.n).toBe(4);
  });

  it('should import nothing when one cell is not a number, naming the row and column', async () => {
    const before = await stored(studyId);
    const res = await upload(studyId, fixture('standards-bad-cell.csv'), 'bad.csv', {
      section: 'standards',
      lockVersion: before.lock_version as number,
    });
    expect(res.status).toBe(422);
    expect(res.body).toMatchObject({ statusCode: 422, message: 'The file has errors; nothing was imported.' });
    expect(res.body.errors).toEqual([{ field: 'rows[2].y', code: 'not_number', message: 'Line 4, column “Area”: “n/a” is not a number.' }]);
    expect(await stored(studyId)).toEqual(before);
    const dry = await upload(studyId, fixture('standards-bad-cell.csv'), 'bad.csv', { section: 'standards', dryRun: true });
    expect(dry.status).toBe(200);
    expect(dry.body.errors).toEqual(res.body.errors);
  });

  it('should name the unused columns when a required field has no column, and accept a mapping instead', async () => {
    const file = Buffer.from('Standard conc.,Detector counts\n1,0.052\n2,0.103\n4,0.204\n');
    const before = await stored(studyId);
    const refused = await upload(studyId, file, 'odd.csv', { section: 'standards', lockVersion: before.lock_version as number });
    expect(refused.status).toBe(422);
    expect(refused.body.errors).toEqual([
      expect.objectContaining({ field: 'mapping.y', code: 'unmapped', message: expect.stringContaining('“Detector counts”') }),
    ]);
    expect(await stored(studyId)).toEqual(before);
    const mapped = await upload(studyId, file, 'odd.csv', {
      section: 'standards',
      dryRun: true,
      mapping: JSON.stringify({ y: 'Detector counts' }),
    });
    expect(mapped.body).toMatchObject({ mapping: { x: 'Standard conc.', y: 'Detector counts' }, errors: [], rowCount: 3 });
    const badMapping = await upload(studyId, file, 'odd.csv', { section: 'standards', dryRun: true, mapping: '{y: counts' });
    expect(badMapping.status).toBe(422);
    expect(badMapping.body.errors[0].field).toBe('mapping');
  });

  it('should refuse a file that is neither CSV nor XLSX with a clear message, whatever its name', async () => {
    const before = await stored(studyId);
    const png = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==', 'base64');
    const pngRes = await upload(studyId, png, 'standards.csv', { section: 'standards', lockVersion: before.lock_version as number });
    expect(pngRes.status).toBe(415);
    expect(pngRes.body.message).toMatch(/PNG image, not CSV or XLSX/);
    const pdf = Buffer.from('%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n');
    const pdfRes = await upload(studyId, pdf, 'standards.xlsx', { section: 'standards', lockVersion: before.lock_version as number });
    expect(pdfRes.status).toBe(415);
    expect(pdfRes.body.errors[0]).toMatchObject({ field: 'file', code: 'unsupported_type' });
    expect(await stored(studyId)).toEqual(before);
  });

  it('should answer a 100 000-row file with 422 “too many rows” quickly, and an over-size file with 413', async () => {
    const before = await stored(studyId);
    const big = Buffer.from(`x,y\n${'1,0.0523\n'.repeat(100_000)}`);
    const started = Date.now();
    const res = await upload(studyId, big, 'big.csv', { section: 'standards', lockVersion: before.lock_version as number });
    expect(res.status).toBe(422);
    expect(res.body.errors[0]).toMatchObject({
      field: 'file',
      code: 'too_many_rows',
      message: expect.stringMatching(/more than 20,000 data rows/),
    });
    expect(Date.now() - started).toBeLessThan(3000);
    const huge = Buffer.alloc(5 * 1024 * 1024 + 1, 'x');
    expect((await upload(studyId, huge, 'huge.csv', { section: 'standards', lockVersion: before.lock_version as number })).status).toBe(
      413,
    );
    expect(await stored(studyId)).toEqual(before);
  });

  it('should answer bad form fields with 422: no file, an unknown section, no lockVersion; and 409 for a stale one', async () => {
    const headers = await signedIn(t, DEMO.analyst);
    const noFile = await t
      .http()
      .post(`/api/studies/${studyId}/imports`)
      .set(headers)
      .field('section', 'standards')
      .field('lockVersion', String(await lockOf(studyId)));
    expect(noFile.status).toBe(422);
    expect(noFile.body.errors[0]).toMatchObject({ field: 'file', code: 'required' });
    const section = await upload(studyId, fixture('standards-comma.csv'), 's.csv', { section: 'calibrants', lockVersion: 1 });
    expect(section.status).toBe(422);
    expect(section.body.errors[0].field).toBe('section');
    const noLock = await upload(studyId, fixture('standards-comma.csv'), 's.csv', { section: 'standards' });
    expect(noLock.status).toBe(422);
    expect(noLock.body.errors[0].field).toBe('lockVersion');
    const stale = await upload(studyId, fixture('standards-comma.csv'), 's.csv', { section: 'standards', lockVersion: 1 });
    expect(stale.status).toBe(409);
  });

  it('should refuse anonymous callers (401), reviewers and other analysts (403), unknown studies (404) and locked studies (409)', async () => {
    const file = fixture('standards-comma.csv');
    expect(
      (
        await t
          .http()
          .post(`/api/studies/${studyId}/imports`)
          .attach('file', file, 's.csv')
          .field('section', 'standards')
          .field('dryRun', 'true')
      ).status,
    ).toBe(401);
    expect((await upload(studyId, file, 's.csv', { section: 'standards', dryRun: true }, DEMO.reviewer)).status).toBe(403);
    expect((await upload(studyId, file, 's.csv', { section: 'standards', lockVersion: await lockOf(studyId) }, DEMO.analyst2)).status).toBe(
      403,
    );
    expect((await upload(UNKNOWN_ID, file, 's.csv', { section: 'standards', dryRun: true })).status).toBe(404);
    const page = (
      await t
        .http()
        .get('/api/studies?status=submitted&mine=true')
        .set(await signedIn(t, DEMO.analyst))
    ).body;
    const submitted = page.items[0];
    expect((await upload(submitted.id, file, 's.csv', { section: 'standards', lockVersion: submitted.lockVersion })).status).toBe(409);
  });

  it('should import unknowns with replicate columns, recovery, precision and low-level spikes into their sections', async () => {
    const id = (
      await t
        .http()
        .post('/api/studies')
        .set(await signedIn(t, DEMO.analyst))
        .send({ methodVersionId: dyeVersionId, title: 'All sections', data: BASE_DATA })
        .expect(201)
    ).body.id;
    const unknowns = await upload(id, fixture('unknowns-replicates.csv'), 'unknowns.csv', {
      section: 'unknowns',
      lockVersion: await lockOf(id),
    });
    expect(unknowns.status).toBe(200);
    expect(unknowns.body.data.unknowns[0]).toEqual({ id: 'S-3101 orange soda', y: [0.3171, 0.3165], dilution: 5 });
    expect(unknowns.body.result.unknowns).toHaveLength(3);

    const recovery = Buffer.from('id,level,added,found\nL1,low,2,1.98\nL2,low,2,2.01\nH1,high,10,10.04\nH2,high,10,9.95\n');
    expect(
      (await upload(id, recovery, 'recovery.csv', { section: 'recovery', lockVersion: await lockOf(id) })).body.result.recovery.items,
    ).toHaveLength(4);
    const precision = Buffer.from('day;value\nday 1;5,02\nday 1;4,99\nday 2;5,05\nday 2;5,01\n');
    expect(
      (await upload(id, precision, 'precision.csv', { section: 'precision', lockVersion: await lockOf(id) })).body.result.precision.k,
    ).toBe(2);
    const spikes = Buffer.from(
      `spiked,blank\n${[0.21, 0.18, 0.2, 0.22, 0.19, 0.2, 0.21].map((v, i) => `${v},${i % 2 ? 'ND' : '0.01'}`).join('\n')}\n`,
    );
    const low = await upload(id, spikes, 'mdl.csv', { section: 'lowSpikes', lockVersion: await lockOf(id) });
    expect(low.body.data.lowSpikes).toEqual({
      spiked: [0.21, 0.18, 0.2, 0.22, 0.19, 0.2, 0.21],
      blanks: [0.01, null, 0.01, null, 0.01, null, 0.01],
    });
    expect(low.body.result.detection.epaMdl.nSpiked).toBe(7);
    const actions = (
      await rows(`SELECT changes FROM audit_entries WHERE entity_id = ? AND action = 'study.imported' ORDER BY seq`, id)
    ).map((e) => JSON.parse(e.changes as string).section.to);
    expect(actions).toEqual(['unknowns', 'recovery', 'precision', 'lowSpikes']);
  });

  it('should ask for a reason before importing into a returned study', async () => {
    const page = (
      await t
        .http()
        .get('/api/studies?status=returned')
        .set(await signedIn(t, DEMO.analyst2))
    ).body;
    const returned = page.items[0];
    const before = await stored(returned.id);
    const refused = await upload(
      returned.id,
      Buffer.from('blank\n0.0003\n0.0002\n0.0004\n'),
      'b.csv',
      { section: 'blanks', lockVersion: returned.lockVersion },
      DEMO.analyst2,
    );
    expect(refused.status).toBe(422);
    expect(refused.body.errors[0].field).toBe('reason');
    expect(await stored(returned.id)).toEqual(before);
    const accepted = await upload(
      returned.id,
      Buffer.from('blank\n0.0003\n0.0002\n0.0004\n'),
      'b.csv',
      { section: 'blanks', lockVersion: returned.lockVersion, reason: 'Blanks re-run with fresh solvent.' },
      DEMO.analyst2,
    );
    expect(accepted.status).toBe(200);
    expect(accepted.body.data.blanks).toEqual([0.0003, 0.0002, 0.0004]);
  });

  describe('GET /api/import-templates/:section', () => {
    it('should give every signed-in user a CSV template with a header and two example rows', async () => {
      await t.http().get('/api/import-templates/standards').expect(401);
      const res = await t
        .http()
        .get('/api/import-templates/unknowns')
        .set(await signedIn(t, DEMO.reviewer))
        .expect(200);
      expect(res.headers['content-type']).toMatch(/^text\/csv/);
      expect(res.headers['content-disposition']).toBe('attachment; filename="unknowns-template.csv"');
      const lines = res.text.trim().split(/\r?\n/);
      expect(lines).toHaveLength(3);
      expect(lines[0]).toBe('id,y1,y2,dilution');
      const missing = await t
        .http()
        .get('/api/import-templates/calibrants')
        .set(await signedIn(t, DEMO.reviewer))
        .expect(404);
      expect(missing.body.message).toMatch(/standards, blanks, recovery, precision, accuracy, unknowns, lowSpikes/);
    });
  });
});
