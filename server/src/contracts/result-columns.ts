import type { ResultFlag, SecurityResult } from '../../../cli/src/engine/types.js';

/**
 * The result CSV's columns: names, order, units and meaning. This list is the contract with the
 * teams that receive the released CSV; add columns at the end of their section, never rename one.
 * Rates, returns, premia and volatilities are decimals (0.02 is 2%).
 */

/** One security's row: the engine's result plus pricing and capital-structure figures. */
export interface ResultRow extends SecurityResult {
  /** The security's group label from the spec's `groups` (e.g. a sector), or null. */
  readonly group: string | null;
  /** CAPM cost of equity r_f + β·(E[R_m] − r_f) + add-on premia, per year; NaN without pricing. */
  readonly expectedReturn: number;
  /** The same with β at the low and high end of its 95% interval. */
  readonly expectedReturnLow: number;
  readonly expectedReturnHigh: number;
  /** From the spec's capital structure; NaN when the spec gives none for the security. */
  readonly debtToEquity: number;
  readonly taxRate: number;
  /** The pricing beta unlevered at the security's own D/E and tax rate (Hamada or Harris–Pringle). */
  readonly unleveredBeta: number;
  /** The one peer group listing the security, or null. */
  readonly peerGroup: string | null;
  /** The peer group's median or mean unlevered beta. */
  readonly peerUnleveredBeta: number;
  /** The peer group's average unlevered beta relevered at the group's target D/E and tax rate. */
  readonly releveredBeta: number;
  /** Pre-tax cost of debt × (1 − tax rate), per year. */
  readonly costOfDebtAfterTax: number;
  /** E/V · cost of equity + D/V · after-tax cost of debt, per year, at the security's own D/E. */
  readonly wacc: number;
}

/** What a row adds to the engine's result: group, pricing and capital structure. */
export type RowPricing = Omit<ResultRow, keyof SecurityResult>;

/**
 * A row from a result and its pricing, built as one object literal with every field named: spreading
 * a result and then more fields into a copy cost 50–100 µs per row in V8 (a new hidden class per
 * object, seen with 3,000 rows); this takes about 1 µs. The compiler checks that no field is missing.
 */
export function resultRowOf(result: SecurityResult, pricing: RowPricing): ResultRow {
  return {
    id: result.id, status: result.status, n: result.n, minimum: result.minimum,
    firstPeriod: result.firstPeriod, lastPeriod: result.lastPeriod, estimator: result.estimator,
    baseN: result.baseN, residualDf: result.residualDf, alpha: result.alpha, alphaSe: result.alphaSe,
    beta: result.beta, betaSe: result.betaSe, betaT: result.betaT, betaP: result.betaP,
    betaLow95: result.betaLow95, betaHigh95: result.betaHigh95, rSquared: result.rSquared,
    adjRSquared: result.adjRSquared, residualVolatility: result.residualVolatility,
    correlation: result.correlation, securityVolatility: result.securityVolatility,
    securityVolatilityAnnual: result.securityVolatilityAnnual, marketVolatility: result.marketVolatility,
    marketVolatilityAnnual: result.marketVolatilityAnnual, covariance: result.covariance,
    olsBeta: result.olsBeta, blumeBeta: result.blumeBeta, vasicekBeta: result.vasicekBeta,
    adjustedBeta: result.adjustedBeta, jensenAlphaAnnual: result.jensenAlphaAnnual,
    zeroReturnShare: result.zeroReturnShare, rollingBetaRange: result.rollingBetaRange, flags: result.flags,
    group: pricing.group, expectedReturn: pricing.expectedReturn,
    expectedReturnLow: pricing.expectedReturnLow, expectedReturnHigh: pricing.expectedReturnHigh,
    debtToEquity: pricing.debtToEquity, taxRate: pricing.taxRate, unleveredBeta: pricing.unleveredBeta,
    peerGroup: pricing.peerGroup, peerUnleveredBeta: pricing.peerUnleveredBeta,
    releveredBeta: pricing.releveredBeta, costOfDebtAfterTax: pricing.costOfDebtAfterTax, wacc: pricing.wacc,
  };
}

export type ColumnUnit =
  | 'text'
  | 'count'
  | 'period label'
  | 'ratio'
  | 'statistic'
  | 'probability'
  | 'share'
  | 'decimal per period'
  | 'decimal squared per period'
  | 'decimal per year';

interface ColumnBase<N extends string> {
  readonly name: N;
  readonly unit: ColumnUnit;
  readonly description: string;
}

export interface NumberColumn<N extends string = string> extends ColumnBase<N> {
  readonly type: 'number';
  /** NaN and non-finite values are written as an empty cell. */
  readonly value: (row: ResultRow) => number;
}

export interface TextColumn<N extends string = string> extends ColumnBase<N> {
  readonly type: 'text';
  /** True when the text comes from input files or the spec: then it is neutralised in the CSV. */
  readonly fromInput: boolean;
  readonly value: (row: ResultRow) => string | null;
}

export type ResultColumn = NumberColumn | TextColumn;

function num<N extends string>(name: N, unit: ColumnUnit, description: string, value: (row: ResultRow) => number): NumberColumn<N> {
  return { name, unit, description, type: 'number', value };
}

function text<N extends string>(
  name: N,
  description: string,
  value: (row: ResultRow) => string | null,
  fromInput = false,
): TextColumn<N> {
  return { name, unit: 'text', description, type: 'text', fromInput, value };
}

function period<N extends string>(name: N, description: string, value: (row: ResultRow) => string | null): TextColumn<N> {
  return { name, unit: 'period label', description, type: 'text', fromInput: false, value };
}

/** Flags in a fixed order, so a row's flags cell never depends on the order the engine set them. */
export const FLAG_ORDER: readonly ResultFlag[] = ['thin-data', 'low-fit', 'stale-prices', 'unstable', 'big-move', 'degenerate'];

function flagsCell(flags: readonly ResultFlag[]): string | null {
  const present = FLAG_ORDER.filter((flag) => flags.includes(flag));
  return present.length === 0 ? null : present.join(' ');
}

const periodLabel = 'YYYY-MM for monthly runs, YYYY-MM-DD (the period\'s last day) for weekly and daily runs';

export const RESULT_COLUMNS = [
  text('security', 'Security code as written in the price file.', (r) => r.id, true),
  text('group', 'Group label from the spec\'s groups (e.g. a sector); empty when none.', (r) => r.group, true),
  text('status', '`ok`, or `insufficient` when n is below the minimum (then no estimates).', (r) => r.status),
  num('n', 'count', 'Return observations in the window (security and market both present).', (r) => r.n),
  num('minimum', 'count', 'Minimum observations the spec requires.', (r) => r.minimum),
  period('first_period', `First period with an observation: ${periodLabel}.`, (r) => r.firstPeriod),
  period('last_period', `Last period with an observation: ${periodLabel}.`, (r) => r.lastPeriod),
  text('estimator', 'Base estimator: ols, dimson or scholes-williams.', (r) => r.estimator),
  num('base_n', 'count', 'Observations in the base estimator\'s own sample (Dimson and Scholes–Williams lose the last k).', (r) => r.baseN),
  num('residual_df', 'count', 'Degrees of freedom behind beta_t, beta_p and the 95% interval.', (r) => r.residualDf),
  num('beta', 'ratio', 'Beta of the base estimator (slope of security on market excess returns).', (r) => r.beta),
  num('beta_se', 'ratio', 'Standard error of beta.', (r) => r.betaSe),
  num('beta_t', 'statistic', 't statistic of beta (beta / beta_se).', (r) => r.betaT),
  num('beta_p', 'probability', 'Two-sided p-value of beta, Student t with the residual degrees of freedom.', (r) => r.betaP),
  num('beta_low_95', 'ratio', 'Lower end of the 95% confidence interval of beta.', (r) => r.betaLow95),
  num('beta_high_95', 'ratio', 'Upper end of the 95% confidence interval of beta.', (r) => r.betaHigh95),
  num('alpha', 'decimal per period', 'Intercept of the regression, per period.', (r) => r.alpha),
  num('alpha_se', 'decimal per period', 'Standard error of alpha.', (r) => r.alphaSe),
  num('r_squared', 'share', 'R² of the regression.', (r) => r.rSquared),
  num('adj_r_squared', 'share', 'Adjusted R² of the regression.', (r) => r.adjRSquared),
  num('correlation', 'ratio', 'Correlation of security and market excess returns; empty when the security has no variance.', (r) => r.correlation),
  num('residual_vol', 'decimal per period', 'Residual volatility √(SSR / (n − 2)), per period.', (r) => r.residualVolatility),
  num('security_vol', 'decimal per period', 'Volatility of the security\'s excess returns (sample, n − 1), per period.', (r) => r.securityVolatility),
  num('security_vol_annual', 'decimal per year', 'security_vol × √P (P = 12, 52 or 252).', (r) => r.securityVolatilityAnnual),
  num('market_vol', 'decimal per period', 'Volatility of the market\'s excess returns over the same observations, per period.', (r) => r.marketVolatility),
  num('market_vol_annual', 'decimal per year', 'market_vol × √P.', (r) => r.marketVolatilityAnnual),
  num('covariance', 'decimal squared per period', 'Covariance of security and market excess returns (sample, n − 1).', (r) => r.covariance),
  num('ols_beta', 'ratio', 'Plain OLS beta, reported whatever the base estimator.', (r) => r.olsBeta),
  num('blume_beta', 'ratio', 'Blume-adjusted base beta: w·beta + (1 − w).', (r) => r.blumeBeta),
  num('vasicek_beta', 'ratio', 'Vasicek-shrunk base beta; empty when the prior cannot be formed.', (r) => r.vasicekBeta),
  num('adjusted_beta', 'ratio', 'Base beta after the spec\'s adjustment (equals beta when the adjustment is none).', (r) => r.adjustedBeta),
  num('jensen_alpha_annual', 'decimal per year', 'Jensen\'s alpha from history: alpha × P.', (r) => r.jensenAlphaAnnual),
  num('zero_return_share', 'share', 'Share of zero security returns in the window (stale prices).', (r) => r.zeroReturnShare),
  num('rolling_beta_range', 'ratio', 'Highest minus lowest rolling beta; empty without rolling betas.', (r) => r.rollingBetaRange),
  num('expected_return', 'decimal per year', 'CAPM cost of equity r_f + beta × premium + add-on premia, with the pricing beta.', (r) => r.expectedReturn),
  num('expected_return_low', 'decimal per year', 'expected_return with the low end of the beta interval.', (r) => r.expectedReturnLow),
  num('expected_return_high', 'decimal per year', 'expected_return with the high end of the beta interval.', (r) => r.expectedReturnHigh),
  num('debt_to_equity', 'ratio', 'Debt-to-equity ratio from the spec.', (r) => r.debtToEquity),
  num('tax_rate', 'share', 'Tax rate from the spec.', (r) => r.taxRate),
  num('unlevered_beta', 'ratio', 'Pricing beta unlevered at the security\'s own D/E and tax rate.', (r) => r.unleveredBeta),
  text('peer_group', 'Name of the peer group listing the security; empty when none.', (r) => r.peerGroup, true),
  num('peer_unlevered_beta', 'ratio', 'The peer group\'s median or mean unlevered beta.', (r) => r.peerUnleveredBeta),
  num('relevered_beta', 'ratio', 'peer_unlevered_beta relevered at the peer group\'s target D/E and tax rate.', (r) => r.releveredBeta),
  num('cost_of_debt_after_tax', 'decimal per year', 'Pre-tax cost of debt × (1 − tax rate).', (r) => r.costOfDebtAfterTax),
  num('wacc', 'decimal per year', 'E/V × expected_return + D/V × cost_of_debt_after_tax at the security\'s own D/E.', (r) => r.wacc),
  text('flags', 'Space-separated flags in this order: thin-data low-fit stale-prices unstable big-move degenerate.', (r) => flagsCell(r.flags)),
] as const;

type Columns = (typeof RESULT_COLUMNS)[number];
export type ResultColumnName = Columns['name'];

export const RESULT_COLUMN_NAMES: readonly ResultColumnName[] = RESULT_COLUMNS.map((column) => column.name);

/** One row as data: keyed by column name, numbers as numbers, null for an empty cell. */
export type ResultRecord = {
  readonly [C in Columns as C['name']]: C extends NumberColumn ? number | null : string | null;
};

/** A number cell's value: non-finite becomes null, −0 becomes 0. */
export function numberValue(x: number): number | null {
  if (!Number.isFinite(x)) return null;
  return x === 0 ? 0 : x;
}

/** One column's value for a row, as a record holds it. */
export function columnValue(column: ResultColumn, row: ResultRow): number | string | null {
  return column.type === 'number' ? numberValue(column.value(row)) : column.value(row);
}

export function toResultRecord(row: ResultRow): ResultRecord {
  const record: Record<string, number | string | null> = {};
  for (const column of RESULT_COLUMNS as readonly ResultColumn[]) record[column.name] = columnValue(column, row);
  return record as ResultRecord;
}
