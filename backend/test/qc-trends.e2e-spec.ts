import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { queryDatabase } from './support/review-fixtures.js';
import { createTestApp, DEMO, type TestApp } from './support/test-app.js';

/* The demo nitrate runs are invented: five released runs set the baseline, the later runs drift upwards. */
const NITRATE = 'Nitrate in drinking water by ion chromatography';
const UNKNOWN_ID = '00000000-0000-4000-8000-000000000000';

describe('QC trends across runs', () => {
  let t: TestApp;
  let analyst: string;
  let quality: string;
  let methodId: string;
  let versionId: string;
  const auth = (token: string) => ({ Authorization: `Bearer ${token}` });
  const query = <T>(sql: string, parameters: unknown[] = []): Promise<T[]> => queryDatabase<T>(t, sql, ...parameters);
  const trends = (series: string, token = analyst, extra = '') =>
    t.http().get(`/api/methods/${methodId}/qc-trends?series=${series}${extra}`).set(auth(token));
  async function outbox(subject: string, atLeast = 1) {
    for (let i = 0; i < 50; i++) {
      const rows = await query<{ subject: string; text: string; to_addresses: string }>('select * from outbox_messages where subject = ?', [
        subject,
      ]);
      if (rows.length >= atLeast) return rows;
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
    return query<{ subject: string; text: string; to_addresses: string }>('select * from outbox_messages where subject = ?', [subject]);
  }

  beforeAll(async () => {
    t = await createTestApp();
    [analyst, quality] = await Promise.all([t.tokenFor(DEMO.analyst), t.tokenFor(DEMO.quality)]);
    [{ id: methodId }] = await query<{ id: string }>('select id from methods where name = ?', [NITRATE]);
    [{ id: versionId }] = await query<{ id: string }>("select id from method_versions where method_id = ? and status = 'active'", [
      methodId,
    ]);
  });
  afterAll(async () => {
    await t?.close();
  });

  it('should set the slope limits from the baseline runs only and name the drift signal in words', async () => {
    const res = await trends('slope').expect(200);
    const body = res.body;
    expect(body).toMatchObject({ methodVersionId: versionId, series: 'slope', seriesLabel: 'Calibration slope', unit: 'µS·min per mg/L' });
    const baseline = body.points.filter((p: { baseline: boolean }) => p.baseline).map((p: { value: number }) => p.value);
    expect(baseline).toHaveLength(5);
    expect(body.baseline.runIds).toHaveLength(5);
    const mean = baseline.reduce((a: number, b: number) => a + b, 0) / 5;
    const sd = Math.sqrt(baseline.reduce((ss: number, v: number) => ss + (v - mean) ** 2, 0) / 4);
    expect(body.limits.mean).toBeCloseTo(mean, 12);
    expect(body.limits.sd).toBeCloseTo(sd, 12);
    expect(body.limits.action[1]).toBeCloseTo(mean + 3 * sd, 12);
    const judged = body.points.filter((p: { baseline: boolean }) => !p.baseline);
    expect(judged.length).toBeGreaterThanOrEqual(7);
    expect(body.signals.map((s: { message: string }) => s.message)).toContainEqual(
      expect.stringMatching(
        /^Calibration slope: seven points in a row on one side of the mean, above the mean, at run “Nitrate in drinking water, batch/,
      ),
    );
  });

  it('should e-mail each signal once to the quality managers and record what was sent', async () => {
    await trends('slope').expect(200);
    const subject = `Control chart signal: ${NITRATE}, version 2`;
    const notices = await query<{ rule: string; recipients: string; subject: string }>('select * from qc_signal_notices where series = ?', [
      'slope',
    ]);
    expect(notices.length).toBeGreaterThan(0);
    expect(notices.some((n) => n.rule === 'sevenOnOneSide')).toBe(true);
    expect(JSON.parse(notices[0].recipients)).toEqual([DEMO.quality]);
    const mails = await outbox(subject, notices.length);
    expect(mails).toHaveLength(notices.length);
    expect(mails.some((m) => m.text.includes('seven points in a row on one side of the mean'))).toBe(true);
  });

  it('should chart check recoveries and blanks and say when a series has no values', async () => {
    const checks = await trends('check').expect(200);
    expect(checks.body.unit).toBe('%');
    expect(checks.body.points[0].item).toBe('CCV 10 mg/L');
    const blanks = await trends('blank').expect(200);
    expect(blanks.body).toMatchObject({ points: [], limits: null });
    expect(blanks.body.message).toMatch(/fewer than 3 values/);
  });

  it('should refuse bad input and callers outside the lab', async () => {
    await t.http().get(`/api/methods/${methodId}/qc-trends?series=slope`).expect(401);
    await trends('slope', await t.tokenFor(DEMO.admin)).expect(403);
    const bad = await trends('colour').expect(422);
    expect(bad.body.errors[0].field).toBe('series');
    const [{ id: other }] = await query<{ id: string }>('select id from method_versions where method_id <> ? limit 1', [methodId]);
    const foreign = await trends('slope', analyst, `&versionId=${other}`).expect(422);
    expect(foreign.body.errors[0].field).toBe('versionId');
    await t.http().get(`/api/methods/${UNKNOWN_ID}/qc-trends?series=slope`).set(auth(analyst)).expect(404);
  });

  describe('choosing the baseline', () => {
    const put = (body: object, token = quality, id = versionId) =>
      t.http().put(`/api/method-versions/${id}/qc-baseline`).set(auth(token)).send(body);

    it('should let only quality managers choose it (403) and refuse runs that are not released (422 with the field)', async () => {
      const current = (await trends('slope')).body.baseline;
      await put({ runIds: current.runIds, reason: 'x', lockVersion: 1 }, analyst).expect(403);
      const [{ id: calculated }] = await query<{ id: string }>(
        "select id from runs where method_version_id = ? and review_status = 'calculated' limit 1",
        [versionId],
      );
      const refused = await put({ runIds: [...current.runIds.slice(0, 2), calculated], reason: 'Wider', lockVersion: 1 }).expect(422);
      expect(refused.body.errors[0]).toMatchObject({ field: 'runIds[2]', code: 'not_released' });
      const short = await put({ runIds: current.runIds.slice(0, 2), reason: 'Short', lockVersion: 1 }).expect(422);
      expect(short.body.errors[0].field).toBe('runIds');
      await put({ runIds: current.runIds, reason: '', lockVersion: 1 }).expect(422);
      await put({ runIds: current.runIds, reason: 'x' }, quality, UNKNOWN_ID).expect(404);
    });

    it('should store a new choice with its lock version and audit it; a stale lock version answers 409', async () => {
      const current = (await trends('slope')).body.baseline;
      const res = await put({
        runIds: current.runIds.slice(1),
        reason: 'The first run was before the suppressor change.',
        lockVersion: 1,
      }).expect(200);
      expect(res.body).toMatchObject({ lockVersion: 2, chosenBy: { name: 'Jonas Lindqvist' }, runIds: current.runIds.slice(1) });
      await put({ runIds: current.runIds, reason: 'Again', lockVersion: 1 }).expect(409);
      const audit = await query<{ reason: string }>(
        "select reason from audit_entries where action = 'qc-baseline.chosen' and entity_id = ? order by seq",
        [versionId],
      );
      expect(audit.at(-1)!.reason).toBe('The first run was before the suppressor change.');
      const chart = (await trends('slope')).body;
      expect(chart.points.filter((p: { baseline: boolean }) => p.baseline)).toHaveLength(4);
    });
  });
});
