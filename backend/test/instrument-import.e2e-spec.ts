import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bearer, postRun, sqlQuery } from './support/flows.js';
import { createTestApp, DEMO, type TestApp } from './support/test-app.js';

/* An invented instrument export on the demo nitrate line (about 0.0031 + 0.1523 µS·min per mg/L), in a layout of its own. */
const EXPORT = readFileSync(new URL('./fixtures/instrument-export-semicolon.csv', import.meta.url), 'utf8');
const MAPPING = {
  sampleId: 'Sample Name',
  sampleType: 'Type',
  response: 'Area',
  replicate: 'Inj',
  dilution: 'Dil.',
  concentration: 'Amount',
};

describe('instrument exports mapped once per method version', () => {
  let t: TestApp;
  let analyst: string;
  let reviewer: string;
  let versionId: string;
  const upload = (text: string, token = analyst, id = versionId) =>
    t
      .http()
      .post(`/api/method-versions/${id}/instrument-import`)
      .set(bearer(token))
      .attach('file', Buffer.from(text, 'utf8'), 'export.csv');
  const put = (body: object, token = analyst) =>
    t.http().put(`/api/method-versions/${versionId}/import-mapping`).set(bearer(token)).send(body);

  beforeAll(async () => {
    t = await createTestApp();
    [analyst, reviewer] = await Promise.all([t.tokenFor(DEMO.analyst), t.tokenFor(DEMO.reviewer)]);
    [{ id: versionId }] = await sqlQuery<{ id: string }>(
      t,
      "select v.id from method_versions v join methods m on m.id = v.method_id where m.name = 'Nitrate in drinking water by ion chromatography' and v.status = 'active'",
    );
  });
  afterAll(async () => {
    await t?.close();
  });

  it('should ask for a mapping the first time, listing the file’s columns', async () => {
    const mapping = await t.http().get(`/api/method-versions/${versionId}/import-mapping`).set(bearer(analyst)).expect(200);
    expect(mapping.body).toMatchObject({ columns: null, lockVersion: 0 });
    const res = await upload(EXPORT).expect(200);
    expect(res.body).toMatchObject({
      status: 'needs-mapping',
      columns: ['Inj', 'Sample Name', 'Type', 'Amount', 'Dil.', 'Area', 'Operator'],
    });
    expect(res.body.preview).toHaveLength(5);
  });

  it('should refuse incomplete or duplicate mappings (422 with the field), other roles (403) and a stale lock version (409)', async () => {
    await put({ columns: MAPPING, lockVersion: 0 }, reviewer).expect(403);
    const incomplete = await put({ columns: { ...MAPPING, response: null }, lockVersion: 0 }).expect(422);
    expect(incomplete.body.errors[0]).toMatchObject({ field: 'columns.response', code: 'required' });
    const twice = await put({ columns: { ...MAPPING, replicate: 'Area' }, lockVersion: 0 }).expect(422);
    expect(twice.body.errors.map((e: { field: string }) => e.field)).toContain('columns.replicate');
    await put({ columns: MAPPING, lockVersion: 3 }).expect(409);
    await put({ columns: MAPPING }).expect(422);
    expect(await sqlQuery(t, 'select id from run_import_mappings')).toEqual([]);
  });

  it('should save the mapping, audit it, and read the next export into run data grouped by sample', async () => {
    const saved = await put({ columns: MAPPING, lockVersion: 0 }).expect(200);
    expect(saved.body).toMatchObject({ columns: MAPPING, lockVersion: 1, updatedBy: 'Alma Ruiz' });
    expect(await sqlQuery(t, "select seq from audit_entries where action = 'run-import-mapping.saved'")).toHaveLength(1);
    const res = await upload(EXPORT).expect(200);
    expect(res.body.status).toBe('parsed');
    expect(res.body.data).toEqual({
      standards: [
        { x: 1, y: 0.1552 },
        { x: 50, y: 7.619 },
      ],
      checks: [{ id: 'CCV 10', nominal: 10, y: [1.527] }],
      blanks: [{ id: 'MB-1', y: [0.0035] }],
      qcSamples: [{ id: 'QC 20', known: 20, y: [3.052] }],
      unknowns: [
        { id: 'W-3001 tap water', y: [1.893, 1.897] },
        { id: 'W-3002 well', y: [4.709], dilution: 2 },
      ],
    });
    const run = await postRun(t, analyst, {
      methodVersionId: versionId,
      title: 'From the instrument',
      data: { model: 'two-point', ...res.body.data },
    }).expect(201);
    expect(run.body.status).toBe('accepted');
  });

  it('should refuse a file that does not fit the saved mapping, whole, naming the line and column (422)', async () => {
    const otherLayout = EXPORT.replace('Area', 'Height');
    const missing = await upload(otherLayout).expect(422);
    expect(missing.body.errors[0]).toMatchObject({ field: 'file', code: 'column_missing' });
    expect(missing.body.message).toMatch(/Line 1: the column “Area” \(Response\) saved in the mapping is not in this file/);
    const badCell = await upload(EXPORT.replace('1,527', 'n/a').replace(';Sample;', ';Probe;')).expect(422);
    expect(badCell.body.errors.map((e: { message: string }) => e.message)).toEqual([
      'Line 4, column “Area”: “n/a” is not a number.',
      expect.stringMatching(/^Line 7, column “Type”: “Probe” is not a sample type Meritline knows/),
    ]);
  });

  it('should keep the study import’s limits: over 20,000 rows 422, over 5 MB 413, a binary file 415', async () => {
    const many = await upload(`${EXPORT.split('\n')[0]}\n${'6;W;Sample;;;1,0;AR\n'.repeat(20_001)}`).expect(422);
    expect(many.body.errors[0]).toMatchObject({
      field: 'file',
      code: 'too_many_rows',
      message: expect.stringMatching(/more than 20,000 data rows/),
    });
    const huge = Buffer.alloc(5 * 1024 * 1024 + 1, 'x');
    await t
      .http()
      .post(`/api/method-versions/${versionId}/instrument-import`)
      .set(bearer(analyst))
      .attach('file', huge, 'huge.csv')
      .expect(413);
    const png = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0, 0, 0, 0]);
    await t
      .http()
      .post(`/api/method-versions/${versionId}/instrument-import`)
      .set(bearer(analyst))
      .attach('file', png, 'x.png')
      .expect(415);
  });

  it('should refuse anonymous callers (401), a missing file (400) and unknown versions (404)', async () => {
    await t.http().post(`/api/method-versions/${versionId}/instrument-import`).attach('file', Buffer.from(EXPORT), 'e.csv').expect(401);
    await t.http().post(`/api/method-versions/${versionId}/instrument-import`).set(bearer(analyst)).expect(400);
    await upload(EXPORT, reviewer).expect(403);
    await upload(EXPORT, analyst, '00000000-0000-4000-8000-000000000000').expect(404);
    await t.http().get('/api/method-versions/00000000-0000-4000-8000-000000000000/import-mapping').set(bearer(analyst)).expect(404);
  });
});
