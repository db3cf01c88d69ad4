// Simple regression with an intercept, y = α + β x + e, over the pairwise-complete observations of
// an index range (only indices where both y and x are finite enter).
//
// Careful two-pass arithmetic: means first, then centred sums with the correction term of Chan,
// Golub & LeVeque (1983, The American Statistician 37(3)), and the residual sum of squares from the
// residuals themselves (never SSR = Syy − β Sxy, which cancels badly when R² is near 1).
// Standard errors as in any regression text: se(β) = s/√Sxx, se(α) = s·√(1/n + x̄²/Sxx), s² = SSR/(n−2).

import type { IndexRange, OlsFit } from './types.js';

/** Centred sums of a pairwise-complete sample. */
export interface CentredSums {
  readonly n: number;
  readonly meanX: number;
  readonly meanY: number;
  readonly sxx: number; // Σ(x − x̄)²
  readonly syy: number;
  readonly sxy: number;
  readonly flatX: boolean; // x has no variance (zero up to rounding)
  readonly flatY: boolean;
  readonly firstIndex: number; // -1 when n = 0
  readonly lastIndex: number;
}

/** Sample means, variances (n − 1), covariance (n − 1) and correlation. */
export interface SampleMoments {
  readonly n: number;
  readonly meanX: number;
  readonly meanY: number;
  readonly varianceX: number;
  readonly varianceY: number;
  readonly covariance: number;
  readonly correlation: number; // NaN when either series has no variance
}

/** The whole array as an inclusive index range. */
export function fullRange(values: Float64Array): IndexRange {
  return { start: 0, end: values.length - 1 };
}

function checkRange(y: Float64Array, x: Float64Array, range: IndexRange): void {
  if (y.length !== x.length) throw new RangeError(`y has ${y.length} values but x has ${x.length}`);
  if (!Number.isInteger(range.start) || !Number.isInteger(range.end) || range.start < 0 || range.end >= y.length) {
    throw new RangeError(`index range [${range.start}, ${range.end}] does not lie within 0..${y.length - 1}`);
  }
}

/**
 * A variance is treated as zero when the centred sum of squares is within rounding of zero:
 * Σ(v − v̄)² ≤ n·(16 ε max|v|)² (a constant series leaves only rounding residue in v − v̄).
 */
function isFlat(sumSquares: number, n: number, maxAbs: number): boolean {
  const noise = 16 * Number.EPSILON * maxAbs;
  return !(sumSquares > n * noise * noise);
}

export function centredSums(y: Float64Array, x: Float64Array, range: IndexRange = fullRange(y)): CentredSums {
  checkRange(y, x, range);
  let n = 0, sumX = 0, sumY = 0, maxX = 0, maxY = 0, first = -1, last = -1;
  for (let i = range.start; i <= range.end; i += 1) {
    const xi = x[i], yi = y[i];
    if (!Number.isFinite(xi) || !Number.isFinite(yi)) continue;
    n += 1; sumX += xi; sumY += yi;
    maxX = Math.max(maxX, Math.abs(xi)); maxY = Math.max(maxY, Math.abs(yi));
    if (first < 0) first = i;
    last = i;
  }
  if (n === 0) return { n, meanX: NaN, meanY: NaN, sxx: NaN, syy: NaN, sxy: NaN, flatX: true, flatY: true, firstIndex: -1, lastIndex: -1 };
  const mx = sumX / n, my = sumY / n;
  let dx = 0, dy = 0, dxx = 0, dyy = 0, dxy = 0;
  for (let i = first; i <= last; i += 1) {
    const xi = x[i] - mx, yi = y[i] - my;
    if (!Number.isFinite(xi) || !Number.isFinite(yi)) continue;
    dx += xi; dy += yi; dxx += xi * xi; dyy += yi * yi; dxy += xi * yi;
  }
  const sxx = dxx - (dx * dx) / n, syy = dyy - (dy * dy) / n;
  return {
    n, meanX: mx + dx / n, meanY: my + dy / n, sxx, syy, sxy: dxy - (dx * dy) / n,
    flatX: isFlat(sxx, n, maxX), flatY: isFlat(syy, n, maxY), firstIndex: first, lastIndex: last,
  };
}

export function sampleMoments(y: Float64Array, x: Float64Array, range: IndexRange = fullRange(y)): SampleMoments {
  const s = centredSums(y, x, range);
  const d = s.n - 1;
  const correlation = s.flatX || s.flatY ? NaN : Math.max(-1, Math.min(1, s.sxy / Math.sqrt(s.sxx * s.syy)));
  return {
    n: s.n, meanX: s.meanX, meanY: s.meanY,
    varianceX: d > 0 ? s.sxx / d : NaN, varianceY: d > 0 ? s.syy / d : NaN, covariance: d > 0 ? s.sxy / d : NaN,
    correlation,
  };
}

/** Σ (y − ȳ − β (x − x̄))² over the pairwise-complete observations. */
function residualSumOfSquares(y: Float64Array, x: Float64Array, s: CentredSums, beta: number): number {
  let ssr = 0;
  for (let i = s.firstIndex; i <= s.lastIndex; i += 1) {
    const e = y[i] - s.meanY - beta * (x[i] - s.meanX);
    if (Number.isFinite(e)) ssr += e * e;
  }
  return ssr;
}

/** An OLS fit with every estimate NaN (too few observations, or x without variance). */
export function undefinedOlsFit(n: number): OlsFit {
  return { n, alpha: NaN, beta: NaN, alphaSe: NaN, betaSe: NaN, rSquared: NaN, adjRSquared: NaN, residualSd: NaN, ssr: NaN };
}

/** The fit from centred sums already computed on (y, x). */
export function fitOlsFromSums(y: Float64Array, x: Float64Array, s: CentredSums): OlsFit {
  if (s.n < 2 || s.flatX) return undefinedOlsFit(s.n);
  const beta = s.sxy / s.sxx;
  const alpha = s.meanY - beta * s.meanX;
  const ssr = residualSumOfSquares(y, x, s, beta);
  const df = s.n - 2;
  const variance = df > 0 ? ssr / df : NaN;
  const rSquared = s.flatY ? NaN : 1 - ssr / s.syy;
  return {
    n: s.n, alpha, beta,
    alphaSe: Math.sqrt(variance * (1 / s.n + (s.meanX * s.meanX) / s.sxx)),
    betaSe: Math.sqrt(variance / s.sxx),
    rSquared, adjRSquared: df > 0 ? 1 - ((s.n - 1) / df) * (1 - rSquared) : NaN,
    residualSd: Math.sqrt(variance), ssr,
  };
}

/** OLS of y on x with an intercept over the pairwise-complete observations in `range`. */
export function fitOls(y: Float64Array, x: Float64Array, range: IndexRange = fullRange(y)): OlsFit {
  return fitOlsFromSums(y, x, centredSums(y, x, range));
}
