import { describe, expect, it } from 'vitest';
import { evaluateStudy } from '../evaluate.js';

/** Two replicates at each end: F(0.99; 1, 1) = 4052, so only an extreme variance ratio is significant. */
const levelBias = [0.01, -0.02, 0.015, -0.01, 0.02, -0.015];
const duplicates = [0.5, 1, 2, 5, 10, 20].flatMap((x, level) =>
  [-1, 1].map((sign) => ({ x, y: 0.004 + 0.1 * x * (1 + levelBias[level]) + sign * 0.001 * x })),
);

describe('weighting recommendation', () => {
  it('recommends no weighting when the variance ratio is not significant, whatever Σ|%RE| says', () => {
    const h = evaluateStudy({ standards: duplicates }).homoscedasticity!;
    expect(h.df).toEqual([1, 1]);
    expect(h.F).toBeCloseTo(1600, 6);
    expect(h.critical).toBeCloseTo(4052.18, 1);
    expect(h.significant).toBe(false);
    expect(h.smallestSumAbsRe).toBe('1/x2');
    expect(h.recommendedWeighting).toBe('none');
    expect(h.advice).toMatch(/does not show unequal variances/);
    expect(h.advice).toMatch(/rests on that sum alone/);
    expect(h.advice).toMatch(/percentage points/);
  });

  it('recommends the smallest Σ|%RE| when the variance ratio is significant', () => {
    const standards = [1, 5, 25].flatMap((x) => [0.97, 1.0, 1.03].map((f) => ({ x, y: x * f + 0.02 })));
    const h = evaluateStudy({ standards }).homoscedasticity!;
    expect(h.significant).toBe(true);
    expect(h.recommendedWeighting).toBe(h.smallestSumAbsRe);
    expect(h.advice).toMatch(/weighting is justified/);
  });
});
