import type { SlopeControlChart, SlopeControlFlag, SlopeControlPointInput } from '../api/runs.js';

export const MIN_RUNS_FOR_LIMITS = 3;
const RUN_LENGTH = 7;

/**
 * Shewhart chart of the calibration slope: warning limits at mean ± 2 s, action limits at
 * mean ± 3 s, and a drift signal for 7 points in a row on one side of the mean
 * (ISO 7870-2:2023 and common practice in laboratory quality control).
 */
export function slopeControlChart(inputs: readonly SlopeControlPointInput[]): SlopeControlChart {
  const n = inputs.length;
  const slopes = inputs.map((p) => p.slope);
  const mean = n > 0 ? slopes.reduce((a, b) => a + b, 0) / n : null;
  const sd = n > 1 && mean !== null ? Math.sqrt(slopes.reduce((ss, s) => ss + (s - mean) ** 2, 0) / (n - 1)) : null;
  if (n < MIN_RUNS_FOR_LIMITS || mean === null || sd === null) {
    return {
      points: inputs.map((p) => ({ ...p, flags: [] })),
      mean,
      sd,
      limits: null,
      n,
      message: `Control limits need at least ${MIN_RUNS_FOR_LIMITS} accepted runs; this version has ${n}.`,
    };
  }
  let side = 0;
  let streak = 0;
  const points = inputs.map((p) => {
    const flags: SlopeControlFlag[] = [];
    const deviation = Math.abs(p.slope - mean);
    if (deviation > 3 * sd) flags.push('beyondAction');
    else if (deviation > 2 * sd) flags.push('beyondWarning');
    const pointSide = Math.sign(p.slope - mean);
    streak = pointSide !== 0 && pointSide === side ? streak + 1 : pointSide === 0 ? 0 : 1;
    side = pointSide;
    if (streak >= RUN_LENGTH) flags.push('sevenOnOneSide');
    return { ...p, flags };
  });
  const action = points.filter((p) => p.flags.includes('beyondAction')).length;
  const drift = points.some((p) => p.flags.includes('sevenOnOneSide'));
  const signals = [
    action > 0 ? `${action} run${action > 1 ? 's' : ''} beyond the action limits` : null,
    drift ? `${RUN_LENGTH} or more runs in a row on one side of the mean (drift)` : null,
  ].filter((s): s is string => s !== null);
  return {
    points,
    mean,
    sd,
    limits: { warning: [mean - 2 * sd, mean + 2 * sd], action: [mean - 3 * sd, mean + 3 * sd] },
    n,
    message: signals.length > 0 ? `Look into the calibration: ${signals.join('; ')}.` : null,
  };
}
