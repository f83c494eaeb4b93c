import { describe, expect, it } from 'vitest';
import {
  detectionDelta,
  fCdf,
  fQuantile,
  fUpper,
  incompleteBeta,
  noncentralTCdf,
  studentCdf,
  studentQuantile,
} from '../engine/distributions.js';

describe('distributions', () => {
  it('closed forms: t with 1 df is Cauchy, t with 2 df has an algebraic cdf', () => {
    for (const t of [-3, -0.5, 0.2, 1, 12.7]) {
      expect(studentCdf(t, 1)).toBeCloseTo(0.5 + Math.atan(t) / Math.PI, 14);
      expect(studentCdf(t, 2)).toBeCloseTo(0.5 + t / (2 * Math.sqrt(2 + t * t)), 14);
    }
  });

  it('quantiles invert the cdfs', () => {
    for (const df of [1, 2, 5, 30, 1000]) {
      for (const p of [0.9, 0.975, 0.99, 0.99975]) expect(studentCdf(studentQuantile(p, df), df)).toBeCloseTo(p, 13);
    }
    for (const [d1, d2] of [
      [1, 1],
      [3, 17],
      [20, 4],
    ]) {
      const f = fQuantile(0.95, d1, d2);
      expect(fCdf(f, d1, d2)).toBeCloseTo(0.95, 13);
      expect(fUpper(f, d1, d2)).toBeCloseTo(0.05, 13);
    }
  });

  it('the incomplete beta at symmetric points', () => {
    expect(incompleteBeta(0.5, 3, 3)).toBeCloseTo(0.5, 14);
    expect(incompleteBeta(0.3, 1, 1)).toBeCloseTo(0.3, 14);
  });

  it("the non-central t reduces to Student's t at δ = 0 and δ solves the ISO 11843-2 condition", () => {
    expect(noncentralTCdf(1.3, 7, 0)).toBeCloseTo(studentCdf(1.3, 7), 15);
    const delta = detectionDelta(8, 0.05, 0.05);
    expect(noncentralTCdf(studentQuantile(0.95, 8), 8, delta)).toBeCloseTo(0.05, 13);
    expect(delta).toBeLessThan(2 * studentQuantile(0.95, 8));
  });
});
