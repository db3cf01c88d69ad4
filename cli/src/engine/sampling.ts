// The sampling grid and the sampling of one price series on it (DESIGN.md "Grid").
// Monthly: every calendar month, labelled YYYY-MM. Weekly: weeks ending on a chosen weekday (the week
// runs from the day after the previous week's end), labelled by that last day. Daily: the dates on
// which the market has a level. A period is priced by the last available price inside it, never by
// one after the as-of date. Each series is sampled on its own: no price inside a period gives NaN.
import type { Frequency, Grid, Weekday } from './types.js';
import {
  firstDayOfMonthIndex, isoOfDayNumber, lastDayOfMonthIndex, monthIndexOf, monthLabelOf, weekdayIndex,
  weekdayIndexOf,
} from './calendar-date.js';

/** A series on its own calendar: days ascending (day numbers), NaN for a missing value. */
export interface DaySeries {
  readonly id: string;
  readonly days: Int32Array;
  readonly prices: Float64Array;
}

/** The grid with each period's first and last calendar day as day numbers (inclusive). */
export interface DayGrid extends Grid {
  readonly startDays: Int32Array;
  readonly endDays: Int32Array;
}

export interface GridRequest {
  readonly frequency: Frequency;
  /** First day the grid must cover (normally the market's first date). */
  readonly firstDay: number;
  /** The as-of date: the grid's last period is the one containing it. */
  readonly asOfDay: number;
  /** Weekly only: the weekday that ends a week. */
  readonly weekEnd: Weekday;
  /** Daily only: the market series; its dates with a level are the periods. */
  readonly market: DaySeries;
}

export const DEFAULT_WEEK_END: Weekday = 'friday';

/** The last day of the week that contains `dayNumber`, for weeks ending on `weekEnd`. */
export function weekEndOf(dayNumber: number, weekEnd: Weekday): number {
  return dayNumber + ((weekdayIndex(weekEnd) - weekdayIndexOf(dayNumber) + 7) % 7);
}

function gridOf(frequency: Frequency, labels: string[], startDays: Int32Array, endDays: Int32Array): DayGrid {
  const periodEnds = Array.from(endDays, (day) => isoOfDayNumber(day));
  return { frequency, labels, periodEnds, startDays, endDays };
}

function monthlyGrid(firstDay: number, asOfDay: number): DayGrid {
  const firstMonth = monthIndexOf(Math.min(firstDay, asOfDay));
  const count = monthIndexOf(asOfDay) - firstMonth + 1;
  const startDays = new Int32Array(count);
  const endDays = new Int32Array(count);
  const labels: string[] = [];
  for (let i = 0; i < count; i++) {
    startDays[i] = firstDayOfMonthIndex(firstMonth + i);
    endDays[i] = lastDayOfMonthIndex(firstMonth + i);
    labels.push(monthLabelOf(firstMonth + i));
  }
  return gridOf('monthly', labels, startDays, endDays);
}

function weeklyGrid(firstDay: number, asOfDay: number, weekEnd: Weekday): DayGrid {
  const firstEnd = weekEndOf(Math.min(firstDay, asOfDay), weekEnd);
  const count = (weekEndOf(asOfDay, weekEnd) - firstEnd) / 7 + 1;
  const startDays = new Int32Array(count);
  const endDays = new Int32Array(count);
  for (let i = 0; i < count; i++) {
    endDays[i] = firstEnd + 7 * i;
    startDays[i] = endDays[i]! - 6;
  }
  const labels = Array.from(endDays, (day) => isoOfDayNumber(day));
  return gridOf('weekly', labels, startDays, endDays);
}

/** Daily periods are single market dates: a security is priced only by its own price on that date. */
function dailyGrid(firstDay: number, asOfDay: number, market: DaySeries): DayGrid {
  const days: number[] = [];
  for (let i = 0; i < market.days.length; i++) {
    const day = market.days[i]!;
    if (day >= firstDay && day <= asOfDay && !Number.isNaN(market.prices[i]!)) days.push(day);
  }
  const endDays = Int32Array.from(days);
  const labels = Array.from(endDays, (day) => isoOfDayNumber(day));
  return gridOf('daily', labels, endDays.slice(), endDays);
}

export function buildGrid(request: GridRequest): DayGrid {
  switch (request.frequency) {
    case 'monthly':
      return monthlyGrid(request.firstDay, request.asOfDay);
    case 'weekly':
      return weeklyGrid(request.firstDay, request.asOfDay, request.weekEnd);
    case 'daily':
      return dailyGrid(request.firstDay, request.asOfDay, request.market);
  }
}

/**
 * Price of each grid period: the last non-missing price dated inside the period and at or before
 * `asOfDay`; NaN when there is none. One pass over the series and the grid (both ascending).
 */
export function sampleOnGrid(series: DaySeries, grid: DayGrid, asOfDay: number): Float64Array {
  const periodCount = grid.endDays.length;
  const sampled = new Float64Array(periodCount).fill(Number.NaN);
  let period = 0;
  for (let i = 0; i < series.days.length && period < periodCount; i++) {
    const day = series.days[i]!;
    const price = series.prices[i]!;
    if (day > asOfDay) break;
    if (Number.isNaN(price)) continue;
    while (period < periodCount && grid.endDays[period]! < day) period++;
    if (period < periodCount && grid.startDays[period]! <= day) sampled[period] = price;
  }
  return sampled;
}

/** Index of the grid period containing `dayNumber`, or -1 when no period contains it. */
export function periodIndexOf(grid: DayGrid, dayNumber: number): number {
  let low = 0;
  let high = grid.endDays.length - 1;
  while (low <= high) {
    const mid = (low + high) >> 1;
    if (grid.endDays[mid]! < dayNumber) low = mid + 1;
    else high = mid - 1;
  }
  return low < grid.endDays.length && grid.startDays[low]! <= dayNumber ? low : -1;
}
