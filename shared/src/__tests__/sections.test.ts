import { describe, expect, it } from 'vitest';
import { figureValue } from '../engine/criteria.js';
import { evaluateStudy } from '../evaluate.js';
import { points } from './helpers.js';

const replicated = [1, 2, 4, 8].flatMap((x) => [0.98, 1.0, 1.02].map((f, r) => ({ x, y: 0.05 + x * f + 0.001 * r })));

describe('criteria paths', () => {
  const result = {
    unknowns: [{ id: 'W-1', x0: 2.5 }],
    recovery: { byLevel: [{ level: 'low', meanPct: 98 }] },
    calibration: { r2: 0.999, sYX: null, ci: [1, 2] },
  };

  it('follows keys, indices, [i] and ids', () => {
    expect(figureValue(result, 'calibration.r2')).toBe(0.999);
    expect(figureValue(result, 'unknowns.0.x0')).toBe(2.5);
    expect(figureValue(result, 'unknowns[0].x0')).toBe(2.5);
    expect(figureValue(result, 'unknowns.W-1.x0')).toBe(2.5);
    expect(figureValue(result, 'recovery.byLevel.low.meanPct')).toBe(98);
    expect(figureValue(result, 'calibration.ci.1')).toBe(2);
  });

  it('gives null for missing, null or non-numeric figures', () => {
    expect(figureValue(result, 'calibration.sYX')).toBeNull();
    expect(figureValue(result, 'calibration.nothing')).toBeNull();
    expect(figureValue(result, 'calibration')).toBeNull();
    expect(figureValue(result, 'unknowns.9.x0')).toBeNull();
  });
});

describe('working range', () => {
  it('takes the longest run of adjacent levels where the per-level criteria hold', () => {
    const standards = [1, 2, 5, 10, 20].flatMap((x) => [0.99, 1.01].map((f) => ({ x, y: x * f + (x === 1 ? 0.4 : 0) })));
    const r = evaluateStudy({ standards, criteria: [{ figure: 'range.rePct', op: 'abs<=', value: 10 }] });
    expect(r.range!.basis).toBe('standards');
    expect(r.range!.levels[0].pass).toBe(false);
    expect([r.range!.low, r.range!.high]).toEqual([2, 20]);
    expect(r.verdict.criteria[0].pass).toBe(false);
    expect(Math.abs(r.verdict.criteria[0].value!)).toBeGreaterThan(10);
  });

  it('from recovery levels, placed at their mean added amount', () => {
    const recovery = [
      ...[0.8, 0.82, 0.79].map((found, i) => ({ id: `L${i}`, level: 'low', added: 1, found })),
      ...[9.9, 10.1, 10.0].map((found, i) => ({ id: `M${i}`, level: 'mid', added: 10, found })),
      ...[49.5, 50.2, 50.4].map((found, i) => ({ id: `H${i}`, level: 'high', added: 50, found })),
    ];
    const r = evaluateStudy({ recovery, criteria: [{ figure: 'range.recoveryPct', op: 'between', value: [90, 110] }] });
    expect(r.range).toMatchObject({ basis: 'recovery', low: 10, high: 50 });
  });
});

describe('detection flags and basis', () => {
  it('the approach named in the criteria decides belowLod / belowLoq', () => {
    const base = { standards: replicated, blanks: [0.049, 0.051, 0.05, 0.052], unknowns: [{ id: 'U', y: [0.12] }] };
    const byResidual = evaluateStudy(base);
    expect(byResidual.detection!.flagBasis).toBe('sdResidual');
    const byBlank = evaluateStudy({ ...base, criteria: [{ figure: 'detection.blankSd.lod', op: '<=', value: 1 }] });
    expect(byBlank.detection!.flagBasis).toBe('blankSd');
    expect(byBlank.unknowns![0].flags).not.toContain('belowLod');
  });

  it('one-point calibration: only blank-based limits and the MDL', () => {
    const r = evaluateStudy({
      model: 'one-point',
      standards: [
        { x: 5, y: 2.5 },
        { x: 5, y: 2.52 },
      ],
      blanks: [0.01, 0.013, 0.008],
    });
    expect(r.detection!.sdResidual).toBeNull();
    expect(r.detection!.iso11843).toBeNull();
    expect(r.detection!.blankSd!.slope).toBeCloseTo(2.51 / 5, 14);
  });
});

describe('unknowns', () => {
  it('range flags, dilution and the interval', () => {
    const r = evaluateStudy({
      standards: replicated,
      unknowns: [
        { id: 'hi', y: [9.5], dilution: 10 },
        { id: 'lo', y: [0.5, 0.52] },
      ],
    });
    const [hi, lo] = r.unknowns!;
    expect(hi.flags).toContain('aboveRange');
    expect(hi.x0).toBeGreaterThan(80);
    expect(hi.ci![0]).toBeLessThan(hi.x0);
    expect(lo.flags).toContain('belowRange');
    expect(lo.m).toBe(2);
  });

  it('bracketing: an unknown outside the levels is read off the nearest pair and flagged', () => {
    const r = evaluateStudy({
      model: 'two-point',
      twoPoint: { bracketing: true },
      standards: points([1, 2, 4], [1, 2, 6]),
      unknowns: [{ id: 'A', y: [8] }],
    });
    expect(r.unknowns![0].x0).toBeCloseTo(5, 14);
    expect(r.unknowns![0].flags).toEqual(['aboveRange']);
    expect(r.calibration!.segments).toHaveLength(2);
  });
});

describe('precision', () => {
  it('one series: repeatability only, with a warning', () => {
    const r = evaluateStudy({ precision: [5.1, 5.0, 5.2, 4.9].map((value) => ({ group: 'day 1', value })) });
    expect(r.precision!.k).toBe(1);
    expect(r.precision!.sI).toBe(r.precision!.sR);
    expect(r.precision!.sBetween).toBeNull();
    expect(r.warnings.some((w) => w.code === 'one_series')).toBe(true);
  });

  it('no replicate at all: null with a warning', () => {
    const r = evaluateStudy({
      precision: [
        { group: 'a', value: 1 },
        { group: 'b', value: 2 },
      ],
    });
    expect(r.precision).toBeNull();
    expect(r.warnings.some((w) => w.section === 'precision' && w.code === 'too_few')).toBe(true);
  });

  it('Horwitz ratio with a mass fraction of 1e-6 (PRSD_R 16 %)', () => {
    const r = evaluateStudy({
      massFraction: 1e-6,
      precision: [1.0, 1.2, 0.9, 1.1, 1.3, 0.8].map((value, i) => ({ group: `d${i % 2}`, value })),
    });
    expect(r.precision!.horwitz!.predictedRsd).toBeCloseTo(16, 12);
    expect(r.precision!.horwitz!.horRat).toBeCloseTo(r.precision!.rsdI! / 16, 12);
  });
});

describe('outliers', () => {
  it('points into the standards array and tests Cochran across the levels', () => {
    const standards = [...replicated];
    standards[7] = { x: 4, y: 6.5 };
    const flags = evaluateStudy({ standards }).outliers!;
    const level = flags.filter((f) => f.set === 'standards x=4');
    expect(level.map((f) => f.test).sort()).toEqual(['dixon', 'grubbs']);
    expect(level.every((f) => f.index === 7)).toBe(true);
    const cochran = flags.find((f) => f.test === 'cochran' && f.set === 'standard levels')!;
    expect(cochran.index).toBe(2);
    expect(cochran.outlier).toBe(true);
    expect(flags.some((f) => f.test === 'standardizedResidual')).toBe(true);
  });

  it('identical values are no outliers', () => {
    const flags = evaluateStudy({ blanks: [0.1, 0.1, 0.1, 0.1] }).outliers!;
    expect(flags.every((f) => !f.outlier && f.statistic === 0)).toBe(true);
  });
});
