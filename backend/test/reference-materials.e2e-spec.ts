import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ReferenceMaterialsService } from '../src/reference-materials/reference-materials.service.js';
import { binary, tokensFor } from './support/flows.js';
import { bearer, queryDatabase } from './support/review-fixtures.js';
import { createTestApp, DEMO, type TestApp } from './support/test-app.js';

const UNKNOWN_ID = '00000000-0000-4000-8000-000000000000';
const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);
/** The smallest file that starts as a PDF does; the server checks the signature, not the whole structure. */
const PDF = Buffer.from('%PDF-1.4\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n', 'latin1');

const material = (extra: Record<string, unknown> = {}) => ({
  name: 'Copper wire, 99.99 %',
  analyte: 'Copper',
  supplier: 'Westmoor Metals',
  lot: `WM-${Math.random().toString(36).slice(2, 8)}`,
  certificateNumber: 'WM-CU-118',
  valueKind: 'purity',
  certifiedValue: 0.9999,
  unit: 'g/g',
  expandedUncertainty: 0.0001,
  coverageFactor: 2,
  receivedOn: day(-10),
  expiresOn: day(400),
  storage: 'Dry, room temperature',
  ...extra,
});

describe('reference materials register', () => {
  let t: TestApp;
  let analyst: string;
  let reviewer: string;
  let quality: string;
  let admin: string;
  const count = async () => (await queryDatabase<{ n: number }>(t, 'SELECT COUNT(*) AS n FROM reference_materials'))[0].n;
  const auditOf = (id: string) =>
    queryDatabase<{ action: string; reason: string | null; changes: string }>(
      t,
      'SELECT action, reason, changes FROM audit_entries WHERE entity_id = ? ORDER BY seq',
      id,
    );
  const create = async (extra: Record<string, unknown> = {}) =>
    (await t.http().post('/api/reference-materials').set(bearer(quality)).send(material(extra)).expect(201)).body;

  beforeAll(async () => {
    t = await createTestApp();
    [analyst, reviewer, quality, admin] = await tokensFor(t, DEMO.analyst, DEMO.reviewer, DEMO.quality, DEMO.admin);
  });
  afterAll(() => t.close());

  it('should refuse every route without a sign-in (401)', async () => {
    await t.http().get('/api/reference-materials').expect(401);
    await t.http().get('/api/reference-materials/expiring').expect(401);
    await t.http().get(`/api/reference-materials/${UNKNOWN_ID}`).expect(401);
    await t.http().post('/api/reference-materials').send(material()).expect(401);
    await t.http().patch(`/api/reference-materials/${UNKNOWN_ID}`).send({ lockVersion: 1 }).expect(401);
    await t.http().post(`/api/reference-materials/${UNKNOWN_ID}/withdraw`).send({ reason: 'x', lockVersion: 1 }).expect(401);
    await t.http().put(`/api/reference-materials/${UNKNOWN_ID}/certificate`).expect(401);
    await t.http().get(`/api/reference-materials/${UNKNOWN_ID}/certificate`).expect(401);
  });

  it('should list the register with status words and expiry for every signed-in role', async () => {
    for (const token of [analyst, reviewer, quality, admin]) {
      const res = await t.http().get('/api/reference-materials').set(bearer(token)).expect(200);
      expect(res.body.length).toBeGreaterThanOrEqual(3);
    }
    const list = (await t.http().get('/api/reference-materials').set(bearer(analyst)).expect(200)).body as {
      name: string;
      status: string;
      expiringSoon: boolean;
      daysToExpiry: number;
      standardUncertainty: number;
    }[];
    const nitrate = list.find((m) => m.name === 'Sodium nitrate, dried')!;
    expect(nitrate).toMatchObject({ status: 'in-use', expiringSoon: true, daysToExpiry: 18, standardUncertainty: 0.0004 });
    const cadmium = list.find((m) => m.name.startsWith('Cadmium'))!;
    // u = U/k with k = 2 (GUM 6.2.1, the certificate's expanded uncertainty divided by its coverage factor).
    expect(cadmium.standardUncertainty).toBeCloseTo(0.00006, 12);
    expect(cadmium.expiringSoon).toBe(false);

    const expiring = (await t.http().get('/api/reference-materials/expiring').set(bearer(reviewer)).expect(200)).body as { name: string }[];
    expect(expiring.map((m) => m.name)).toContain('Sodium nitrate, dried');
    expect(expiring.map((m) => m.name)).not.toContain(cadmium.name);
  });

  it('should read one material and answer 404 for an unknown one', async () => {
    const [first] = (await t.http().get('/api/reference-materials').set(bearer(analyst)).expect(200)).body;
    const res = await t.http().get(`/api/reference-materials/${first.id}`).set(bearer(reviewer)).expect(200);
    expect(res.body.id).toBe(first.id);
    const missing = await t.http().get(`/api/reference-materials/${UNKNOWN_ID}`).set(bearer(analyst)).expect(404);
    expect(missing.body).toMatchObject({ statusCode: 404, message: 'Reference material not found.' });
  });

  it('should let quality managers and administrators register a material, audited, and refuse analysts and reviewers (403)', async () => {
    const before = await count();
    await t.http().post('/api/reference-materials').set(bearer(analyst)).send(material()).expect(403);
    await t.http().post('/api/reference-materials').set(bearer(reviewer)).send(material()).expect(403);
    expect(await count()).toBe(before);

    const created = await create();
    expect(created).toMatchObject({ status: 'in-use', lockVersion: 1, unit: 'g/g', certificate: null, standardUncertainty: 0.00005 });
    const byAdmin = (await t.http().post('/api/reference-materials').set(bearer(admin)).send(material()).expect(201)).body;
    expect(await count()).toBe(before + 2);
    const [entry] = await auditOf(created.id);
    expect(entry.action).toBe('reference-material.created');
    expect(JSON.parse(entry.changes).lot).toEqual({ from: null, to: created.lot });
    expect((await auditOf(byAdmin.id)).map((e) => e.action)).toEqual(['reference-material.created']);
  });

  it.each([
    ['certifiedValue', { certifiedValue: 1.2 }, 'out_of_range'],
    ['certifiedValue', { certifiedValue: 0 }, 'isPositive'],
    ['unit', { unit: 'mg/kg' }, 'invalid_value'],
    ['expandedUncertainty', { expandedUncertainty: -0.001 }, 'min'],
    ['coverageFactor', { coverageFactor: undefined }, 'required'],
    ['standardUncertainty', { standardUncertainty: 0.0001 }, 'ambiguous'],
    ['expiresOn', { expiresOn: day(-20) }, 'before_received'],
    ['receivedOn', { receivedOn: '2026-02-30' }, 'invalid_date'],
    ['receivedOn', { receivedOn: '12/01/2026' }, 'matches'],
    ['openedOn', { openedOn: day(-30) }, 'before_received'],
    ['name', { name: '   ' }, 'minLength'],
    ['valueKind', { valueKind: 'solution' }, 'isIn'],
    ['storage', { storage: 'x'.repeat(501) }, 'maxLength'],
  ])('should refuse a bad %s with 422 and save nothing (%j)', async (field, extra, code) => {
    const before = await count();
    const res = await t.http().post('/api/reference-materials').set(bearer(quality)).send(material(extra)).expect(422);
    expect(res.body.errors).toContainEqual(expect.objectContaining({ field, code }));
    expect(await count()).toBe(before);
  });

  it('should accept a content with a stated standard uncertainty and refuse a duplicate lot (409)', async () => {
    const body = material({
      valueKind: 'content',
      certifiedValue: 998.2,
      unit: 'mg/L',
      expandedUncertainty: null,
      coverageFactor: null,
      standardUncertainty: 1.1,
    });
    const created = (await t.http().post('/api/reference-materials').set(bearer(quality)).send(body).expect(201)).body;
    expect(created).toMatchObject({ valueKind: 'content', unit: 'mg/L', standardUncertainty: 1.1 });
    const duplicate = await t.http().post('/api/reference-materials').set(bearer(quality)).send(body).expect(409);
    expect(duplicate.body.errors[0]).toMatchObject({ field: 'lot', code: 'duplicate' });
  });

  it('should update with the lock version, audit old and new values, and refuse a stale one (409)', async () => {
    const created = await create();
    await t.http().patch(`/api/reference-materials/${created.id}`).set(bearer(analyst)).send({ lockVersion: 1, storage: 'x' }).expect(403);
    const updated = (
      await t
        .http()
        .patch(`/api/reference-materials/${created.id}`)
        .set(bearer(quality))
        .send({ lockVersion: 1, openedOn: day(-2), storage: 'Desiccator' })
        .expect(200)
    ).body;
    expect(updated).toMatchObject({ lockVersion: 2, openedOn: day(-2), storage: 'Desiccator' });
    const stale = await t
      .http()
      .patch(`/api/reference-materials/${created.id}`)
      .set(bearer(quality))
      .send({ lockVersion: 1, storage: 'Fridge' })
      .expect(409);
    expect(stale.body.message).toMatch(/reload/);
    const bad = await t
      .http()
      .patch(`/api/reference-materials/${created.id}`)
      .set(bearer(quality))
      .send({ lockVersion: 2, certifiedValue: 3 })
      .expect(422);
    expect(bad.body.errors[0]).toMatchObject({ field: 'certifiedValue', code: 'out_of_range' });
    await t.http().patch(`/api/reference-materials/${created.id}`).set(bearer(quality)).send({ lockVersion: 2, name: null }).expect(422);
    await t.http().patch(`/api/reference-materials/${created.id}`).set(bearer(quality)).send({ storage: 'no lock' }).expect(422);
    await t.http().patch(`/api/reference-materials/${UNKNOWN_ID}`).set(bearer(quality)).send({ lockVersion: 1 }).expect(404);
    const entries = await auditOf(created.id);
    expect(entries.map((e) => e.action)).toEqual(['reference-material.created', 'reference-material.updated']);
    expect(JSON.parse(entries[1].changes).storage).toEqual({ from: 'Dry, room temperature', to: 'Desiccator' });
  });

  it('should withdraw with a reason, audited, and keep a withdrawn material as it is', async () => {
    const created = await create();
    await t
      .http()
      .post(`/api/reference-materials/${created.id}/withdraw`)
      .set(bearer(analyst))
      .send({ reason: 'x', lockVersion: 1 })
      .expect(403);
    const noReason = await t
      .http()
      .post(`/api/reference-materials/${created.id}/withdraw`)
      .set(bearer(quality))
      .send({ reason: ' ', lockVersion: 1 })
      .expect(422);
    expect(noReason.body.errors[0].field).toBe('reason');
    await t
      .http()
      .post(`/api/reference-materials/${created.id}/withdraw`)
      .set(bearer(quality))
      .send({ reason: 'Cracked bottle', lockVersion: 7 })
      .expect(409);
    await t
      .http()
      .post(`/api/reference-materials/${UNKNOWN_ID}/withdraw`)
      .set(bearer(quality))
      .send({ reason: 'x', lockVersion: 1 })
      .expect(404);
    const withdrawn = (
      await t
        .http()
        .post(`/api/reference-materials/${created.id}/withdraw`)
        .set(bearer(admin))
        .send({ reason: 'Cracked bottle', lockVersion: 1 })
        .expect(200)
    ).body;
    expect(withdrawn).toMatchObject({ status: 'withdrawn', withdrawnReason: 'Cracked bottle', lockVersion: 2 });
    await t.http().patch(`/api/reference-materials/${created.id}`).set(bearer(quality)).send({ lockVersion: 2, storage: 'x' }).expect(409);
    await t
      .http()
      .post(`/api/reference-materials/${created.id}/withdraw`)
      .set(bearer(quality))
      .send({ reason: 'again', lockVersion: 2 })
      .expect(409);
    const last = (await auditOf(created.id)).at(-1)!;
    expect(last).toMatchObject({ action: 'reference-material.withdrawn', reason: 'Cracked bottle' });
  });

  it('should store the certificate PDF, give the same bytes back, and refuse what is not a PDF', async () => {
    const created = await create();
    const url = `/api/reference-materials/${created.id}/certificate`;
    await t.http().get(url).set(bearer(analyst)).expect(404);
    await t.http().put(url).set(bearer(analyst)).field('lockVersion', '1').attach('file', PDF, 'cert.pdf').expect(403);
    const notPdf = await t
      .http()
      .put(url)
      .set(bearer(quality))
      .field('lockVersion', '1')
      .attach('file', Buffer.from('GIF89a…'), 'cert.pdf')
      .expect(422);
    expect(notPdf.body.errors[0]).toMatchObject({ field: 'file', code: 'not_pdf' });
    const noFile = await t.http().put(url).set(bearer(quality)).field('lockVersion', '1').expect(422);
    expect(noFile.body.errors[0]).toMatchObject({ field: 'file', code: 'required' });
    await t.http().put(url).set(bearer(quality)).field('lockVersion', '5').attach('file', PDF, 'cert.pdf').expect(409);
    const tooLarge = Buffer.concat([PDF, Buffer.alloc(10 * 1024 * 1024)]);
    await t.http().put(url).set(bearer(quality)).field('lockVersion', '1').attach('file', tooLarge, 'big.pdf').expect(413);
    await t
      .http()
      .put(`/api/reference-materials/${UNKNOWN_ID}/certificate`)
      .set(bearer(quality))
      .field('lockVersion', '1')
      .attach('file', PDF, 'c.pdf')
      .expect(404);

    const uploaded = (
      await t.http().put(url).set(bearer(quality)).field('lockVersion', '1').attach('file', PDF, 'Certificate WM-CU.pdf').expect(200)
    ).body;
    expect(uploaded.certificate).toMatchObject({ fileName: 'Certificate WM-CU.pdf', sizeBytes: PDF.length });
    const download = await t.http().get(url).set(bearer(reviewer)).buffer(true).parse(binary).expect(200);
    expect(download.headers['content-type']).toBe('application/pdf');
    expect(Buffer.compare(download.body as Buffer, PDF)).toBe(0);
    expect((await auditOf(created.id)).at(-1)!.action).toBe('reference-material.certificate-uploaded');
    await t.http().get(`/api/reference-materials/${UNKNOWN_ID}/certificate`).set(bearer(analyst)).expect(404);
  });

  it('should e-mail the quality managers once per material entering its last 30 days', async () => {
    const service = t.app.get(ReferenceMaterialsService);
    const soon = await create({ name: 'Zinc shot', expiresOn: day(10) });
    await service.sendExpiryNotices();
    expect(await service.sendExpiryNotices()).toBe(0);
    const subjectOf = (name: string, days: number) => `Reference material expires in ${days} days: ${name}, lot`;
    const mails = async (prefix: string) => {
      for (let i = 0; i < 50; i++) {
        const outbox = (await t.http().get('/api/outbox').set(bearer(admin)).expect(200)).body as { subject: string; to: string[] }[];
        const found = outbox.filter((m) => m.subject.startsWith(prefix));
        if (found.length) return found;
        await new Promise((resolve) => setTimeout(resolve, 100));
      }
      return [];
    };
    const zinc = await mails(subjectOf('Zinc shot', 10));
    expect(zinc).toHaveLength(1);
    expect(zinc[0].to).toEqual([DEMO.quality]);
    const nitrate = await mails(subjectOf('Sodium nitrate, dried', 18));
    expect(nitrate).toHaveLength(1);
    expect((await auditOf(soon.id)).map((e) => e.action)).toContain('reference-material.expiry-notice-sent');
  });
});
