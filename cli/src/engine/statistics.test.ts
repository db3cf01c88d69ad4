import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { betaInference, estimateSecurity, zeroReturnShare, type EstimationSettings } from './statistics.js';
import { staleSeries } from './test-support/stale-prices.js';

const relative = (got: number, expected: number) => Math.abs(got / expected - 1);

// Source: the project's reference WORKED-EXAMPLE.md (monthly, as-of 2026-10, W = 10, minimum 8).
const labels = ['2025-10', '2025-11', '2025-12', '2026-01', '2026-02', '2026-03', '2026-04', '2026-05', '2026-06', '2026-07', '2026-08', '2026-09', '2026-10'];
const securityPrices = [102.5, 101.8, 106, 105.2, 109.3, NaN, 110.7, 111.2, 115.6, 117.8, 115.4, 120.1, 121.9];
const marketLevels = [2021, 2012, 2079, 2048, 2115, 2087, 2142, 2151, 2214, 2236, 2203, 2266, 2290];
const riskFree = [NaN, 3.55, 3.5, 3.4, 3.35, 3.3, 3.25, 3.2, 3.1, 3.05, 3.0, 2.95, 2.9].map((y) => (1 + y / 100) ** (1 / 12) - 1);
const simple = (prices: number[]) => Float64Array.from(prices, (p, t) => (t === 0 ? NaN : p / prices[t - 1]! - 1));
const raw = simple(securityPrices);
const excess = raw.map((r, t) => r - riskFree[t]!);
const marketExcess = simple(marketLevels).map((r, t) => r - riskFree[t]!);
const window = { start: 3, end: 12 };
const settings: EstimationSettings = { estimator: 'ols', dimsonLags: 1, minimum: 8, periodsPerYear: 12, adjustment: 'blume', blumeWeight: 2 / 3 };
const security = { id: 'QZ1', excess, raw };

describe('estimateSecurity on the worked example', () => {
  const result = estimateSecurity(security, marketExcess, window, labels, settings);

  it('reports the sample: 8 observations from 2026-01 to 2026-10', () => {
    expect(result).toMatchObject({ status: 'ok', n: 8, baseN: 8, residualDf: 6, minimum: 8, firstPeriod: '2026-01', lastPeriod: '2026-10', flags: [] });
  });

  it.each([
    ['beta', 'beta', 1.19590747062],
    ['plain OLS beta', 'olsBeta', 1.19590747062],
    ['alpha', 'alpha', 0.00393217903536],
    ['se(beta)', 'betaSe', 0.096352215683],
    ['se(alpha)', 'alphaSe', 0.00187609001869],
    ['R²', 'rSquared', 0.962512549498],
    ['correlation', 'correlation', 0.981077239313],
    ['security volatility', 'securityVolatility', 0.0230468187746],
    ['market volatility', 'marketVolatility', 0.0189067380995],
    ['Blume beta', 'blumeBeta', 1.13060498042],
    ['adjusted (Blume) beta', 'adjustedBeta', 1.13060498042],
  ] as const)('matches the published %s', (_name, key, published) => {
    expect(relative(result[key], published)).toBeLessThan(5e-11);
  });

  it('annualises volatilities by √12 and Jensen\'s alpha by 12', () => {
    expect(result.securityVolatilityAnnual).toBeCloseTo(result.securityVolatility * Math.sqrt(12), 15);
    expect(result.marketVolatilityAnnual).toBeCloseTo(result.marketVolatility * Math.sqrt(12), 15);
    expect(result.jensenAlphaAnnual).toBeCloseTo(0.00393217903536 * 12, 12);
  });

  it('gives t = β/se, the two-sided p of jStat (independent) and a 95% interval with t(6) = 2.447 (t tables [memory])', () => {
    expect(result.betaT).toBeCloseTo(1.19590747062 / 0.096352215683, 9);
    expect(relative(result.betaP, 2 * jStat.studentt.cdf(-result.betaT, 6))).toBeLessThan(1e-6);
    expect((result.betaHigh95 - result.beta) / result.betaSe).toBeCloseTo(2.447, 3);
    expect(result.beta - result.betaLow95).toBeCloseTo(result.betaHigh95 - result.beta, 14);
  });

  it('counts no zero returns among the 8 present security returns', () => {
    expect(result.zeroReturnShare).toBe(0);
  });
});

describe('estimateSecurity status and degenerate cases', () => {
  it('is insufficient below the minimum, with n and the minimum but no estimates', () => {
    const result = estimateSecurity(security, marketExcess, window, labels, { ...settings, minimum: 9 });
    expect(result).toMatchObject({ status: 'insufficient', n: 8, minimum: 9, firstPeriod: '2026-01' });
    expect(result.beta).toBeNaN();
    expect(result.correlation).toBeNaN();
  });

  it('flags a security whose excess returns have no variance and leaves correlation, R², t and p empty', () => {
    const flat = { id: 'QZ2', excess: new Float64Array(13).fill(0.004), raw: new Float64Array(13).fill(0.007) };
    const result = estimateSecurity(flat, marketExcess, window, labels, settings);
    expect(result.flags).toEqual(['degenerate']);
    expect([result.correlation, result.rSquared, result.betaT, result.betaP, result.betaLow95]).toEqual([NaN, NaN, NaN, NaN, NaN]);
  });

  it('reports the Dimson sample and its residual degrees of freedom (n − 2k − 2) with a Dimson base', () => {
    const series = staleSeries({ seed: 12, periods: 400, beta: 1, tradeProbability: 0.5 });
    const dimson = estimateSecurity({ id: 'QZ3', excess: series.security, raw: series.security }, series.market,
      { start: 148, end: 399 }, [], { ...settings, estimator: 'dimson', dimsonLags: 2, minimum: 200 });
    expect(dimson.n).toBe(252);
    expect(dimson.baseN).toBe(250);
    expect(dimson.residualDf).toBe(250 - 6);
    expect(relative(dimson.betaP, 2 * jStat.studentt.cdf(-Math.abs(dimson.betaT), 244))).toBeLessThan(1e-6);
    expect(dimson.olsBeta).not.toBe(dimson.beta);
  });
});

describe('betaInference and zeroReturnShare', () => {
  it('has no inference without a positive standard error or degrees of freedom', () => {
    expect(betaInference(1, 0, 10).t).toBeNaN();
    expect(betaInference(1, 0.1, 0).p).toBeNaN();
  });

  it('counts zero returns among the present ones in the window', () => {
    expect(zeroReturnShare(Float64Array.of(NaN, 0, 0.01, NaN, 0, -0.02), { start: 1, end: 5 })).toBe(0.5);
  });
});
