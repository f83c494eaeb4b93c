export { CalibrationPlot, calibrationFigure, type CalibrationPlotProps } from './calibration-plot';
export { ResidualPlot } from './residual-plot';
export { preloadPlotly } from './lazy-plot';
export { StudyFigures } from './study-figures';
export { AccuracyProfilePlot, truenessSentence, validityWords } from './accuracy-profile';
export { UncertaintyTables } from './uncertainty-tables';
export { StudyFlags, studyFlags, type StudyFlag } from './study-flags';
export { VerdictSummary, verdictHeadline } from './verdict-summary';
export { CriterionMark } from './criterion-mark';
export { judgeCriteria, type JudgedCriterion } from './judge-criteria';
export {
  criterionName,
  describeRequirement,
  FIGURE_LABELS,
  figureLabel,
  figureUnit,
  formatNumber,
  formatP,
  formatPercent,
  MODEL_LABELS,
  WEIGHTING_LABELS,
} from './format';
export type { CriterionDefinition, StudyResultsProps, StudyUnits } from './types';
export { plainWarning } from './figure-section';
