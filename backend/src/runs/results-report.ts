import {
  formatRunSignificant,
  ROLE_LABELS,
  RUN_CAUTION,
  runDecimalsFor,
  RUN_SIGNATURE_MEANING_LABELS,
  type Role,
  type RunDto,
  type RunSignatureMeaning,
  type RunUnknown,
} from '@meritline/shared';
import { colors, createPdfComposer, formatDate, formatDateTime, sizes } from '../reports/pdf/index.js';

/** Key of the PDF information entry naming the results report, so a changed copy can still be recognised. */
export const RESULTS_REPORT_ID_INFO_KEY = 'MeritlineResultsReportId';

export interface ReportSignature {
  signerName: string;
  signerRole: Role;
  meaning: RunSignatureMeaning;
  signedAt: Date;
}

export interface ResultsReportContent {
  run: RunDto;
  laboratoryName: string;
  verifyUrl: string;
  reportId: string;
  issuedAt: Date;
  signatures: ReportSignature[];
}

/** What each signature meaning says in a report, in words. */
const MEANING_WORDS: Record<RunSignatureMeaning, string> = {
  performed: 'Performed the run and submitted it for release',
  'reviewed-and-released': 'Reviewed the run and released its results',
};

const count = (n: number, one: string) => `${n} ${one}${n === 1 ? '' : 's'}`;

const stripUnit = (text: string, unit: string) => (unit && text.endsWith(` ${unit}`) ? text.slice(0, -unit.length - 1) : text);

/** The result and its U as printed: the value to the decimal place of U (two significant figures), "< LOQ" and "> top" as such. */
export function resultCells(u: RunUnknown, unit: string): { result: string; U: string } {
  const U = u.uncertainty?.value?.U;
  if (u.reported.startsWith('<') || u.reported.startsWith('>')) return { result: stripUnit(u.reported, unit), U: '' };
  if (U !== undefined && U > 0) {
    const half = Number(U.toPrecision(2));
    const decimals = runDecimalsFor(half, 2);
    return { result: u.x0.toFixed(decimals), U: half.toFixed(decimals) };
  }
  return { result: formatRunSignificant(u.x0, 3), U: '' };
}

export const releaseSignature = (signatures: ReportSignature[]): ReportSignature | null =>
  signatures.filter((s) => s.meaning === 'reviewed-and-released').at(-1) ?? null;

/** One row per reported sample: the columns of the signed results report, also leading the CSV and XLSX exports. */
export function reportRows(run: RunDto, signatures: ReportSignature[]): Record<string, string | number>[] {
  const unit = run.method.xUnit;
  const released = releaseSignature(signatures);
  return run.result.unknowns.map((u) => {
    const { result, U } = resultCells(u, unit);
    const value = u.uncertainty?.value;
    return {
      Sample: u.id,
      Result: result,
      Unit: unit,
      'Expanded uncertainty U': U,
      'Coverage factor k': value ? value.coverageFactor : '',
      'Dilution factor': u.dilution,
      Method: run.method.name,
      'Method version': run.versionNumber,
      'Run date': formatDate(run.createdAt),
      'Released by': released?.signerName ?? '',
      'Released at': released ? formatDateTime(released.signedAt) : '',
      'Signature meaning': released ? RUN_SIGNATURE_MEANING_LABELS[released.meaning] : '',
      Remarks: u.remarks.join(' '),
      'Uncertainty basis': u.uncertainty?.basis ?? 'This run was calculated before uncertainties were carried with results.',
    };
  });
}

/** The signed certificate of a released run's results (unsigned bytes; the caller signs them). */
export async function renderResultsReport(content: ResultsReportContent): Promise<Buffer> {
  const { run, reportId } = content;
  const { method, result } = run;
  const unit = method.xUnit;
  const released = releaseSignature(content.signatures);
  const pdf = createPdfComposer({
    title: `Results report: ${run.title}`,
    author: content.laboratoryName,
    subject: `${method.name}, version ${run.versionNumber}: results of the run "${run.title}" (${run.id})`,
    keywords: `results report, ${method.analyte}, ${method.matrix}`,
    header: { left: `${content.laboratoryName} · Results report`, right: `Report ${reportId}` },
    footer: `Run ${run.id} · data SHA-256 ${run.dataHash.slice(0, 16)}…`,
    info: { [RESULTS_REPORT_ID_INFO_KEY]: reportId },
  });

  pdf.label('Results report');
  pdf.heading(run.title);
  pdf.keyValues([
    ['Laboratory', content.laboratoryName],
    ['Method', `${method.name}, version ${run.versionNumber}`],
    ['Analyte and matrix', `${method.analyte} in ${method.matrix}`],
    ['Run date', formatDateTime(run.createdAt)],
    ['Analyst', run.author.name],
    ['Validation study', result.validation.studyTitle],
    [
      'Released by',
      released
        ? `${released.signerName}, ${formatDateTime(released.signedAt)}: ${MEANING_WORDS[released.meaning].toLowerCase()}`
        : 'not released',
    ],
    ['Report issued', formatDateTime(content.issuedAt)],
    ['Report id', reportId],
  ]);

  pdf.heading('Results', 2);
  const hasU = result.unknowns.some((u) => u.uncertainty?.value);
  const k = result.unknowns.find((u) => u.uncertainty?.value)?.uncertainty?.value?.coverageFactor ?? 2;
  pdf.table({
    columns: [
      { header: 'Sample', width: 1.3 },
      { header: `Result (${unit})`, width: 0.9, align: 'right' },
      { header: `U, k = ${k} (${unit})`, width: 0.9, align: 'right' },
      { header: 'Dilution', width: 0.6, align: 'right' },
      { header: 'Remarks', width: 2.6 },
    ],
    rows: result.unknowns.map((u) => {
      const cells = resultCells(u, unit);
      return [u.id, cells.result, cells.U || '—', String(u.dilution), u.remarks.join(' ') || '—'];
    }),
    note: hasU
      ? 'U is the expanded uncertainty of the result, dilution included; "<" values are below the limit shown (not quantified) and carry no U.'
      : 'No expanded uncertainty is stated: see its basis below. "<" values are below the limit shown (not quantified).',
  });
  const bases = [...new Set(result.unknowns.map((u) => u.uncertainty?.basis).filter((b): b is string => !!b))];
  pdf.paragraph(
    `Uncertainty: ${bases.join(' ') || 'this run was calculated before uncertainties were carried with results; none is stated.'}`,
    {
      size: sizes.small,
      color: colors.muted,
    },
  );
  pdf.paragraph(
    `Acceptance: every check standard of the run recovered within ${result.acceptance.low} to ${result.acceptance.high} % of its nominal value${
      result.blanks?.length || result.qcSamples?.length
        ? `; ${count(result.blanks?.length ?? 0, 'method blank')} below the limit and ${count(result.qcSamples?.length ?? 0, 'QC sample')} within ${result.qcWindow?.low} to ${result.qcWindow?.high} % recovery`
        : ''
    }.`,
    { size: sizes.small, color: colors.muted },
  );

  pdf.heading('Electronic signatures', 2);
  pdf.table({
    columns: [
      { header: 'Signed by', width: 1.3 },
      { header: 'Role', width: 0.9 },
      { header: 'Meaning', width: 2.2 },
      { header: 'Signed (date and time)', width: 1.5 },
    ],
    rows: content.signatures.map((s) => ({
      cells: [s.signerName, ROLE_LABELS[s.signerRole] ?? s.signerRole, MEANING_WORDS[s.meaning], formatDateTime(s.signedAt)],
      bold: s === released,
    })),
    empty: 'No electronic signature.',
  });

  pdf.callout(
    'Caution',
    [
      RUN_CAUTION,
      `This report is signed with the laboratory's certificate; any change after signing breaks the signature. Check a copy at ${content.verifyUrl}.`,
    ],
    'warning',
  );
  return pdf.finish();
}
