import { parse } from 'yaml';
import { describe, expect, it } from 'vitest';
import { specIssueMessage } from './run-spec.messages.js';
import { fillRunSpecDefaults, runSpecSchema, type ResolvedRunSpec } from './run-spec.schema.js';
import { MINIMAL_SPEC, specWith } from './run-spec.test-support.js';

// The defaults below are the ones DESIGN.md ("Numerical conventions") and the spec contract fix;
// the flag thresholds are our own documented choices (docs/run-spec.md, `flags`).

function resolve(text: string): ResolvedRunSpec {
  return fillRunSpecDefaults(runSpecSchema.parse(parse(text)));
}

function issuesOf(text: string): { path: string; message: string }[] {
  const result = runSpecSchema.safeParse(parse(text), { error: specIssueMessage });
  if (result.success) throw new Error('expected the spec to be rejected');
  return result.error.issues.map((issue) => ({ path: issue.path.join('.'), message: issue.message }));
}

describe('run spec defaults', () => {
  const spec = resolve(MINIMAL_SPEC);

  it('reads a wide price file with date, security, close headers, comma and ISO dates', () => {
    expect(spec.inputs.prices).toEqual({
      pattern: 'prices-*.csv',
      layout: 'wide',
      dateColumn: 'date',
      securityColumn: 'security',
      closeColumn: 'close',
      delimiter: ',',
      dateFormat: 'YYYY-MM-DD',
    });
  });

  it('reads a market file and a risk-free file with the same defaults, the yield in percent', () => {
    const text = MINIMAL_SPEC.replace(
      '    source: price-file\n    column: QZIDX\n',
      '    source: own-file\n    pattern: index-*.csv\n    column: level\n',
    ).replace('    source: constant\n    annualYield: 0.03\n', '    source: file\n    pattern: yields-*.csv\n    column: y\n');
    const withFiles = resolve(text);
    expect(withFiles.inputs.market).toEqual({ source: 'own-file', pattern: 'index-*.csv', column: 'level', dateColumn: 'date', delimiter: ',', dateFormat: 'YYYY-MM-DD' });
    expect(withFiles.inputs.riskFree).toEqual({ source: 'file', pattern: 'yields-*.csv', column: 'y', unit: 'percent', dateColumn: 'date', delimiter: ',', dateFormat: 'YYYY-MM-DD' });
  });

  it('samples monthly simple returns, weeks ending Friday, as of the latest date', () => {
    expect(spec.sampling).toEqual({ frequency: 'monthly', weekday: 'friday', window: 60, minimum: 36, asOf: 'latest', returns: 'simple' });
  });

  it.each([
    ['monthly', 60, 36],
    ['weekly', 156, 104],
    ['daily', 252, 200],
  ])('defaults %s to a window of %i and a minimum of %i (DESIGN.md)', (frequency, window, minimum) => {
    const resolved = resolve(specWith('sampling:', `  frequency: ${frequency}`));
    expect([resolved.sampling.window, resolved.sampling.minimum]).toEqual([window, minimum]);
    expect(resolved.estimation.rolling.length).toBe(window);
  });

  it('caps the default minimum at a shorter window', () => {
    const resolved = resolve(specWith('sampling:', '  window: 24'));
    expect([resolved.sampling.window, resolved.sampling.minimum]).toEqual([24, 24]);
  });

  it('estimates OLS with no adjustment, Dimson k = 1, Vasicek over the run from the cross-section', () => {
    expect(spec.estimation).toMatchObject({
      estimator: 'ols',
      dimson: { lags: 1 },
      adjustment: 'none',
      vasicek: { priorScope: 'run', priorVariance: 'cross-section' },
    });
  });

  it('weights Blume by exactly 2/3', () => {
    // Blume (1975) as used in common practice: β_adj = 2/3 β + 1/3; the default must be the double 2/3 itself.
    expect(spec.estimation.blume.weight).toBe(2 / 3);
  });

  it('rolls 24 windows of the window length, one period apart', () => {
    expect(spec.estimation.rolling).toEqual({ length: 60, step: 1, count: 24 });
  });

  it('prices with the adjusted beta and no add-on premia when pricing is given', () => {
    const resolved = resolve(specWith('pricing:', '  riskFreeRate: 0.02', '  marketReturn: 0.08'));
    expect(resolved.pricing).toEqual({ riskFreeRate: 0.02, marketReturn: 0.08, addOnPremia: {}, beta: 'adjusted' });
  });

  it('unlevers by Hamada, debt beta 0, peer groups by median', () => {
    const resolved = resolve(
      specWith(
        'capitalStructure:',
        '  securities:',
        '    QZ1: { debtToEquity: 0.5, taxRate: 0.2 }',
        '  peerGroups:',
        '    - { name: light-industry, members: [QZ1], targetDebtToEquity: 0.4, taxRate: 0.25 }',
      ),
    );
    expect(resolved.capitalStructure?.unlevering).toBe('hamada');
    expect(resolved.capitalStructure?.securities.QZ1).toEqual({ debtToEquity: 0.5, taxRate: 0.2, debtBeta: 0 });
    expect(resolved.capitalStructure?.peerGroups[0]?.average).toBe('median');
    expect(resolve(specWith('capitalStructure: {}')).capitalStructure).toEqual({ unlevering: 'hamada', securities: {}, peerGroups: [] });
  });

  it('sets the flag thresholds', () => {
    expect(spec.flags).toEqual({ thinDataShare: 0.8, lowFitRSquared: 0.1, stalePricesShare: 0.2, unstableRange: 0.5, bigMoveChange: 0.25 });
  });

  it('writes every column and names no distribution list', () => {
    expect(spec.report).toEqual({});
  });

  it('leaves the optional sections out', () => {
    expect([spec.description, spec.pricing, spec.capitalStructure, spec.groups]).toEqual([undefined, undefined, undefined, undefined]);
  });

  it('does not share default objects between specs', () => {
    const first = resolve(specWith('pricing:', '  riskFreeRate: 0.02', '  marketPremium: 0.05'));
    (first.pricing?.addOnPremia as Record<string, number>).size = 0.01;
    expect(resolve(specWith('pricing:', '  riskFreeRate: 0.02', '  marketPremium: 0.05')).pricing?.addOnPremia).toEqual({});
  });
});

describe('run spec checks across keys', () => {
  it('rejects a minimum above the window', () => {
    expect(issuesOf(specWith('sampling:', '  window: 30', '  minimum: 31'))).toEqual([
      { path: 'sampling.minimum', message: '31 is more than the window (30); allowed: at most the window' },
    ]);
  });

  it('rejects a rolling length below the minimum', () => {
    expect(issuesOf(specWith('estimation:', '  rolling:', '    length: 12'))).toEqual([
      { path: 'estimation.rolling.length', message: '12 is less than the minimum (36); allowed: at least the minimum' },
    ]);
  });

  it('rejects Vasicek priors by group without groups', () => {
    expect(issuesOf(specWith('estimation:', '  vasicek: { priorScope: group }'))[0]?.path).toBe('estimation.vasicek.priorScope');
  });

  it('needs exactly one of market return and market premium', () => {
    expect(issuesOf(specWith('pricing:', '  riskFreeRate: 0.02'))[0]?.path).toBe('pricing');
    expect(issuesOf(specWith('pricing:', '  riskFreeRate: 0.02', '  marketReturn: 0.08', '  marketPremium: 0.06'))[0]?.path).toBe('pricing.marketPremium');
  });

  it('keeps each security in one peer group', () => {
    const issues = issuesOf(
      specWith(
        'capitalStructure:',
        '  securities: { QZ1: { debtToEquity: 0.5, taxRate: 0.2 } }',
        '  peerGroups:',
        '    - { name: a, members: [QZ1], targetDebtToEquity: 0.4, taxRate: 0.25 }',
        '    - { name: b, members: [QZ1], targetDebtToEquity: 0.4, taxRate: 0.25 }',
      ),
    );
    expect(issues).toEqual([{ path: 'capitalStructure.peerGroups.1.members.0', message: '"QZ1" is already in peer group "a"; allowed: one peer group per security' }]);
  });

  it('rejects a repeated report column and a column that does not exist', () => {
    expect(issuesOf(specWith('report:', '  columns: [security, beta, beta]'))).toEqual([
      { path: 'report.columns.2', message: '"beta" is listed twice; allowed: each column once' },
    ]);
    expect(issuesOf(specWith('report:', '  columns: [security, betta]'))[0]?.path).toBe('report.columns.1');
  });

  it('rejects two roles on one column of a long price file', () => {
    const text = MINIMAL_SPEC.replace('    pattern: prices-*.csv\n', '    pattern: prices-*.csv\n    layout: long\n    closeColumn: date\n');
    expect(issuesOf(text)[0]?.path).toBe('inputs.prices.closeColumn');
  });

  it('rejects an impossible as-of date and accepts a leap day', () => {
    expect(issuesOf(specWith('sampling:', '  asOf: 2026-02-29'))[0]?.message).toBe('"2026-02-29" is not allowed; allowed: a calendar date YYYY-MM-DD, or latest');
    expect(resolve(specWith('sampling:', '  asOf: 2028-02-29')).sampling.asOf).toBe('2028-02-29');
  });
});
