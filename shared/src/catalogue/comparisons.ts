import type { ComparisonVerdict } from '../comparison-types.js';
import type { DetectionApproach } from '../result.js';

/** The outcome of a comparison of two method versions, in the words people read. */
export const COMPARISON_VERDICT_LABELS: Record<ComparisonVerdict, string> = {
  'no-difference': 'no significant difference',
  different: 'significantly different',
  equivalent: 'equivalent within the margin',
  inconclusive: 'inconclusive',
};

export const comparisonVerdictLabel = (verdict: ComparisonVerdict) => COMPARISON_VERDICT_LABELS[verdict];

/** The tests of a version comparison, by the key the comparison result uses. */
export const COMPARISON_TEST_LABELS = {
  slope: 'Slope (sensitivity)',
  intercept: 'Intercept',
  residualSd: 'Residual standard deviation s(y/x)',
  repeatability: 'Repeatability standard deviation',
  intermediatePrecision: 'Intermediate precision standard deviation',
  recoveryWelch: 'Mean recovery, difference (Welch t test)',
  recoveryTost: 'Mean recovery, equivalence (two one-sided tests)',
  recovery: 'Mean recovery',
} as const;

export type ComparisonTestKey = keyof typeof COMPARISON_TEST_LABELS;

export const DETECTION_APPROACH_LABELS: Record<DetectionApproach, string> = {
  sdResidual: 'From the residual SD',
  sdIntercept: 'From the SD of the intercept',
  blankSd: 'From the blank SD',
  iso11843: 'ISO 11843-2',
  hubauxVos: 'Hubaux–Vos',
  epaMdl: 'Method detection limit (40 CFR 136)',
};

/** Trend figures of a method over its versions. */
export const TREND_FIGURE_LABELS = {
  slope: 'Slope',
  loq: 'LOQ',
  rsdR: 'Repeatability RSD',
  rsdI: 'Intermediate precision RSD',
  meanRecovery: 'Mean recovery',
} as const;

export const METHOD_VERSION_STATUS_LABELS = { draft: 'Draft', active: 'Active', retired: 'Retired' } as const;

export const CALIBRATION_MODEL_LABELS = {
  linear: 'Straight line',
  'linear-through-origin': 'Straight line through the origin',
  quadratic: 'Quadratic',
  'one-point': 'One-point',
  'two-point': 'Two-point',
} as const;

export const WEIGHTING_LABELS = { none: 'None', '1/x': '1/x', '1/x2': '1/x²', '1/s2': '1/s²' } as const;

/** Aspects of two method versions set side by side. */
export const VERSION_ASPECT_LABELS = {
  status: 'Status',
  changeKind: 'Kind of change',
  changeSummary: 'Change recorded with the version',
  revalidationScope: 'Shown again after the change',
  study: 'Study compared',
  instrument: 'Instrument',
  model: 'Calibration model',
  weighting: 'Weighting',
  requiresQualityRelease: 'Release by a quality manager',
  checkTolerancePct: 'Check standards recover within',
  onePointMaxInterceptPct: 'Largest intercept for one-point calibration',
  recoveryEquivalenceMarginPct: 'Equivalence margin of the mean recovery',
  criterion: 'Acceptance criterion',
} as const;
