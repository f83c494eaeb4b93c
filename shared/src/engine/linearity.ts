import type { LackOfFitResult, MandelResult } from '../result.js';
import { refitRows, type CalibrationFit } from './calibration.js';
import { fQuantile, fUpper } from './distributions.js';
import { fitQuadratic } from './quadratic.js';
import { fitLine, type RegressionCore } from './regression.js';
import { mean } from './stats.js';
import type { Warn } from './warnings.js';

const PARAMETERS: Record<string, number> = { linear: 2, 'linear-through-origin': 1, quadratic: 3 };

/** Mandel's scratch slots: w(x), the straight line's residuals, the quadratic's QR and residuals (five). */
const SCRATCH = { weights: 0, line: 1, quadratic: 2 };

/** Lack-of-fit F test against the pure error of replicated standards (Draper & Smith ch. 2). */
export function lackOfFit(fit: CalibrationFit, warn: Warn): LackOfFitResult | null {
  const p = PARAMETERS[fit.model];
  const core = fit.core;
  if (!core || p === undefined) {
    warn('lackOfFit', 'not_applicable', `no lack-of-fit test for a ${fit.model} calibration`);
    return null;
  }
  const levels = fit.levels;
  const k = levels.keys.length;
  const n = fit.xs.length;
  if (n - k < 1 || k - p < 1) {
    warn('lackOfFit', 'too_few', `the lack-of-fit test needs replicated standards and at least ${p + 1} distinct x`);
    return null;
  }
  let ssPureError = 0;
  const summary = fit.summary;
  if (summary) for (let g = 0; g < k; g++) ssPureError += fit.weightAt(levels.keys[g]) * summary.ss[g];
  else
    for (let g = 0; g < k; g++) {
      const ys = fit.levelYs.subarray(levels.start[g], levels.start[g + 1]);
      const centre = mean(ys);
      const w = fit.weightAt(levels.keys[g]);
      for (let m = 0; m < ys.length; m++) ssPureError += w * (ys[m] - centre) ** 2;
    }
  const dfPureError = n - k;
  const dfLackOfFit = k - p;
  if (ssPureError === 0) {
    warn('lackOfFit', 'no_pure_error', 'the replicates agree exactly, so lack of fit cannot be tested');
    return null;
  }
  const ssLackOfFit = Math.max(0, core.ssResidual - ssPureError);
  const F = ssLackOfFit / dfLackOfFit / (ssPureError / dfPureError);
  const pValue = fUpper(F, dfLackOfFit, dfPureError);
  return {
    ssPureError,
    dfPureError,
    ssLackOfFit,
    dfLackOfFit,
    F,
    p: pValue,
    critical: fQuantile(fit.confidence, dfLackOfFit, dfPureError),
    significant: pValue < 1 - fit.confidence,
  };
}

/** Mandel's fitting test, straight line against quadratic (ISO 8466-1, DIN 38402-51), at 99 %. */
export function mandel(fit: CalibrationFit, warn: Warn): MandelResult | null {
  if (!fit.core) {
    warn('mandel', 'not_applicable', `no Mandel test for a ${fit.model} calibration`);
    return null;
  }
  const { xs } = fit;
  const n = xs.length;
  if (fit.levels.keys.length < 4 || n < 4) {
    warn('mandel', 'too_few', "Mandel's test needs at least 4 distinct x");
    return null;
  }
  // w(x) at each standard: the fit's own weights except for 1/s², whose fit weighs each standard by its own SD.
  const sameWeights = fit.weighting !== '1/s2';
  const rows = sameWeights ? fit.rows : refitRows(fit, fit.weightAt, SCRATCH.weights);
  // The fit's own core where it is the same least-squares problem (same points, same weights).
  const line =
    fit.model === 'linear' && sameWeights
      ? (fit.core as RegressionCore)
      : fitLine(rows.x, rows.y, rows.w, rows.pooled ? undefined : fit.scratch(SCRATCH.line), rows.pooled);
  const quad =
    fit.model === 'quadratic' && sameWeights
      ? (fit.core as RegressionCore)
      : fitQuadratic(rows.x, rows.y, rows.w, rows.pooled ? undefined : (slot) => fit.scratch(SCRATCH.quadratic + slot), rows.pooled);
  if (quad.ssResidual === 0) {
    warn('mandel', 'exact_fit', "the quadratic passes exactly through the standards; Mandel's F is undefined");
    return null;
  }
  const F = Math.max(0, line.ssResidual - quad.ssResidual) / (quad.ssResidual / (n - 3));
  const critical = fQuantile(0.99, 1, n - 3);
  return {
    F,
    p: fUpper(F, 1, n - 3),
    df: [1, n - 3],
    sYXLinear: line.s,
    sYXQuadratic: quad.s,
    critical,
    significant: F > critical,
  };
}
