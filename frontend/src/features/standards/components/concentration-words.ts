import { roundToInterval } from '@meritline/shared';

/** "1002.70 ± 0.84 mg/L (u)" with the value rounded to the place of u. */
export function concentrationWords(c: number, u: number, unit: string): string {
  const r = roundToInterval(c, u);
  return `${r.value} ${unit}, u = ${r.halfWidth} ${unit}`;
}
