import {
  EXCLUDED_DETECTION_ROW_WORDS,
  lowSpikeExclusion,
  mdlBlankValue,
  NOT_DETECTED_WORDS,
  spikeValue,
  type OutlierFlag,
} from '@meritline/shared';
import { formatDateTime, formatLevel, formatNumber, NOT_AVAILABLE, type PdfComposer, type TableRow } from '../pdf/index.js';
import type { ReportContent } from '../report-content.js';
import { notEvaluated, plural, sectionWarnings, xUnit, yUnit } from './common.js';
import { numbered } from './numbering.js';

const TEST_WORDS: Record<OutlierFlag['test'], string> = {
  grubbs: 'Grubbs (two-sided)',
  dixon: 'Dixon r10',
  cochran: 'Cochran C',
  standardizedResidual: 'Standardised residual',
};

const SET_WORDS: Record<string, string> = {
  standards: 'standard',
  blanks: 'blank',
  recovery: 'spiked sample',
  precision: 'precision result',
  unknowns: 'sample',
  'lowSpikes.spiked': 'low-level spike',
  'lowSpikes.blanks': 'method blank for the MDL',
};

type Exclusion = ReportContent['exclusions'][number];

function pointOf(text: string): { set: string; index: number } | null {
  const match = /(lowSpikes\.spiked|lowSpikes\.blanks|standards|blanks|recovery|precision|unknowns)(?:\[|\.)(\d+)/.exec(text);
  return match ? { set: match[1], index: Number(match[2]) } : null;
}

function describeChange(entry: Exclusion): string {
  const point = pointOf(JSON.stringify(entry.changes ?? {}));
  const what = point ? `${SET_WORDS[point.set]} ${point.index + 1}` : Object.keys(entry.changes ?? {}).join(', ') || 'a point';
  return entry.action.endsWith('excluded') ? `excluded ${what}` : `${entry.action.replace(/^study\.point-/, '')} ${what}`;
}

function reasonOf(entry: Exclusion): string {
  if (entry.reason) return entry.reason;
  for (const change of Object.values(entry.changes ?? {})) {
    const to = change?.to as { reason?: unknown } | null;
    if (to && typeof to === 'object' && typeof to.reason === 'string') return to.reason;
  }
  return NOT_AVAILABLE;
}

/** The excluded rows of one data set, as the table of excluded replicate results lists them. */
function excludedRows<T>(
  set: string,
  rows: readonly T[] | undefined,
  exclusionOf: (row: T) => { reason: string } | null | undefined,
  shown: (row: T) => { what: string; value: string },
): { set: string; what: string; index: number; value: string; reason: string }[] {
  return (rows ?? []).flatMap((row, index) => {
    const excluded = exclusionOf(row);
    return excluded ? [{ set, index, reason: excluded.reason, ...shown(row) }] : [];
  });
}

function exclusions(pdf: PdfComposer, content: ReportContent): void {
  pdf.heading(numbered('outliers', 'Excluded points', 2), 2);
  const excluded = (content.study.data.standards ?? []).flatMap((p, index) =>
    p.excluded ? [{ index, x: p.x, y: p.y, reason: p.excluded.reason }] : [],
  );
  const recordOf = (set: string, index: number) =>
    [...content.exclusions].reverse().find((entry) => {
      const point = pointOf(JSON.stringify(entry.changes ?? {}));
      return entry.action.endsWith('excluded') && point?.set === set && point.index === index;
    });
  const data = content.study.data;
  const inX = (value: number) => `${formatNumber(value, 5)} ${xUnit(content)}`;
  const replicates = [
    ...excludedRows(
      'blanks',
      data.blanks,
      (b) => (typeof b === 'number' ? null : b.excluded),
      (b) => ({
        what: EXCLUDED_DETECTION_ROW_WORDS.blanks,
        value: `${formatNumber(typeof b === 'number' ? b : b.value, 5)} ${yUnit(content)}`,
      }),
    ),
    ...excludedRows('lowSpikes.spiked', data.lowSpikes?.spiked, lowSpikeExclusion, (s) => ({
      what: EXCLUDED_DETECTION_ROW_WORDS['lowSpikes.spiked'],
      value: inX(spikeValue(s)),
    })),
    ...excludedRows('lowSpikes.blanks', data.lowSpikes?.blanks, lowSpikeExclusion, (b) => {
      const value = mdlBlankValue(b);
      return { what: EXCLUDED_DETECTION_ROW_WORDS['lowSpikes.blanks'], value: value === null ? NOT_DETECTED_WORDS : inX(value) };
    }),
    ...excludedRows(
      'recovery',
      data.recovery,
      (r) => r.excluded,
      (r) => ({ what: `Recovery, ${r.id}`, value: inX(r.found) }),
    ),
    ...excludedRows(
      'precision',
      data.precision,
      (p) => p.excluded,
      (p) => ({ what: `Precision, series ${p.group}`, value: inX(p.value) }),
    ),
  ];
  if (!excluded.length && !replicates.length) {
    pdf.paragraph('No point is excluded: every standard, method blank and replicate result enters the computations.');
  }
  if (excluded.length) {
    pdf.table({
      columns: [
        { header: 'Standard', width: 0.7, align: 'right' },
        { header: `x (${xUnit(content)})`, width: 0.9, align: 'right' },
        { header: `Response (${yUnit(content)})`, width: 1.1, align: 'right' },
        { header: 'Reason given', width: 2.4 },
        { header: 'Excluded by', width: 1.1 },
        { header: 'When', width: 1.5 },
      ],
      rows: excluded.map((p) => {
        const record = recordOf('standards', p.index);
        return [
          String(p.index + 1),
          formatLevel(p.x),
          formatNumber(p.y, 5),
          p.reason,
          record?.actorName ?? 'not in the audit trail',
          record ? formatDateTime(record.at) : NOT_AVAILABLE,
        ];
      }),
      note: 'Excluded points stay in the study data and in the plots (hollow markers) but enter no computation.',
    });
  }
  if (replicates.length) {
    pdf.table({
      caption: 'Excluded replicate results',
      columns: [
        { header: 'Result', width: 1.5 },
        { header: 'Value', width: 1, align: 'right' },
        { header: 'Reason given', width: 2.1 },
        { header: 'Excluded by', width: 1.1 },
        { header: 'When', width: 1.5 },
      ],
      rows: replicates.map((r) => {
        const record = recordOf(r.set, r.index);
        return [
          `${r.what} (row ${r.index + 1})`,
          r.value,
          r.reason,
          record?.actorName ?? 'not in the audit trail',
          record ? formatDateTime(record.at) : NOT_AVAILABLE,
        ];
      }),
      note: 'Excluded results stay in the study data but enter no blank, detection limit, recovery or precision figure.',
    });
  }
  if (content.exclusions.length) {
    pdf.table({
      caption: 'Exclusion history from the audit trail',
      columns: [
        { header: 'When', width: 1.5 },
        { header: 'By', width: 1.2 },
        { header: 'Change', width: 1.6 },
        { header: 'Reason', width: 2.7 },
      ],
      rows: content.exclusions.map((entry) => [formatDateTime(entry.at), entry.actorName, describeChange(entry), reasonOf(entry)]),
    });
  }
}

export function outliersSection(pdf: PdfComposer, content: ReportContent): void {
  pdf.heading(numbered('outliers', 'Outliers and exclusions'));
  const result = content.study.result;
  pdf.heading(numbered('outliers', 'Outlier tests', 1), 2);
  const flags = result?.outliers;
  if (!result || !flags) {
    notEvaluated(pdf, result, ['outliers']);
  } else {
    const flagged = flags.filter((f) => f.outlier).length;
    pdf.paragraph(
      `${plural(flags.length, 'test')} on the replicate sets; ${flagged === 0 ? 'none flags a value' : `${plural(flagged, 'test')} flag a value`}. ` +
        `Tests only flag: no value was removed because of a test. Points are excluded only by a person, with a reason (section ${numbered('outliers', '', 2).trim()}).`,
    );
    const rows: TableRow[] = flags.map((f) => ({
      cells: [
        f.set,
        TEST_WORDS[f.test] ?? f.test,
        formatNumber(f.value, 5),
        formatNumber(f.statistic, 3),
        formatNumber(f.critical, 3),
        f.outlier ? 'Outlier' : 'No outlier',
      ],
      bold: f.outlier,
      shaded: f.outlier,
    }));
    pdf.table({
      columns: [
        { header: 'Set of values', width: 1.8 },
        { header: 'Test', width: 1.4 },
        { header: 'Most extreme value', width: 1.2, align: 'right' },
        { header: 'Statistic', width: 0.9, align: 'right' },
        { header: 'Critical value', width: 0.9, align: 'right' },
        { header: 'Flag', width: 0.9, align: 'center' },
      ],
      rows,
      note: 'Grubbs, Dixon and Cochran tests (ISO 5725-2) at the 5 % significance level; standardised residuals flag beyond 3. A flag asks for a look at the laboratory records, not for removal.',
    });
    sectionWarnings(pdf, result, ['outliers']);
  }
  exclusions(pdf, content);
}
