import { evaluateStudy } from '@meritline/shared';
import { describe, expect, it } from 'vitest';
import { expectRel, loadJson, standards } from './helpers.js';

const ref = loadJson('lack_of_fit_and_mandel.json').datasets;
const pontius = ref.pontius_load_cell;

describe('Lack-of-fit F on the Pontius load-cell data (NIST/SEMATECH e-Handbook 4.6.1)', () => {
  const data = standards(pontius.data.x_load, pontius.data.y_deflection);

  it('straight line: F against exact rational arithmetic (reference file) and the printed e-Handbook value', () => {
    const lof = evaluateStudy({ model: 'linear', standards: data }).lackOfFit!;
    expectRel(lof.F, pontius.exact_rational_linear.F_lack_of_fit, 1e-9, 'F exact');
    expectRel(lof.ssPureError, pontius.exact_rational_linear.SS_pure_error, 1e-9, 'SS pure error');
    expect(lof.dfLackOfFit).toBe(18);
    expect(lof.dfPureError).toBe(20);
    // e-Handbook printout agrees with exact arithmetic to about 6 digits only (reference file).
    expectRel(lof.F, pontius.published.lack_of_fit_F, 1e-5, 'F printed');
    expectRel(
      lof.critical,
      pontius.published.F_crit_0_05_18_20 ?? pontius.published['F_crit_0.05_18_20'],
      5e-3,
      'F(0.95; 18, 20) printed 2.15',
    );
    expect(lof.significant).toBe(true);
    expectRel(lof.p, pontius.recomputed_linear.p_value, 1e-6, 'p');
  });

  it('straight line: the e-Handbook printout of the fit (Dataplot, about 6 digits)', () => {
    const published = pontius.published;
    const cal = evaluateStudy({ model: 'linear', standards: data }).calibration!;
    expectRel(cal.intercept, published.B0, 1e-5, 'B0');
    expectRel(cal.slope, published.B1, 1e-5, 'B1');
    expectRel(cal.seIntercept, published.sd_B0, 1e-4, 'sd B0 (4 digits printed)');
    expectRel(cal.seSlope, published.sd_B1, 1e-4, 'sd B1 (4 digits printed)');
    expectRel(cal.sYX, published.residual_sd, 1e-5, 'residual SD');
    expect(cal.df).toBe(published.residual_df);
  });

  it('quadratic: F = 0.81072 (printed 0.8107, from memory), not significant', () => {
    const lof = evaluateStudy({ model: 'quadratic', standards: data }).lackOfFit!;
    expectRel(lof.F, pontius.recomputed_quadratic.F_lack_of_fit, 1e-9, 'F');
    expect(lof.dfLackOfFit).toBe(17);
    expect(Number(lof.F.toFixed(4))).toBe(pontius.published_quadratic_from_memory.lack_of_fit_F);
    expectRel(lof.p, pontius.recomputed_quadratic.p_value, 1e-9, 'p');
    expect(lof.significant).toBe(false);
  });
});

describe("Mandel's fitting test (ISO 8466-1 / DIN 38402-51; values recomputed in the reference file)", () => {
  const series = [
    ['Pontius load cell', pontius.data.x_load, pontius.data.y_deflection, pontius.mandel],
    [
      'fluorescence, 7 standards',
      ref.fluorescence_7_standards.data.x,
      ref.fluorescence_7_standards.data.y,
      ref.fluorescence_7_standards.mandel,
    ],
    [
      'fluorescence, 11 standards',
      ref.fluorescence_11_standards_extended.data.x,
      ref.fluorescence_11_standards_extended.data.y,
      ref.fluorescence_11_standards_extended.mandel,
    ],
  ] as const;

  it.each(series)('%s', (_name, x, y, expected) => {
    const mandel = evaluateStudy({ standards: standards(x, y) }).mandel!;
    expectRel(mandel.F, expected.PG_test_value, 1e-9, 'PG');
    expectRel(mandel.sYXLinear, expected.s_y1_linear, 1e-12, 's_y1');
    expectRel(mandel.sYXQuadratic, expected.s_y2_quadratic, 1e-9, 's_y2');
    expectRel(mandel.critical, expected.F_crit, 1e-12, 'F(0.99; 1, N − 3)');
    expectRel(mandel.p, expected.p_value, 1e-6, 'p');
    expect(mandel.df).toEqual(expected.df);
    expect(mandel.significant).toBe(expected.quadratic_significantly_better);
  });
});
