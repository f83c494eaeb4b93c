import type {
  CalibrationModel,
  DetectionApproach,
  EvaluationResult,
  RunBlankResult,
  RunQcSampleResult,
  RunQcWindow,
  RunResultUncertainty,
  RunStatus,
  UncertaintyResult,
  UnknownResult,
  Weighting,
} from '@meritline/shared';

export const RUN_MODELS = ['one-point', 'two-point', 'linear', 'quadratic'] as const;
export type RunModel = (typeof RUN_MODELS)[number];

export const RUN_DATA_KEYS = ['model', 'weighting', 'twoPoint', 'standards', 'checks', 'unknowns', 'blanks', 'qcSamples'] as const;

export interface ModelChoice {
  model: RunModel;
  allowed: boolean;
  /** Why the model is not offered, in words. */
  reason?: string;
  /** The weighting a run must use with this model (the validated one). */
  weighting?: Weighting;
}

export interface ValidatedRange {
  low: number;
  high: number;
  basis: 'range' | 'standards';
}

/** What a run takes from the approved validation study of its method version. */
export interface ValidationBasis {
  studyId: string;
  studyTitle: string;
  approvedAt: string | null;
  model: CalibrationModel;
  weighting: Weighting;
  confidence: number;
  slope: number;
  intercept: number;
  curvature: number | null;
  lod: number | null;
  loq: number | null;
  lodBasis: DetectionApproach | null;
  loqBasis: DetectionApproach | null;
  validatedRange: ValidatedRange | null;
  interceptTest: { intercept: number; p: number; significant: boolean; interceptPctOfTopResponse: number } | null;
  /** The validation's top-down measurement uncertainty; null when the study has none (absent on runs saved before it was carried). */
  uncertainty?: Pick<UncertaintyResult, 'coverageFactor' | 'relativeAbove' | 'absolute' | 'relative'> | null;
}

export interface RunSettings {
  checkTolerancePct: number;
  onePointMaxInterceptPct: number;
}

export type RunFlag = 'belowLod' | 'belowLoq' | 'aboveTopStandard' | 'outsideValidatedRange';

export interface RunUnknown extends Omit<UnknownResult, 'flags'> {
  /** Concentration in the measured solution, before the dilution factor. */
  x0Undiluted: number;
  flags: RunFlag[];
  /** The text to report, e.g. "12.3 ± 0.4 mg/L" or "< 0.50 mg/L". */
  reported: string;
  /** Each flag explained in words. */
  remarks: string[];
  /** Total dilution factor that brings the sample below the top standard (above the top standard only). */
  suggestedDilution: number | null;
  /** False for every result of a rejected run. */
  reportable: boolean;
  /** U (k = 2 unless the validation says otherwise) from the validation, with its basis in words; absent on older runs. */
  uncertainty?: RunResultUncertainty;
}

export interface RunCheck {
  id: string;
  nominal: number;
  yMean: number;
  found: number;
  recoveryPct: number;
  pass: boolean;
}

export interface OnePointBiasItem {
  id: string;
  yMean: number;
  /** Read off the one-point line (× dilution). */
  onePoint: number;
  /** Read off the validation's regression line through today's standard (× dilution). */
  regression: number;
  bias: number;
  biasPct: number | null;
}

export interface OnePointBias {
  /** The validation's straight line, rescaled so it passes through today's one-point standard. */
  referenceLine: { slope: number; intercept: number };
  /** Validation intercept / slope: the concentration the intercept stands for. */
  interceptAsConcentration: number;
  items: OnePointBiasItem[];
}

export interface RunResult extends Omit<EvaluationResult, 'unknowns' | 'checks'> {
  unknowns: RunUnknown[];
  checks: RunCheck[];
  onePointBias: OnePointBias | null;
  acceptance: { tolerancePct: number; low: number; high: number };
  validation: ValidationBasis;
  /** Method blanks and QC samples of known value (absent on runs saved before they existed). */
  blanks?: RunBlankResult[];
  qcSamples?: RunQcSampleResult[];
  qcWindow?: RunQcWindow;
}

export interface RunEvaluation {
  data: Record<string, unknown>;
  status: RunStatus;
  result: RunResult;
  rejectionReasons: string[];
}
