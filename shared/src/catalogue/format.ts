/**
 * One rule set for every number Meritline shows: on screen, in exports and in signed reports.
 */

/** What a table prints where a figure could not be computed. */
export const NOT_AVAILABLE = '—';

type Num = number | null | undefined;

const SUPERSCRIPTS = '⁰¹²³⁴⁵⁶⁷⁸⁹';
const superscript = (exponent: number) =>
  String(exponent)
    .replace(/-/, '⁻')
    .replace(/\d/g, (digit) => SUPERSCRIPTS[Number(digit)]);

const isNumber = (value: Num): value is number => typeof value === 'number' && Number.isFinite(value);

function decimalsFor(value: number, significant: number): number {
  if (value === 0) return significant - 1;
  return Math.max(0, significant - 1 - Math.floor(Math.log10(Math.abs(value))));
}

function fixed(value: number, decimals: number): string {
  const text = value.toFixed(decimals);
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}

/**
 * A value to `significant` digits, never in exponent form between 1e-4 and 1e7 and never rounding
 * away integer digits (55333.3 at 4 digits prints 55333, not 55330).
 */
export function formatNumber(value: Num, significant = 4): string {
  if (!isNumber(value)) return NOT_AVAILABLE;
  const magnitude = Math.abs(value);
  if (magnitude !== 0 && (magnitude < 1e-4 || magnitude >= 1e7)) {
    const [mantissa, exponent] = value.toExponential(significant - 1).split('e');
    return `${mantissa} × 10${superscript(Number(exponent))}`;
  }
  return fixed(value, decimalsFor(value, significant));
}

/** Nominal values such as concentration levels: as entered, without padding zeros (0.5, not 0.5000). */
export function formatLevel(value: Num): string {
  if (!isNumber(value)) return NOT_AVAILABLE;
  return String(Number(value.toPrecision(6)));
}

/** A percentage's number (for a column headed %): three significant digits, at least one decimal. */
export function formatPercentValue(value: Num, significant = 3): string {
  if (!isNumber(value)) return NOT_AVAILABLE;
  return fixed(value, Math.max(1, decimalsFor(value, significant)));
}

/** "98.7 %". */
export function formatPercent(value: Num, significant = 3): string {
  return withUnit(formatPercentValue(value, significant), '%');
}

export function formatFixed(value: Num, decimals: number): string {
  return isNumber(value) ? fixed(value, decimals) : NOT_AVAILABLE;
}

export function formatInteger(value: Num): string {
  return isNumber(value) ? String(Math.round(value)) : NOT_AVAILABLE;
}

/** p-values to two significant digits; below 0.001 only the bound is meaningful. */
export function formatPValue(p: Num): string {
  if (!isNumber(p)) return NOT_AVAILABLE;
  if (p < 0.001) return '< 0.001';
  return fixed(p, Math.max(3, decimalsFor(p, 2)));
}

/** "p = 0.034" or "p < 0.001", for running text. */
export function pText(p: Num): string {
  const text = formatPValue(p);
  return text.startsWith('<') ? `p ${text}` : `p = ${text}`;
}

/**
 * An estimate with its standard uncertainty: the uncertainty to two significant digits and the
 * estimate to the same decimal place (JCGM 100:2008, GUM 7.2.6). Without an uncertainty, four digits.
 */
export function formatEstimate(value: Num, uncertainty: Num): { value: string; uncertainty: string; decimals: number | null } {
  if (!isNumber(value)) return { value: NOT_AVAILABLE, uncertainty: NOT_AVAILABLE, decimals: null };
  if (!isNumber(uncertainty) || uncertainty <= 0) return { value: formatNumber(value, 5), uncertainty: NOT_AVAILABLE, decimals: null };
  const decimals = decimalsFor(uncertainty, 2);
  return { value: fixed(value, decimals), uncertainty: fixed(uncertainty, decimals), decimals };
}

/** "1.23 to 4.56"; `format` is a number of significant digits or a formatter. */
export function formatInterval(
  interval: readonly [number, number] | null | undefined,
  format: number | ((value: number) => string) = formatNumber,
): string {
  if (!interval || !isNumber(interval[0]) || !isNumber(interval[1])) return NOT_AVAILABLE;
  const one = typeof format === 'number' ? (value: number) => formatNumber(value, format) : format;
  return `${one(interval[0])} to ${one(interval[1])}`;
}

export function withUnit(text: string, unit: string | null | undefined): string {
  return text === NOT_AVAILABLE || !unit ? text : `${text} ${unit}`;
}

function asDate(value: Date | string | null | undefined): Date | null {
  if (!value) return null;
  const date = value instanceof Date ? value : new Date(value);
  return Number.isNaN(date.getTime()) ? null : date;
}

/** ISO 8601 calendar date (UTC): unambiguous for readers in every country. */
export function formatDate(value: Date | string | null | undefined): string {
  const date = asDate(value);
  return date ? date.toISOString().slice(0, 10) : NOT_AVAILABLE;
}

export function formatDateTime(value: Date | string | null | undefined): string {
  const date = asDate(value);
  return date ? `${date.toISOString().slice(0, 16).replace('T', ' ')} UTC` : NOT_AVAILABLE;
}

/**
 * A result rounded to its interval: the half-width to two significant digits and the value to the same
 * decimal place (JCGM 100:2008, 7.2.6, common practice in reporting).
 */
export function roundToInterval(value: number, halfWidth: number): { value: string; halfWidth: string } {
  if (!Number.isFinite(halfWidth) || halfWidth <= 0) return { value: String(Number(value.toPrecision(3))), halfWidth: '0' };
  const exponent = Math.floor(Math.log10(halfWidth));
  const decimals = Math.max(0, 1 - exponent);
  const step = 10 ** (exponent - 1);
  if (decimals > 0) return { value: value.toFixed(decimals), halfWidth: halfWidth.toFixed(decimals) };
  // Interval of 10 or more: round to tens, hundreds… and print no decimals.
  return { value: String(Math.round(value / step) * step), halfWidth: String(Math.round(halfWidth / step) * step) };
}

/** "322.5 ± 3.1 mg/L (calibration confidence interval, 95 %)". */
export function formatWithIntervalWords(value: number, halfWidth: number, unit: string, confidence: number): string {
  const rounded = roundToInterval(value, halfWidth);
  return `${rounded.value} ± ${rounded.halfWidth}${unit ? ` ${unit}` : ''} (calibration confidence interval, ${Math.round(confidence * 100)} %)`;
}

/** R² with enough digits to differ from 1: at least four decimals, then up to the first digit that is not a 9. */
export function formatR2(r2: number): string {
  if (!Number.isFinite(r2)) return '—';
  const gap = 1 - r2;
  if (gap <= 0) return r2.toFixed(4);
  const decimals = Math.min(12, Math.max(4, -Math.floor(Math.log10(gap)) + 1));
  return r2.toFixed(decimals);
}

/** A number to `digits` significant digits, without exponent notation for everyday magnitudes. */
export function formatSignificant(value: number, digits = 3): string {
  if (!Number.isFinite(value)) return '—';
  if (value === 0) return '0';
  const magnitude = Math.floor(Math.log10(Math.abs(value)));
  if (magnitude < -6 || magnitude > 9) return value.toExponential(digits - 1);
  return value.toFixed(Math.max(0, digits - 1 - magnitude));
}
