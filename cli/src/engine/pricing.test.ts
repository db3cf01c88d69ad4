import { describe, expect, it } from 'vitest';
import { blumeBeta } from './adjustments.js';
import { capmBand, capmExpectedReturn, marketPremium, portfolioBeta, portfolioExpectedReturn, securityMarketLine } from './pricing.js';

describe('capmExpectedReturn', () => {
  it('gives 9.6% for r_f 3%, E[R_m] 9%, β 1.10 (FORMULAS.md, Sharpe 1964 / Lintner 1965, arithmetic)', () => {
    expect(capmExpectedReturn(1.1, { riskFree: 0.03, expectedMarketReturn: 0.09 })).toBeCloseTo(0.096, 15);
  });

  it('gives 6.35% for r_f 2.5%, a premium of 5.5% and β 0.7 (FORMULAS.md, arithmetic)', () => {
    expect(capmExpectedReturn(0.7, { riskFree: 0.025, marketPremium: 0.055 })).toBeCloseTo(0.0635, 15);
  });

  it.each([[1.8, 0.128], [0.8, 0.068], [1, 0.08]])('gives β %f → %f with r_f 2% and E[R_m] 8% (common practice)', (beta, expected) => {
    expect(capmExpectedReturn(beta, { riskFree: 0.02, expectedMarketReturn: 0.08 })).toBeCloseTo(expected, 15);
  });

  it('prices the worked example\'s Blume beta at 0.0878362988249 with r_f 2%, E[R_m] 8% (WORKED-EXAMPLE.md)', () => {
    expect(capmExpectedReturn(blumeBeta(1.19590747062), { riskFree: 0.02, expectedMarketReturn: 0.08 })).toBeCloseTo(0.0878362988249, 12);
  });

  it('adds the sum of add-on premia', () => {
    expect(capmExpectedReturn(1, { riskFree: 0.02, marketPremium: 0.05 }, [0.01, 0.005])).toBeCloseTo(0.085, 15);
  });

  it('reads the premium from E[R_m] − r_f or takes it as given', () => {
    expect(marketPremium({ riskFree: 0.03, expectedMarketReturn: 0.09 })).toBeCloseTo(0.06, 15);
    expect(marketPremium({ riskFree: 0.03, marketPremium: 0.045 })).toBe(0.045);
  });
});

describe('capmBand and the security market line', () => {
  it('prices both ends of the beta interval, low first even with a negative premium', () => {
    expect(capmBand(0.8, 1.4, { riskFree: 0.02, marketPremium: 0.05 })).toEqual({ low: expect.closeTo(0.06, 15), high: expect.closeTo(0.09, 15) });
    expect(capmBand(0.8, 1.4, { riskFree: 0.02, marketPremium: -0.01 }).low).toBeCloseTo(0.006, 15);
  });

  it('passes through (0, r_f) and (1, E[R_m])', () => {
    const line = securityMarketLine({ riskFree: 0.02, expectedMarketReturn: 0.08 }, 0, 2, 5);
    expect(line.map((p) => p.beta)).toEqual([0, 0.5, 1, 1.5, 2]);
    expect(line[0]!.expectedReturn).toBe(0.02);
    expect(line[2]!.expectedReturn).toBeCloseTo(0.08, 15);
  });
});

describe('portfolio beta and expected return', () => {
  const holdings = [{ weight: 600, beta: 1.2, expectedReturn: 0.09 }, { weight: 400, beta: 0.7, expectedReturn: 0.06 }];

  it('normalises market-value weights by default (0.6 × 1.2 + 0.4 × 0.7 = 1.0, arithmetic)', () => {
    expect(portfolioBeta(holdings)).toBeCloseTo(1.0, 15);
    expect(portfolioExpectedReturn(holdings)).toBeCloseTo(0.078, 15);
  });

  it('uses the weights as given when asked not to normalise', () => {
    expect(portfolioBeta([{ weight: 0.5, beta: 1.2 }, { weight: 0.3, beta: 0.7 }], false)).toBeCloseTo(0.81, 15);
  });

  it('refuses to normalise weights that sum to zero', () => {
    expect(() => portfolioBeta([{ weight: 1, beta: 1 }, { weight: -1, beta: 2 }])).toThrow('sum to zero');
  });
});
