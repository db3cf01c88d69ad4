// Dimson (1979, Journal of Financial Economics 7) beta for thinly traded securities: one regression
// of the security's excess return on the market's at t − k … t + k, beta = the sum of the k·2 + 1
// slopes, its standard error √(1ᵀ V 1) with V the slopes' covariance matrix.
//
// Sample: window periods t (start ≤ t ≤ end) where y[t] and every m[t + d], d = −k…k, are present.
// A lagged market return may come from before the window (t − k ≥ 0); nothing after the as-of
// period (the window's end) is used, so t + k ≤ end and the last k window periods do not enter.

import { undefinedEstimate } from './beta-estimate.js';
import { fitMultiple } from './multiple-regression.js';
import type { BetaEstimate, IndexRange } from './types.js';

function checkLeadLag(y: Float64Array, m: Float64Array, window: IndexRange, lags: number): void {
  if (y.length !== m.length) throw new RangeError(`security has ${y.length} periods but the market has ${m.length}`);
  if (!Number.isInteger(lags) || lags < 0) throw new RangeError(`Dimson lags must be a whole number ≥ 0, got ${lags}`);
  const { start, end } = window;
  if (!Number.isInteger(start) || !Number.isInteger(end) || start < 0 || end >= y.length || start > end) {
    throw new RangeError(`window [${start}, ${end}] does not lie within 0..${y.length - 1}`);
  }
}

/** Grid indices of the common lead-lag sample, ascending. */
export function leadLagRows(y: Float64Array, m: Float64Array, window: IndexRange, lags: number): Int32Array {
  checkLeadLag(y, m, window, lags);
  const first = Math.max(window.start, lags), last = window.end - lags;
  const rows = new Int32Array(Math.max(0, last - first + 1));
  let n = 0;
  for (let t = first; t <= last; t += 1) {
    let present = Number.isFinite(y[t]);
    for (let d = -lags; present && d <= lags; d += 1) present = Number.isFinite(m[t + d]);
    if (present) rows[n++] = t;
  }
  return rows.subarray(0, n);
}

/** Values of `series` at rows + offset, as a compact array. */
export function gather(series: Float64Array, rows: Int32Array, offset = 0): Float64Array {
  const out = new Float64Array(rows.length);
  for (let i = 0; i < rows.length; i += 1) out[i] = series[rows[i] + offset];
  return out;
}

/** Sum of all entries of the slopes' block (rows and columns 1…k) of a (k+1)² covariance. */
function slopeBlockSum(covariance: Float64Array, size: number): number {
  let sum = 0;
  for (let i = 1; i < size; i += 1) for (let j = 1; j < size; j += 1) sum += covariance[i * size + j];
  return sum;
}

export function estimateDimson(y: Float64Array, m: Float64Array, window: IndexRange, lags: number): BetaEstimate {
  const rows = leadLagRows(y, m, window, lags);
  const n = rows.length, regressors = 2 * lags + 1, df = n - regressors - 1;
  const firstIndex = n > 0 ? rows[0] : -1, lastIndex = n > 0 ? rows[n - 1] : -1;
  if (df < 1) return undefinedEstimate('dimson', n, df, firstIndex, lastIndex);
  const columns = Array.from({ length: regressors }, (_, j) => gather(m, rows, j - lags));
  const fit = fitMultiple(gather(y, rows), columns);
  if (fit.rankDeficient) return undefinedEstimate('dimson', n, df, firstIndex, lastIndex);
  const size = regressors + 1;
  let beta = 0;
  for (let j = 1; j < size; j += 1) beta += fit.coefficients[j];
  return {
    estimator: 'dimson', n, residualDf: df, firstIndex, lastIndex,
    alpha: fit.coefficients[0], alphaSe: Math.sqrt(fit.covariance[0]),
    beta, betaSe: Math.sqrt(Math.max(0, slopeBlockSum(fit.covariance, size))),
    rSquared: fit.rSquared, adjRSquared: fit.adjRSquared, residualSd: fit.residualSd, ssr: fit.ssr,
  };
}
