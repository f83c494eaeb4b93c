import { StudyValidationError, type StudyFieldError } from './errors.js';
import type { StandardPoint } from './study.js';

function parseNumber(text: string, decimalComma: boolean): number {
  const cleaned = text
    .trim()
    .replace(/^"(.*)"$/, '$1')
    .trim();
  if (cleaned === '') return NaN;
  const normalised = decimalComma ? cleaned.replace(',', '.') : cleaned;
  return /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(normalised) ? Number(normalised) : NaN;
}

/**
 * Standards from CSV text with two columns x, y. The first line may be a header. A `;`
 * separator means decimal commas are allowed (`0,5;0,0612`); lines starting with # are skipped.
 */
export function parseStandardsCsv(text: string): StandardPoint[] {
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/);
  const firstData = lines.find((l) => l.trim() !== '' && !l.trim().startsWith('#')) ?? '';
  const separator = firstData.includes(';') ? ';' : firstData.includes('\t') ? '\t' : ',';
  const decimalComma = separator !== ',';
  const errors: StudyFieldError[] = [];
  const standards: StandardPoint[] = [];
  let headerSeen = false;
  lines.forEach((raw, i) => {
    const line = raw.trim();
    if (line === '' || line.startsWith('#')) return;
    const cells = line.split(separator);
    const x = parseNumber(cells[0] ?? '', decimalComma);
    const y = parseNumber(cells[1] ?? '', decimalComma);
    if (!headerSeen && standards.length === 0 && errors.length === 0 && Number.isNaN(x) && Number.isNaN(y)) {
      headerSeen = true;
      return;
    }
    if (cells.length < 2) {
      errors.push({ field: `line ${i + 1}`, code: 'too_few_columns', message: `line ${i + 1} needs two values, x and y` });
      return;
    }
    if (!Number.isFinite(x))
      errors.push({ field: `line ${i + 1}.x`, code: 'not_number', message: `line ${i + 1}: x "${cells[0].trim()}" is not a number` });
    if (!Number.isFinite(y))
      errors.push({ field: `line ${i + 1}.y`, code: 'not_number', message: `line ${i + 1}: y "${cells[1].trim()}" is not a number` });
    if (Number.isFinite(x) && Number.isFinite(y)) standards.push({ x, y });
  });
  if (errors.length === 0 && standards.length === 0) {
    errors.push({ field: 'csv', code: 'empty', message: 'the CSV holds no standards' });
  }
  if (errors.length > 0) throw new StudyValidationError(errors);
  return standards;
}
