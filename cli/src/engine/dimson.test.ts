import { describe, expect, it } from 'vitest';
import { estimateOls } from './beta-estimate.js';
import { estimateDimson, leadLagRows } from './dimson.js';
import { referenceFit } from './test-support/reference-regression.js';
import { staleSeries } from './test-support/stale-prices.js';

const relative = (got: number, expected: number) => Math.abs(got / expected - 1);

describe('estimateDimson on a thinly traded security', () => {
  // Source: Dimson (1979), Journal of Financial Economics 7: stale prices bias the OLS beta toward
  // zero and the sum of lagged, current and leading slopes corrects it. True beta known: 1.2.
  const series = staleSeries({ seed: 1979, periods: 3001, beta: 1.2, tradeProbability: 0.4 });
  const window = { start: 1, end: 3000 };
  const ols = estimateOls(series.security, series.market, window);
  const dimson = estimateDimson(series.security, series.market, window, 1);

  it('shows the raw OLS beta biased toward zero', () => {
    expect(ols.beta).toBeLessThan(1.2 - 3 * ols.betaSe);
  });

  it('moves the beta toward the true value with one lag and one lead', () => {
    expect(Math.abs(dimson.beta - 1.2)).toBeLessThan(Math.abs(ols.beta - 1.2));
    expect(dimson.beta).toBeGreaterThan(ols.beta + 2 * dimson.betaSe);
  });

  it('gets closer still with more lags', () => {
    expect(Math.abs(estimateDimson(series.security, series.market, window, 4).beta - 1.2)).toBeLessThan(Math.abs(dimson.beta - 1.2));
  });

  it('gives the OLS estimate with k = 0', () => {
    const zero = estimateDimson(series.security, series.market, window, 0);
    for (const key of ['alpha', 'alphaSe', 'beta', 'betaSe', 'rSquared', 'adjRSquared', 'residualSd', 'ssr'] as const) {
      expect(relative(zero[key], ols[key])).toBeLessThan(1e-12);
    }
    expect([zero.n, zero.residualDf]).toEqual([ols.n, ols.residualDf]);
  });
});

describe('estimateDimson standard error', () => {
  it('equals √(1ᵀV1) from independent normal equations over the same rows', () => {
    const series = staleSeries({ seed: 7, periods: 300, beta: 0.9, tradeProbability: 0.6 });
    const window = { start: 40, end: 299 }, k = 2;
    const rows = Array.from(leadLagRows(series.security, series.market, window, k));
    const regressors = rows.map((t) => Array.from({ length: 2 * k + 1 }, (_, j) => series.market[t + j - k]!));
    const reference = referenceFit(rows.map((t) => series.security[t]!), regressors);
    let oneVOne = 0;
    for (let i = 1; i <= 2 * k + 1; i += 1) for (let j = 1; j <= 2 * k + 1; j += 1) oneVOne += reference.inverseGram[i]![j]!;
    const expectedSe = Math.sqrt(reference.residualVariance * oneVOne);
    const expectedBeta = reference.coefficients.slice(1).reduce((s, v) => s + v, 0);
    const got = estimateDimson(series.security, series.market, window, k);
    expect(relative(got.beta, expectedBeta)).toBeLessThan(1e-10);
    expect(relative(got.betaSe, expectedSe)).toBeLessThan(1e-10);
    expect(relative(got.alphaSe, Math.sqrt(reference.residualVariance * reference.inverseGram[0]![0]!))).toBeLessThan(1e-10);
    expect(got.residualDf).toBe(rows.length - 2 * k - 2);
  });
});

describe('leadLagRows', () => {
  const m = Float64Array.from({ length: 12 }, (_, t) => (t === 0 ? NaN : 0.01 * Math.sin(t)));
  const y = Float64Array.from({ length: 12 }, (_, t) => (t === 0 ? NaN : 0.02 * Math.cos(t)));

  it('drops the last k window periods, which would need a market return after the as-of period', () => {
    expect(Array.from(leadLagRows(y, m, { start: 4, end: 9 }, 2))).toEqual([4, 5, 6, 7]);
  });

  it('takes lagged market returns from before the window but never index 0, which holds no return', () => {
    expect(Array.from(leadLagRows(y, m, { start: 1, end: 9 }, 1))).toEqual([2, 3, 4, 5, 6, 7, 8]);
  });

  it('skips periods where the security or any lead or lag of the market is missing', () => {
    const holes = m.slice();
    holes[5] = NaN;
    expect(Array.from(leadLagRows(y, holes, { start: 3, end: 10 }, 1))).toEqual([3, 7, 8, 9]);
  });

  it('never reads a market return after the as-of period', () => {
    const series = staleSeries({ seed: 3, periods: 200, beta: 1, tradeProbability: 0.5 });
    const window = { start: 50, end: 180 };
    const before = estimateDimson(series.security, series.market, window, 2);
    const changed = series.market.slice();
    changed.fill(0.5, 181);
    expect(estimateDimson(series.security, changed, window, 2)).toEqual(before);
  });

  it('rejects a negative or fractional number of lags', () => {
    expect(() => leadLagRows(y, m, { start: 1, end: 9 }, 1.5)).toThrow('whole number');
  });
});
