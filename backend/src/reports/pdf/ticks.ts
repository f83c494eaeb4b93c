/** The "nice" number nearest `value`: 1, 2 or 5 times a power of ten (Heckbert, Graphics Gems, 1990). */
function niceNumber(value: number): number {
  const exponent = Math.floor(Math.log10(value));
  const fraction = value / 10 ** exponent;
  const nice = fraction < 1.5 ? 1 : fraction < 3 ? 2 : fraction < 7 ? 5 : 10;
  return nice * 10 ** exponent;
}

export interface AxisTicks {
  min: number;
  max: number;
  step: number;
  values: number[];
  /** Decimals that show every tick exactly. */
  decimals: number;
}

/** Axis bounds widened to round numbers and about `target` ticks between them. */
export function niceTicks(min: number, max: number, target = 6): AxisTicks {
  if (!Number.isFinite(min) || !Number.isFinite(max)) return niceTicks(0, 1, target);
  if (min === max) {
    const pad = min === 0 ? 1 : Math.abs(min) * 0.1;
    return niceTicks(min - pad, max + pad, target);
  }
  if (min > max) return niceTicks(max, min, target);
  const step = niceNumber((max - min) / Math.max(1, target - 1));
  const lo = Math.floor(min / step + 1e-9) * step;
  const hi = Math.ceil(max / step - 1e-9) * step;
  const decimals = Math.max(0, -Math.floor(Math.log10(step) + 1e-9));
  const values: number[] = [];
  for (let v = lo; v <= hi + step * 1e-6; v += step) values.push(Number(v.toFixed(decimals)));
  return { min: lo, max: hi, step, values, decimals };
}
