import { describe, expect, it } from 'vitest';
import { canonicalJson } from '../canonical.js';
import { bandAt, fitCalibration } from '../engine/calibration.js';
import { predictUnknown } from '../engine/inverse.js';
import { evaluateStudy } from '../evaluate.js';
import { ENGINE_VERSION } from '../version.js';
import { nonFinitePaths, points, typicalStudy } from './helpers.js';

const TOP_LEVEL = [
  'engineVersion',
  'model',
  'weighting',
  'calibration',
  'lackOfFit',
  'mandel',
  'interceptTest',
  'throughOrigin',
  'homoscedasticity',
  'unknowns',
  'detection',
  'recovery',
  'precision',
  'outliers',
  'range',
  'verdict',
];

describe('evaluateStudy on a full study', () => {
  const result = evaluateStudy(typicalStudy);

  it('has every top-level key of the result format', () => {
    for (const key of TOP_LEVEL) expect(result).toHaveProperty(key);
    expect(result.engineVersion).toBe(ENGINE_VERSION);
  });

  it('computes every section and never a NaN or an infinity', () => {
    for (const key of TOP_LEVEL) expect(result[key as keyof typeof result], key).not.toBeNull();
    expect(nonFinitePaths(result)).toEqual([]);
    expect(() => canonicalJson(result)).not.toThrow();
  });

  it('flags unknowns against the range and the detection limits', () => {
    const [, low, diluted] = result.unknowns!;
    expect(low.flags).toEqual(expect.arrayContaining(['belowRange', 'belowLod', 'belowLoq']));
    expect(diluted.dilution).toBe(2);
    const undiluted = predictUnknown(fitCalibration(typicalStudy.standards), diluted.ci ? [6.52, 6.49, 6.55] : []);
    expect(diluted.x0).toBeCloseTo(2 * undiluted.x0, 12);
    expect(diluted.sX0).toBeCloseTo(2 * (undiluted.sX0 as number), 12);
  });

  it('judges the criteria and the working range', () => {
    expect(result.verdict.criteria).toHaveLength(4);
    expect(result.verdict.criteria.every((c) => typeof c.pass === 'boolean')).toBe(true);
    expect(result.range).toMatchObject({ basis: 'standards', low: 0.5, high: 40 });
  });

  it('gives the same JSON for the same study (canonical form)', () => {
    expect(canonicalJson(evaluateStudy(typicalStudy))).toBe(canonicalJson(result));
  });
});

describe('sections null with a warning when their inputs are absent', () => {
  const result = evaluateStudy({ standards: points([1, 2, 3], [1.1, 1.9, 3.05]) });

  it.each(['lackOfFit', 'homoscedasticity', 'recovery', 'precision', 'unknowns', 'range'] as const)('%s', (section) => {
    expect(result[section]).toBeNull();
    expect(result.warnings.some((w) => w.section === section)).toBe(true);
  });

  it('a verdict without criteria passes nothing and fails nothing', () => {
    expect(result.verdict).toEqual({ criteria: [], pass: null });
  });

  it('no standards: no calibration, but precision still evaluated', () => {
    const r = evaluateStudy({
      precision: [
        { group: 'a', value: 1 },
        { group: 'a', value: 1.2 },
        { group: 'b', value: 1.1 },
      ],
    });
    expect(r.calibration).toBeNull();
    expect(r.precision).not.toBeNull();
    expect(r.warnings.some((w) => w.section === 'calibration')).toBe(true);
  });

  it('a criterion whose figure is null fails with value null', () => {
    const r = evaluateStudy({ standards: points([1, 2, 3], [1, 2, 3.1]), criteria: [{ figure: 'precision.rsdR', op: '<=', value: 2 }] });
    expect(r.verdict.criteria[0]).toMatchObject({ value: null, pass: false });
    expect(r.verdict.pass).toBe(false);
  });
});

describe('models', () => {
  it('excluded standards stay in the data but out of the fit', () => {
    const standards = [...points([1, 2, 3, 4], [1, 2, 3, 4]), { x: 5, y: 50, excluded: { reason: 'injection failed' } }];
    const cal = evaluateStudy({ standards }).calibration!;
    expect(cal.slope).toBeCloseTo(1, 14);
    expect(cal.n).toBe(4);
    expect(cal.excluded).toEqual([{ index: 4, x: 5, y: 50, reason: 'injection failed' }]);
  });

  it('weighted 1/x fit: Σw = n and the prediction band uses 1/w(x)', () => {
    const fit = fitCalibration(points([1, 2, 5, 10, 20], [1.05, 1.98, 5.1, 9.8, 20.6]), { weighting: '1/x' });
    expect(fit.calibration.sumWeights).toBeCloseTo(5, 12);
    const band = bandAt(fit, 10)!;
    expect(band.predictionHalfWidth).toBeGreaterThan(band.confidenceHalfWidth);
    const low = bandAt(fit, 1)!;
    expect(low.predictionHalfWidth).toBeLessThan(band.predictionHalfWidth);
  });

  it('weighted fits: detection uses the unweighted line and says so', () => {
    const r = evaluateStudy({ weighting: '1/x2', standards: points([1, 2, 5, 10, 20], [1.05, 1.98, 5.1, 9.8, 20.6]) });
    expect(r.warnings.some((w) => w.code === 'unweighted_line')).toBe(true);
    const plain = evaluateStudy({ standards: points([1, 2, 5, 10, 20], [1.05, 1.98, 5.1, 9.8, 20.6]) });
    expect(r.detection!.sdResidual).toEqual(plain.detection!.sdResidual);
  });

  it("quadratic: inverse prediction takes the root inside the standards' range", () => {
    const standards = points([0, 1, 2, 3, 4, 5], [0.02, 1.9, 3.6, 5.05, 6.3, 7.3]);
    const fit = fitCalibration(standards, { model: 'quadratic' });
    for (const x of [0.5, 2.5, 4.5]) {
      const y = fit.predict(x);
      expect(predictUnknown(fit, [y]).x0).toBeCloseTo(x, 10);
    }
    expect(fit.calibration.curvature).toBeLessThan(0);
  });

  it('two-point: no regression statistics', () => {
    const r = evaluateStudy({ model: 'two-point', standards: points([0, 10], [0.1, 5.1]), unknowns: [{ id: 'A', y: [2.6] }] });
    expect(r.calibration!.sYX).toBeNull();
    expect(r.calibration!.bands).toBeNull();
    expect(r.unknowns![0].x0).toBeCloseTo(5, 14);
    expect(r.unknowns![0].sX0).toBeNull();
    expect(r.lackOfFit).toBeNull();
  });

  it('check standards: found and recovery', () => {
    const r = evaluateStudy({ standards: points([0, 5, 10], [0, 5, 10]), checks: [{ id: 'CCV', nominal: 5, y: [5.1, 4.9, 5.05] }] });
    expect(r.checks![0].found).toBeCloseTo((5.1 + 4.9 + 5.05) / 3, 12);
    expect(r.checks![0].recoveryPct).toBeCloseTo((100 * r.checks![0].found) / 5, 12);
  });

  it('homoscedasticity recommends a weighting from the smallest Σ|%RE|', () => {
    const standards = [1, 5, 25].flatMap((x) => [0.97, 1.0, 1.03].map((f) => ({ x, y: x * f + 0.02 })));
    const h = evaluateStudy({ standards }).homoscedasticity!;
    expect(h.F).toBeCloseTo(625, 6);
    expect(h.significant).toBe(true);
    const sums = h.sumAbsRePct;
    const best = Math.min(...Object.values(sums).filter((v): v is number => v !== null));
    expect(sums[h.recommendedWeighting]).toBe(best);
  });
});
