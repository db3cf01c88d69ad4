// Reader for the wide layout: `date,<id>,<id>,…`, one row per date, one column per security (and
// optionally the market). Prices go straight into one Float64Array per column while streaming; the
// common row (plain prices, no quotes) is read straight from the file's bytes (rowFromBytes).
import { isoOfDayNumber } from '../engine/calendar-date.js';
import { badDate, badPrice, repeatedDate } from './cell-problems.js';
import type { CellPlace } from './cell-problems.js';
import { visitCsv } from './csv-records.js';
import { ascendingOrder, findRepeatedDate, permuteFloat64, permuteInt32 } from './date-order.js';
import { compileDateFormat } from './date-format.js';
import { DateCells, NOT_PLAIN, plainPrice, skipAsciiCell } from './byte-cells.js';
import type { ByteCursor } from './byte-cells.js';
import { growableInt32, pushInt32, trimmedInt32 } from './growable-array.js';
import type { GrowableInt32 } from './growable-array.js';
import { checkSecurityCodes, requireColumn } from './header-columns.js';
import { InputError } from './input-error.js';
import { fastPrice, trimPadding } from './number-cell.js';
import type { DatedSeries, PriceFileContents, PriceFileOptions, WideLayout } from './price-file-options.js';

/** Rows are stored row-major in blocks (sequential writes while streaming), then turned into columns. */
const BLOCK_ROWS = 128;

interface WideState {
  names: readonly string[];
  dateField: number;
  valueFields: Int32Array;
  blocks: Float64Array[];
  days: GrowableInt32;
  lines: GrowableInt32;
  readonly cursor: ByteCursor;
}

/** Columns per pass of the transposition: the rows of a block are read a cache-friendly strip at a time. */
const STRIP = 32;

function toColumns(blocks: readonly Float64Array[], width: number, rows: number): Float64Array[] {
  const columns = Array.from({ length: width }, () => new Float64Array(rows));
  for (let b = 0; b < blocks.length; b++) {
    const block = blocks[b]!;
    const first = b * BLOCK_ROWS;
    const count = Math.min(BLOCK_ROWS, rows - first);
    for (let strip = 0; strip < width; strip += STRIP) {
      const stop = Math.min(width, strip + STRIP);
      for (let r = 0; r < count; r++) {
        const base = r * width;
        for (let k = strip; k < stop; k++) columns[k]![first + r] = block[base + k]!;
      }
    }
  }
  return columns;
}

/** The block that holds row `row` (a row read again as text after the byte path left it reuses it). */
function blockFor(state: WideState, row: number): Float64Array {
  const index = Math.floor(row / BLOCK_ROWS);
  if (index === state.blocks.length) state.blocks.push(new Float64Array(BLOCK_ROWS * state.valueFields.length));
  return state.blocks[index]!;
}

/**
 * The byte path for the common row: a date the format reads as it stands (ASCII, no padding) and
 * plain positive prices or empty cells (byte-cells.ts), as many fields as the header. Answers the
 * row's day, or NaN to leave the row to the text path (which then reads it, or names its problem).
 */
function rowFromBytes(state: WideState, dates: DateCells, delimiter: number, bytes: Uint8Array, start: number, end: number): number {
  const row = state.days.length;
  const block = blockFor(state, row);
  const fields = state.valueFields.length + 1;
  const dateField = state.dateField;
  const cursor = state.cursor;
  cursor.at = start;
  let day = Number.NaN;
  let k = (row % BLOCK_ROWS) * state.valueFields.length;
  for (let field = 0; field < fields; field++) {
    if (field > 0) {
      if (cursor.at >= end || bytes[cursor.at] !== delimiter) return Number.NaN; // too few fields
      cursor.at++;
    }
    if (field === dateField) {
      const first = cursor.at;
      if (!skipAsciiCell(bytes, cursor, end, delimiter)) return Number.NaN;
      day = dates.dayOf(bytes, first, cursor.at);
      if (Number.isNaN(day)) return Number.NaN;
      continue;
    }
    const price = plainPrice(bytes, cursor, end, delimiter);
    if (price === NOT_PLAIN) return Number.NaN;
    block[k++] = price;
  }
  return cursor.at === end ? day : Number.NaN; // more fields than the header: the text path says so
}

export interface WideColumns {
  readonly names: readonly string[];
  readonly dateField: number;
  readonly valueFields: Int32Array;
  readonly columns: readonly Float64Array[];
  readonly days: Int32Array;
  readonly lines: Int32Array;
}

/** Streams the file into typed columns, rows in file order. */
async function readColumns(file: string, options: PriceFileOptions, layout: WideLayout): Promise<WideColumns> {
  const format = compileDateFormat(options.dateFormat);
  const state: WideState = {
    names: [], dateField: 0, valueFields: new Int32Array(0), blocks: [], days: growableInt32(), lines: growableInt32(),
    cursor: { at: 0 },
  };
  const dates = new DateCells((text) => format.parse(text));
  const placeAt = (line: number, field: number): CellPlace => ({ file, line, field, columnName: state.names[field]! });
  await visitCsv(file, options, {
    header(names) {
      state.names = names;
      state.dateField = requireColumn(file, names, layout.dateColumn, 'INPUT_NO_DATE_COLUMN', 'date');
      state.valueFields = Int32Array.from(names.keys()).filter((i) => i !== state.dateField);
      if (state.valueFields.length === 0) {
        throw new InputError({ code: 'INPUT_NO_VALUE_COLUMN', file, line: 1, column: null, reason: 'the header has no security column' });
      }
      checkSecurityCodes(file, names, Array.from(state.valueFields));
    },
    row(fields, line) {
      const day = format.parse(trimPadding(fields[state.dateField]!));
      if (Number.isNaN(day)) throw badDate(placeAt(line, state.dateField), fields[state.dateField]!, format);
      const row = state.days.length;
      pushInt32(state.days, day);
      pushInt32(state.lines, line);
      const width = state.valueFields.length;
      const block = blockFor(state, row);
      const offset = (row % BLOCK_ROWS) * width;
      for (let k = 0; k < width; k++) {
        const field = state.valueFields[k]!;
        const price = fastPrice(fields[field]!);
        if (price === -1) throw badPrice(placeAt(line, field), fields[field]!);
        block[offset + k] = price;
      }
    },
    rowBytes(bytes, start, end, line) {
      const day = rowFromBytes(state, dates, options.delimiter.charCodeAt(0), bytes, start, end);
      if (Number.isNaN(day)) return false;
      pushInt32(state.days, day);
      pushInt32(state.lines, line);
      return true;
    },
  });
  const rows = state.days.length;
  return {
    names: state.names, dateField: state.dateField, valueFields: state.valueFields,
    columns: toColumns(state.blocks, state.valueFields.length, rows),
    days: trimmedInt32(state.days), lines: trimmedInt32(state.lines),
  };
}

/** Reads a wide price file: rows sorted by date, a repeated date refused. Series share one date list. */
export async function readWidePriceFile(
  file: string, options: PriceFileOptions, layout: WideLayout,
): Promise<PriceFileContents> {
  const read = await readColumns(file, options, layout);
  const order = ascendingOrder(read.days);
  const repeat = findRepeatedDate(read.days, order);
  if (repeat !== null) {
    const place = { file, line: read.lines[repeat.repeat]!, field: read.dateField, columnName: read.names[read.dateField]! };
    throw repeatedDate(place, isoOfDayNumber(read.days[repeat.repeat]!), read.lines[repeat.first]!, '');
  }
  const days = permuteInt32(read.days, order);
  const dates = Array.from(days, (day) => isoOfDayNumber(day));
  const series = read.columns.map((column, k): DatedSeries => ({
    id: read.names[read.valueFields[k]!]!, dates, days, prices: permuteFloat64(column, order),
  }));
  return { series, header: read.names };
}
