import type { AccuracyProfileResult, TruenessResult, UncertaintyResult } from './uncertainty-types.js';
import type { CalibrationModel, CandidateWeighting, CriterionOp, Units, Weighting } from './study.js';

export type Interval = [number, number];

export interface BackCalculatedPoint {
  /** Position in the study's `standards` array. */
  index: number;
  x: number;
  y: number;
  xBack: number | null;
  /** Null where x = 0. */
  rePct: number | null;
}

export interface BandPoint {
  x: number;
  fit: number;
  confidenceHalfWidth: number;
  predictionHalfWidth: number;
}

export interface CalibrationLevel {
  x: number;
  n: number;
  yMean: number;
  ySd: number | null;
  xBackMean: number | null;
  /** Mean %RE of the back-calculated standards at this level; null where x = 0. */
  rePct: number | null;
  /** RSD (%) of the back-calculated standards at this level; null with one replicate. */
  rsdPct: number | null;
}

export interface BracketSegment {
  xLow: number;
  xHigh: number;
  slope: number;
  intercept: number;
}

export interface RegressionAnova {
  dfRegression: number;
  ssRegression: number;
  msRegression: number;
  dfResidual: number;
  ssResidual: number;
  msResidual: number;
  F: number | null;
  p: number | null;
}

export interface ExcludedStandard {
  index: number;
  x: number;
  y: number;
  reason: string;
}

export interface CalibrationResult {
  model: CalibrationModel;
  weighting: Weighting;
  n: number;
  df: number | null;
  slope: number;
  intercept: number;
  seSlope: number | null;
  seIntercept: number | null;
  ciSlope: Interval | null;
  ciIntercept: Interval | null;
  /** x² coefficient (quadratic model only, else null). */
  curvature: number | null;
  seCurvature: number | null;
  ciCurvature: Interval | null;
  r: number | null;
  r2: number | null;
  adjR2: number | null;
  sYX: number | null;
  /** Two-sided t((1 + C)/2; df) used for every interval of the fit. */
  t: number | null;
  xMean: number;
  yMean: number;
  sxx: number;
  sumWeights: number;
  xMin: number;
  xMax: number;
  residuals: number[];
  standardizedResiduals: number[] | null;
  backCalculated: BackCalculatedPoint[];
  bands: BandPoint[] | null;
  anova: RegressionAnova | null;
  levels: CalibrationLevel[];
  segments: BracketSegment[] | null;
  excluded: ExcludedStandard[];
}

export interface LackOfFitResult {
  ssPureError: number;
  dfPureError: number;
  ssLackOfFit: number;
  dfLackOfFit: number;
  F: number;
  p: number;
  critical: number;
  significant: boolean;
}

export interface MandelResult {
  F: number;
  p: number;
  df: [number, number];
  sYXLinear: number;
  sYXQuadratic: number;
  /** F(0.99; 1, n − 3), the ISO 8466-1 decision level. */
  critical: number;
  significant: boolean;
}

export interface InterceptTestResult {
  intercept: number;
  seIntercept: number;
  t: number;
  df: number;
  p: number;
  significant: boolean;
  interceptPctOfTopResponse: number;
}

export interface OriginBias {
  id: string;
  x0ThroughOrigin: number;
  x0Regression: number;
  bias: number;
}

export interface ThroughOriginResult {
  slope: number;
  seSlope: number;
  sYX: number;
  r2: number;
  df: number;
  biasAt: OriginBias[];
}

export interface HomoscedasticityResult {
  xLow: number;
  xHigh: number;
  F: number;
  df: [number, number];
  p: number;
  critical: number;
  significant: boolean;
  /** The weighting with the smallest Σ|%RE| when the variance test is significant, else none. */
  recommendedWeighting: CandidateWeighting;
  /** The weighting with the smallest Σ|%RE|, whatever the variance test says. */
  smallestSumAbsRe: CandidateWeighting | null;
  sumAbsRePct: Record<CandidateWeighting, number | null>;
  /** The recommendation in words: what it rests on and how close the candidates were. */
  advice: string;
}

export type UnknownFlag = 'belowRange' | 'aboveRange' | 'belowLod' | 'belowLoq';

export interface UnknownResult {
  id: string;
  m: number;
  yMean: number;
  dilution: number;
  x0: number;
  sX0: number | null;
  ci: Interval | null;
  flags: UnknownFlag[];
}

export interface CheckResult {
  id: string;
  nominal: number;
  found: number;
  recoveryPct: number;
}

export interface LimitPair {
  sigma: number;
  slope: number;
  lod: number;
  loq: number;
}

export interface BlankSdLimits extends LimitPair {
  n: number;
  mean: number;
  responseLod: number;
  responseLoq: number;
  responseLodX: number;
  responseLoqX: number;
}

export interface Iso11843Limits {
  K: number;
  df: number;
  criticalResponse: number;
  criticalX: number;
  detectableX: number;
  delta: number;
}

export interface HubauxVosLimits {
  df: number;
  criticalResponse: number;
  criticalX: number;
  detectableX: number;
}

export interface EpaMdlResult {
  nSpiked: number;
  nBlanks: number;
  mdlSpiked: number | null;
  mdlBlank: number | null;
  /** Which rule of 40 CFR 136 App. B gave mdlBlank. */
  blankRule: 'none-numeric' | 'highest' | 'rank' | 'mean-plus-t-sd' | null;
  mdl: number;
  governing: 'spiked' | 'blank';
}

export type DetectionApproach = 'sdResidual' | 'sdIntercept' | 'blankSd' | 'iso11843' | 'hubauxVos' | 'epaMdl';

export interface DetectionResult {
  sdResidual: LimitPair | null;
  sdIntercept: LimitPair | null;
  blankSd: BlankSdLimits | null;
  iso11843: Iso11843Limits | null;
  hubauxVos: HubauxVosLimits | null;
  epaMdl: EpaMdlResult | null;
  /** The approach the unknowns' belowLod / belowLoq flags were judged against. */
  flagBasis: DetectionApproach | null;
  /** Method blanks the analyst excluded; none of them enters a blank-based figure or outlier test. */
  excludedBlanks: ExcludedRow[];
  /** Low-level spike results the analyst excluded, none of them in the MDL; absent when none is. */
  excludedSpikes?: ExcludedRow[];
  /** Method blanks of the MDL procedure the analyst excluded (value null: no numerical result); absent when none is. */
  excludedMdlBlanks?: ExcludedMdlBlank[];
}

export interface RecoveryItemResult {
  id: string;
  level: string | null;
  pct: number;
}

export interface RecoveryGroup {
  level: string | null;
  n: number;
  meanPct: number;
  sdPct: number | null;
  rsdPct: number | null;
  ci: Interval | null;
  t: number | null;
  df: number | null;
  p: number | null;
  significant: boolean | null;
}

/** A replicate row left out of the figures, with its position in the study section and the reason given. */
export interface ExcludedRow {
  index: number;
  /** The row's sample id (recovery) or series (precision). */
  label: string;
  value: number;
  reason: string;
}

export interface ExcludedMdlBlank extends Omit<ExcludedRow, 'value'> {
  value: number | null;
}

export interface RecoveryResult {
  items: RecoveryItemResult[];
  /** Rows the analyst excluded; none of them enters the items or the means. */
  excluded: ExcludedRow[];
  byLevel: RecoveryGroup[];
  overall: RecoveryGroup;
}

export interface HorwitzResult {
  massFraction: number;
  /** PRSD_R (%) = 2^(1 − 0.5 log10 C), Horwitz 1980; AOAC writes the same curve as 2 C^−0.15. */
  predictedRsd: number;
  horRat: number;
  horRatRepeatability: number;
}

export interface PrecisionSeries {
  group: string;
  n: number;
  mean: number;
  sd: number | null;
}

export interface PrecisionResultSection {
  /** Results the analyst excluded; none of them enters the analysis of variance. */
  excluded: ExcludedRow[];
  k: number;
  N: number;
  grandMean: number;
  series: PrecisionSeries[];
  ssBetween: number | null;
  ssWithin: number;
  dfBetween: number | null;
  dfWithin: number;
  msBetween: number | null;
  msWithin: number;
  n0: number | null;
  sR: number;
  sBetween: number | null;
  sI: number;
  rsdR: number | null;
  rsdI: number | null;
  F: number | null;
  p: number | null;
  horwitz: HorwitzResult | null;
}

export interface OutlierFlag {
  set: string;
  test: 'grubbs' | 'dixon' | 'cochran' | 'standardizedResidual';
  statistic: number;
  critical: number;
  /** Position of the suspect value in the study array the set was drawn from. */
  index: number;
  value: number;
  outlier: boolean;
}

export interface RangeLevel {
  x: number;
  values: Record<string, number | null>;
  pass: boolean;
}

export interface RangeResult {
  basis: 'standards' | 'recovery';
  low: number;
  high: number;
  levels: RangeLevel[];
}

export interface CriterionOutcome {
  figure: string;
  op: CriterionOp;
  threshold: number | [number, number];
  value: number | null;
  pass: boolean;
}

export interface Verdict {
  criteria: CriterionOutcome[];
  /** Null when the study names no criteria. */
  pass: boolean | null;
}

export interface EvaluationWarning {
  section: string;
  code: string;
  message: string;
}

export interface EvaluationResult {
  engineVersion: string;
  model: CalibrationModel;
  weighting: Weighting;
  confidence: number;
  alpha: number;
  units: Units;
  calibration: CalibrationResult | null;
  lackOfFit: LackOfFitResult | null;
  mandel: MandelResult | null;
  interceptTest: InterceptTestResult | null;
  throughOrigin: ThroughOriginResult | null;
  homoscedasticity: HomoscedasticityResult | null;
  unknowns: UnknownResult[] | null;
  checks: CheckResult[] | null;
  detection: DetectionResult | null;
  recovery: RecoveryResult | null;
  precision: PrecisionResultSection | null;
  outliers: OutlierFlag[] | null;
  range: RangeResult | null;
  verdict: Verdict;
  warnings: EvaluationWarning[];
  /** Present only when the study has accuracy, reference-material or uncertainty sections. */
  uncertainty?: UncertaintyResult;
  accuracyProfile?: AccuracyProfileResult;
  trueness?: TruenessResult;
}
