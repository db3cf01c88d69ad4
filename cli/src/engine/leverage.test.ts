import { describe, expect, it } from 'vitest';
import {
  afterTaxCostOfDebt, average, debtToEquityFromDebtShare, peerGroupBeta, releverHamada, releverHarrisPringle,
  unleverHamada, unleverHarrisPringle, wacc, waccFromDebtToEquity,
} from './leverage.js';

describe('Hamada', () => {
  it('relevers β_U 0.74 at D/E 1.54 and T 26.2% to 1.5810248 (FORMULAS.md, Hamada 1972, arithmetic)', () => {
    expect(releverHamada(0.74, 1.54, 0.262)).toBeCloseTo(1.5810248, 14);
  });

  it('relevers β_U 0.75 at D/V 37% and T 20% to 1.1023809523809525 (FORMULAS.md, arithmetic)', () => {
    expect(releverHamada(0.75, debtToEquityFromDebtShare(0.37), 0.2)).toBeCloseTo(1.1023809523809525, 15);
  });

  it('unlevers back to the same asset beta', () => {
    expect(unleverHamada(releverHamada(0.83, 0.6, 0.25), 0.6, 0.25)).toBeCloseTo(0.83, 15);
  });
});

describe('Harris–Pringle', () => {
  it('relevers an asset beta of 0.8 at D/V 40% with a debt beta of 0.2 to 1.2 (FORMULAS.md, arithmetic)', () => {
    expect(releverHarrisPringle(0.8, debtToEquityFromDebtShare(0.4), 0.2)).toBeCloseTo(1.2, 15);
  });

  it('unlevers back to the same asset beta, with the debt beta defaulting to 0', () => {
    expect(unleverHarrisPringle(1.2, 2 / 3, 0.2)).toBeCloseTo(0.8, 15);
    expect(unleverHarrisPringle(1.5, 0.5)).toBeCloseTo(1.0, 15);
  });
});

describe('peer groups', () => {
  const peers = [
    { leveredBeta: 1.2, debtToEquity: 0.5, taxRate: 0.2 }, // β_U 1.2 / 1.4 [arithmetic]
    { leveredBeta: 0.9, debtToEquity: 0.25, taxRate: 0.2 }, // 0.9 / 1.2 = 0.75
    { leveredBeta: 1.6, debtToEquity: 1.0, taxRate: 0.2 }, // 1.6 / 1.8
    { leveredBeta: NaN, debtToEquity: 1.0, taxRate: 0.2 },
  ];

  it('takes the median unlevered beta by default and relevers it at the target structure', () => {
    const group = peerGroupBeta(peers, { debtToEquity: 0.4, taxRate: 0.25 }, 'hamada');
    expect(group.count).toBe(3);
    expect(group.unleveredBeta).toBeCloseTo(1.2 / 1.4, 15);
    expect(group.releveredBeta).toBeCloseTo((1.2 / 1.4) * 1.3, 15);
  });

  it('can take the mean instead, and the median of an even count is the mid-point', () => {
    expect(peerGroupBeta(peers, { debtToEquity: 0, taxRate: 0 }, 'hamada', 'mean').unleveredBeta).toBeCloseTo((1.2 / 1.4 + 0.75 + 1.6 / 1.8) / 3, 15);
    expect(average([4, 1, 3, 2], 'median')).toBe(2.5);
  });
});

describe('cost of debt and WACC', () => {
  it('gives 10.545714285714286% for r_E 14%, r_D 9%, D/E 0.75, T 34% (FORMULAS.md, arithmetic)', () => {
    expect(waccFromDebtToEquity(0.75, 0.14, 0.09, 0.34)).toBeCloseTo(0.10545714285714286, 15);
  });

  it('gives 11.0383…% for equity 9.3m at 11.3% and debt 0.729m at 7.7% after tax (FORMULAS.md, arithmetic)', () => {
    // (9.3 × 0.113 + 0.729 × 0.077) / 10.029 = 1.107033 / 10.029.
    expect(wacc(9.3, 0.729, 0.113, 0.077)).toBeCloseTo(1.107033 / 10.029, 15);
    expect(wacc(9.3, 0.729, 0.113, 0.077)).toBeCloseTo(0.110383, 6);
  });

  it('takes tax off the cost of debt', () => {
    expect(afterTaxCostOfDebt(0.09, 0.34)).toBeCloseTo(0.0594, 15);
  });

  it('rejects a debt share of 100%', () => {
    expect(() => debtToEquityFromDebtShare(1)).toThrow('D/V');
  });
});
