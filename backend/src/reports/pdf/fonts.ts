import { readFileSync } from 'node:fs';
import PDFDocument from 'pdfkit';
import { createRequire } from 'node:module';
import { woffToSfnt } from './woff.js';

const require = createRequire(import.meta.url);

/** IBM Plex Sans ships per-script subsets; the first subset that covers a character draws it. */
const SUBSETS = ['latin', 'latin-ext', 'greek', 'cyrillic', 'cyrillic-ext', 'vietnamese'] as const;
type Subset = (typeof SUBSETS)[number];

export type FontWeight = 'regular' | 'semibold';
const WEIGHT_FILES: Record<FontWeight, number> = { regular: 400, semibold: 600 };

/** Characters no subset carries, spelled with ones that exist. */
const SUBSTITUTES: Record<string, string> = {
  '≤': '<=',
  '≥': '>=',
  '≠': '!=',
  '≈': '~',
  '→': '->',
  '←': '<-',
  '√': 'sqrt',
  '∑': 'sum',
  '‰': ' per mille',
  '\t': ' ',
  // Chemical formulas such as NO₃⁻: no subset has sub- or superscript digits beyond ¹²³, so they print on the line.
  ...Object.fromEntries([...'₀₁₂₃₄₅₆₇₈₉'].map((c, i) => [c, String(i)])),
  ...Object.fromEntries([...'⁴⁵⁶⁷⁸⁹'].map((c, i) => [c, String(i + 4)])),
  '⁰': '0',
  '⁺': '+',
  '⁻': '-',
};

const ranges: Record<Subset, [number, number][]> = (() => {
  // WOFF2 renders nothing in pdfkit, so the .woff files are used; unicode.json lists each subset's coverage.
  const table = require('@fontsource/ibm-plex-sans/unicode.json') as Record<string, string>;
  return Object.fromEntries(
    SUBSETS.map((subset) => [
      subset,
      table[subset].split(',').map((part) => {
        const [from, to] = part.replace(/U\+/g, '').split('-');
        return [parseInt(from, 16), parseInt(to ?? from, 16)] as [number, number];
      }),
    ]),
  ) as Record<Subset, [number, number][]>;
})();

/** A parsed font (fontkit object) that pdfkit accepts in place of a file. */
type ParsedFont = { layout: (...args: unknown[]) => unknown };

const parsedFonts = new Map<string, ParsedFont>();

/**
 * Fonts are unpacked and parsed once per process and shared by every document; each document still
 * embeds its own subset. pdfkit parses the file itself, so a throwaway document lends its parser.
 */
function parsedFont(subset: Subset, weight: FontWeight): ParsedFont {
  const key = `${subset}-${weight}`;
  let font = parsedFonts.get(key);
  if (!font) {
    const file = require.resolve(`@fontsource/ibm-plex-sans/files/ibm-plex-sans-${subset}-${WEIGHT_FILES[weight]}-normal.woff`);
    const parser = new PDFDocument({ autoFirstPage: false }).font(woffToSfnt(readFileSync(file)));
    font = (parser as unknown as { _font: { font: ParsedFont } })._font.font;
    parsedFonts.set(key, font);
  }
  return font;
}

export function fontName(weight: FontWeight, subset: Subset = 'latin'): string {
  return `plex-${weight}-${subset}`;
}

const FONTS = new Map(
  SUBSETS.flatMap((subset) =>
    (Object.keys(WEIGHT_FILES) as FontWeight[]).map((weight) => [fontName(weight, subset), { subset, weight }] as const),
  ),
);
const registered = new WeakMap<PDFKit.PDFDocument, Set<string>>();

/** Makes `name` the current font; a subset is parsed the first time any document needs it and embedded only where used. */
export function selectFont(doc: PDFKit.PDFDocument, name: string): void {
  let names = registered.get(doc);
  if (!names) registered.set(doc, (names = new Set()));
  if (!names.has(name)) {
    const font = FONTS.get(name);
    if (!font) throw new Error(`unknown font ${name}`);
    doc.registerFont(name, parsedFont(font.subset, font.weight) as unknown as Buffer);
    names.add(name);
  }
  doc.font(name);
}

function subsetOf(codePoint: number): Subset {
  return SUBSETS.find((subset) => ranges[subset].some(([from, to]) => codePoint >= from && codePoint <= to)) ?? 'latin';
}

const SUPERSCRIPT_DIGITS = '⁰¹²³⁴⁵⁶⁷⁸⁹';

/** The fonts lack most superscript digits: a power of ten such as 10⁻⁸ prints as 10^-8. */
function plainPowers(text: string): string {
  return text.replace(
    /10([⁻]?[⁰¹²³⁴⁵⁶⁷⁸⁹]+)/g,
    (_match, power: string) => `10^${[...power].map((char) => (char === '⁻' ? '-' : String(SUPERSCRIPT_DIGITS.indexOf(char)))).join('')}`,
  );
}

export function printable(text: string): string {
  return [...plainPowers(text.normalize('NFC'))].map((char) => SUBSTITUTES[char] ?? char).join('');
}

export interface FontRun {
  font: string;
  text: string;
}

/** Splits text into runs that one embedded font can draw; plain Latin text is a single run. */
export function fontRuns(text: string, weight: FontWeight): FontRun[] {
  if (/^[\x20-\x7e\xa0-\xff]*$/.test(text)) return [{ font: fontName(weight), text }];
  const runs: FontRun[] = [];
  for (const char of printable(text)) {
    // Whitespace always comes from the Latin subset: fontkit cannot read the empty space glyph of the other subsets.
    const font = fontName(weight, /\s/.test(char) ? 'latin' : subsetOf(char.codePointAt(0)!));
    const last = runs.at(-1);
    if (last?.font === font) last.text += char;
    else runs.push({ font, text: char });
  }
  return runs.length ? runs : [{ font: fontName(weight), text: '' }];
}
