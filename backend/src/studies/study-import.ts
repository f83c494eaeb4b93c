import {
  type AccuracyItem,
  type FieldError,
  headerAliases,
  type ImportPreviewDto,
  type ImportSection,
  type LowSpikes,
  type PrecisionResult,
  type RecoveryItem,
  type StandardPoint,
  type UnknownSample,
} from '@meritline/shared';
import { MAX_IMPORT_ROWS, type Cell, type ImportTable, type TableRow } from './import-table.js';

/** Target field → source column header. */
export type ImportMapping = Record<string, string>;

export type ImportedRows = StandardPoint[] | number[] | RecoveryItem[] | PrecisionResult[] | AccuracyItem[] | UnknownSample[] | LowSpikes[];

type FieldKind = 'number' | 'text' | 'number-or-not-detected';

interface ImportField {
  key: string;
  label: string;
  kind: FieldKind;
  required: boolean;
  aliases: string[];
}

const field = (key: string, label: string, kind: FieldKind, required: boolean, aliases: string[]): ImportField => ({
  key,
  label,
  kind,
  required,
  aliases,
});

const SECTION_FIELDS: Record<ImportSection, ImportField[]> = {
  standards: [
    field('x', 'concentration', 'number', true, headerAliases('standards', 'x')),
    field('y', 'response', 'number', true, headerAliases('standards', 'y')),
    field('id', 'identifier', 'text', false, headerAliases('standards', 'id')),
  ],
  blanks: [field('value', 'blank response', 'number', true, headerAliases('blanks', 'value'))],
  recovery: [
    field('id', 'identifier', 'text', false, headerAliases('recovery', 'id')),
    field('level', 'spike level', 'text', false, headerAliases('recovery', 'level')),
    field('added', 'amount added', 'number', true, headerAliases('recovery', 'added')),
    field('found', 'amount found', 'number', true, headerAliases('recovery', 'found')),
    field('native', 'native amount', 'number', false, headerAliases('recovery', 'native')),
  ],
  precision: [
    field('group', 'series', 'text', true, headerAliases('precision', 'group')),
    field('value', 'result', 'number', true, headerAliases('precision', 'value')),
  ],
  accuracy: [
    field('level', 'level', 'text', true, headerAliases('accuracy', 'level')),
    field('series', 'series', 'text', true, headerAliases('accuracy', 'series')),
    field('nominal', 'nominal value', 'number', true, headerAliases('accuracy', 'nominal')),
    field('found', 'result found', 'number', true, headerAliases('accuracy', 'found')),
  ],
  unknowns: [
    field('id', 'sample', 'text', true, headerAliases('unknowns', 'id')),
    field('y', 'response', 'number', false, headerAliases('unknowns', 'y')),
    field('dilution', 'dilution factor', 'number', false, headerAliases('unknowns', 'dilution')),
  ],
  lowSpikes: [
    field('spiked', 'spiked result', 'number', false, headerAliases('lowSpikes', 'spiked')),
    field('blank', 'blank result', 'number-or-not-detected', false, headerAliases('lowSpikes', 'blank')),
  ],
};

/** Replicate response columns of unknowns: y1, y2… (also "response 2", "rep 3"). */
const REPLICATE_KEY = /^y(\d{1,2})$/;
const REPLICATE_HEADER = /^(?:y|response|signal|area|absorbance|rep|replicate|reading) ?(\d{1,2})$/;
const NOT_DETECTED = /^(nd|n\.d\.|not detected|bdl|<.*)$/i;
const NUMBER = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/;
const MAX_ROW_ERRORS = 100;

const TEMPLATE_ROWS: Record<ImportSection, string[][]> = {
  standards: [
    ['x', 'y'],
    ['0.5', '0.0612'],
    ['1.0', '0.1218'],
  ],
  blanks: [['value'], ['0.0011'], ['0.0018']],
  recovery: [
    ['id', 'level', 'added', 'found', 'native'],
    ['R1', 'low', '1.0', '0.982', '0'],
    ['R2', 'low', '1.0', '1.013', '0'],
  ],
  precision: [
    ['group', 'value'],
    ['day 1', '5.02'],
    ['day 1', '4.97'],
  ],
  accuracy: [
    ['level', 'series', 'nominal', 'found'],
    ['L1', 'day 1', '1.0', '0.984'],
    ['L1', 'day 1', '1.0', '1.012'],
  ],
  unknowns: [
    ['id', 'y1', 'y2', 'dilution'],
    ['W-014', '0.412', '0.415', '1'],
    ['W-015', '0.288', '0.291', '2'],
  ],
  lowSpikes: [
    ['spiked', 'blank'],
    ['0.21', '0.02'],
    ['0.18', 'ND'],
  ],
};

/** A CSV template: the header and two rows of invented numbers. */
export function importTemplate(section: ImportSection): string {
  return `${TEMPLATE_ROWS[section].map((row) => row.join(',')).join('\r\n')}\r\n`;
}

export function normaliseHeader(header: string): string {
  return header
    .toLowerCase()
    .replace(/\(.*?\)|\[.*?\]/g, ' ')
    .replace(/[^a-z0-9]+/g, ' ')
    .trim();
}

function isKnownTarget(section: ImportSection, key: string): boolean {
  return SECTION_FIELDS[section].some((f) => f.key === key) || (section === 'unknowns' && REPLICATE_KEY.test(key));
}

function fieldFor(section: ImportSection, key: string): ImportField {
  const known = SECTION_FIELDS[section].find((f) => f.key === key);
  return known ?? field(key, `response ${REPLICATE_KEY.exec(key)?.[1]}`, 'number', false, []);
}

/** The user's mapping first, then each field's aliases (exact, then as the start of a header) over the columns left. */
export function resolveMapping(section: ImportSection, columns: string[], requested: Record<string, string | null> = {}) {
  const errors: FieldError[] = [];
  const mapping: ImportMapping = {};
  const used = new Set<number>();
  const unmapped = new Set<string>();
  for (const [key, source] of Object.entries(requested)) {
    if (!isKnownTarget(section, key)) {
      const fields = SECTION_FIELDS[section].map((f) => f.key).join(', ');
      errors.push({
        field: `mapping.${key}`,
        code: 'unknown_field',
        message: `“${key}” is not a field of ${section}; the fields are ${fields}.`,
      });
      continue;
    }
    if (source === null || source === '') {
      unmapped.add(key);
      continue;
    }
    const index = columns.findIndex((column) => column.trim().toLowerCase() === String(source).trim().toLowerCase());
    if (index < 0) {
      errors.push({ field: `mapping.${key}`, code: 'unknown_column', message: `The file has no column “${source}”.` });
      continue;
    }
    mapping[key] = columns[index];
    used.add(index);
  }
  const normalised = columns.map(normaliseHeader);
  const claim = (key: string, matches: (header: string) => boolean) => {
    if (key in mapping || unmapped.has(key)) return;
    const index = normalised.findIndex((header, i) => !used.has(i) && matches(header));
    if (index < 0) return;
    mapping[key] = columns[index];
    used.add(index);
  };
  if (section === 'unknowns') {
    normalised.forEach((header, i) => {
      const replicate = REPLICATE_HEADER.exec(header)?.[1];
      if (replicate && !used.has(i)) claim(`y${Number(replicate)}`, (h) => h === header);
    });
  }
  for (const f of SECTION_FIELDS[section]) claim(f.key, (header) => f.aliases.includes(header));
  for (const f of SECTION_FIELDS[section]) claim(f.key, (header) => f.aliases.some((alias) => header.startsWith(`${alias} `)));

  const leftOver = columns.filter((_, i) => !used.has(i));
  const unmatched = leftOver.length
    ? ` Columns that match nothing: ${leftOver.map((c) => `“${c}”`).join(', ')}.`
    : ' The file has no other column.';
  const missing = (key: string, what: string) =>
    errors.push({ field: `mapping.${key}`, code: 'unmapped', message: `No column for ${what}.${unmatched} Choose one in the mapping.` });
  for (const f of SECTION_FIELDS[section]) if (f.required && !(f.key in mapping)) missing(f.key, `${f.key} (${f.label})`);
  if (section === 'unknowns' && !Object.keys(mapping).some((key) => key === 'y' || REPLICATE_KEY.test(key)))
    missing('y', 'the responses (y, or y1, y2…)');
  if (section === 'lowSpikes' && !('spiked' in mapping) && !('blank' in mapping)) missing('spiked', 'spiked results or blank results');
  return { mapping, errors };
}

export function parseNumber(cell: Cell, decimalComma: boolean): number | undefined {
  if (typeof cell === 'number') return Number.isFinite(cell) ? cell : undefined;
  let text = String(cell).trim();
  if (decimalComma && /^[^.]*,[^,]*$/.test(text)) text = text.replace(',', '.');
  return NUMBER.test(text) ? Number(text) : undefined;
}

const isEmptyCell = (cell: Cell | undefined) => cell === null || cell === undefined || String(cell).trim() === '';

/** Reads each mapped cell of one row; a number column must hold a number, a required column a value. */
function readRow(row: TableRow, index: number, section: ImportSection, mapping: ImportMapping, table: ImportTable, errors: FieldError[]) {
  const values: Record<string, number | string | null | undefined> = {};
  for (const [key, column] of Object.entries(mapping)) {
    const f = fieldFor(section, key);
    const cell = row.cells[table.columns.indexOf(column)];
    const where = `${table.lineWord} ${row.line}, column “${column}”`;
    if (isEmptyCell(cell)) {
      if (f.required) errors.push({ field: `rows[${index}].${key}`, code: 'required', message: `${where}: the ${f.label} is missing.` });
      continue;
    }
    const text = String(cell).trim();
    if (f.kind === 'text') {
      values[key] = typeof cell === 'number' ? String(cell) : text;
      continue;
    }
    if (f.kind === 'number-or-not-detected' && NOT_DETECTED.test(text)) {
      values[key] = null;
      continue;
    }
    const number = parseNumber(cell as Cell, table.decimalComma);
    if (number === undefined)
      errors.push({ field: `rows[${index}].${key}`, code: 'not_number', message: `${where}: “${text}” is not a number.` });
    else values[key] = number;
  }
  return values;
}

function buildRows(
  section: ImportSection,
  records: Record<string, number | string | null | undefined>[],
  mapping: ImportMapping,
  table: ImportTable,
  errors: FieldError[],
): ImportedRows {
  const num = (value: unknown) => value as number;
  const text = (value: unknown) => value as string;
  switch (section) {
    case 'standards':
      return records.map((r) => ({ x: num(r.x), y: num(r.y), ...(r.id !== undefined ? { id: text(r.id) } : {}) }));
    case 'blanks':
      return records.map((r) => num(r.value));
    case 'recovery':
      return records.map((r, i) => ({
        id: r.id !== undefined ? text(r.id) : `R${i + 1}`,
        ...(r.level !== undefined ? { level: text(r.level) } : {}),
        added: num(r.added),
        found: num(r.found),
        ...(r.native !== undefined ? { native: num(r.native) } : {}),
      }));
    case 'precision':
      return records.map((r) => ({ group: text(r.group), value: num(r.value) }));
    case 'accuracy':
      return records.map((r) => ({ level: text(r.level), series: text(r.series), nominal: num(r.nominal), found: num(r.found) }));
    case 'unknowns': {
      const replicateKeys = Object.keys(mapping)
        .filter((key) => key === 'y' || REPLICATE_KEY.test(key))
        .sort((a, b) => Number(a.slice(1) || 0) - Number(b.slice(1) || 0));
      const samples = new Map<string, UnknownSample>();
      records.forEach((r, i) => {
        const id = text(r.id);
        const y = replicateKeys.map((key) => r[key]).filter((v): v is number => typeof v === 'number');
        const where = `${table.lineWord} ${table.rows[i].line}`;
        if (y.length === 0) errors.push({ field: `rows[${i}].y`, code: 'required', message: `${where}: sample “${id}” has no response.` });
        const sample = samples.get(id) ?? { id, y: [] };
        sample.y.push(...y);
        if (r.dilution !== undefined) {
          if (sample.dilution !== undefined && sample.dilution !== r.dilution) {
            errors.push({
              field: `rows[${i}].dilution`,
              code: 'conflict',
              message: `${where}: sample “${id}” has another dilution factor on an earlier row.`,
            });
          }
          sample.dilution = num(r.dilution);
        }
        samples.set(id, sample);
      });
      return [...samples.values()];
    }
    case 'lowSpikes': {
      const spikes: LowSpikes = { spiked: records.flatMap((r) => (typeof r.spiked === 'number' ? [r.spiked] : [])) };
      if ('blank' in mapping) spikes.blanks = records.flatMap((r) => (r.blank === undefined ? [] : [r.blank as number | null]));
      return [spikes];
    }
  }
}

/** Maps the table's columns onto one study section and reads every row; all errors are reported, nothing is dropped. */
export function importSection(table: ImportTable, section: ImportSection, requested?: Record<string, string | null>): ImportPreviewDto {
  const { mapping, errors } = resolveMapping(section, table.columns, requested);
  const preview = { section, columns: table.columns, mapping, rowCount: table.rows.length };
  if (table.tooManyRows) {
    const message = `The file has more than ${MAX_IMPORT_ROWS.toLocaleString('en-GB')} data rows; split it into smaller files.`;
    return { ...preview, rows: [], errors: [{ field: 'file', code: 'too_many_rows', message }] };
  }
  if (table.rows.length === 0) errors.push({ field: 'file', code: 'empty', message: 'The file has a header but no data rows.' });
  if (errors.length > 0) return { ...preview, rows: [], errors };

  const rowErrors: FieldError[] = [];
  const records = table.rows.map((row, i) => readRow(row, i, section, mapping, table, rowErrors));
  const rows = rowErrors.length === 0 ? buildRows(section, records, mapping, table, rowErrors) : [];
  const shown = rowErrors.slice(0, MAX_ROW_ERRORS);
  if (rowErrors.length > MAX_ROW_ERRORS) {
    shown.push({ field: 'rows', code: 'too_many_errors', message: `…and ${rowErrors.length - MAX_ROW_ERRORS} more errors.` });
  }
  return { ...preview, rows: rowErrors.length === 0 ? rows : [], errors: shown };
}
