/** Mean with a second, correcting pass (the shifted data keep their digits). */
export function mean(values: readonly number[]): number {
  const n = values.length;
  if (n === 0) return NaN;
  let sum = 0;
  for (const v of values) sum += v;
  const first = sum / n;
  let correction = 0;
  for (const v of values) correction += v - first;
  return first + correction / n;
}

export function weightedMean(values: ArrayLike<number>, weights: ArrayLike<number>, sumWeights: number): number {
  let sum = 0;
  for (let i = 0; i < values.length; i++) sum += weights[i] * values[i];
  const first = sum / sumWeights;
  let correction = 0;
  for (let i = 0; i < values.length; i++) correction += weights[i] * (values[i] - first);
  return first + correction / sumWeights;
}

/** Σ(v − v̄)², two-pass. */
export function sumSquaredDeviations(values: readonly number[], centre = mean(values)): number {
  let ss = 0;
  for (const v of values) ss += (v - centre) * (v - centre);
  return ss;
}

/** Sample variance with the n − 1 divisor; null below two values. */
export function variance(values: readonly number[]): number | null {
  return values.length < 2 ? null : sumSquaredDeviations(values) / (values.length - 1);
}

export function sd(values: readonly number[]): number | null {
  const v = variance(values);
  return v === null ? null : Math.sqrt(v);
}

export function sum(values: readonly number[]): number {
  let s = 0;
  for (const v of values) s += v;
  return s;
}

/** Groups values by key, keeping the order in which keys first appear. */
export function groupBy<T, K>(items: readonly T[], key: (item: T) => K): Map<K, T[]> {
  const groups = new Map<K, T[]>();
  for (const item of items) {
    const k = key(item);
    const list = groups.get(k);
    if (list) list.push(item);
    else groups.set(k, [item]);
  }
  return groups;
}

export function linspace(lo: number, hi: number, count: number): number[] {
  if (count === 1) return [lo];
  const out = new Array<number>(count);
  for (let i = 0; i < count; i++) out[i] = i === count - 1 ? hi : lo + ((hi - lo) * i) / (count - 1);
  return out;
}

/** Positions 0…n−1 grouped by key: groups in order of first appearance, positions ascending within each group. */
export interface Grouping<K> {
  keys: K[];
  /** Group g holds members[start[g]] … members[start[g + 1] − 1]. */
  start: Int32Array;
  members: Int32Array;
}

export function groupPositions<K>(n: number, keyAt: (position: number) => K): Grouping<K> {
  const ids = new Map<K, number>();
  const keys: K[] = [];
  const groupOf = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    const key = keyAt(i);
    let id = ids.get(key);
    if (id === undefined) {
      id = keys.length;
      ids.set(key, id);
      keys.push(key);
    }
    groupOf[i] = id;
  }
  keys.splice(0, keys.length, ...ids.keys());
  const start = new Int32Array(keys.length + 1);
  for (let i = 0; i < n; i++) start[groupOf[i] + 1]++;
  for (let g = 0; g < keys.length; g++) start[g + 1] += start[g];
  const next = start.slice(0, keys.length);
  const members = new Int32Array(n);
  for (let i = 0; i < n; i++) members[next[groupOf[i]]++] = i;
  return { keys, start, members };
}

/** The values at the members of group g, in position order. */
export function groupValues<K>(grouping: Grouping<K>, g: number, valueAt: (position: number) => number): number[] {
  const out: number[] = [];
  for (let m = grouping.start[g]; m < grouping.start[g + 1]; m++) out.push(valueAt(grouping.members[m]));
  return out;
}

/** Group ids sorted by their numeric key, ascending. */
export function sortedGroups(grouping: Grouping<number>): number[] {
  return grouping.keys.map((_, g) => g).sort((a, b) => grouping.keys[a] - grouping.keys[b]);
}
