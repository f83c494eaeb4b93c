import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, DEMO, type TestApp } from './support/test-app.js';

const EVALUATE_LIMIT = 120;
const STUDY = { standards: [1, 2, 4, 8].map((x) => ({ x, y: 0.01 + 0.25 * x })) };

describe('throttling by account, not by shared address', () => {
  let t: TestApp;

  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('should give each signed-in account its own budget on one address, and never throttle the health route', async () => {
    const [analyst, reviewer] = [await t.tokenFor(DEMO.analyst), await t.tokenFor(DEMO.reviewer)];
    const evaluate = (token: string) => t.http().post('/api/evaluate').set('Authorization', `Bearer ${token}`).send(STUDY);
    for (let i = 0; i < EVALUATE_LIMIT; i++) await evaluate(analyst).expect(200);
    const refused = await evaluate(analyst).expect(429);
    expect(refused.body.statusCode).toBe(429);
    await evaluate(reviewer).expect(200);
    for (let i = 0; i < 50; i++) await t.http().get('/api/health').expect(200);
  }, 60_000);
});
