import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluateStudy, STUDY_LIMITS } from '@meritline/shared';
import { INLINE_EVALUATION_ROWS } from '../src/workers/worker-pool.service.js';
import { createStudy, queryDatabase } from './support/review-fixtures.js';
import { createTestApp, DEMO, type TestApp } from './support/test-app.js';

/** A straight line with a little scatter, as many standards as asked (invented numbers). */
function standards(count: number) {
  return Array.from({ length: count }, (_, i) => {
    const x = 1 + (i % 50);
    return { x, y: 0.002 + 0.1523 * x + ((i * 7919) % 13) * 1e-4 - 6e-4 };
  });
}

describe('bounds on a study and heavy work off the main thread', () => {
  let t: TestApp;
  let token: string;

  beforeAll(async () => {
    t = await createTestApp();
    token = await t.tokenFor(DEMO.analyst);
  });
  afterAll(() => t.close());

  it('should refuse a list longer than the documented bound with 422 on the field, saving nothing', async () => {
    const study = await createStudy(t, { author: DEMO.analyst });
    const res = await t
      .http()
      .patch(`/api/studies/${study.id}`)
      .set('Authorization', `Bearer ${token}`)
      .send({ lockVersion: study.lockVersion, data: { standards: standards(STUDY_LIMITS.rows + 1) } })
      .expect(422);
    expect(res.body.errors[0]).toMatchObject({ field: 'standards', code: 'too_many' });
    const [row] = await queryDatabase<{ lockVersion: number }>(
      t,
      'SELECT lock_version AS "lockVersion" FROM validation_studies WHERE id = ?',
      study.id,
    );
    expect(row.lockVersion).toBe(study.lockVersion);
  });

  it('should evaluate a large study in a worker thread with exactly the engine result', async () => {
    const data = { units: { x: 'mg/L', y: 'AU' }, standards: standards(INLINE_EVALUATION_ROWS * 10) };
    const res = await t.http().post('/api/evaluate').set('Authorization', `Bearer ${token}`).send(data).expect(200);
    expect(res.body).toEqual(JSON.parse(JSON.stringify(evaluateStudy(data))));
  });

  it('should keep the engine refusals of a large study a 422 with the field when they come back from the worker', async () => {
    const data = { standards: [...standards(INLINE_EVALUATION_ROWS * 2), { x: 'ten', y: 1 }] };
    const res = await t.http().post('/api/evaluate').set('Authorization', `Bearer ${token}`).send(data).expect(422);
    expect(res.body.errors[0]).toMatchObject({ field: `standards[${INLINE_EVALUATION_ROWS * 2}].x` });
  });

  it('should answer the health route while a large evaluation is running', async () => {
    const data = { standards: standards(STUDY_LIMITS.rows) };
    const heavy = t.http().post('/api/evaluate').set('Authorization', `Bearer ${token}`).send(data);
    const [health] = await Promise.all([t.http().get('/api/health').expect(200), heavy.expect(200)]);
    expect(health.body).toBeTruthy();
  });
});
