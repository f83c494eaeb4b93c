import { headerAliases, type ImportSection } from '@meritline/shared';
import { isNotDetected, parseDecimal } from './parse-number';

export type CellKind = 'number' | 'positive' | 'text' | 'numberOrNotDetected';

export interface GridColumn {
  key: string;
  label: string;
  unit?: string;
  kind: CellKind;
  required?: boolean;
  /** Header words a pasted column may carry for this column. */
  aliases?: readonly string[];
  placeholder?: string;
}

export interface GridRow {
  id: string;
  cells: Record<string, string>;
  /** Standards, blanks, recovery and precision rows: left out of every computation, with the analyst's reason. */
  excluded?: { reason: string; test?: string };
  /** Low-level spike rows hold two results (a spike, a method blank): each is left out on its own, by column key. */
  excludedCells?: Record<string, { reason: string; test?: string }>;
  /** Standards rows: the saved standard preparation the concentration was taken from. */
  preparationId?: string;
}

let lastRowId = 0;
export const newRowId = () => `row-${++lastRowId}`;

export function newRow(cells: Record<string, string> = {}, excluded?: GridRow['excluded']): GridRow {
  return { id: newRowId(), cells, ...(excluded ? { excluded } : {}) };
}

export interface SectionUnits {
  x?: string;
  y?: string;
}

/** The grid columns of each section of the study, in the order a lab sheet usually has them. */
export function sectionColumns(section: ImportSection, units: SectionUnits): GridColumn[] {
  switch (section) {
    case 'standards':
      return [
        {
          key: 'x',
          label: 'Concentration',
          unit: units.x,
          kind: 'number',
          required: true,
          aliases: headerAliases('standards', 'x'),
        },
        { key: 'y', label: 'Response', unit: units.y, kind: 'number', required: true, aliases: headerAliases('standards', 'y') },
      ];
    case 'unknowns':
      return [
        { key: 'id', label: 'Sample', kind: 'text', required: true, aliases: headerAliases('unknowns', 'id') },
        { key: 'y', label: 'Response', unit: units.y, kind: 'number', required: true, aliases: headerAliases('unknowns', 'y') },
        {
          key: 'dilution',
          label: 'Dilution factor',
          kind: 'positive',
          placeholder: '1',
          aliases: headerAliases('unknowns', 'dilution'),
        },
      ];
    case 'blanks':
      return [
        {
          key: 'value',
          label: 'Blank response',
          unit: units.y,
          kind: 'number',
          required: true,
          aliases: headerAliases('blanks', 'value'),
        },
      ];
    case 'lowSpikes':
      return [
        {
          key: 'spiked',
          label: 'Low-level spike result',
          unit: units.x,
          kind: 'number',
          aliases: headerAliases('lowSpikes', 'spiked'),
        },
        {
          key: 'blank',
          label: 'Method blank result',
          unit: units.x,
          kind: 'numberOrNotDetected',
          placeholder: 'ND',
          aliases: headerAliases('lowSpikes', 'blank'),
        },
      ];
    case 'recovery':
      return [
        { key: 'id', label: 'Spike', kind: 'text', placeholder: 'R1', aliases: headerAliases('recovery', 'id') },
        { key: 'level', label: 'Level', kind: 'text', placeholder: 'low', aliases: headerAliases('recovery', 'level') },
        {
          key: 'added',
          label: 'Added',
          unit: units.x,
          kind: 'positive',
          required: true,
          aliases: headerAliases('recovery', 'added'),
        },
        {
          key: 'found',
          label: 'Found',
          unit: units.x,
          kind: 'number',
          required: true,
          aliases: headerAliases('recovery', 'found'),
        },
        {
          key: 'native',
          label: 'Native (before spiking)',
          unit: units.x,
          kind: 'number',
          placeholder: '0',
          aliases: headerAliases('recovery', 'native'),
        },
      ];
    case 'accuracy':
      return [
        { key: 'level', label: 'Level', kind: 'text', required: true, placeholder: 'L1', aliases: headerAliases('accuracy', 'level') },
        {
          key: 'series',
          label: 'Series (day, analyst, instrument)',
          kind: 'text',
          required: true,
          placeholder: 'day 1',
          aliases: headerAliases('accuracy', 'series'),
        },
        {
          key: 'nominal',
          label: 'Nominal',
          unit: units.x,
          kind: 'positive',
          required: true,
          aliases: headerAliases('accuracy', 'nominal'),
        },
        { key: 'found', label: 'Found', unit: units.x, kind: 'number', required: true, aliases: headerAliases('accuracy', 'found') },
      ];
    case 'precision':
      return [
        {
          key: 'group',
          label: 'Series (day, analyst, instrument)',
          kind: 'text',
          required: true,
          aliases: headerAliases('precision', 'group'),
        },
        {
          key: 'value',
          label: 'Result',
          unit: units.x,
          kind: 'number',
          required: true,
          aliases: headerAliases('precision', 'value'),
        },
      ];
  }
}

/** The exclusion of one cell: the row's own, or the cell's in a section whose columns are results of their own. */
export const cellExclusion = (row: GridRow, key: string) => row.excluded ?? row.excludedCells?.[key];

/** How many results a row leaves out: 1 for an excluded row, else its excluded cells. */
export const excludedCount = (row: GridRow) => (row.excluded ? 1 : Object.keys(row.excludedCells ?? {}).length);

export const isBlankRow = (row: GridRow, columns: readonly GridColumn[]) => columns.every((c) => (row.cells[c.key] ?? '').trim() === '');

/** What is wrong with one cell, in words for the cell itself; null when nothing is. */
export function cellProblem(column: GridColumn, text: string | undefined): string | null {
  const value = (text ?? '').trim();
  if (value === '') return column.required ? 'Required' : null;
  if (column.kind === 'text') return null;
  if (column.kind === 'numberOrNotDetected' && isNotDetected(value)) return null;
  const number = parseDecimal(value);
  if (number === null)
    return column.kind === 'numberOrNotDetected' ? `“${value}” is not a number; write ND if not detected` : `“${value}” is not a number`;
  if (column.kind === 'positive' && number <= 0) return 'Must be above zero';
  return null;
}

/** Problems by column key; an empty row has none (it is simply ignored). */
export function rowProblems(row: GridRow, columns: readonly GridColumn[]): Record<string, string> {
  if (isBlankRow(row, columns)) return {};
  const problems: Record<string, string> = {};
  for (const column of columns) {
    const problem = cellProblem(column, row.cells[column.key]);
    if (problem) problems[column.key] = problem;
  }
  return problems;
}
