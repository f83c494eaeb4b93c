import { UnprocessableEntityException, UnsupportedMediaTypeException } from '@nestjs/common';
import ExcelJS from 'exceljs';
import { Unzip, UnzipInflate } from 'fflate';
import Papa from 'papaparse';

export const MAX_IMPORT_BYTES = 5 * 1024 * 1024;
export const MAX_IMPORT_ROWS = 20_000;
/** What the parts of a workbook may expand to; a small file can unpack to gigabytes of XML. */
export const MAX_WORKBOOK_EXPANDED_BYTES = 30 * 1024 * 1024;

export type Cell = string | number | null;

export interface TableRow {
  /** Line of the CSV file or row of the worksheet, as the user sees it. */
  line: number;
  cells: Cell[];
}

export interface ImportTable {
  columns: string[];
  rows: TableRow[];
  /** The file holds more data rows than MAX_IMPORT_ROWS; `rows` stops early. */
  tooManyRows: boolean;
  /** Text cells may use a decimal comma (CSV separated by ; or tab). */
  decimalComma: boolean;
  lineWord: 'Line' | 'Row';
}

const BINARY_SIGNATURES: { bytes: number[]; name: string }[] = [
  { bytes: [0x25, 0x50, 0x44, 0x46], name: 'a PDF document' },
  { bytes: [0x89, 0x50, 0x4e, 0x47], name: 'a PNG image' },
  { bytes: [0xff, 0xd8, 0xff], name: 'a JPEG image' },
  { bytes: [0x47, 0x49, 0x46, 0x38], name: 'a GIF image' },
  { bytes: [0xd0, 0xcf, 0x11, 0xe0], name: 'a legacy Office file (such as .xls)' },
];

const startsWith = (buffer: Buffer, bytes: number[]) => bytes.every((byte, i) => buffer[i] === byte);

function unsupported(what: string) {
  const message = `This file is ${what}, not CSV or XLSX. Export the data as CSV or as an Excel workbook (.xlsx) and try again.`;
  return new UnsupportedMediaTypeException({ statusCode: 415, message, errors: [{ field: 'file', code: 'unsupported_type', message }] });
}

function emptyFile() {
  const message = 'The file is empty.';
  return new UnprocessableEntityException({ statusCode: 422, message, errors: [{ field: 'file', code: 'empty', message }] });
}

function decodeText(buffer: Buffer): string {
  const head = buffer.subarray(0, 64 * 1024);
  if (head.includes(0)) throw unsupported('a binary file');
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(buffer);
  } catch {
    text = new TextDecoder('windows-1252').decode(buffer);
  }
  // eslint-disable-next-line no-control-regex
  if (/[\x01-\x08\x0b\x0e-\x1f\x7f]/.test(text.slice(0, 64 * 1024))) throw unsupported('a binary file');
  return text.replace(/^\uFEFF/, '');
}

const isBlank = (cells: Cell[]) => cells.every((cell) => cell === null || (typeof cell === 'string' && cell.trim() === ''));
const isComment = (cells: Cell[]) => typeof cells[0] === 'string' && cells[0].trim().startsWith('#');

function toTable(lines: TableRow[], limitReached: boolean, decimalComma: boolean, lineWord: ImportTable['lineWord']): ImportTable {
  const meaningful = lines.filter((row) => !isBlank(row.cells) && !isComment(row.cells));
  const [header, ...rows] = meaningful;
  if (!header) throw emptyFile();
  return {
    columns: header.cells.map((cell, i) => (cell === null || String(cell).trim() === '' ? `Column ${i + 1}` : String(cell).trim())),
    rows: rows.slice(0, MAX_IMPORT_ROWS),
    tooManyRows: limitReached || rows.length > MAX_IMPORT_ROWS,
    decimalComma,
    lineWord,
  };
}

/** The header line decides: a tab, else a semicolon, else a comma (data lines may hold decimal commas). */
function separatorOf(text: string): string {
  const header = text.split(/\r?\n/, 50).find((line) => line.trim() !== '' && !line.trim().startsWith('#')) ?? '';
  return header.includes('\t') ? '\t' : header.includes(';') ? ';' : ',';
}

function readCsv(text: string): ImportTable {
  const preview = MAX_IMPORT_ROWS + 1000;
  const delimiter = separatorOf(text);
  const parsed = Papa.parse<string[]>(text, { delimiter, skipEmptyLines: false, preview });
  const lines = parsed.data.map((cells, i) => ({ line: i + 1, cells: cells as Cell[] }));
  return toTable(lines, parsed.data.length >= preview, delimiter !== ',', 'Line');
}

function cellValue(value: unknown): Cell {
  if (value === null || value === undefined) return null;
  if (typeof value === 'number' || typeof value === 'string') return value;
  if (typeof value === 'boolean') return String(value);
  if (value instanceof Date) return value.toISOString();
  if (typeof value === 'object') {
    const v = value as {
      result?: unknown;
      richText?: { text: string }[];
      text?: unknown;
      error?: string;
      formula?: string;
      sharedFormula?: string;
    };
    if ('result' in v && v.result !== undefined) return cellValue(v.result);
    if (v.formula || v.sharedFormula)
      return `formula =${v.formula ?? v.sharedFormula} with no saved result (open the workbook in a spreadsheet program and save it so the values are stored)`;
    if (v.richText) return v.richText.map((part) => part.text).join('');
    if ('text' in v) return cellValue(v.text);
    if (v.error) return v.error;
  }
  return String(value);
}

class ExpandsTooFar extends Error {}

/** Unpacks the archive in small steps, counting, and stops as soon as it grows past the bound. */
function checkExpandedSize(buffer: Buffer): void {
  let expanded = 0;
  const unzip = new Unzip();
  unzip.register(UnzipInflate);
  unzip.onfile = (file) => {
    file.ondata = (error, chunk) => {
      if (error) throw error;
      expanded += chunk.length;
      if (expanded > MAX_WORKBOOK_EXPANDED_BYTES) throw new ExpandsTooFar();
    };
    file.start();
  };
  const step = 4096;
  try {
    for (let at = 0; at < buffer.length; at += step) unzip.push(buffer.subarray(at, at + step), at + step >= buffer.length);
  } catch (error) {
    if (!(error instanceof ExpandsTooFar)) throw unsupported('a ZIP archive that is not a readable Excel workbook');
    const message = `This workbook unpacks to more than ${MAX_WORKBOOK_EXPANDED_BYTES / 1024 / 1024} MB. Save only the sheet with the data, or export it as CSV.`;
    throw new UnprocessableEntityException({ statusCode: 422, message, errors: [{ field: 'file', code: 'too_large', message }] });
  }
}

async function readXlsx(buffer: Buffer): Promise<ImportTable> {
  checkExpandedSize(buffer);
  const workbook = new ExcelJS.Workbook();
  try {
    await workbook.xlsx.load(buffer as unknown as ArrayBuffer);
  } catch {
    throw unsupported('a ZIP archive that is not a readable Excel workbook');
  }
  const sheet = workbook.worksheets[0];
  if (!sheet) {
    const message = 'This ZIP archive holds no Excel worksheet. Upload the workbook (.xlsx) itself or a CSV file.';
    throw new UnprocessableEntityException({ statusCode: 422, message, errors: [{ field: 'file', code: 'no_worksheet', message }] });
  }
  const lines: TableRow[] = [];
  sheet.eachRow({ includeEmpty: false }, (row, rowNumber) => {
    if (lines.length > MAX_IMPORT_ROWS + 1) return;
    const values = Array.isArray(row.values) ? row.values : [];
    lines.push({ line: rowNumber, cells: Array.from({ length: Math.max(values.length - 1, 0) }, (_, i) => cellValue(values[i + 1])) });
  });
  return toTable(lines, false, false, 'Row');
}

/** Reads the first worksheet of an XLSX workbook or a CSV text (separator `,`, `;` or tab) into a header and rows. */
export async function readImportTable(buffer: Buffer): Promise<ImportTable> {
  if (buffer.length === 0) throw emptyFile();
  if (startsWith(buffer, [0x50, 0x4b, 0x03, 0x04])) return readXlsx(buffer);
  const binary = BINARY_SIGNATURES.find((signature) => startsWith(buffer, signature.bytes));
  if (binary) throw unsupported(binary.name);
  return readCsv(decodeText(buffer));
}
