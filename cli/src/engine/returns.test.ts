// Return rules from DESIGN.md "Returns"; values follow by arithmetic from the prices shown.
import { describe, expect, it } from 'vitest';
import { excessReturns, simpleReturns, simpleReturnsInPlace } from './returns.js';

describe('simple returns on the grid', () => {
  it('forms P_t / P_{t-1} − 1 between consecutive periods, with none at index 0', () => {
    const returns = simpleReturns(Float64Array.from([100, 110, 99]));
    expect(returns[0]).toBeNaN();
    expect(returns[1]).toBeCloseTo(0.1, 15);
    expect(returns[2]).toBeCloseTo(-0.1, 15);
  });

  it('loses two returns for one empty cell: the period itself and the next one', () => {
    const returns = simpleReturns(Float64Array.from([100, 101, Number.NaN, 103, 104]));
    expect(Array.from(returns, Number.isNaN)).toEqual([true, false, true, true, false]);
  });
});

describe('excess returns', () => {
  const simple = Float64Array.from([Number.NaN, 0.1, -0.05]);
  const riskFree = Float64Array.from([Number.NaN, 0.01, 0.002]);

  it('subtracts the per-period risk-free rate from simple returns', () => {
    const excess = excessReturns(simple, riskFree, 'simple');
    expect(excess[0]).toBeNaN();
    expect(excess[1]).toBeCloseTo(0.09, 15);
    expect(excess[2]).toBeCloseTo(-0.052, 15);
  });

  it('takes ln(1 + r) − ln(1 + r_f) with log returns', () => {
    // [arithmetic] ln(1.1) − ln(1.01) = ln(1.1 / 1.01) = 0.08536...; ln(0.95) − ln(1.002).
    const excess = excessReturns(simple, riskFree, 'log');
    expect(excess[1]).toBeCloseTo(Math.log(1.1 / 1.01), 14);
    expect(excess[2]).toBeCloseTo(Math.log(0.95) - Math.log(1.002), 14);
  });

  it('has no excess return where the risk-free rate is unknown', () => {
    expect(excessReturns(simple, Float64Array.from([0, Number.NaN, 0]), 'simple')[1]).toBeNaN();
  });
});

describe('simpleReturnsInPlace', () => {
  it('gives simpleReturns\' values over the prices themselves, gaps included', () => {
    const prices = Float64Array.from([100, 101, Number.NaN, 103, 104, 0.5, Number.NaN, Number.NaN, 2]);
    const expected = simpleReturns(prices);
    const inPlace = simpleReturnsInPlace(prices);
    expect(inPlace).toBe(prices);
    expect(Array.from(inPlace)).toEqual(Array.from(expected));
  });

  it('leaves an empty series empty', () => {
    expect(simpleReturnsInPlace(new Float64Array(0))).toHaveLength(0);
  });
});
