import ExcelJS from 'exceljs';
import JSZip from 'jszip';
import { describe, expect, it } from 'vitest';
import { readImportTable } from './import-table.js';
import { importSection } from './study-import.js';

describe('import messages that say what is wrong in the file', () => {
  it('should name a formula that has no saved result instead of showing [object Object]', async () => {
    const workbook = new ExcelJS.Workbook();
    const sheet = workbook.addWorksheet('Standards');
    sheet.addRow(['Concentration', 'Response']);
    sheet.addRow([0.5, 0.06]);
    sheet.addRow([1, { formula: 'B2*2' }]);
    const buffer = Buffer.from(await workbook.xlsx.writeBuffer());
    const result = importSection(await readImportTable(buffer), 'standards');
    const messages = JSON.stringify(result);
    expect(messages).not.toContain('[object Object]');
    expect(messages).toContain('formula =B2*2 with no saved result');
  });

  it('should say that a ZIP archive holds no worksheet rather than that the file is empty', async () => {
    const zip = new JSZip();
    zip.file('notes.txt', 'not a workbook');
    const buffer = await zip.generateAsync({ type: 'nodebuffer' });
    const error = await readImportTable(buffer).catch((e: unknown) => e as { getResponse(): { message: string } });
    const message = JSON.stringify((error as { getResponse?: () => unknown }).getResponse?.() ?? String(error));
    expect(message).not.toMatch(/file is empty/);
    expect(message).toMatch(/no Excel worksheet|not a readable Excel workbook/);
  });
});
