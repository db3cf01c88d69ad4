import { describe, expect, it } from 'vitest';
import { estimateOls } from './beta-estimate.js';
import { leadLagRows } from './dimson.js';
import { estimateScholesWilliams } from './scholes-williams.js';
import { referenceCorrelation, referenceFit, referenceSlope } from './test-support/reference-regression.js';
import { staleSeries } from './test-support/stale-prices.js';

const relative = (got: number, expected: number) => Math.abs(got / expected - 1);

describe('estimateScholesWilliams', () => {
  it('moves a stale security\'s beta toward the true beta (Scholes & Williams 1977, JFE 5(3))', () => {
    const series = staleSeries({ seed: 1979, periods: 3001, beta: 1.2, tradeProbability: 0.4 });
    const window = { start: 1, end: 3000 };
    const ols = estimateOls(series.security, series.market, window);
    const sw = estimateScholesWilliams(series.security, series.market, window);
    expect(Math.abs(sw.beta - 1.2)).toBeLessThan(Math.abs(ols.beta - 1.2));
    expect(sw.beta).toBeGreaterThan(ols.beta + 2 * sw.betaSe);
  });

  it('equals (b⁻ + b⁰ + b⁺)/(1 + 2ρ_m) computed independently on the Dimson k = 1 sample', () => {
    const series = staleSeries({ seed: 77, periods: 400, beta: 0.8, tradeProbability: 0.5 });
    series.market[120] = NaN;
    const window = { start: 100, end: 399 };
    const rows = Array.from(leadLagRows(series.security, series.market, window, 1));
    const y = rows.map((t) => series.security[t]!);
    const lagged = (d: number) => rows.map((t) => series.market[t + d]!);
    const slopes = [-1, 0, 1].map((d) => referenceSlope(y, lagged(d)));
    const rho = referenceCorrelation(lagged(0), lagged(-1));
    const expected = (slopes[0]! + slopes[1]! + slopes[2]!) / (1 + 2 * rho);
    const got = estimateScholesWilliams(series.security, series.market, window);
    expect(relative(got.beta, expected)).toBeLessThan(1e-12);
    expect(got.n).toBe(rows.length);
    expect(got.residualDf).toBe(rows.length - 4);
  });

  it('derives its standard error from the linear weights and the joint three-regressor residual variance', () => {
    const series = staleSeries({ seed: 78, periods: 300, beta: 1.1, tradeProbability: 0.7 });
    const window = { start: 20, end: 299 };
    const rows = Array.from(leadLagRows(series.security, series.market, window, 1));
    const columns = [-1, 0, 1].map((d) => rows.map((t) => series.market[t + d]!));
    const weights = rows.map((_, i) => columns.reduce((s, c) => {
      const mean = c.reduce((a, v) => a + v, 0) / c.length;
      return s + (c[i]! - mean) / c.reduce((a, v) => a + (v - mean) ** 2, 0);
    }, 0));
    const joint = referenceFit(rows.map((t) => series.security[t]!), rows.map((_, i) => columns.map((c) => c[i]!)));
    const denominator = 1 + 2 * referenceCorrelation(columns[1]!, columns[0]!);
    const expected = Math.sqrt(joint.residualVariance * weights.reduce((s, w) => s + w * w, 0)) / denominator;
    expect(relative(estimateScholesWilliams(series.security, series.market, window).betaSe, expected)).toBeLessThan(1e-10);
  });

  it('leaves the beta undefined when too few periods remain', () => {
    const series = staleSeries({ seed: 5, periods: 10, beta: 1, tradeProbability: 1 });
    const got = estimateScholesWilliams(series.security, series.market, { start: 6, end: 9 });
    expect(got.n).toBe(3);
    expect(got.beta).toBeNaN();
  });
});
