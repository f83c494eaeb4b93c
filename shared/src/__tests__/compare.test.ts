import { describe, expect, it } from 'vitest';
import { COMPARISON_VERDICT_LABELS } from '../catalogue/comparisons.js';
import { compareResults, compareVariances, equivalenceTest, intermediatePrecisionDf, welchTest } from '../engine/compare.js';
import { evaluateStudy } from '../evaluate.js';
import { nonFinitePaths, typicalStudy } from './helpers.js';

const earlier = evaluateStudy(typicalStudy);
/** The same study with a 20 % more sensitive detector and slightly different recoveries. */
const later = evaluateStudy({
  ...typicalStudy,
  standards: typicalStudy.standards.map((s) => ({ ...s, y: 1.2 * s.y })),
  recovery: typicalStudy.recovery.map((r) => ({ ...r, found: r.found * 1.004 })),
});

describe('compareResults', () => {
  const comparison = compareResults(earlier, later);

  it('finds the sensitivity change and reports it in per cent', () => {
    expect(comparison.slope.available).toBe(true);
    if (!comparison.slope.available) return;
    expect(comparison.slope.verdict).toBe('different');
    expect(comparison.slope.changePct).toBeCloseTo(20, 6);
    expect(comparison.slope.df).toBe(earlier.calibration!.n + later.calibration!.n - 4);
    expect(comparison.slope.ci[0]).toBeLessThan(comparison.slope.difference);
  });

  it('judges near-identical recoveries equivalent within the default 5-point margin', () => {
    expect(comparison.recoveryMarginPct).toBe(5);
    expect(comparison.recovery.verdict).toBe('equivalent');
    expect(comparison.recovery.welch.available && comparison.recovery.welch.verdict).toBe('no-difference');
  });

  it('finds no difference in precision between identical precision data', () => {
    expect(comparison.repeatability.available && comparison.repeatability.F).toBeCloseTo(1, 12);
    expect(comparison.intermediatePrecision.available && comparison.intermediatePrecision.dfNote).toMatch(/Satterthwaite/);
  });

  it('lists figures, LOD/LOQ ratios and the range, with no NaN or infinity', () => {
    expect(comparison.figures.find((f) => f.figure === 'calibration.slope')?.ratio).toBeCloseTo(1.2, 9);
    const residual = comparison.detection.find((d) => d.approach === 'sdResidual');
    expect(residual?.lodRatio).toBeCloseTo(1, 9);
    expect(comparison.range.available).toBe(true);
    expect(nonFinitePaths(comparison)).toEqual([]);
  });

  it('says which test cannot be made and why, instead of failing', () => {
    const recoveryOnly = evaluateStudy({ recovery: typicalStudy.recovery });
    const partial = compareResults(recoveryOnly, later);
    expect(partial.slope).toEqual({ available: false, reason: expect.stringMatching(/calibration is missing/) });
    expect(partial.repeatability.available).toBe(false);
    expect(partial.recovery.tost.available).toBe(true);
  });

  it('has words for every verdict', () => {
    expect(Object.values(COMPARISON_VERDICT_LABELS)).toEqual([
      'no significant difference',
      'significantly different',
      'equivalent within the margin',
      'inconclusive',
    ]);
  });
});

describe('the two-sample tests', () => {
  it('Satterthwaite df of s_I lies between the within- and the total df', () => {
    const { df, satterthwaite } = intermediatePrecisionDf(earlier.precision!);
    expect(satterthwaite).toBe(true);
    expect(df).toBeGreaterThan(earlier.precision!.dfBetween!);
    expect(df).toBeLessThanOrEqual(earlier.precision!.N - 1);
  });

  it('refuses what cannot be tested', () => {
    expect(compareVariances({ sd: 0, df: 4 }, { sd: 1, df: 4 }, 0.05).available).toBe(false);
    expect(welchTest({ n: 1, mean: 100, sd: 0 }, { n: 5, mean: 100, sd: 1 }, 0.05).available).toBe(false);
    expect(equivalenceTest({ n: 5, mean: 100, sd: 1 }, { n: 5, mean: 100, sd: 1 }, 0, 0.05).available).toBe(false);
  });

  it('a wider margin can only help equivalence', () => {
    const a = { n: 6, mean: 99, sd: 2 };
    const b = { n: 6, mean: 101.5, sd: 2 };
    const narrow = equivalenceTest(a, b, 2, 0.05);
    const wide = equivalenceTest(a, b, 6, 0.05);
    expect(narrow.available && narrow.verdict).toBe('inconclusive');
    expect(wide.available && wide.verdict).toBe('equivalent');
  });
});
