import type { CalibrationModel, Units, Weighting } from '../study.js';
import type { RunReviewStatus, RunStatus } from '../run-status.js';
import type { KeysetPage, UserRef } from './common.js';
import type { MethodVersionStatus } from './methods.js';
import type { DetectionApproach, EvaluationResult, UnknownResult } from '../result.js';
import type { UncertaintyResult } from '../uncertainty-types.js';
import type { RoutineUncertainty } from '../engine/routine-uncertainty.js';

export type { RoutineUncertainty };

/** The expanded uncertainty a routine result carries, and where it comes from in words. */
export interface RunResultUncertainty {
  /** Null when the validation states no uncertainty or the result is not a number to report (e.g. below the LOQ). */
  value: RoutineUncertainty | null;
  /** The basis in words, shown on screen, on the run sheet, in the report and in exports. */
  basis: string;
}

/** The answer of POST /api/reports/verify for a signed results report of a routine run. */
export interface RunReportVerificationDto {
  valid: true;
  kind: 'results-report';
  reportId: string;
  runId: string;
  runTitle: string;
  methodName: string;
  methodVersion: number;
  signedAt: string;
  sha256: string;
}

/** A method blank in a run: its reading must stay below the set limit, else below the validation's LOD. */
export interface RunBlankInput {
  id: string;
  y: number[];
  /** Upper limit in the measured solution (concentration unit); absent: the validation's LOD. */
  limit?: number;
}

/** A QC sample of known value in a run: its recovery must fall within the version's window. */
export interface RunQcSampleInput {
  id: string;
  known: number;
  y: number[];
  dilution?: number;
}

export interface RunBlankResult {
  id: string;
  yMean: number;
  /** Concentration read off the run's calibration (measured solution). */
  found: number;
  limit: number;
  limitBasis: 'set' | 'lod';
  pass: boolean;
}

export interface RunQcSampleResult {
  id: string;
  known: number;
  dilution: number;
  yMean: number;
  found: number;
  recoveryPct: number;
  pass: boolean;
}

/** The recovery window QC samples must meet, and where it comes from in words. */
export interface RunQcWindow {
  low: number;
  high: number;
  basis: string;
}

export const QC_SERIES = ['check', 'qc', 'blank', 'slope', 'intercept'] as const;
export type QcSeries = (typeof QC_SERIES)[number];

export const QC_SERIES_LABELS: Record<QcSeries, string> = {
  check: 'Check standard recovery',
  qc: 'QC sample recovery',
  blank: 'Method blank reading',
  slope: 'Calibration slope',
  intercept: 'Calibration intercept',
};

export interface QcBaselineDto {
  methodVersionId: string;
  runIds: string[];
  chosenBy: { id: string; name: string };
  chosenAt: string;
  reason: string;
  lockVersion: number;
}

/** PUT /api/method-versions/:id/qc-baseline: the released runs whose points set the control limits. */
export interface PutQcBaselineRequest {
  runIds: string[];
  reason: string;
  /** The baseline's lock version as loaded; absent when none has been chosen yet. */
  lockVersion?: number;
}

export interface QcTrendPoint {
  runId: string;
  runTitle: string;
  createdAt: string;
  /** The check standard, QC sample or blank the value belongs to; null for slope and intercept. */
  item: string | null;
  value: number;
  /** Part of the baseline that sets the limits (not judged by the rules). */
  baseline: boolean;
  /** Rules that fired at this point, in words. */
  signals: string[];
}

export interface QcTrendSignalDto {
  rule: 'beyondAction' | 'twoOfThreeBeyondWarning' | 'sevenOnOneSide' | 'sixTrending';
  /** The signal in words: the rule, where and which way. */
  message: string;
  runId: string;
  runTitle: string;
  item: string | null;
  createdAt: string;
}

/** GET /api/methods/:id/qc-trends */
export interface QcTrendsDto {
  methodId: string;
  methodName: string;
  methodVersionId: string;
  versionNumber: number;
  series: QcSeries;
  seriesLabel: string;
  unit: string;
  baseline: QcBaselineDto | null;
  limits: { n: number; mean: number; sd: number; warning: [number, number]; action: [number, number] } | null;
  points: QcTrendPoint[];
  signals: QcTrendSignalDto[];
  /** Why there are no limits, in words; null when there are. */
  message: string | null;
}

/** The run fields an instrument export's columns are mapped to. */
export const IMPORT_MAPPING_FIELDS = ['sampleId', 'sampleType', 'response', 'replicate', 'dilution', 'concentration'] as const;
export type ImportMappingField = (typeof IMPORT_MAPPING_FIELDS)[number];

export const IMPORT_MAPPING_LABELS: Record<ImportMappingField, string> = {
  sampleId: 'Sample name',
  sampleType: 'Sample type',
  response: 'Response',
  replicate: 'Replicate',
  dilution: 'Dilution factor',
  concentration: 'Concentration (standards, checks and QC samples)',
};

/** Column header per field; replicate, dilution and concentration may be left unmapped (null). */
export interface ImportMappingColumns {
  sampleId: string;
  sampleType: string;
  response: string;
  replicate: string | null;
  dilution: string | null;
  concentration: string | null;
}

/** GET /api/method-versions/:id/import-mapping */
export interface ImportMappingDto {
  methodVersionId: string;
  /** Null until a mapping has been saved for the version. */
  columns: ImportMappingColumns | null;
  /** 0 while none is saved. */
  lockVersion: number;
  updatedBy: string | null;
  updatedAt: string | null;
}

/** PUT /api/method-versions/:id/import-mapping */
export interface PutImportMappingRequest {
  columns: ImportMappingColumns;
  /** The lock version as loaded (0 for the first mapping). */
  lockVersion: number;
}

/** The measurements of an instrument export, in the shape a new run takes. */
export interface InstrumentImportData {
  standards: { x: number; y: number }[];
  checks: { id: string; nominal: number; y: number[] }[];
  unknowns: { id: string; y: number[]; dilution?: number }[];
  blanks: RunBlankInput[];
  qcSamples: RunQcSampleInput[];
}

/** POST /api/method-versions/:id/instrument-import */
export type InstrumentImportResult =
  | { status: 'needs-mapping'; columns: string[]; preview: (string | number | null)[][] }
  | { status: 'parsed'; columns: string[]; data: InstrumentImportData; rows: number };

/** A routine run's calculation, as the server stores and answers it. */
export const RUN_MODELS = ['one-point', 'two-point', 'linear', 'quadratic'] as const;

export type RunModel = (typeof RUN_MODELS)[number];

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

/** The method version settings a run's calculation depends on. */
export interface RunSettings {
  checkTolerancePct: number;
  onePointMaxInterceptPct: number;
}

/** The keys a run's data may have. */
export const RUN_DATA_KEYS = ['model', 'weighting', 'twoPoint', 'standards', 'checks', 'unknowns', 'blanks', 'qcSamples'] as const;

/** A run's measurements and calibration choice, as the API takes them. */
export type RunData = {
  model: RunModel;
  weighting?: Weighting;
  twoPoint?: { bracketing: boolean };
  standards: { x: number; y: number; sd?: number; excluded?: { reason: string } }[];
  checks: { id: string; nominal: number; y: number[] }[];
  unknowns: { id: string; y: number[]; dilution?: number }[];
  blanks?: RunBlankInput[];
  qcSamples?: RunQcSampleInput[];
};

/** The run data as calculated and stored: as given, with the units, weighting and confidence level the calculation used. */
export type RunRecordedData = RunData & { units: Units; weighting: Weighting; confidence: number };

/** POST /api/runs and POST /api/runs/preview */
export interface CreateRunRequest {
  methodVersionId: string;
  title: string;
  data: RunData;
  /** The method version's lock version as loaded; a changed version answers 409. */
  methodVersionLockVersion?: number;
}

/** The calculation of a run: what POST /api/runs/preview answers and the browser's preview shows. */
export interface RunPreviewDto {
  status: RunStatus;
  result: RunResult;
  rejectionReasons: string[];
  data: RunRecordedData;
}

/** The method a run belongs to. */
export interface RunMethodDto {
  id: string;
  name: string;
  analyte: string;
  matrix: string;
  xUnit: string;
  yUnit: string;
}

/** GET /api/method-versions/:id/run-options: what a run on the version may do, and what its calculation needs. */
export interface RunOptionsDto {
  methodVersionId: string;
  lockVersion: number;
  versionNumber: number;
  status: MethodVersionStatus;
  method: RunMethodDto;
  /** False when no run may be made on the version; `reason` says why. */
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
  qcWindow: RunQcWindow;
}

/** GET /api/runs/method-choices */
export interface RunMethodChoiceDto extends RunMethodDto {
  versions: { id: string; number: number; status: MethodVersionStatus; usable: boolean; reason: string | null }[];
}

/** GET /api/runs/:id */
export interface RunDto extends RunPreviewDto {
  id: string;
  methodVersionId: string;
  versionNumber: number;
  method: RunMethodDto;
  title: string;
  model: RunModel;
  engineVersion: string;
  dataHash: string;
  author: UserRef;
  createdAt: string;
}

export interface RunSummaryDto {
  id: string;
  title: string;
  status: RunStatus;
  reviewStatus: RunReviewStatus;
  model: RunModel;
  methodVersionId: string;
  versionNumber: number;
  method: Pick<RunMethodDto, 'id' | 'name' | 'analyte'>;
  author: UserRef;
  createdAt: string;
  slope: number | null;
  unknownCount: number;
  checkCount: number;
}

/** GET /api/runs: newest first, paged by cursor. */
export type RunPageDto = KeysetPage<RunSummaryDto>;

export type SlopeControlFlag = 'beyondWarning' | 'beyondAction' | 'sevenOnOneSide';

export interface SlopeControlPointInput {
  runId: string;
  title: string;
  createdAt: string;
  model: RunModel;
  slope: number;
}

export interface SlopeControlPoint extends SlopeControlPointInput {
  flags: SlopeControlFlag[];
}

/** The Shewhart chart of the calibration slope of a version's accepted runs. */
export interface SlopeControlChart {
  points: SlopeControlPoint[];
  mean: number | null;
  sd: number | null;
  limits: { warning: [number, number]; action: [number, number] } | null;
  n: number;
  /** Why there are no limits, or which drift signals were found. */
  message: string | null;
}

/** GET /api/method-versions/:id/control-chart */
export interface RunControlChartDto extends SlopeControlChart {
  methodVersionId: string;
  slopeUnit: string;
}
