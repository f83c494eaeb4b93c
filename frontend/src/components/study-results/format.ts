import {
  formatLevel,
  figureLabel as catalogueFigureLabel,
  figureUnit as catalogueFigureUnit,
  findFigure,
  FIGURES,
  type CriterionOp,
} from '@meritline/shared';
import type { CriterionDefinition } from './types';

const OP_WORDS: Record<Exclude<CriterionOp, 'between'>, string> = {
  '>=': 'at least',
  '<=': 'at most',
  '>': 'above',
  '<': 'below',
  'abs<=': 'within ±',
};

/** "at least 0.995", "from 98 to 102 %", "within ± 2 %". */
export function describeRequirement(op: CriterionOp, threshold: number | [number, number], unit?: string): string {
  const suffix = unit ? ` ${unit}` : '';
  if (op === 'between') {
    const [low, high] = threshold as [number, number];
    return `from ${formatLevel(low)} to ${formatLevel(high)}${suffix}`;
  }
  const words = OP_WORDS[op];
  return `${words} ${formatLevel(threshold as number)}${suffix}`;
}

/** Figures a criterion commonly names, with their words (the catalogue in shared). */
export const FIGURE_LABELS: Record<string, string> = Object.fromEntries(FIGURES.map((figure) => [figure.key, figure.label]));

/** Figures whose values are percentages, for the unit beside the requirement. */
const PERCENT_FIGURE = /Pct|(^|\.)(rsdR|rsdI|predictedRsd)$/;

/** `recovery.byLevel.low.meanPct` → "Mean recovery at level low"; never a code path. */
export const figureLabel = catalogueFigureLabel;

/** Figures in concentration (x) and response (y) units; the rest are ratios, statistics or counts. */
const X_FIGURE =
  /^(detection\.[^.]+\.(lod|loq|mdl|mdlSpiked|mdlBlank|criticalX|detectableX|responseLodX|responseLoqX)|precision\.(sR|sI|sBetween|grandMean)|range\.(low|high)|unknowns\..+\.x0)$/;
const Y_FIGURE = /^(calibration\.(intercept|sYX|seIntercept)|detection\.[^.]+\.(criticalResponse|responseLod|responseLoq))$/;

export function figureUnit(figure: string, units: { x?: string; y?: string } = {}): string | undefined {
  if (findFigure(figure)) return catalogueFigureUnit(figure, units);
  const path = figure.replace(/\[(\w+)\]/g, '.$1');
  if (PERCENT_FIGURE.test(path)) return '%';
  if (X_FIGURE.test(path)) return units.x;
  if (Y_FIGURE.test(path)) return units.y;
  return undefined;
}

export function criterionName(criterion: Pick<CriterionDefinition, 'figure' | 'label'>): string {
  // A known figure is named by the catalogue, so a hand-written label cannot contradict the limit beside it.
  if (findFigure(criterion.figure)) return figureLabel(criterion.figure);
  return criterion.label?.trim() || figureLabel(criterion.figure);
}

/** Criteria name figures as `a.b[2]` or `a.b.2`; both mean the same place. */
export function sameFigure(a: string, b: string): boolean {
  const normalise = (figure: string) => figure.replace(/\[(\w+)\]/g, '.$1');
  return normalise(a) === normalise(b);
}

export const MODEL_LABELS: Record<string, string> = {
  linear: 'Straight line',
  'linear-through-origin': 'Straight line through the origin',
  quadratic: 'Quadratic curve',
  'one-point': 'One point (single standard level)',
  'two-point': 'Two points',
};

export const WEIGHTING_LABELS: Record<string, string> = {
  none: 'None (equal weights)',
  '1/x': '1/x',
  '1/x2': '1/x²',
  '1/s2': '1/s²',
};

export function slopeUnit(units: { x?: string; y?: string }): string | undefined {
  if (!units.x && !units.y) return undefined;
  return `${units.y ?? 'response'} per ${units.x ?? 'unit'}`;
}
