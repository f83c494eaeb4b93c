import { StudyValidationError, type StudyFieldError } from '../errors.js';
import type { AccuracyItem, AccuracyProfileLevel, AccuracyProfileOptions, AccuracyProfileResult } from '../uncertainty-types.js';
import { DEFAULT_ACCURACY_BETA, DEFAULT_ACCURACY_LAMBDA_PCT } from '../version-options.js';
import { studentQuantile } from './distributions.js';
import { groupBy, mean } from './stats.js';

export interface ToleranceInterval {
  I: number;
  J: number;
  mean: number;
  msb: number;
  msw: number;
  sr: number;
  sBetween: number;
  sI: number;
  R: number;
  B: number;
  nu: number;
  k: number;
  lower: number;
  upper: number;
}

/**
 * β-expectation tolerance interval of a balanced one-way random model (Mee 1984, as used in
 * the SFSTP accuracy profile; formula written from memory): R = s²_B/s²_W,
 * B = √((R+1)/(JR+1)), ν = (R+1)²/((R+1/J)²/(I−1) + (1−1/J)/(IJ)),
 * k = t((1+β)/2; ν)·√(1 + 1/(IJB²)), interval x̄ ± k·s_IP.
 */
export function betaExpectationInterval(series: readonly (readonly number[])[], beta = 0.8): ToleranceInterval {
  const I = series.length;
  const J = series[0].length;
  const shift = series[0][0];
  const groups = series.map((s) => s.map((v) => v - shift));
  const means = groups.map((g) => mean(g));
  const grand = mean(groups.flat());
  let ssw = 0;
  for (let i = 0; i < I; i++) for (const v of groups[i]) ssw += (v - means[i]) ** 2;
  const msw = ssw / (I * (J - 1));
  const msb = (J * means.reduce((s, m) => s + (m - grand) ** 2, 0)) / (I - 1);
  const s2b = Math.max(0, (msb - msw) / J);
  const s2i = msw + s2b;
  const R = msw > 0 ? s2b / msw : 0;
  const B = Math.sqrt((R + 1) / (J * R + 1));
  const nu = (R + 1) ** 2 / ((R + 1 / J) ** 2 / (I - 1) + (1 - 1 / J) / (I * J));
  const k = studentQuantile((1 + beta) / 2, nu) * Math.sqrt(1 + 1 / (I * J * B * B));
  const sI = Math.sqrt(s2i);
  const m = grand + shift;
  return { I, J, mean: m, msb, msw, sr: Math.sqrt(msw), sBetween: Math.sqrt(s2b), sI, R, B, nu, k, lower: m - k * sI, upper: m + k * sI };
}

/** Field errors of an accuracy-profile design and options. */
export function accuracyProfileErrors(items: readonly AccuracyItem[], options: AccuracyProfileOptions = {}): StudyFieldError[] {
  const errors: StudyFieldError[] = [];
  if (options.beta !== undefined && !(options.beta > 0 && options.beta < 1)) {
    errors.push({ field: 'accuracyProfile.beta', code: 'out_of_range', message: 'β must lie between 0 and 1' });
  }
  if (options.lambda !== undefined && !(options.lambda > 0)) {
    errors.push({ field: 'accuracyProfile.lambda', code: 'not_positive', message: 'the acceptance limit λ must be greater than zero' });
  }
  const levels = groupBy(items, (i) => i.level);
  if (levels.size < 3)
    errors.push({
      field: 'accuracy',
      code: 'too_few_levels',
      message: `an accuracy profile needs at least 3 levels (${levels.size} given)`,
    });
  for (const [level, list] of levels) {
    if (new Set(list.map((i) => i.nominal)).size > 1) {
      errors.push({
        field: 'accuracy',
        code: 'nominal_mismatch',
        message: `level ${level}: every result of a level must have the same nominal value`,
      });
    }
    if (!list.every((i) => i.nominal > 0))
      errors.push({ field: 'accuracy', code: 'not_positive', message: `level ${level}: the nominal value must be greater than zero` });
    const series = groupBy(list, (i) => i.series);
    if (series.size < 2)
      errors.push({
        field: 'accuracy',
        code: 'too_few_series',
        message: `level ${level}: at least 2 series are needed (${series.size} given)`,
      });
    const sizes = new Set([...series.values()].map((s) => s.length));
    if (Math.min(...sizes) < 2)
      errors.push({ field: 'accuracy', code: 'too_few_replicates', message: `level ${level}: every series needs at least 2 replicates` });
    else if (sizes.size > 1)
      errors.push({
        field: 'accuracy',
        code: 'unbalanced',
        message: `level ${level}: every series must have the same number of replicates`,
      });
  }
  return errors;
}

/** Where a linear margin g (positive = outside the limits) crosses zero between x0 and x1. */
function crossing(x0: number, g0: number, x1: number, g1: number): number {
  return x0 + ((x1 - x0) * g0) / (g0 - g1);
}

/** Accuracy profile (SFSTP total-error approach): per level bias, s_r, s_I and the β-expectation interval vs ±λ %. */
export function accuracyProfile(items: readonly AccuracyItem[], options: AccuracyProfileOptions = {}): AccuracyProfileResult {
  const errors = accuracyProfileErrors(items, options);
  if (errors.length > 0) throw new StudyValidationError(errors);
  const beta = options.beta ?? DEFAULT_ACCURACY_BETA;
  const lambda = options.lambda ?? DEFAULT_ACCURACY_LAMBDA_PCT;
  const levels: AccuracyProfileLevel[] = [...groupBy(items, (i) => i.level).entries()]
    .map(([level, list]) => {
      const nominal = list[0].nominal;
      const series = [...groupBy(list, (i) => i.series).values()].map((s) => s.map((i) => i.found));
      const ti = betaExpectationInterval(series, beta);
      const lowerPct = (100 * (ti.lower - nominal)) / nominal;
      const upperPct = (100 * (ti.upper - nominal)) / nominal;
      return {
        level,
        nominal,
        series: ti.I,
        replicates: ti.J,
        n: list.length,
        mean: ti.mean,
        bias: ti.mean - nominal,
        biasPct: (100 * (ti.mean - nominal)) / nominal,
        recoveryPct: (100 * ti.mean) / nominal,
        sr: ti.sr,
        sBetween: ti.sBetween,
        sI: ti.sI,
        rsdRPct: (100 * ti.sr) / nominal,
        rsdIPct: (100 * ti.sI) / nominal,
        R: ti.R,
        B: ti.B,
        nu: ti.nu,
        k: ti.k,
        lower: ti.lower,
        upper: ti.upper,
        lowerPct,
        upperPct,
        within: lowerPct > -lambda && upperPct < lambda,
      };
    })
    .sort((a, b) => a.nominal - b.nominal);

  // The longest run of consecutive levels inside the limits; its ends are interpolated towards failing neighbours.
  let best: [number, number] | null = null;
  for (let i = 0; i < levels.length; i++) {
    if (!levels[i].within) continue;
    let j = i;
    while (j + 1 < levels.length && levels[j + 1].within) j++;
    if (!best || j - i > best[1] - best[0]) best = [i, j];
    i = j;
  }
  const margins = (l: AccuracyProfileLevel) => [l.upperPct - lambda, -lambda - l.lowerPct];
  const edge = (inside: AccuracyProfileLevel, outside: AccuracyProfileLevel, pick: (xs: number[]) => number) => {
    const gi = margins(inside);
    const go = margins(outside);
    const xs = go.flatMap((g, m) => (g >= 0 ? [crossing(outside.nominal, g, inside.nominal, gi[m])] : []));
    return pick(xs);
  };
  let validFrom: number | null = null;
  let validTo: number | null = null;
  if (best) {
    const [i, j] = best;
    validFrom = i === 0 ? levels[0].nominal : edge(levels[i], levels[i - 1], (xs) => Math.max(...xs));
    validTo = j === levels.length - 1 ? levels[j].nominal : edge(levels[j], levels[j + 1], (xs) => Math.min(...xs));
  }
  return { beta, lambda, levels, validFrom, validTo };
}
