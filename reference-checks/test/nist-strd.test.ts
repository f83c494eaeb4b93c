import { evaluateStudy } from '@meritline/shared';
import { describe, expect, it } from 'vitest';
import { expectRel, loadJson, standards } from './helpers.js';

// NIST StRD certified values (15 significant digits): required here to at least 9 (relative 1e-9).
const NINE_DIGITS = 1e-9;

describe('NIST StRD Norris: straight line, certified values', () => {
  const ref = loadJson('nist_strd_norris.json');
  const cert = ref.certified;
  const cal = evaluateStudy({ model: 'linear', standards: standards(ref.data.x, ref.data.y) }).calibration!;

  it('reproduces the estimates and their standard deviations', () => {
    expectRel(cal.intercept, cert.parameters.B0.estimate, NINE_DIGITS, 'B0');
    expectRel(cal.slope, cert.parameters.B1.estimate, NINE_DIGITS, 'B1');
    expectRel(cal.seIntercept, cert.parameters.B0.sd, NINE_DIGITS, 'sd B0');
    expectRel(cal.seSlope, cert.parameters.B1.sd, NINE_DIGITS, 'sd B1');
  });

  it('reproduces the residual SD, R² and the ANOVA table', () => {
    expectRel(cal.sYX, cert.residual_standard_deviation, NINE_DIGITS, 'residual SD');
    expectRel(cal.r2, cert.r_squared, NINE_DIGITS, 'R²');
    expect(cal.anova!.dfRegression).toBe(cert.anova.regression.df);
    expect(cal.anova!.dfResidual).toBe(cert.anova.residual.df);
    expectRel(cal.anova!.ssRegression, cert.anova.regression.ss, NINE_DIGITS, 'SS regression');
    expectRel(cal.anova!.msRegression, cert.anova.regression.ms, NINE_DIGITS, 'MS regression');
    expectRel(cal.anova!.F, cert.anova.regression.F, NINE_DIGITS, 'F');
    expectRel(cal.anova!.ssResidual, cert.anova.residual.ss, NINE_DIGITS, 'SS residual');
    expectRel(cal.anova!.msResidual, cert.anova.residual.ms, NINE_DIGITS, 'MS residual');
  });
});

describe('NIST StRD Pontius: quadratic, certified values', () => {
  const ref = loadJson('nist_strd_pontius.json');
  const cert = ref.certified;
  const cal = evaluateStudy({ model: 'quadratic', standards: standards(ref.data.x, ref.data.y) }).calibration!;

  it('reproduces B0, B1, B2 and their standard deviations', () => {
    expectRel(cal.intercept, cert.parameters.B0.estimate, NINE_DIGITS, 'B0');
    expectRel(cal.slope, cert.parameters.B1.estimate, NINE_DIGITS, 'B1');
    expectRel(cal.curvature, cert.parameters.B2.estimate, NINE_DIGITS, 'B2');
    expectRel(cal.seIntercept, cert.parameters.B0.sd, NINE_DIGITS, 'sd B0');
    expectRel(cal.seSlope, cert.parameters.B1.sd, NINE_DIGITS, 'sd B1');
    expectRel(cal.seCurvature, cert.parameters.B2.sd, NINE_DIGITS, 'sd B2');
  });

  it('reproduces the residual SD, R² and the ANOVA table', () => {
    expectRel(cal.sYX, cert.residual_standard_deviation, NINE_DIGITS, 'residual SD');
    expectRel(cal.r2, cert.r_squared, NINE_DIGITS, 'R²');
    expect(cal.anova!.dfRegression).toBe(2);
    expect(cal.anova!.dfResidual).toBe(37);
    expectRel(cal.anova!.ssRegression, cert.anova.regression.ss, NINE_DIGITS, 'SS regression');
    expectRel(cal.anova!.msRegression, cert.anova.regression.ms, NINE_DIGITS, 'MS regression');
    expectRel(cal.anova!.F, cert.anova.regression.F, NINE_DIGITS, 'F');
    expectRel(cal.anova!.ssResidual, cert.anova.residual.ss, NINE_DIGITS, 'SS residual');
    expectRel(cal.anova!.msResidual, cert.anova.residual.ms, NINE_DIGITS, 'MS residual');
  });
});

describe.each(['nist_strd_noint1.json', 'nist_strd_noint2.json'])('NIST StRD %s: line through the origin, certified values', (file) => {
  const ref = loadJson(file);
  const cert = ref.certified;
  const cal = evaluateStudy({ model: 'linear-through-origin', standards: standards(ref.data.x, ref.data.y) }).calibration!;

  it('reproduces B1, its SD, the residual SD and the uncentred R²', () => {
    expectRel(cal.slope, cert.parameters.B1.estimate, NINE_DIGITS, 'B1');
    expectRel(cal.seSlope, cert.parameters.B1.sd, NINE_DIGITS, 'sd B1');
    expectRel(cal.sYX, cert.residual_standard_deviation, NINE_DIGITS, 'residual SD');
    expectRel(cal.r2, cert.r_squared, NINE_DIGITS, 'R² (uncentred)');
    expect(cal.intercept).toBe(0);
  });

  it('reproduces the uncentred ANOVA table', () => {
    expect(cal.anova!.dfRegression).toBe(1);
    expect(cal.anova!.dfResidual).toBe(cert.anova.residual.df);
    expectRel(cal.anova!.ssRegression, cert.anova.regression.ss, NINE_DIGITS, 'SS regression');
    expectRel(cal.anova!.F, cert.anova.regression.F, NINE_DIGITS, 'F');
    expectRel(cal.anova!.ssResidual, cert.anova.residual.ss, NINE_DIGITS, 'SS residual');
    expectRel(cal.anova!.msResidual, cert.anova.residual.ms, NINE_DIGITS, 'MS residual');
  });
});

function anovaStudy(file: string) {
  const ref = loadJson(file);
  const precision = ref.data.group.map((g: number, i: number) => ({ group: `instrument ${g}`, value: ref.data.value[i] }));
  return { ref, result: evaluateStudy({ precision }).precision! };
}

describe('NIST StRD ANOVA SiRstv: one-way layout, certified values', () => {
  const { ref, result } = anovaStudy('nist_strd_anova_sirstv.json');
  const cert = ref.certified;

  it('reproduces the between and within rows to 9 digits', () => {
    expect(result.dfBetween).toBe(cert.between.df);
    expect(result.dfWithin).toBe(cert.within.df);
    expectRel(result.ssBetween, cert.between.ss, NINE_DIGITS, 'SS between');
    expectRel(result.msBetween, cert.between.ms, NINE_DIGITS, 'MS between');
    expectRel(result.F, cert.between.F, NINE_DIGITS, 'F');
    expectRel(result.ssWithin, cert.within.ss, NINE_DIGITS, 'SS within');
    expectRel(result.msWithin, cert.within.ms, NINE_DIGITS, 'MS within');
    expectRel(result.sR, cert.residual_sd, NINE_DIGITS, 'residual SD');
    const r2 = result.ssBetween! / (result.ssBetween! + result.ssWithin);
    expectRel(r2, cert.r_squared, NINE_DIGITS, 'R²');
  });

  it('derives s_r, s_L and s_R as recomputed in the reference file (ISO 5725-2 one-way model; recomputed, not certified)', () => {
    const derived = ref.derived_precision_estimates_not_certified;
    expectRel(result.sR, derived.s_r, 1e-9, 's_r');
    expectRel(result.sBetween, derived.s_L, 1e-9, 's_L');
    expectRel(result.sI, derived.s_R, 1e-9, 's_R');
    expectRel(result.grandMean, derived.grand_mean, 1e-12, 'grand mean');
    expectRel(result.p, derived['F_p_value (upper tail, scipy)'], 1e-9, 'p');
  });
});

describe('NIST StRD ANOVA AtmWtAg: 7 constant leading digits, certified values', () => {
  const { ref, result } = anovaStudy('nist_strd_anova_atmwtag.json');
  const cert = ref.certified;
  // 6 digits are asked of this set (the reference file's plain two-pass float64 gives 8.5); shifting
  // the data by their first value before any sum keeps about 10, so 9 are checked.
  const NINE_DIGITS_SHIFTED = 1e-9;

  it('reproduces the between and within rows to 9 digits', () => {
    expectRel(result.ssBetween, cert.between.ss, NINE_DIGITS_SHIFTED, 'SS between');
    expectRel(result.msBetween, cert.between.ms, NINE_DIGITS_SHIFTED, 'MS between');
    expectRel(result.F, cert.between.F, NINE_DIGITS_SHIFTED, 'F');
    expectRel(result.ssWithin, cert.within.ss, NINE_DIGITS_SHIFTED, 'SS within');
    expectRel(result.msWithin, cert.within.ms, NINE_DIGITS_SHIFTED, 'MS within');
    expectRel(result.sR, cert.residual_sd, NINE_DIGITS_SHIFTED, 'residual SD');
  });
});
