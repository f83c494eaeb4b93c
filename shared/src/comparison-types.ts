import type { CriterionOutcome, DetectionApproach, Interval } from './result.js';

/** The outcome of a comparison in one word; the catalogue holds the words people read. */
export type ComparisonVerdict = 'no-difference' | 'different' | 'equivalent' | 'inconclusive';

/** A test that could not be made, and why. */
export interface Unavailable {
  available: false;
  reason: string;
}

/** A two-sided t test of a difference, with the interval of the difference at 1 − α. */
export interface TTestOutcome {
  se: number;
  t: number;
  df: number;
  p: number;
  ci: Interval;
  alpha: number;
  verdict: ComparisonVerdict;
}

export interface LineParameterComparison extends TTestOutcome {
  available: true;
  parameter: 'slope' | 'intercept';
  from: number;
  to: number;
  /** to − from. */
  difference: number;
  /** Slope only: 100 (to − from) / |from|, the change in sensitivity. */
  changePct: number | null;
  pooledSd: number;
}

export interface VarianceComparison {
  available: true;
  /** Standard deviations. */
  from: number;
  to: number;
  /** s_to² / s_from². */
  F: number;
  /** Numerator (later) and denominator (earlier) degrees of freedom. */
  df: [number, number];
  /** How the degrees of freedom were obtained, where not plain. */
  dfNote: string | null;
  p: number;
  /** Interval of σ_to² / σ_from² at 1 − α. */
  ratioCi: Interval;
  alpha: number;
  verdict: ComparisonVerdict;
}

export interface MeanComparison extends TTestOutcome {
  available: true;
  from: number;
  to: number;
  difference: number;
}

export interface EquivalenceTest {
  available: true;
  margin: number;
  difference: number;
  se: number;
  df: number;
  pooled: boolean;
  tLower: number;
  pLower: number;
  tUpper: number;
  pUpper: number;
  /** The larger one-sided p. */
  p: number;
  /** Interval of the difference at 1 − 2α. */
  ci: Interval;
  alpha: number;
  verdict: ComparisonVerdict;
}

export interface RecoveryComparison {
  welch: MeanComparison | Unavailable;
  tost: EquivalenceTest | Unavailable;
  verdict: ComparisonVerdict;
}

export interface DetectionComparison {
  approach: DetectionApproach;
  lodFrom: number | null;
  lodTo: number | null;
  /** to / from. */
  lodRatio: number | null;
  loqFrom: number | null;
  loqTo: number | null;
  loqRatio: number | null;
  /** Whether the study's LOQ criterion for this approach holds; null without one. */
  loqCriterionFrom: boolean | null;
  loqCriterionTo: boolean | null;
}

export interface RangeComparison {
  available: true;
  from: { low: number; high: number };
  to: { low: number; high: number };
  levelsGained: number[];
  levelsLost: number[];
}

export interface FigureComparison {
  figure: string;
  label: string;
  from: number | null;
  to: number | null;
  difference: number | null;
  ratio: number | null;
  criterionFrom: CriterionOutcome | null;
  criterionTo: CriterionOutcome | null;
}

export interface VersionComparison {
  alpha: number;
  /** Equivalence margin of the mean recoveries, percentage points. */
  recoveryMarginPct: number;
  slope: LineParameterComparison | Unavailable;
  intercept: LineParameterComparison | Unavailable;
  residualSd: VarianceComparison | Unavailable;
  repeatability: VarianceComparison | Unavailable;
  intermediatePrecision: VarianceComparison | Unavailable;
  recovery: RecoveryComparison;
  detection: DetectionComparison[];
  range: RangeComparison | Unavailable;
  figures: FigureComparison[];
}
