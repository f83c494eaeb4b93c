import { describe, expect, it } from 'vitest';
import { SUMMARISED_FROM, type FitRowsChoice } from '../engine/calibration.js';
import { evaluateParsedStudy } from '../evaluate.js';
import type { StandardPoint, Study } from '../study.js';
import { parseStudy } from '../validate.js';
import { typicalStudy } from './helpers.js';

/** Invented standards: `levels` levels of `replicates` each (the last level one short), a slight curve and scatter. */
function standards(levels: number, replicates: number, options: { offset?: number; spacing?: number; excludeEvery?: number } = {}) {
  const { offset = 0, spacing = 0, excludeEvery = 0 } = options;
  const points: StandardPoint[] = [];
  for (let i = 0; i < levels * replicates - 1; i++) {
    const level = Math.floor(i / replicates);
    const x = spacing > 0 ? offset + spacing * level : 0.4 * (level + 1) ** 1.25;
    const signal = spacing > 0 ? 0.3 + 0.2 * (x - offset) : 0.012 + 0.2051 * x * (1 + 0.0004 * x);
    const scatter = 0.002 * (1 + 0.03 * (spacing > 0 ? level : x)) * Math.sin(7.3 * i + 1) + 0.0007 * Math.cos(3.1 * i);
    const point: StandardPoint = { x, y: signal + scatter, sd: 0.001 + 0.002 * (spacing > 0 ? 1 : x) * (1 + 0.2 * Math.sin(i)) };
    if (excludeEvery > 0 && i % excludeEvery === 3) point.excluded = { reason: 'injection fault' };
    points.push(point);
  }
  // Shuffled deterministically, so that levels are not contiguous in the study.
  return points
    .map((p, i) => ({ p, key: Math.sin(12.9898 * i) * 43758.5453 }))
    .sort((a, b) => a.key - b.key)
    .map(({ p }) => p);
}

function evaluate(template: Record<string, unknown>, points: StandardPoint[], rows: FitRowsChoice) {
  const accepted = parseStudy({ ...template, standards: [1, 2, 3, 4, 5].map((x) => ({ x, y: x, sd: 0.1 })) });
  const study: Study = { ...accepted, standards: points };
  try {
    return evaluateParsedStudy(study, study.standards, rows);
  } catch (error) {
    return { refused: error instanceof Error ? error.message : String(error) };
  }
}

interface Scales {
  /** The largest |x| and |y| of the standards (at least 1), and the smallest x above zero. */
  x: number;
  y: number;
  xLow: number;
}

/**
 * How far a figure of the per-level fit may lie from the per-standard one. Both add the same terms in another order, so
 * they agree to 1e-12 relative, except where a figure is a small difference of large numbers, which either path knows
 * only to the rounding of those numbers: near zero, 1e-11 of the responses' scale (a residual, an intercept); a per cent
 * of x divides a difference of x by x; the intercept's per cent of the top response divides the intercept by that
 * response, itself a sum of the intercept and the slope's share; Mandel's F divides the difference of two residual sums
 * of squares by one of them.
 */
function tolerance(path: string, a: number, b: number, scales: Scales, parent: Record<string, unknown>): number {
  const relative = 1e-12 * Math.max(Math.abs(a), Math.abs(b));
  let nearZero = 1e-11 * scales.y;
  if (/rePct|\.sumAbsRePct\./.test(path) || (path.startsWith('result.verdict') && parent.figure === 'range.rePct'))
    nearZero = (100 * 1e-11 * Math.max(scales.x, scales.y)) / scales.xLow;
  if (path.endsWith('interceptPctOfTopResponse')) {
    const intercept = Math.abs(parent.intercept as number);
    const known = Math.max(1e-12 * intercept, 1e-11 * scales.y);
    nearZero = ((Math.abs(a) * known) / intercept) * (1 + Math.abs(a) / 100);
  }
  if (path === 'result.mandel.F' || path === 'result.mandel.p') {
    const { df, sYXLinear, sYXQuadratic } = parent as { df: number[]; sYXLinear: number; sYXQuadratic: number };
    nearZero = 1e-12 * df[1] * (sYXLinear / sYXQuadratic) ** 2;
  }
  return Math.max(relative, nearZero);
}

/** Every leaf of the two results, walked together: same keys in the same order, same strings and flags, numbers within tolerance. */
function differences(a: unknown, b: unknown, scales: Scales, path = 'result', parent: Record<string, unknown> = {}, out: string[] = []) {
  if (typeof a === 'number' && typeof b === 'number') {
    const close = a === b || (Number.isNaN(a) && Number.isNaN(b)) || Math.abs(a - b) <= tolerance(path, a, b, scales, parent);
    if (!close) out.push(`${path}: ${a} per standard, ${b} per level`);
  } else if (Array.isArray(a) && Array.isArray(b)) {
    if (a.length !== b.length) out.push(`${path}: ${a.length} entries per standard, ${b.length} per level`);
    else a.forEach((value, i) => differences(value, b[i], scales, `${path}[${i}]`, parent, out));
  } else if (a && b && typeof a === 'object' && typeof b === 'object') {
    const [keysA, keysB] = [Object.keys(a), Object.keys(b)];
    const [recordA, recordB] = [a as Record<string, unknown>, b as Record<string, unknown>];
    if (keysA.join() !== keysB.join()) out.push(`${path}: keys ${keysA.join()} per standard, ${keysB.join()} per level`);
    else for (const key of keysA) differences(recordA[key], recordB[key], scales, `${path}.${key}`, recordA, out);
  } else if (a !== b) {
    out.push(`${path}: ${String(a)} per standard, ${String(b)} per level`);
  }
  return out;
}

type Result = ReturnType<typeof evaluate>;

/**
 * Where two candidate weightings give the same Σ|%RE| (with two levels every straight line passes through both level
 * means, whatever its weights), which one is "smallest" is rounding in either path: those words are not compared.
 */
function withoutTiedChoice(result: Result): Result {
  const copy = structuredClone(result);
  const check = 'homoscedasticity' in copy ? copy.homoscedasticity : null;
  if (!check) return copy;
  const sums = Object.values(check.sumAbsRePct).filter((v): v is number => v !== null);
  const tied = sums.some((v, i) => sums.some((w, j) => i !== j && Math.abs(v - w) <= 1e-9 * Math.abs(v)));
  if (tied) Object.assign(check, { smallestSumAbsRe: 'tied', recommendedWeighting: 'tied', advice: 'tied' });
  return copy;
}

const CASES: [string, Record<string, unknown>, () => StandardPoint[]][] = [
  ['unweighted, just above the bound', {}, () => standards(Math.ceil(SUMMARISED_FROM / 7), 7)],
  ['weighting 1/x', { weighting: '1/x' }, () => standards(800, 8)],
  ['weighting 1/x², 99 %', { weighting: '1/x2', confidence: 0.99 }, () => standards(1_200, 5)],
  ['weighting 1/s²', { weighting: '1/s2' }, () => standards(900, 6)],
  ['excluded standards', { weighting: '1/x' }, () => standards(700, 9, { excludeEvery: 11 })],
  ['quadratic', { model: 'quadratic' }, () => standards(500, 12)],
  ['quadratic, weighting 1/x', { model: 'quadratic', weighting: '1/x' }, () => standards(1_700, 3)],
  ['through the origin', { model: 'linear-through-origin' }, () => standards(600, 10)],
  ['x around 1e6 a few hundredths apart', {}, () => standards(1_000, 6, { offset: 1e6, spacing: 0.01 })],
  ['two levels', {}, () => standards(2, 3_000)],
  ['one level', {}, () => standards(1, 6_000)],
  ['every x distinct', { weighting: '1/x2' }, () => standards(6_000, 1)],
];

describe('a large study fitted on one row per standard level', () => {
  for (const [name, template, points] of CASES) {
    it(`gives every figure, flag, warning and per-standard table of the per-standard fit: ${name}`, () => {
      const study = { ...typicalStudy, ...template };
      const data = points();
      expect(data.filter((p) => !p.excluded).length).toBeGreaterThanOrEqual(SUMMARISED_FROM);
      const perStandard = evaluate(study, data, 'standards');
      const perLevel = evaluate(study, data, 'levels');
      const scales = {
        x: Math.max(1, ...data.map((p) => Math.abs(p.x))),
        y: Math.max(1, ...data.map((p) => Math.abs(p.y))),
        xLow: Math.min(...data.filter((p) => p.x > 0).map((p) => p.x)),
      };
      expect(differences(withoutTiedChoice(perStandard), withoutTiedChoice(perLevel), scales)).toEqual([]);
    });
  }

  it('is what the evaluation chooses beyond the list bound, and not below it', () => {
    const same = (a: Result, b: Result) => JSON.stringify(a) === JSON.stringify(b);
    const large = standards(2_000, 3);
    expect(same(evaluate(typicalStudy, large, 'levels-when-large'), evaluate(typicalStudy, large, 'levels'))).toBe(true);
    expect(same(evaluate(typicalStudy, large, 'levels-when-large'), evaluate(typicalStudy, large, 'standards'))).toBe(false);
    const small = standards(500, 10);
    expect(same(evaluate(typicalStudy, small, 'levels-when-large'), evaluate(typicalStudy, small, 'standards'))).toBe(true);
    const distinct = standards(SUMMARISED_FROM + 1, 1);
    expect(same(evaluate(typicalStudy, distinct, 'levels-when-large'), evaluate(typicalStudy, distinct, 'standards'))).toBe(true);
  });
});
