import type { UncertaintyResult } from '../uncertainty-types.js';

export interface RoutineUncertainty {
  /** Expanded uncertainty U of the reported (dilution-corrected) result. */
  U: number;
  coverageFactor: number;
  expressedAs: 'absolute' | 'relative';
  /** U in % of the result when it is stated relative. */
  relativePct: number | null;
}

/**
 * U of a routine result from the validation's top-down uncertainty: the absolute U below the
 * level where the validation switches to relative statements, the relative U at and above it
 * (or everywhere when only one of them is given). The level is compared in the measured
 * solution; an absolute U is scaled by the dilution factor, a relative one applies to the result.
 */
export function routineUncertainty(
  validation: Pick<UncertaintyResult, 'coverageFactor' | 'absolute' | 'relative'>,
  measured: number,
  dilution: number,
): RoutineUncertainty | null {
  const { absolute, relative, coverageFactor } = validation;
  const result = measured * dilution;
  const below = absolute?.below ?? relative?.from ?? null;
  const useAbsolute = absolute !== null && (relative === null || (below !== null && measured < below));
  if (useAbsolute) return { U: absolute.U * dilution, coverageFactor, expressedAs: 'absolute', relativePct: null };
  if (relative === null) return null;
  return { U: (Math.abs(result) * relative.UPct) / 100, coverageFactor, expressedAs: 'relative', relativePct: relative.UPct };
}
