import { newRow, type GridColumn, type GridRow } from './grid-sections';
import { matchColumns, parsePastedTable } from './paste-parser';

/** Whether a paste into one cell carries a table (several cells) rather than one value. */
export const isTablePaste = (text: string) => /[\t\r\n]/.test(text.replace(/(\r\n|\n|\r)+$/, ''));

/**
 * Writes pasted text into the grid from a cell on, as a spreadsheet does: cells to the right
 * and below are overwritten, rows are added as needed. With a header, columns go by name instead.
 */
export function pasteIntoRows(
  rows: readonly GridRow[],
  columns: readonly GridColumn[],
  text: string,
  at: { row: number; column: number },
): { rows: GridRow[]; pasted: number } {
  const table = parsePastedTable(text);
  if (table.rows.length === 0) return { rows: [...rows], pasted: 0 };
  const width = Math.max(...table.rows.map((r) => r.length));
  const targets = table.header
    ? matchColumns(table.header, width, columns)
    : Array.from({ length: width }, (_, i) => columns[at.column + i]?.key ?? null);
  const next = [...rows];
  table.rows.forEach((cells, i) => {
    const index = at.row + i;
    const current = next[index] ?? newRow();
    const updated = { ...current.cells };
    cells.forEach((cell, c) => {
      const key = targets[c];
      if (key) updated[key] = cell;
    });
    next[index] = { ...current, cells: updated };
  });
  return { rows: next, pasted: table.rows.length };
}

/** Rows from a whole pasted table, columns matched by header names or by position. */
export function rowsFromPaste(
  columns: readonly GridColumn[],
  text: string,
): { rows: GridRow[]; header: string[] | null; targets: (string | null)[] } {
  const table = parsePastedTable(text);
  const width = table.rows.length > 0 ? Math.max(...table.rows.map((r) => r.length)) : 0;
  const targets = matchColumns(table.header, width, columns);
  const rows = table.rows.map((cells) => {
    const record: Record<string, string> = {};
    cells.forEach((cell, c) => {
      const key = targets[c];
      if (key) record[key] = cell;
    });
    return newRow(record);
  });
  return { rows, header: table.header, targets };
}
