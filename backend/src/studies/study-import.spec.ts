import { UnsupportedMediaTypeException } from '@nestjs/common';
import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import { MAX_IMPORT_ROWS, readImportTable } from './import-table.js';
import { IMPORT_SECTIONS, type ImportSection } from '@meritline/shared';
import { importSection, importTemplate, normaliseHeader, resolveMapping } from './study-import.js';

const csv = (text: string) => Buffer.from(text, 'utf8');
const preview = async (buffer: Buffer, section: ImportSection, mapping?: Record<string, string | null>) =>
  importSection(await readImportTable(buffer), section, mapping);

async function xlsx(rows: unknown[][]): Promise<Buffer> {
  const workbook = new ExcelJS.Workbook();
  workbook.addWorksheet('Standards').addRows(rows);
  workbook.addWorksheet('Ignored').addRow(['x', 'y']);
  return Buffer.from(await workbook.xlsx.writeBuffer());
}

describe('reading CSV and XLSX files', () => {
  it('should read a comma-separated file and map its headers, units in brackets ignored', async () => {
    const result = await preview(csv('Conc (mg/L),Peak area [µS·min],Vial\n0.5,0.0612,A1\n1.0,0.1218,A2\n'), 'standards');
    expect(result).toEqual({
      section: 'standards',
      columns: ['Conc (mg/L)', 'Peak area [µS·min]', 'Vial'],
      mapping: { x: 'Conc (mg/L)', y: 'Peak area [µS·min]', id: 'Vial' },
      rows: [
        { x: 0.5, y: 0.0612, id: 'A1' },
        { x: 1, y: 0.1218, id: 'A2' },
      ],
      errors: [],
      rowCount: 2,
    });
  });

  it('should read semicolon- and tab-separated files with decimal commas', async () => {
    const semicolon = await preview(csv('\uFEFFconcentration;response\r\n0,5;0,0612\r\n1;0,1218\r\n2,5;3,1e-1\r\n'), 'standards');
    expect(semicolon.errors).toEqual([]);
    expect(semicolon.rows).toEqual([
      { x: 0.5, y: 0.0612 },
      { x: 1, y: 0.1218 },
      { x: 2.5, y: 0.31 },
    ]);
    const tab = await preview(csv('group\tvalue\nday 1\t5,02\nday 2\t4,97\n'), 'precision');
    expect(tab.rows).toEqual([
      { group: 'day 1', value: 5.02 },
      { group: 'day 2', value: 4.97 },
    ]);
  });

  it('should keep decimal points in comma-separated files and not read a decimal comma there', async () => {
    const result = await preview(csv('x,y\n0.5,"0,0612"\n'), 'standards');
    expect(result.errors).toEqual([expect.objectContaining({ field: 'rows[0].y', code: 'not_number' })]);
  });

  it('should skip blank lines and # comment lines but count lines as the user sees them', async () => {
    const result = await preview(csv('# exported from IC-2\nx,y\n\n0.5,0.06\nnot,0.12\n'), 'standards');
    expect(result.rowCount).toBe(2);
    expect(result.errors).toEqual([{ field: 'rows[1].x', code: 'not_number', message: 'Line 5, column “x”: “not” is not a number.' }]);
  });

  it('should read text in the Windows Latin-1 code page as well as UTF-8', async () => {
    const result = await preview(Buffer.from('Conc (µg/kg);Area ratio\n1;0,0121\n', 'latin1'), 'standards');
    expect(result.columns[0]).toBe('Conc (µg/kg)');
    expect(result.rows).toEqual([{ x: 1, y: 0.0121 }]);
  });

  it('should read the first worksheet of an XLSX workbook, with formula results and rich-text headers', async () => {
    const buffer = await xlsx([
      [{ richText: [{ text: 'Conc' }, { text: ' (mg/L)' }] }, 'Absorbance'],
      [1, 0.0523],
      [2, { formula: 'B2*2', result: 0.1046 }],
      [4, '0.2091'],
    ]);
    const result = await preview(buffer, 'standards');
    expect(result).toMatchObject({
      columns: ['Conc (mg/L)', 'Absorbance'],
      mapping: { x: 'Conc (mg/L)', y: 'Absorbance' },
      errors: [],
      rowCount: 3,
    });
    expect(result.rows).toEqual([
      { x: 1, y: 0.0523 },
      { x: 2, y: 0.1046 },
      { x: 4, y: 0.2091 },
    ]);
    const bad = await preview(
      await xlsx([
        ['x', 'y'],
        [1, 'n/a'],
      ]),
      'standards',
    );
    expect(bad.errors).toEqual([{ field: 'rows[0].y', code: 'not_number', message: 'Row 2, column “y”: “n/a” is not a number.' }]);
  });

  it('should refuse files that are neither CSV nor XLSX by their content, whatever their name', async () => {
    const png = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]);
    await expect(readImportTable(png)).rejects.toThrow(UnsupportedMediaTypeException);
    await expect(readImportTable(Buffer.from('%PDF-1.7\n1 0 obj\n'))).rejects.toThrow(/PDF document, not CSV or XLSX/);
    await expect(readImportTable(Buffer.from([0x50, 0x4b, 0x03, 0x04, 1, 2, 3]))).rejects.toThrow(/not a readable Excel workbook/);
    await expect(readImportTable(Buffer.from('x,y\n1,\u0001\u0002\n'))).rejects.toThrow(/binary file/);
    await expect(readImportTable(Buffer.alloc(0))).rejects.toThrow(/empty/);
  });

  it('should stop at the row limit and report too many rows instead of reading on', async () => {
    const text = `x,y\n${'1,2\n'.repeat(MAX_IMPORT_ROWS + 1)}`;
    const started = Date.now();
    const result = await preview(csv(text), 'standards');
    expect(result.errors).toEqual([expect.objectContaining({ field: 'file', code: 'too_many_rows' })]);
    expect(result.rows).toEqual([]);
    expect(Date.now() - started).toBeLessThan(2000);
    expect((await preview(csv(`x,y\n${'1,2\n'.repeat(MAX_IMPORT_ROWS)}`), 'standards')).errors).toEqual([]);
  });
});

describe('mapping headers to study fields', () => {
  it('should normalise headers: case, units in brackets and punctuation', () => {
    expect(normaliseHeader('  Conc. (mg/L) ')).toBe('conc');
    expect(normaliseHeader('Peak Area [µS·min]')).toBe('peak area');
    expect(normaliseHeader('Sample-ID')).toBe('sample id');
    expect(normaliseHeader('Rep.2')).toBe('rep 2');
  });

  it('should read the headers the study grid shows, "Spike" being the spiked sample and not the amount added', () => {
    expect(resolveMapping('recovery', ['Spike', 'Level', 'Added (mg/L)', 'Found (mg/L)', 'Native (mg/L)'])).toMatchObject({
      mapping: { id: 'Spike', level: 'Level', added: 'Added (mg/L)', found: 'Found (mg/L)', native: 'Native (mg/L)' },
      errors: [],
    });
    expect(resolveMapping('lowSpikes', ['Low-level spike result (mg/L)', 'Blank result (mg/L)']).mapping).toEqual({
      spiked: 'Low-level spike result (mg/L)',
      blank: 'Blank result (mg/L)',
    });
  });

  it.each(IMPORT_SECTIONS.map((section) => [section]))('should map every header of the %s template back to its own field', (section) => {
    const header = importTemplate(section as ImportSection)
      .split('\r\n')[0]
      .split(',');
    const { mapping, errors } = resolveMapping(section as ImportSection, header);
    expect(errors).toEqual([]);
    expect(mapping).toEqual(Object.fromEntries(header.map((h) => [h, h])));
  });

  it('should map common header words case-insensitively, and a header that begins with one', () => {
    expect(resolveMapping('standards', ['CONCENTRATION mg/L', 'Signal']).mapping).toEqual({ x: 'CONCENTRATION mg/L', y: 'Signal' });
    expect(resolveMapping('standards', ['Level', 'Height']).mapping).toEqual({ x: 'Level', y: 'Height' });
    expect(resolveMapping('precision', ['Day', 'Result']).mapping).toEqual({ group: 'Day', value: 'Result' });
    expect(resolveMapping('recovery', ['Sample', 'Spike level', 'Added', 'Found', 'Background']).mapping).toEqual({
      id: 'Sample',
      level: 'Spike level',
      added: 'Added',
      found: 'Found',
      native: 'Background',
    });
  });

  it('should take the user’s mapping first and refuse unknown fields and columns', () => {
    const mapping = resolveMapping('standards', ['A', 'B', 'Conc'], { x: 'a', y: 'B' });
    expect(mapping).toEqual({ mapping: { x: 'A', y: 'B' }, errors: [] });
    const refused = resolveMapping('standards', ['A', 'B'], { z: 'A', y: 'C' });
    expect(refused.errors).toEqual([
      expect.objectContaining({ field: 'mapping.z', code: 'unknown_field' }),
      expect.objectContaining({ field: 'mapping.y', code: 'unknown_column', message: 'The file has no column “C”.' }),
      expect.objectContaining({ field: 'mapping.x', code: 'unmapped' }),
      expect.objectContaining({ field: 'mapping.y', code: 'unmapped' }),
    ]);
  });

  it('should name the columns that match nothing when a required field has no column', () => {
    const { errors } = resolveMapping('standards', ['Conc', 'Wavelength']);
    expect(errors).toEqual([
      {
        field: 'mapping.y',
        code: 'unmapped',
        message: 'No column for y (response). Columns that match nothing: “Wavelength”. Choose one in the mapping.',
      },
    ]);
  });
});

describe('building each section in the study format', () => {
  it('should report every bad cell by row and column, and no rows', async () => {
    const result = await preview(csv('x,y\n1,0.1\n,0.2\n3,abc\n'), 'standards');
    expect(result.rows).toEqual([]);
    expect(result.errors).toEqual([
      { field: 'rows[1].x', code: 'required', message: 'Line 3, column “x”: the concentration is missing.' },
      { field: 'rows[2].y', code: 'not_number', message: 'Line 4, column “y”: “abc” is not a number.' },
    ]);
  });

  it('should read blanks from a single column', async () => {
    expect((await preview(csv('Blank\n0.0011\n0.0018\n'), 'blanks')).rows).toEqual([0.0011, 0.0018]);
  });

  it('should number recovery items when the file has no identifier column', async () => {
    const result = await preview(csv('level,added,found\nlow,1,0.98\nhigh,10,10.1\n'), 'recovery');
    expect(result.rows).toEqual([
      { id: 'R1', level: 'low', added: 1, found: 0.98 },
      { id: 'R2', level: 'high', added: 10, found: 10.1 },
    ]);
  });

  it('should gather unknowns from replicate columns and from repeated rows with the same id', async () => {
    const columns = await preview(csv('Sample ID,Response 1,Response 2,Dilution factor\nW-1,0.41,0.42,1\nW-2,0.29,,2\n'), 'unknowns');
    expect(columns.mapping).toEqual({ y1: 'Response 1', y2: 'Response 2', id: 'Sample ID', dilution: 'Dilution factor' });
    expect(columns.rows).toEqual([
      { id: 'W-1', y: [0.41, 0.42], dilution: 1 },
      { id: 'W-2', y: [0.29], dilution: 2 },
    ]);
    const repeated = await preview(csv('id,area\nW-1,0.41\nW-2,0.29\nW-1,0.42\n'), 'unknowns');
    expect(repeated.rows).toEqual([
      { id: 'W-1', y: [0.41, 0.42] },
      { id: 'W-2', y: [0.29] },
    ]);
    const conflict = await preview(csv('id,y,dilution\nW-1,0.41,1\nW-1,0.42,5\n'), 'unknowns');
    expect(conflict.errors).toEqual([expect.objectContaining({ field: 'rows[1].dilution', code: 'conflict' })]);
  });

  it('should read low-level spikes and blanks, a not-detected blank as null', async () => {
    const result = await preview(csv('spiked,blank\n0.21,0.02\n0.18,ND\n0.19,\n0.22,<0.01\n'), 'lowSpikes');
    expect(result.rows).toEqual([{ spiked: [0.21, 0.18, 0.19, 0.22], blanks: [0.02, null, null] }]);
    expect(result.rowCount).toBe(4);
  });

  it('should offer for every section a template that reads back without errors', async () => {
    for (const section of IMPORT_SECTIONS) {
      const template = importTemplate(section);
      expect(template.split('\r\n').filter(Boolean)).toHaveLength(3);
      const result = await preview(csv(template), section);
      expect(result.errors).toEqual([]);
      expect(result.rowCount).toBe(2);
    }
  });
});
