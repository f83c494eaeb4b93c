import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bearer, createStudy, databaseState, queryDatabase, userId } from './support/review-fixtures.js';
import { createTestApp, DEMO, DEMO_PASSWORD, type TestApp } from './support/test-app.js';

const UNKNOWN_ID = '00000000-0000-4000-8000-000000000000';

interface Study {
  id: string;
  lockVersion: number;
  status: string;
  data: Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any -- study data are plain JSON
  meta: Record<string, unknown>;
  author: { id: string; name: string };
  result: Record<string, any> | null; // eslint-disable-line @typescript-eslint/no-explicit-any -- the engine result is plain JSON
}

// Invented spike recoveries (common practice: recovery = 100 · found / added).
const RECOVERY = [
  { id: 'S1', added: 1, found: 0.98 },
  { id: 'S2', added: 1, found: 1.02 },
  { id: 'S3', added: 1, found: 0.61 },
];

describe('changes to a study: reasons, record, author and exclusions', () => {
  let t: TestApp;
  const token: Record<keyof typeof DEMO, string> = { analyst: '', analyst2: '', reviewer: '', quality: '', admin: '' };
  const as = (who: keyof typeof DEMO) => bearer(token[who]);
  const get = async (id: string, who: keyof typeof DEMO = 'analyst') =>
    (await t.http().get(`/api/studies/${id}`).set(as(who)).expect(200)).body as Study;
  const patch = (id: string, who: keyof typeof DEMO, body: Record<string, unknown>) =>
    t.http().patch(`/api/studies/${id}`).set(as(who)).send(body);
  const auditOf = (id: string, action: string) =>
    queryDatabase<{ changes: string; reason: string | null }>(
      t,
      'SELECT changes, reason FROM audit_entries WHERE entity_id = ? AND action = ? ORDER BY seq',
      id,
      action,
    );
  const history = async (id: string) =>
    (await t.http().get(`/api/studies/${id}/history`).set(as('reviewer')).expect(200)).body as {
      action: string;
      detail: string | null;
      lines?: string[];
    }[];

  beforeAll(async () => {
    t = await createTestApp();
    for (const who of Object.keys(DEMO) as (keyof typeof DEMO)[]) token[who] = await t.tokenFor(DEMO[who]);
  });
  afterAll(() => t.close());

  describe('after a study was returned', () => {
    it('should refuse a change of the conclusion, the title or the data without a reason (422 on reason) and save nothing', async () => {
      const study = await get((await createStudy(t, { author: DEMO.analyst, status: 'returned' })).id);
      const before = await databaseState(t, study.id);
      const data = structuredClone(study.data);
      data.standards[1].y = 0.13;
      for (const body of [
        { meta: { conclusion: 'Fit for purpose.' } },
        { title: 'Renamed' },
        { data },
        { meta: { conclusion: 'x' }, reason: '  ' },
      ]) {
        const res = await patch(study.id, 'analyst', { lockVersion: study.lockVersion, ...body }).expect(422);
        expect(res.body.errors).toEqual([expect.objectContaining({ field: 'reason', code: 'required' })]);
      }
      expect(await databaseState(t, study.id)).toEqual(before);
      expect((await get(study.id)).meta.conclusion).toBeUndefined();
    });

    it('should keep the reason with each change and tell before and after in words in the history', async () => {
      const study = await get((await createStudy(t, { author: DEMO.analyst, status: 'returned' })).id);
      const conclusion = await patch(study.id, 'analyst', {
        lockVersion: study.lockVersion,
        meta: { conclusion: 'The method is fit for nitrate at 0.5–8 mg/L.' },
        reason: 'The reviewer asked for the working range in the conclusion.',
      }).expect(200);
      const data = structuredClone(study.data);
      const oldY = data.standards[1].y;
      data.standards[1].y = 0.13;
      await patch(study.id, 'analyst', {
        lockVersion: conclusion.body.lockVersion,
        data,
        reason: 'Typing error in the second standard.',
      }).expect(200);
      const updates = (await history(study.id)).filter((item) => item.action === 'study.updated');
      expect(updates).toEqual([
        expect.objectContaining({
          detail: 'The reviewer asked for the working range in the conclusion.',
          lines: ['Conclusion: nothing → “The method is fit for nitrate at 0.5–8 mg/L.”'],
        }),
        expect.objectContaining({
          detail: 'Typing error in the second standard.',
          lines: [`Calibration standards, row 2, response: ${oldY} → 0.13`],
        }),
      ]);
      expect(updates.flatMap((item) => item.lines).join(' ')).not.toMatch(/standards\[|meta\./);
    });

    it('should show the reviewer the conclusion and title edits among the changes since the last submission', async () => {
      const draft = await createStudy(t, { author: DEMO.analyst });
      const first = await get(draft.id);
      await patch(first.id, 'analyst', { lockVersion: first.lockVersion, meta: { conclusion: 'Fit for purpose.' } }).expect(200);
      const submit = async () => {
        const { lockVersion } = await get(first.id);
        await t
          .http()
          .post(`/api/studies/${first.id}/submit`)
          .set(as('analyst'))
          .send({ password: DEMO_PASSWORD, lockVersion })
          .expect(200);
      };
      await submit();
      const { lockVersion } = await get(first.id);
      await t
        .http()
        .post(`/api/studies/${first.id}/return`)
        .set(as('reviewer'))
        .send({ comment: 'State the working range in the conclusion.', lockVersion })
        .expect(200);
      const returned = await get(first.id);
      await patch(first.id, 'analyst', {
        lockVersion: returned.lockVersion,
        meta: { conclusion: 'Fit for purpose from 0.5 to 8 mg/L.' },
        reason: 'Working range stated as asked.',
      }).expect(200);
      await submit();
      const diff = (await t.http().get(`/api/studies/${first.id}/diff`).set(as('reviewer')).expect(200)).body;
      expect(diff.meta).toEqual([{ field: 'conclusion', from: 'Fit for purpose.', to: 'Fit for purpose from 0.5 to 8 mg/L.' }]);
      expect(diff.sections).toEqual([]);
    });
  });

  describe('who may change a study', () => {
    it('should let only the author change a draft or a returned study (403 for others, who still read it)', async () => {
      for (const status of ['draft', 'returned'] as const) {
        const study = await get((await createStudy(t, { author: DEMO.analyst, status })).id);
        const before = await databaseState(t, study.id);
        const other = await patch(study.id, 'analyst2', {
          lockVersion: study.lockVersion,
          title: 'Taken over',
          reason: 'Mine now.',
        }).expect(403);
        expect(other.body.message).toMatch(/only the author/i);
        await patch(study.id, 'reviewer', { lockVersion: study.lockVersion, title: 'Taken over' }).expect(403);
        await patch(study.id, 'admin', { lockVersion: study.lockVersion, title: 'Taken over' }).expect(403);
        expect(await databaseState(t, study.id)).toEqual(before);
        expect((await get(study.id, 'analyst2')).status).toBe(status);
      }
    });
  });

  describe('POST /api/studies/:id/reassign', () => {
    const reassign = (id: string, body: Record<string, unknown>, who?: keyof typeof DEMO) => {
      const request = t.http().post(`/api/studies/${id}/reassign`);
      return (who ? request.set(as(who)) : request).send(body);
    };

    it('should refuse anonymous callers (401), everyone but an administrator (403) and unknown studies (404)', async () => {
      const study = await get((await createStudy(t, { author: DEMO.analyst })).id);
      const body = { authorId: await userId(t, DEMO.analyst2), reason: 'Alma is on leave.', lockVersion: study.lockVersion };
      const before = await databaseState(t, study.id);
      await reassign(study.id, body).expect(401);
      for (const who of ['analyst', 'analyst2', 'reviewer', 'quality'] as const) await reassign(study.id, body, who).expect(403);
      await reassign(UNKNOWN_ID, body, 'admin').expect(404);
      expect(await databaseState(t, study.id)).toEqual(before);
    });

    it('should answer bad input with 422 per field, a stale lock version or a study past draft with 409, and save nothing', async () => {
      const study = await get((await createStudy(t, { author: DEMO.analyst })).id);
      const before = await databaseState(t, study.id);
      const missing = await reassign(study.id, { reason: ' ', authorId: 'nobody' }, 'admin').expect(422);
      expect(missing.body.errors.map((e: { field: string }) => e.field).sort()).toEqual(['authorId', 'lockVersion', 'reason']);
      const lockVersion = study.lockVersion;
      const reviewer = await reassign(study.id, { authorId: await userId(t, DEMO.reviewer), reason: 'Away.', lockVersion }, 'admin').expect(
        422,
      );
      expect(reviewer.body.errors).toEqual([expect.objectContaining({ field: 'authorId', code: 'not_analyst' })]);
      await reassign(study.id, { authorId: UNKNOWN_ID, reason: 'Away.', lockVersion }, 'admin').expect(422);
      const same = await reassign(study.id, { authorId: study.author.id, reason: 'Away.', lockVersion }, 'admin').expect(422);
      expect(same.body.errors).toEqual([expect.objectContaining({ field: 'authorId', code: 'same_author' })]);
      const analyst2 = await userId(t, DEMO.analyst2);
      await reassign(study.id, { authorId: analyst2, reason: 'Away.', lockVersion: lockVersion + 1 }, 'admin').expect(409);
      expect(await databaseState(t, study.id)).toEqual(before);
      const submitted = await get((await createStudy(t, { author: DEMO.analyst, status: 'submitted' })).id);
      const locked = await reassign(
        submitted.id,
        { authorId: analyst2, reason: 'Away.', lockVersion: submitted.lockVersion },
        'admin',
      ).expect(409);
      expect(locked.body.message).toMatch(/only a draft/i);
    });

    it('should hand the draft to the analyst named, audited with the reason; only the new author may then change it', async () => {
      const study = await get((await createStudy(t, { author: DEMO.analyst })).id);
      const analyst2 = await userId(t, DEMO.analyst2);
      const res = await reassign(
        study.id,
        { authorId: analyst2, reason: 'Alma is on leave until March; Tomasz finishes the study.', lockVersion: study.lockVersion },
        'admin',
      ).expect(200);
      expect(res.body).toMatchObject({ author: { id: analyst2 }, status: 'draft', lockVersion: study.lockVersion + 1 });
      expect(res.body.editorIds).toContain(analyst2);
      const [entry] = await auditOf(study.id, 'study.reassigned');
      expect(entry.reason).toBe('Alma is on leave until March; Tomasz finishes the study.');
      expect(JSON.parse(entry.changes).authorId).toEqual({ from: study.author.id, to: analyst2 });
      const item = (await history(study.id)).find((h) => h.action === 'study.reassigned');
      expect(item?.lines).toEqual([`Author: “${study.author.name}” → “${res.body.author.name}”`]);
      await patch(study.id, 'analyst', { lockVersion: res.body.lockVersion, title: 'Still mine?' }).expect(403);
      await patch(study.id, 'analyst2', { lockVersion: res.body.lockVersion, title: 'Nitrate calibration, finished' }).expect(200);
    });
  });

  describe('excluding replicate rows', () => {
    it('should leave an excluded recovery row out of the figures, audit the exclusion with its reason and list it', async () => {
      const study = await get((await createStudy(t, { author: DEMO.analyst })).id);
      const withRecovery = await patch(study.id, 'analyst', {
        lockVersion: study.lockVersion,
        data: { ...study.data, recovery: RECOVERY },
      }).expect(200);
      const reason = 'Vial S3 spilt before injection.';
      const data = { ...study.data, recovery: RECOVERY.map((r) => (r.id === 'S3' ? { ...r, excluded: { reason } } : r)) };
      const res = await patch(study.id, 'analyst', { lockVersion: withRecovery.body.lockVersion, data }).expect(200);
      expect(res.body.result.recovery.overall).toMatchObject({ n: 2 });
      expect(res.body.result.recovery.overall.meanPct).toBeCloseTo(100, 10);
      expect(res.body.result.recovery.excluded).toEqual([{ index: 2, label: 'S3', value: 0.61, reason }]);
      const [entry] = await auditOf(study.id, 'study.point-excluded');
      expect(entry.reason).toBe(reason);
      expect(JSON.parse(entry.changes)).toEqual({ 'recovery[2].excluded': { from: null, to: { reason } } });
      const bad = await patch(study.id, 'analyst', {
        lockVersion: res.body.lockVersion,
        data: { ...study.data, precision: [{ group: 'day 1', value: 5, excluded: { reason: '' } }] },
      }).expect(422);
      expect(bad.body.errors.map((e: { field: string }) => e.field)).toContain('precision[0].excluded.reason');
    });

    it('should save a study with an excluded method blank, leave the blank out of the blank SD, audit it and keep plain blanks', async () => {
      const study = await get((await createStudy(t, { author: DEMO.analyst })).id);
      // Invented blank responses (AU); the last one is a carried-over vial.
      const blanks = [0.0011, 0.0018, 0.0009, 0.0014, 0.0012, 0.0016, 0.0095];
      const plain = await patch(study.id, 'analyst', { lockVersion: study.lockVersion, data: { ...study.data, blanks } }).expect(200);
      expect(plain.body.data.blanks).toEqual(blanks);
      expect(plain.body.result.detection.blankSd.n).toBe(7);
      const reason = 'Carry-over from the top standard.';
      const withExclusion = { ...study.data, blanks: blanks.map((value, i) => (i === 6 ? { value, excluded: { reason } } : value)) };
      const res = await patch(study.id, 'analyst', { lockVersion: plain.body.lockVersion, data: withExclusion }).expect(200);
      expect(res.body.data.blanks[6]).toEqual({ value: 0.0095, excluded: { reason } });
      const detection = res.body.result.detection;
      expect(detection.excludedBlanks).toEqual([{ index: 6, label: 'blank 7', value: 0.0095, reason }]);
      expect(detection.blankSd.n).toBe(6);
      // Mean of the six kept blanks, summed by hand: 0.0080 / 6.
      expect(detection.blankSd.mean).toBeCloseTo(0.008 / 6, 12);
      expect(res.body.result.warnings).toContainEqual(
        expect.objectContaining({ section: 'detection', code: 'excluded', message: `1 method blank excluded by the analyst: ${reason}` }),
      );
      const entry = (await auditOf(study.id, 'study.point-excluded')).find((e) => e.changes.includes('blanks[6]'));
      expect(entry?.reason).toBe(reason);
      expect(JSON.parse(entry!.changes)).toEqual({ 'blanks[6].excluded': { from: null, to: { reason } } });
      const item = (await history(study.id)).find((h) => h.action === 'study.point-excluded');
      expect(item?.lines).toEqual([`Blanks, row 7, excluded: nothing → excluded (${reason})`]);
      const bad = await patch(study.id, 'analyst', {
        lockVersion: res.body.lockVersion,
        data: { ...study.data, blanks: [0.001, { value: 'high' }] },
      }).expect(422);
      expect(bad.body.errors.map((e: { field: string }) => e.field)).toContain('blanks[1].value');
    });
  });
});
