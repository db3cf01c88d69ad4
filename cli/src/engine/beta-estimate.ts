// Building blocks shared by the base estimators: the empty estimate and the OLS one.

import { centredSums, fitOlsFromSums } from './ols.js';
import type { BaseEstimator, BetaEstimate, IndexRange } from './types.js';

/** An estimate with every number NaN (too few observations, or a degenerate sample). */
export function undefinedEstimate(estimator: BaseEstimator, n: number, residualDf: number, firstIndex = -1, lastIndex = -1): BetaEstimate {
  return {
    estimator, n, residualDf, firstIndex, lastIndex,
    alpha: NaN, alphaSe: NaN, beta: NaN, betaSe: NaN, rSquared: NaN, adjRSquared: NaN, residualSd: NaN, ssr: NaN,
  };
}

/** The window's plain OLS regression of y on m (pairwise-complete, n − 2 degrees of freedom). */
export function estimateOls(y: Float64Array, m: Float64Array, window: IndexRange): BetaEstimate {
  const sums = centredSums(y, m, window);
  const fit = fitOlsFromSums(y, m, sums);
  return {
    estimator: 'ols', n: fit.n, residualDf: fit.n - 2, firstIndex: sums.firstIndex, lastIndex: sums.lastIndex,
    alpha: fit.alpha, alphaSe: fit.alphaSe, beta: fit.beta, betaSe: fit.betaSe,
    rSquared: fit.rSquared, adjRSquared: fit.adjRSquared, residualSd: fit.residualSd, ssr: fit.ssr,
  };
}
