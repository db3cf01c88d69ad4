// Shared shapes of the estimation engine. Everything here is plain data: no I/O, no classes.
// Rates and returns are decimals (0.02 is 2%). Dates are calendar dates as ISO text `YYYY-MM-DD`.

export type Frequency = 'daily' | 'weekly' | 'monthly';

/** Periods per year used to annualise and to turn an annual yield into a per-period rate. */
export const PERIODS_PER_YEAR: Readonly<Record<Frequency, number>> = { daily: 252, weekly: 52, monthly: 12 };

export type Weekday = 'monday' | 'tuesday' | 'wednesday' | 'thursday' | 'friday' | 'saturday' | 'sunday';

export type ReturnKind = 'simple' | 'log';
export type BaseEstimator = 'ols' | 'dimson' | 'scholes-williams';
export type Adjustment = 'none' | 'blume' | 'vasicek';
export type VasicekPrior = 'cross-section' | 'cross-section-less-noise';
export type Unlevering = 'hamada' | 'harris-pringle';
export type PeerAverage = 'median' | 'mean';

export type ResultFlag = 'thin-data' | 'low-fit' | 'stale-prices' | 'unstable' | 'big-move' | 'degenerate';
export type ResultStatus = 'ok' | 'insufficient';

/** A price series on its own calendar: dates ascending, prices > 0; NaN marks a missing cell. */
export interface PriceSeries {
  readonly id: string;
  readonly dates: readonly string[];
  readonly prices: Float64Array;
}

/** The sampling grid: one label per period (`YYYY-MM`, or the period's last day `YYYY-MM-DD`). */
export interface Grid {
  readonly frequency: Frequency;
  readonly labels: readonly string[];
  /** Last calendar day of each period (for monthly and weekly); the market date for daily. */
  readonly periodEnds: readonly string[];
}

/**
 * Returns aligned on the grid. Index t is the return from period t-1 to period t; index 0 is NaN.
 * NaN marks "no return" (a missing price in either period).
 */
export interface AlignedReturns {
  readonly grid: Grid;
  readonly riskFree: Float64Array; // per-period rate applying to period t
  readonly marketExcess: Float64Array;
  readonly securities: readonly { readonly id: string; readonly excess: Float64Array; readonly raw: Float64Array }[];
}

/** Result of one regression of y on x with an intercept. */
export interface OlsFit {
  readonly n: number;
  readonly alpha: number;
  readonly beta: number;
  readonly alphaSe: number;
  readonly betaSe: number;
  readonly rSquared: number;
  readonly adjRSquared: number;
  readonly residualSd: number; // sqrt(SSR / (n - 2)), per period
  readonly ssr: number;
}

/** Everything Clinometer reports for one security. Numbers are NaN when not defined. */
export interface SecurityResult {
  readonly id: string;
  readonly status: ResultStatus;
  readonly n: number;
  readonly minimum: number;
  readonly firstPeriod: string | null;
  readonly lastPeriod: string | null;
  readonly estimator: BaseEstimator;
  readonly baseN: number; // observations in the base estimator's own sample (Dimson and Scholes–Williams lose the last k)
  readonly residualDf: number; // degrees of freedom behind betaT, betaP and the 95% interval
  readonly alpha: number; // per period
  readonly alphaSe: number;
  readonly beta: number; // base estimator's beta
  readonly betaSe: number;
  readonly betaT: number;
  readonly betaP: number; // two-sided, Student t with n - 2 (OLS) or residual df (Dimson)
  readonly betaLow95: number;
  readonly betaHigh95: number;
  readonly rSquared: number;
  readonly adjRSquared: number;
  readonly residualVolatility: number; // per period
  readonly correlation: number;
  readonly securityVolatility: number; // per period, sample (n - 1), excess returns
  readonly securityVolatilityAnnual: number;
  readonly marketVolatility: number;
  readonly marketVolatilityAnnual: number;
  readonly covariance: number; // sample (n - 1)
  readonly olsBeta: number; // plain OLS beta, always reported next to the base one
  readonly blumeBeta: number;
  readonly vasicekBeta: number;
  readonly adjustedBeta: number; // the base beta after the spec's adjustment: the beta that prices
  readonly jensenAlphaAnnual: number; // alpha * P
  readonly zeroReturnShare: number; // share of zero security returns in the window (stale prices)
  readonly rollingBetaRange: number; // max - min of the rolling betas (NaN without any)
  readonly flags: readonly ResultFlag[];
}

/** An inclusive range of grid indices [start, end]; for an estimation window, end is the as-of period. */
export interface IndexRange {
  readonly start: number;
  readonly end: number;
}

/** One base estimator's result on its own sample. Numbers are NaN when not defined. */
export interface BetaEstimate {
  readonly estimator: BaseEstimator;
  readonly n: number; // observations in the estimator's sample
  readonly residualDf: number; // degrees of freedom for t, p and the interval
  readonly firstIndex: number; // grid index of the sample's first observation (-1 when empty)
  readonly lastIndex: number;
  readonly alpha: number; // per period
  readonly alphaSe: number;
  readonly beta: number;
  readonly betaSe: number;
  readonly rSquared: number;
  readonly adjRSquared: number;
  readonly residualSd: number; // per period
  readonly ssr: number;
}
