import { describe, expect, it } from 'vitest';
import { readNistDataset } from '../../../cli/src/engine/test-support/nist-strd.js';
import { fitLine } from './fitted-line.js';

describe('fitLine', () => {
  it('reproduces the certified NIST StRD Norris slope and intercept', () => {
    // Source: NIST StRD linear regression, Norris.dat (certified B0, B1), test/fixtures/nist-strd.
    const norris = readNistDataset('Norris');
    const fit = fitLine(Array.from(norris.xs[0] as Float64Array), Array.from(norris.y));
    expect(fit?.n).toBe(36);
    expect(fit?.beta).toBeCloseTo(norris.parameters[1]?.estimate as number, 12);
    expect(fit?.alpha).toBeCloseTo(norris.parameters[0]?.estimate as number, 10);
  });

  it('reproduces the worked example\'s beta and alpha from its eight excess-return pairs', () => {
    // Source: ../shared/reference/WORKED-EXAMPLE.md, monthly grid table (returns minus per-period r_f)
    // and its results table: beta 1.19590747062, alpha 0.00393217903536 (checked there against statsmodels).
    const rows: [number, number, number][] = [
      [-0.007547169811, -0.01491101491, 0.002790116491],
      [0.03897338403, 0.03271484375, 0.002749698517],
      [0.004516711834, 0.004201680672, 0.002628336959],
      [0.03956834532, 0.02928870293, 0.002547339389],
      [0.01903114187, 0.009936766034, 0.002506813595],
      [-0.02037351443, -0.01475849732, 0.002466269772],
      [0.04072790295, 0.02859736723, 0.002425707904],
      [0.01498751041, 0.0105913504, 0.002385127974],
    ];
    const fit = fitLine(rows.map(([, m, rf]) => m - rf), rows.map(([s, , rf]) => s - rf));
    expect(fit?.n).toBe(8);
    // The table's returns carry 10 significant digits, so agreement is to about 1e-9.
    expect(fit?.beta).toBeCloseTo(1.19590747062, 8);
    expect(fit?.alpha).toBeCloseTo(0.00393217903536, 9);
  });

  it('answers null for a single point or for points with no spread in x', () => {
    expect(fitLine([0.01], [0.02])).toBeNull();
    expect(fitLine([0.01, 0.01, 0.01], [0.02, 0.03, 0.04])).toBeNull();
  });
});
