import {
  type FieldError,
  IMPORT_MAPPING_LABELS,
  type ImportMappingColumns,
  type ImportMappingField,
  type InstrumentImportData,
} from '@meritline/shared';
import { MAX_IMPORT_ROWS, type Cell, type ImportTable } from '../studies/import-table.js';
import { parseNumber } from '../studies/study-import.js';

export type SampleKind = 'standard' | 'check' | 'blank' | 'qc' | 'unknown';

/** Words an instrument writes in its sample-type column (case and spacing ignored). */
const KIND_WORDS: Record<SampleKind, string[]> = {
  standard: ['standard', 'std', 'calibrant', 'calibration', 'cal'],
  check: ['check', 'check standard', 'ccv', 'control standard'],
  blank: ['blank', 'method blank', 'mb', 'reagent blank'],
  qc: ['qc', 'qc sample', 'control sample', 'reference'],
  unknown: ['sample', 'unknown', 'unk', 'test'],
};

export function sampleKind(text: string): SampleKind | null {
  const word = text.trim().toLowerCase().replace(/\s+/g, ' ');
  return (Object.keys(KIND_WORDS) as SampleKind[]).find((kind) => KIND_WORDS[kind].includes(word)) ?? null;
}

const MAX_ID = 80;

/**
 * The run measurements of an export read through a saved mapping. Any cell that does not fit is
 * named by its line and column, and the file is refused whole (no partial import).
 */
export function readInstrumentExport(
  table: ImportTable,
  mapping: ImportMappingColumns,
): { data: InstrumentImportData; errors: FieldError[] } {
  const errors: FieldError[] = [];
  const index = {} as Record<ImportMappingField, number>;
  for (const [field, header] of Object.entries(mapping) as [ImportMappingField, string | null][]) {
    if (header === null) continue;
    const at = table.columns.indexOf(header);
    if (at < 0)
      errors.push({
        field: 'file',
        code: 'column_missing',
        message: `${table.lineWord} 1: the column “${header}” (${IMPORT_MAPPING_LABELS[field]}) saved in the mapping is not in this file, whose columns are ${table.columns.map((c) => `“${c}”`).join(', ')}.`,
      });
    index[field] = at;
  }
  const data: InstrumentImportData = { standards: [], checks: [], unknowns: [], blanks: [], qcSamples: [] };
  if (errors.length) return { data, errors };
  if (table.tooManyRows) {
    const message = `The file has more than ${MAX_IMPORT_ROWS.toLocaleString('en-GB')} data rows; split it into runs of that size or fewer.`;
    return { data, errors: [{ field: 'file', code: 'too_many_rows', message }] };
  }

  type Reading = {
    kind: SampleKind;
    id: string;
    y: number;
    replicate: number;
    dilution: number;
    concentration: number | null;
    line: number;
  };
  const readings: Reading[] = [];
  const fail = (line: number, field: ImportMappingField, message: string) =>
    errors.push({ field: 'file', code: 'does_not_fit', message: `${table.lineWord} ${line}, column “${mapping[field]}”: ${message}` });
  const cell = (cells: Cell[], field: ImportMappingField): Cell | undefined =>
    index[field] === undefined ? undefined : cells[index[field]];
  const empty = (c: Cell | undefined) => c === null || c === undefined || String(c).trim() === '';
  const number = (line: number, cells: Cell[], field: ImportMappingField, positive: boolean): number | null => {
    const c = cell(cells, field);
    if (empty(c)) return null;
    const n = parseNumber(c as Cell, table.decimalComma);
    if (n === undefined || (positive && n <= 0)) {
      fail(line, field, `“${String(c)}” is not ${positive ? 'a number above zero' : 'a number'}.`);
      return null;
    }
    return n;
  };

  for (const { line, cells } of table.rows) {
    const id = String(cell(cells, 'sampleId') ?? '').trim();
    if (!id || id.length > MAX_ID) fail(line, 'sampleId', `give a sample name of 1 to ${MAX_ID} characters.`);
    const typeText = String(cell(cells, 'sampleType') ?? '');
    const kind = sampleKind(typeText);
    if (!kind)
      fail(
        line,
        'sampleType',
        `“${typeText}” is not a sample type Meritline knows (standard, check, blank, QC or sample, or their usual short forms).`,
      );
    const y = number(line, cells, 'response', false);
    if (y === null && empty(cell(cells, 'response'))) fail(line, 'response', 'the response is empty.');
    const replicate = number(line, cells, 'replicate', true) ?? 0;
    const dilution = number(line, cells, 'dilution', true) ?? 1;
    const concentration = number(line, cells, 'concentration', kind === 'check' || kind === 'qc');
    if (kind === 'standard' && concentration === null && empty(cell(cells, 'concentration')))
      fail(
        line,
        mapping.concentration ? 'concentration' : 'sampleType',
        'a standard needs its concentration; map the concentration column.',
      );
    if ((kind === 'check' || kind === 'qc') && concentration === null && empty(cell(cells, 'concentration')))
      fail(
        line,
        mapping.concentration ? 'concentration' : 'sampleType',
        `a ${kind === 'qc' ? 'QC sample' : 'check standard'} needs its known concentration; map the concentration column.`,
      );
    if (kind && id && y !== null) readings.push({ kind, id, y, replicate, dilution, concentration, line });
  }
  if (errors.length) return { data, errors };

  const groups = new Map<string, Reading[]>();
  for (const r of readings) {
    const key = `${r.kind}\u0000${r.id}`;
    groups.set(key, [...(groups.get(key) ?? []), r]);
  }
  for (const group of groups.values()) {
    const sorted = [...group].sort((a, b) => a.replicate - b.replicate || a.line - b.line);
    const first = sorted[0];
    const ys = sorted.map((r) => r.y);
    switch (first.kind) {
      case 'standard':
        for (const r of sorted) data.standards.push({ x: r.concentration!, y: r.y });
        break;
      case 'check':
        data.checks.push({ id: first.id, nominal: first.concentration!, y: ys });
        break;
      case 'qc':
        data.qcSamples.push({
          id: first.id,
          known: first.concentration!,
          y: ys,
          ...(first.dilution !== 1 ? { dilution: first.dilution } : {}),
        });
        break;
      case 'blank':
        data.blanks.push({ id: first.id, y: ys });
        break;
      case 'unknown':
        data.unknowns.push({ id: first.id, y: ys, ...(first.dilution !== 1 ? { dilution: first.dilution } : {}) });
        break;
    }
  }
  return { data, errors };
}
