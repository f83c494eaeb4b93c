/** Least-squares core shared by every regression model: enough to predict, invert and band. */
export interface RegressionCore {
  n: number;
  df: number;
  /** Coefficients in the raw x basis: intercept, slope, curvature (0 when absent). */
  a: number;
  b: number;
  c: number;
  seA: number | null;
  seB: number;
  seC: number | null;
  s: number;
  ssResidual: number;
  /** Centred (or, through the origin, uncentred) weighted total sum of squares of y. */
  ssTotal: number;
  ssRegression: number;
  dfRegression: number;
  xMean: number;
  yMean: number;
  sxx: number;
  sumWeights: number;
  /** One per row (per standard, or per level for rows that stand for levels). */
  residuals: Float64Array;
  /** Variance of the fitted mean response at x divided by s². */
  leverage(x: number): number;
  /** The residual of a standard at (x, y), as the fit computes it for its rows. */
  residualAt(x: number, y: number): number;
}

/**
 * What rows that stand for standard levels leave out: each row is a level (its x, the weighted mean of its responses, the
 * sum of its weights), and the least-squares sums need the number of standards and their weighted squares about their
 * level's mean (SS_residual = SS_within + Σ W (ȳ − ŷ)²), and the plain mean of every standard's x (the quadratic's centre).
 */
export interface Pooled {
  count: number;
  ssWithin: number;
  xCentre: number;
}

// Made outside the fits: a closure over a sum the fit's loop updates would box that sum at every step.
function lineLeverage(sumWeights: number, xMean: number, sxx: number): (at: number) => number {
  return (at) => 1 / sumWeights + ((at - xMean) * (at - xMean)) / sxx;
}

function originLeverage(sxx0: number): (at: number) => number {
  return (at) => (at * at) / sxx0;
}

function lineResidual(xMean: number, yMean: number, b: number): (x: number, y: number) => number {
  return (x, y) => {
    const fitted = b * (x - xMean);
    return cleanResidual(y - yMean - fitted, Math.abs(y) + Math.abs(yMean) + Math.abs(fitted));
  };
}

function originResidual(b: number): (x: number, y: number) => number {
  return (x, y) => {
    const fitted = b * x;
    return cleanResidual(y - fitted, Math.abs(y) + Math.abs(fitted));
  };
}

/** Drops round-off residuals of an exact fit so that s_y/x is exactly zero there. */
export function cleanResidual(e: number, scale: number): number {
  return Math.abs(e) <= 8 * Number.EPSILON * scale ? 0 : e;
}

/** Weighted (w ≡ 1: ordinary) straight-line least squares on centred sums; with `pooled`, the rows stand for levels. */
export function fitLine(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  w: ArrayLike<number>,
  residuals: Float64Array = new Float64Array(x.length),
  pooled: Pooled | null = null,
): RegressionCore {
  const rows = x.length;
  const n = pooled ? pooled.count : rows;
  // Σw, then the weighted means of x and y (two passes each, as weightedMean), with the passes shared.
  let sumWeights = 0;
  let sumX = 0;
  let sumY = 0;
  for (let i = 0; i < rows; i++) {
    sumWeights += w[i];
    sumX += w[i] * x[i];
    sumY += w[i] * y[i];
  }
  const firstX = sumX / sumWeights;
  const firstY = sumY / sumWeights;
  let correctionX = 0;
  let correctionY = 0;
  for (let i = 0; i < rows; i++) {
    correctionX += w[i] * (x[i] - firstX);
    correctionY += w[i] * (y[i] - firstY);
  }
  const xMean = firstX + correctionX / sumWeights;
  const yMean = firstY + correctionY / sumWeights;
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  for (let i = 0; i < rows; i++) {
    const dx = x[i] - xMean;
    const dy = y[i] - yMean;
    sxx += w[i] * dx * dx;
    sxy += w[i] * dx * dy;
    syy += w[i] * dy * dy;
  }
  const b = sxy / sxx;
  const a = yMean - b * xMean;
  let ssResidual = 0;
  for (let i = 0; i < rows; i++) {
    const dy = y[i] - yMean;
    const fitted = b * (x[i] - xMean);
    const e = cleanResidual(dy - fitted, Math.abs(y[i]) + Math.abs(yMean) + Math.abs(fitted));
    residuals[i] = e;
    ssResidual += w[i] * e * e;
  }
  if (pooled) {
    ssResidual += pooled.ssWithin;
    syy += pooled.ssWithin;
  }
  const df = n - 2;
  const s = df > 0 ? Math.sqrt(ssResidual / df) : 0;
  return {
    n,
    df,
    a,
    b,
    c: 0,
    seA: s * Math.sqrt(1 / sumWeights + (xMean * xMean) / sxx),
    seB: s / Math.sqrt(sxx),
    seC: null,
    s,
    ssResidual,
    ssTotal: syy,
    ssRegression: b * sxy,
    dfRegression: 1,
    xMean,
    yMean,
    sxx,
    sumWeights,
    residuals,
    leverage: lineLeverage(sumWeights, xMean, sxx),
    residualAt: lineResidual(xMean, yMean, b),
  };
}

/**
 * Straight line through the origin; R² and the regression SS are uncentred (NIST StRD convention). Unweighted: `counts`
 * only says how many standards each row stands for (with `pooled`, rows are levels; null: one row per standard).
 */
export function fitThroughOrigin(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  residuals: Float64Array = new Float64Array(x.length),
  counts: ArrayLike<number> | null = null,
  pooled: Pooled | null = null,
): RegressionCore {
  const rows = x.length;
  const n = pooled ? pooled.count : rows;
  // The means of x and y (two passes each, as mean) share the passes of the sums and of the residuals.
  let sxx0 = 0;
  let sxy0 = 0;
  let syy0 = 0;
  let sumX = 0;
  let sumY = 0;
  for (let i = 0; i < rows; i++) {
    const c = counts ? counts[i] : 1;
    sxx0 += c * x[i] * x[i];
    sxy0 += c * x[i] * y[i];
    syy0 += c * y[i] * y[i];
    sumX += c * x[i];
    sumY += c * y[i];
  }
  if (pooled) syy0 += pooled.ssWithin;
  const b = sxy0 / sxx0;
  const firstX = sumX / n;
  const firstY = sumY / n;
  let correctionX = 0;
  let correctionY = 0;
  let ssResidual = 0;
  for (let i = 0; i < rows; i++) {
    const c = counts ? counts[i] : 1;
    const fitted = b * x[i];
    const e = cleanResidual(y[i] - fitted, Math.abs(y[i]) + Math.abs(fitted));
    residuals[i] = e;
    ssResidual += c * e * e;
    correctionX += c * (x[i] - firstX);
    correctionY += c * (y[i] - firstY);
  }
  if (pooled) ssResidual += pooled.ssWithin;
  const df = n - 1;
  const s = df > 0 ? Math.sqrt(ssResidual / df) : 0;
  const xMean = n === 0 ? NaN : firstX + correctionX / n;
  const yMean = n === 0 ? NaN : firstY + correctionY / n;
  let sxx = 0;
  for (let i = 0; i < rows; i++) sxx += (counts ? counts[i] : 1) * (x[i] - xMean) * (x[i] - xMean);
  return {
    n,
    df,
    a: 0,
    b,
    c: 0,
    seA: null,
    seB: s / Math.sqrt(sxx0),
    seC: null,
    s,
    ssResidual,
    ssTotal: syy0,
    ssRegression: b * sxy0,
    dfRegression: 1,
    xMean,
    yMean,
    sxx,
    sumWeights: n,
    residuals,
    leverage: originLeverage(sxx0),
    residualAt: originResidual(b),
  };
}
