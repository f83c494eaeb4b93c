import { cleanResidual, type Pooled, type RegressionCore } from './regression.js';
import type { Scratch } from './stats.js';

/**
 * Math.hypot(a, b) as V8 computes it (divide by the larger magnitude, add the squares, square root, scale back), written
 * out so that the compiler inlines it and keeps the running norm unboxed. Same numbers, bit for bit, special values included.
 */
export function hypot(a: number, b: number): number {
  const x = Math.abs(a);
  const y = Math.abs(b);
  if (x > y) {
    if (x === Infinity) return Infinity;
    const q = y / x;
    return Math.sqrt(1 + q * q) * x;
  }
  if (x === Infinity || y === Infinity) return Infinity;
  if (x !== x || y !== y) return NaN;
  if (y === 0) return 0;
  const p = x / y;
  return Math.sqrt(p * p + 1) * y;
}

/**
 * Householder QR least squares for a tall matrix held by columns (each of length rows; overwritten, as is rhs).
 * Returns the coefficients and the upper-triangular R.
 *
 * Each reflection takes two passes over the rows: one for v·v and every v·target, one for the updates and the next
 * column's norm. Each sum still adds its terms in row order, so the numbers are those of one pass per sum.
 */
function householderLeastSquares(
  columns: Float64Array[],
  rhs: Float64Array,
  firstNorm: number | null = null,
): { beta: number[]; r: number[][] } {
  if (columns.length > 3) throw new RangeError('householderLeastSquares takes at most 3 columns');
  const p = columns.length;
  const m = rhs.length;
  let nextNorm = firstNorm;
  for (let k = 0; k < p; k++) {
    // v is column k with v[k] = column[k] − alpha; the column itself is the last target updated at each row.
    const column = columns[k];
    let norm = 0;
    if (nextNorm !== null) norm = nextNorm;
    else for (let i = k; i < m; i++) norm = hypot(norm, column[i]);
    nextNorm = null;
    if (norm === 0) continue;
    const alpha = column[k] > 0 ? -norm : norm;
    const vk = column[k] - alpha;
    // The other targets: the columns after k, then the right-hand side (one to three arrays).
    const [t0, t1 = null, t2 = null] = [...columns.slice(k + 1), rhs];
    let vv = 0;
    let dotColumn = 0;
    let dot0 = 0;
    let dot1 = 0;
    let dot2 = 0;
    vv += vk * vk;
    dotColumn += vk * column[k];
    dot0 += vk * t0[k];
    if (t1) dot1 += vk * t1[k];
    if (t2) dot2 += vk * t2[k];
    for (let i = k + 1; i < m; i++) {
      const vi = column[i];
      vv += vi * vi;
      dotColumn += vi * vi;
      dot0 += vi * t0[i];
      if (t1) dot1 += vi * t1[i];
      if (t2) dot2 += vi * t2[i];
    }
    if (vv === 0) continue;
    const fColumn = (2 * dotColumn) / vv;
    const f0 = (2 * dot0) / vv;
    const f1 = (2 * dot1) / vv;
    const f2 = (2 * dot2) / vv;
    t0[k] -= f0 * vk;
    if (t1) t1[k] -= f1 * vk;
    if (t2) t2[k] -= f2 * vk;
    column[k] -= fColumn * vk;
    const next = k + 1 < p ? columns[k + 1] : null;
    let following = 0;
    for (let i = k + 1; i < m; i++) {
      const vi = column[i];
      t0[i] -= f0 * vi;
      if (t1) t1[i] -= f1 * vi;
      if (t2) t2[i] -= f2 * vi;
      column[i] -= fColumn * vi;
      if (next) following = hypot(following, next[i]);
    }
    if (next) nextNorm = following;
  }
  const r = Array.from({ length: p }, (_, i) => Array.from({ length: p }, (_, j) => (j >= i ? columns[j][i] : 0)));
  const beta = new Array<number>(p).fill(0);
  for (let i = p - 1; i >= 0; i--) {
    let acc = rhs[i];
    for (let j = i + 1; j < p; j++) acc -= r[i][j] * beta[j];
    beta[i] = acc / r[i][i];
  }
  return { beta, r };
}

function invertUpper(r: number[][]): number[][] {
  const p = r.length;
  const inv = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  for (let j = 0; j < p; j++) {
    inv[j][j] = 1 / r[j][j];
    for (let i = j - 1; i >= 0; i--) {
      let acc = 0;
      for (let k = i + 1; k <= j; k++) acc += r[i][k] * inv[k][j];
      inv[i][j] = -acc / r[i][i];
    }
  }
  return inv;
}

// Made outside fitQuadratic: a closure over `scale`, which its loop updates, would box it at every step.
function quadraticLeverage(centre: number, scale: number, rInv: number[][]): (at: number) => number {
  return (at) => {
    const zz = (at - centre) / scale;
    const v = [1, zz, zz * zz];
    let acc = 0;
    for (let j = 0; j < 3; j++) {
      let u = 0;
      for (let k = 0; k <= j; k++) u += rInv[k][j] * v[k];
      acc += u * u;
    }
    return acc;
  };
}

export interface QuadraticCore extends RegressionCore {
  /** Coefficients in z = (x − centre)/scale: ŷ = c0 + c1 z + c2 z². */
  zCoefficients: [number, number, number];
  centre: number;
  scale: number;
}

function quadraticResidual(centre: number, scale: number, c0: number, c1: number, c2: number): (x: number, y: number) => number {
  return (x, y) => {
    const zi = (x - centre) / scale;
    const fitted = c0 + zi * (c1 + zi * c2);
    return cleanResidual(y - fitted, Math.abs(y) + Math.abs(c0) + Math.abs(c1 * zi) + Math.abs(c2 * zi * zi));
  };
}

/**
 * y = a + b x + c x² by QR on centred and scaled x (weights w; w ≡ 1 for ordinary least squares); with `pooled`, the rows
 * stand for levels. With `scratch`, slots 0–4 hold the QR's columns and the residuals (for a caller that keeps neither).
 */
export function fitQuadratic(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  w: ArrayLike<number>,
  scratch?: Scratch,
  pooled: Pooled | null = null,
): QuadraticCore {
  const rows = x.length;
  const n = pooled ? pooled.count : rows;
  // Σw, the mean of x (the centre) and the weighted means of y and x, two passes each as mean and weightedMean, passes shared.
  let sumWeights = 0;
  let sumX = 0;
  let weightedSumY = 0;
  let weightedSumX = 0;
  for (let i = 0; i < rows; i++) {
    sumWeights += w[i];
    sumX += x[i];
    weightedSumY += w[i] * y[i];
    weightedSumX += w[i] * x[i];
  }
  const firstCentre = sumX / n;
  const firstY = weightedSumY / sumWeights;
  const firstX = weightedSumX / sumWeights;
  let correctionCentre = 0;
  let correctionY = 0;
  let correctionX = 0;
  for (let i = 0; i < rows; i++) {
    correctionCentre += x[i] - firstCentre;
    correctionY += w[i] * (y[i] - firstY);
    correctionX += w[i] * (x[i] - firstX);
  }
  const centre = pooled ? pooled.xCentre : n === 0 ? NaN : firstCentre + correctionCentre / n;
  const yMean = firstY + correctionY / sumWeights;
  const xMean = firstX + correctionX / sumWeights;
  let scale = 0;
  for (let i = 0; i < rows; i++) scale = Math.max(scale, Math.abs(x[i] - centre));
  if (scale === 0) scale = 1;
  const column = (slot: number) => {
    if (!scratch) return new Float64Array(rows);
    const lent = scratch(slot);
    return lent.length === rows ? lent : lent.subarray(0, rows);
  };
  const columns = [column(0), column(1), column(2)];
  const [ones, linear, square] = columns;
  const rhs = column(3);
  // The norm of the first column for the first reflection, in the same pass.
  let firstNorm = 0;
  for (let i = 0; i < rows; i++) {
    const zi = (x[i] - centre) / scale;
    const sw = Math.sqrt(w[i]);
    ones[i] = sw;
    linear[i] = sw * zi;
    square[i] = sw * zi * zi;
    rhs[i] = sw * y[i];
    firstNorm = hypot(firstNorm, sw);
  }
  const { beta, r } = householderLeastSquares(columns, rhs, firstNorm);
  const [c0, c1, c2] = beta;

  const residuals = column(4);
  let ssResidual = 0;
  let ssTotal = 0;
  let sxx = 0;
  for (let i = 0; i < rows; i++) {
    const zi = (x[i] - centre) / scale;
    const fitted = c0 + zi * (c1 + zi * c2);
    const e = cleanResidual(y[i] - fitted, Math.abs(y[i]) + Math.abs(c0) + Math.abs(c1 * zi) + Math.abs(c2 * zi * zi));
    residuals[i] = e;
    ssResidual += w[i] * e * e;
    ssTotal += w[i] * (y[i] - yMean) * (y[i] - yMean);
    sxx += w[i] * (x[i] - xMean) * (x[i] - xMean);
  }
  if (pooled) {
    ssResidual += pooled.ssWithin;
    ssTotal += pooled.ssWithin;
  }
  const df = n - 3;
  const s = df > 0 ? Math.sqrt(ssResidual / df) : 0;

  const m = centre / scale;
  const transform = [
    [1, -m, m * m],
    [0, 1 / scale, (-2 * m) / scale],
    [0, 0, 1 / (scale * scale)],
  ];
  const rInv = invertUpper(r);
  const rowNorm = (row: number[]) => {
    let acc = 0;
    for (let j = 0; j < 3; j++) {
      let v = 0;
      for (let k = 0; k < 3; k++) v += row[k] * rInv[k][j];
      acc += v * v;
    }
    return Math.sqrt(acc);
  };
  const a = c0 - c1 * m + c2 * m * m;
  const b = (c1 - 2 * c2 * m) / scale;
  const c = c2 / (scale * scale);
  return {
    n,
    df,
    a,
    b,
    c,
    seA: s * rowNorm(transform[0]),
    seB: s * rowNorm([0, transform[1][1], transform[1][2]]),
    seC: s * rowNorm([0, 0, transform[2][2]]),
    s,
    ssResidual,
    ssTotal,
    ssRegression: ssTotal - ssResidual,
    dfRegression: 2,
    xMean,
    yMean,
    sxx,
    sumWeights,
    residuals,
    zCoefficients: [c0, c1, c2],
    centre,
    scale,
    leverage: quadraticLeverage(centre, scale, rInv),
    residualAt: quadraticResidual(centre, scale, c0, c1, c2),
  };
}
