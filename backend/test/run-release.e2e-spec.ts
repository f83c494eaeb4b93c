import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { StudyInput } from '@meritline/shared';
import {
  addValidatedVersion,
  bearer,
  outboxMessages,
  postRun,
  releaseRun,
  runAction,
  sqlQuery,
  submitRun,
  tokensFor,
} from './support/flows.js';
import { queryDatabase } from './support/review-fixtures.js';
import { createTestApp, DEMO, DEMO_PASSWORD, type TestApp } from './support/test-app.js';

/*
 * Standards: the fluorescence example of Miller & Miller, Statistics and Chemometrics for Analytical
 * Chemistry (x 0–12 pg/ml), as in runs.e2e-spec.ts; check standards and unknowns are invented.
 */
const X = [0, 2, 4, 6, 8, 10, 12];
const Y = [2.1, 5.0, 9.0, 12.6, 17.3, 21.0, 24.7];
const pairs = X.map((x, i) => ({ x, y: Y[i] }));

describe('second-person release of routine runs', () => {
  let t: TestApp;
  let analyst: string;
  let analyst2: string;
  let reviewer: string;
  let quality: string;
  let versionId: string;
  const query = <T>(sql: string, parameters: unknown[] = []): Promise<T[]> => queryDatabase<T>(t, sql, ...parameters);

  const runInput = (title: string, checkY = 13.1) => ({
    methodVersionId: versionId,
    title,
    data: {
      model: 'linear',
      standards: pairs,
      checks: [{ id: 'CCV-1', nominal: 6, y: [checkY] }],
      unknowns: [{ id: 'S-1', y: [13.5, 13.5] }],
    },
  });
  async function newRun(title: string, checkY?: number, token = analyst): Promise<{ id: string; status: string }> {
    return (await postRun(t, token, runInput(title, checkY)).expect(201)).body;
  }
  const review = async (id: string) => (await t.http().get(`/api/runs/${id}/review`).set(bearer(analyst)).expect(200)).body;
  const act = (id: string, action: string, token: string, body: object) => runAction(t, id, action, token, body);
  async function submitted(title: string, checkY?: number) {
    const run = await newRun(title, checkY);
    return { id: run.id, version: await submitRun(t, run.id, analyst) };
  }
  async function released(title: string) {
    const run = await submitted(title);
    return { id: run.id, version: await releaseRun(t, run.id, reviewer, run.version) };
  }
  const auditOf = (id: string) =>
    query<{ action: string; reason: string | null }>('select action, reason from audit_entries where entity_id = ? order by seq', [id]);

  beforeAll(async () => {
    t = await createTestApp();
    [analyst, analyst2, reviewer, quality] = await tokensFor(t, DEMO.analyst, DEMO.analyst2, DEMO.reviewer, DEMO.quality);
    const study: StudyInput = { model: 'linear', units: { x: 'pg/ml', y: 'intensity' }, standards: pairs };
    const version = await addValidatedVersion(t, {
      name: 'Fluorescein',
      method: { analyte: 'fluorescein', technique: 'fluorimetry', xUnit: 'pg/ml', yUnit: 'intensity' },
      study,
    });
    versionId = version.id;
  });
  afterAll(async () => {
    await t?.close();
  });

  it('should start a new run as calculated, unsigned and not exportable', async () => {
    const run = await newRun('Batch 1');
    expect(run.status).toBe('accepted');
    expect(await review(run.id)).toMatchObject({ reviewStatus: 'calculated', lockVersion: 1, signatures: [], supersededById: null });
    const res = await t.http().get(`/api/runs/${run.id}/export?format=csv`).set(bearer(analyst)).expect(409);
    expect(res.body.message).toMatch(/only after a second person has released the run/);
  });

  it('should let the analyst submit with a performed signature, notify reviewers and put the run in the queue', async () => {
    const run = await newRun('Batch 2');
    await act(run.id, 'submit', analyst, { password: 'wrong password', version: 1 }).expect(401);
    expect((await review(run.id)).reviewStatus).toBe('calculated');
    const res = await act(run.id, 'submit', analyst, { password: DEMO_PASSWORD, version: 1 }).expect(200);
    expect(res.body).toMatchObject({ reviewStatus: 'submitted', lockVersion: 2 });
    expect(res.body.signatures).toEqual([
      expect.objectContaining({
        signerName: 'Alma Ruiz',
        meaning: 'performed',
        signerRole: 'analyst',
        valid: true,
        signedAt: expect.any(String),
      }),
    ]);
    expect((await auditOf(run.id)).map((a) => a.action)).toEqual(['run.created', 'signature.failed', 'run.submitted']);
    const mails = await outboxMessages(t, 'Run awaiting release: Batch 2');
    expect(mails.map((m) => JSON.parse(m.to_addresses)[0]).sort()).toEqual([DEMO.quality, DEMO.reviewer].sort());
    expect(mails[0].text).toContain(`/runs/${run.id}`);
    const notices = await t.http().get('/api/notifications').set(bearer(reviewer)).expect(200);
    expect(JSON.stringify(notices.body)).toContain('submitted the run “Batch 2” for release');

    const queue = await t.http().get('/api/reviews/queue').set(bearer(reviewer)).expect(200);
    expect(queue.body.items).toContainEqual(
      expect.objectContaining({ kind: 'run', id: run.id, status: 'submitted', verdict: 'accepted', authorName: 'Alma Ruiz' }),
    );
    const onlyRuns = await t.http().get('/api/reviews/queue?kind=run').set(bearer(reviewer)).expect(200);
    expect(onlyRuns.body.items.every((item: { kind: string }) => item.kind === 'run')).toBe(true);
    const onlyStudies = await t.http().get('/api/reviews/queue?kind=study').set(bearer(reviewer)).expect(200);
    expect(onlyStudies.body.items.map((item: { id: string }) => item.id)).not.toContain(run.id);
    const bad = await t.http().get('/api/reviews/queue?kind=batch').set(bearer(reviewer)).expect(422);
    expect(bad.body.errors[0].field).toBe('kind');
  });

  it('should refuse submission by someone else and of a run already submitted', async () => {
    const run = await newRun('Batch 3');
    const other = await act(run.id, 'submit', analyst2, { password: DEMO_PASSWORD, version: 1 }).expect(403);
    expect(other.body.message).toMatch(/Only the analyst who performed this run/);
    await act(run.id, 'submit', analyst, { password: DEMO_PASSWORD, version: 1 }).expect(200);
    await act(run.id, 'submit', analyst, { password: DEMO_PASSWORD, version: 2 }).expect(409);
    const missing = await act(run.id, 'submit', analyst, {}).expect(422);
    expect(missing.body.errors.map((e: { field: string }) => e.field).sort()).toEqual(['password', 'version']);
  });

  it('should let a second person release the run with a signature, lock it, e-mail the analyst and allow the export', async () => {
    const run = await submitted('Batch 4');
    const res = await act(run.id, 'release', reviewer, { password: DEMO_PASSWORD, version: run.version }).expect(200);
    expect(res.body).toMatchObject({ reviewStatus: 'released', lockVersion: run.version + 1, releasedAt: expect.any(String) });
    expect(res.body.signatures.map((s: { meaning: string; signerName: string }) => [s.meaning, s.signerName])).toEqual([
      ['performed', 'Alma Ruiz'],
      ['reviewed-and-released', 'Priya Nair'],
    ]);
    expect((await auditOf(run.id)).map((a) => a.action)).toEqual(['run.created', 'run.submitted', 'run.released']);
    const mails = await outboxMessages(t, 'Run released: Batch 4');
    expect(mails.map((m) => JSON.parse(m.to_addresses)[0])).toEqual([DEMO.analyst]);
    const csv = await t.http().get(`/api/runs/${run.id}/export?format=csv`).set(bearer(analyst)).expect(200);
    expect(csv.text).toContain('S-1');
    const queue = await t.http().get('/api/reviews/queue?kind=run').set(bearer(reviewer)).expect(200);
    expect(queue.body.items.map((item: { id: string }) => item.id)).not.toContain(run.id);

    const again = await act(run.id, 'release', quality, { password: DEMO_PASSWORD, version: run.version }).expect(409);
    expect(again.body.message).toMatch(/already released/);
    await act(run.id, 'return', quality, { password: DEMO_PASSWORD, version: run.version + 1, comment: 'Too late' }).expect(409);
    await act(run.id, 'submit', analyst, { password: DEMO_PASSWORD, version: run.version + 1 }).expect(409);
  });

  it('should refuse self-release (403), release by an analyst (403) and a stale lock version (409)', async () => {
    const run = await newRun('Batch 5');
    const sub = await act(run.id, 'submit', analyst, { password: DEMO_PASSWORD, version: 1 }).expect(200);
    const wrongRole = await act(run.id, 'release', analyst2, { password: DEMO_PASSWORD, version: sub.body.lockVersion }).expect(403);
    expect(wrongRole.body.statusCode).toBe(403);

    // A user with both roles performs and submits a run, then tries to release it.
    await query(`update users set roles = ? where email = ?`, [JSON.stringify(['analyst', 'reviewer']), DEMO.analyst2]);
    const both = await t.http().post('/api/auth/login').send({ email: DEMO.analyst2, password: DEMO_PASSWORD }).expect(200);
    const own = await newRun('Batch 5b', undefined, both.body.accessToken);
    const ownSub = await act(own.id, 'submit', both.body.accessToken, { password: DEMO_PASSWORD, version: 1 }).expect(200);
    const self = await act(own.id, 'release', both.body.accessToken, { password: DEMO_PASSWORD, version: ownSub.body.lockVersion }).expect(
      403,
    );
    expect(self.body.message).toMatch(/You performed this run, so you cannot release it/);
    const ownQueue = await t.http().get('/api/reviews/queue?kind=run').set(bearer(both.body.accessToken)).expect(200);
    expect(ownQueue.body.items.map((item: { id: string }) => item.id)).not.toContain(own.id);
    await query(`update users set roles = ? where email = ?`, [JSON.stringify(['analyst']), DEMO.analyst2]);

    const stale = await act(run.id, 'release', reviewer, { password: DEMO_PASSWORD, version: 1 }).expect(409);
    expect(stale.body.message).toMatch(/changed since you opened it/);
    expect((await review(run.id)).reviewStatus).toBe('submitted');
  });

  it('should refuse to release a run its check standards rejected (422 with the reason)', async () => {
    const run = await submitted('Batch 6 rejected', 20);
    expect((await t.http().get(`/api/runs/${run.id}`).set(bearer(analyst)).expect(200)).body.status).toBe('rejected');
    const res = await act(run.id, 'release', reviewer, { password: DEMO_PASSWORD, version: run.version }).expect(422);
    expect(res.body.message).toMatch(/rejected by its check standards/);
    expect(res.body.errors[0]).toMatchObject({ field: 'status', code: 'rejected' });
    expect((await review(run.id)).reviewStatus).toBe('submitted');
    const exported = await t.http().get(`/api/runs/${run.id}/export?format=csv`).set(bearer(analyst)).expect(409);
    expect(exported.body.message).toMatch(/released/);
  });

  it('should return a run only with a comment, tell the analyst why and let them submit it again', async () => {
    const run = await submitted('Batch 7');
    const noComment = await act(run.id, 'return', reviewer, { password: DEMO_PASSWORD, version: run.version, comment: '  ' }).expect(422);
    expect(noComment.body.errors[0].field).toBe('comment');
    const res = await act(run.id, 'return', reviewer, {
      password: DEMO_PASSWORD,
      version: run.version,
      comment: 'Check the dilution of S-1.',
    }).expect(200);
    expect(res.body).toMatchObject({ reviewStatus: 'returned', returnComment: 'Check the dilution of S-1.' });
    const audit = await auditOf(run.id);
    expect(audit.at(-1)).toEqual({ action: 'run.returned', reason: 'Check the dilution of S-1.' });
    const mails = await outboxMessages(t, 'Run returned: Batch 7');
    expect(mails[0].text).toContain('Check the dilution of S-1.');
    await t.http().get(`/api/runs/${run.id}/export?format=csv`).set(bearer(analyst)).expect(409);
    const again = await act(run.id, 'submit', analyst, { password: DEMO_PASSWORD, version: res.body.lockVersion }).expect(200);
    expect(again.body.reviewStatus).toBe('submitted');
  });

  it('should replace a released run by a correction with a reason, keeping both', async () => {
    const run = await released('Batch 8');
    const runsBefore = (await sqlQuery<{ n: number }>(t, 'select count(*) as n from runs'))[0].n;
    const noReason = await act(run.id, 'supersede', analyst, runInput('Batch 8 corrected')).expect(422);
    expect(noReason.body.errors.map((e: { field: string }) => e.field)).toEqual(['reason']);
    expect((await sqlQuery<{ n: number }>(t, 'select count(*) as n from runs'))[0].n).toBe(runsBefore);

    const res = await act(run.id, 'supersede', analyst, { ...runInput('Batch 8 corrected'), reason: 'Wrong vial read as S-1.' }).expect(
      201,
    );
    expect(res.body).toMatchObject({ title: 'Batch 8 corrected', status: 'accepted' });
    const correction = await review(res.body.id);
    expect(correction).toMatchObject({ reviewStatus: 'calculated', supersedesId: run.id, supersedeReason: 'Wrong vial read as S-1.' });
    const old = await review(run.id);
    expect(old).toMatchObject({ reviewStatus: 'superseded', supersededById: res.body.id, supersedeReason: 'Wrong vial read as S-1.' });
    expect(old.signatures).toHaveLength(2);
    expect((await auditOf(run.id)).at(-1)).toEqual({ action: 'run.superseded', reason: 'Wrong vial read as S-1.' });
    expect((await auditOf(res.body.id)).map((a) => a.action)).toEqual(['run.created']);
    const exported = await t.http().get(`/api/runs/${run.id}/export?format=csv`).set(bearer(analyst)).expect(409);
    expect(exported.body.message).toMatch(/replaced by a correction/);
    await act(run.id, 'supersede', analyst, { ...runInput('Batch 8 again'), reason: 'Again' }).expect(409);
    await act(res.body.id, 'supersede', analyst, { ...runInput('Not released'), reason: 'Not yet released' }).expect(409);
    await act(run.id, 'supersede', reviewer, { ...runInput('By a reviewer'), reason: 'Wrong role' }).expect(403);
  });

  it('should answer 404 for an unknown run', async () => {
    const unknown = '00000000-0000-4000-8000-000000000000';
    await act(unknown, 'submit', analyst, { password: DEMO_PASSWORD, version: 1 }).expect(404);
    await act(unknown, 'release', reviewer, { password: DEMO_PASSWORD, version: 1 }).expect(404);
    await t.http().get(`/api/runs/${unknown}/review`).set(bearer(analyst)).expect(404);
  });
});
