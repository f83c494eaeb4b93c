import { describe, expect, it } from 'vitest';
import { fitCalibration } from '../index.js';

// Identity of weighted least squares (common practice): with s_y/x(w)² = Σ w e² / (n − 2),
// the standardised residuals √w·e / s_y/x(w) have squares summing to exactly n − 2.
describe('standardised residuals of weighted fits', () => {
  const standards = [1, 2, 5, 10, 20, 50, 100].flatMap((x, i) => [
    { x, y: 0.02 + 0.5 * x * (1 + 0.03 * Math.sin(i + 1)) },
    { x, y: 0.02 + 0.5 * x * (1 - 0.02 * Math.cos(i + 2)) },
  ]);

  for (const weighting of ['none', '1/x', '1/x2'] as const) {
    it(`should scale residuals by √w so their squares sum to n − 2 (${weighting})`, () => {
      const fit = fitCalibration(standards, { model: 'linear', weighting });
      const z = fit.calibration.standardizedResiduals!;
      const sumSquares = z.reduce((sum, value) => sum + value * value, 0);
      expect(sumSquares).toBeCloseTo(standards.length - 2, 9);
      expect(Math.max(...z.map(Math.abs))).toBeLessThan(3);
    });
  }
});
