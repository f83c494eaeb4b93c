export { createPdfComposer, PdfComposer, type CalloutTone, type PdfComposerOptions, type TextStyle } from './pdf-composer.js';
export type { TableColumn, TableRow, TableSpec } from './table.js';
export type { PlotAxis, PlotLayer, PlotPoint, PlotSpec } from './plot.js';
export { niceTicks, type AxisTicks } from './ticks.js';
export {
  formatDate,
  formatDateTime,
  formatEstimate,
  formatFixed,
  formatInteger,
  formatInterval,
  formatLevel,
  formatNumber,
  formatPercent,
  formatPValue,
  pText,
  NOT_AVAILABLE,
  withUnit,
} from './format.js';
export { colors, sizes } from './theme.js';
