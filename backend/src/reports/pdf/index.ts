export { createPdfComposer, PdfComposer, type CalloutTone, type PdfComposerOptions, type TextStyle } from './pdf-composer.js';
export type { TableColumn, TableRow, TableSpec } from './table.js';
export type { PlotAxis, PlotLayer, PlotPoint, PlotSpec } from './plot.js';
export { niceTicks, type AxisTicks } from './ticks.js';
// Reports format numbers by the same rules as the screens.
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
  formatPercentValue,
  formatPValue,
  pText,
  NOT_AVAILABLE,
  withUnit,
} from '@meritline/shared';
export { colors, sizes } from './theme.js';
