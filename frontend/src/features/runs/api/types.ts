import type {
  KeysetPage,
  MethodVersionStatus,
  ModelChoice,
  OnePointBias,
  RunBlankInput,
  RunCheck,
  RunFlag,
  RunModel,
  RunQcSampleInput,
  RunResult,
  RunReviewStatus,
  RunStatus,
  RunUnknown,
  ValidatedRange,
  ValidationBasis,
  Weighting,
} from '@meritline/shared';

/** The run calculation's shapes are the server's, from the shared contract. */
export type { RunModel, ModelChoice, ValidatedRange, ValidationBasis, RunFlag, RunUnknown, RunCheck, OnePointBias, RunResult };

export interface MethodSummary {
  id: string;
  name: string;
  analyte: string;
  matrix: string;
  xUnit: string;
  yUnit: string;
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

/** Newest first, paged by cursor. */
export type RunPage = KeysetPage<RunSummary>;

export interface RunFilters {
  methodId?: string;
  methodVersionId?: string;
  status?: RunStatus;
  cursor?: string;
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
