import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEntry } from '../src/audit/audit-entry.entity.js';
import { ValidationStudy } from '../src/studies/validation-study.entity.js';
import { bearer, createStudy, dataSourceOf, withDatabase } from './support/review-fixtures.js';
import { createTestApp, DEMO, DEMO_PASSWORD, type TestApp } from './support/test-app.js';

describe('the audit trail and signature integrity', () => {
  let t: TestApp;
  let quality: Record<string, string>;
  let studyId: string;

  beforeAll(async () => {
    t = await createTestApp();
    quality = bearer(await t.tokenFor(DEMO.quality));
    const analyst = bearer(await t.tokenFor(DEMO.analyst));
    const reviewer = bearer(await t.tokenFor(DEMO.reviewer));
    const study = await createStudy(t, { author: DEMO.analyst });
    studyId = study.id;
    await t.http().post(`/api/studies/${study.id}/submit`).set(analyst).send({ password: 'wrong-password' }).expect(401);
    await t.http().post(`/api/studies/${study.id}/submit`).set(analyst).send({ password: DEMO_PASSWORD }).expect(200);
    await t
      .http()
      .post(`/api/studies/${study.id}/comments`)
      .set(reviewer)
      .send({ section: 'standards', body: 'Residuals look even across the range.' })
      .expect(201);
    await t.http().post(`/api/studies/${study.id}/approve`).set(reviewer).send({ password: DEMO_PASSWORD }).expect(200);
  });
  afterAll(() => t.close());

  it('should refuse the chain check to anonymous callers (401) and analysts (403)', async () => {
    await t.http().get('/api/audit/verify').expect(401);
    await t
      .http()
      .get('/api/audit/verify')
      .set(bearer(await t.tokenFor(DEMO.analyst)))
      .expect(403);
  });

  it('should record each step of the review with the actor, the status change and the failed signature', async () => {
    const trail = await t.http().get(`/api/audit?record=study:${studyId}`).set(quality).expect(200);
    const study = trail.body.items.filter((e: { entity: string }) => e.entity === 'study');
    expect(study.map((e: { action: string }) => e.action).reverse()).toEqual(['signature.failed', 'study.submitted', 'study.approved']);
    expect(study[0]).toMatchObject({ actorName: 'Priya Nair', changes: { status: { from: 'submitted', to: 'approved' } } });
    const ofStudy = trail.body.items.filter((e: { entity: string }) => e.entity === 'study-signature');
    expect(ofStudy.map((e: { action: string }) => e.action).sort()).toEqual(['signature.authored', 'signature.reviewed-and-approved']);
  });

  it('should report the chain intact after the review', async () => {
    const res = await t.http().get('/api/audit/verify').set(quality).expect(200);
    expect(res.body).toEqual({ ok: true, rows: expect.any(Number) });
    expect(res.body.rows).toBeGreaterThanOrEqual(9);
  });

  it('should refuse to change or delete an audit entry through the repository', async () => {
    const repo = dataSourceOf(t).getRepository(AuditEntry);
    const entry = await repo.findOneByOrFail({ seq: 3 });
    await expect(repo.save({ ...entry, reason: 'edited afterwards' })).rejects.toThrow(/append-only/);
    await expect(repo.remove(entry)).rejects.toThrow(/append-only/);
    expect((await repo.findOneByOrFail({ seq: 3 })).reason).toBe(entry.reason);
    const res = await t.http().get('/api/audit/verify').set(quality).expect(200);
    expect(res.body.ok).toBe(true);
  });

  it('should show the signatures as broken when the study data are changed behind the API', async () => {
    const before = await t.http().get(`/api/studies/${studyId}/signatures`).set(quality).expect(200);
    expect(before.body.map((s: { valid: boolean }) => s.valid)).toEqual([true, true]);

    await withDatabase(t, async (db) => {
      const row = (await db.get<{ data: string }>('SELECT data FROM validation_studies WHERE id = ?', studyId))!;
      const data = JSON.parse(row.data) as { standards: { x: number; y: number }[] };
      data.standards[4].y = Number((data.standards[4].y + 0.01).toFixed(4));
      expect(await db.run('UPDATE validation_studies SET data = ? WHERE id = ?', JSON.stringify(data), studyId)).toBe(1);
    });

    const after = await t.http().get(`/api/studies/${studyId}/signatures`).set(quality).expect(200);
    expect(after.body.map((s: { valid: boolean }) => s.valid)).toEqual([false, false]);
    const history = await t.http().get(`/api/studies/${studyId}/history`).set(quality).expect(200);
    expect(
      history.body.filter((item: { kind: string }) => item.kind === 'signature').map((item: { valid: boolean }) => item.valid),
    ).toEqual([false, false]);
  });

  it('should report the chain broken at the row edited directly in the database file', async () => {
    expect(await withDatabase(t, (db) => db.run("UPDATE audit_entries SET reason = 'x' WHERE seq = 3"))).toBe(1);
    const res = await t.http().get('/api/audit/verify').set(quality).expect(200);
    expect(res.body).toMatchObject({ ok: false, brokenAt: 3, reason: 'content does not match its hash' });
  });
});

describe('the demo review trail', () => {
  let t: TestApp;

  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('should give every seeded study past the draft stage valid signatures and history, with the audit chain intact', async () => {
    const quality = bearer(await t.tokenFor(DEMO.quality));
    const studies = await dataSourceOf(t).getRepository(ValidationStudy).find();
    const reviewed = studies.filter((study) => study.status !== 'draft');
    expect(reviewed.length).toBeGreaterThan(0);
    for (const study of reviewed) {
      const signatures = (await t.http().get(`/api/studies/${study.id}/signatures`).set(quality).expect(200)).body as {
        meaning: string;
        valid: boolean;
      }[];
      expect(signatures[0].meaning).toBe('authored');
      expect(signatures.every((signature) => signature.valid)).toBe(true);
      if (study.status === 'approved') expect(signatures.map((signature) => signature.meaning)).toContain('reviewed-and-approved');
      const history = (await t.http().get(`/api/studies/${study.id}/history`).set(quality).expect(200)).body as {
        kind: string;
        action: string;
      }[];
      expect(history.filter((item) => item.kind === 'status').map((item) => item.action)[0]).toBe('study.submitted');
      if (study.status === 'returned') expect(history.map((item) => item.action)).toContain('study.returned');
    }
    const verify = await t.http().get('/api/audit/verify').set(quality).expect(200);
    expect(verify.body).toMatchObject({ ok: true });
  });
});
