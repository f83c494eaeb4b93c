import type { RunData } from '@meritline/shared';
import Papa from 'papaparse';

export interface ParsedTable<T> {
  rows: T[];
  /** One message per line that could not be read, e.g. "Line 3: the response “0,4x” is not a number." */
  errors: string[];
}

type Standard = RunData['standards'][number];
type Check = RunData['checks'][number];
type Unknown = RunData['unknowns'][number];

/**
 * Spreadsheets copy cells as tab-separated lines; semicolon-separated text comes from decimal-comma
 * locales, where "0,512" is a number. Commas separate only when neither is present.
 */
function splitLines(text: string): { cells: string[]; line: number }[] {
  const cleaned = text.replace(/^\uFEFF/, '');
  const delimiter = cleaned.includes('\t') ? '\t' : cleaned.includes(';') ? ';' : ',';
  const parsed = Papa.parse<string[]>(cleaned, { delimiter, skipEmptyLines: false });
  return parsed.data
    .map((cells, i) => ({ cells: cells.map((c) => c.trim()), line: i + 1 }))
    .filter(({ cells }) => cells.some((c) => c !== '') && !cells[0].startsWith('#'));
}

/** A number typed or pasted with a decimal point or a decimal comma; null when it is not one. */
export function readNumber(text: string): number | null {
  const plain = text
    .replace(/[\s\u00a0\u202f]/g, '')
    .replace(/\u2212/g, '-')
    .replace(/^(-?\d*),(\d+)$/, '$1.$2');
  if (!/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(plain)) return null;
  return Number(plain);
}

function readTable<T>(
  text: string,
  minCells: number,
  read: (cells: string[], fail: (message: string) => null) => T | null,
): ParsedTable<T> {
  const rows: T[] = [];
  const errors: string[] = [];
  splitLines(text).forEach(({ cells, line }, index) => {
    let message: string | null = null;
    const fail = (m: string) => {
      message = m;
      return null;
    };
    // A first line whose numbers are words is a header row.
    if (index === 0 && readNumber(cells[minCells - 1] ?? '') === null && cells.slice(0, minCells).every((c) => readNumber(c) === null))
      return;
    const row = cells.length < minCells ? fail(`needs at least ${minCells} values`) : read(cells, fail);
    if (row) rows.push(row);
    else errors.push(`Line ${line}: ${message ?? 'could not be read'}.`);
  });
  return { rows, errors };
}

const notNumber = (what: string, text: string) => `the ${what} “${text}” is not a number`;

function responses(cells: string[], fail: (message: string) => null): number[] | null {
  const ys: number[] = [];
  for (const cell of cells) {
    if (cell === '') continue;
    const y = readNumber(cell);
    if (y === null) return fail(notNumber('response', cell));
    ys.push(y);
  }
  return ys.length > 0 ? ys : fail('has no responses');
}

/** "concentration, response[, SD]": one reading per line, replicates on lines of their own. */
export function parseStandards(text: string): ParsedTable<Standard> {
  return readTable(text, 2, (cells, fail) => {
    const x = readNumber(cells[0]);
    const y = readNumber(cells[1]);
    if (x === null) return fail(notNumber('concentration', cells[0]));
    if (y === null) return fail(notNumber('response', cells[1]));
    if (cells[2]) {
      const sd = readNumber(cells[2]);
      if (sd === null || sd <= 0) return fail(`the SD “${cells[2]}” must be a number above zero`);
      return { x, y, sd };
    }
    return { x, y };
  });
}

/** "name, nominal concentration, response[, response …]". */
export function parseChecks(text: string): ParsedTable<Check> {
  return readTable(text, 3, (cells, fail) => {
    const nominal = readNumber(cells[1]);
    if (!cells[0]) return fail('the check standard needs a name');
    if (nominal === null) return fail(notNumber('nominal concentration', cells[1]));
    const y = responses(cells.slice(2), fail);
    return y && { id: cells[0], nominal, y };
  });
}

/** "sample, dilution factor, response[, response …]"; an empty dilution means undiluted. */
export function parseUnknowns(text: string): ParsedTable<Unknown> {
  return readTable(text, 3, (cells, fail) => {
    if (!cells[0]) return fail('the sample needs a name');
    const dilution = cells[1] === '' ? 1 : readNumber(cells[1]);
    if (dilution === null || dilution <= 0) return fail(`the dilution factor “${cells[1]}” must be a number above zero`);
    const y = responses(cells.slice(2), fail);
    return y && { id: cells[0], y, ...(dilution !== 1 ? { dilution } : {}) };
  });
}

/** "name, limit (empty for the validation's LOD), response[, response …]". */
export function parseBlanks(text: string): ParsedTable<NonNullable<RunData['blanks']>[number]> {
  return readTable(text, 3, (cells, fail) => {
    if (!cells[0]) return fail('the method blank needs a name');
    const limit = cells[1] === '' ? undefined : readNumber(cells[1]);
    if (limit === null || (limit !== undefined && limit <= 0))
      return fail(`the limit “${cells[1]}” must be a number above zero, or empty for the LOD`);
    const y = responses(cells.slice(2), fail);
    return y && { id: cells[0], y, ...(limit !== undefined ? { limit } : {}) };
  });
}

/** "name, known value, dilution factor (empty for none), response[, response …]". */
export function parseQcSamples(text: string): ParsedTable<NonNullable<RunData['qcSamples']>[number]> {
  return readTable(text, 4, (cells, fail) => {
    if (!cells[0]) return fail('the QC sample needs a name');
    const known = readNumber(cells[1]);
    if (known === null || known <= 0) return fail(`the known value “${cells[1]}” must be a number above zero`);
    const dilution = cells[2] === '' ? 1 : readNumber(cells[2]);
    if (dilution === null || dilution <= 0) return fail(`the dilution factor “${cells[2]}” must be a number above zero`);
    const y = responses(cells.slice(3), fail);
    return y && { id: cells[0], known, y, ...(dilution !== 1 ? { dilution } : {}) };
  });
}

const line = (cells: (string | number)[]) => cells.join('\t');

/** Back to the tab-separated text the fields hold, e.g. to start a new run from a saved one. */
export function standardsText(standards: RunData['standards']): string {
  return standards.map((s) => line(s.sd !== undefined ? [s.x, s.y, s.sd] : [s.x, s.y])).join('\n');
}

export function checksText(checks: RunData['checks']): string {
  return checks.map((c) => line([c.id, c.nominal, ...c.y])).join('\n');
}

export function unknownsText(unknowns: RunData['unknowns']): string {
  return unknowns.map((u) => line([u.id, u.dilution ?? 1, ...u.y])).join('\n');
}

export function blanksText(blanks: RunData['blanks']): string {
  return (blanks ?? []).map((b) => line([b.id, b.limit ?? '', ...b.y])).join('\n');
}

export function qcSamplesText(qcSamples: RunData['qcSamples']): string {
  return (qcSamples ?? []).map((q) => line([q.id, q.known, q.dilution ?? 1, ...q.y])).join('\n');
}
