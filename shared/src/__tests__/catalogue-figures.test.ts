import { describe, expect, it } from 'vitest';
import { describeCriterion, figureLabel, FIGURES, figureUnit } from '../catalogue/figures.js';

describe('figure catalogue', () => {
  it('describes a criterion in words from its figure, comparison and limit', () => {
    expect(describeCriterion({ figure: 'calibration.r2', op: '>=', value: 0.999 })).toBe('Coefficient of determination R² at least 0.999');
    expect(describeCriterion({ figure: 'recovery.overall.meanPct', op: 'between', value: [98, 102] })).toBe(
      'Mean recovery, all levels from 98 to 102 %',
    );
    expect(describeCriterion({ figure: 'interceptTest.interceptPctOfTopResponse', op: 'abs<=', value: 2 })).toBe(
      'Intercept as % of the top response within ±2 %',
    );
    expect(describeCriterion({ figure: 'detection.sdResidual.loq', op: '<=', value: 0.5 }, { x: 'mg/L' })).toBe(
      'LOQ from the residual SD at most 0.5 mg/L',
    );
  });

  it('never shows a code path, even for a figure it has no entry for', () => {
    for (const text of [figureLabel('recovery.byLevel.low.meanPct'), figureLabel('precision.sBetween'), figureLabel('unknowns[0].x0')]) {
      expect(text).not.toMatch(/\.|\[|[a-z][A-Z]/);
    }
    expect(figureLabel('recovery.byLevel.low.meanPct')).toBe('Mean recovery at level low');
  });

  it('knows the unit of every figure it lists', () => {
    expect(new Set(FIGURES.map((f) => f.key)).size).toBe(FIGURES.length);
    expect(figureUnit('precision.rsdR')).toBe('%');
    expect(figureUnit('calibration.intercept', { y: 'mAU' })).toBe('mAU');
    expect(figureUnit('calibration.r2')).toBeUndefined();
  });
});
