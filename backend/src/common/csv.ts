import Papa from 'papaparse';

/**
 * Every CSV the application writes goes through here. A cell starting with = + - @, a tab or a carriage return
 * is prefixed with a single quote so a spreadsheet shows it as text instead of running it as a formula.
 */
export function toCsv(rows: Record<string, unknown>[]): string {
  // The byte-order mark lets spreadsheet programs read ± and µ as UTF-8.
  return `\uFEFF${Papa.unparse(rows, { newline: '\r\n', escapeFormulae: /^[=+\-@\t\r]/ })}\r\n`;
}
