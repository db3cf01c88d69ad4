// computeRun on the shared reference's worked example (../shared/reference/WORKED-EXAMPLE.md):
// the two input files of test/fixtures/worked-example/ through the real readers, the spec in
// test/cli/fixtures/worked-example.yaml. Expected values are the worked example's table (checked
// there against statsmodels OLS to 1e-12) and formulas from FORMULAS.md worked by hand in comments.
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadRunSpec } from '../../../server/src/contracts/run-spec.load.js';
import { computeRun } from './compute-run.js';

const root = path.join(import.meta.dirname, '../../..');
const fixtures = path.join(root, 'test/fixtures/worked-example');
const specFile = path.join(root, 'test/cli/fixtures/worked-example.yaml');
const { spec } = loadRunSpec(readFileSync(specFile, 'utf8'), specFile);
const paths = { prices: path.join(fixtures, 'prices.csv'), riskFree: path.join(fixtures, 'risk-free.csv') };

describe('computeRun on the worked example', async () => {
  const run = await computeRun(spec, paths);
  const row = run.rows[0]!;

  it('reads one security and resolves the as-of date of the spec', () => {
    expect(run.rows.map((r) => r.id)).toEqual(['QZ1']);
    expect(run.asOf).toBe('2026-10-30');
  });

  it('reproduces n, beta, alpha and their standard errors (WORKED-EXAMPLE.md, Results)', () => {
    expect(row.status).toBe('ok');
    expect(row.n).toBe(8);
    expect(row.firstPeriod).toBe('2026-01');
    expect(row.lastPeriod).toBe('2026-10');
    expect(row.beta).toBeCloseTo(1.19590747062, 10);
    expect(row.alpha).toBeCloseTo(0.00393217903536, 12);
    expect(row.betaSe).toBeCloseTo(0.096352215683, 11);
    expect(row.alphaSe).toBeCloseTo(0.00187609001869, 12);
  });

  it('reproduces R², correlation and the volatilities (WORKED-EXAMPLE.md, Results)', () => {
    expect(row.rSquared).toBeCloseTo(0.962512549498, 11);
    expect(row.correlation).toBeCloseTo(0.981077239313, 11);
    expect(row.securityVolatility).toBeCloseTo(0.0230468187746, 12);
    expect(row.marketVolatility).toBeCloseTo(0.0189067380995, 12);
    // Annualised by √12 (DESIGN.md, per security): 0.0230468187746 × 3.46410161514 = 0.0798364...
    expect(row.securityVolatilityAnnual).toBeCloseTo(0.0230468187746 * Math.sqrt(12), 11);
  });

  it('prices the Blume beta with the CAPM (WORKED-EXAMPLE.md: 1.13060498042 and 0.0878362988249)', () => {
    expect(row.blumeBeta).toBeCloseTo(1.13060498042, 10);
    expect(row.adjustedBeta).toBeCloseTo(1.13060498042, 10);
    expect(row.expectedReturn).toBeCloseTo(0.0878362988249, 12);
  });

  it('unlevers with Hamada and forms the WACC at the security\'s own D/E (FORMULAS.md formulas, [arithmetic])', () => {
    // β_U = β_L / (1 + (1 − T)·D/E) = 1.13060498042 / (1 + 0.66 × 0.75) = 1.13060498042 / 1.495 = 0.756257512...
    expect(row.unleveredBeta).toBeCloseTo(1.13060498042 / 1.495, 10);
    // After-tax cost of debt 0.09 × (1 − 0.34) = 0.0594.
    expect(row.costOfDebtAfterTax).toBeCloseTo(0.0594, 15);
    // WACC = E/V·r_E + D/V·r_D(1 − T) with D/E 0.75: E/V = 1/1.75, D/V = 0.75/1.75.
    expect(row.wacc).toBeCloseTo(0.0878362988249 / 1.75 + (0.75 / 1.75) * 0.0594, 12);
  });

  it('keeps the window\'s 8 observations as the scatter and 3 rolling betas, the last ending at the as-of month', () => {
    const series = run.series[0]!;
    expect(series.scatter.market).toHaveLength(8);
    expect(series.scatter.security).toHaveLength(8);
    // The table's first window observation: January 2026, market return −0.01491101491 less r_f 0.002790116491.
    expect(series.scatter.market[0]).toBeCloseTo(-0.01491101491 - 0.002790116491, 10);
    expect(series.rolling.periods).toEqual(['2026-08', '2026-09', '2026-10']);
  });

  it('reports each input file\'s sha256 as sha256sum computes it', () => {
    const expected = execFileSync('sha256sum', [paths.prices, paths.riskFree], { encoding: 'utf8' })
      .trim().split('\n').map((line) => line.split(/\s+/)[0]);
    expect(run.inputs.map((input) => input.sha256)).toEqual(expected);
    expect(run.inputs.map((input) => input.name)).toEqual(['prices.csv', 'risk-free.csv']);
  });
});
