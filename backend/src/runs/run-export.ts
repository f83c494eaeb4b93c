import { RUN_CAUTION, type RunDto, type RunUnknown } from '@meritline/shared';
import ExcelJS from 'exceljs';
import { toCsv } from '../common/csv.js';
import { reportRows, type ReportSignature } from './results-report.js';

export const FLAG_LABELS: Record<RunUnknown['flags'][number], string> = {
  belowLod: 'below LOD',
  belowLoq: 'below LOQ',
  aboveTopStandard: 'above top standard',
  outsideValidatedRange: 'outside validated range',
};

const rounded = (value: number | null | undefined, significant = 6): number | null =>
  typeof value === 'number' && Number.isFinite(value) ? Number(value.toPrecision(significant)) : null;

export function reportableText(run: RunDto): string {
  return run.status === 'accepted' ? 'yes' : 'no: run rejected';
}

/**
 * One row per unknown, in the order the analyst entered them: the columns of the signed results report
 * first, then the calculation's own figures (their names carry the units).
 */
export function resultRows(run: RunDto, signatures: ReportSignature[]): Record<string, string | number | null>[] {
  const { xUnit, yUnit } = run.method;
  const bias = new Map((run.result.onePointBias?.items ?? []).map((b) => [b.id, b]));
  const reported = reportRows(run, signatures);
  return run.result.unknowns.map((u, i) => {
    const row: Record<string, string | number | null> = {
      ...reported[i],
      Replicates: u.m,
      [`Mean response (${yUnit})`]: rounded(u.yMean),
      'Dilution factor': u.dilution,
      [`Concentration (${xUnit})`]: rounded(u.x0),
      [`CI low (${xUnit})`]: rounded(u.ci?.[0]),
      [`CI high (${xUnit})`]: rounded(u.ci?.[1]),
      Reported: u.reported,
      Flags: u.flags.map((f) => FLAG_LABELS[f]).join('; '),
      Remarks: u.remarks.join(' '),
      Reportable: reportableText(run),
    };
    const b = bias.get(u.id);
    if (run.result.onePointBias) {
      row[`Validation line reading (${xUnit})`] = rounded(b?.regression);
      row[`One-point bias (${xUnit})`] = rounded(b?.bias);
      row['One-point bias (%)'] = rounded(b?.biasPct, 3);
    }
    return row;
  });
}

export function runCsv(run: RunDto, signatures: ReportSignature[]): string {
  return toCsv(resultRows(run, signatures));
}

function addTable(sheet: ExcelJS.Worksheet, rows: Record<string, string | number | boolean | null>[]): void {
  if (!rows.length) return;
  const headers = Object.keys(rows[0]);
  sheet.columns = headers.map((header) => ({ header, key: header, width: Math.min(60, Math.max(12, header.length + 2)) }));
  sheet.addRows(rows);
  sheet.getRow(1).font = { bold: true };
  sheet.views = [{ state: 'frozen', ySplit: 1 }];
}

export async function runWorkbook(run: RunDto, signatures: ReportSignature[]): Promise<Buffer> {
  const { result } = run;
  const { xUnit, yUnit } = run.method;
  const validation = result.validation;
  const workbook = new ExcelJS.Workbook();
  workbook.creator = 'Meritline';
  workbook.created = new Date(run.createdAt);

  addTable(workbook.addWorksheet('Results'), resultRows(run, signatures));
  addTable(
    workbook.addWorksheet('Check standards'),
    result.checks.map((c) => ({
      Check: c.id,
      [`Nominal (${xUnit})`]: c.nominal,
      [`Mean response (${yUnit})`]: rounded(c.yMean),
      [`Found (${xUnit})`]: rounded(c.found),
      'Recovery (%)': rounded(c.recoveryPct, 4),
      'Acceptance window (%)': `${result.acceptance.low} to ${result.acceptance.high}`,
      Outcome: c.pass ? 'pass' : 'fail',
    })),
  );
  const controls = [
    ...(result.blanks ?? []).map((b) => ({
      Kind: 'method blank',
      Name: b.id,
      [`Known (${xUnit})`]: null,
      [`Found (${xUnit})`]: rounded(b.found),
      'Recovery (%)': null,
      Limit: `below ${rounded(b.limit, 3)} ${xUnit} (${b.limitBasis === 'lod' ? 'LOD of the validation' : 'set limit'})`,
      Outcome: b.pass ? 'pass' : 'fail',
    })),
    ...(result.qcSamples ?? []).map((q) => ({
      Kind: 'QC sample',
      Name: q.id,
      [`Known (${xUnit})`]: q.known,
      [`Found (${xUnit})`]: rounded(q.found),
      'Recovery (%)': rounded(q.recoveryPct, 4),
      Limit: result.qcWindow ? `${result.qcWindow.low} to ${result.qcWindow.high} % recovery` : '',
      Outcome: q.pass ? 'pass' : 'fail',
    })),
  ];
  if (controls.length) addTable(workbook.addWorksheet('Blanks and QC samples'), controls);
  addTable(
    workbook.addWorksheet('Standards'),
    ((run.data.standards as { x: number; y: number; excluded?: { reason: string } }[]) ?? []).map((s) => ({
      [`Concentration (${xUnit})`]: s.x,
      [`Response (${yUnit})`]: s.y,
      'Left out because': s.excluded?.reason ?? '',
    })),
  );
  const calibration = result.calibration;
  const summary = workbook.addWorksheet('Run');
  summary.columns = [
    { header: 'Item', key: 'item', width: 34 },
    { header: 'Value', key: 'value', width: 90 },
  ];
  summary.getRow(1).font = { bold: true };
  const info: [string, string | number | null][] = [
    ['Run', run.title],
    ['Status', run.status === 'accepted' ? 'Accepted' : 'Rejected: results not reportable'],
    ['Reasons for rejection', run.rejectionReasons.join(' ') || null],
    ['Method', `${run.method.name}, version ${run.versionNumber}`],
    ['Calibration model', `${run.model}${result.weighting !== 'none' ? `, weighting ${result.weighting}` : ''}`],
    [`Slope (${yUnit} per ${xUnit})`, rounded(calibration?.slope)],
    [`Intercept (${yUnit})`, rounded(calibration?.intercept)],
    ['Curvature', rounded(calibration?.curvature)],
    ['R²', rounded(calibration?.r2)],
    ['Validation study', `${validation.studyTitle} (${validation.studyId})`],
    [`LOD (${xUnit}, measured solution)`, rounded(validation.lod, 3)],
    [`LOQ (${xUnit}, measured solution)`, rounded(validation.loq, 3)],
    [
      'Validated range',
      validation.validatedRange ? `${validation.validatedRange.low} to ${validation.validatedRange.high} ${xUnit}` : null,
    ],
    ['Check acceptance', `recovery within ${result.acceptance.low} to ${result.acceptance.high} %`],
    ['Analyst', run.author.name],
    ['Created', run.createdAt],
    ['Engine version', run.engineVersion],
    ['Data hash (SHA-256)', run.dataHash],
    ['Caution', RUN_CAUTION],
  ];
  summary.addRows(info.map(([item, value]) => ({ item, value: value ?? '' })));
  summary.getColumn('value').alignment = { wrapText: true, vertical: 'top' };
  return Buffer.from(await workbook.xlsx.writeBuffer());
}
