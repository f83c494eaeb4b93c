import { expect } from 'vitest';
import { StudyValidationError, type StudyFieldError } from '../errors.js';

/** Paths of every non-finite number in a value (JSON would print them as null). */
export function nonFinitePaths(value: unknown, path = ''): string[] {
  if (typeof value === 'number') return Number.isFinite(value) ? [] : [path];
  if (Array.isArray(value)) return value.flatMap((v, i) => nonFinitePaths(v, `${path}[${i}]`));
  if (value && typeof value === 'object') return Object.entries(value).flatMap(([k, v]) => nonFinitePaths(v, `${path}.${k}`));
  return [];
}

export function validationErrors(run: () => unknown): StudyFieldError[] {
  try {
    run();
  } catch (error) {
    expect(error).toBeInstanceOf(StudyValidationError);
    return (error as StudyValidationError).errors;
  }
  throw new Error('expected a StudyValidationError');
}

export function points(x: readonly number[], y: readonly number[]) {
  return x.map((xi, i) => ({ x: xi, y: y[i] }));
}

/** An invented nitrate-by-ion-chromatography validation study (demo numbers). */
export const typicalStudy = {
  units: { x: 'mg/L', y: 'µS·min' },
  standards: [0.5, 1, 2, 5, 10, 20, 40].flatMap((x, level) =>
    [0, 1, 2].map((r) => ({ x, y: 0.012 + 0.2051 * x * (1 + 0.004 * Math.sin(3 * level + r)) + 0.0021 * Math.cos(7 * level + 2 * r) })),
  ),
  blanks: [0.011, 0.013, 0.0095, 0.0122, 0.0108, 0.0131, 0.0117, 0.0099, 0.0126, 0.0114],
  unknowns: [
    { id: 'W-014', y: [2.071, 2.083], dilution: 1 },
    { id: 'W-015', y: [0.0158], dilution: 1 },
    { id: 'W-016', y: [6.52, 6.49, 6.55], dilution: 2 },
  ],
  recovery: [
    ...[0.982, 1.011, 0.994].map((found, i) => ({ id: `L${i + 1}`, level: 'low', added: 1, found })),
    ...[10.12, 9.87, 10.05].map((found, i) => ({ id: `M${i + 1}`, level: 'mid', added: 10, found })),
    ...[30.4, 29.7, 30.2].map((found, i) => ({ id: `H${i + 1}`, level: 'high', added: 30, found: found + 2.1, native: 2.1 })),
  ],
  precision: [
    ...[5.02, 4.98, 5.05, 5.01, 4.99].map((value) => ({ group: 'day 1', value })),
    ...[5.07, 5.04, 5.1, 5.06, 5.03].map((value) => ({ group: 'day 2', value })),
    ...[4.97, 5.0, 4.95, 5.02, 4.98].map((value) => ({ group: 'day 3', value })),
  ],
  lowSpikes: { spiked: [0.21, 0.18, 0.24, 0.2, 0.17, 0.22, 0.19, 0.23, 0.2], blanks: [0.02, null, 0.03, 0.01, null, 0.02, 0.04] },
  massFraction: 5e-6,
  criteria: [
    { figure: 'calibration.r2', op: '>=', value: 0.995 },
    { figure: 'recovery.overall.meanPct', op: 'between', value: [95, 105] },
    { figure: 'range.rePct', op: 'abs<=', value: 15 },
    { figure: 'precision.rsdI', op: '<=', value: 5 },
  ],
};
