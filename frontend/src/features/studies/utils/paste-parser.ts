import Papa from 'papaparse';
import { parseDecimal } from './parse-number';

export interface PastedTable {
  /** The first row, when it names the columns rather than holding data. */
  header: string[] | null;
  rows: string[][];
}

/**
 * Spreadsheets copy cells as tab-separated lines. Without a tab, a semicolon separates (the CSV of
 * decimal-comma locales); a comma only when the numbers use decimal points, else "0,512" would split.
 */
function chooseDelimiter(text: string): string {
  if (text.includes('\t')) return '\t';
  if (text.includes(';')) return ';';
  const lines = text.split(/\r\n|\n|\r/).filter((line) => line.trim() !== '');
  const commaSeparated = lines.length > 0 && lines.every((line) => /\d\.\d|[a-z]/i.test(line) && line.includes(','));
  return commaSeparated ? ',' : '\t';
}

/** The first row is a header when none of its cells is a number but a later row holds one. */
export function looksLikeHeader(rows: readonly string[][]): boolean {
  if (rows.length < 2) return false;
  const [first, ...rest] = rows;
  const hasNumber = (row: readonly string[]) => row.some((cell) => parseDecimal(cell) !== null);
  return first.some((cell) => cell.trim() !== '') && !hasNumber(first) && rest.some(hasNumber);
}

export function parsePastedTable(text: string): PastedTable {
  const cleaned = text.replace(/^\uFEFF/, '').replace(/(\r\n|\n|\r)+$/, '');
  if (cleaned.trim() === '') return { header: null, rows: [] };
  const parsed = Papa.parse<string[]>(cleaned, { delimiter: chooseDelimiter(cleaned), skipEmptyLines: 'greedy' });
  const rows = parsed.data.map((row) => row.map((cell) => cell.trim()));
  if (looksLikeHeader(rows)) return { header: rows[0], rows: rows.slice(1) };
  return { header: null, rows };
}

export interface ColumnMatchTarget {
  key: string;
  label: string;
  aliases?: readonly string[];
}

const normalise = (text: string) =>
  text
    .toLowerCase()
    .replace(/\(.*?\)|\[.*?\]/g, ' ')
    .replace(/[^a-z0-9]+/g, ' ')
    .trim();

/**
 * Which grid column each pasted column feeds: by header name where the header names one of them,
 * then the grid columns left take the pasted columns left, in order.
 */
export function matchColumns(header: readonly string[] | null, width: number, columns: readonly ColumnMatchTarget[]): (string | null)[] {
  const assigned: (string | null)[] = Array.from({ length: width }, () => null);
  const taken = new Set<string>();
  header?.forEach((name, i) => {
    const n = normalise(name);
    if (!n || i >= width) return;
    const match = columns.find(
      (c) => !taken.has(c.key) && [c.key, c.label, ...(c.aliases ?? [])].some((candidate) => normalise(candidate) === n),
    );
    if (match) {
      assigned[i] = match.key;
      taken.add(match.key);
    }
  });
  const free = columns.filter((c) => !taken.has(c.key));
  for (let i = 0; i < width && free.length > 0; i++) {
    if (assigned[i] === null) assigned[i] = free.shift()!.key;
  }
  return assigned;
}
