// How a price file is laid out. Column names, the delimiter and the date format come from the spec.
import type { PriceSeries } from '../engine/types.js';
import type { DaySeries } from '../engine/sampling.js';
import type { CsvDialect } from './csv-records.js';

export interface WideLayout {
  readonly layout: 'wide';
  /** Header name of the date column (any position); every other column is one security. */
  readonly dateColumn: string;
}

export interface LongLayout {
  readonly layout: 'long';
  readonly dateColumn: string;
  readonly securityColumn: string;
  readonly closeColumn: string;
}

export interface PriceFileOptions extends CsvDialect {
  readonly dateFormat: string;
  readonly columns: WideLayout | LongLayout;
  /** The market's code when its levels are in the price file (a column, or rows in the long layout). */
  readonly marketId?: string;
}

export const DEFAULT_WIDE: WideLayout = { layout: 'wide', dateColumn: 'date' };
export const DEFAULT_LONG: LongLayout = { layout: 'long', dateColumn: 'date', securityColumn: 'security', closeColumn: 'close' };

/** A series as read: ISO dates and day numbers (same order), prices > 0, NaN for an empty cell. */
export interface DatedSeries extends PriceSeries, DaySeries {
  readonly id: string;
}

export interface PriceFile {
  readonly file: string;
  readonly securities: readonly DatedSeries[];
  /** Present when `marketId` was given. */
  readonly market: DatedSeries | null;
}

/** What a layout reader returns: every column or code as a series, and the header's names. */
export interface PriceFileContents {
  readonly series: readonly DatedSeries[];
  readonly header: readonly string[];
}
