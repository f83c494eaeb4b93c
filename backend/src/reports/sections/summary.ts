import { type CriterionOp, criterionOutcomeLabel, type EvaluationResult } from '@meritline/shared';
import { formatNumber, formatLevel, formatPercent, NOT_AVAILABLE, withUnit, type PdfComposer } from '../pdf/index.js';
import type { ReportContent } from '../report-content.js';
import { APPROACH_LABELS, criterionInWords, describeFigure, formatAgainstCriterion } from '../report-figures.js';
import { MODEL_WORDS, WEIGHTING_WORDS, xUnit } from './common.js';
import { reportedLimits } from './detection.js';
import { numbered } from './numbering.js';

function conclusion(result: EvaluationResult | null): string {
  if (!result) return 'The study could not be evaluated, so no verdict is given.';
  const { criteria, pass } = result.verdict;
  if (pass === null) return 'The method version names no acceptance criteria: the figures in this report carry no verdict.';
  if (pass) return `Verdict: Pass. Every one of the ${criteria.length} acceptance criteria of the method version is met.`;
  const failed = criteria.filter((c) => !c.pass).length;
  return `Verdict: Fail. ${failed} of the ${criteria.length} acceptance criteria of the method version are not met.`;
}

export function summarySection(pdf: PdfComposer, content: ReportContent): void {
  const result = content.study.result;
  const units = { x: xUnit(content), y: content.study.data.units?.y ?? content.method.yUnit };
  pdf.heading(numbered('summary', 'Summary'));

  if (result && result.verdict.criteria.length) {
    pdf.table({
      caption: 'Acceptance criteria',
      columns: [
        { header: 'Figure', width: 3.2 },
        { header: 'Result', width: 1.6, align: 'right' },
        { header: 'Required', width: 2.2 },
        { header: 'Outcome', width: 1, align: 'center' },
      ],
      rows: result.verdict.criteria.map((c) => {
        const described = describeFigure(c.figure, units);
        // The lab's own label often repeats the threshold, which has its own column; it names figures we have no words for.
        const label =
          described.label !== c.figure
            ? described.label
            : (content.version.criteria.find((v) => v.figure === c.figure && v.op === c.op)?.label ?? c.figure);
        const value = formatAgainstCriterion(c.value, described.kind, c.op as CriterionOp, c.threshold, c.pass);
        return {
          cells: [
            label,
            c.value === null ? 'not computed' : withUnit(value, described.unit),
            criterionInWords(c.op, c.threshold, described.unit),
            criterionOutcomeLabel(c.pass),
          ],
          bold: !c.pass,
        };
      }),
      note: 'A criterion whose figure could not be computed counts as not met. Per-level criteria report the level closest to failing.',
    });
  }

  pdf.heading('Conclusion', 3);
  pdf.paragraph(conclusion(result));
  if (!result && content.study.resultErrors?.length) {
    pdf.bullets(
      content.study.resultErrors.map((e) => `${e.field}: ${e.message}`),
      { size: 8.5 },
    );
  }
  if (content.study.meta.conclusion) pdf.paragraph(`Conclusion stated in the study: ${content.study.meta.conclusion}`);
  pdf.space(4);

  if (!result) return;
  const limits = reportedLimits(result);
  const calibration = result.calibration;
  pdf.heading('Key figures', 3);
  pdf.keyValues(
    [
      [
        'Calibration',
        calibration
          ? `${MODEL_WORDS[result.model]}, ${WEIGHTING_WORDS[result.weighting]}; ${calibration.n} standards from ${formatLevel(calibration.xMin)} to ${formatLevel(calibration.xMax)} ${units.x}`
          : NOT_AVAILABLE,
      ],
      ['R²', calibration?.r2 == null ? NOT_AVAILABLE : formatNumber(calibration.r2, 5)],
      ['Working range', result.range ? `${formatLevel(result.range.low)} to ${formatLevel(result.range.high)} ${units.x}` : NOT_AVAILABLE],
      ['Reported LOD', limits ? withUnit(formatNumber(limits.lod, 3), units.x) : NOT_AVAILABLE],
      ['Reported LOQ', limits?.loq == null ? NOT_AVAILABLE : withUnit(formatNumber(limits.loq, 3), units.x)],
      ['Limits from', limits ? APPROACH_LABELS[limits.approach] : NOT_AVAILABLE],
      [
        'Mean recovery',
        result.recovery ? `${formatPercent(result.recovery.overall.meanPct)} (n = ${result.recovery.overall.n})` : NOT_AVAILABLE,
      ],
      ['Repeatability RSD', formatPercent(result.precision?.rsdR)],
      ['Intermediate precision RSD', formatPercent(result.precision?.rsdI)],
      ...accuracyFigures(result, units.x),
    ],
    { labelWidth: 150 },
  );
}

/** Only for studies with an accuracy design, reference material or uncertainty options. */
function accuracyFigures(result: EvaluationResult, x: string): [string, string][] {
  const rows: [string, string][] = [];
  const p = result.accuracyProfile;
  if (p)
    rows.push([
      'Accuracy profile',
      p.validFrom === null || p.validTo === null
        ? `no validity domain at ±${formatNumber(p.lambda, 3)} %`
        : `valid from ${withUnit(formatNumber(p.validFrom, 4), x)} to ${withUnit(formatNumber(p.validTo, 4), x)} (β ${formatNumber(p.beta * 100, 3)} %, ±${formatNumber(p.lambda, 3)} %)`,
    ]);
  const u = result.uncertainty;
  if (u) {
    const parts = [
      u.relative ? `${formatPercent(u.relative.UPct)}` : null,
      u.absolute ? withUnit(formatNumber(u.absolute.U, 3), x) : null,
    ].filter(Boolean);
    rows.push([`Expanded uncertainty (k = ${formatNumber(u.coverageFactor, 3)})`, `up to ${parts.join(' or ')}`]);
  }
  if (result.trueness)
    rows.push([
      'Trueness',
      result.trueness.significant ? 'bias shown on the reference material' : 'no bias shown on the reference material',
    ]);
  return rows;
}
