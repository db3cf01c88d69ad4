// The estimation window (DESIGN.md "Window"): W return periods ending at the as-of period, counted on
// the calendar grid, so a security that stopped trading has few or no observations in it. The first
// return in the window uses the price of the period just before the window. Observations are
// pairwise-complete: a period counts only when both the security's and the market's excess returns
// exist. Fewer than the minimum: status `insufficient`, with n and the minimum.
import type { AlignedReturns, Frequency, ResultStatus } from './types.js';

export interface WindowSize {
  readonly length: number;
  readonly minimum: number;
}

export const DEFAULT_WINDOW: Readonly<Record<Frequency, WindowSize>> = {
  monthly: { length: 60, minimum: 36 },
  weekly: { length: 156, minimum: 104 },
  daily: { length: 252, minimum: 200 },
};

/** Inclusive return indices on the grid. Empty when first > last. */
export interface WindowBounds {
  readonly first: number;
  readonly last: number;
}

/**
 * Return indices of the W periods ending at `endIndex`. Return index 0 does not exist (no previous
 * period on the grid), so a window reaching before the grid starts is cut at index 1.
 */
export function windowBounds(endIndex: number, length: number): WindowBounds {
  if (!Number.isInteger(length) || length < 1) throw new RangeError(`window length must be a positive integer, got ${length}`);
  return { first: Math.max(1, endIndex - length + 1), last: endIndex };
}

export interface WindowSample {
  readonly status: ResultStatus;
  readonly n: number;
  readonly minimum: number;
  /** Grid index of each observation, ascending. */
  readonly periods: Int32Array;
  readonly securityExcess: Float64Array;
  readonly marketExcess: Float64Array;
  readonly firstPeriod: string | null;
  readonly lastPeriod: string | null;
}

/** The pairwise-complete excess returns of one security inside the window. */
export function windowSample(
  aligned: AlignedReturns, securityExcess: Float64Array, bounds: WindowBounds, minimum: number,
): WindowSample {
  const periods: number[] = [];
  for (let t = bounds.first; t <= bounds.last; t++) {
    if (!Number.isNaN(securityExcess[t]!) && !Number.isNaN(aligned.marketExcess[t]!)) periods.push(t);
  }
  const n = periods.length;
  const first = periods[0];
  const last = periods[n - 1];
  return {
    status: n >= minimum ? 'ok' : 'insufficient',
    n,
    minimum,
    periods: Int32Array.from(periods),
    securityExcess: Float64Array.from(periods, (t) => securityExcess[t]!),
    marketExcess: Float64Array.from(periods, (t) => aligned.marketExcess[t]!),
    firstPeriod: first === undefined ? null : aligned.grid.labels[first] ?? null,
    lastPeriod: last === undefined ? null : aligned.grid.labels[last] ?? null,
  };
}
