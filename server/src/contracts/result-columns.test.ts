import { describe, expect, it } from 'vitest';
import { RESULT_COLUMNS, RESULT_COLUMN_NAMES, toResultRecord, type ResultRow } from './result-columns.js';
import { resultRow } from './result-rows.test-support.js';

// Which row field each number column carries, written out independently of the column list.
const NUMBER_FIELDS: Record<string, keyof ResultRow> = {
  n: 'n', minimum: 'minimum', base_n: 'baseN', residual_df: 'residualDf', beta: 'beta', beta_se: 'betaSe', beta_t: 'betaT', beta_p: 'betaP',
  beta_low_95: 'betaLow95', beta_high_95: 'betaHigh95', alpha: 'alpha', alpha_se: 'alphaSe',
  r_squared: 'rSquared', adj_r_squared: 'adjRSquared', correlation: 'correlation',
  residual_vol: 'residualVolatility', security_vol: 'securityVolatility',
  security_vol_annual: 'securityVolatilityAnnual', market_vol: 'marketVolatility',
  market_vol_annual: 'marketVolatilityAnnual', covariance: 'covariance', ols_beta: 'olsBeta',
  blume_beta: 'blumeBeta', vasicek_beta: 'vasicekBeta', adjusted_beta: 'adjustedBeta',
  jensen_alpha_annual: 'jensenAlphaAnnual', zero_return_share: 'zeroReturnShare',
  rolling_beta_range: 'rollingBetaRange', expected_return: 'expectedReturn',
  expected_return_low: 'expectedReturnLow', expected_return_high: 'expectedReturnHigh',
  debt_to_equity: 'debtToEquity', tax_rate: 'taxRate', unlevered_beta: 'unleveredBeta',
  peer_unlevered_beta: 'peerUnleveredBeta', relevered_beta: 'releveredBeta',
  cost_of_debt_after_tax: 'costOfDebtAfterTax', wacc: 'wacc',
};

describe('RESULT_COLUMNS', () => {
  it('names each column once, in snake_case, with a unit and a description', () => {
    expect(new Set(RESULT_COLUMN_NAMES).size).toBe(RESULT_COLUMN_NAMES.length);
    for (const column of RESULT_COLUMNS) {
      expect(column.name).toMatch(/^[a-z][a-z0-9]*(_[a-z0-9]+)*$/);
      expect(column.unit).not.toBe('');
      expect(column.description.length).toBeGreaterThan(10);
    }
  });

  it('starts with the security and ends with the flags', () => {
    expect([RESULT_COLUMN_NAMES[0], RESULT_COLUMN_NAMES.at(-1)]).toEqual(['security', 'flags']);
  });

  it('reads each number column from its own field', () => {
    const numberColumns = RESULT_COLUMNS.filter((column) => column.type === 'number').map((column) => column.name);
    expect([...numberColumns].sort()).toEqual(Object.keys(NUMBER_FIELDS).sort());
    const distinct = Object.fromEntries(Object.values(NUMBER_FIELDS).map((field, i) => [field, 1000 + i]));
    const record = toResultRecord(resultRow('QZ1', distinct as Partial<ResultRow>)) as Record<string, unknown>;
    for (const [name, field] of Object.entries(NUMBER_FIELDS)) expect([name, record[name]]).toEqual([name, distinct[field]]);
  });

  it('marks as input text exactly the security, group and peer-group columns', () => {
    const fromInput = RESULT_COLUMNS.filter((column) => column.type === 'text' && column.fromInput).map((column) => column.name);
    expect(fromInput).toEqual(['security', 'group', 'peer_group']);
  });
});

describe('toResultRecord', () => {
  it('turns NaN and infinities into null and -0 into 0', () => {
    const record = toResultRecord(resultRow('QZ1', { beta: -0, alpha: Number.NaN, betaT: Infinity }));
    expect([record.alpha, record.beta_t]).toEqual([null, null]);
    expect(Object.is(record.beta, 0)).toBe(true);
  });

  it('writes flags in the fixed order, space-separated, and no flags as null', () => {
    expect(toResultRecord(resultRow('QZ1', { flags: ['degenerate', 'big-move', 'low-fit'] })).flags).toBe('low-fit big-move degenerate');
    expect(toResultRecord(resultRow('QZ1')).flags).toBeNull();
  });

  it('carries text fields as they are, with the period labels and status', () => {
    const record = toResultRecord(resultRow('QZ1', { group: 'utilities', peerGroup: 'light-industry', status: 'insufficient' }));
    expect([record.security, record.group, record.peer_group, record.status, record.first_period, record.last_period, record.estimator]).toEqual([
      'QZ1', 'utilities', 'light-industry', 'insufficient', '2021-11', '2026-10', 'ols',
    ]);
  });
});
