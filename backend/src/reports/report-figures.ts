import { figureUnit, findFigure, type CriterionOp, type DetectionApproach, type Units } from '@meritline/shared';
import { formatFixed, formatNumber, formatPercentValue, formatPValue } from './pdf/index.js';

export const APPROACH_LABELS: Record<DetectionApproach, string> = {
  sdResidual: 'Residual SD of the calibration, ICH Q2(R2)',
  sdIntercept: 'SD of the intercept, ICH Q2(R2)',
  blankSd: 'SD of blank responses, ICH Q2(R2)',
  iso11843: 'Critical and minimum detectable values, ISO 11843-2',
  hubauxVos: 'Prediction-band limits, Hubaux and Vos 1970',
  epaMdl: 'Method detection limit, 40 CFR 136 App. B',
};

const NAMED: Record<string, string> = {
  'calibration.r': 'Correlation coefficient r',
  'calibration.r2': 'Coefficient of determination R²',
  'calibration.adjR2': 'Adjusted R²',
  'calibration.slope': 'Slope',
  'calibration.intercept': 'Intercept',
  'calibration.curvature': 'Curvature (x² coefficient)',
  'calibration.sYX': 'Residual standard deviation s(y/x)',
  'calibration.seSlope': 'Standard error of the slope',
  'calibration.seIntercept': 'Standard error of the intercept',
  'calibration.n': 'Standards in the fit',
  'lackOfFit.F': 'Lack-of-fit F',
  'lackOfFit.p': 'Lack-of-fit p-value',
  'mandel.F': 'Mandel F',
  'mandel.p': 'Mandel p-value',
  'interceptTest.p': 'Intercept test p-value',
  'interceptTest.interceptPctOfTopResponse': 'Intercept as % of the top response',
  'homoscedasticity.p': 'Variance test p-value',
  'recovery.overall.meanPct': 'Mean recovery, all levels',
  'recovery.overall.rsdPct': 'Recovery RSD, all levels',
  'recovery.overall.sdPct': 'Recovery SD, all levels',
  'precision.rsdR': 'Repeatability RSD',
  'precision.rsdI': 'Intermediate precision RSD',
  'precision.sR': 'Repeatability SD',
  'precision.sI': 'Intermediate precision SD',
  'precision.sBetween': 'Between-series SD',
  'precision.horwitz.horRat': 'HorRat (intermediate precision)',
  'precision.horwitz.horRatRepeatability': 'HorRat (repeatability)',
  'range.rePct': 'Back-calculated standards: %RE at each level',
  'range.rsdPct': 'Back-calculated standards: RSD at each level',
  'range.recoveryPct': 'Mean recovery at each level',
};

const DETECTION_KEYS: Record<string, string> = {
  lod: 'LOD',
  loq: 'LOQ',
  criticalX: 'Critical value',
  detectableX: 'Minimum detectable value',
  criticalResponse: 'Critical response',
  mdl: 'MDL',
  mdlSpiked: 'MDL from spiked samples',
  mdlBlank: 'MDL from method blanks',
  responseLodX: 'LOD from mean blank + 3 SD',
  responseLoqX: 'LOQ from mean blank + 10 SD',
};

const X_UNIT_DETECTION = new Set([
  'lod',
  'loq',
  'criticalX',
  'detectableX',
  'mdl',
  'mdlSpiked',
  'mdlBlank',
  'responseLodX',
  'responseLoqX',
]);

export type FigureKind = 'percent' | 'p' | 'correlation' | 'plain';

export interface FigureDescription {
  label: string;
  unit: string | null;
  kind: FigureKind;
}

/** A result path such as `detection.blankSd.lod` in words, with its unit. */
export function describeFigure(figure: string, units: Units): FigureDescription {
  const path = figure.replace(/\[(\w+)\]/g, '.$1');
  const parts = path.split('.');
  const catalogued = ['accuracyProfile', 'trueness', 'uncertainty'].includes(parts[0]) ? findFigure(path) : undefined;
  if (catalogued)
    return { label: catalogued.label, unit: figureUnit(path, units) ?? null, kind: catalogued.unit === 'percent' ? 'percent' : 'plain' };
  const leaf = parts.at(-1) ?? path;
  const kind: FigureKind = /Pct$|^rsd/.test(leaf)
    ? 'percent'
    : leaf === 'p'
      ? 'p'
      : ['r', 'r2', 'adjR2'].includes(leaf)
        ? 'correlation'
        : 'plain';
  const unitFor = (): string | null => {
    if (kind === 'percent') return '%';
    if (parts[0] === 'detection')
      return X_UNIT_DETECTION.has(leaf) ? (units.x ?? null) : leaf === 'criticalResponse' ? (units.y ?? null) : null;
    if (path === 'calibration.slope' || path === 'calibration.seSlope') return units.x && units.y ? `${units.y} per ${units.x}` : null;
    if (['calibration.intercept', 'calibration.seIntercept', 'calibration.sYX'].includes(path)) return units.y ?? null;
    if (parts[0] === 'precision' && ['sR', 'sI', 'sBetween', 'grandMean'].includes(leaf)) return units.x ?? null;
    if (parts[0] === 'unknowns' && leaf === 'x0') return units.x ?? null;
    return null;
  };
  let label = NAMED[path];
  if (!label && parts[0] === 'detection' && parts.length === 3) {
    label = `${DETECTION_KEYS[leaf] ?? leaf} (${APPROACH_LABELS[parts[1] as DetectionApproach] ?? parts[1]})`;
  } else if (!label && parts[0] === 'recovery' && parts[1] === 'byLevel') {
    label = `${NAMED[`recovery.overall.${leaf}`]?.replace(', all levels', '') ?? leaf}, level ${parts[2]}`;
  } else if (!label) {
    label = figure;
  }
  return { label, unit: unitFor(), kind };
}

export function formatFigure(value: number | null, kind: FigureKind, digits?: number): string {
  switch (kind) {
    case 'percent':
      return digits ? formatNumber(value, digits) : formatPercentValue(value);
    case 'p':
      return formatPValue(value);
    case 'correlation':
      return formatFixed(value, digits ? digits - 1 : 5);
    default:
      return formatNumber(value, digits ?? 4);
  }
}

export function holds(value: number, op: CriterionOp, threshold: number | [number, number]): boolean {
  const [lo, hi] = Array.isArray(threshold) ? threshold : [threshold, threshold];
  switch (op) {
    case 'between':
      return value >= lo && value <= hi;
    case '>=':
      return value >= lo;
    case '<=':
      return value <= lo;
    case '>':
      return value > lo;
    case '<':
      return value < lo;
    case 'abs<=':
      return Math.abs(value) <= lo;
  }
}

/**
 * The value with enough digits that the printed number agrees with the outcome: a reader never
 * sees 0.99500 reported as failing "at least 0.995".
 */
export function formatAgainstCriterion(
  value: number | null,
  kind: FigureKind,
  op: CriterionOp,
  threshold: number | [number, number],
  pass: boolean,
): string {
  if (value === null || kind === 'p') return formatFigure(value, kind);
  for (let digits = kind === 'correlation' ? 6 : kind === 'percent' ? 3 : 4; digits <= 12; digits++) {
    const text = formatFigure(value, kind, digits);
    if (holds(Number(text), op, threshold) === pass) return text;
  }
  return String(value);
}

export function criterionInWords(op: string, threshold: number | [number, number], unit: string | null): string {
  const u = unit ? (unit === '%' ? ' %' : ` ${unit}`) : '';
  if (Array.isArray(threshold)) return `between ${threshold[0]} and ${threshold[1]}${u}`;
  switch (op) {
    case '>=':
      return `at least ${threshold}${u}`;
    case '>':
      return `more than ${threshold}${u}`;
    case '<=':
      return `at most ${threshold}${u}`;
    case '<':
      return `less than ${threshold}${u}`;
    case 'abs<=':
      return `within ±${threshold}${u} of zero`;
    default:
      return `${op} ${threshold}${u}`;
  }
}
