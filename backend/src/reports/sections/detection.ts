import type { DetectionApproach, DetectionResult, EvaluationResult } from '@meritline/shared';
import { formatNumber, NOT_AVAILABLE, withUnit, type PdfComposer, type TableRow } from '../pdf/index.js';
import type { ReportContent } from '../report-content.js';
import { APPROACH_LABELS } from '../report-figures.js';
import { notEvaluated, sectionWarnings, xUnit, yUnit } from './common.js';
import { numbered } from './numbering.js';

export interface ReportedLimits {
  approach: DetectionApproach;
  lod: number;
  loq: number | null;
}

/** The approach the criteria name, else the first one the data allow: what the unknowns were judged against. */
export function reportedLimits(result: EvaluationResult): ReportedLimits | null {
  const detection = result.detection;
  const approach = detection?.flagBasis;
  if (!detection || !approach) return null;
  const limits = limitsOf(detection, approach);
  return limits && limits.lod !== null ? { approach, lod: limits.lod, loq: limits.loq } : null;
}

function limitsOf(
  detection: DetectionResult,
  approach: DetectionApproach,
): { critical: number | null; lod: number | null; loq: number | null } | null {
  switch (approach) {
    case 'sdResidual':
    case 'sdIntercept':
    case 'blankSd': {
      const pair = detection[approach];
      return pair ? { critical: null, lod: pair.lod, loq: pair.loq } : null;
    }
    case 'iso11843':
    case 'hubauxVos': {
      const limits = detection[approach];
      return limits ? { critical: limits.criticalX, lod: limits.detectableX, loq: null } : null;
    }
    case 'epaMdl':
      return detection.epaMdl ? { critical: null, lod: detection.epaMdl.mdl, loq: null } : null;
  }
}

/** The rows left out of the MDL; the exclusions section lists them with their reasons. */
const excludedNote = (rows: readonly unknown[] | undefined) =>
  rows?.length ? ` (${rows.length} more excluded, see section ${numbered('outliers', '', 2).trim()})` : '';

const ORDER: DetectionApproach[] = ['sdResidual', 'sdIntercept', 'blankSd', 'iso11843', 'hubauxVos', 'epaMdl'];

export function detectionSection(pdf: PdfComposer, content: ReportContent): void {
  const result = content.study.result;
  pdf.heading(numbered('detection', 'Detection and quantitation limits'));
  const detection = result?.detection;
  if (!result || !detection) {
    notEvaluated(pdf, result, ['detection']);
    return;
  }
  const x = xUnit(content);
  const y = yUnit(content);
  const reported = detection.flagBasis;
  pdf.paragraph(
    `Every approach the data allow, side by side, in ${x}. The row marked "Reported" is the approach the acceptance criteria name ` +
      '(without one, the first approach the data allow); unknowns are flagged against it. Approaches differ in what they assume, ' +
      'so their limits differ: compare like with like.',
  );
  const rows: TableRow[] = ORDER.map((approach) => {
    const limits = limitsOf(detection, approach);
    const isReported = approach === reported;
    return {
      cells: [
        APPROACH_LABELS[approach],
        limits ? formatNumber(limits.critical, 3) : NOT_AVAILABLE,
        limits ? formatNumber(limits.lod, 3) : 'not computed',
        limits ? formatNumber(limits.loq, 3) : NOT_AVAILABLE,
        isReported ? 'Reported' : '',
      ],
      bold: isReported,
      shaded: isReported,
    };
  });
  pdf.table({
    columns: [
      { header: 'Approach', width: 3.6 },
      { header: `Critical value (${x})`, width: 1.3, align: 'right' },
      { header: `LOD (${x})`, width: 1.2, align: 'right' },
      { header: `LOQ (${x})`, width: 1.2, align: 'right' },
      { header: 'Use', width: 0.9, align: 'center' },
    ],
    rows,
    note:
      'For ISO 11843-2 and Hubaux–Vos the LOD column is the minimum detectable value; for 40 CFR 136 App. B it is the MDL. ' +
      'An approach shows "not computed" when the study lacks its inputs.',
  });

  const details: [string, string][] = [];
  const { sdResidual, sdIntercept, blankSd, iso11843, hubauxVos, epaMdl } = detection;
  if (sdResidual)
    details.push([
      'Residual SD',
      `σ = ${withUnit(formatNumber(sdResidual.sigma), y)}, slope ${formatNumber(sdResidual.slope, 5)}; LOD = 3.3 σ / slope, LOQ = 10 σ / slope`,
    ]);
  if (sdIntercept)
    details.push([
      'SD of the intercept',
      `σ = ${withUnit(formatNumber(sdIntercept.sigma), y)}, slope ${formatNumber(sdIntercept.slope, 5)}`,
    ]);
  if (blankSd) {
    details.push([
      'Blanks',
      `n = ${blankSd.n}, mean ${withUnit(formatNumber(blankSd.mean), y)}, SD ${withUnit(formatNumber(blankSd.sigma), y)}`,
    ]);
    details.push([
      'Mean blank + 3 SD / + 10 SD',
      `responses ${formatNumber(blankSd.responseLod)} / ${formatNumber(blankSd.responseLoq)} ${y}, i.e. ${formatNumber(blankSd.responseLodX, 3)} / ${formatNumber(blankSd.responseLoqX, 3)} ${x} (IUPAC, common practice)`,
    ]);
  }
  if (iso11843) {
    details.push([
      'ISO 11843-2',
      `K = ${iso11843.K} reading, ν = ${iso11843.df}, α = β = ${result.alpha}; critical response ${withUnit(formatNumber(iso11843.criticalResponse), y)}; δ = ${formatNumber(iso11843.delta)}`,
    ]);
  }
  if (hubauxVos)
    details.push(['Hubaux and Vos', `ν = ${hubauxVos.df}; critical response ${withUnit(formatNumber(hubauxVos.criticalResponse), y)}`]);
  if (epaMdl) {
    const rule = {
      'none-numeric': 'no numerical blank results',
      highest: 'highest blank result',
      rank: 'blank result at the 99th-percentile rank',
      'mean-plus-t-sd': 'mean + t(0.99) SD of the blanks',
    };
    details.push([
      'MDL (40 CFR 136 App. B)',
      `from ${epaMdl.nSpiked} spiked samples${excludedNote(detection.excludedSpikes)} ${withUnit(formatNumber(epaMdl.mdlSpiked, 3), x)}; ` +
        `from ${epaMdl.nBlanks} method blanks${excludedNote(detection.excludedMdlBlanks)} ${withUnit(formatNumber(epaMdl.mdlBlank, 3), x)}` +
        `${epaMdl.blankRule ? ` (${rule[epaMdl.blankRule]})` : ''}; the larger, from the ${epaMdl.governing === 'spiked' ? 'spiked samples' : 'method blanks'}, governs`,
    ]);
  }
  if (details.length) {
    pdf.heading('Inputs of each approach', 3);
    pdf.keyValues(details, { labelWidth: 130, size: 8.5 });
  }
  const unknownsBelow = (result.unknowns ?? []).filter((u) => u.flags.includes('belowLod') || u.flags.includes('belowLoq'));
  if (unknownsBelow.length) {
    pdf.paragraph(`${unknownsBelow.length} unknown sample(s) fall below the reported LOD or LOQ (see the calibration section).`, {
      size: 8.5,
    });
  }
  sectionWarnings(pdf, result, ['detection']);
}
