import type { AuditTrailEntryDto, AuditVerificationDto } from '@meritline/shared';
import { toCsv } from '../common/csv.js';
import { createPdfComposer, formatDateTime } from '../reports/pdf/index.js';

export interface AuditExtract {
  laboratoryName: string;
  exportedAt: Date;
  exportedBy: string;
  filters: [string, string][];
  entries: AuditTrailEntryDto[];
  verification: AuditVerificationDto | null;
}

const changesText = (entry: AuditTrailEntryDto) => entry.changesInWords.map((c) => `${c.field}: ${c.from} → ${c.to}`).join('\n');

export function auditExtractCsv(extract: AuditExtract): string {
  return toCsv(
    extract.entries.map((entry) => ({
      'Entry number': entry.seq,
      'When (UTC)': entry.at,
      Who: entry.actorName,
      What: entry.actionText,
      Record: entry.recordText,
      'Record id': entry.entityId ?? '',
      'Old and new values': changesText(entry),
      Reason: entry.reason ?? '',
    })),
  );
}

export function auditExtractFileName(exportedAt: Date, format: 'csv' | 'pdf'): string {
  return `meritline-audit-trail-${exportedAt.toISOString().slice(0, 19).replace(/[:T]/g, '-')}.${format}`;
}

/** The extract as PDF bytes, unsigned: the caller signs it with the laboratory certificate. */
export function renderAuditExtract(extract: AuditExtract): Promise<Buffer> {
  const pdf = createPdfComposer({
    title: 'Audit-trail extract',
    author: extract.laboratoryName,
    subject: `Audit-trail extract of ${extract.entries.length} entries`,
    header: { left: extract.laboratoryName, right: 'Audit-trail extract' },
    footer: `Exported ${formatDateTime(extract.exportedAt)} by ${extract.exportedBy}`,
  });
  pdf.heading('Audit-trail extract');
  pdf.keyValues([
    ['Laboratory', extract.laboratoryName],
    ['Exported', formatDateTime(extract.exportedAt)],
    ['Exported by', extract.exportedBy],
    ['Entries', String(extract.entries.length)],
    ...extract.filters,
  ]);
  const verification = extract.verification;
  if (verification) {
    if (verification.ok) {
      pdf.callout('Chain intact', [`All ${verification.rows} entries of the trail link to each other and match their content.`], 'pass');
    } else {
      pdf.callout(
        'Chain broken',
        verification.broken.map((b) => (b.seq ? `Entry ${b.seq}: ${b.reason}.` : `${b.reason}.`)),
        'fail',
      );
    }
  }
  pdf.table({
    columns: [
      { header: 'No.', width: 0.5, align: 'right' },
      { header: 'When (UTC)', width: 1.3 },
      { header: 'Who', width: 1.2 },
      { header: 'What', width: 1.8 },
      { header: 'Old and new values', width: 2.6 },
      { header: 'Reason', width: 1.6 },
    ],
    rows: extract.entries.map((entry) => [
      String(entry.seq),
      formatDateTime(entry.at),
      entry.actorName,
      `${entry.actionText}\n(${entry.recordText})`,
      changesText(entry),
      entry.reason ?? '',
    ]),
    empty: 'No entries match these filters.',
    fontSize: 7,
  });
  return pdf.finish();
}
