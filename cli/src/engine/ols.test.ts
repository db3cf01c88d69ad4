import { describe, expect, it } from 'vitest';
import { centredSums, fitOls, sampleMoments } from './ols.js';
import { logRelativeError, readNistDataset } from './test-support/nist-strd.js';
import { normalSeries, seededRandom } from './test-support/seeded-random.js';

/** Independent textbook two-pass moments, written here without the library (plain arrays). */
function referenceMoments(y: number[], x: number[]) {
  const n = y.length;
  const mean = (v: number[]) => v.reduce((s, a) => s + a, 0) / n;
  const my = mean(y), mx = mean(x);
  const sd = (v: number[], m: number) => Math.sqrt(v.reduce((s, a) => s + (a - m) ** 2, 0) / (n - 1));
  const cov = y.reduce((s, a, i) => s + (a - my) * (x[i]! - mx), 0) / (n - 1);
  const sy = sd(y, my), sx = sd(x, mx);
  return { rho: cov / (sy * sx), sy, sx };
}

/** Two seeded series rescaled so that their sample correlation and sds are exactly the given ones. */
function seriesWithMoments(rho: number, sdY: number, sdX: number, n: number, seed: number) {
  const random = seededRandom(seed);
  const centre = (v: Float64Array) => { const m = v.reduce((s, a) => s + a, 0) / n; return v.map((a) => a - m); };
  const dot = (a: Float64Array, b: Float64Array) => a.reduce((s, v, i) => s + v * b[i]!, 0);
  const z1 = centre(normalSeries(random, n, 0, 1));
  let z2 = centre(normalSeries(random, n, 0, 1));
  z2 = z2.map((v, i) => v - (dot(z1, z2) / dot(z1, z1)) * z1[i]!);
  const unit = (v: Float64Array) => { const s = Math.sqrt(dot(v, v) / (n - 1)); return v.map((a) => a / s); };
  const u1 = unit(z1), u2 = unit(z2);
  return {
    x: u1.map((v) => 0.01 + sdX * v),
    y: u1.map((v, i) => 0.002 + sdY * (rho * v + Math.sqrt(1 - rho * rho) * u2[i]!)),
  };
}

describe('fitOls on NIST StRD Norris', () => {
  const norris = readNistDataset('Norris');
  const fit = fitOls(norris.y, norris.xs[0]!);
  const [b0, b1] = norris.parameters;

  // Source: NIST StRD Norris certified values (test/fixtures/nist-strd/Norris.dat); project tolerance
  // of 12 significant digits from the reference FORMULAS notes.
  it.each([
    ['B0', () => fit.alpha, b0!.estimate],
    ['sd(B0)', () => fit.alphaSe, b0!.sd],
    ['B1', () => fit.beta, b1!.estimate],
    ['sd(B1)', () => fit.betaSe, b1!.sd],
    ['residual sd', () => fit.residualSd, norris.residualSd],
    ['R²', () => fit.rSquared, norris.rSquared],
    ['residual sum of squares', () => fit.ssr, norris.residualSumOfSquares],
  ] as const)('reproduces the certified %s to at least 12 significant digits', (_name, got, certified) => {
    expect(logRelativeError(got(), certified)).toBeGreaterThanOrEqual(12);
  });

  it('uses the certified residual degrees of freedom (n − 2 = 34)', () => {
    expect(fit.n - 2).toBe(norris.residualDf);
  });
});

describe('fitOls on the worked example window', () => {
  // Source: the project's reference WORKED-EXAMPLE.md (monthly closes, yields used, window 2026-01..10,
  // results checked there against statsmodels OLS to 1e-12). Prices of the example, index 0 = 2025-10.
  const security = [102.5, 101.8, 106, 105.2, 109.3, NaN, 110.7, 111.2, 115.6, 117.8, 115.4, 120.1, 121.9];
  const market = [2021, 2012, 2079, 2048, 2115, 2087, 2142, 2151, 2214, 2236, 2203, 2266, 2290];
  const yieldsPercent = [NaN, 3.55, 3.5, 3.4, 3.35, 3.3, 3.25, 3.2, 3.1, 3.05, 3.0, 2.95, 2.9];
  const riskFree = yieldsPercent.map((y) => (1 + y / 100) ** (1 / 12) - 1);
  const excess = (prices: number[]) => Float64Array.from(prices, (p, t) => (t === 0 ? NaN : p / prices[t - 1]! - 1 - riskFree[t]!));
  const y = excess(security), x = excess(market);
  const window = { start: 3, end: 12 };
  const fit = fitOls(y, x, window);
  const moments = sampleMoments(y, x, window);

  it('counts only the 8 months where both returns exist (March and April have no security return)', () => {
    expect(fit.n).toBe(8);
    expect(centredSums(y, x, window)).toMatchObject({ firstIndex: 3, lastIndex: 12 });
  });

  it.each([
    ['beta', () => fit.beta, 1.19590747062],
    ['alpha', () => fit.alpha, 0.00393217903536],
    ['se(beta)', () => fit.betaSe, 0.096352215683],
    ['se(alpha)', () => fit.alphaSe, 0.00187609001869],
    ['R²', () => fit.rSquared, 0.962512549498],
    ['correlation', () => moments.correlation, 0.981077239313],
    ['security sd', () => Math.sqrt(moments.varianceY), 0.0230468187746],
    ['market sd', () => Math.sqrt(moments.varianceX), 0.0189067380995],
  ] as const)('matches the published %s to its 12 printed digits', (_name, got, published) => {
    expect(Math.abs(got() / published - 1)).toBeLessThan(5e-11);
  });
});

describe('the beta identity', () => {
  it('gives a slope equal to ρ·σ_i/σ_m from an independent two-pass routine (common practice)', () => {
    const random = seededRandom(20260131);
    const x = normalSeries(random, 500, 0.004, 0.045);
    const y = x.map((v) => 0.001 + 1.3 * v + 0.03 * random.normal());
    const reference = referenceMoments(Array.from(y), Array.from(x));
    expect(fitOls(y, x).beta).toBeCloseTo((reference.rho * reference.sy) / reference.sx, 13);
  });

  it('gives β = 0.75 for ρ = 0.5, σ_i = 6% and σ_m = 4% a month (FORMULAS.md, arithmetic)', () => {
    const { x, y } = seriesWithMoments(0.5, 0.06, 0.04, 120, 7);
    expect(fitOls(y, x).beta).toBeCloseTo(0.75, 12);
  });

  it('gives β = 1.8 for ρ = 0.6, σ_i = 8.1% and σ_m = 2.7% a month (common practice: 0.6 × 8.1 / 2.7)', () => {
    const { x, y } = seriesWithMoments(0.6, 0.081, 0.027, 60, 11);
    expect(fitOls(y, x).beta).toBeCloseTo(1.8, 12);
    expect(sampleMoments(y, x).correlation).toBeCloseTo(0.6, 12);
  });

  it('recovers σ_i = 6% from β = 1.5, ρ = 0.75 and σ_m = 3% (FORMULAS.md, arithmetic)', () => {
    const { x, y } = seriesWithMoments(0.75, 0.06, 0.03, 90, 5);
    expect(fitOls(y, x).beta).toBeCloseTo(1.5, 12);
    expect(Math.sqrt(sampleMoments(y, x).varianceY)).toBeCloseTo(0.06, 14);
  });
});

describe('fitOls edge cases', () => {
  it('skips indices where either series is missing (pairwise-complete)', () => {
    const y = Float64Array.of(1, NaN, 3, 4, 5, 7);
    const x = Float64Array.of(1, 2, NaN, 4, 5, 6);
    const complete = fitOls(Float64Array.of(1, 4, 5, 7), Float64Array.of(1, 4, 5, 6));
    expect(fitOls(y, x)).toEqual(complete);
  });

  it('reports no estimates when the market has no variance in the sample', () => {
    const fit = fitOls(Float64Array.of(1, 2, 3), Float64Array.of(0.1, 0.1, 0.1));
    expect(fit.n).toBe(3);
    expect(fit.beta).toBeNaN();
  });

  it('marks a flat security and leaves its correlation and R² empty', () => {
    const y = new Float64Array(5).fill(0.1 / 3);
    const x = Float64Array.of(0.01, -0.02, 0.03, 0.0, 0.015);
    expect(centredSums(y, x).flatY).toBe(true);
    expect(sampleMoments(y, x).correlation).toBeNaN();
    expect(fitOls(y, x).rSquared).toBeNaN();
  });

  it('rejects a range outside the arrays, naming the range', () => {
    expect(() => fitOls(new Float64Array(3), new Float64Array(3), { start: 1, end: 3 })).toThrow('[1, 3]');
  });
});
