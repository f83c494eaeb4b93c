import { compareLineParameter, compareVariances, equivalenceTest, welchTest, type SampleSummary } from '@meritline/shared';
import { describe, expect, it } from 'vitest';
import { expectAbs, expectRel, hasSharedReference, loadSharedJson } from './helpers.js';

const NINE_DIGITS = 1e-9;

function summary(values: number[]): SampleSummary {
  const n = values.length;
  const mean = values.reduce((s, v) => s + v, 0) / n;
  const sd = Math.sqrt(values.reduce((s, v) => s + (v - mean) ** 2, 0) / (n - 1));
  return { n, mean, sd };
}

/** Ordinary least squares of one group, as the calibration engine reports it. */
function line(x: number[], y: number[]) {
  const n = x.length;
  const xm = x.reduce((s, v) => s + v, 0) / n;
  const ym = y.reduce((s, v) => s + v, 0) / n;
  let sxx = 0;
  let sxy = 0;
  for (let i = 0; i < n; i++) {
    sxx += (x[i] - xm) ** 2;
    sxy += (x[i] - xm) * (y[i] - ym);
  }
  const b = sxy / sxx;
  const a = ym - b * xm;
  let sse = 0;
  for (let i = 0; i < n; i++) sse += (y[i] - a - b * x[i]) ** 2;
  const s = Math.sqrt(sse / (n - 2));
  return {
    slope: { estimate: b, s, df: n - 2, varianceFactor: 1 / sxx },
    intercept: { estimate: a, s, df: n - 2, varianceFactor: 1 / n + xm ** 2 / sxx },
  };
}

// UCLA IDRE statistics FAQ "How can I compare regression coefficients between two groups?" (fictional data;
// the per-group regressions are printed, the pooled-slope t is recomputed with scipy in the reference file).
describe.skipIf(!hasSharedReference('compare_two_slopes_ucla_example.json'))('two slopes: UCLA IDRE two-group example', () => {
  const ref = loadSharedJson('compare_two_slopes_ucla_example.json');
  const female = line(ref.data.female.x, ref.data.female.y);
  const male = line(ref.data.male.x, ref.data.male.y);
  const pooled = ref.computed.pooled_slope_test;

  it('reproduces the printed per-group slopes and their SEs', () => {
    expectRel(female.slope.estimate, '2.095872170', 1e-9, 'female slope (SAS)');
    expectRel(male.slope.estimate, '3.189727463', 1e-9, 'male slope (SAS)');
    expectRel(female.slope.s * Math.sqrt(female.slope.varianceFactor), '0.11049098', 1e-7, 'female slope SE (SAS)');
  });

  it('pooled-slope t on n1 + n2 − 4 df, its interval and verdict (recomputed)', () => {
    const result = compareLineParameter(female.slope, male.slope, 0.05, 'slope');
    expect(result.available).toBe(true);
    if (!result.available) return;
    expect(result.df).toBe(pooled.df);
    expectRel(result.difference, pooled.difference_b_male_minus_b_female, NINE_DIGITS, 'difference');
    expectRel(result.pooledSd ** 2, pooled['s_p^2'], NINE_DIGITS, 's_p²');
    expectRel(result.se, pooled.se_difference, NINE_DIGITS, 'SE');
    expectRel(result.t, pooled.t, NINE_DIGITS, 't');
    expectRel(result.p, pooled.p_two_sided, 1e-7, 'p');
    expectRel(result.ci[0], pooled.CI95_difference[0], NINE_DIGITS, 'CI low');
    expectRel(result.ci[1], pooled.CI95_difference[1], NINE_DIGITS, 'CI high');
    expect(result.verdict).toBe('different');
    expectRel(result.changePct, (100 * pooled.difference_b_male_minus_b_female) / ref.computed.female.b, NINE_DIGITS, 'change %');
  });

  it('the interaction model gives the same t with the other sign (recomputed)', () => {
    const result = compareLineParameter(male.slope, female.slope, 0.05, 'slope');
    if (!result.available) throw new Error(result.reason);
    expectRel(result.t, ref.computed.interaction_model_D_female.t[3], NINE_DIGITS, 't of the interaction term');
  });
});

// NIST/SEMATECH e-Handbook 1.3.5.9, F test for equal variances (JAHANMI2 batches, summary statistics) and its R output;
// e-Handbook 7.3.2 (old vs new assembly process) as printed in the Boost.Math documentation.
describe.skipIf(!hasSharedReference('compare_two_variances_f_test.json'))('two variances: NIST/SEMATECH F test', () => {
  const ref = loadSharedJson('compare_two_variances_f_test.json');

  it('JAHANMI2: F 1.123037, p 0.3704, CI of the ratio (R var.test)', () => {
    const { n1, sd1, n2, sd2 } = ref.examples.jahanmi2_batches.inputs;
    const result = compareVariances({ sd: sd2, df: n2 - 1 }, { sd: sd1, df: n1 - 1 }, 0.05);
    if (!result.available) throw new Error(result.reason);
    expectAbs(result.F, '1.123037', 5e-7, 'F (printed)');
    expectAbs(result.p, '0.3704', 5e-5, 'p (printed)');
    expectRel(result.ratioCi[0], '0.8709874', 2e-6, 'CI low (R, from raw data; printed SDs move the 7th digit)');
    expectRel(result.ratioCi[1], '1.4480271', 2e-6, 'CI high');
    const computed = ref.examples.jahanmi2_batches.computed_from_printed_sd;
    expectRel(result.p, computed.p_two_sided, NINE_DIGITS, 'p (recomputed)');
    expect(result.df).toEqual(computed.df);
    expect(result.verdict).toBe('no-difference');
  });

  it('assembly process: F 3.598, two-sided not rejected at 0.05', () => {
    const { n1, sd1, n2, sd2 } = ref.examples.assembly_process_old_vs_new.inputs;
    const result = compareVariances({ sd: sd2, df: n2 - 1 }, { sd: sd1, df: n1 - 1 }, 0.05);
    if (!result.available) throw new Error(result.reason);
    expectRel(result.F, ref.examples.assembly_process_old_vs_new.computed_from_printed_sd.F, NINE_DIGITS, 'F');
    expect(result.verdict).toBe('no-difference');
  });
});

// NIST/SEMATECH e-Handbook 1.3.5.3 (AUTO83B, US vs Japanese cars); Welch values as printed by the Boost.Math documentation.
describe.skipIf(!hasSharedReference('compare_two_means_nist_auto83b.json'))('two means: Welch test on NIST AUTO83B', () => {
  const ref = loadSharedJson('compare_two_means_nist_auto83b.json');
  const us = summary(ref.data.sample1_US_cars);
  const japan = summary(ref.data.sample2_Japanese_cars);
  const result = welchTest(japan, us, 0.05);

  it('reproduces the printed summary statistics', () => {
    expectAbs(us.mean, ref.published_summary_statistics.mean1, 5e-6, 'US mean');
    expectAbs(japan.sd, ref.published_summary_statistics.sd2, 5e-6, 'Japanese SD');
  });

  it('Welch ν 136.87, T −12.946, p 1.571e−25 (printed) and to nine digits of the recomputation', () => {
    if (!result.available) throw new Error(result.reason);
    const welch = ref.computed_from_raw_data.welch;
    expect(Math.floor(result.df * 100) / 100).toBe(136.87);
    expectAbs(result.t, '-12.946', 5e-4, 'T (printed)');
    expectRel(result.p, '1.571e-25', 5e-4, 'p (printed)');
    expectRel(result.df, welch.df, NINE_DIGITS, 'ν');
    expectRel(result.t, welch.T, NINE_DIGITS, 'T');
    expectRel(result.ci[0], welch.CI95_difference[0], NINE_DIGITS, 'CI low');
    expectRel(result.ci[1], welch.CI95_difference[1], NINE_DIGITS, 'CI high');
    expect(result.verdict).toBe('different');
  });
});

// TOST (Schuirmann 1987): the NCSS yield example as written into the TOSTER R package tests, and R equivalence::tost
// results stored in the statsmodels test suite (full-precision software output).
describe.skipIf(!hasSharedReference('equivalence_tost.json'))('equivalence: two one-sided tests', () => {
  const ref = loadSharedJson('equivalence_tost.json');
  const ncss = ref.examples.ncss_yield_two_sample;
  const yieldA = summary(ncss.data.A);
  const yieldB = summary(ncss.data.B);

  it.each([
    ['pooled_alpha_0.025', true, 0.025],
    ['welch_alpha_0.025', false, 0.025],
    ['pooled_alpha_0.05', true, 0.05],
    ['welch_alpha_0.05', false, 0.05],
  ] as const)('NCSS yields, %s', (key, pooled, alpha) => {
    const expected = ncss.computed[key];
    const result = equivalenceTest(yieldB, yieldA, ncss.margin.theta_U, alpha, pooled);
    if (!result.available) throw new Error(result.reason);
    expectRel(result.difference, expected.estimate, NINE_DIGITS, 'difference');
    expectRel(result.se, expected.se, NINE_DIGITS, 'SE');
    expectRel(result.df, expected.df, NINE_DIGITS, 'df');
    expectRel(result.pLower, expected.p_lower, 1e-8, 'p lower');
    expectRel(result.pUpper, expected.p_upper, 1e-8, 'p upper');
    expectRel(result.ci[0], expected['CI_1-2alpha'][0], NINE_DIGITS, 'CI low');
    expectRel(result.ci[1], expected['CI_1-2alpha'][1], NINE_DIGITS, 'CI high');
    expect(result.verdict).toBe(expected.equivalent_at_alpha ? 'equivalent' : 'inconclusive');
  });

  it.each([
    ['var1_welch_eps0.6', 'var1', false],
    ['var1_pooled_eps0.6', 'var1', true],
    ['var2_welch_eps0.6', 'var2', false],
  ] as const)('R equivalence::tost on the clinic data, %s', (key, variable, pooled) => {
    const clinic = ref.examples.clinic_R_equivalence_package;
    const expected = clinic.computed[key];
    const result = equivalenceTest(
      summary(clinic.data[`${variable}_group2`]),
      summary(clinic.data[`${variable}_group1`]),
      0.6,
      0.05,
      pooled,
    );
    if (!result.available) throw new Error(result.reason);
    expectRel(result.se, expected.se, 1e-12, 'SE');
    expectRel(result.df, expected.df, 1e-12, 'df');
    expectRel(result.p, expected.p_TOST, 1e-10, 'TOST p');
    expectRel(result.ci[0], expected['CI_1-2alpha'][0], 1e-10, 'CI low');
    expect(result.verdict).toBe(expected.equivalent_at_alpha ? 'equivalent' : 'inconclusive');
  });
});
