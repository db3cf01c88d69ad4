// From price series to excess returns aligned on one grid: builds the grid from the market's first
// date to the as-of period, samples the market and every security on it (each on its own calendar),
// forms simple returns, the per-period risk-free rate and excess returns. Pure: no I/O.
import { PERIODS_PER_YEAR } from './types.js';
import type { AlignedReturns, Frequency, ReturnKind, Weekday } from './types.js';
import { dayNumberOfIso } from './calendar-date.js';
import { buildGrid, DEFAULT_WEEK_END, sampleOnGrid } from './sampling.js';
import type { DayGrid, DaySeries } from './sampling.js';
import { excessReturns, simpleReturns, simpleReturnsInPlace } from './returns.js';
import { perPeriodRates, yieldsUsed } from './risk-free.js';
import type { RiskFreeSource } from './risk-free.js';

export interface AlignRequest {
  readonly frequency: Frequency;
  /** ISO date, or 'latest' for the market's last date with a level. */
  readonly asOf: string;
  readonly returnKind: ReturnKind;
  readonly weekEnd?: Weekday;
  readonly market: DaySeries;
  readonly securities: readonly DaySeries[];
  readonly riskFree: RiskFreeSource;
  /** Keep each security's sampled prices (for reports and tests); off by default to save memory. */
  readonly keepSampledPrices?: boolean;
}

export interface AlignedSecurity {
  readonly id: string;
  readonly excess: Float64Array;
  /** Simple returns, whatever the return kind. */
  readonly raw: Float64Array;
  readonly sampledPrices: Float64Array | null;
}

export interface AlignedSample extends AlignedReturns {
  readonly grid: DayGrid;
  readonly asOfDay: number;
  /** Grid index of the as-of period (the last period). */
  readonly asOfIndex: number;
  readonly marketLevels: Float64Array;
  readonly marketRaw: Float64Array;
  /** Annual yield (decimal) behind each period's rate. */
  readonly yieldsUsed: Float64Array;
  readonly securities: readonly AlignedSecurity[];
}

/** The market's last date with a level; NaN when the market has none. */
export function latestMarketDay(market: DaySeries): number {
  for (let i = market.days.length - 1; i >= 0; i--) {
    if (!Number.isNaN(market.prices[i]!)) return market.days[i]!;
  }
  return Number.NaN;
}

function firstMarketDay(market: DaySeries): number {
  for (let i = 0; i < market.days.length; i++) {
    if (!Number.isNaN(market.prices[i]!)) return market.days[i]!;
  }
  return Number.NaN;
}

export function resolveAsOfDay(asOf: string, market: DaySeries): number {
  const day = asOf === 'latest' ? latestMarketDay(market) : dayNumberOfIso(asOf);
  if (Number.isNaN(day)) throw new RangeError('the market series has no level, so "latest" has no date');
  return day;
}

export function alignReturns(request: AlignRequest): AlignedSample {
  const asOfDay = resolveAsOfDay(request.asOf, request.market);
  const marketStart = firstMarketDay(request.market);
  const grid = buildGrid({
    frequency: request.frequency,
    firstDay: Number.isNaN(marketStart) ? asOfDay : marketStart,
    asOfDay,
    weekEnd: request.weekEnd ?? DEFAULT_WEEK_END,
    market: request.market,
  });
  const used = yieldsUsed(grid, request.riskFree);
  const riskFree = perPeriodRates(used, PERIODS_PER_YEAR[request.frequency]);
  const marketLevels = sampleOnGrid(request.market, grid, asOfDay);
  const marketRaw = simpleReturns(marketLevels);
  const securities = request.securities.map((series): AlignedSecurity => {
    const sampled = sampleOnGrid(series, grid, asOfDay);
    const keep = request.keepSampledPrices === true;
    const raw = keep ? simpleReturns(sampled) : simpleReturnsInPlace(sampled);
    return {
      id: series.id,
      raw,
      excess: excessReturns(raw, riskFree, request.returnKind),
      sampledPrices: keep ? sampled : null,
    };
  });
  return {
    grid,
    asOfDay,
    asOfIndex: grid.endDays.length - 1,
    riskFree,
    yieldsUsed: used,
    marketLevels,
    marketRaw,
    marketExcess: excessReturns(marketRaw, riskFree, request.returnKind),
    securities,
  };
}
