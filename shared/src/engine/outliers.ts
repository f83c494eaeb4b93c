import type { OutlierFlag } from '../result.js';
import { blankValue, type Study } from '../study.js';
import type { CalibrationFit } from './calibration.js';
import { fQuantile, studentQuantile } from './distributions.js';
import { groupBy, mean, sd, sortedGroups, variance, type GroupSummary } from './stats.js';
import type { Warn } from './warnings.js';

const ALPHA = 0.05;

/** Dixon r10 critical values at 95 %, n = 3..10 (Rorabacher, Anal. Chem. 63 (1991) 139). */
export const DIXON_R10_95: Readonly<Record<number, number>> = {
  3: 0.97,
  4: 0.829,
  5: 0.71,
  6: 0.625,
  7: 0.568,
  8: 0.526,
  9: 0.493,
  10: 0.466,
};

/** Two-sided Grubbs critical value (Grubbs 1969; ISO 5725-2 Table 5 is these values rounded). */
export function grubbsCritical(n: number, alpha = ALPHA): number {
  const t = studentQuantile(1 - alpha / (2 * n), n - 2);
  return ((n - 1) / Math.sqrt(n)) * Math.sqrt((t * t) / (n - 2 + t * t));
}

/** Cochran's C critical value for k variances with ν degrees of freedom each. */
export function cochranCritical(k: number, nu: number, alpha = ALPHA): number {
  const F = fQuantile(1 - alpha / k, nu, (k - 1) * nu);
  return 1 / (1 + (k - 1) / F);
}

export function grubbsStatistic(values: ArrayLike<number>): { G: number; position: number } {
  const centre = mean(values);
  const s = sd(values) ?? 0;
  let position = 0;
  for (let i = 1; i < values.length; i++) {
    if (Math.abs(values[i] - centre) > Math.abs(values[position] - centre)) position = i;
  }
  return { G: s > 0 ? Math.abs(values[position] - centre) / s : 0, position };
}

export function dixonStatistic(values: ArrayLike<number>): { Q: number; position: number } {
  const n = values.length;
  // Positions by ascending value, equal values in their original order (what a stable sort gives), by insertion: n ≤ 10 here.
  const order = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    let j = i - 1;
    while (j >= 0 && values[order[j]] > values[i]) {
      order[j + 1] = order[j];
      j--;
    }
    order[j + 1] = i;
  }
  const at = (k: number) => values[order[k]];
  const range = at(n - 1) - at(0);
  if (range === 0) return { Q: 0, position: 0 };
  const low = (at(1) - at(0)) / range;
  const high = (at(n - 1) - at(n - 2)) / range;
  return high >= low ? { Q: high, position: order[n - 1] } : { Q: low, position: order[0] };
}

interface ValueSet {
  name: string;
  size: number;
  /** The values, read for Dixon's test and for Grubbs's where `grubbs` is not given. */
  values: () => ArrayLike<number>;
  /** Study-array index of the value at a position. */
  indexOf: (position: number) => number;
  /** Grubbs's statistic, the value farthest from the mean and its study index, where a summary already gives them. */
  grubbs?: { G: number; value: number; index: number };
}

function valueSet(name: string, values: ArrayLike<number>, indexOf: (position: number) => number): ValueSet {
  return { name, size: values.length, values: () => values, indexOf };
}

/**
 * Grubbs's statistic of a standard level from its summary: the value farthest from the mean is the level's first smallest
 * or first largest (as grubbsStatistic finds it, the earlier of the two where both are as far).
 */
function levelGrubbs(fit: CalibrationFit, summary: GroupSummary, g: number): ValueSet['grubbs'] {
  const { ys } = fit;
  const [centre, n, lowest, highest] = [summary.mean[g], summary.count[g], summary.lowest[g], summary.highest[g]];
  const s = Math.sqrt(summary.ss[g] / (n - 1));
  const [low, high] = [Math.abs(ys[lowest] - centre), Math.abs(ys[highest] - centre)];
  const position = high > low || (high === low && highest < lowest) ? highest : lowest;
  return { G: s > 0 ? Math.abs(ys[position] - centre) / s : 0, value: ys[position], index: fit.studyIndex(position) };
}

function testSet(set: ValueSet, flags: OutlierFlag[]): void {
  const n = set.size;
  if (n < 3) return;
  const grubbs =
    set.grubbs ??
    (() => {
      const values = set.values();
      const { G, position } = grubbsStatistic(values);
      return { G, value: values[position], index: set.indexOf(position) };
    })();
  const gCrit = grubbsCritical(n);
  flags.push({
    set: set.name,
    test: 'grubbs',
    statistic: grubbs.G,
    critical: gCrit,
    index: grubbs.index,
    value: grubbs.value,
    outlier: grubbs.G > gCrit,
  });
  const dCrit = DIXON_R10_95[n];
  if (dCrit !== undefined) {
    const values = set.values();
    const { Q, position: at } = dixonStatistic(values);
    flags.push({
      set: set.name,
      test: 'dixon',
      statistic: Q,
      critical: dCrit,
      index: set.indexOf(at),
      value: values[at],
      outlier: Q > dCrit,
    });
  }
}

function cochran(name: string, groups: { size: number; index: number; variance: () => number }[], flags: OutlierFlag[]): void {
  const replicated = groups.filter((g) => g.size >= 2);
  if (replicated.length < 2) return;
  const variances = replicated.map((g) => g.variance());
  const total = variances.reduce((a, b) => a + b, 0);
  if (total === 0) return;
  let position = 0;
  variances.forEach((v, i) => {
    if (v > variances[position]) position = i;
  });
  const counts = [...groupBy(replicated, (g) => g.size).entries()].sort((a, b) => b[1].length - a[1].length || b[0] - a[0]);
  const nu = counts[0][0] - 1;
  const C = variances[position] / total;
  const critical = cochranCritical(replicated.length, nu);
  flags.push({
    set: name,
    test: 'cochran',
    statistic: C,
    critical,
    index: replicated[position].index,
    value: variances[position],
    outlier: C > critical,
  });
}

/** Flags suspect values (Grubbs, Dixon r10, Cochran, standardised residuals); nothing is removed. */
export function outliers(study: Study, fit: CalibrationFit | null, recoveryPcts: number[] | null, warn: Warn): OutlierFlag[] | null {
  const flags: OutlierFlag[] = [];
  const sets: ValueSet[] = [];
  if (study.blanks) {
    const used = study.blanks.flatMap((b, index) => (typeof b !== 'number' && b.excluded ? [] : [{ value: blankValue(b), index }]));
    sets.push(
      valueSet(
        'blanks',
        used.map((b) => b.value),
        (position) => used[position].index,
      ),
    );
  }
  // Levels by ascending x that hold two values or more, each with its rank among all levels (Cochran names a level by it).
  // A fit summarised by level has each level's mean, squares and extremes: the numbers the tests would compute from its
  // values, which are then laid out only for Dixon's test (levels of 3 to 10).
  const levels: (ValueSet & { g: number; rank: number })[] = [];
  const summary = fit?.summary;
  if (fit) {
    const { keys, start } = fit.levels;
    sortedGroups(fit.levels).forEach((g, rank) => {
      const [from, to] = [start[g], start[g + 1]];
      if (to - from < 2) return;
      // Naming a set formats its x, which costs more than testing it when levels are many: only levels testSet tests.
      levels.push({
        name: to - from >= 3 ? `standards x=${keys[g]}` : '',
        size: to - from,
        values: () => fit.levelYs.subarray(from, to),
        indexOf: (position) => fit.studyIndex(fit.levels.members[from + position]),
        grubbs: summary && to - from >= 3 ? levelGrubbs(fit, summary, g) : undefined,
        g,
        rank,
      });
    });
  }
  sets.push(...levels);
  if (recoveryPcts) sets.push(valueSet('recovery', recoveryPcts, (position) => position));
  const usedPrecision: { group: string; value: number; index: number }[] = [];
  (study.precision ?? []).forEach((p, index) => {
    if (!p.excluded) usedPrecision.push({ group: p.group, value: p.value, index });
  });
  const series = [...groupBy(usedPrecision, (p) => p.group).entries()];
  for (const [group, items] of series) {
    sets.push(
      valueSet(
        `precision ${group}`,
        items.map((i) => i.value),
        (position) => items[position].index,
      ),
    );
  }
  if (series.length >= 3) {
    sets.push(
      valueSet(
        'precision series means',
        series.map(([, items]) => mean(items.map((i) => i.value))),
        (position) => position,
      ),
    );
  }
  for (const set of sets) testSet(set, flags);

  cochran(
    'standard levels',
    levels.map(({ size, values, g, rank }) => ({
      size,
      index: rank,
      variance: () => (summary ? summary.ss[g] / (size - 1) : (variance(values()) as number)),
    })),
    flags,
  );
  cochran(
    'precision series',
    series.map(([, items], index) => ({ size: items.length, index, variance: () => variance(items.map((i) => i.value)) as number })),
    flags,
  );

  const largest = fit?.largest;
  if (fit && largest) {
    flags.push({
      set: 'calibration residuals',
      test: 'standardizedResidual',
      statistic: Math.abs(largest.standardized),
      critical: 3,
      index: fit.studyIndex(largest.position),
      value: largest.residual,
      outlier: Math.abs(largest.standardized) > 3,
    });
  }
  if (flags.length === 0) {
    warn('outliers', 'too_few', 'no set of values large enough for an outlier test (3 values, or 2 replicated groups)');
    return null;
  }
  return flags;
}
