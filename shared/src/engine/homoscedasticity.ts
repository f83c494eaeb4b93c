import type { HomoscedasticityResult } from '../result.js';
import { CANDIDATE_WEIGHTINGS, type CandidateWeighting } from '../study.js';
import { sumsAbsRePct, type CalibrationFit } from './calibration.js';
import { fQuantile, fUpper } from './distributions.js';
import { sortedGroups, variance } from './stats.js';
import type { Warn } from './warnings.js';

/**
 * Variance ratio of the highest to the lowest standard level, one-sided at 99 % (common
 * practice), and the weighting with the smallest Σ|%RE| of the back-calculated standards
 * (common practice in bioanalysis).
 */
export function homoscedasticity(fit: CalibrationFit, warn: Warn): HomoscedasticityResult | null {
  if (fit.model !== 'linear' && fit.model !== 'quadratic') {
    warn('homoscedasticity', 'not_applicable', `no weighting check for a ${fit.model} calibration`);
    return null;
  }
  const sorted = sortedGroups(fit.levels);
  const [lowest, highest] = [sorted[0], sorted[sorted.length - 1]];
  const [xLow, xHigh] = [fit.levels.keys[lowest], fit.levels.keys[highest]];
  const { start } = fit.levels;
  const [nLow, nHigh] = [start[lowest + 1] - start[lowest], start[highest + 1] - start[highest]];
  if (nLow < 2 || nHigh < 2) {
    warn('homoscedasticity', 'too_few', 'the variance check needs at least 2 replicates at the lowest and the highest level');
    return null;
  }
  // A fit summarised by level holds each level's squares: what variance() would compute from its values.
  const { summary } = fit;
  const levelVariance = (g: number, n: number) =>
    summary ? summary.ss[g] / (n - 1) : (variance(fit.levelYs.subarray(start[g], start[g + 1])) ?? 0);
  const sLow = levelVariance(lowest, nLow);
  const sHigh = levelVariance(highest, nHigh);
  if (sLow === 0) {
    warn('homoscedasticity', 'no_scatter', 'the replicates at the lowest level agree exactly; the variance ratio is undefined');
    return null;
  }
  const df: [number, number] = [nHigh - 1, nLow - 1];
  const F = sHigh / sLow;
  const critical = fQuantile(0.99, df[0], df[1]);
  // 1/x and 1/x² need every standard above zero.
  const fitted = CANDIDATE_WEIGHTINGS.filter((w) => w === fit.weighting || w === 'none' || fit.calibration.xMin > 0);
  const sums = sumsAbsRePct(fit, fitted);
  const sumAbsRePct = {} as Record<CandidateWeighting, number | null>;
  for (const weighting of CANDIDATE_WEIGHTINGS) {
    const at = fitted.indexOf(weighting);
    sumAbsRePct[weighting] = at < 0 ? null : sums[at];
  }
  let smallest: CandidateWeighting | null = null;
  for (const weighting of CANDIDATE_WEIGHTINGS) {
    const value = sumAbsRePct[weighting];
    if (value !== null && (smallest === null || value < (sumAbsRePct[smallest] as number))) smallest = weighting;
  }
  const significant = F > critical;
  const p = fUpper(F, df[0], df[1]);
  // Weighting is justified by unequal variances, not by a smaller Σ|%RE| alone.
  const recommendedWeighting: CandidateWeighting = significant && smallest !== null ? smallest : 'none';
  return {
    xLow,
    xHigh,
    F,
    df,
    p,
    critical,
    significant,
    recommendedWeighting,
    smallestSumAbsRe: smallest,
    sumAbsRePct,
    advice: weightingAdvice(significant, F, critical, smallest, sumAbsRePct),
  };
}

const WORDS: Record<CandidateWeighting, string> = { none: 'no weighting', '1/x': 'weighting 1/x', '1/x2': 'weighting 1/x²' };

function figure(value: number, digits = 4): string {
  return Number(value.toPrecision(digits)).toString();
}

function weightingAdvice(
  significant: boolean,
  F: number,
  critical: number,
  smallest: CandidateWeighting | null,
  sums: Record<CandidateWeighting, number | null>,
): string {
  const test = `F = ${figure(F)} ${significant ? 'exceeds' : 'does not exceed'} the 99 % decision level ${figure(critical)}`;
  const ranked = CANDIDATE_WEIGHTINGS.filter((w) => sums[w] !== null).sort((a, b) => (sums[a] as number) - (sums[b] as number));
  const listing = ranked.map((w) => `${WORDS[w]} ${figure(sums[w] as number, 3)} %`).join(', ');
  if (significant) {
    return smallest === null
      ? `The variances differ (${test}), but no candidate weighting could be fitted to compare Σ|%RE|.`
      : `The variances differ (${test}): weighting is justified, and ${WORDS[smallest]} gives the smallest Σ|%RE| of the back-calculated standards (${listing}).`;
  }
  const head = `The variance test does not show unequal variances (${test}), so no weighting is recommended.`;
  if (smallest === null || smallest === 'none' || ranked.length < 2) {
    return `${head} Σ|%RE| of the back-calculated standards: ${listing || 'not computable'}.`;
  }
  const best = sums[smallest] as number;
  const unweighted = sums.none;
  const gap =
    unweighted === null
      ? ''
      : ` against ${figure(unweighted, 3)} % unweighted (${figure(unweighted - best, 2)} percentage points, ${figure((100 * (unweighted - best)) / unweighted, 2)} % smaller)`;
  return (
    `${head} ${WORDS[smallest][0].toUpperCase()}${WORDS[smallest].slice(1)} gives the smallest Σ|%RE| of the back-calculated standards, ` +
    `${figure(best, 3)} %${gap}; choosing it rests on that sum alone (${listing}).`
  );
}
