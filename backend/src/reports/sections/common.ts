import type { CalibrationModel, EvaluationResult, Weighting } from '@meritline/shared';
import { colors, sizes, type PdfComposer } from '../pdf/index.js';
import type { ReportContent } from '../report-content.js';

export const MODEL_WORDS: Record<CalibrationModel, string> = {
  linear: 'straight line',
  'linear-through-origin': 'straight line through the origin',
  quadratic: 'second-degree polynomial (quadratic)',
  'one-point': 'single-point calibration',
  'two-point': 'two-point calibration',
};

export const WEIGHTING_WORDS: Record<Weighting, string> = {
  none: 'unweighted',
  '1/x': 'weighted 1/x',
  '1/x2': 'weighted 1/x²',
  '1/s2': 'weighted 1/s² (inverse variance of the replicates)',
};

export function xUnit(content: ReportContent): string {
  return content.study.result?.units.x ?? content.study.data.units?.x ?? content.method.xUnit;
}

export function yUnit(content: ReportContent): string {
  return content.study.result?.units.y ?? content.study.data.units?.y ?? content.method.yUnit;
}

export function confidenceWords(result: EvaluationResult): string {
  return `${Number((result.confidence * 100).toFixed(1))} %`;
}

/** The engine's own words for why a section has no numbers. */
export function notEvaluated(pdf: PdfComposer, result: EvaluationResult | null, sections: string[]): void {
  if (!result) {
    pdf.paragraph('Not evaluated: the study data cannot be evaluated yet (the reasons are listed in the summary).', {
      color: colors.muted,
    });
    return;
  }
  const reasons = result.warnings.filter((w) => sections.includes(w.section)).map((w) => w.message);
  const text = reasons.length
    ? `Not evaluated: ${[...new Set(reasons)].join('; ')}.`
    : 'Not evaluated: the study has no inputs for this part.';
  pdf.paragraph(text, { color: colors.muted });
}

/** Engine warnings for a section, printed under its figures. */
export function sectionWarnings(pdf: PdfComposer, result: EvaluationResult, sections: string[]): void {
  const warnings = result.warnings.filter((w) => sections.includes(w.section) && w.code !== 'no_inputs');
  if (warnings.length)
    pdf.paragraph(`Engine notes: ${[...new Set(warnings.map((w) => w.message))].join('; ')}.`, { size: sizes.small, color: colors.muted });
}

export function plural(count: number, one: string, many = `${one}s`): string {
  return `${count} ${count === 1 ? one : many}`;
}
