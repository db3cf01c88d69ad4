// Compares Clinometer's SecurityResults with the reference JSON of statsmodels_reference.py.
// Tolerance: |ours − reference| ≤ max(1e-9·|reference|, 1e-12) for every statistic, and an absolute
// 1e-10 for p-values; counts, statuses and period labels must be equal.
import type { SecurityResult } from '../../cli/src/engine/types.js';
import type { EngineSecurity } from './engine-side.js';

type ReferenceNumbers = Readonly<Record<string, number | null>>;

export interface ReferenceSecurity {
  readonly n: number;
  readonly minimum: number;
  readonly status: 'ok' | 'insufficient';
  readonly first_period: string | null;
  readonly last_period: string | null;
  readonly ols?: ReferenceNumbers;
  readonly dimson?: ReferenceNumbers;
}

export interface ReferenceCase {
  readonly frequency: 'daily' | 'weekly' | 'monthly';
  readonly as_of: string;
  readonly risk_free: 'file' | 'constant';
  readonly window: number;
  readonly minimum: number;
  readonly grid_periods: number;
  readonly as_of_period: string;
  readonly as_of_date: string;
  readonly securities: Readonly<Record<string, ReferenceSecurity>>;
}

export interface ReferenceDocument {
  readonly versions: Readonly<Record<string, string>>;
  readonly constant_yield: number;
  readonly cases: readonly ReferenceCase[];
}

/** Reference key → our SecurityResult field, for the plain OLS regression. */
const OLS_FIELDS: Readonly<Record<string, keyof SecurityResult>> = {
  alpha: 'alpha', alpha_se: 'alphaSe', beta: 'beta', beta_se: 'betaSe', beta_t: 'betaT', beta_p: 'betaP',
  beta_low_95: 'betaLow95', beta_high_95: 'betaHigh95', r_squared: 'rSquared', adj_r_squared: 'adjRSquared',
  residual_sd: 'residualVolatility', correlation: 'correlation', security_vol: 'securityVolatility',
  security_vol_annual: 'securityVolatilityAnnual', market_vol: 'marketVolatility',
  market_vol_annual: 'marketVolatilityAnnual', covariance: 'covariance',
};

/**
 * The Dimson k = 1 regression: its own sample size and the base-estimate fields. The reference gives
 * the beta twice: as statsmodels' t_test of the slopes' sum (beta, beta_se) and as the sum of the
 * slopes with √(1ᵀV1) from cov_params (slope_sum, slope_sum_se).
 */
const DIMSON_FIELDS: Readonly<Record<string, keyof SecurityResult>> = {
  n: 'baseN', alpha: 'alpha', alpha_se: 'alphaSe', beta: 'beta', beta_se: 'betaSe', slope_sum: 'beta', slope_sum_se: 'betaSe',
  beta_t: 'betaT', beta_p: 'betaP',
  beta_low_95: 'betaLow95', beta_high_95: 'betaHigh95', r_squared: 'rSquared', adj_r_squared: 'adjRSquared',
  residual_sd: 'residualVolatility',
};

export const RELATIVE_TOLERANCE = 1e-9;
export const ABSOLUTE_FLOOR = 1e-12;
export const P_VALUE_TOLERANCE = 1e-10;

/** The largest difference seen, with where it was. */
export interface WorstDifference {
  value: number;
  where: string;
}

export interface ComparisonTally {
  readonly mismatches: string[];
  /** Largest |ours − ref| / |ref| over statistics whose relative tolerance governs (|ref| ≥ 1e-3). */
  readonly worstRelative: WorstDifference;
  /** Largest |ours − ref| over p-values. */
  readonly worstPValue: WorstDifference;
  compared: number;
}

export function emptyTally(): ComparisonTally {
  return { mismatches: [], worstRelative: { value: 0, where: '' }, worstPValue: { value: 0, where: '' }, compared: 0 };
}

function compareNumber(tally: ComparisonTally, where: string, key: string, ours: number, reference: number | null): void {
  tally.compared += 1;
  if (reference === null || !Number.isFinite(ours)) {
    if (reference !== null || Number.isFinite(ours)) tally.mismatches.push(`${where}: ours ${ours}, reference ${reference}`);
    return;
  }
  const difference = Math.abs(ours - reference);
  const isP = key.endsWith('_p');
  const allowed = isP ? P_VALUE_TOLERANCE : Math.max(RELATIVE_TOLERANCE * Math.abs(reference), ABSOLUTE_FLOOR);
  if (!(difference <= allowed)) tally.mismatches.push(`${where}: ours ${ours}, reference ${reference}, difference ${difference}`);
  if (isP) {
    if (difference > tally.worstPValue.value) Object.assign(tally.worstPValue, { value: difference, where });
  } else if (Math.abs(reference) * RELATIVE_TOLERANCE >= ABSOLUTE_FLOOR) {
    const relative = difference / Math.abs(reference);
    if (relative > tally.worstRelative.value) Object.assign(tally.worstRelative, { value: relative, where });
  }
}

function compareBlock(
  tally: ComparisonTally, where: string, fields: Readonly<Record<string, keyof SecurityResult>>, ours: SecurityResult, reference: ReferenceNumbers,
): void {
  for (const [key, field] of Object.entries(fields)) {
    const value = ours[field];
    if (typeof value !== 'number') throw new TypeError(`${field} is not a number field`);
    const expected = reference[key];
    if (expected === undefined) throw new Error(`${where}: the reference has no ${key}`);
    compareNumber(tally, `${where} ${key}`, key, value, expected);
  }
}

function compareExact(tally: ComparisonTally, where: string, ours: unknown, reference: unknown): void {
  tally.compared += 1;
  if (ours !== reference) tally.mismatches.push(`${where}: ours ${String(ours)}, reference ${String(reference)}`);
}

/** Every statistic of one security; the OLS and Dimson results share n, status and periods. */
export function compareSecurity(tally: ComparisonTally, where: string, ours: EngineSecurity, reference: ReferenceSecurity): void {
  for (const result of [ours.ols, ours.dimson]) {
    compareExact(tally, `${where} ${result.estimator} status`, result.status, reference.status);
    compareExact(tally, `${where} ${result.estimator} n`, result.n, reference.n);
    compareExact(tally, `${where} ${result.estimator} first_period`, result.firstPeriod, reference.first_period);
    compareExact(tally, `${where} ${result.estimator} last_period`, result.lastPeriod, reference.last_period);
  }
  if (reference.status !== 'ok') return;
  if (reference.ols === undefined || reference.dimson === undefined) throw new Error(`${where}: the reference has no estimates`);
  compareBlock(tally, `${where} ols`, OLS_FIELDS, ours.ols, reference.ols);
  compareBlock(tally, `${where} dimson`, DIMSON_FIELDS, ours.dimson, reference.dimson);
}
