import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { RunReviewStatus, type OverviewDto } from '@meritline/shared';
import { bearer, dataSourceOf, queryDatabase } from './support/review-fixtures.js';
import { createTestApp, DEMO, DEMO_PASSWORD, type TestApp } from './support/test-app.js';
import { Run } from '../src/runs/run.entity.js';

describe('the overview of waiting work', () => {
  let t: TestApp;
  const get = async (who: keyof typeof DEMO) =>
    (
      await t
        .http()
        .get('/api/overview')
        .set(bearer(await t.tokenFor(DEMO[who])))
        .expect(200)
    ).body as OverviewDto;

  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('should refuse anonymous callers (401)', async () => {
    await t.http().get('/api/overview').expect(401);
  });

  it('should give each role only its own kinds of work', async () => {
    const analyst = await get('analyst');
    expect(analyst.versionsAwaitingActivation).toEqual([]);
    expect(analyst.justifiedApprovals).toEqual([]);
    const reviewer = await get('reviewer');
    expect(reviewer).toEqual({ returnedRuns: [], versionsAwaitingActivation: [], justifiedApprovals: [], driftSignals: [] });
    const quality = await get('quality');
    expect(quality.returnedRuns).toEqual([]);
    for (const v of quality.versionsAwaitingActivation)
      expect(v).toMatchObject({ methodName: expect.any(String), number: expect.any(Number) });
    for (const a of quality.justifiedApprovals) expect(a.justification.length).toBeGreaterThan(0);
  });

  it('should list an analyst’s run returned by the reviewer, with the reviewer’s comment', async () => {
    const ds = dataSourceOf(t);
    const analystId = (
      await t
        .http()
        .get('/api/auth/me')
        .set(bearer(await t.tokenFor(DEMO.analyst)))
        .expect(200)
    ).body.id as string;
    const run = await ds.getRepository(Run).findOneOrFail({ where: { authorId: analystId, reviewStatus: RunReviewStatus.Calculated } });
    const as = async (who: keyof typeof DEMO) => bearer(await t.tokenFor(DEMO[who]));
    await t
      .http()
      .post(`/api/runs/${run.id}/submit`)
      .set(await as('analyst'))
      .send({ password: DEMO_PASSWORD, version: run.lockVersion })
      .expect(200);
    await t
      .http()
      .post(`/api/runs/${run.id}/return`)
      .set(await as('reviewer'))
      .send({ password: DEMO_PASSWORD, version: run.lockVersion + 1, comment: 'Check standard 3 again.' })
      .expect(200);
    const analyst = await get('analyst');
    expect(analyst.returnedRuns).toContainEqual(
      expect.objectContaining({ id: run.id, title: run.title, comment: 'Check standard 3 again.' }),
    );
    expect((await get('analyst2')).returnedRuns.map((r) => r.id)).not.toContain(run.id);
  });

  it('should list the control-chart signals e-mailed to the quality managers, in words, for them only', async () => {
    const [{ id: methodId }] = await queryDatabase<{ id: string }>(
      t,
      'select id from methods where name = ?',
      ...['Nitrate in drinking water by ion chromatography'],
    );
    await t
      .http()
      .get(`/api/methods/${methodId}/qc-trends?series=slope`)
      .set(bearer(await t.tokenFor(DEMO.analyst)))
      .expect(200);
    const quality = await get('quality');
    expect(quality.driftSignals.length).toBeGreaterThan(0);
    expect(quality.driftSignals[0]).toMatchObject({ methodName: 'Nitrate in drinking water by ion chromatography', series: 'slope' });
    expect(quality.driftSignals[0].message).toMatch(/^Calibration slope: /);
    expect((await get('analyst')).driftSignals).toEqual([]);
  });
});
