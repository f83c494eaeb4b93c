import type { QualificationCheckResult, QualificationInstallation } from '@meritline/shared';
import { createPdfComposer, formatDateTime } from '../reports/pdf/index.js';

export const QUALIFICATION_ID_INFO_KEY = 'MeritlineQualificationId';

export interface QualificationReportContent {
  id: string;
  ranAt: Date;
  ranByName: string;
  installation: QualificationInstallation;
  checks: QualificationCheckResult[];
  passed: number;
  minDigits: number | null;
  verifyUrl: string;
}

export const qualificationFileName = (id: string) => `meritline-self-qualification-${id.slice(0, 8)}.pdf`;

const digits = (value: number | null) => (value === null ? 'none' : value >= 15 ? '15 (all)' : value.toFixed(1));
function requiredText(check: QualificationCheckResult): string {
  if (check.tolerance === 0) return 'exact';
  if (check.toleranceKind === 'absolute') return `± ${Number(check.tolerance.toPrecision(2))}`;
  return `${check.requiredDigits} digits`;
}

/** 15 significant digits, in powers of ten where the published value uses them too. */
function obtainedText(check: QualificationCheckResult): string {
  if (check.obtained === null) return 'no value';
  if (check.tolerance === 0) return String(check.obtained);
  return /E/i.test(check.expected) ? check.obtained.toExponential(14).toUpperCase() : check.obtained.toPrecision(15);
}

/** The self-qualification report as PDF bytes (unsigned): installation, every check with its source, and the verdict. */
export function renderQualificationReport(content: QualificationReportContent): Promise<Buffer> {
  const { installation, checks } = content;
  const failed = checks.length - content.passed;
  const pdf = createPdfComposer({
    title: 'Self-qualification of the calculations',
    author: installation.laboratoryName,
    subject: `${checks.length} published checks, ${content.passed} passed`,
    header: { left: installation.laboratoryName, right: `Self-qualification ${content.id.slice(0, 8)}` },
    footer: `Engine ${installation.engineVersion} · run ${formatDateTime(content.ranAt)}`,
    info: { [QUALIFICATION_ID_INFO_KEY]: content.id },
  });
  pdf.heading('Self-qualification of the calculations');
  pdf.paragraph(
    'The statistics engine of this installation recomputed published reference values from their input data. Each check compares ' +
      'the value obtained with the published one and counts the significant digits on which they agree.',
  );
  pdf.heading('Installation', 2);
  pdf.keyValues([
    ['Laboratory', installation.laboratoryName],
    ['Product version', installation.productVersion],
    ['Engine version', installation.engineVersion],
    ['Source revision', installation.gitRevision],
    ['Node.js version', installation.nodeVersion],
    ['Database', installation.databaseKind],
    ['Run', formatDateTime(content.ranAt)],
    ['Run by', content.ranByName],
    ['Report id', content.id],
  ]);
  pdf.heading('Summary', 2);
  pdf.callout(
    failed === 0 ? 'All checks passed' : `${failed} of ${checks.length} checks failed`,
    [
      `${content.passed} of ${checks.length} checks agree with the published values within their tolerance.`,
      `Fewest digits of agreement with the certified values: ${digits(content.minDigits)}.`,
      failed === 0
        ? 'The calculations of this installation reproduce the published reference values.'
        : 'Do not rely on results calculated by this installation until the failed checks are explained; inform your quality manager.',
    ],
    failed === 0 ? 'pass' : 'fail',
  );
  const sources = [...new Set(checks.map((check) => check.source))];
  for (const source of sources) {
    pdf.heading(source, 3);
    pdf.table({
      columns: [
        { header: 'Check', width: 1.5 },
        { header: 'Quantity', width: 2.2 },
        { header: 'Published', width: 1.6, align: 'right' },
        { header: 'Obtained', width: 1.6, align: 'right' },
        { header: 'Digits agreeing', width: 0.8, align: 'right' },
        { header: 'Required', width: 0.8, align: 'right' },
        { header: 'Result', width: 0.7 },
      ],
      rows: checks
        .filter((check) => check.source === source)
        .map((check) => ({
          cells: [
            check.id,
            check.quantity.replace(/^[^:]+: /, ''),
            check.expected,
            obtainedText(check),
            digits(check.digits),
            requiredText(check),
            check.pass ? 'Pass' : 'FAIL',
          ],
          bold: !check.pass,
        })),
      fontSize: 7,
    });
  }
  pdf.heading('What this report does and does not show', 2);
  pdf.paragraph(
    'Digits of agreement are −log10 of the relative difference between the obtained and the published value (the log relative error ' +
      'of the NIST StRD documentation), at most 15. Counts such as degrees of freedom must agree exactly; values of printed tables, ' +
      'which are rounded, must agree within half a unit of their last printed digit. This run shows that the ' +
      'calculations reproduce the reference values on this installation; it does not replace the validation of the computerised ' +
      "system or of any method under the laboratory's own procedures, its qualified review and the regulations that apply.",
  );
  pdf.paragraph(`Check that this file is unchanged on the verification page: ${content.verifyUrl}`);
  return pdf.finish();
}
