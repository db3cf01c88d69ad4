// Per-period risk-free rates on the grid (DESIGN.md "Risk-free"). The rate applying to the return of
// period t is (1 + y)^(1/P) − 1, y the annual yield (decimal) last observed at or before the end of the
// previous period: the previous month's last calendar day, the last day of the previous week, or the
// previous market date. Compounding the per-period rate P times gives back (1 + y) exactly in
// exact arithmetic (common practice: geometric de-annualisation).
import type { DayGrid } from './sampling.js';

/** Annual yields on their own calendar: days ascending, yields as decimals, NaN for a missing cell. */
export interface YieldSeries {
  readonly days: Int32Array;
  readonly yields: Float64Array;
}

export type RiskFreeSource =
  | { readonly kind: 'series'; readonly series: YieldSeries }
  | { readonly kind: 'constant'; readonly annualYield: number };

/** (1 + y)^(1/P) − 1, computed as expm1(log1p(y) / P) to keep digits for small yields. */
export function perPeriodRate(annualYield: number, periodsPerYear: number): number {
  return Math.expm1(Math.log1p(annualYield) / periodsPerYear);
}

/**
 * The annual yield used for each grid period: index t holds the yield last observed at or before
 * the end of period t − 1. Index 0 (no previous period on the grid) and periods with no yield
 * observed yet are NaN.
 */
export function yieldsUsed(grid: DayGrid, source: RiskFreeSource): Float64Array {
  const count = grid.endDays.length;
  const used = new Float64Array(count).fill(Number.NaN);
  if (source.kind === 'constant') {
    used.fill(source.annualYield, Math.min(1, count));
    return used;
  }
  const { days, yields } = source.series;
  let next = 0;
  let last = Number.NaN;
  for (let t = 1; t < count; t++) {
    const cutoff = grid.endDays[t - 1]!;
    while (next < days.length && days[next]! <= cutoff) {
      if (!Number.isNaN(yields[next]!)) last = yields[next]!;
      next++;
    }
    used[t] = last;
  }
  return used;
}

export function perPeriodRates(annualYields: Float64Array, periodsPerYear: number): Float64Array {
  return annualYields.map((y) => perPeriodRate(y, periodsPerYear));
}
