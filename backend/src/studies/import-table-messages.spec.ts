import ExcelJS from 'exceljs';
import { strToU8, zipSync } from 'fflate';
import JSZip from 'jszip';
import { describe, expect, it } from 'vitest';
import { MAX_WORKBOOK_EXPANDED_BYTES, readImportTable } from './import-table.js';
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

  it('should refuse a workbook whose parts unpack past the bound, without unpacking all of it', async () => {
    const sheet = new Uint8Array(MAX_WORKBOOK_EXPANDED_BYTES * 2).fill(0x20);
    const buffer = Buffer.from(zipSync({ '[Content_Types].xml': strToU8('<Types/>'), 'xl/worksheets/sheet1.xml': sheet }, { level: 9 }));
    expect(buffer.length).toBeLessThan(MAX_WORKBOOK_EXPANDED_BYTES / 50);
    const error = await readImportTable(buffer).catch((e: unknown) => e as { getStatus(): number; getResponse(): unknown });
    expect((error as { getStatus(): number }).getStatus()).toBe(422);
    expect(JSON.stringify((error as { getResponse(): unknown }).getResponse())).toMatch(/unpacks to more than 30 MB.*"code":"too_large"/);
  }, 30_000);
});
