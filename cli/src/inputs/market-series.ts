// The market series: a column (or, in the long layout, a code) of the price file, or a file of its
// own. Its levels follow the price rules, and a market whose returns never vary is refused: no beta
// can be estimated against it.
import { isoOfDayNumber } from '../engine/calendar-date.js';
import { badPrice } from './cell-problems.js';
import { readDatedValues } from './dated-value-file.js';
import type { DatedValueOptions } from './dated-value-file.js';
import { excerpt, InputError } from './input-error.js';
import { fastPrice } from './number-cell.js';
import type { DatedSeries } from './price-file-options.js';

export interface MarketFileOptions extends DatedValueOptions {
  /** The market's code in results; defaults to the value column's header name. */
  readonly id?: string;
}

/** True when the simple returns between consecutive levels take at least two different values. */
export function marketVaries(prices: Float64Array): boolean {
  let previous = Number.NaN;
  let low = Number.POSITIVE_INFINITY;
  let high = Number.NEGATIVE_INFINITY;
  for (const price of prices) {
    if (Number.isNaN(price)) continue;
    if (!Number.isNaN(previous)) {
      const change = price / previous - 1;
      low = Math.min(low, change);
      high = Math.max(high, change);
    }
    previous = price;
  }
  return high > low;
}

export interface MarketPlace {
  readonly file: string;
  /** 0-based field of the market's levels (the market column, or the close column). */
  readonly field: number;
  readonly columnName: string;
}

/** Throws INPUT_FLAT_MARKET, pointing at the header of the market's column. */
export function assertMarketVaries(market: DatedSeries, place: MarketPlace): void {
  if (marketVaries(market.prices)) return;
  throw new InputError({
    code: 'INPUT_FLAT_MARKET', file: place.file, line: 1, column: place.field + 1, columnName: place.columnName,
    reason: `the market series ${excerpt(market.id)} has no variance: its returns never change`,
  });
}

export async function readMarketFile(file: string, options: MarketFileOptions): Promise<DatedSeries> {
  const read = await readDatedValues(file, options, (cell, place) => {
    const level = fastPrice(cell);
    if (level === -1) throw badPrice(place, cell, 'level');
    return level;
  });
  const market: DatedSeries = {
    id: options.id ?? read.valueColumn.name,
    days: read.days,
    dates: Array.from(read.days, (day) => isoOfDayNumber(day)),
    prices: read.values,
  };
  assertMarketVaries(market, { file, field: read.valueColumn.index, columnName: read.valueColumn.name });
  return market;
}
