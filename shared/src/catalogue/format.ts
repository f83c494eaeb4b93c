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
