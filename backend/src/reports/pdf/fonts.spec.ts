import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { fontName, fontRuns, printable } from './fonts.js';
import { woffToSfnt } from './woff.js';

const require = createRequire(import.meta.url);

describe('fonts', () => {
  it('should unpack WOFF into a TrueType file whose head table carries the OpenType magic number', () => {
    const woff = readFileSync(require.resolve('@fontsource/ibm-plex-sans/files/ibm-plex-sans-latin-400-normal.woff'));
    const sfnt = woffToSfnt(woff);
    const tables = sfnt.readUInt16BE(4);
    expect(tables).toBe(woff.readUInt16BE(12));
    const records = Array.from({ length: tables }, (_, i) => ({
      tag: sfnt.toString('latin1', 12 + i * 16, 16 + i * 16),
      offset: sfnt.readUInt32BE(20 + i * 16),
    }));
    const head = records.find((r) => r.tag === 'head')!;
    // OpenType specification, 'head' table: magicNumber 0x5F0F3CF5 at byte 12.
    expect(sfnt.readUInt32BE(head.offset + 12)).toBe(0x5f0f3cf5);
    expect(() => woffToSfnt(sfnt)).toThrow(/not a WOFF/);
  });

  it('should draw Latin text with one font and borrow other scripts only for their own letters', () => {
    expect(fontRuns('LOD = 3.3 s/b, 0.5 µg/L', 'regular')).toEqual([{ font: fontName('regular'), text: 'LOD = 3.3 s/b, 0.5 µg/L' }]);
    expect(fontRuns('σ = 21 (Łódź)', 'semibold')).toEqual([
      { font: fontName('semibold', 'greek'), text: 'σ' },
      { font: fontName('semibold'), text: ' = 21 (' },
      { font: fontName('semibold', 'latin-ext'), text: 'Ł' },
      { font: fontName('semibold'), text: 'ód' },
      { font: fontName('semibold', 'latin-ext'), text: 'ź' },
      { font: fontName('semibold'), text: ')' },
    ]);
  });

  it('should spell the signs no subset carries with ones that exist', () => {
    expect(printable('r² ≥ 0.995, %RE ≤ 15')).toBe('r² >= 0.995, %RE <= 15');
    expect(printable('1.00 × 10⁻⁸ and 2.5392 × 10⁸')).toBe('1.00 × 10^-8 and 2.5392 × 10^8');
    expect(printable('Nitrate (as NO₃⁻), CO₂')).toBe('Nitrate (as NO3-), CO2');
  });
});
