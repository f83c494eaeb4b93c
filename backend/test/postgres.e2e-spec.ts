import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { TestApp } from './support/test-app.js';

const serverUrl = process.env.TEST_POSTGRES_URL;

describe.skipIf(!serverUrl)('the same entities, migrations and seeds on PostgreSQL', () => {
  const database = `meritline_e2e_${Date.now()}`;
  let t: TestApp;
  let DEMO: typeof import('./support/test-app.js').DEMO;

  beforeAll(async () => {
    const admin = new pg.Client({ connectionString: serverUrl });
    await admin.connect();
    await admin.query(`CREATE DATABASE ${database}`);
    await admin.end();
    const url = new URL(serverUrl!);
    url.pathname = `/${database}`;
    process.env.DATABASE_URL = url.toString();
    // Entities read DATABASE_URL at import time (binary column type), so import after setting it.
    const support = await import('./support/test-app.js');
    DEMO = support.DEMO;
    t = await support.createTestApp({ DATABASE_URL: url.toString() });
  }, 120_000);

  afterAll(async () => {
    await t?.close();
    const admin = new pg.Client({ connectionString: serverUrl });
    await admin.connect();
    await admin.query(`DROP DATABASE IF EXISTS ${database} WITH (FORCE)`);
    await admin.end();
  });

  it('should run every migration, seed the demo data and sign in', async () => {
    const token = await t.tokenFor(DEMO.admin);
    const users = await t.http().get('/api/users').set('Authorization', `Bearer ${token}`).expect(200);
    expect(users.body.length).toBeGreaterThanOrEqual(5);
  });

  it('should serve the seeded methods and studies', async () => {
    const token = await t.tokenFor(DEMO.analyst);
    const methods = await t.http().get('/api/methods').set('Authorization', `Bearer ${token}`).expect(200);
    expect(methods.body.length).toBeGreaterThanOrEqual(3);
    const studies = await t.http().get('/api/studies?pageSize=50').set('Authorization', `Bearer ${token}`).expect(200);
    expect(studies.body.total).toBeGreaterThan(0);
    const runs = await t.http().get('/api/runs').set('Authorization', `Bearer ${token}`).expect(200);
    expect(runs.body.total).toBeGreaterThan(0);
  });

  it('should keep reference materials with their numbers and certificate bytes, and save a preparation', async () => {
    const quality = { Authorization: `Bearer ${await t.tokenFor(DEMO.quality)}` };
    const analyst = { Authorization: `Bearer ${await t.tokenFor(DEMO.analyst)}` };
    const materials = (await t.http().get('/api/reference-materials').set(analyst).expect(200)).body as {
      id: string;
      analyte: string;
      certifiedValue: number;
      lockVersion: number;
    }[];
    const cadmium = materials.find((m) => m.analyte === 'Cadmium')!;
    expect(typeof cadmium.certifiedValue).toBe('number');
    const pdf = Buffer.from('%PDF-1.4\n%%EOF\n', 'latin1');
    await t
      .http()
      .put(`/api/reference-materials/${cadmium.id}/certificate`)
      .set(quality)
      .field('lockVersion', String(cadmium.lockVersion))
      .attach('file', pdf, 'c.pdf')
      .expect(200);
    const back = await t
      .http()
      .get(`/api/reference-materials/${cadmium.id}/certificate`)
      .set(analyst)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      })
      .expect(200);
    expect(Buffer.compare(back.body as Buffer, pdf)).toBe(0);
    const stock = { mass: 50, uMass: 0.05, massUnit: 'mg', volume: 50, volumeTolerance: 0.06, volumeDistribution: 'triangular' };
    const saved = await t
      .http()
      .post('/api/preparations')
      .set(analyst)
      .send({ name: 'On PostgreSQL', source: { materialId: cadmium.id }, stock, steps: [] })
      .expect(201);
    expect(saved.body.result.stock.concentration).toBeCloseTo(1000 * cadmium.certifiedValue, 9);
  });

  it('should keep the audit chain intact on PostgreSQL', async () => {
    const token = await t.tokenFor(DEMO.quality);
    const verify = await t.http().get('/api/audit/verify').set('Authorization', `Bearer ${token}`).expect(200);
    expect(verify.body.ok).toBe(true);
  });

  it('should filter, scope and page the audit trail, run the self-qualification and build the overview on PostgreSQL', async () => {
    const quality = { Authorization: `Bearer ${await t.tokenFor(DEMO.quality)}` };
    const analyst = { Authorization: `Bearer ${await t.tokenFor(DEMO.analyst)}` };
    const studies = await t.http().get('/api/studies?pageSize=50').set(analyst).expect(200);
    const study = studies.body.items[0] as { id: string };
    const today = new Date().toISOString().slice(0, 10);
    const filtered = await t
      .http()
      .get(`/api/audit?record=study:${study.id}&from=${today}&to=${today}&q=study&pageSize=5`)
      .set(quality)
      .expect(200);
    expect(filtered.body.record).toMatchObject({ kind: 'study', id: study.id });
    const scoped = await t.http().get('/api/audit?pageSize=200').set(analyst).expect(200);
    expect(scoped.body.total).toBeGreaterThan(0);
    await t.http().get('/api/audit/people').set(analyst).expect(200);
    const me = (await t.http().get('/api/auth/me').set(analyst).expect(200)).body.id as string;
    const items = studies.body.items as { id: string; author: { id: string } }[];
    const own = items.find((s) => s.author.id === me);
    const other = items.find((s) => s.author.id !== me);
    if (own) await t.http().get(`/api/audit?record=study:${own.id}`).set(analyst).expect(200);
    if (other) await t.http().get(`/api/audit?record=study:${other.id}`).set(analyst).expect(403);
    expect(own && other).toBeTruthy();
    const paged = await t.http().get('/api/audit?pageSize=3').set(quality).expect(200);
    await t.http().get(`/api/audit?pageSize=3&cursor=${paged.body.nextCursor}`).set(quality).expect(200);
    await t.http().get('/api/audit/export?format=csv').set(quality).expect(200);
    await t.http().post('/api/qualification').set(quality).expect(201);
    const overview = await t.http().get('/api/overview').set(quality).expect(200);
    expect(overview.body).toHaveProperty('justifiedApprovals');
  });
});
