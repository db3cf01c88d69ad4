// Window rules from DESIGN.md "Window"; expected counts follow from the arrays shown.
import { describe, expect, it } from 'vitest';
import type { AlignedReturns } from './types.js';
import { DEFAULT_WINDOW, windowBounds, windowSample } from './window.js';

const nan = Number.NaN;
const labels = ['m0', 'm1', 'm2', 'm3', 'm4', 'm5', 'm6'];
const aligned: AlignedReturns = {
  grid: { frequency: 'monthly', labels, periodEnds: labels },
  riskFree: new Float64Array(7),
  marketExcess: Float64Array.from([nan, 0.01, 0.02, nan, 0.04, 0.05, 0.06]),
  securities: [],
};

describe('estimation window', () => {
  it('spans W return periods ending at the as-of period', () => {
    expect(windowBounds(6, 4)).toEqual({ first: 3, last: 6 });
  });

  it('starts at return index 1 when the grid is shorter than W', () => {
    expect(windowBounds(6, 60)).toEqual({ first: 1, last: 6 });
  });

  it('counts only periods where both the security and the market have an excess return', () => {
    const security = Float64Array.from([nan, 0.1, nan, 0.3, 0.4, 0.5, 0.6]);
    const sample = windowSample(aligned, security, windowBounds(6, 6), 4);
    expect(sample.n).toBe(4);
    expect(Array.from(sample.periods)).toEqual([1, 4, 5, 6]);
    expect(Array.from(sample.securityExcess)).toEqual([0.1, 0.4, 0.5, 0.6]);
    expect(Array.from(sample.marketExcess)).toEqual([0.01, 0.04, 0.05, 0.06]);
    expect([sample.status, sample.firstPeriod, sample.lastPeriod]).toEqual(['ok', 'm1', 'm6']);
  });

  it('marks a security with fewer observations than the minimum insufficient, with n and the minimum', () => {
    const delisted = Float64Array.from([nan, 0.1, 0.2, nan, nan, nan, nan]);
    const sample = windowSample(aligned, delisted, windowBounds(6, 4), 2);
    expect([sample.status, sample.n, sample.minimum, sample.firstPeriod]).toEqual(['insufficient', 0, 2, null]);
  });

  it('defaults to 60/36 monthly, 156/104 weekly and 252/200 daily (DESIGN.md)', () => {
    expect(DEFAULT_WINDOW).toEqual({
      monthly: { length: 60, minimum: 36 }, weekly: { length: 156, minimum: 104 }, daily: { length: 252, minimum: 200 },
    });
  });

  it('refuses a window length that is not a positive integer', () => {
    expect(() => windowBounds(6, 0)).toThrow(RangeError);
  });
});
