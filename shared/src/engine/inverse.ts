import { StudyValidationError } from '../errors.js';
import type { Interval, UnknownFlag } from '../result.js';
import type { CalibrationFit } from './calibration.js';
import { mean } from './stats.js';

export interface Prediction {
  m: number;
  yMean: number;
  dilution: number;
  x0: number;
  sX0: number | null;
  ci: Interval | null;
  /** Only the range flags; detection flags are added by the evaluation. */
  flags: UnknownFlag[];
  /** x0 before the dilution factor, for range and detection comparisons. */
  x0Undiluted: number;
}

/**
 * Reads an unknown off the calibration: x0 from the mean of its m responses and, for the
 * regression models, s_x0 by the propagation of the fit's and the readings' variances
 * (Miller & Miller; for a weighted fit the reading's weight is w(x0)).
 */
export function predictUnknown(fit: CalibrationFit, ys: readonly number[], dilution = 1, field = 'unknowns'): Prediction {
  if (ys.length === 0) throw StudyValidationError.single(`${field}.y`, 'empty', 'the unknown has no responses');
  const m = ys.length;
  const yMean = mean(ys);
  const x0 = fit.inverse(yMean);
  if (x0 === null || !Number.isFinite(x0)) {
    throw StudyValidationError.single(
      `${field}.y`,
      'not_invertible',
      `the mean response ${yMean} lies outside the range the ${fit.model} calibration can be inverted over`,
    );
  }
  const { calibration, core } = fit;
  const flags: UnknownFlag[] = [];
  if (x0 < calibration.xMin) flags.push('belowRange');
  if (x0 > calibration.xMax) flags.push('aboveRange');

  let sX0: number | null = null;
  let ci: Interval | null = null;
  if (core && calibration.t !== null) {
    const weightX = fit.weighting === 'none' ? x0 : Math.max(x0, calibration.xMin);
    const w0 = fit.weightAt(weightX);
    const slope = Math.abs(fit.slopeAt(x0));
    sX0 = (core.s / slope) * Math.sqrt(1 / (w0 * m) + core.leverage(x0));
    const half = calibration.t * sX0 * dilution;
    ci = [x0 * dilution - half, x0 * dilution + half];
    sX0 *= dilution;
  }
  return { m, yMean, dilution, x0: x0 * dilution, sX0, ci, flags, x0Undiluted: x0 };
}
