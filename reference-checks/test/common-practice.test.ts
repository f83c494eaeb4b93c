import { evaluateStudy, fitCalibration, predictUnknown } from '@meritline/shared';
import { describe, expect, it } from 'vitest';
import { expectRel, loadJson, standards } from './helpers.js';

function finiteEverywhere(value: unknown, path = ''): string[] {
  if (typeof value === 'number') return Number.isFinite(value) ? [] : [path];
  if (Array.isArray(value)) return value.flatMap((v, i) => finiteEverywhere(v, `${path}[${i}]`));
  if (value && typeof value === 'object') return Object.entries(value).flatMap(([k, v]) => finiteEverywhere(v, `${path}.${k}`));
  return [];
}

describe('Facts of the trade (common practice)', () => {
  it('a straight line through exact points has zero residuals and s_y/x = 0, with no division by zero', () => {
    const result = evaluateStudy({
      standards: standards([1, 2, 3, 4, 5, 1, 5], [5, 8, 11, 14, 17, 5, 17]),
      unknowns: [{ id: 'U1', y: [9.5] }],
      blanks: [0.5, 0.5, 0.5],
    });
    const cal = result.calibration!;
    expect(cal.residuals.every((e) => e === 0)).toBe(true);
    expect(cal.sYX).toBe(0);
    expect(cal.slope).toBe(3);
    expect(cal.intercept).toBe(2);
    expect(cal.r2).toBe(1);
    expect(cal.standardizedResiduals!.every((e) => e === 0)).toBe(true);
    expect(result.unknowns![0].x0).toBe(2.5);
    expect(result.unknowns![0].sX0).toBe(0);
    expect(result.detection!.sdResidual!.lod).toBe(0);
    expect(finiteEverywhere(result)).toEqual([]);
    expect(result.warnings.some((w) => w.code === 'non_finite')).toBe(false);
  });

  it('one-point and two-point calibrations agree exactly when the response at zero concentration is zero', () => {
    const onePoint = fitCalibration([{ x: 10, y: 52 }], { model: 'one-point' });
    const twoPoint = fitCalibration(standards([0, 10], [0, 52]), { model: 'two-point' });
    for (const y of [0.7, 13, 26, 52, 61.3]) {
      expect(predictUnknown(onePoint, [y]).x0).toBeCloseTo(predictUnknown(twoPoint, [y]).x0, 14);
    }
  });

  it("with a response at zero they agree only at the standard and differ by the intercept's share elsewhere", () => {
    const a = 2;
    const xs = 10;
    const ys = 52;
    const onePoint = fitCalibration([{ x: xs, y: ys }], { model: 'one-point' });
    const twoPoint = fitCalibration(standards([0, xs], [a, ys]), { model: 'two-point' });
    expect(predictUnknown(onePoint, [ys]).x0).toBeCloseTo(xs, 14);
    expect(predictUnknown(twoPoint, [ys]).x0).toBeCloseTo(xs, 14);
    for (const y of [5, 20, 40]) {
      const difference = predictUnknown(onePoint, [y]).x0 - predictUnknown(twoPoint, [y]).x0;
      // x0(one) − x0(two) = x_s · a (y_s − y) / (y_s (y_s − a))
      expect(difference).toBeCloseTo((xs * a * (ys - y)) / (ys * (ys - a)), 12);
    }
  });

  it('a two-point calibration at the ice point (0 °C) and the boiling point (100 °C, standard pressure) interpolates linearly', () => {
    const sensor = fitCalibration(standards([0, 100], [100.0, 138.51]), { model: 'two-point' });
    const reading = 119.4;
    const expected = (100 * (reading - 100.0)) / (138.51 - 100.0);
    expectRel(predictUnknown(sensor, [reading]).x0, expected, 1e-14, 'interpolated temperature');
    expect(predictUnknown(sensor, [100.0]).x0).toBe(0);
    expectRel(predictUnknown(sensor, [138.51]).x0, 100, 1e-14, 'boiling point');
  });

  it('a bracketing two-point calibration reads each unknown off the adjacent pair of levels', () => {
    const fit = fitCalibration(standards([0, 10, 20], [0, 10, 30]), { model: 'two-point', twoPoint: { bracketing: true } });
    expect(predictUnknown(fit, [5]).x0).toBe(5);
    expect(predictUnknown(fit, [20]).x0).toBe(15);
  });

  it('Miller & Miller fluorescence unknowns read through the regression model match the worked example (recomputed)', () => {
    const ref = loadJson('calibration_miller_fluorescence.json');
    const fit = fitCalibration(standards(ref.data.x, ref.data.y));
    for (const u of ref.computed.inverse_prediction) {
      const p = predictUnknown(fit, Array(u.m_replicates_of_unknown).fill(u.y0));
      expectRel(p.x0, u.x0, 1e-12, `x0 at ${u.y0}`);
      expectRel(p.sX0, u.s_x0, 1e-12, `s_x0 at ${u.y0}, m = ${u.m_replicates_of_unknown}`);
    }
  });
});
