import jstat from 'jstat';

const { jStat } = jstat;

/*
 * jStat supplies the starting guesses; the regularised incomplete beta below (modified Lentz
 * continued fraction, Lanczos log-gamma) carries the cdfs and the Newton polish of every
 * quantile to about 1e-14 relative, which jStat's single-precision tolerances do not reach.
 */

const LANCZOS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059, 12.507343278686905,
  -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7,
];
const HALF_LOG_2PI = 0.5 * Math.log(2 * Math.PI);

export function logGamma(x: number): number {
  if (x < 0.5) return Math.log(Math.PI / Math.abs(Math.sin(Math.PI * x))) - logGamma(1 - x);
  const z = x - 1;
  let sum = LANCZOS[0];
  for (let i = 1; i < 9; i++) sum += LANCZOS[i] / (z + i);
  const t = z + 7.5;
  return HALF_LOG_2PI + (z + 0.5) * Math.log(t) - t + Math.log(sum);
}

function logBeta(a: number, b: number): number {
  return logGamma(a) + logGamma(b) - logGamma(a + b);
}

function betaContinuedFraction(x: number, a: number, b: number): number {
  const tiny = 1e-300;
  let c = 1;
  let d = 1 - ((a + b) * x) / (a + 1);
  if (Math.abs(d) < tiny) d = tiny;
  d = 1 / d;
  let h = d;
  for (let m = 1; m <= 5000; m++) {
    const m2 = 2 * m;
    let aa = (m * (b - m) * x) / ((a + m2 - 1) * (a + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + aa / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    h *= d * c;
    aa = (-(a + m) * (a + b + m) * x) / ((a + m2) * (a + m2 + 1));
    d = 1 + aa * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + aa / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const del = d * c;
    h *= del;
    if (Math.abs(del - 1) < 1e-16) break;
  }
  return h;
}

/** Regularised incomplete beta I_x(a, b); xc = 1 − x, passed separately to keep its digits. */
export function incompleteBeta(x: number, a: number, b: number, xc = 1 - x): number {
  if (x <= 0) return 0;
  if (xc <= 0) return 1;
  const front = Math.exp(a * Math.log(x) + b * Math.log(xc) - logBeta(a, b));
  if (x < (a + 1) / (a + b + 2)) return (front * betaContinuedFraction(x, a, b)) / a;
  return 1 - (front * betaContinuedFraction(xc, b, a)) / b;
}

/** 1 − I_x(a, b), computed without cancellation. */
function incompleteBetaComplement(x: number, a: number, b: number, xc = 1 - x): number {
  return incompleteBeta(xc, b, a, x);
}

export function normalCdf(z: number): number {
  return 0.5 * jStat.erfc(-z / Math.SQRT2);
}

/** P(T > t) for Student's t with ν degrees of freedom. */
export function studentUpper(t: number, df: number): number {
  if (!Number.isFinite(t)) return t > 0 ? 0 : 1;
  const t2 = t * t;
  const tail = 0.5 * incompleteBeta(df / (df + t2), df / 2, 0.5, t2 / (df + t2));
  return t >= 0 ? tail : 1 - tail;
}

export function studentCdf(t: number, df: number): number {
  return studentUpper(-t, df);
}

export function studentPdf(t: number, df: number): number {
  return Math.exp(logGamma((df + 1) / 2) - logGamma(df / 2) - 0.5 * Math.log(df * Math.PI) - ((df + 1) / 2) * Math.log1p((t * t) / df));
}

/** Two-sided p-value of a t statistic. */
export function studentTwoSidedP(t: number, df: number): number {
  return Math.min(1, 2 * studentUpper(Math.abs(t), df));
}

/** Quantiles computed once per argument list, kept in maps keyed by the numbers themselves (no key text to format per call). */
type QuantileCache = Map<number, Map<number, Map<number, number>>>;

function recall(cache: QuantileCache, a: number, b: number, c: number): number | undefined {
  return cache.get(a)?.get(b)?.get(c);
}

function remember(cache: QuantileCache, a: number, b: number, c: number, value: number): number {
  let byA = cache.get(a);
  if (!byA) cache.set(a, (byA = new Map()));
  let byB = byA.get(b);
  if (!byB) byA.set(b, (byB = new Map()));
  byB.set(c, value);
  return value;
}

const studentQuantiles: QuantileCache = new Map();
const fQuantiles: QuantileCache = new Map();
const normalQuantiles: QuantileCache = new Map();
const detectionDeltas: QuantileCache = new Map();

/**
 * Solves upper(x) = q for a decreasing upper-tail function by Newton steps from a guess,
 * falling back to bisection on [lo, hi] when a step leaves the bracket.
 */
function solveUpper(upper: (x: number) => number, pdf: (x: number) => number, q: number, guess: number, lo: number, hi: number): number {
  let x = Number.isFinite(guess) && guess > lo && guess < hi ? guess : (lo + hi) / 2;
  let low = lo;
  let high = hi;
  for (let i = 0; i < 200; i++) {
    const diff = upper(x) - q;
    if (diff > 0) low = x;
    else high = x;
    if (diff === 0) return x;
    const step = diff / pdf(x);
    let next = x + step;
    if (!Number.isFinite(next) || next <= low || next >= high) {
      next = Number.isFinite(high) ? (low + high) / 2 : Math.max(2 * x, x + 1);
    }
    if (Math.abs(next - x) <= 1e-15 * Math.abs(next)) return next;
    x = next;
  }
  return x;
}

/** p-quantile of Student's t with ν degrees of freedom. */
export function studentQuantile(p: number, df: number): number {
  if (p === 0.5) return 0;
  if (p < 0.5) return -studentQuantile(1 - p, df);
  return (
    recall(studentQuantiles, p, df, 0) ??
    remember(
      studentQuantiles,
      p,
      df,
      0,
      solveUpper(
        (t) => studentUpper(t, df),
        (t) => studentPdf(t, df),
        1 - p,
        jStat.studentt.inv(p, df),
        0,
        Infinity,
      ),
    )
  );
}

/** P(F > f) for Fisher's F with (d1, d2) degrees of freedom. */
export function fUpper(f: number, d1: number, d2: number): number {
  if (!(f > 0)) return 1;
  if (!Number.isFinite(f)) return 0;
  const denom = d2 + d1 * f;
  return incompleteBeta(d2 / denom, d2 / 2, d1 / 2, (d1 * f) / denom);
}

export function fCdf(f: number, d1: number, d2: number): number {
  if (!(f > 0)) return 0;
  const denom = d2 + d1 * f;
  return incompleteBetaComplement(d2 / denom, d2 / 2, d1 / 2, (d1 * f) / denom);
}

export function fPdf(f: number, d1: number, d2: number): number {
  if (f <= 0) return 0;
  return Math.exp(
    (d1 / 2) * Math.log(d1 / d2) + (d1 / 2 - 1) * Math.log(f) - ((d1 + d2) / 2) * Math.log1p((d1 * f) / d2) - logBeta(d1 / 2, d2 / 2),
  );
}

/** p-quantile of Fisher's F with (d1, d2) degrees of freedom. */
export function fQuantile(p: number, d1: number, d2: number): number {
  return (
    recall(fQuantiles, p, d1, d2) ??
    remember(
      fQuantiles,
      p,
      d1,
      d2,
      solveUpper(
        (f) => fUpper(f, d1, d2),
        (f) => fPdf(f, d1, d2),
        1 - p,
        jStat.centralF.inv(p, d1, d2),
        0,
        Infinity,
      ),
    )
  );
}

export function normalQuantile(p: number): number {
  const known = recall(normalQuantiles, p, 0, 0);
  if (known !== undefined) return known;
  let z = jStat.normal.inv(p, 0, 1);
  for (let i = 0; i < 3; i++) {
    const pdf = Math.exp(-0.5 * z * z) / Math.sqrt(2 * Math.PI);
    z -= (normalCdf(z) - p) / pdf;
  }
  return remember(normalQuantiles, p, 0, 0, z);
}

/**
 * Cdf of the non-central t distribution, P(T(ν, δ) ≤ x), by the Poisson-weighted series of
 * incomplete beta functions (Lenth, Applied Statistics AS 243, 1989).
 */
export function noncentralTCdf(x: number, df: number, delta: number): number {
  if (delta === 0) return studentCdf(x, df);
  if (x < 0) return 1 - noncentralTCdf(-x, df, -delta);
  const y = (x * x) / (x * x + df);
  const yc = df / (x * x + df);
  const lambda = (delta * delta) / 2;
  let sum = 0;
  let logPoisson = -lambda;
  let logQ = -lambda - 0.5 * Math.LN2 - logGamma(1.5);
  const logAbsDelta = Math.log(Math.abs(delta));
  const sign = Math.sign(delta);
  for (let j = 0; j < 10000; j++) {
    if (j > 0) {
      logPoisson += Math.log(lambda / j);
      logQ += Math.log(lambda / (j + 0.5));
    }
    const term =
      Math.exp(logPoisson) * incompleteBeta(y, j + 0.5, df / 2, yc) +
      sign * Math.exp(logQ + logAbsDelta) * incompleteBeta(y, j + 1, df / 2, yc);
    sum += term;
    if (j > lambda && Math.abs(term) < 1e-17 && Math.exp(logPoisson) < 1e-17) break;
  }
  return Math.min(1, Math.max(0, normalCdf(-delta) + 0.5 * sum));
}

/** Finds a root of f in [lo, hi] (f(lo), f(hi) of opposite sign) by Brent's method. */
export function brentRoot(f: (x: number) => number, lo: number, hi: number, tol = 1e-15): number {
  let a = lo;
  let b = hi;
  let fa = f(a);
  let fb = f(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (Math.sign(fa) === Math.sign(fb)) throw new RangeError('root not bracketed');
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let i = 0; i < 200; i++) {
    if (Math.sign(fb) === Math.sign(fc)) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol1 = 2 * Number.EPSILON * Math.abs(b) + 0.5 * tol;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol1 || fb === 0) return b;
    if (Math.abs(e) >= tol1 && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol1 * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = d;
      }
    } else {
      d = m;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol1 ? d : m > 0 ? tol1 : -tol1;
    fb = f(b);
  }
  return b;
}

/**
 * Non-centrality δ with P(T(ν, δ) ≤ t(1 − α; ν)) = β: the ISO 11843-2 factor for the
 * minimum detectable value.
 */
export function detectionDelta(df: number, alpha: number, beta: number): number {
  const known = recall(detectionDeltas, df, alpha, beta);
  if (known !== undefined) return known;
  const tc = studentQuantile(1 - alpha, df);
  const g = (delta: number) => noncentralTCdf(tc, df, delta) - beta;
  let hi = 2 * tc + 2;
  while (g(hi) > 0) hi *= 2;
  return remember(detectionDeltas, df, alpha, beta, brentRoot(g, 0, hi, 1e-14));
}
