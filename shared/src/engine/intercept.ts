import type { InterceptTestResult, ThroughOriginResult, UnknownResult } from '../result.js';
import { refitRows, type CalibrationFit } from './calibration.js';
import { studentTwoSidedP } from './distributions.js';
import { fitLine, fitThroughOrigin, type RegressionCore } from './regression.js';
import type { Warn } from './warnings.js';

function lineWithIntercept(fit: CalibrationFit): RegressionCore | null {
  if (fit.core && fit.model !== 'linear-through-origin') return fit.core;
  if (fit.xs.length < 3 || fit.levels.keys.length < 2) return null;
  const rows = refitRows(fit, null);
  return fitLine(rows.x, rows.y, rows.w, undefined, rows.pooled);
}

/** Is the intercept distinguishable from zero? t = a/s_a with the fit's residual df. */
export function interceptTest(fit: CalibrationFit, warn: Warn): InterceptTestResult | null {
  const line = lineWithIntercept(fit);
  if (!line || line.seA === null || line.df < 1) {
    warn('interceptTest', 'too_few', 'the intercept test needs at least 3 standards at 2 or more x');
    return null;
  }
  if (line.seA === 0 && line.a !== 0) {
    warn('interceptTest', 'exact_fit', 'the standards lie exactly on a line with an intercept; t is unbounded');
    return null;
  }
  const t = line.seA === 0 ? 0 : line.a / line.seA;
  const p = studentTwoSidedP(t, line.df);
  const xMax = fit.calibration.xMax;
  const top = line.a + line.b * xMax + line.c * xMax * xMax;
  return {
    intercept: line.a,
    seIntercept: line.seA,
    t,
    df: line.df,
    p,
    significant: p < 1 - fit.confidence,
    interceptPctOfTopResponse: top === 0 ? 0 : (100 * line.a) / top,
  };
}

/**
 * The straight line forced through the origin, and what it would change for each unknown:
 * one-point and regression calibrations agree only when the intercept is zero (common practice).
 */
export function throughOrigin(fit: CalibrationFit, unknowns: readonly UnknownResult[], warn: Warn): ThroughOriginResult | null {
  const { xs } = fit;
  if (xs.length < 2 || xs.every((x) => x === 0)) {
    warn('throughOrigin', 'too_few', 'the line through the origin needs at least 2 standards with x above zero');
    return null;
  }
  const rows = refitRows(fit, null, 1);
  const line = fitThroughOrigin(rows.x, rows.y, rows.pooled ? undefined : fit.scratch(0), rows.pooled && rows.w, rows.pooled);
  return {
    slope: line.b,
    seSlope: line.seB,
    sYX: line.s,
    r2: line.ssTotal > 0 ? 1 - line.ssResidual / line.ssTotal : 1,
    df: line.df,
    biasAt: unknowns.map((u) => {
      const x0ThroughOrigin = (u.yMean / line.b) * u.dilution;
      return { id: u.id, x0ThroughOrigin, x0Regression: u.x0, bias: x0ThroughOrigin - u.x0 };
    }),
  };
}
