/** Centre line and limits of a Shewhart chart, from baseline values only. */
export interface ControlLimits {
  n: number;
  mean: number;
  sd: number;
  warning: [number, number];
  action: [number, number];
}

export type ControlRule = 'beyondAction' | 'twoOfThreeBeyondWarning' | 'sevenOnOneSide' | 'sixTrending';

export interface ControlSignal {
  rule: ControlRule;
  /** The point (0-based) at which the rule fires. */
  index: number;
  /** Every point the rule looked at to fire. */
  points: number[];
  direction: 'above' | 'below' | 'rising' | 'falling';
}

/** The rules in words, for screens, exports and e-mails. */
export const CONTROL_RULE_LABELS: Record<ControlRule, string> = {
  beyondAction: 'one point beyond an action limit (mean ± 3 s)',
  twoOfThreeBeyondWarning: 'two of three points in a row beyond the same warning limit (mean ± 2 s)',
  sevenOnOneSide: 'seven points in a row on one side of the mean',
  sixTrending: 'six points in a row steadily rising or falling',
};

export const MIN_BASELINE_POINTS = 3;

/** Mean and sample SD (n − 1) of the baseline; warning at mean ± 2 s, action at mean ± 3 s. Null below three values. */
export function controlLimits(baseline: readonly number[]): ControlLimits | null {
  const n = baseline.length;
  if (n < MIN_BASELINE_POINTS) return null;
  const mean = baseline.reduce((a, b) => a + b, 0) / n;
  const sd = Math.sqrt(baseline.reduce((ss, v) => ss + (v - mean) ** 2, 0) / (n - 1));
  return { n, mean, sd, warning: [mean - 2 * sd, mean + 2 * sd], action: [mean - 3 * sd, mean + 3 * sd] };
}

/**
 * The run rules of laboratory quality control (common practice; Westgard's 1-3s and 2-of-3 2s,
 * the Western Electric runs of seven and trends of six). A run rule fires once, at the point
 * where its run reaches its length; a longer run does not fire again until it is broken.
 */
export function controlSignals(values: readonly number[], limits: Pick<ControlLimits, 'mean' | 'sd'>): ControlSignal[] {
  const { mean, sd } = limits;
  const signals: ControlSignal[] = [];
  const side = (v: number) => Math.sign(v - mean);
  let sideRun = 0;
  let trendRun = 1;
  let trendDirection = 0;
  values.forEach((v, i) => {
    const s = side(v);
    if (Math.abs(v - mean) > 3 * sd) signals.push({ rule: 'beyondAction', index: i, points: [i], direction: s > 0 ? 'above' : 'below' });

    if (Math.abs(v - mean) > 2 * sd) {
      const window = [i - 2, i - 1].filter((j) => j >= 0);
      const partner = window.find((j) => Math.abs(values[j] - mean) > 2 * sd && side(values[j]) === s);
      const alreadyFired = signals.some(
        (sig) => sig.rule === 'twoOfThreeBeyondWarning' && partner !== undefined && sig.points.includes(partner),
      );
      if (partner !== undefined && !alreadyFired)
        signals.push({ rule: 'twoOfThreeBeyondWarning', index: i, points: [partner, i], direction: s > 0 ? 'above' : 'below' });
    }

    sideRun = s !== 0 && i > 0 && s === side(values[i - 1]) ? sideRun + 1 : s !== 0 ? 1 : 0;
    if (sideRun === 7) signals.push({ rule: 'sevenOnOneSide', index: i, points: range(i - 6, i), direction: s > 0 ? 'above' : 'below' });

    const step = i > 0 ? Math.sign(v - values[i - 1]) : 0;
    trendRun = step !== 0 && step === trendDirection ? trendRun + 1 : step !== 0 ? 2 : 1;
    trendDirection = step;
    if (trendRun === 6)
      signals.push({ rule: 'sixTrending', index: i, points: range(i - 5, i), direction: step > 0 ? 'rising' : 'falling' });
  });
  return signals;
}

const range = (from: number, to: number) => Array.from({ length: to - from + 1 }, (_, k) => from + k);
