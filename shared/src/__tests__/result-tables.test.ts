import { describe, expect, it } from 'vitest';
import { hypot } from '../engine/quadratic.js';
import { evaluateParsedStudy, evaluateStudy } from '../evaluate.js';
import { parseStudy } from '../validate.js';
import { typicalStudy } from './helpers.js';

describe('per-standard tables built on first read', () => {
  it('give the same JSON through JSON.stringify, structuredClone and a spread', () => {
    const result = evaluateStudy(typicalStudy);
    const text = JSON.stringify(result);
    expect(JSON.stringify(structuredClone(result))).toBe(text);
    expect(JSON.stringify({ ...result, calibration: { ...result.calibration } })).toBe(text);
    expect(Object.keys(result.calibration!).slice(-8)).toEqual([
      'anova',
      'xMin',
      'xMax',
      'residuals',
      'backCalculated',
      'levels',
      'segments',
      'excluded',
    ]);
  });

  it('keep a value written over them', () => {
    const calibration = evaluateStudy(typicalStudy).calibration!;
    calibration.residuals = [1, 2];
    expect(calibration.residuals).toEqual([1, 2]);
    expect(JSON.parse(JSON.stringify(calibration)).residuals).toEqual([1, 2]);
  });

  it('are the same from standards passed by columns as from one object per standard', () => {
    const study = parseStudy(typicalStudy);
    const standards = study.standards!;
    const columns = { x: Float64Array.from(standards, (s) => s.x), y: Float64Array.from(standards, (s) => s.y) };
    expect(JSON.stringify(evaluateParsedStudy(study, columns))).toBe(JSON.stringify(evaluateParsedStudy(study)));
  });

  it('report a non-finite back-calculated %RE as null with its place, as the rows always did', () => {
    // Invented standards: the lowest x is so small that its %RE overflows.
    const result = evaluateStudy({
      standards: [
        { x: 1e-310, y: 0.5 },
        { x: 1, y: 1 },
        { x: 2, y: 2 },
        { x: 3, y: 3 },
      ],
    });
    expect(result.calibration!.backCalculated[0].rePct).toBeNull();
    expect(result.warnings.map((w) => w.message)).toContain(
      'calibration.backCalculated[0].rePct could not be computed (non-finite) and is reported as null',
    );
  });
});

describe('the Householder norm', () => {
  it('equals Math.hypot bit for bit', () => {
    // Deterministic pseudo-random magnitudes over 600 binary orders, signs and the special values.
    let seed = 12345;
    const next = () => (seed = (Math.imul(seed, 1103515245) + 12345) >>> 0) / 2 ** 32;
    const values = [0, -0, 1, -1, Infinity, -Infinity, NaN, Number.MIN_VALUE, Number.MAX_VALUE, 2 ** -1074, 1e-300, 1e300];
    for (let i = 0; i < 5_000; i++) values.push((next() - 0.5) * 2 ** Math.floor(600 * next() - 300));
    const differing: [number, number][] = [];
    for (let i = 0; i < values.length; i++) {
      const a = values[i];
      for (const b of [values[(i * 7919 + 1) % values.length], a * (1 + next()), -a / 3]) {
        if (!Object.is(hypot(a, b), Math.hypot(a, b)) || !Object.is(hypot(b, a), Math.hypot(b, a))) differing.push([a, b]);
      }
    }
    expect(differing).toEqual([]);
  });
});
