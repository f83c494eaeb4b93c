export * from './roles.js';
export * from './api/index.js';
export * from './api/audit.js';
export * from './api/qualification.js';
export * from './api/overview.js';
export * from './run-status.js';
export * from './method-change.js';
export * from './catalogue/index.js';
export * from './password-policy.js';
export { withVersionOptions, DEFAULT_ACCURACY_BETA, DEFAULT_ACCURACY_LAMBDA_PCT, DEFAULT_COVERAGE_FACTOR } from './version-options.js';
export { ENGINE_VERSION } from './version.js';
export { parseStudy } from './validate.js';
export { evaluateStudy } from './evaluate.js';
export { StudyValidationError, type StudyFieldError } from './errors.js';
export { canonicalJson } from './canonical.js';
export { parseStandardsCsv } from './csv.js';
export { fitCalibration, bandAt, BAND_POINTS, type CalibrationFit, type FitOptions, type FitPoint } from './engine/calibration.js';
export { predictUnknown, type Prediction } from './engine/inverse.js';
export { horwitzRsd } from './engine/precision.js';
export type * from './uncertainty-types.js';
export { preparationUncertainty, preparationErrors, toleranceToStandard } from './engine/preparation.js';
export {
  topDownUncertainty,
  biasUncertainty,
  crmBiasUncertainty,
  combineTopDown,
  rmsBias,
  truenessVersusReference,
} from './engine/uncertainty.js';
export { accuracyProfile, accuracyProfileErrors, betaExpectationInterval, type ToleranceInterval } from './engine/accuracy-profile.js';
export { grubbsCritical, cochranCritical, grubbsStatistic, dixonStatistic, DIXON_R10_95 } from './engine/outliers.js';
export { figureValue } from './engine/criteria.js';
export {
  studentQuantile,
  studentCdf,
  studentTwoSidedP,
  fQuantile,
  fCdf,
  fUpper,
  noncentralTCdf,
  detectionDelta,
  normalQuantile,
} from './engine/distributions.js';
export * from './study.js';
export type * from './result.js';
export type * from './comparison-types.js';
export {
  compareResults,
  figureComparisons,
  compareLineParameter,
  compareVariances,
  welchTest,
  equivalenceTest,
  intermediatePrecisionDf,
  type CompareOptions,
  type SampleSummary,
  type LineSummary,
} from './engine/compare.js';
export type * from './api/comparisons.js';
export * from './api/reference-materials.js';
export * from './api/preparations.js';
export { routineUncertainty } from './engine/routine-uncertainty.js';
export type * from './api/runs.js';
export { QC_SERIES, QC_SERIES_LABELS, IMPORT_MAPPING_FIELDS, IMPORT_MAPPING_LABELS, RUN_MODELS, RUN_DATA_KEYS } from './api/runs.js';
export * from './runs/index.js';
export {
  controlLimits,
  controlSignals,
  CONTROL_RULE_LABELS,
  MIN_BASELINE_POINTS,
  type ControlLimits,
  type ControlRule,
  type ControlSignal,
} from './engine/control-rules.js';
export * from './qualification/index.js';
