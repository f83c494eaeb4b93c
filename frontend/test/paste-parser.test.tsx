import { parseDecimal } from '@/features/studies/utils/parse-number';
import { pasteIntoRows, rowsFromPaste } from '@/features/studies/utils/grid-paste';
import { newRow, sectionColumns } from '@/features/studies/utils/grid-sections';
import { looksLikeHeader, parsePastedTable } from '@/features/studies/utils/paste-parser';

// ISO 80000-1 allows either the comma or the point as the decimal sign; laboratories in
// decimal-comma countries paste "0,0612". Spreadsheets put a tab between copied cells and a
// line break between rows (common practice of every spreadsheet clipboard).
const standards = sectionColumns('standards', { x: 'mg/L', y: 'AU' });

describe('parseDecimal', () => {
  it.each([
    ['0.0612', 0.0612],
    ['0,0612', 0.0612],
    [' 12,5 ', 12.5],
    ['1 234,5', 1234.5],
    ['1.234,5', 1234.5],
    ['1,234.5', 1234.5],
    ['−0,25', -0.25],
    ['2,5E-3', 0.0025],
    ['1e3', 1000],
    ['"0,5"', 0.5],
  ])('reads %s as %s', (text, expected) => {
    expect(parseDecimal(text)).toBeCloseTo(expected, 12);
  });

  it.each(['', 'abc', 'n.d.', '<0.05', '1,2,3', '0.5 mg/L', '#DIV/0!', '1..2'])('refuses %s', (text) => {
    expect(parseDecimal(text)).toBeNull();
  });
});

describe('parsePastedTable', () => {
  it('splits tab-separated cells copied from a spreadsheet, with decimal commas', () => {
    const table = parsePastedTable('0,5\t0,0612\r\n1,0\t0,1218\r\n2,0\t0,2431\r\n');
    expect(table.header).toBeNull();
    expect(table.rows).toEqual([
      ['0,5', '0,0612'],
      ['1,0', '0,1218'],
      ['2,0', '0,2431'],
    ]);
  });

  it('takes a first row without numbers as the header', () => {
    const table = parsePastedTable('Conc (mg/L)\tAbsorbance\n0.5\t0.0612\n1\t0.1218');
    expect(table.header).toEqual(['Conc (mg/L)', 'Absorbance']);
    expect(table.rows).toHaveLength(2);
  });

  it('keeps a first row of numbers as data', () => {
    expect(parsePastedTable('0.5\t0.0612\n1\t0.1218').header).toBeNull();
    expect(looksLikeHeader([['R1', 'low', '1,0', '0,98']])).toBe(false);
  });

  it('does not split a single column of decimal-comma values at the comma', () => {
    expect(parsePastedTable('0,0011\n0,0018\n0,0009').rows).toEqual([['0,0011'], ['0,0018'], ['0,0009']]);
  });

  it('reads semicolon-separated lines, as decimal-comma locales export CSV', () => {
    expect(parsePastedTable('x;y\n0,5;0,0612').rows).toEqual([['0,5', '0,0612']]);
  });

  it('reads comma-separated lines when the numbers use decimal points', () => {
    expect(parsePastedTable('x,y\n0.5,0.0612\n1.0,0.1218').rows).toEqual([
      ['0.5', '0.0612'],
      ['1.0', '0.1218'],
    ]);
  });
});

describe('pasting into a grid', () => {
  it('matches header names to the grid columns, whatever their order', () => {
    const { rows, header } = rowsFromPaste(standards, 'Response\tConcentration\n0,0612\t0,5\n0,1218\t1');
    expect(header).toEqual(['Response', 'Concentration']);
    expect(rows.map((row) => row.cells)).toEqual([
      { y: '0,0612', x: '0,5' },
      { y: '0,1218', x: '1' },
    ]);
  });

  it('spreads a block from the cell it lands in, overwriting and adding rows', () => {
    const existing = [newRow({ x: '0.5', y: '0.06' }), newRow({ x: '1', y: '' })];
    const { rows, pasted } = pasteIntoRows(existing, standards, '0,1218\n0,2431\n0,4862', { row: 1, column: 1 });
    expect(pasted).toBe(3);
    expect(rows.map((row) => row.cells)).toEqual([{ x: '0.5', y: '0.06' }, { x: '1', y: '0,1218' }, { y: '0,2431' }, { y: '0,4862' }]);
  });
});
