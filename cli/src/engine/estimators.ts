// The base estimators of a security's beta, chosen by the run spec (default `ols`).

import { estimateOls } from './beta-estimate.js';
import { estimateDimson } from './dimson.js';
import { estimateScholesWilliams } from './scholes-williams.js';
import type { BaseEstimator, BetaEstimate, IndexRange } from './types.js';

export interface EstimatorOptions {
  readonly estimator: BaseEstimator;
  readonly dimsonLags: number; // k, used by `dimson` only
}

/**
 * The base estimate over a window of aligned excess returns. y and m are the full arrays on the grid;
 * the window's [start, end] is inclusive and end is the as-of period, so lagged market returns may
 * come from before the window but nothing after `end` is read.
 */
export function estimateBeta(y: Float64Array, m: Float64Array, window: IndexRange, options: EstimatorOptions): BetaEstimate {
  switch (options.estimator) {
    case 'ols':
      return estimateOls(y, m, window);
    case 'dimson':
      return estimateDimson(y, m, window, options.dimsonLags);
    case 'scholes-williams':
      return estimateScholesWilliams(y, m, window);
  }
}
