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

  it('should keep the audit chain intact on PostgreSQL', async () => {
    const token = await t.tokenFor(DEMO.quality);
    const verify = await t.http().get('/api/audit/verify').set('Authorization', `Bearer ${token}`).expect(200);
    expect(verify.body.ok).toBe(true);
  });
});
