import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  bearer,
  calibrationData,
  createStudy,
  databaseState,
  dataSourceOf,
  evaluated,
  queryDatabase,
  userId,
} from './support/review-fixtures.js';
import { studyAction } from './support/flows.js';
import { createTestApp, DEMO, DEMO_PASSWORD, type TestApp } from './support/test-app.js';
import { ValidationStudy } from '../src/studies/validation-study.entity.js';

const UNKNOWN_ID = '00000000-0000-4000-8000-000000000000';

interface Mail {
  id: string;
  to: string[];
  subject: string;
  text: string;
}

describe('review and sign-off', () => {
  let t: TestApp;
  const token: Record<keyof typeof DEMO, string> = { analyst: '', analyst2: '', reviewer: '', quality: '', admin: '' };

  const as = (who: keyof typeof DEMO) => bearer(token[who]);
  const act = (id: string, action: string, who: keyof typeof DEMO, body: object) => studyAction(t, id, action, as(who), body);
  const newMail = async (action: () => Promise<unknown>): Promise<Mail[]> => {
    const outbox = async () => (await t.http().get('/api/outbox').set(as('admin')).expect(200)).body as Mail[];
    const seen = new Set((await outbox()).map((m) => m.id));
    await action();
    return (await outbox()).filter((m) => !seen.has(m.id));
  };
  const recipients = (mails: Mail[]) => mails.flatMap((m) => m.to).sort();
  const changeData = async (studyId: string, mutate: (data: ReturnType<typeof calibrationData>) => void) => {
    const data = calibrationData();
    mutate(data);
    await dataSourceOf(t)
      .getRepository(ValidationStudy)
      .update({ id: studyId }, { ...evaluated(data), lockVersion: () => 'lock_version + 1' } as never);
  };

  beforeAll(async () => {
    t = await createTestApp();
    for (const who of Object.keys(DEMO) as (keyof typeof DEMO)[]) token[who] = await t.tokenFor(DEMO[who]);
  });
  afterAll(() => t.close());

  describe('submitting', () => {
    it('should refuse anonymous callers (401), other roles (403), other analysts (403) and unknown studies (404)', async () => {
      const study = await createStudy(t, { author: DEMO.analyst });
      const before = await databaseState(t, study.id);
      await t.http().post(`/api/studies/${study.id}/submit`).send({ password: DEMO_PASSWORD }).expect(401);
      await act(study.id, 'submit', 'reviewer', { password: DEMO_PASSWORD }).expect(403);
      const other = await act(study.id, 'submit', 'analyst2', { password: DEMO_PASSWORD }).expect(403);
      expect(other.body.message).toMatch(/only the author/i);
      await act(UNKNOWN_ID, 'submit', 'analyst', { password: DEMO_PASSWORD }).expect(404);
      await t.http().post('/api/studies/not-a-uuid/submit').set(as('analyst')).send({ password: DEMO_PASSWORD }).expect(400);
      expect(await databaseState(t, study.id)).toEqual(before);
    });

    it('should answer missing or malformed fields with 422 and one message per field', async () => {
      const study = await createStudy(t, { author: DEMO.analyst });
      const before = await databaseState(t, study.id);
      const res = await act(study.id, 'submit', 'analyst', { comment: 'x'.repeat(2001), lockVersion: 0 }).expect(422);
      expect(res.body.errors.map((e: { field: string }) => e.field).sort()).toEqual(['comment', 'lockVersion', 'password']);
      await act(study.id, 'submit', 'analyst', { password: DEMO_PASSWORD, approve: true }).expect(422);
      expect(await databaseState(t, study.id)).toEqual(before);
    });

    it('should refuse a study whose results cannot be computed with 422 listing why', async () => {
      const study = await createStudy(t, { author: DEMO.analyst, withoutResult: true });
      const before = await databaseState(t, study.id);
      const res = await t.http().post(`/api/studies/${study.id}/submit`).set(as('analyst')).send({ password: DEMO_PASSWORD }).expect(422);
      expect(res.body.errors).toEqual([{ field: 'standards', code: 'too_few', message: expect.stringMatching(/at least 3 standards/) }]);
      expect(await databaseState(t, study.id)).toEqual(before);
    });

    it('should refuse a wrong password with 401, sign nothing and record the failed signature', async () => {
      const study = await createStudy(t, { author: DEMO.analyst });
      const before = await databaseState(t, study.id);
      const res = await act(study.id, 'submit', 'analyst', { password: 'not-my-password' }).expect(401);
      expect(res.body.message).toBe('Password not correct; nothing was signed.');
      expect(await databaseState(t, study.id)).toEqual(before);
      const audit = await t.http().get(`/api/audit?record=study:${study.id}`).set(as('quality')).expect(200);
      expect(audit.body.items[0]).toMatchObject({ action: 'signature.failed', actorName: 'Alma Ruiz' });
      await t.http().get('/api/auth/me').set(as('analyst')).expect(200);
    });

    it('should refuse a stale lock version with 409', async () => {
      const study = await createStudy(t, { author: DEMO.analyst });
      const before = await databaseState(t, study.id);
      const res = await act(study.id, 'submit', 'analyst', { password: DEMO_PASSWORD, lockVersion: study.lockVersion + 1 }).expect(409);
      expect(res.body.message).toMatch(/changed since you opened it/);
      expect(await databaseState(t, study.id)).toEqual(before);
    });

    it('should submit with an authored signature, e-mail every reviewer but the author and notify them in the app', async () => {
      const study = await createStudy(t, { author: DEMO.analyst });
      let res: { body: Record<string, unknown> } = { body: {} };
      const mails = await newMail(async () => {
        res = await act(study.id, 'submit', 'analyst', {
          password: DEMO_PASSWORD,
          comment: 'Ready for review.',
          lockVersion: study.lockVersion,
        }).expect(200);
      });
      expect(res.body).toMatchObject({
        status: 'submitted',
        stage: 'review',
        lockVersion: study.lockVersion + 1,
        signature: { meaning: 'authored', signerName: 'Alma Ruiz', signerRole: 'analyst', valid: true, comment: 'Ready for review.' },
      });
      expect(recipients(mails)).toEqual([DEMO.quality, DEMO.reviewer]);
      expect(mails[0].subject).toBe(`Study awaiting review: ${study.title}`);
      expect(mails[0].text).toContain(`/studies/${study.id}`);
      const notices = await t.http().get('/api/notifications').set(as('reviewer')).expect(200);
      expect(notices.body.items[0]).toMatchObject({ kind: 'study.submitted', link: `/studies/${study.id}`, readAt: null });
      const again = await act(study.id, 'submit', 'analyst', { password: DEMO_PASSWORD }).expect(409);
      expect(again.body.message).toMatch(/only a draft or a returned study/);
    });
  });

  describe('returning and approving', () => {
    let study: ValidationStudy;

    beforeAll(async () => {
      study = await createStudy(t, { author: DEMO.analyst });
    });

    it('should refuse to approve or return a draft with 409', async () => {
      const before = await databaseState(t, study.id);
      const approve = await act(study.id, 'approve', 'reviewer', { password: DEMO_PASSWORD }).expect(409);
      expect(approve.body.message).toMatch(/a draft; only a submitted study can be approved/);
      await t.http().post(`/api/studies/${study.id}/return`).set(as('reviewer')).send({ comment: 'Not yet.' }).expect(409);
      expect(await databaseState(t, study.id)).toEqual(before);
    });

    it('should refuse a return without a comment (422), by an analyst (403), anonymously (401) and for an unknown study (404)', async () => {
      await t.http().post(`/api/studies/${study.id}/submit`).set(as('analyst')).send({ password: DEMO_PASSWORD }).expect(200);
      const before = await databaseState(t, study.id);
      const missing = await t.http().post(`/api/studies/${study.id}/return`).set(as('reviewer')).send({}).expect(422);
      expect(missing.body.errors[0]).toMatchObject({ field: 'comment' });
      const blank = await act(study.id, 'return', 'reviewer', { comment: '   ' }).expect(422);
      expect(blank.body.errors[0]).toMatchObject({ field: 'comment', message: 'Say what the author should change before resubmitting.' });
      await act(study.id, 'return', 'analyst', { comment: 'Self-return' }).expect(403);
      await t.http().post(`/api/studies/${study.id}/return`).send({ comment: 'Anonymous' }).expect(401);
      await t.http().post(`/api/studies/${UNKNOWN_ID}/return`).set(as('reviewer')).send({ comment: 'Who?' }).expect(404);
      await t.http().post(`/api/studies/${study.id}/return`).set(as('reviewer')).send({ comment: 'Stale', lockVersion: 1 }).expect(409);
      expect(await databaseState(t, study.id)).toEqual(before);
    });

    it('should return a submitted study to its author with the comment by e-mail and in the app', async () => {
      const comment = 'The 8 mg/L duplicate reads 0.2 % high; re-measure it or give a reason.';
      const mails = await newMail(() => act(study.id, 'return', 'reviewer', { comment }).expect(200));
      expect(recipients(mails)).toEqual([DEMO.analyst]);
      expect(mails[0].subject).toBe(`Study returned for changes: ${study.title}`);
      expect(mails[0].text).toContain(comment);
      const notices = await t.http().get('/api/notifications').set(as('analyst')).expect(200);
      expect(notices.body.items[0]).toMatchObject({ kind: 'study.returned', message: expect.stringContaining(comment) });
      const audit = await t.http().get(`/api/audit?record=study:${study.id}`).set(as('quality')).expect(200);
      expect(audit.body.items[0]).toMatchObject({
        action: 'study.returned',
        changes: { status: { from: 'submitted', to: 'returned' } },
        reason: comment,
      });
    });

    it('should accept the corrected study again and show the difference between the two submissions', async () => {
      await changeData(study.id, (data) => {
        data.standards![9] = { ...data.standards![9], y: 0.9756 };
        data.standards![0] = { ...data.standards![0], excluded: { reason: 'air bubble in the cell' } };
        data.weighting = '1/x';
      });
      const diffBefore = await t.http().get(`/api/studies/${study.id}/diff`).set(as('reviewer')).expect(200);
      expect(diffBefore.body).toEqual({});
      await act(study.id, 'submit', 'analyst', { password: DEMO_PASSWORD, comment: 'Re-measured the top standard.' }).expect(200);
      const diff = await t.http().get(`/api/studies/${study.id}/diff`).set(as('reviewer')).expect(200);
      expect(diff.body.settings).toEqual([{ field: 'weighting', from: 'none', to: '1/x' }]);
      const standards = diff.body.sections.find((s: { section: string }) => s.section === 'standards');
      expect(standards.changed).toEqual(
        expect.arrayContaining([
          { key: '#10', field: 'y', from: expect.any(Number), to: 0.9756 },
          { key: '#1', field: 'excluded', from: null, to: { reason: 'air bubble in the cell' } },
        ]),
      );
      expect(standards.added).toEqual([]);
      const signatures = await t.http().get(`/api/studies/${study.id}/signatures`).set(as('reviewer')).expect(200);
      expect(
        signatures.body.map((s: { meaning: string; valid: boolean; superseded: boolean }) => [s.meaning, s.valid, s.superseded]),
      ).toEqual([
        ['authored', true, true],
        ['authored', true, false],
      ]);
    });

    it('should refuse the approval of a study by its author whatever roles the author holds (403)', async () => {
      const admin = as('admin');
      const analyst2Id = await userId(t, DEMO.analyst2);
      await t
        .http()
        .patch(`/api/users/${analyst2Id}`)
        .set(admin)
        .send({ roles: ['analyst', 'reviewer'] })
        .expect(200);
      const both = (await t.http().post('/api/auth/login').send({ email: DEMO.analyst2, password: DEMO_PASSWORD }).expect(200)).body
        .accessToken;
      const own = await createStudy(t, { author: DEMO.analyst2 });
      await t.http().post(`/api/studies/${own.id}/submit`).set(bearer(both)).send({ password: DEMO_PASSWORD }).expect(200);
      const before = await databaseState(t, own.id);
      const res = await t.http().post(`/api/studies/${own.id}/approve`).set(bearer(both)).send({ password: DEMO_PASSWORD }).expect(403);
      expect(res.body.message).toMatch(/second person/);
      await t.http().post(`/api/studies/${own.id}/return`).set(bearer(both)).send({ comment: 'Returning my own' }).expect(403);
      const queue = await t.http().get('/api/reviews/queue').set(bearer(both)).expect(200);
      expect(queue.body.items.map((q: { id: string }) => q.id)).not.toContain(own.id);
      expect(await databaseState(t, own.id)).toEqual(before);
      await t
        .http()
        .patch(`/api/users/${analyst2Id}`)
        .set(admin)
        .send({ roles: ['analyst'] })
        .expect(200);
    });

    it('should refuse the approval of a study by someone who edited its data (403)', async () => {
      const edited = await createStudy(t, { author: DEMO.analyst, editors: [DEMO.reviewer] });
      await t.http().post(`/api/studies/${edited.id}/submit`).set(as('analyst')).send({ password: DEMO_PASSWORD }).expect(200);
      const before = await databaseState(t, edited.id);
      await t.http().post(`/api/studies/${edited.id}/approve`).set(as('reviewer')).send({ password: DEMO_PASSWORD }).expect(403);
      expect(await databaseState(t, edited.id)).toEqual(before);
      const queue = await t.http().get('/api/reviews/queue').set(as('reviewer')).expect(200);
      expect(queue.body.items.map((q: { id: string }) => q.id)).not.toContain(edited.id);
    });

    it('should refuse an approval with a wrong password (401) or a missing one (422) and change nothing', async () => {
      const before = await databaseState(t, study.id);
      const wrong = await t.http().post(`/api/studies/${study.id}/approve`).set(as('reviewer')).send({ password: 'guess' }).expect(401);
      expect(wrong.body.message).toBe('Password not correct; nothing was signed.');
      const missing = await act(study.id, 'approve', 'reviewer', { password: '' }).expect(422);
      expect(missing.body.errors[0]).toMatchObject({ field: 'password', message: 'Enter your password to sign.' });
      await act(study.id, 'approve', 'analyst', { password: DEMO_PASSWORD }).expect(403);
      await t.http().post(`/api/studies/${study.id}/approve`).send({ password: DEMO_PASSWORD }).expect(401);
      await act(UNKNOWN_ID, 'approve', 'reviewer', { password: DEMO_PASSWORD }).expect(404);
      const stale = await act(study.id, 'approve', 'reviewer', { password: DEMO_PASSWORD, lockVersion: 1 }).expect(409);
      expect(stale.body.message).toMatch(/changed since you opened it/);
      expect(await databaseState(t, study.id)).toEqual(before);
    });

    it('should approve with a reviewer signature and e-mail the author and the quality managers', async () => {
      let res: { body: Record<string, unknown> } = { body: {} };
      const mails = await newMail(async () => {
        res = await act(study.id, 'approve', 'reviewer', { password: DEMO_PASSWORD, comment: 'Checked all sections.' }).expect(200);
      });
      expect(res.body).toMatchObject({
        status: 'approved',
        stage: null,
        approvedAt: expect.any(String),
        signature: { meaning: 'reviewed-and-approved', signerName: 'Priya Nair', signerRole: 'reviewer', valid: true },
      });
      expect(recipients(mails)).toEqual([DEMO.analyst, DEMO.quality]);
      expect(mails[0].subject).toBe(`Study approved: ${study.title}`);
      expect(mails[0].text).toMatch(/does not replace/);
      const notices = await t.http().get('/api/notifications').set(as('quality')).expect(200);
      expect(notices.body.items[0]).toMatchObject({ kind: 'study.approved' });
      expect(await queryDatabase(t, 'SELECT COUNT(*) AS n FROM validation_reports WHERE study_id = ?', study.id)).toEqual([{ n: 1 }]);
    });

    it('should keep an approved study locked against further transitions (409)', async () => {
      const before = await databaseState(t, study.id);
      await t.http().post(`/api/studies/${study.id}/approve`).set(as('quality')).send({ password: DEMO_PASSWORD }).expect(409);
      await t.http().post(`/api/studies/${study.id}/return`).set(as('quality')).send({ comment: 'Reopen' }).expect(409);
      await t.http().post(`/api/studies/${study.id}/submit`).set(as('analyst')).send({ password: DEMO_PASSWORD }).expect(409);
      const current = await t.http().get(`/api/studies/${study.id}`).set(as('analyst')).expect(200);
      const edit = await t
        .http()
        .patch(`/api/studies/${study.id}`)
        .set(as('analyst'))
        .send({ title: 'Changed afterwards', lockVersion: current.body.lockVersion })
        .expect(409);
      expect(edit.body.message).toMatch(/approved/);
      expect(await databaseState(t, study.id)).toEqual(before);
    });

    it('should tell the whole story in the history, oldest first', async () => {
      await act(study.id, 'comments', 'reviewer', { section: 'standards', body: 'Top standard now fine.' }).expect(409);
      const res = await t.http().get(`/api/studies/${study.id}/history`).set(as('analyst')).expect(200);
      const timeline = res.body as { at: string; kind: string; action: string; valid?: boolean }[];
      expect(timeline.map((item) => item.at)).toEqual([...timeline.map((item) => item.at)].sort());
      const actions = timeline.map((item) => item.action);
      for (const action of [
        'study.submitted',
        'signature.authored',
        'study.returned',
        'study.approved',
        'signature.reviewed-and-approved',
      ]) {
        expect(actions).toContain(action);
      }
      expect(actions.indexOf('study.returned')).toBeLessThan(actions.lastIndexOf('study.submitted'));
      expect(timeline.filter((item) => item.kind === 'signature').every((item) => item.valid)).toBe(true);
    });

    it('should refuse the history, signatures, diff and comments to anonymous callers and unknown studies; admins read but never comment', async () => {
      for (const route of ['history', 'signatures', 'diff', 'comments']) {
        await t.http().get(`/api/studies/${study.id}/${route}`).expect(401);
        await t.http().get(`/api/studies/${study.id}/${route}`).set(as('admin')).expect(200);
        await t.http().get(`/api/studies/${UNKNOWN_ID}/${route}`).set(as('reviewer')).expect(404);
      }
      await act(study.id, 'comments', 'admin', { section: 'standards', body: 'Looks fine.' }).expect(403);
    });
  });

  describe('release by a quality manager', () => {
    it('should keep the study submitted after the first approval and make it approved only after a release', async () => {
      const study = await createStudy(t, { author: DEMO.analyst, requiresQualityRelease: true });
      await act(study.id, 'submit', 'analyst', { password: DEMO_PASSWORD }).expect(200);
      let first: { body: Record<string, unknown> } = { body: {} };
      const mails = await newMail(async () => {
        first = await act(study.id, 'approve', 'reviewer', { password: DEMO_PASSWORD }).expect(200);
      });
      expect(first.body).toMatchObject({ status: 'submitted', stage: 'release', approvedAt: null });
      expect(recipients(mails)).toEqual([DEMO.quality]);
      expect(mails[0].subject).toBe(`Study awaiting release: ${study.title}`);

      const reviewerQueue = await t.http().get('/api/reviews/queue').set(as('reviewer')).expect(200);
      expect(reviewerQueue.body.items.map((q: { id: string }) => q.id)).not.toContain(study.id);
      const qualityQueue = await t.http().get('/api/reviews/queue').set(as('quality')).expect(200);
      expect(qualityQueue.body.items.find((q: { id: string }) => q.id === study.id)).toMatchObject({
        stage: 'release',
        authorName: 'Alma Ruiz',
        methodVersionNumber: 1,
      });

      const before = await databaseState(t, study.id);
      const again = await act(study.id, 'approve', 'reviewer', { password: DEMO_PASSWORD }).expect(403);
      expect(again.body.message).toMatch(/awaits release by a quality manager/);
      expect(await databaseState(t, study.id)).toEqual(before);

      const released = await newMail(async () => {
        const res = await act(study.id, 'approve', 'quality', { password: DEMO_PASSWORD }).expect(200);
        expect(res.body).toMatchObject({
          status: 'approved',
          signature: { meaning: 'released', signerRole: 'quality_manager', signerName: 'Jonas Lindqvist' },
        });
      });
      expect(recipients(released)).toEqual([DEMO.analyst]);
      const signatures = await t.http().get(`/api/studies/${study.id}/signatures`).set(as('analyst')).expect(200);
      expect(signatures.body.map((s: { meaning: string }) => s.meaning)).toEqual(['authored', 'reviewed-and-approved', 'released']);
    });

    it('should refuse a release by the quality manager who gave the first approval (403)', async () => {
      const study = await createStudy(t, { author: DEMO.analyst, requiresQualityRelease: true });
      await act(study.id, 'submit', 'analyst', { password: DEMO_PASSWORD }).expect(200);
      const first = await act(study.id, 'approve', 'quality', { password: DEMO_PASSWORD }).expect(200);
      expect(first.body.signature.signerRole).toBe('reviewer');
      const before = await databaseState(t, study.id);
      const res = await t.http().post(`/api/studies/${study.id}/approve`).set(as('quality')).send({ password: DEMO_PASSWORD }).expect(403);
      expect(res.body.message).toMatch(/different quality manager/);
      expect(await databaseState(t, study.id)).toEqual(before);
    });
  });

  describe('concurrent approvals', () => {
    it('should let exactly one of two simultaneous approvals through and answer the other with 409', async () => {
      const study = await createStudy(t, { author: DEMO.analyst });
      await act(study.id, 'submit', 'analyst', { password: DEMO_PASSWORD }).expect(200);
      const answers = await Promise.all([
        act(study.id, 'approve', 'reviewer', { password: DEMO_PASSWORD }),
        act(study.id, 'approve', 'quality', { password: DEMO_PASSWORD }),
      ]);
      expect(answers.map((a) => a.status).sort()).toEqual([200, 409]);
      const signatures = await t.http().get(`/api/studies/${study.id}/signatures`).set(as('analyst')).expect(200);
      expect(signatures.body.filter((s: { meaning: string }) => s.meaning === 'reviewed-and-approved')).toHaveLength(1);
      expect(((await databaseState(t, study.id)).study as { status: string }).status).toBe('approved');
    });
  });

  describe('the review queue', () => {
    it('should list submitted studies awaiting the caller, oldest first, and refuse analysts and anonymous callers', async () => {
      const older = await createStudy(t, { author: DEMO.analyst });
      const newer = await createStudy(t, { author: DEMO.analyst2 });
      await act(older.id, 'submit', 'analyst', { password: DEMO_PASSWORD }).expect(200);
      await act(newer.id, 'submit', 'analyst2', { password: DEMO_PASSWORD }).expect(200);
      const res = await t.http().get('/api/reviews/queue').set(as('reviewer')).expect(200);
      const ids = res.body.items.map((q: { id: string }) => q.id);
      expect(ids.indexOf(older.id)).toBeLessThan(ids.indexOf(newer.id));
      expect(res.body.items.find((q: { id: string }) => q.id === newer.id)).toMatchObject({
        stage: 'review',
        authorName: 'Tomasz Weber',
        methodName: expect.stringMatching(/^Nitrate/),
        submittedAt: expect.any(String),
      });
      const dates = res.body.items.map((q: { submittedAt: string }) => q.submittedAt);
      expect(dates).toEqual([...dates].sort());
      await t.http().get('/api/reviews/queue').set(as('analyst')).expect(403);
      await t.http().get('/api/reviews/queue').expect(401);
    });

    it('should page the queue by cursor, oldest first, without duplicates or gaps, and refuse a bad cursor or page size', async () => {
      for (let i = 0; i < 4; i++) {
        const study = await createStudy(t, { author: DEMO.analyst });
        await t.http().post(`/api/studies/${study.id}/submit`).set(as('analyst')).send({ password: DEMO_PASSWORD }).expect(200);
      }
      const whole = await t.http().get('/api/reviews/queue?pageSize=100').set(as('reviewer')).expect(200);
      expect(whole.body).toMatchObject({ nextCursor: null, pageSize: 100 });
      const all = whole.body.items.map((q: { id: string }) => q.id);
      expect(all.length).toBeGreaterThanOrEqual(5);
      const walked: string[] = [];
      let cursor: string | null = null;
      do {
        const page = (
          await t
            .http()
            .get('/api/reviews/queue')
            .query({ pageSize: 2, ...(cursor ? { cursor } : {}) })
            .set(as('reviewer'))
            .expect(200)
        ).body as { items: { id: string }[]; nextCursor: string | null };
        expect(page.items.length).toBeLessThanOrEqual(2);
        walked.push(...page.items.map((q) => q.id));
        cursor = page.nextCursor;
      } while (cursor);
      expect(walked).toEqual(all);
      for (const item of whole.body.items) {
        expect(item).not.toHaveProperty('data');
        expect(item).not.toHaveProperty('result');
      }
      for (const [query, field] of [
        ['cursor=garbage', 'cursor'],
        ['pageSize=101', 'pageSize'],
        ['pageSize=0', 'pageSize'],
      ]) {
        const res = await t.http().get(`/api/reviews/queue?${query}`).set(as('reviewer')).expect(422);
        expect(res.body.errors[0].field).toBe(field);
      }
    });
  });

  describe('starting a new study from an approved one', () => {
    it('should copy the data and method version into a new draft authored by the caller', async () => {
      const study = await createStudy(t, { author: DEMO.analyst, status: 'approved' });
      const res = await t.http().post(`/api/studies/${study.id}/copy`).set(as('analyst2')).expect(201);
      expect(res.body).toMatchObject({
        status: 'draft',
        copiedFromId: study.id,
        methodVersionId: study.methodVersionId,
        author: { id: await userId(t, DEMO.analyst2), name: 'Tomasz Weber' },
        data: study.data,
        submittedAt: null,
        result: expect.any(Object),
      });
      const audit = await t.http().get(`/api/audit?record=study:${res.body.id}`).set(as('quality')).expect(200);
      expect(audit.body.items[0]).toMatchObject({ action: 'study.created', changes: { copiedFromId: { from: null, to: study.id } } });
    });

    it('should refuse a copy onto a retired method version (422), by a reviewer (403), anonymously (401) or of an unknown study (404)', async () => {
      const retired = await createStudy(t, { author: DEMO.analyst, status: 'approved', retired: true });
      const before = await databaseState(t, retired.id);
      const res = await t.http().post(`/api/studies/${retired.id}/copy`).set(as('analyst')).expect(422);
      expect(res.body.errors[0]).toMatchObject({ field: 'methodVersionId', code: 'retired' });
      await t.http().post(`/api/studies/${retired.id}/copy`).set(as('reviewer')).expect(403);
      await t.http().post(`/api/studies/${retired.id}/copy`).expect(401);
      await t.http().post(`/api/studies/${UNKNOWN_ID}/copy`).set(as('analyst')).expect(404);
      expect(await databaseState(t, retired.id)).toEqual(before);
    });
  });

  describe('comments', () => {
    let study: ValidationStudy;

    beforeAll(async () => {
      study = await createStudy(t, { author: DEMO.analyst });
    });

    it('should pin comments to a section, thread replies under them and resolve the thread', async () => {
      const first = await act(study.id, 'comments', 'reviewer', { section: 'blanks', body: 'Only four blanks: is that the plan?' }).expect(
        201,
      );
      expect(first.body).toMatchObject({ section: 'blanks', threadId: null, authorName: 'Priya Nair', resolved: false });
      const reply = await act(study.id, 'comments', 'analyst', {
        section: 'results',
        body: 'Yes, per the method version.',
        threadId: first.body.id,
      }).expect(201);
      expect(reply.body).toMatchObject({ section: 'blanks', threadId: first.body.id });
      const resolved = await t
        .http()
        .patch(`/api/studies/${study.id}/comments/${first.body.id}`)
        .set(as('reviewer'))
        .send({ resolved: true })
        .expect(200);
      expect(resolved.body.resolved).toBe(true);
      const list = await t.http().get(`/api/studies/${study.id}/comments`).set(as('analyst')).expect(200);
      expect(list.body.map((c: { id: string; resolved: boolean }) => [c.id, c.resolved])).toEqual([
        [first.body.id, true],
        [reply.body.id, false],
      ]);
      const audit = await t.http().get(`/api/audit?record=study:${study.id}`).set(as('quality')).expect(200);
      const ofComment = audit.body.items.filter((e: { entityId: string }) => e.entityId === first.body.id);
      expect(ofComment.map((e: { action: string }) => e.action)).toEqual(['study-comment.resolved', 'study-comment.created']);
    });

    it('should refuse bad comments with 422 field messages and change nothing', async () => {
      const before = await databaseState(t, study.id);
      const bad = await act(study.id, 'comments', 'reviewer', { section: 'appendix', body: ' ' }).expect(422);
      expect(bad.body.errors.map((e: { field: string }) => e.field).sort()).toEqual(['body', 'section']);
      const thread = await act(study.id, 'comments', 'reviewer', { section: 'blanks', body: 'Reply', threadId: UNKNOWN_ID }).expect(422);
      expect(thread.body.errors[0]).toMatchObject({ field: 'threadId', code: 'unknown_thread' });
      await act(study.id, 'comments', 'reviewer', { section: 'blanks', body: 'x'.repeat(4001) }).expect(422);
      await t.http().patch(`/api/studies/${study.id}/comments/${UNKNOWN_ID}`).set(as('reviewer')).send({ resolved: 'yes' }).expect(422);
      expect(await databaseState(t, study.id)).toEqual(before);
    });

    it('should refuse comments to anonymous callers (401), admins (403), unknown studies and comments (404)', async () => {
      const before = await databaseState(t, study.id);
      await t.http().post(`/api/studies/${study.id}/comments`).send({ section: 'blanks', body: 'Hi' }).expect(401);
      await act(study.id, 'comments', 'admin', { section: 'blanks', body: 'Hi' }).expect(403);
      await act(UNKNOWN_ID, 'comments', 'reviewer', { section: 'blanks', body: 'Hi' }).expect(404);
      await t.http().patch(`/api/studies/${study.id}/comments/${UNKNOWN_ID}`).set(as('reviewer')).send({ resolved: true }).expect(404);
      await t.http().patch(`/api/studies/${study.id}/comments/${UNKNOWN_ID}`).send({ resolved: true }).expect(401);
      await t.http().patch(`/api/studies/${study.id}/comments/${UNKNOWN_ID}`).set(as('admin')).send({ resolved: true }).expect(403);
      expect(await databaseState(t, study.id)).toEqual(before);
    });
  });
});
