import type { PrecisionResultSection } from '../result.js';
import type { PrecisionResult } from '../study.js';
import { fUpper } from './distributions.js';
import { groupBy, mean, sd } from './stats.js';
import type { Warn } from './warnings.js';

/** Horwitz (1980) predicted reproducibility RSD (%); AOAC OMA App. F writes it 2 C^−0.1505 ≈ 2 C^−0.15. */
export function horwitzRsd(massFraction: number): number {
  return 2 ** (1 - 0.5 * Math.log10(massFraction));
}

/**
 * One-way ANOVA of results grouped in series (ISO 5725-2 / -3): repeatability s_r,
 * between-series s_L and intermediate precision s_I. Data are shifted by their first value
 * before any sum, so constant leading digits cost no precision (NIST StRD AtmWtAg).
 */
export function precision(
  rows: readonly PrecisionResult[] | undefined,
  massFraction: number | undefined,
  warn: Warn,
): PrecisionResultSection | null {
  if (!rows || rows.length === 0) {
    warn('precision', 'no_inputs', 'no precision results in the study');
    return null;
  }
  const excluded = rows.flatMap((row, index) =>
    row.excluded ? [{ index, label: row.group, value: row.value, reason: row.excluded.reason }] : [],
  );
  const items = rows.filter((row) => !row.excluded);
  if (excluded.length > 0) {
    const reasons = [...new Set(excluded.map((row) => row.reason))].join('; ');
    warn(
      'precision',
      'excluded',
      `${excluded.length} precision result${excluded.length === 1 ? '' : 's'} excluded by the analyst: ${reasons}`,
    );
  }
  if (items.length === 0) {
    warn('precision', 'all_excluded', 'every precision result is excluded');
    return null;
  }
  const shift = items[0].value;
  const groups = [...groupBy(items, (i) => i.group).entries()].map(([group, list]) => {
    const values = list.map((i) => i.value - shift);
    return { group, values, mean: mean(values) };
  });
  const k = groups.length;
  const N = items.length;
  if (N - k < 1) {
    warn('precision', 'too_few', 'precision needs at least one series with replicate results');
    return null;
  }
  const grand = mean(groups.flatMap((g) => g.values));
  let ssWithin = 0;
  let ssBetween = 0;
  let sumNi2 = 0;
  for (const g of groups) {
    for (const v of g.values) ssWithin += (v - g.mean) ** 2;
    ssBetween += g.values.length * (g.mean - grand) ** 2;
    sumNi2 += g.values.length ** 2;
  }
  const dfWithin = N - k;
  const msWithin = ssWithin / dfWithin;
  const grandMean = grand + shift;
  const sR = Math.sqrt(msWithin);
  const series = groups.map((g) => ({ group: g.group, n: g.values.length, mean: g.mean + shift, sd: sd(g.values) }));
  const rsd = (s: number) => (grandMean === 0 ? null : (100 * s) / Math.abs(grandMean));

  let between: Pick<PrecisionResultSection, 'ssBetween' | 'dfBetween' | 'msBetween' | 'n0' | 'sBetween' | 'F' | 'p'> = {
    ssBetween: null,
    dfBetween: null,
    msBetween: null,
    n0: null,
    sBetween: null,
    F: null,
    p: null,
  };
  let sI = sR;
  if (k >= 2) {
    const dfBetween = k - 1;
    const msBetween = ssBetween / dfBetween;
    const n0 = (N - sumNi2 / N) / dfBetween;
    const sBetween = Math.sqrt(Math.max(0, (msBetween - msWithin) / n0));
    sI = Math.sqrt(msWithin + sBetween * sBetween);
    const F = msWithin > 0 ? msBetween / msWithin : null;
    if (F === null) warn('precision', 'no_scatter', 'the results within each series agree exactly; F is undefined');
    between = { ssBetween, dfBetween, msBetween, n0, sBetween, F, p: F === null ? null : fUpper(F, dfBetween, dfWithin) };
  } else {
    warn('precision', 'one_series', 'one series only: repeatability without a between-series component');
  }
  const rsdI = rsd(sI);
  let horwitz: PrecisionResultSection['horwitz'] = null;
  if (massFraction !== undefined && rsdI !== null) {
    const predictedRsd = horwitzRsd(massFraction);
    horwitz = {
      massFraction,
      predictedRsd,
      horRat: rsdI / predictedRsd,
      horRatRepeatability: (rsd(sR) ?? 0) / predictedRsd,
    };
  }
  return {
    excluded,
    k,
    N,
    grandMean,
    series,
    ...between,
    ssWithin,
    dfWithin,
    msWithin,
    sR,
    sI,
    rsdR: rsd(sR),
    rsdI,
    horwitz,
  };
}
