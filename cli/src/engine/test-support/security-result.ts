// A complete SecurityResult for tests that only care about a few fields.

import type { SecurityResult } from '../types.js';

export function securityResult(fields: Partial<SecurityResult> & Pick<SecurityResult, 'id'>): SecurityResult {
  return {
    status: 'ok', n: 60, minimum: 36, firstPeriod: null, lastPeriod: null, estimator: 'ols', baseN: 60, residualDf: 58,
    alpha: 0, alphaSe: NaN, beta: 1, betaSe: 0.1, betaT: NaN, betaP: NaN, betaLow95: NaN, betaHigh95: NaN,
    rSquared: 0.4, adjRSquared: NaN, residualVolatility: NaN, correlation: NaN, securityVolatility: NaN,
    securityVolatilityAnnual: NaN, marketVolatility: NaN, marketVolatilityAnnual: NaN, covariance: NaN, olsBeta: NaN,
    blumeBeta: NaN, vasicekBeta: NaN, adjustedBeta: NaN, jensenAlphaAnnual: NaN, zeroReturnShare: 0, rollingBetaRange: NaN,
    flags: [], ...fields,
  };
}
