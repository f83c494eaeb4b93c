import { withUnit } from '../catalogue/format.js';

/**
 * The number rules of routine results as reported: the value rounded to its significant figures before it
 * is printed, so trailing zeros that are significant stay (0.50, 12.0).
 */

/** Digits after the decimal point that keep `significant` figures of `value`. */
export function runDecimalsFor(value: number, significant: number): number {
  if (value === 0 || !Number.isFinite(value)) return Math.max(0, significant - 1);
  return Math.max(0, significant - 1 - Math.floor(Math.log10(Math.abs(value))));
}

function fixed(value: number, decimals: number): string {
  const text = value.toFixed(decimals);
  return /^-0(\.0+)?$/.test(text) ? text.slice(1) : text;
}

export function formatRunSignificant(value: number, significant = 3): string {
  const rounded = Number(value.toPrecision(significant));
  return fixed(rounded, runDecimalsFor(rounded, significant));
}

/**
 * "value ± half-width": the half-width to two significant figures and the value to the same
 * decimal place (GUM, JCGM 100:2008 §7.2.6: at most two significant figures for an uncertainty).
 */
export function formatRunInterval(value: number, halfWidth: number, unit?: string): string {
  const half = Number(halfWidth.toPrecision(2));
  const decimals = runDecimalsFor(half, 2);
  return withUnit(`${fixed(value, decimals)} ± ${fixed(half, decimals)}`, unit);
}

export function formatRunPct(value: number, decimals = 1): string {
  return `${fixed(value, decimals)} %`;
}
