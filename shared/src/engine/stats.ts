/** Mean with a second, correcting pass (the shifted data keep their digits). */
export function mean(values: ArrayLike<number>): number {
  const n = values.length;
  if (n === 0) return NaN;
  let sum = 0;
  for (let i = 0; i < n; i++) sum += values[i];
  const first = sum / n;
  let correction = 0;
  for (let i = 0; i < n; i++) correction += values[i] - first;
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
export function sumSquaredDeviations(values: ArrayLike<number>, centre = mean(values)): number {
  let ss = 0;
  for (let i = 0; i < values.length; i++) ss += (values[i] - centre) * (values[i] - centre);
  return ss;
}

/** Sample variance with the n − 1 divisor; null below two values. */
export function variance(values: ArrayLike<number>): number | null {
  return values.length < 2 ? null : sumSquaredDeviations(values) / (values.length - 1);
}

export function sd(values: ArrayLike<number>): number | null {
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

/** Positions 0…n−1 grouped by value: groups in order of first appearance, positions ascending within each group. */
export interface Grouping {
  /** Each group's value (−0 read as 0, as a Map key would be). */
  keys: number[];
  /** Group g holds members[start[g]] … members[start[g + 1] − 1]. */
  start: Int32Array;
  members: Int32Array;
  /** The group of each position. */
  of: Int32Array;
}

const bits = new Float64Array(1);
const bitWords = new Int32Array(bits.buffer);

/** A hash of the value's bits (murmur3's mixing, so that values a tenth apart spread over the table). */
function slotHash(key: number): number {
  bits[0] = key;
  let h = Math.imul(bitWords[0] ^ Math.imul(bitWords[1], 0x9e3779b1), 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  return h ^ (h >>> 16);
}

/** An open-addressing table: each slot holds a key and its group (−1: empty). */
class SlotTable {
  readonly mask: number;
  readonly groups: Int32Array;
  readonly keys: Float64Array;
  constructor(size: number) {
    this.mask = size - 1;
    this.groups = new Int32Array(size).fill(-1);
    this.keys = new Float64Array(size);
  }
}

// Apart from the grouping loop, which then keeps its table in locals.
function grownTable(table: SlotTable, keys: readonly number[]): SlotTable {
  const grown = new SlotTable((table.mask + 1) * 4);
  for (let g = 0; g < keys.length; g++) {
    let at = slotHash(keys[g]) & grown.mask;
    while (grown.groups[at] >= 0) at = (at + 1) & grown.mask;
    grown.groups[at] = g;
    grown.keys[at] = keys[g];
  }
  return grown;
}

/**
 * Groups equal values (SameValueZero, as a Map would) with an open-addressing table on their bits; a value equal to the
 * one before it takes its group without a look-up.
 */
export function groupPositions(values: ArrayLike<number>): Grouping {
  const n = values.length;
  const keys: number[] = [];
  const of = new Int32Array(n);
  // At most half full; a small study needs a small table (it grows as keys come, so a size only saves rehashing).
  let size = 16;
  while (size < 2 * n && size < 1024) size *= 2;
  let table = new SlotTable(size);
  let { mask, groups: slotGroups, keys: slotKeys } = table;
  let previous = NaN;
  let previousGroup = -1;
  for (let i = 0; i < n; i++) {
    const value = values[i];
    const key = value === 0 ? 0 : value;
    if (key === previous) {
      of[i] = previousGroup;
      continue;
    }
    let slot = slotHash(key) & mask;
    let group = slotGroups[slot];
    while (group >= 0) {
      const held = slotKeys[slot];
      if (held === key || (held !== held && key !== key)) break;
      slot = (slot + 1) & mask;
      group = slotGroups[slot];
    }
    if (group < 0) {
      group = keys.length;
      keys.push(key);
      slotGroups[slot] = group;
      slotKeys[slot] = key;
      if (2 * keys.length > mask + 1) {
        table = grownTable(table, keys);
        ({ mask, groups: slotGroups, keys: slotKeys } = table);
      }
    }
    of[i] = group;
    previous = key;
    previousGroup = group;
  }
  const start = new Int32Array(keys.length + 1);
  for (let i = 0; i < n; i++) start[of[i] + 1]++;
  for (let g = 0; g < keys.length; g++) start[g + 1] += start[g];
  // Laid out when first asked for: a fit summarised by level reads its columns through `of` instead.
  let members: Int32Array | null = null;
  return {
    keys,
    start,
    get members() {
      return (members ??= membersByGroup(start, of));
    },
    of,
  };
}

function membersByGroup(start: Int32Array, of: Int32Array): Int32Array {
  const next = start.slice(0, start.length - 1);
  const members = new Int32Array(of.length);
  for (let i = 0; i < of.length; i++) members[next[of[i]]++] = i;
  return members;
}

/** The column's values in group order (group 0's members first), so each group is one contiguous run. */
export function byGroup(
  grouping: Grouping,
  column: ArrayLike<number>,
  out: Float64Array = new Float64Array(grouping.members.length),
): Float64Array {
  for (let m = 0; m < out.length; m++) out[m] = column[grouping.members[m]];
  return out;
}

/**
 * Columns of n numbers lent by slot: room for values nobody keeps, written over whole by each user and never read after
 * the (synchronous) section that wrote them. Large columns come from one pool shared by every fit and held weakly, so that
 * a large study does not ask the allocator (and the page tables) for fresh megabytes at every step or every evaluation.
 */
export type Scratch = (slot: number) => Float64Array;

/** Below this length a fresh column costs less than keeping one. */
const POOLED_FROM = 65_536;
let pool: WeakRef<Float64Array[]> | null = null;

export function scratchColumns(n: number): Scratch {
  if (n < POOLED_FROM) {
    const own: Float64Array[] = [];
    return (slot) => (own[slot] ??= new Float64Array(n));
  }
  let shared = pool?.deref();
  if (!shared) pool = new WeakRef((shared = []));
  const columns = shared;
  return (slot) => {
    if (!(columns[slot]?.length >= n)) columns[slot] = new Float64Array(n);
    return columns[slot].length === n ? columns[slot] : columns[slot].subarray(0, n);
  };
}

/** Group ids sorted by their key, ascending. */
export function sortedGroups(grouping: Grouping): readonly number[] {
  let sorted = sortedOnce.get(grouping);
  if (!sorted) sortedOnce.set(grouping, (sorted = grouping.keys.map((_, g) => g).sort((a, b) => grouping.keys[a] - grouping.keys[b])));
  return sorted;
}

/** Each grouping's order is asked for by several sections; with many levels the sort is worth keeping. */
const sortedOnce = new WeakMap<Grouping, number[]>();

/** Per group (in the grouping's order): the summary of its values that fits on levels and per-level tests read. */
export interface GroupSummary {
  count: Float64Array;
  /** What mean() and sumSquaredDeviations() give for the group's values (the same arithmetic, so the same numbers). */
  mean: Float64Array;
  ss: Float64Array;
  /** Position of the group's first smallest and first largest value (−1 where every value is NaN). */
  lowest: Int32Array;
  highest: Int32Array;
}

/**
 * Summarises each group of a column (in position order) in three passes through `of`: each group's sums add its values
 * in the order of their positions, as mean() and sumSquaredDeviations() would over the group's values. With `passes`
 * 2, the squares come from the correction pass, about the first mean: Σ(v − m₁)² − c²/n with c = Σ(v − m₁) (the
 * corrected two-pass formula, as accurate, not the same rounding).
 */
export function summariseGroups(grouping: Grouping, column: ArrayLike<number>, passes: 2 | 3 = 3): GroupSummary {
  const k = grouping.keys.length;
  const { start, of } = grouping;
  const n = of.length;
  const count = new Float64Array(k);
  const mean = new Float64Array(k);
  const ss = new Float64Array(k);
  const lowest = new Int32Array(k).fill(-1);
  const highest = new Int32Array(k).fill(-1);
  const low = new Float64Array(k).fill(Infinity);
  const high = new Float64Array(k).fill(-Infinity);
  const sums = new Float64Array(k);
  for (let i = 0; i < n; i++) sums[of[i]] += column[i];
  for (let g = 0; g < k; g++) {
    count[g] = start[g + 1] - start[g];
    mean[g] = sums[g] / count[g];
  }
  const corrections = sums.fill(0);
  if (passes === 3) {
    for (let i = 0; i < n; i++) {
      const g = of[i];
      corrections[g] += column[i] - mean[g];
    }
    for (let g = 0; g < k; g++) mean[g] += corrections[g] / count[g];
    corrections.fill(0);
  }
  for (let i = 0; i < n; i++) {
    const g = of[i];
    const v = column[i];
    const d = v - mean[g];
    corrections[g] += d;
    ss[g] += d * d;
    if (v < low[g]) {
      low[g] = v;
      lowest[g] = i;
    }
    if (v > high[g]) {
      high[g] = v;
      highest[g] = i;
    }
  }
  if (passes === 2) {
    for (let g = 0; g < k; g++) {
      ss[g] = Math.max(0, ss[g] - (corrections[g] * corrections[g]) / count[g]);
      mean[g] += corrections[g] / count[g];
    }
  }
  return { count, mean, ss, lowest, highest };
}
