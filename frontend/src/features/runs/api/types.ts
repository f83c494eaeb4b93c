import type {
  CalibrationModel,
  DetectionApproach,
  EvaluationResult,
  MethodVersionStatus,
  RunBlankInput,
  RunBlankResult,
  RunQcSampleInput,
  RunQcSampleResult,
  RunQcWindow,
  RunResultUncertainty,
  RunReviewStatus,
  RunStatus,
  UncertaintyResult,
  UnknownResult,
  Weighting,
} from '@meritline/shared';

export type RunModel = 'one-point' | 'two-point' | 'linear' | 'quadratic';

export interface ModelChoice {
  model: RunModel;
  allowed: boolean;
  reason?: string;
  weighting?: Weighting;
}

export interface MethodSummary {
  id: string;
  name: string;
  analyte: string;
  matrix: string;
  xUnit: string;
  yUnit: string;
}

export interface ValidatedRange {
  low: number;
  high: number;
  basis: 'range' | 'standards';
}

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
  uncertainty?: Pick<UncertaintyResult, 'coverageFactor' | 'relativeAbove' | 'absolute' | 'relative'> | null;
}

export interface RunOptions {
  methodVersionId: string;
  lockVersion: number;
  versionNumber: number;
  status: MethodVersionStatus;
  method: MethodSummary;
  usable: boolean;
  reason: string | null;
  models: ModelChoice[];
  validationStudyId: string | null;
  lod: number | null;
  loq: number | null;
  validatedRange: ValidatedRange | null;
  checkTolerancePct: number;
  onePointMaxInterceptPct: number;
  validation: ValidationBasis | null;
}

export interface MethodChoice extends MethodSummary {
  versions: { id: string; number: number; status: MethodVersionStatus; usable: boolean; reason: string | null }[];
}

export type RunFlag = 'belowLod' | 'belowLoq' | 'aboveTopStandard' | 'outsideValidatedRange';

export interface RunUnknown extends Omit<UnknownResult, 'flags'> {
  x0Undiluted: number;
  flags: RunFlag[];
  reported: string;
  remarks: string[];
  suggestedDilution: number | null;
  reportable: boolean;
  /** Absent on runs calculated before results carried their uncertainty. */
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

export interface OnePointBias {
  referenceLine: { slope: number; intercept: number };
  interceptAsConcentration: number;
  items: { id: string; yMean: number; onePoint: number; regression: number; bias: number; biasPct: number | null }[];
}

export interface RunResult extends Omit<EvaluationResult, 'unknowns' | 'checks'> {
  unknowns: RunUnknown[];
  checks: RunCheck[];
  onePointBias: OnePointBias | null;
  acceptance: { tolerancePct: number; low: number; high: number };
  validation: ValidationBasis;
  blanks?: RunBlankResult[];
  qcSamples?: RunQcSampleResult[];
  qcWindow?: RunQcWindow;
}

export interface RunData {
  model: RunModel;
  weighting?: Weighting;
  twoPoint?: { bracketing: boolean };
  standards: { x: number; y: number; sd?: number; excluded?: { reason: string } }[];
  checks: { id: string; nominal: number; y: number[] }[];
  unknowns: { id: string; y: number[]; dilution?: number }[];
  blanks?: RunBlankInput[];
  qcSamples?: RunQcSampleInput[];
}

export interface RunPreview {
  status: RunStatus;
  result: RunResult;
  rejectionReasons: string[];
  data: RunData & { units: { x?: string; y?: string }; confidence: number };
}

export interface Run extends RunPreview {
  id: string;
  methodVersionId: string;
  versionNumber: number;
  method: MethodSummary;
  title: string;
  model: RunModel;
  engineVersion: string;
  dataHash: string;
  author: { id: string; name: string };
  createdAt: string;
}

export interface RunSummary {
  id: string;
  title: string;
  status: RunStatus;
  reviewStatus: RunReviewStatus;
  model: RunModel;
  methodVersionId: string;
  versionNumber: number;
  method: Pick<MethodSummary, 'id' | 'name' | 'analyte'>;
  author: { id: string; name: string };
  createdAt: string;
  slope: number | null;
  unknownCount: number;
  checkCount: number;
}

export interface RunPage {
  items: RunSummary[];
  total: number;
  page: number;
  pageSize: number;
}

export interface RunFilters {
  methodId?: string;
  methodVersionId?: string;
  status?: RunStatus;
  page?: number;
  pageSize?: number;
}

export type ControlFlag = 'beyondWarning' | 'beyondAction' | 'sevenOnOneSide';

export interface ControlChart {
  methodVersionId: string;
  slopeUnit: string;
  points: { runId: string; title: string; createdAt: string; model: RunModel; slope: number; flags: ControlFlag[] }[];
  mean: number | null;
  sd: number | null;
  limits: { warning: [number, number]; action: [number, number] } | null;
  n: number;
  message: string | null;
}

export interface CreateRunInput {
  methodVersionId: string;
  title: string;
  data: RunData;
  methodVersionLockVersion?: number;
}
