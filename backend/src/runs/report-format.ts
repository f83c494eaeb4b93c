/** Digits after the decimal point that keep `significant` figures of `value`. */
export function decimalsFor(value: number, significant: number): number {
  if (value === 0 || !Number.isFinite(value)) return Math.max(0, significant - 1);
  return Math.max(0, significant - 1 - Math.floor(Math.log10(Math.abs(value))));
}

function fixed(value: number, decimals: number): string {
  const text = value.toFixed(decimals);
  return /^-0(\.0+)?$/.test(text) ? text.slice(1) : text;
}

export function formatSignificant(value: number, significant = 3): string {
  const rounded = Number(value.toPrecision(significant));
  return fixed(rounded, decimalsFor(rounded, significant));
}

export function withUnit(text: string, unit: string | undefined): string {
  return unit ? `${text} ${unit}` : text;
}

/**
 * "value ± half-width": the half-width to two significant figures and the value to the same
 * decimal place (GUM, JCGM 100:2008 §7.2.6: at most two significant figures for an uncertainty).
 */
export function formatWithInterval(value: number, halfWidth: number, unit?: string): string {
  const half = Number(halfWidth.toPrecision(2));
  const decimals = decimalsFor(half, 2);
  return withUnit(`${fixed(value, decimals)} ± ${fixed(half, decimals)}`, unit);
}

export function formatPct(value: number, decimals = 1): string {
  return `${fixed(value, decimals)} %`;
}
