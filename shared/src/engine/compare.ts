import { DEFAULT_RECOVERY_EQUIVALENCE_MARGIN_PCT } from '../method-change.js';
import type {
  ComparisonVerdict,
  DetectionComparison,
  EquivalenceTest,
  FigureComparison,
  LineParameterComparison,
  MeanComparison,
  RangeComparison,
  RecoveryComparison,
  Unavailable,
  VarianceComparison,
  VersionComparison,
} from '../comparison-types.js';
import type { CalibrationResult, CriterionOutcome, DetectionApproach, EvaluationResult, PrecisionResultSection } from '../result.js';
import { FIGURES } from '../catalogue/figures.js';
import { fCdf, fQuantile, fUpper, studentCdf, studentQuantile, studentTwoSidedP, studentUpper } from './distributions.js';
import { figureValue } from './criteria.js';

/** What a two-sample test needs of each sample. */
export interface SampleSummary {
  n: number;
  mean: number;
  sd: number;
}

/** What the comparison of two straight lines needs of each fit (weighted fits give their weighted sums). */
export interface LineSummary {
  /** Slope or intercept. */
  estimate: number;
  /** Residual SD s_y/x and its degrees of freedom. */
  s: number;
  df: number;
  /** Var(estimate) / s²: 1/Sxx for the slope, 1/Σw + x̄²/Sxx for the intercept. */
  varianceFactor: number;
}

const unavailable = (reason: string): Unavailable => ({ available: false, reason });

const differenceVerdict = (p: number, alpha: number): ComparisonVerdict => (p < alpha ? 'different' : 'no-difference');

/**
 * Slopes (or intercepts) of two independent straight lines: t = (b_to − b_from) / √(s_p² (c_from + c_to)),
 * s_p² = (SS_res,from + SS_res,to) / (ν_from + ν_to); ν = n1 + n2 − 4 for two lines with intercepts (Zar,
 * Biostatistical Analysis, comparing two regression lines, from memory; Kleinbaum et al.).
 */
export function compareLineParameter(
  from: LineSummary,
  to: LineSummary,
  alpha: number,
  parameter: 'slope' | 'intercept',
): LineParameterComparison | Unavailable {
  const df = from.df + to.df;
  if (from.df < 1 || to.df < 1) return unavailable('each line needs more standards than parameters to estimate its scatter');
  const pooledVariance = (from.df * from.s ** 2 + to.df * to.s ** 2) / df;
  const se = Math.sqrt(pooledVariance * (from.varianceFactor + to.varianceFactor));
  if (!(se > 0) || !Number.isFinite(se)) return unavailable('both lines pass exactly through their standards: no scatter to test against');
  const difference = to.estimate - from.estimate;
  const t = difference / se;
  const p = studentTwoSidedP(t, df);
  const half = studentQuantile(1 - alpha / 2, df) * se;
  return {
    available: true,
    parameter,
    from: from.estimate,
    to: to.estimate,
    difference,
    changePct: parameter === 'intercept' || from.estimate === 0 ? null : (100 * difference) / Math.abs(from.estimate),
    pooledSd: Math.sqrt(pooledVariance),
    se,
    t,
    df,
    p,
    ci: [difference - half, difference + half],
    alpha,
    verdict: differenceVerdict(p, alpha),
  };
}

/**
 * Two-sided F test of two variances: F = s_to² / s_from² on (ν_to, ν_from) df, p = 2 min(P(F ≤ f), P(F ≥ f)),
 * CI of σ_to²/σ_from² = [F / F(1 − α/2), F / F(α/2)] (NIST/SEMATECH e-Handbook 1.3.5.9).
 */
export function compareVariances(
  from: { sd: number; df: number },
  to: { sd: number; df: number },
  alpha: number,
  dfNote: string | null = null,
): VarianceComparison | Unavailable {
  if (!(from.df > 0) || !(to.df > 0)) return unavailable('each standard deviation needs at least one degree of freedom');
  if (!(from.sd > 0)) return unavailable('the earlier standard deviation is zero: the ratio is undefined');
  const F = to.sd ** 2 / from.sd ** 2;
  const p = Math.min(1, 2 * Math.min(fCdf(F, to.df, from.df), fUpper(F, to.df, from.df)));
  return {
    available: true,
    from: from.sd,
    to: to.sd,
    F,
    df: [to.df, from.df],
    dfNote,
    p,
    ratioCi: [F / fQuantile(1 - alpha / 2, to.df, from.df), F / fQuantile(alpha / 2, to.df, from.df)],
    alpha,
    verdict: differenceVerdict(p, alpha),
  };
}

function twoSampleError(from: SampleSummary, to: SampleSummary, pooled: boolean): { se: number; df: number } {
  if (pooled) {
    const df = from.n + to.n - 2;
    const sp2 = ((from.n - 1) * from.sd ** 2 + (to.n - 1) * to.sd ** 2) / df;
    return { se: Math.sqrt(sp2 * (1 / from.n + 1 / to.n)), df };
  }
  const vFrom = from.sd ** 2 / from.n;
  const vTo = to.sd ** 2 / to.n;
  return { se: Math.sqrt(vFrom + vTo), df: (vFrom + vTo) ** 2 / (vFrom ** 2 / (from.n - 1) + vTo ** 2 / (to.n - 1)) };
}

/** Welch's t test of two means (Welch–Satterthwaite df, not truncated); NIST/SEMATECH e-Handbook 1.3.5.3. */
export function welchTest(from: SampleSummary, to: SampleSummary, alpha: number): MeanComparison | Unavailable {
  if (from.n < 2 || to.n < 2) return unavailable('each mean needs at least two results');
  const { se, df } = twoSampleError(from, to, false);
  if (!(se > 0)) return unavailable('both sets of results are without scatter');
  const difference = to.mean - from.mean;
  const t = difference / se;
  const p = studentTwoSidedP(t, df);
  const half = studentQuantile(1 - alpha / 2, df) * se;
  return {
    available: true,
    from: from.mean,
    to: to.mean,
    difference,
    se,
    t,
    df,
    p,
    ci: [difference - half, difference + half],
    alpha,
    verdict: differenceVerdict(p, alpha),
  };
}

/**
 * Two one-sided tests (Schuirmann 1987, from memory) of |μ_to − μ_from| < margin: equivalent when both one-sided
 * p are below α, the same as the 100(1 − 2α) % interval of the difference lying inside ±margin.
 */
export function equivalenceTest(
  from: SampleSummary,
  to: SampleSummary,
  margin: number,
  alpha: number,
  pooled = false,
): EquivalenceTest | Unavailable {
  if (!(margin > 0)) return unavailable('the equivalence margin must be greater than zero');
  if (from.n < 2 || to.n < 2) return unavailable('each mean needs at least two results');
  const { se, df } = twoSampleError(from, to, pooled);
  if (!(se > 0)) return unavailable('both sets of results are without scatter');
  const difference = to.mean - from.mean;
  const tLower = (difference + margin) / se;
  const tUpper = (difference - margin) / se;
  const pLower = studentUpper(tLower, df);
  const pUpper = studentCdf(tUpper, df);
  const p = Math.max(pLower, pUpper);
  const half = studentQuantile(1 - alpha, df) * se;
  return {
    available: true,
    margin,
    difference,
    se,
    df,
    pooled,
    tLower,
    pLower,
    tUpper,
    pUpper,
    p,
    ci: [difference - half, difference + half],
    alpha,
    verdict: p < alpha ? 'equivalent' : 'inconclusive',
  };
}

function lineSummary(cal: CalibrationResult, parameter: 'slope' | 'intercept'): LineSummary | string {
  if (cal.df === null || cal.sYX === null) return 'the calibration has too few standards for a residual scatter';
  if (cal.model === 'linear') {
    const varianceFactor = parameter === 'slope' ? 1 / cal.sxx : 1 / cal.sumWeights + cal.xMean ** 2 / cal.sxx;
    return { estimate: parameter === 'slope' ? cal.slope : cal.intercept, s: cal.sYX, df: cal.df, varianceFactor };
  }
  if (cal.model === 'linear-through-origin' && parameter === 'slope') {
    return { estimate: cal.slope, s: cal.sYX, df: cal.df, varianceFactor: 1 / (cal.sxx + cal.n * cal.xMean ** 2) };
  }
  return parameter === 'slope'
    ? `a ${cal.model} calibration has no single straight-line slope to compare`
    : `a ${cal.model} calibration has no fitted intercept to compare`;
}

function compareLines(
  from: EvaluationResult,
  to: EvaluationResult,
  parameter: 'slope' | 'intercept',
  alpha: number,
): LineParameterComparison | Unavailable {
  if (!from.calibration || !to.calibration) return unavailable('a calibration is missing from one of the studies');
  const a = lineSummary(from.calibration, parameter);
  const b = lineSummary(to.calibration, parameter);
  if (typeof a === 'string') return unavailable(`earlier version: ${a}`);
  if (typeof b === 'string') return unavailable(`later version: ${b}`);
  return compareLineParameter(a, b, alpha, parameter);
}

/**
 * Effective df of s_I² = (1 − 1/n0) MS_within + MS_between / n0 (Satterthwaite 1946); s_I = s_r with its own df
 * when there is one series or the between-series component is zero.
 */
export function intermediatePrecisionDf(p: PrecisionResultSection): { df: number; satterthwaite: boolean } {
  if (p.msBetween === null || p.dfBetween === null || p.n0 === null || p.sBetween === null || p.sBetween === 0) {
    return { df: p.dfWithin, satterthwaite: false };
  }
  const within = (1 - 1 / p.n0) * p.msWithin;
  const between = p.msBetween / p.n0;
  return { df: (within + between) ** 2 / (within ** 2 / p.dfWithin + between ** 2 / p.dfBetween), satterthwaite: true };
}

function comparePrecision(
  from: PrecisionResultSection | null,
  to: PrecisionResultSection | null,
  which: 'repeatability' | 'intermediate',
  alpha: number,
): VarianceComparison | Unavailable {
  if (!from || !to) return unavailable('precision results are missing from one of the studies');
  if (which === 'repeatability') return compareVariances({ sd: from.sR, df: from.dfWithin }, { sd: to.sR, df: to.dfWithin }, alpha);
  const a = intermediatePrecisionDf(from);
  const b = intermediatePrecisionDf(to);
  const describe = (d: { df: number; satterthwaite: boolean }) =>
    d.satterthwaite ? `${d.df.toFixed(1)} (Satterthwaite)` : `${d.df} (within series; no between-series component)`;
  const note = `effective degrees of freedom: earlier ${describe(a)}, later ${describe(b)}`;
  return compareVariances({ sd: from.sI, df: a.df }, { sd: to.sI, df: b.df }, alpha, note);
}

function compareRecovery(from: EvaluationResult, to: EvaluationResult, marginPct: number, alpha: number): RecoveryComparison {
  const a = from.recovery?.overall;
  const b = to.recovery?.overall;
  if (!a || !b) {
    const missing = unavailable('recovery results are missing from one of the studies');
    return { welch: missing, tost: missing, verdict: 'inconclusive' };
  }
  if (a.sdPct === null || b.sdPct === null) {
    const single = unavailable('each mean recovery needs at least two results');
    return { welch: single, tost: single, verdict: 'inconclusive' };
  }
  const summaryA = { n: a.n, mean: a.meanPct, sd: a.sdPct };
  const summaryB = { n: b.n, mean: b.meanPct, sd: b.sdPct };
  const welch = welchTest(summaryA, summaryB, alpha);
  const tost = equivalenceTest(summaryA, summaryB, marginPct, alpha);
  const verdict: ComparisonVerdict =
    tost.available && tost.verdict === 'equivalent'
      ? 'equivalent'
      : welch.available && welch.verdict === 'different'
        ? 'different'
        : 'inconclusive';
  return { welch, tost, verdict };
}

const DETECTION_APPROACHES: DetectionApproach[] = ['sdResidual', 'sdIntercept', 'blankSd', 'iso11843', 'hubauxVos', 'epaMdl'];

function limitsOf(result: EvaluationResult, approach: DetectionApproach): { lod: number | null; loq: number | null } {
  const d = result.detection;
  if (!d) return { lod: null, loq: null };
  switch (approach) {
    case 'sdResidual':
    case 'sdIntercept':
    case 'blankSd':
      return { lod: d[approach]?.lod ?? null, loq: d[approach]?.loq ?? null };
    case 'iso11843':
    case 'hubauxVos':
      return { lod: d[approach]?.detectableX ?? null, loq: null };
    case 'epaMdl':
      return { lod: d.epaMdl?.mdl ?? null, loq: null };
  }
}

const ratio = (from: number | null, to: number | null) => (from === null || to === null || from === 0 ? null : to / from);

function criterionFor(result: EvaluationResult, figure: string): CriterionOutcome | null {
  return result.verdict.criteria.find((c) => c.figure === figure) ?? null;
}

function compareDetection(from: EvaluationResult, to: EvaluationResult): DetectionComparison[] {
  return DETECTION_APPROACHES.flatMap((approach) => {
    const a = limitsOf(from, approach);
    const b = limitsOf(to, approach);
    if (a.lod === null && b.lod === null) return [];
    const loqFigure = `detection.${approach}.loq`;
    return [
      {
        approach,
        lodFrom: a.lod,
        lodTo: b.lod,
        lodRatio: ratio(a.lod, b.lod),
        loqFrom: a.loq,
        loqTo: b.loq,
        loqRatio: ratio(a.loq, b.loq),
        loqCriterionFrom: criterionFor(from, loqFigure)?.pass ?? null,
        loqCriterionTo: criterionFor(to, loqFigure)?.pass ?? null,
      },
    ];
  });
}

function compareRange(from: EvaluationResult, to: EvaluationResult): RangeComparison | Unavailable {
  if (!from.range || !to.range) return unavailable('a working range is missing from one of the studies (no per-level criteria)');
  const passing = (r: EvaluationResult) => new Set((r.range?.levels ?? []).filter((l) => l.pass).map((l) => l.x));
  const a = passing(from);
  const b = passing(to);
  return {
    available: true,
    from: { low: from.range.low, high: from.range.high },
    to: { low: to.range.low, high: to.range.high },
    levelsGained: [...b].filter((x) => !a.has(x)).sort((p, q) => p - q),
    levelsLost: [...a].filter((x) => !b.has(x)).sort((p, q) => p - q),
  };
}

/** Every catalogue figure either result holds, side by side; a missing result gives a one-sided table. */
export function figureComparisons(from: EvaluationResult | null, to: EvaluationResult | null): FigureComparison[] {
  return FIGURES.filter((f) => !f.key.startsWith('range.')).flatMap((f) => {
    const a = from ? figureValue(from, f.key) : null;
    const b = to ? figureValue(to, f.key) : null;
    if (a === null && b === null) return [];
    return [
      {
        figure: f.key,
        label: f.label,
        from: a,
        to: b,
        difference: a === null || b === null ? null : b - a,
        ratio: ratio(a, b),
        criterionFrom: from ? criterionFor(from, f.key) : null,
        criterionTo: to ? criterionFor(to, f.key) : null,
      },
    ];
  });
}

export interface CompareOptions {
  /** Equivalence margin of the mean recoveries in percentage points (default 5, common practice). */
  recoveryMarginPct?: number;
}

/** Every comparison of an earlier study result (`from`) with a later one (`to`), at the later study's α. */
export function compareResults(from: EvaluationResult, to: EvaluationResult, options: CompareOptions = {}): VersionComparison {
  const alpha = to.alpha;
  const marginPct = options.recoveryMarginPct ?? DEFAULT_RECOVERY_EQUIVALENCE_MARGIN_PCT;
  const residualSd =
    from.calibration?.sYX != null && to.calibration?.sYX != null && from.calibration.df !== null && to.calibration.df !== null
      ? compareVariances({ sd: from.calibration.sYX, df: from.calibration.df }, { sd: to.calibration.sYX, df: to.calibration.df }, alpha)
      : unavailable('a calibration with a residual scatter is missing from one of the studies');
  return {
    alpha,
    recoveryMarginPct: marginPct,
    slope: compareLines(from, to, 'slope', alpha),
    intercept: compareLines(from, to, 'intercept', alpha),
    residualSd,
    repeatability: comparePrecision(from.precision, to.precision, 'repeatability', alpha),
    intermediatePrecision: comparePrecision(from.precision, to.precision, 'intermediate', alpha),
    recovery: compareRecovery(from, to, marginPct, alpha),
    detection: compareDetection(from, to),
    range: compareRange(from, to),
    figures: figureComparisons(from, to),
  };
}
