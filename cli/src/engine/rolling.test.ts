import { describe, expect, it } from 'vitest';
import { fitOls } from './ols.js';
import { rollingBetaRange, rollingBetas, rollingEnds } from './rolling.js';
import { normalSeries, seededRandom } from './test-support/seeded-random.js';
import { staleSeries } from './test-support/stale-prices.js';

const relative = (got: number, expected: number) => Math.abs(got / expected - 1);

describe('rollingBetas', () => {
  const series = staleSeries({ seed: 9, periods: 1261, beta: 1.1, tradeProbability: 0.95 });
  for (let t = 5; t < 1261; t += 37) series.security[t] = NaN;
  const asOf = 1260, W = 252;
  const rolling = rollingBetas(series.security, series.market, asOf, { length: W, step: 1, count: 'all', minimum: 200 });

  it('ends at the as-of period with the full-window OLS estimate when L = W (DESIGN.md rolling betas)', () => {
    const last = rolling.ends.length - 1;
    const full = fitOls(series.security, series.market, { start: asOf - W + 1, end: asOf });
    expect(rolling.ends[last]).toBe(asOf);
    expect(rolling.n[last]).toBe(full.n);
    expect(relative(rolling.beta[last]!, full.beta)).toBeLessThan(1e-12);
    expect(relative(rolling.betaSe[last]!, full.betaSe)).toBeLessThan(1e-12);
    expect(relative(rolling.rSquared[last]!, full.rSquared)).toBeLessThan(1e-12);
    expect(Math.abs(rolling.alpha[last]! - full.alpha)).toBeLessThan(1e-15);
  });

  it('matches a fresh OLS fit at every end, through the periodic rebuilds of the running sums', () => {
    let worst = 0;
    rolling.ends.forEach((end, j) => {
      worst = Math.max(worst, relative(rolling.beta[j]!, fitOls(series.security, series.market, { start: end - W + 1, end }).beta));
    });
    expect(worst).toBeLessThan(1e-12);
  });

  it('stays exact over a long sweep of returns far from zero (no drift in the running sums)', () => {
    const random = seededRandom(44);
    const x = normalSeries(random, 20001, 3, 0.01);
    const y = x.map((v) => 7 + 0.8 * v + 0.005 * random.normal());
    const sweep = rollingBetas(y, x, 20000, { length: 60, step: 1, count: 'all', minimum: 36 });
    const full = fitOls(y, x, { start: 20000 - 59, end: 20000 });
    expect(relative(sweep.beta[sweep.beta.length - 1]!, full.beta)).toBeLessThan(1e-12);
  });

  it('leaves windows below the minimum without estimates but reports their n', () => {
    const y = series.security.slice();
    y.fill(NaN, 600, 700);
    const thin = rollingBetas(y, series.market, 760, { length: 252, step: 100, count: 'all', minimum: 200 });
    const index = Array.from(thin.ends).indexOf(760);
    expect(thin.n[index]).toBe(fitOls(y, series.market, { start: 509, end: 760 }).n);
    expect(thin.n[index]).toBeLessThan(200);
    expect(thin.beta[index]).toBeNaN();
  });
});

describe('rollingEnds', () => {
  it('takes the K most recent ends S periods apart, oldest first', () => {
    expect(Array.from(rollingEnds(100, { length: 20, step: 5, count: 3, minimum: 15 }))).toEqual([90, 95, 100]);
  });

  it('goes back as far as a full window fits after index 0 with `all`', () => {
    const ends = Array.from(rollingEnds(100, { length: 20, step: 5, count: 'all', minimum: 15 }));
    expect(ends[0]).toBe(20);
    expect(ends).toHaveLength(17);
  });

  it('stops early when the data allow fewer than K ends, and gives none for K = 0', () => {
    expect(rollingEnds(30, { length: 20, step: 1, count: 24, minimum: 15 })).toHaveLength(11);
    expect(rollingEnds(30, { length: 20, step: 1, count: 0, minimum: 15 })).toHaveLength(0);
  });

  it('rejects a step of zero', () => {
    expect(() => rollingEnds(30, { length: 20, step: 0, count: 1, minimum: 15 })).toThrow('rolling step');
  });
});

describe('rollingBetaRange', () => {
  it('is the spread of the finite rolling betas', () => {
    const rolling = { ends: Int32Array.of(1, 2, 3), n: Int32Array.of(3, 3, 3), alpha: new Float64Array(3), betaSe: new Float64Array(3), rSquared: new Float64Array(3), beta: Float64Array.of(0.9, NaN, 1.35) };
    expect(rollingBetaRange(rolling)).toBeCloseTo(0.45, 15);
    expect(rollingBetaRange({ ...rolling, beta: Float64Array.of(NaN) })).toBeNaN();
  });
});
