import type { CriterionOutcome, EvaluationResult, RangeLevel, RangeResult, Verdict } from '../result.js';
import type { Criterion, CriterionOp, RecoveryItem } from '../study.js';
import { groupBy, mean } from './stats.js';
import type { Warn } from './warnings.js';

/** Per-level figures that define the working range (and are judged level by level). */
const STANDARD_LEVEL_FIGURES = ['range.rePct', 'range.rsdPct'];
const RECOVERY_LEVEL_FIGURE = 'range.recoveryPct';

/**
 * Value at a dotted path: `calibration.r2`, `unknowns.0.x0`, `unknowns[0].x0`, or an array
 * element by its id / level / group: `recovery.byLevel.low.meanPct`.
 */
export function figureValue(root: unknown, figure: string): number | null {
  let current: unknown = root;
  for (const part of figure
    .replace(/\[(\w+)\]/g, '.$1')
    .split('.')
    .filter(Boolean)) {
    if (Array.isArray(current)) {
      const byIndex = /^\d+$/.test(part) ? current[Number(part)] : undefined;
      current =
        byIndex ??
        current.find(
          (item) =>
            typeof item === 'object' &&
            item !== null &&
            ['id', 'level', 'group', 'set'].some((key) => (item as Record<string, unknown>)[key] === part),
        );
    } else if (typeof current === 'object' && current !== null) {
      current = (current as Record<string, unknown>)[part];
    } else {
      return null;
    }
  }
  return typeof current === 'number' && Number.isFinite(current) ? current : null;
}

export function holds(value: number, op: CriterionOp, threshold: number | [number, number]): boolean {
  if (op === 'between') {
    const [lo, hi] = threshold as [number, number];
    return value >= lo && value <= hi;
  }
  const limit = threshold as number;
  switch (op) {
    case '>=':
      return value >= limit;
    case '<=':
      return value <= limit;
    case '>':
      return value > limit;
    case '<':
      return value < limit;
    case 'abs<=':
      return Math.abs(value) <= limit;
  }
  return false;
}

/** The level value that comes closest to failing: what a range-wide criterion reports. */
function worst(values: number[], op: CriterionOp, threshold: number | [number, number]): number {
  const score = (v: number) => {
    switch (op) {
      case '>=':
      case '>':
        return -v;
      case '<=':
      case '<':
        return v;
      case 'abs<=':
        return Math.abs(v);
      case 'between': {
        const [lo, hi] = threshold as [number, number];
        return Math.abs(v - (lo + hi) / 2);
      }
    }
  };
  return values.reduce((w, v) => (score(v) > score(w) ? v : w));
}

function levelRows(result: EvaluationResult, recovery: readonly RecoveryItem[] | undefined, basis: RangeResult['basis']): RangeLevel[] {
  if (basis === 'standards') {
    return (result.calibration?.levels ?? [])
      .filter((l) => l.x !== 0)
      .map((l) => ({ x: l.x, values: { 'range.rePct': l.rePct, 'range.rsdPct': l.rsdPct }, pass: false }));
  }
  const added = groupBy(
    (recovery ?? []).filter((r) => r.level !== undefined),
    (r) => r.level as string,
  );
  return (result.recovery?.byLevel ?? [])
    .map((g) => ({
      x: mean((added.get(g.level as string) ?? []).map((r) => r.added)),
      values: { [RECOVERY_LEVEL_FIGURE]: g.meanPct } as Record<string, number | null>,
      pass: false,
    }))
    .sort((a, b) => a.x - b.x);
}

/** Lowest and highest level of the longest run of adjacent levels at which every per-level criterion holds. */
export function workingRange(
  result: EvaluationResult,
  criteria: readonly Criterion[],
  recovery: readonly RecoveryItem[] | undefined,
  warn: Warn,
): RangeResult | null {
  const standardCriteria = criteria.filter((c) => STANDARD_LEVEL_FIGURES.includes(c.figure));
  const recoveryCriteria = criteria.filter((c) => c.figure === RECOVERY_LEVEL_FIGURE);
  const basis: RangeResult['basis'] | null =
    standardCriteria.length > 0 ? 'standards' : recoveryCriteria.length > 0 && result.recovery ? 'recovery' : null;
  if (basis === null) {
    warn('range', 'no_criteria', 'no per-level criterion (range.rePct, range.rsdPct or range.recoveryPct) in the study');
    return null;
  }
  const used = basis === 'standards' ? standardCriteria : recoveryCriteria;
  const levels = levelRows(result, recovery, basis);
  for (const level of levels) {
    level.pass = used.every((c) => {
      const v = level.values[c.figure];
      return v !== null && v !== undefined && holds(v, c.op, c.value);
    });
  }
  let lo = -1;
  let hi = -1;
  let start = -1;
  for (let i = 0; i < levels.length; i++) {
    if (!levels[i].pass) {
      start = -1;
      continue;
    }
    if (start < 0) start = i;
    if (lo < 0 || i - start > hi - lo) [lo, hi] = [start, i];
  }
  if (lo < 0) {
    warn('range', 'no_level_passes', 'the per-level criteria hold at no level');
    return null;
  }
  return { basis, low: levels[lo].x, high: levels[hi].x, levels };
}

export function verdict(result: EvaluationResult, criteria: readonly Criterion[]): Verdict {
  const outcomes: CriterionOutcome[] = criteria.map((c) => {
    let value: number | null;
    let pass: boolean;
    if (c.figure.startsWith('range.') && result.range) {
      const values = result.range.levels.map((l) => l.values[c.figure]);
      const numeric = values.filter((v): v is number => typeof v === 'number');
      value = numeric.length === values.length && numeric.length > 0 ? worst(numeric, c.op, c.value) : null;
      pass = value !== null && numeric.every((v) => holds(v, c.op, c.value));
    } else {
      value = figureValue(result, c.figure);
      pass = value !== null && holds(value, c.op, c.value);
    }
    return { figure: c.figure, op: c.op, threshold: c.value, value, pass };
  });
  return { criteria: outcomes, pass: outcomes.length === 0 ? null : outcomes.every((o) => o.pass) };
}
