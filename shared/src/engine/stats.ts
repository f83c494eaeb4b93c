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
