import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bearer, createStudy, queryDatabase } from './support/review-fixtures.js';
import { createTestApp, DEMO, DEMO_PASSWORD, type TestApp } from './support/test-app.js';

const UNKNOWN_ID = '00000000-0000-4000-8000-000000000000';

interface NotificationItem {
  id: string;
  kind: string;
  message: string;
  link: string;
  readAt: string | null;
}

describe('in-app notifications', () => {
  let t: TestApp;
  let analyst: Record<string, string>;
  let reviewer: Record<string, string>;
  let quality: Record<string, string>;
  let studyId: string;

  const unreadOf = (auth: Record<string, string>) =>
    t
      .http()
      .get('/api/notifications')
      .set(auth)
      .expect(200)
      .then((res) => res.body.unread as number);

  beforeAll(async () => {
    t = await createTestApp();
    analyst = bearer(await t.tokenFor(DEMO.analyst));
    reviewer = bearer(await t.tokenFor(DEMO.reviewer));
    quality = bearer(await t.tokenFor(DEMO.quality));
    const study = await createStudy(t, { author: DEMO.analyst, requiresQualityRelease: true });
    studyId = study.id;
  });
  afterAll(() => t.close());

  it('should refuse every notification route to anonymous callers', async () => {
    await t.http().get('/api/notifications').expect(401);
    await t.http().post('/api/notifications/read-all').expect(401);
    await t.http().post(`/api/notifications/${UNKNOWN_ID}/read`).expect(401);
  });

  it('should notify the reviewers of a submission, the quality managers of a pending release and the author of the approval', async () => {
    const [reviewerUnread, analystUnread] = [await unreadOf(reviewer), await unreadOf(analyst)];
    await t.http().post(`/api/studies/${studyId}/submit`).set(analyst).send({ password: DEMO_PASSWORD }).expect(200);
    const forReviewer = await t.http().get('/api/notifications').set(reviewer).expect(200);
    expect(forReviewer.body.unread).toBe(reviewerUnread + 1);
    expect(forReviewer.body.items[0]).toMatchObject({
      kind: 'study.submitted',
      message: expect.stringContaining('Alma Ruiz submitted'),
      link: `/studies/${studyId}`,
      readAt: null,
      createdAt: expect.any(String),
    });
    expect(await unreadOf(analyst)).toBe(analystUnread);

    await t.http().post(`/api/studies/${studyId}/approve`).set(reviewer).send({ password: DEMO_PASSWORD }).expect(200);
    const forQuality = await t.http().get('/api/notifications').set(quality).expect(200);
    expect(forQuality.body.items.slice(0, 2).map((n: NotificationItem) => n.kind)).toEqual(['study.release-pending', 'study.submitted']);

    await t.http().post(`/api/studies/${studyId}/approve`).set(quality).send({ password: DEMO_PASSWORD }).expect(200);
    const forAnalyst = await t.http().get('/api/notifications').set(analyst).expect(200);
    expect(forAnalyst.body.items[0]).toMatchObject({ kind: 'study.approved', link: `/studies/${studyId}` });
  });

  it('should mark one notice read and leave the others unread', async () => {
    const list = await t.http().get('/api/notifications').set(quality).expect(200);
    const unread = list.body.unread as number;
    const target = list.body.items[0] as NotificationItem;
    const res = await t.http().post(`/api/notifications/${target.id}/read`).set(quality).expect(200);
    expect(res.body).toMatchObject({ id: target.id, readAt: expect.any(String) });
    expect(await unreadOf(quality)).toBe(unread - 1);
    const again = await t.http().post(`/api/notifications/${target.id}/read`).set(quality).expect(200);
    expect(again.body.readAt).toBe(res.body.readAt);
  });

  it('should answer 404 for another user’s notice or an unknown one, 400 for a malformed id, and change nothing', async () => {
    const reviewerList = await t.http().get('/api/notifications').set(reviewer).expect(200);
    const theirs = reviewerList.body.items[0] as NotificationItem;
    await t.http().post(`/api/notifications/${theirs.id}/read`).set(analyst).expect(404);
    await t.http().post(`/api/notifications/${UNKNOWN_ID}/read`).set(analyst).expect(404);
    await t.http().post('/api/notifications/not-an-id/read').set(analyst).expect(400);
    expect(await queryDatabase(t, 'SELECT read_at FROM notifications WHERE id = ?', theirs.id)).toEqual([{ read_at: null }]);
  });

  it('should mark all of the caller’s notices read and no one else’s', async () => {
    const reviewerUnread = await unreadOf(reviewer);
    const res = await t.http().post('/api/notifications/read-all').set(quality).expect(200);
    expect(res.body.marked).toBeGreaterThan(0);
    expect(await unreadOf(quality)).toBe(0);
    expect(await unreadOf(reviewer)).toBe(reviewerUnread);
  });
});
