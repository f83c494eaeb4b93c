import type { HomoscedasticityResult } from '../result.js';
import { CANDIDATE_WEIGHTINGS, type CandidateWeighting, type StandardPoint } from '../study.js';
import { fitCalibration, type CalibrationFit } from './calibration.js';
import { fQuantile, fUpper } from './distributions.js';
import { groupBy, variance } from './stats.js';
import type { Warn } from './warnings.js';

function sumAbsRe(fit: CalibrationFit): number {
  let total = 0;
  for (const p of fit.calibration.backCalculated) if (p.rePct !== null) total += Math.abs(p.rePct);
  return total;
}

function sumAbsReOrNull(standards: readonly StandardPoint[], fit: CalibrationFit, weighting: CandidateWeighting): number | null {
  try {
    return sumAbsRe(fitCalibration(standards, { model: fit.model, weighting, confidence: fit.confidence }));
  } catch {
    return null;
  }
}

/**
 * Variance ratio of the highest to the lowest standard level, one-sided at 99 % (common
 * practice), and the weighting with the smallest Σ|%RE| of the back-calculated standards
 * (common practice in bioanalysis).
 */
export function homoscedasticity(
  fit: CalibrationFit,
  standards: readonly StandardPoint[],
  warn: Warn,
): HomoscedasticityResult | null {
  if (fit.model !== 'linear' && fit.model !== 'quadratic') {
    warn('homoscedasticity', 'not_applicable', `no weighting check for a ${fit.model} calibration`);
    return null;
  }
  const levels = [...groupBy(fit.points, (p) => p.x).entries()].sort(([a], [b]) => a - b);
  const [xLow, low] = levels[0];
  const [xHigh, high] = levels[levels.length - 1];
  if (low.length < 2 || high.length < 2) {
    warn('homoscedasticity', 'too_few', 'the variance check needs at least 2 replicates at the lowest and the highest level');
    return null;
  }
  const sLow = variance(low.map((p) => p.y)) ?? 0;
  const sHigh = variance(high.map((p) => p.y)) ?? 0;
  if (sLow === 0) {
    warn('homoscedasticity', 'no_scatter', 'the replicates at the lowest level agree exactly; the variance ratio is undefined');
    return null;
  }
  const df: [number, number] = [high.length - 1, low.length - 1];
  const F = sHigh / sLow;
  const critical = fQuantile(0.99, df[0], df[1]);
  const sumAbsRePct = {} as Record<CandidateWeighting, number | null>;
  for (const weighting of CANDIDATE_WEIGHTINGS) {
    sumAbsRePct[weighting] =
      weighting === fit.weighting
        ? sumAbsRe(fit)
        : weighting === 'none' || fit.calibration.xMin > 0
          ? sumAbsReOrNull(standards, fit, weighting)
          : null;
  }
  let recommendedWeighting: CandidateWeighting = 'none';
  for (const weighting of CANDIDATE_WEIGHTINGS) {
    const value = sumAbsRePct[weighting];
    const best = sumAbsRePct[recommendedWeighting];
    if (value !== null && best !== null && value < best) recommendedWeighting = weighting;
  }
  return {
    xLow,
    xHigh,
    F,
    df,
    p: fUpper(F, df[0], df[1]),
    critical,
    significant: F > critical,
    recommendedWeighting,
    sumAbsRePct,
  };
}
