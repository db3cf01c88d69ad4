// Entry point for price files in either layout. When the market's levels are in the price file
// (a column in the wide layout, a code in the long one) they are split off as the market series.
//
// Decisions DESIGN.md leaves open (full list in INPUT-RULES.md):
// - Unsorted dates are accepted and sorted ascending (vendor files are sometimes newest first); a
//   repeated date, or security and date in the long layout, is refused at its later line.
// - Padded fields are accepted: spaces and tabs around dates, codes, header names and numbers are
//   trimmed after unquoting; an all-space cell is empty (missing). Other Unicode spaces are not.
// - Blank lines are fine only at the end of a file; one between rows is a field-count error.
// - Columns are found by exact (trimmed, case-sensitive) header name, in any position.
import { excerpt, InputError } from './input-error.js';
import { readLongPriceFile } from './long-price-file.js';
import { assertMarketVaries } from './market-series.js';
import type { PriceFile, PriceFileContents, PriceFileOptions } from './price-file-options.js';
import { readWidePriceFile } from './wide-price-file.js';

function marketField(options: PriceFileOptions, header: readonly string[]): number {
  const { columns } = options;
  return header.indexOf(columns.layout === 'wide' ? (options.marketId ?? '') : columns.closeColumn);
}

function splitMarket(file: string, options: PriceFileOptions, contents: PriceFileContents): PriceFile {
  const { marketId } = options;
  if (marketId === undefined) return { file, securities: contents.series, market: null };
  const market = contents.series.find((series) => series.id === marketId);
  if (market === undefined) {
    const where = options.columns.layout === 'wide' ? 'no column' : 'no rows for the code';
    const reason = `the price file has ${where} ${excerpt(marketId)} for the market`;
    throw new InputError({ code: 'INPUT_NO_VALUE_COLUMN', file, line: 1, column: null, reason });
  }
  const field = marketField(options, contents.header);
  assertMarketVaries(market, { file, field, columnName: contents.header[field]! });
  return { file, securities: contents.series.filter((series) => series !== market), market };
}

/** Reads and checks a price file; throws InputError naming file, line, column and reason. */
export async function readPriceFile(file: string, options: PriceFileOptions): Promise<PriceFile> {
  const contents = options.columns.layout === 'wide'
    ? await readWidePriceFile(file, options, options.columns)
    : await readLongPriceFile(file, options, options.columns);
  return splitMarket(file, options, contents);
}
