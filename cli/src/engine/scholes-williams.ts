// Scholes–Williams (1977, Journal of Financial Economics 5(3)) beta for non-synchronous prices:
// β_SW = (b⁻ + b⁰ + b⁺) / (1 + 2ρ_m), with b⁻, b⁰, b⁺ the slopes of three simple regressions of the
// security's excess return on the market's at t − 1, t and t + 1.
//
// Choices (documented in the engine's notes):
// - Sample: the common sample of Dimson with k = 1 (window periods t with y[t], m[t−1], m[t], m[t+1]
//   present, t + 1 ≤ the as-of period); all three regressions and ρ_m use exactly these rows.
// - ρ_m: the Pearson correlation of the pairs (m[t], m[t−1]) over those rows (each with its own mean).
// - Standard error: β_SW is linear in y, β_SW = Σ_t W_t y_t / (1 + 2ρ_m) with W_t = Σ_j (x_jt − x̄_j)/S_jj.
//   Holding ρ_m fixed, Var(β_SW) = σ² Σ W_t² / (1 + 2ρ_m)², σ² estimated by the residual variance of the
//   Dimson k = 1 regression on the same rows; t, p and the interval use its n − 4 degrees of freedom.
//   The same reasoning gives se(α) for α = ȳ − β_SW m̄⁰.
// - R², adjusted R², residual sd and SSR describe the line α + β_SW m[t] on those rows (n − 2).
// - 1 + 2ρ_m ≤ 0 (ρ_m ≤ −½) leaves the beta undefined.

import { undefinedEstimate } from './beta-estimate.js';
import { gather, leadLagRows } from './dimson.js';
import { fitMultiple } from './multiple-regression.js';
import { centredSums, sampleMoments, type CentredSums } from './ols.js';
import type { BetaEstimate, IndexRange } from './types.js';

/** Σ_t (1/n − c·W_t)² and Σ_t W_t², with W_t = Σ_j (x_jt − x̄_j)/S_jj. */
function weightSums(columns: readonly Float64Array[], sums: readonly CentredSums[], c: number): [number, number] {
  const n = columns[0].length;
  let alphaWeights = 0, betaWeights = 0;
  for (let t = 0; t < n; t += 1) {
    let w = 0;
    for (let j = 0; j < columns.length; j += 1) w += (columns[j][t] - sums[j].meanX) / sums[j].sxx;
    betaWeights += w * w;
    alphaWeights += (1 / n - c * w) ** 2;
  }
  return [alphaWeights, betaWeights];
}

function lineResidualSumOfSquares(y: Float64Array, x: Float64Array, alpha: number, beta: number): number {
  let ssr = 0;
  for (let t = 0; t < y.length; t += 1) ssr += (y[t] - alpha - beta * x[t]) ** 2;
  return ssr;
}

export function estimateScholesWilliams(y: Float64Array, m: Float64Array, window: IndexRange): BetaEstimate {
  const rows = leadLagRows(y, m, window, 1);
  const n = rows.length, df = n - 4;
  const firstIndex = n > 0 ? rows[0] : -1, lastIndex = n > 0 ? rows[n - 1] : -1;
  if (df < 1) return undefinedEstimate('scholes-williams', n, df, firstIndex, lastIndex);
  const ys = gather(y, rows);
  const columns = [gather(m, rows, -1), gather(m, rows, 0), gather(m, rows, 1)];
  const sums = columns.map((column) => centredSums(ys, column));
  const denominator = 1 + 2 * sampleMoments(columns[1], columns[0]).correlation;
  const joint = fitMultiple(ys, columns);
  if (sums.some((s) => s.flatX) || !(denominator > 0) || joint.rankDeficient) {
    return undefinedEstimate('scholes-williams', n, df, firstIndex, lastIndex);
  }
  const beta = sums.reduce((total, s) => total + s.sxy / s.sxx, 0) / denominator;
  const alpha = sums[1].meanY - beta * sums[1].meanX;
  const sigma2 = joint.residualSd * joint.residualSd;
  const [alphaWeights, betaWeights] = weightSums(columns, sums, sums[1].meanX / denominator);
  const ssr = lineResidualSumOfSquares(ys, columns[1], alpha, beta);
  const rSquared = sums[1].flatY ? NaN : 1 - ssr / sums[1].syy;
  return {
    estimator: 'scholes-williams', n, residualDf: df, firstIndex, lastIndex,
    alpha, alphaSe: Math.sqrt(sigma2 * alphaWeights), beta, betaSe: Math.sqrt(sigma2 * betaWeights) / denominator,
    rSquared, adjRSquared: 1 - ((n - 1) / (n - 2)) * (1 - rSquared), residualSd: Math.sqrt(ssr / (n - 2)), ssr,
  };
}
