/** Non-numerical results a lab writes for a blank: "ND", "n.d.", "not detected", "<0.05". */
const NOT_DETECTED = /^(nd|n\.d\.?|not detected|bdl|<.*)$/i;

const PLAIN_NUMBER = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/;

/**
 * A number as people type or paste it from a spreadsheet: decimal point or decimal comma
 * ("0,512"), spaces or thin spaces between thousands, a typographic minus, exponent notation.
 * Null when the text is not one number.
 */
export function parseDecimal(input: string): number | null {
  let text = input
    .trim()
    .replace(/^"(.*)"$/, '$1')
    .replace(/[\s\u00a0\u202f\u2009]/g, '')
    .replace(/\u2212/g, '-');
  if (text === '') return null;
  const comma = text.lastIndexOf(',');
  const dot = text.lastIndexOf('.');
  if (comma >= 0 && dot >= 0) {
    // Both present: the later one is the decimal separator, the other groups thousands.
    text = comma > dot ? text.replace(/\./g, '').replace(',', '.') : text.replace(/,/g, '');
  } else if (comma >= 0) {
    if (text.indexOf(',') !== comma) return null;
    text = text.replace(',', '.');
  }
  if (!PLAIN_NUMBER.test(text)) return null;
  const value = Number(text);
  return Number.isFinite(value) ? value : null;
}

export function isNotDetected(input: string): boolean {
  return NOT_DETECTED.test(input.trim());
}
