import { describe, expect, it } from 'vitest';
import { niceTicks } from './ticks.js';

// Axis steps from the 1–2–5 series (common practice; Heckbert, Graphics Gems, 1990).
describe('nice axis ticks', () => {
  it('should widen the range to round bounds with steps of 1, 2 or 5 times a power of ten', () => {
    expect(niceTicks(0, 10600, 6)).toMatchObject({ min: 0, max: 12000, step: 2000, decimals: 0 });
    expect(niceTicks(0, 12, 7).values).toEqual([0, 2, 4, 6, 8, 10, 12]);
    expect(niceTicks(0.0021, 0.0968, 6)).toMatchObject({ min: 0, max: 0.1, step: 0.02, decimals: 2 });
    expect(niceTicks(-2.62, 2.53, 6).values).toEqual([-3, -2, -1, 0, 1, 2, 3]);
  });

  it('should survive a flat or reversed range', () => {
    expect(niceTicks(5, 5).values.length).toBeGreaterThan(1);
    expect(niceTicks(0, 0).values).toContain(0);
    expect(niceTicks(10, 0).min).toBe(0);
    expect(niceTicks(Number.NaN, 1).values.length).toBeGreaterThan(1);
  });
});
