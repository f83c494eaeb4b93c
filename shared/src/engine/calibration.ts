import { StudyValidationError } from '../errors.js';
import type {
  BackCalculatedPoint,
  BandPoint,
  BracketSegment,
  CalibrationLevel,
  CalibrationResult,
  ExcludedStandard,
  Interval,
} from '../result.js';
import { STUDY_LIMITS, type CalibrationModel, type StandardPoint, type Weighting } from '../study.js';
import { fUpper, studentQuantile } from './distributions.js';
import { fitQuadratic, type QuadraticCore } from './quadratic.js';
import { fitLine, fitThroughOrigin, type Pooled, type RegressionCore } from './regression.js';
import { LazyTable, registerLazyTables } from './lazy-table.js';
import {
  byGroup,
  groupPositions,
  linspace,
  mean,
  scratchColumns,
  sortedGroups,
  summariseGroups,
  sumSquaredDeviations,
  type GroupSummary,
  type Grouping,
  type Scratch,
} from './stats.js';

/** Studies the API accepts hold at most STUDY_LIMITS.rows standards: they all keep the per-standard arithmetic. */
export const SUMMARISED_FROM = STUDY_LIMITS.rows + 1;

export type FitRowsChoice = 'standards' | 'levels' | 'levels-when-large';

export interface FitOptions {
  model?: CalibrationModel;
  weighting?: Weighting;
  confidence?: number;
  twoPoint?: { bracketing: boolean };
  /**
   * The regression models' least-squares rows: one per standard (the default), one per standard level (the same figures
   * to rounding, in a fraction of the time), or per level from SUMMARISED_FROM standards on where levels hold two
   * standards each on average (what the evaluation asks for).
   */
  rows?: FitRowsChoice;
}

/**
 * Least-squares rows: the standards themselves, or (with `pooled`) one row per standard level: its x, the weighted mean of
 * its responses and the sum of its weights.
 */
export interface FitRows {
  x: Float64Array;
  y: Float64Array;
  w: Float64Array;
  pooled: Pooled | null;
}

/** The standards summarised by level (level g in the grouping's order), for fits on one row per level. */
export interface LevelSummary extends GroupSummary {
  x: Float64Array;
  /** Plain mean of every standard's x. */
  xCentre: number;
}

/** The per-standard columns: back-calculated x and %RE (NaN where null), residuals, standardised residuals (null without regression statistics). */
interface PointColumns {
  xBacks: Float64Array;
  rePcts: Float64Array;
  residuals: Float64Array;
  standardized: Float64Array | null;
  largest: LargestResidual | null;
  finite: { rows: boolean; residuals: boolean; standardized: boolean };
}

/** The first standard whose standardised residual has the largest magnitude. */
export interface LargestResidual {
  position: number;
  standardized: number;
  residual: number;
}

/** A standard used by the fit (the caller's own object; never copied). */
export interface FitPoint {
  x: number;
  y: number;
  sd?: number;
}

/** A fitted calibration: the result section plus what prediction and inversion need, by columns (one entry per used standard). */
export interface CalibrationFit extends Omit<UsedPoints, 'excluded'> {
  model: CalibrationModel;
  weighting: Weighting;
  confidence: number;
  /** The study index of the used standard at a position. */
  studyIndex: (position: number) => number;
  /** The fit's least-squares rows (per standard: its normalised weights, all 1 without weighting). */
  rows: FitRows;
  /** Columns of n numbers for the sections' own scratch work (nothing kept in them outlives the section that writes them). */
  scratch: Scratch;
  /** The per-standard columns (made on first call when the fit is summarised by level). */
  points: () => PointColumns;
  /** Null without regression statistics. */
  largest: LargestResidual | null;
  /** For a straight line fitted on centred sums: x = cx + (y − cy)/b. */
  centred: { cx: number; cy: number; b: number } | null;
  calibration: CalibrationResult;
  /** Regression core (null for one- and two-point calibrations). */
  core: RegressionCore | null;
  segments: BracketSegment[] | null;
  /** Normalised weight at x (1 without weighting). */
  weightAt(x: number): number;
  predict(x: number): number;
  slopeAt(x: number): number;
  /** x for a response, or null where the curve cannot be inverted. */
  inverse(y: number): number | null;
}

export const BAND_POINTS = 101;

/** SD of the response at x, interpolated linearly between the standard levels' SDs. */
function sdProfile(used: UsedPoints): (at: number) => number {
  const levelSds = byGroup(used.levels, used.sds());
  const { keys, start } = used.levels;
  const levels = keys.map((x, g) => ({ x, sd: mean(levelSds.subarray(start[g], start[g + 1])) })).sort((a, b) => a.x - b.x);
  return (at) => {
    if (at <= levels[0].x) return levels[0].sd;
    const hi = levels.findIndex((l) => l.x >= at);
    if (hi < 0) return levels[levels.length - 1].sd;
    const lo = levels[hi - 1];
    const f = (at - lo.x) / (levels[hi].x - lo.x);
    return lo.sd + f * (levels[hi].sd - lo.sd);
  };
}

/**
 * Weights 1/x, 1/x² or 1/s² normalised so that they sum to n; the same scale gives w(x)
 * anywhere (for 1/s², s(x) is interpolated between the standard levels).
 */
function makeWeights(
  used: UsedPoints,
  weighting: Weighting,
  w: Float64Array = new Float64Array(used.xs.length),
): { w: Float64Array; weightAt: (at: number) => number } {
  const n = used.xs.length;
  if (weighting === 'none') return { w: w.fill(1), weightAt: () => 1 };
  let rawAt: (at: number) => number;
  if (weighting === '1/s2') {
    const sdAt = sdProfile(used);
    rawAt = (at) => sdAt(at) ** -2;
    const sds = used.sds();
    for (let i = 0; i < n; i++) w[i] = sds[i] ** -2;
  } else {
    const power = weighting === '1/x' ? 1 : 2;
    rawAt = (at) => at ** -power;
    // Once per level: every standard of a level has the level's x.
    const levelWeights = used.levels.keys.map(rawAt);
    for (let i = 0; i < n; i++) w[i] = levelWeights[used.levels.of[i]];
  }
  let total = 0;
  for (let i = 0; i < n; i++) total += w[i];
  const scale = total / n;
  for (let i = 0; i < n; i++) w[i] = w[i] / scale;
  return { w, weightAt: (at: number) => rawAt(at) / scale };
}

interface Weighted {
  rows: FitRows;
  weightAt: (at: number) => number;
  /** The normalised weight of each standard. */
  pointWeights: () => Float64Array;
}

/** The fit's rows: the standards with their normalised weights. */
function pointRows(used: UsedPoints, weighting: Weighting, scratch?: Scratch): Weighted {
  const { w, weightAt } = makeWeights(used, weighting, scratch?.(SCRATCH.weights));
  return { rows: { x: used.xs, y: used.ys, w, pooled: null }, weightAt, pointWeights: () => w };
}

/**
 * The fit's rows on levels: the same normalised weights as pointRows, summed per level, and each level's weighted mean
 * response and weighted squares about it (for 1/s², by the standards' own weights; otherwise w is the level's).
 */
function levelRows(used: UsedPoints, summary: LevelSummary, weighting: Weighting): Weighted {
  const { levels, ys } = used;
  const k = summary.x.length;
  const n = used.xs.length;
  const pooled = { count: n, ssWithin: 0, xCentre: summary.xCentre };
  const w = new Float64Array(k);
  if (weighting === '1/s2') {
    // Each level's weighted mean in two passes, its weighted squares about it in a third, through `of`.
    const weighted = makeWeights(used, weighting);
    const pointWeights = weighted.w;
    const { of } = levels;
    const y = new Float64Array(k);
    for (let i = 0; i < n; i++) {
      w[of[i]] += pointWeights[i];
      y[of[i]] += pointWeights[i] * ys[i];
    }
    for (let g = 0; g < k; g++) y[g] /= w[g];
    const corrections = new Float64Array(k);
    for (let i = 0; i < n; i++) corrections[of[i]] += pointWeights[i] * (ys[i] - y[of[i]]);
    for (let g = 0; g < k; g++) y[g] += corrections[g] / w[g];
    for (let i = 0; i < n; i++) pooled.ssWithin += pointWeights[i] * (ys[i] - y[of[i]]) * (ys[i] - y[of[i]]);
    return { rows: { x: summary.x, y, w, pooled }, weightAt: weighted.weightAt, pointWeights: () => pointWeights };
  }
  const power = weighting === '1/x' ? 1 : weighting === '1/x2' ? 2 : 0;
  const rawAt = (at: number) => (power === 0 ? 1 : at ** -power);
  const raw = summary.x.map(rawAt);
  let total = 0;
  for (let g = 0; g < k; g++) total += summary.count[g] * raw[g];
  const scale = total / n;
  const levelWeight = raw.map((r) => r / scale);
  for (let g = 0; g < k; g++) {
    w[g] = summary.count[g] * levelWeight[g];
    pooled.ssWithin += levelWeight[g] * summary.ss[g];
  }
  const weightAt = power === 0 ? () => 1 : (at: number) => rawAt(at) / scale;
  const pointWeights = () => Float64Array.from(levels.of, (g) => levelWeight[g]);
  return { rows: { x: summary.x, y: summary.mean, w, pooled }, weightAt, pointWeights };
}

/**
 * Rows for a refit of the fit's standards with weight w(x) (1 where null): the standards (weights written into `slot` of
 * the scratch columns, or a fresh column), or one row per level when the fit is summarised.
 */
export function refitRows(fit: CalibrationFit, weightAt: ((x: number) => number) | null, slot?: number): FitRows {
  const { levels, summary } = fit;
  const levelWeights = levels.keys.map((x) => (weightAt ? weightAt(x) : 1));
  if (summary) {
    const w = new Float64Array(levelWeights.length);
    const pooled = { count: fit.xs.length, ssWithin: 0, xCentre: summary.xCentre };
    for (let g = 0; g < w.length; g++) {
      w[g] = summary.count[g] * levelWeights[g];
      pooled.ssWithin += levelWeights[g] * summary.ss[g];
    }
    return { x: summary.x, y: summary.mean, w, pooled };
  }
  const n = fit.xs.length;
  const w = slot === undefined ? new Float64Array(n) : fit.scratch(slot);
  for (let i = 0; i < n; i++) w[i] = levelWeights[levels.of[i]];
  return { x: fit.xs, y: fit.ys, w, pooled: null };
}

function interval(centre: number, halfWidth: number): Interval {
  return [centre - halfWidth, centre + halfWidth];
}

function fail(code: string, message: string, field = 'standards'): never {
  throw StudyValidationError.single(field, code, message);
}

/** The standards a fit uses, by columns (one entry per used standard). */
export interface UsedPoints {
  /** Position of each used standard in the study's `standards` array (null where none is excluded: the position itself). */
  indices: Int32Array | null;
  xs: Float64Array;
  ys: Float64Array;
  /** SD of each standard (NaN where not given), read from the standards when first asked for. */
  sds: () => Float64Array;
  /** The standards grouped by x (the standard levels), in order of first appearance. */
  levels: Grouping;
  /** ys in level order: level g is levelYs[levels.start[g]] … levelYs[levels.start[g + 1] − 1] (laid out when first read). */
  readonly levelYs: Float64Array;
  /** The standards summarised by level when the fit is made on one row per level, else null. */
  summary: LevelSummary | null;
  excluded: ExcludedStandard[];
}

function summarises(model: CalibrationModel, n: number, levels: number, rows: FitRowsChoice = 'standards'): boolean {
  if (model !== 'linear' && model !== 'linear-through-origin' && model !== 'quadratic') return false;
  // Levels of one standard each gain nothing from a summary.
  return rows === 'levels' || (rows === 'levels-when-large' && n >= SUMMARISED_FROM && 2 * levels <= n);
}

function levelSummary(levels: Grouping, ys: Float64Array): LevelSummary {
  const summary = summariseGroups(levels, ys, 2);
  const x = Float64Array.from(levels.keys);
  const n = ys.length;
  let sum = 0;
  for (let g = 0; g < x.length; g++) sum += summary.count[g] * x[g];
  const first = sum / n;
  let correction = 0;
  for (let g = 0; g < x.length; g++) correction += summary.count[g] * (x[g] - first);
  return { ...summary, x, xCentre: first + correction / n };
}

/** The standards' columns grouped by x, summarised by level when the fit is to be made on levels. */
function grouped(columns: Omit<UsedPoints, 'levels' | 'levelYs' | 'summary'>, options: FitOptions): UsedPoints {
  const levels = groupPositions(columns.xs);
  const summary = summarises(options.model ?? 'linear', columns.xs.length, levels.keys.length, options.rows)
    ? levelSummary(levels, columns.ys)
    : null;
  let levelYs: Float64Array | null = null;
  return {
    ...columns,
    levels,
    get levelYs() {
      return (levelYs ??= byGroup(levels, columns.ys));
    },
    summary,
  };
}

/** Standards held by columns, none excluded (what a caller that already holds arrays passes instead of one object per standard). */
export interface StandardColumns {
  x: Float64Array;
  y: Float64Array;
  sd?: Float64Array;
}

function usedColumns(columns: StandardColumns, options: FitOptions): UsedPoints {
  const xs = columns.x.slice();
  const ys = columns.y.slice();
  if (ys.length !== xs.length) fail('not_computable', 'the x and y columns of the standards differ in length');
  const given = columns.sd;
  let sds: Float64Array | null = null;
  const sdsOf = () => (sds ??= given ? given.slice() : new Float64Array(xs.length).fill(NaN));
  return grouped({ indices: null, xs, ys, sds: sdsOf, excluded: [] }, options);
}

/** The standards that are not excluded, read once into columns and grouped by x. */
function usedPoints(standards: readonly StandardPoint[] | StandardColumns, options: FitOptions): UsedPoints {
  if (!Array.isArray(standards)) return usedColumns(standards as StandardColumns, options);
  const total = standards.length;
  // Study indices are written from the first excluded standard on; until then a position is its index.
  let indices: Int32Array | null = null;
  let xs = new Float64Array(total);
  let ys = new Float64Array(total);
  const excluded: ExcludedStandard[] = [];
  let used = 0;
  for (let index = 0; index < total; index++) {
    const s = standards[index];
    if (s.excluded) {
      if (!indices) indices = Int32Array.from({ length: total }, (_, position) => position);
      excluded.push({ index, x: s.x, y: s.y, reason: s.excluded.reason });
      continue;
    }
    if (indices) indices[used] = index;
    xs[used] = s.x;
    ys[used] = s.y;
    used++;
  }
  if (indices) [indices, xs, ys] = [indices.slice(0, used), xs.slice(0, used), ys.slice(0, used)];
  let sds: Float64Array | null = null;
  const positions = indices;
  const sdsOf = () => (sds ??= Float64Array.from({ length: used }, (_, p) => standards[positions ? positions[p] : p].sd ?? NaN));
  return grouped({ indices, xs, ys, sds: sdsOf, excluded }, options);
}

/** Real root of c2 z² + c1 z + c0 = 0 on the branch that covers [zLo, zHi]. */
export function invertQuadratic(core: QuadraticCore, y: number, xMin: number, xMax: number): number | null {
  const [c0, c1, c2] = core.zCoefficients;
  const zLo = (xMin - core.centre) / core.scale;
  const zHi = (xMax - core.centre) / core.scale;
  const k = c0 - y;
  if (Math.abs(c2) <= 1e-14 * (Math.abs(c1) + Math.abs(c0))) {
    return c1 === 0 ? null : core.centre + core.scale * (-k / c1);
  }
  const disc = c1 * c1 - 4 * c2 * k;
  if (disc < 0) return null;
  const q = -0.5 * (c1 + (c1 >= 0 ? 1 : -1) * Math.sqrt(disc));
  const roots = [q / c2, q === 0 ? q / c2 : k / q];
  const vertex = -c1 / (2 * c2);
  let z: number | undefined;
  if (vertex <= zLo || vertex >= zHi) {
    const side = Math.sign((zLo + zHi) / 2 - vertex);
    z = roots.find((r) => Math.sign(r - vertex) === side || r === vertex);
  } else {
    const tol = 1e-12 * (zHi - zLo);
    const inside = roots.filter((r) => r >= zLo - tol && r <= zHi + tol);
    if (inside.length === 1 || (inside.length === 2 && inside[0] === inside[1])) z = inside[0];
  }
  return z === undefined ? null : core.centre + core.scale * z;
}

function buildSegments(used: UsedPoints): { levels: { x: number; yMean: number }[]; segments: BracketSegment[] } {
  const levelYs = byGroup(used.levels, used.ys);
  const { keys, start } = used.levels;
  const levels = keys.map((x, g) => ({ x, yMean: mean(levelYs.subarray(start[g], start[g + 1])) })).sort((p, q) => p.x - q.x);
  const segments: BracketSegment[] = [];
  for (let i = 1; i < levels.length; i++) {
    const lo = levels[i - 1];
    const hi = levels[i];
    const slope = (hi.yMean - lo.yMean) / (hi.x - lo.x);
    if (slope === 0) fail('zero_slope', `the mean responses at x = ${lo.x} and x = ${hi.x} are equal: zero slope`);
    segments.push({ xLow: lo.x, xHigh: hi.x, slope, intercept: lo.yMean - slope * lo.x });
  }
  const increasing = segments[0].slope > 0;
  if (segments.some((s) => s.slope > 0 !== increasing)) {
    fail('not_monotonic', 'the mean responses do not rise (or fall) steadily with x, so an unknown cannot be bracketed');
  }
  return { levels, segments };
}

function pickSegment(segments: BracketSegment[], y: number): BracketSegment {
  const responseAt = (s: BracketSegment, x: number) => s.intercept + s.slope * x;
  for (const s of segments) {
    const a = responseAt(s, s.xLow);
    const b = responseAt(s, s.xHigh);
    if (y >= Math.min(a, b) && y <= Math.max(a, b)) return s;
  }
  const first = segments[0];
  const below = first.slope > 0 ? y < responseAt(first, first.xLow) : y > responseAt(first, first.xLow);
  return below ? first : segments[segments.length - 1];
}

/** `xBacks` holds NaN where a standard has no back-calculated x. */
function levelSummaries(levels: Grouping, ysColumn: Float64Array, xBacks: Float64Array): CalibrationLevel[] {
  // summariseGroups computes mean() and sd()'s sums of each level (no view per level).
  const ys = summariseGroups(levels, ysColumn);
  const backs = summariseGroups(levels, xBacks);
  const incomplete = new Uint8Array(levels.keys.length);
  for (let i = 0; i < xBacks.length; i++) if (Number.isNaN(xBacks[i])) incomplete[levels.of[i]] = 1;
  const sdOf = (ss: number, n: number) => (n < 2 ? null : Math.sqrt(ss / (n - 1)));
  return sortedGroups(levels).map((g) => {
    const x = levels.keys[g];
    const n = levels.start[g + 1] - levels.start[g];
    const complete = incomplete[g] === 0;
    const xBackMean = complete ? backs.mean[g] : null;
    const backSd = complete ? sdOf(backs.ss[g], n) : null;
    return {
      x,
      n,
      yMean: ys.mean[g],
      ySd: sdOf(ys.ss[g], n),
      xBackMean,
      rePct: xBackMean === null || x === 0 ? null : (100 * (xBackMean - x)) / x,
      rsdPct: backSd === null || xBackMean === null || xBackMean === 0 ? null : (100 * backSd) / Math.abs(xBackMean),
    };
  });
}

function band(core: RegressionCore, t: number, x: number, predict: (x: number) => number, weightAt: (x: number) => number): BandPoint {
  const leverage = core.leverage(x);
  return {
    x,
    fit: predict(x),
    confidenceHalfWidth: t * core.s * Math.sqrt(leverage),
    predictionHalfWidth: t * core.s * Math.sqrt(1 / weightAt(x) + leverage),
  };
}

/**
 * The column as a plain list, by push: Array.from reads a typed array through its iterator (several times slower), and a
 * list made with new Array(n) stays "holey" for V8, which JSON.stringify writes at half the speed.
 */
function listOf(column: Float64Array): number[] {
  const list: number[] = [];
  for (let i = 0; i < column.length; i++) list.push(column[i]);
  return list;
}

/** The bands at BAND_POINTS x from xMin to xMax, by columns, as a table built when first read (null without regression statistics). */
function bandColumns(
  core: RegressionCore | null,
  t: number | null,
  xMin: number,
  xMax: number,
  predict: (x: number) => number,
  weightAt: (x: number) => number,
): LazyTable<BandPoint[] | null> {
  if (!core || t === null)
    return new LazyTable(
      () => null,
      () => true,
    );
  const xs = linspace(xMin, xMax, BAND_POINTS);
  const fits = new Float64Array(BAND_POINTS);
  const confidence = new Float64Array(BAND_POINTS);
  const prediction = new Float64Array(BAND_POINTS);
  let finite = true;
  for (let i = 0; i < BAND_POINTS; i++) {
    const x = xs[i];
    const leverage = core.leverage(x);
    fits[i] = predict(x);
    confidence[i] = t * core.s * Math.sqrt(leverage);
    prediction[i] = t * core.s * Math.sqrt(1 / weightAt(x) + leverage);
    if (!Number.isFinite(x) || !Number.isFinite(fits[i]) || !Number.isFinite(confidence[i]) || !Number.isFinite(prediction[i]))
      finite = false;
  }
  return new LazyTable(
    () => xs.map((x, i) => ({ x, fit: fits[i], confidenceHalfWidth: confidence[i], predictionHalfWidth: prediction[i] })),
    () => finite,
  );
}

/** Confidence and prediction half-widths at any x (null without regression statistics). */
export function bandAt(fit: CalibrationFit, x: number): BandPoint | null {
  const t = fit.calibration.t;
  return fit.core && t !== null ? band(fit.core, t, x, fit.predict, fit.weightAt) : null;
}

function assertComputable(values: number[]): void {
  if (values.some((v) => !Number.isFinite(v))) {
    fail('not_computable', 'the standards give no finite calibration (values too large or too close together)');
  }
}

/** A calibration curve: how to go from x to y and back, with its least-squares core if any. */
interface Curve {
  core: RegressionCore | null;
  segments: BracketSegment[] | null;
  slope: number;
  intercept: number;
  predict(x: number): number;
  slopeAt(x: number): number;
  inverse(y: number): number | null;
  /** x for each response into `out`, NaN where the curve gives no finite x. */
  backCalculate(ys: Float64Array, out: Float64Array): void;
  /** For a straight line fitted on centred sums: x = cx + (y − cy)/b. */
  centred: { cx: number; cy: number; b: number } | null;
}

// The loops live in module-level functions: a closure made per curve would start each large study in the interpreter.
function backCalculateStraight(ys: Float64Array, out: Float64Array, intercept: number, slope: number): void {
  for (let i = 0; i < ys.length; i++) {
    const xBack = (ys[i] - intercept) / slope;
    out[i] = Number.isFinite(xBack) ? xBack : NaN;
  }
}

function backCalculateCentred(ys: Float64Array, out: Float64Array, cx: number, cy: number, b: number): void {
  for (let i = 0; i < ys.length; i++) {
    const xBack = cx + (ys[i] - cy) / b;
    out[i] = Number.isFinite(xBack) ? xBack : NaN;
  }
}

/** Σ|%RE| over the standards whose back-calculated x is finite, as back-calculating them first would give it. */
function sumAbsRePctCentred(xs: Float64Array, ys: Float64Array, cx: number, cy: number, b: number): number {
  let total = 0;
  for (let i = 0; i < xs.length; i++) {
    const x = xs[i];
    const xBack = cx + (ys[i] - cy) / b;
    if (Number.isFinite(xBack) && x !== 0) total += Math.abs((100 * (xBack - x)) / x);
  }
  return total;
}

type Centred = { cx: number; cy: number; b: number };

/**
 * Σ|%RE| of straight lines by level: a standard's x̂ − x is (y − ŷ(x))/b, so each level adds 100 Σ|y − ŷ(x)| / |x b| (no
 * division per standard; one tight pass per line). Where that is not finite, standard by standard.
 */
function sumsAbsRePctByLevel(fit: CalibrationFit, lines: readonly Centred[]): number[] {
  return lines.map((line) => {
    const total = sumAbsRePctByLevel(fit.levels, fit.ys, line);
    return Number.isFinite(total) ? total : sumAbsRePctCentred(fit.xs, fit.ys, line.cx, line.cy, line.b);
  });
}

function sumAbsRePctByLevel({ of, keys }: Grouping, ys: Float64Array, { cx, cy, b }: Centred): number {
  const fitted = new Float64Array(keys.length);
  for (let g = 0; g < keys.length; g++) fitted[g] = cy + b * (keys[g] - cx);
  const sums = new Float64Array(keys.length);
  for (let i = 0; i < ys.length; i++) {
    const g = of[i];
    sums[g] += Math.abs(ys[i] - fitted[g]);
  }
  let total = 0;
  for (let g = 0; g < keys.length; g++) if (keys[g] !== 0) total += (100 * sums[g]) / Math.abs(keys[g] * b);
  return total;
}

/** Back-calculation through `inverse` one response at a time. */
function backCalculateEach(inverse: (y: number) => number | null): Curve['backCalculate'] {
  return (ys, out) => {
    for (let i = 0; i < ys.length; i++) {
      const xBack = inverse(ys[i]);
      out[i] = xBack !== null && Number.isFinite(xBack) ? xBack : NaN;
    }
  };
}

function straight(slope: number, intercept: number, segments: BracketSegment[] | null = null): Curve {
  return {
    core: null,
    segments,
    slope,
    intercept,
    predict: (x) => intercept + slope * x,
    slopeAt: () => slope,
    inverse: (y) => (y - intercept) / slope,
    backCalculate: (ys, out) => backCalculateStraight(ys, out, intercept, slope),
    centred: null,
  };
}

function onePointCurve(ys: Float64Array, levels: number, x: number): Curve {
  if (levels !== 1) fail('too_many_levels', 'a one-point calibration takes one standard level');
  if (x <= 0) fail('not_positive', 'the one-point standard must have a concentration above zero');
  const slope = mean(ys) / x;
  if (slope === 0) fail('zero_slope', 'the standard response is zero: zero slope');
  return straight(slope, 0);
}

function twoPointCurve(used: UsedPoints, levels: number, bracketing: boolean): Curve {
  if (used.xs.length < 2 || levels < 2) fail('all_x_equal', 'a two-point calibration needs two standards at different x');
  if (levels > 2 && !bracketing) fail('too_many_levels', 'a two-point calibration takes two standard levels');
  const built = buildSegments(used);
  const low = built.levels[0];
  const high = built.levels[built.levels.length - 1];
  const slope = (high.yMean - low.yMean) / (high.x - low.x);
  const outer = straight(slope, low.yMean - slope * low.x);
  if (!bracketing) return outer;
  const segs = built.segments;
  const segmentAt = (x: number) => segs.find((seg) => x <= seg.xHigh) ?? segs[segs.length - 1];
  const inverse = (y: number) => {
    const seg = pickSegment(segs, y);
    return (y - seg.intercept) / seg.slope;
  };
  return {
    ...outer,
    segments: segs,
    predict: (x) => segmentAt(x).intercept + segmentAt(x).slope * x,
    slopeAt: (x) => segmentAt(x).slope,
    inverse,
    backCalculate: backCalculateEach(inverse),
  };
}

function regressionCurve(
  model: CalibrationModel,
  rows: FitRows,
  levels: number,
  xMin: number,
  xMax: number,
  standardsScratch?: Scratch,
): Curve {
  const count = rows.pooled ? rows.pooled.count : rows.x.length;
  // Rows that stand for levels are few: their columns are fresh rather than the standards' scratch columns.
  const scratch = rows.pooled ? undefined : standardsScratch;
  const minPoints = model === 'quadratic' ? 4 : 3;
  if (count < minPoints) fail('too_few', `the ${model} model needs at least ${minPoints} standards (${count} given)`);
  if (levels < 2) fail('all_x_equal', 'all standards have the same x');
  if (model === 'quadratic') {
    if (levels < 3) fail('too_few_levels', 'a quadratic calibration needs at least 3 distinct x');
    const q = fitQuadratic(rows.x, rows.y, rows.w, scratch && ((slot) => scratch(SCRATCH.quadratic + slot)), rows.pooled);
    assertComputable([q.sxx, q.ssTotal, q.a, q.b, q.c, q.s]);
    if (q.b === 0 && q.c === 0) fail('zero_slope', 'the responses do not change with x: zero slope');
    const [c0, c1, c2] = q.zCoefficients;
    return {
      core: q,
      segments: null,
      slope: q.b,
      intercept: q.a,
      predict: (x) => {
        const z = (x - q.centre) / q.scale;
        return c0 + z * (c1 + z * c2);
      },
      slopeAt: (x) => q.b + 2 * q.c * x,
      inverse: (y) => invertQuadratic(q, y, xMin, xMax),
      backCalculate: backCalculateEach((y) => invertQuadratic(q, y, xMin, xMax)),
      centred: null,
    };
  }
  const origin = model === 'linear-through-origin';
  const residuals = scratch ? scratch(SCRATCH.residuals) : new Float64Array(rows.x.length);
  const line = origin
    ? fitThroughOrigin(rows.x, rows.y, residuals, rows.pooled && rows.w, rows.pooled)
    : fitLine(rows.x, rows.y, rows.w, residuals, rows.pooled);
  assertComputable([line.sxx, line.ssTotal, line.a, line.b, line.s]);
  if (line.b === 0) fail('zero_slope', 'the responses do not change with x: zero slope');
  const cx = origin ? 0 : line.xMean;
  const cy = origin ? 0 : line.yMean;
  return {
    core: line,
    segments: null,
    slope: line.b,
    intercept: line.a,
    predict: (x) => cy + line.b * (x - cx),
    slopeAt: () => line.b,
    inverse: (y) => cx + (y - cy) / line.b,
    backCalculate: (ys, out) => backCalculateCentred(ys, out, cx, cy, line.b),
    centred: { cx, cy, b: line.b },
  };
}

type Statistics = Omit<
  CalibrationResult,
  | 'model'
  | 'weighting'
  | 'n'
  | 'slope'
  | 'intercept'
  | 'xMin'
  | 'xMax'
  | 'bands'
  | 'residuals'
  | 'backCalculated'
  | 'standardizedResiduals'
  | 'levels'
  | 'segments'
  | 'excluded'
>;

function regressionStatistics(core: RegressionCore, model: CalibrationModel, confidence: number): Statistics {
  const t = core.df > 0 ? studentQuantile((1 + confidence) / 2, core.df) : null;
  const ci = (estimate: number, se: number | null) => (t === null || se === null ? null : interval(estimate, t * se));
  const quadratic = model === 'quadratic';
  const r2 = core.ssTotal > 0 ? 1 - core.ssResidual / core.ssTotal : 1;
  const dfTotal = model === 'linear-through-origin' ? core.n : core.n - 1;
  const msResidual = core.df > 0 ? core.ssResidual / core.df : 0;
  const msRegression = core.ssRegression / core.dfRegression;
  const F = msResidual > 0 ? msRegression / msResidual : null;
  return {
    df: core.df,
    seSlope: core.seB,
    seIntercept: core.seA,
    ciSlope: ci(core.b, core.seB),
    ciIntercept: ci(core.a, core.seA),
    curvature: quadratic ? core.c : null,
    seCurvature: quadratic ? core.seC : null,
    ciCurvature: quadratic ? ci(core.c, core.seC) : null,
    r: (quadratic ? 1 : Math.sign(core.b)) * Math.sqrt(Math.max(0, r2)),
    r2,
    adjR2: core.df > 0 ? 1 - ((1 - r2) * dfTotal) / core.df : null,
    sYX: core.s,
    t,
    xMean: core.xMean,
    yMean: core.yMean,
    sxx: core.sxx,
    sumWeights: core.sumWeights,
    anova: {
      dfRegression: core.dfRegression,
      ssRegression: core.ssRegression,
      msRegression,
      dfResidual: core.df,
      ssResidual: core.ssResidual,
      msResidual,
      F,
      p: F === null ? null : fUpper(F, core.dfRegression, core.df),
    },
  };
}

function noRegressionStatistics(xs: Float64Array, ys: Float64Array): Statistics {
  return {
    df: null,
    seSlope: null,
    seIntercept: null,
    ciSlope: null,
    ciIntercept: null,
    curvature: null,
    seCurvature: null,
    ciCurvature: null,
    r: null,
    r2: null,
    adjR2: null,
    sYX: null,
    t: null,
    xMean: mean(xs),
    yMean: mean(ys),
    sxx: sumSquaredDeviations(xs),
    sumWeights: xs.length,
    anova: null,
  };
}

function checkWeighting(model: CalibrationModel, weighting: Weighting, sds: () => Float64Array, xMin: number): void {
  if (weighting === 'none') return;
  if (model !== 'linear' && model !== 'quadratic') fail('incompatible', 'weighting applies only to linear and quadratic', 'weighting');
  if (weighting === '1/s2') {
    if (sds().some((sd) => !(sd > 0))) fail('required', 'weighting 1/s2 needs the SD of every standard');
  } else if (xMin <= 0) {
    fail('not_positive', `weighting ${weighting} needs every standard above zero`);
  }
}

interface FittedCurve {
  model: CalibrationModel;
  weighting: Weighting;
  confidence: number;
  used: UsedPoints;
  xMin: number;
  xMax: number;
  weighted: Weighted;
  curve: Curve;
}

/** Scratch slots of a refit whose curve is used and dropped (sumAbsRePct): weights, residuals, back-calculated x, QR. */
const SCRATCH = { weights: 0, residuals: 1, xBacks: 2, quadratic: 3 };

/** The curve through the standards that are not excluded, without its per-point tables (with `scratch`: a curve nobody keeps). */
function fitCurve(used: UsedPoints, options: FitOptions, scratch?: Scratch): FittedCurve {
  const model = options.model ?? 'linear';
  const weighting = options.weighting ?? 'none';
  const confidence = options.confidence ?? 0.95;
  const { xs, ys, summary } = used;
  if (xs.length === 0) fail('too_few', 'no standards to calibrate with');
  const levels = used.levels.keys.length;
  const range = summary ? summary.x : xs;
  let xMin = Infinity;
  let xMax = -Infinity;
  for (let i = 0; i < range.length; i++) {
    const x = range[i];
    if (x < xMin) xMin = x;
    if (x > xMax) xMax = x;
  }
  checkWeighting(model, weighting, used.sds, xMin);
  const weighted = summary ? levelRows(used, summary, weighting) : pointRows(used, weighting, scratch);

  const curve =
    model === 'one-point'
      ? onePointCurve(ys, levels, xMin)
      : model === 'two-point'
        ? twoPointCurve(used, levels, options.twoPoint?.bracketing === true)
        : regressionCurve(model, weighted.rows, levels, xMin, xMax, scratch);
  assertComputable([curve.slope, curve.intercept]);
  return { model, weighting, confidence, used, xMin, xMax, weighted, curve };
}

/**
 * Σ|%RE| of the back-calculated standards of the fit's points, under the fit's own weighting or another one (the tables
 * are not built).
 */
export function sumAbsRePct(fit: CalibrationFit, weighting: Weighting): number {
  const used = usedOf(fit);
  if (weighting === fit.weighting) {
    if (fit.summary && fit.centred) return sumsAbsRePctByLevel(fit, [fit.centred])[0];
    const { rePcts } = fit.points();
    let total = 0;
    for (let i = 0; i < rePcts.length; i++) if (!Number.isNaN(rePcts[i])) total += Math.abs(rePcts[i]);
    return total;
  }
  const { curve } = fitCurve(used, { model: fit.model, weighting, confidence: fit.confidence }, fit.scratch);
  if (curve.centred && fit.summary) return sumsAbsRePctByLevel(fit, [curve.centred])[0];
  if (curve.centred) return sumAbsRePctCentred(used.xs, used.ys, curve.centred.cx, curve.centred.cy, curve.centred.b);
  const xBacks = fit.scratch(SCRATCH.xBacks);
  curve.backCalculate(used.ys, xBacks);
  let total = 0;
  for (let i = 0; i < used.xs.length; i++) {
    const x = used.xs[i];
    const xBack = xBacks[i];
    if (!Number.isNaN(xBack) && x !== 0) total += Math.abs((100 * (xBack - x)) / x);
  }
  return total;
}

/** Σ|%RE| under each weighting, null where that weighting's fit fails. */
export function sumsAbsRePct(fit: CalibrationFit, weightings: readonly Weighting[]): (number | null)[] {
  const orNull = (weighting: Weighting) => {
    try {
      return sumAbsRePct(fit, weighting);
    } catch {
      return null;
    }
  };
  if (!fit.summary) return weightings.map(orNull);
  const lines = weightings.map((weighting): { centred: Centred | null } | null => {
    if (weighting === fit.weighting) return { centred: fit.centred };
    try {
      return { centred: fitCurve(usedOf(fit), { model: fit.model, weighting, confidence: fit.confidence }, fit.scratch).curve.centred };
    } catch {
      return null;
    }
  });
  const centred = lines.flatMap((line) => (line?.centred ? [line.centred] : []));
  const sums = sumsAbsRePctByLevel(fit, centred);
  return lines.map((line, j) =>
    line === null ? null : line.centred ? (sums[centred.indexOf(line.centred)] as number) : orNull(weightings[j]),
  );
}

/** The fit's standards as fitCurve takes them. */
function usedOf(fit: CalibrationFit): UsedPoints {
  return {
    indices: fit.indices,
    xs: fit.xs,
    ys: fit.ys,
    sds: fit.sds,
    levels: fit.levels,
    get levelYs() {
      return fit.levelYs;
    },
    summary: fit.summary,
    excluded: fit.calibration.excluded,
  };
}

/** Back-calculated x, %RE, residuals and standardised residuals of every standard, with what the finite guard asks of them. */
function pointColumns({ used, curve, weighted }: FittedCurve): PointColumns {
  const { xs, ys } = used;
  const n = xs.length;
  const xBacks = new Float64Array(n);
  const rePcts = new Float64Array(n);
  curve.backCalculate(ys, xBacks);
  // Whether each table holds only finite numbers (the finite guard's question), noted while the columns are written.
  // Back-calculated x is finite or NaN (null) by construction.
  let rowsFinite = true;
  for (let i = 0; i < n; i++) {
    const x = xs[i];
    const xBack = xBacks[i];
    const rePct = Number.isNaN(xBack) || x === 0 ? NaN : (100 * (xBack - x)) / x;
    rePcts[i] = rePct;
    if (!Number.isFinite(x) || !Number.isFinite(ys[i]) || rePct === Infinity || rePct === -Infinity) rowsFinite = false;
  }
  const core = curve.core;
  let residuals: Float64Array;
  let standardized: Float64Array | null = null;
  let residualsFinite = true;
  let standardizedFinite = true;
  let largest: LargestResidual | null = null;
  if (core) {
    if (used.summary) {
      residuals = new Float64Array(n);
      for (let i = 0; i < n; i++) residuals[i] = core.residualAt(xs[i], ys[i]);
    } else {
      residuals = core.residuals;
    }
    const w = weighted.pointWeights();
    // Weighted fits: s_y/x estimates the SD of a unit-weight residual, so each residual is scaled by √w.
    standardized = new Float64Array(n);
    let position = 0;
    for (let i = 0; i < n; i++) {
      const e = residuals[i];
      const value = core.s > 0 ? (Math.sqrt(w[i]) * e) / core.s : 0;
      standardized[i] = value;
      if (Math.abs(value) > Math.abs(standardized[position])) position = i;
      if (!Number.isFinite(e)) residualsFinite = false;
      if (!Number.isFinite(value)) standardizedFinite = false;
    }
    largest = { position, standardized: standardized[position], residual: residuals[position] };
  } else {
    residuals = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const e = ys[i] - curve.predict(xs[i]);
      residuals[i] = e;
      if (!Number.isFinite(e)) residualsFinite = false;
    }
  }
  const finite = { rows: rowsFinite, residuals: residualsFinite, standardized: standardizedFinite };
  return { xBacks, rePcts, residuals, standardized, largest, finite };
}

/**
 * For a straight line summarised by level with one weight per level: a standard's residual, standardised residual,
 * back-calculated x and %RE all move with its response, so each level's smallest and largest response answer for the
 * level (the largest residual, finiteness), and the level's back-calculated mean and SD follow from its mean and SD.
 */
function fromLevelExtremes(
  { used, weighted }: FittedCurve,
  summary: LevelSummary,
  core: RegressionCore,
  { cx, cy, b }: { cx: number; cy: number; b: number },
): Pick<PointColumns, 'finite'> & { largest: LargestResidual; levels: CalibrationLevel[] } {
  const { levels, xs, ys } = used;
  const finite = { rows: true, residuals: true, standardized: true };
  const standardize = (x: number, e: number) => (core.s > 0 ? (Math.sqrt(weighted.weightAt(x)) * e) / core.s : 0);
  const atZero = core.residualAt(xs[0], ys[0]);
  let largest: LargestResidual = { position: 0, standardized: standardize(xs[0], atZero), residual: atZero };
  for (let g = 0; g < summary.x.length; g++) {
    const x = summary.x[g];
    for (const position of [summary.lowest[g], summary.highest[g]]) {
      const y = ys[position];
      const e = core.residualAt(x, y);
      const standardized = standardize(x, e);
      const xBack = cx + (y - cy) / b;
      const rePct = !Number.isFinite(xBack) || x === 0 ? NaN : (100 * (xBack - x)) / x;
      if (!Number.isFinite(x) || !Number.isFinite(y) || rePct === Infinity || rePct === -Infinity) finite.rows = false;
      if (!Number.isFinite(e)) finite.residuals = false;
      if (!Number.isFinite(standardized)) finite.standardized = false;
      const [size, held] = [Math.abs(standardized), Math.abs(largest.standardized)];
      if (size > held || (size === held && position < largest.position)) largest = { position, standardized, residual: e };
    }
  }
  const summaries = sortedGroups(levels).map((g): CalibrationLevel => {
    const x = levels.keys[g];
    const n = summary.count[g];
    const yMean = summary.mean[g];
    const ySd = n < 2 ? null : Math.sqrt(summary.ss[g] / (n - 1));
    const complete = Number.isFinite(cx + (ys[summary.lowest[g]] - cy) / b) && Number.isFinite(cx + (ys[summary.highest[g]] - cy) / b);
    const xBackMean = complete ? cx + (yMean - cy) / b : null;
    const backSd = complete && ySd !== null ? ySd / Math.abs(b) : null;
    return {
      x,
      n,
      yMean,
      ySd,
      xBackMean,
      rePct: xBackMean === null || x === 0 ? null : (100 * (xBackMean - x)) / x,
      rsdPct: backSd === null || xBackMean === null || xBackMean === 0 ? null : (100 * backSd) / Math.abs(xBackMean),
    };
  });
  return { finite, largest, levels: summaries };
}

/** Fits a calibration of the chosen model to the standards that are not excluded. */
export function fitCalibration(standards: readonly StandardPoint[] | StandardColumns, options: FitOptions = {}): CalibrationFit {
  const fitted = fitCurve(usedPoints(standards, options), options);
  const { model, weighting, confidence, used, xMin, xMax, weighted, curve } = fitted;
  const { indices, xs, ys, sds, levels, excluded, summary } = used;
  const n = xs.length;
  const core = curve.core;
  const scratch = scratchColumns(n);
  // Summarised straight lines with one weight per level need no per-standard column until a table is read.
  const extremes =
    summary && core && curve.centred && weighting !== '1/s2' ? fromLevelExtremes(fitted, summary, core, curve.centred) : null;
  let columns = extremes ? null : pointColumns(fitted);
  const points = () => (columns ??= pointColumns(fitted));
  const { finite, largest } = extremes ?? points();
  const statistics = core ? regressionStatistics(core, model, confidence) : noRegressionStatistics(xs, ys);
  const { anova, ...fitStatistics } = statistics;
  // The per-standard tables are built from the columns when first read (JSON.stringify, structuredClone, a report).
  const residualTable = new LazyTable(
    () => listOf(points().residuals),
    () => finite.residuals,
  );
  const standardizedTable = new LazyTable(
    () => {
      const standardized = points().standardized;
      return standardized ? listOf(standardized) : null;
    },
    () => finite.standardized,
  );
  const backCalculatedTable = new LazyTable(
    () => {
      const { xBacks, rePcts } = points();
      const rows: BackCalculatedPoint[] = [];
      for (let i = 0; i < n; i++) {
        const xBack = xBacks[i];
        const rePct = rePcts[i];
        rows.push({
          index: indices ? indices[i] : i,
          x: xs[i],
          y: ys[i],
          xBack: Number.isNaN(xBack) ? null : xBack,
          rePct: Number.isNaN(rePct) ? null : rePct,
        });
      }
      return rows;
    },
    () => finite.rows,
  );
  const bandTable = bandColumns(core, statistics.t, xMin, xMax, curve.predict, weighted.weightAt);
  const calibration: CalibrationResult = {
    model,
    weighting,
    n,
    slope: curve.slope,
    intercept: curve.intercept,
    ...fitStatistics,
    get standardizedResiduals() {
      return standardizedTable.get();
    },
    set standardizedResiduals(next) {
      standardizedTable.set(next);
    },
    get bands() {
      return bandTable.get();
    },
    set bands(next) {
      bandTable.set(next);
    },
    anova,
    xMin,
    xMax,
    get residuals() {
      return residualTable.get();
    },
    set residuals(next) {
      residualTable.set(next);
    },
    get backCalculated() {
      return backCalculatedTable.get();
    },
    set backCalculated(next) {
      backCalculatedTable.set(next);
    },
    levels: extremes ? extremes.levels : levelSummaries(levels, ys, points().xBacks),
    segments: curve.segments,
    excluded,
  };
  registerLazyTables(calibration, {
    standardizedResiduals: standardizedTable,
    bands: bandTable,
    residuals: residualTable,
    backCalculated: backCalculatedTable,
  });
  return {
    model,
    weighting,
    confidence,
    indices,
    studyIndex: indices ? (position) => indices[position] : (position) => position,
    xs,
    ys,
    sds,
    levels,
    get levelYs() {
      return used.levelYs;
    },
    summary,
    rows: weighted.rows,
    scratch,
    points,
    largest,
    centred: curve.centred,
    calibration,
    core,
    segments: curve.segments,
    weightAt: weighted.weightAt,
    predict: curve.predict,
    slopeAt: curve.slopeAt,
    inverse: curve.inverse,
  };
}
