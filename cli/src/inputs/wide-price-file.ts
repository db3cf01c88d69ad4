// Reader for the wide layout: `date,<id>,<id>,…`, one row per date, one column per security (and
// optionally the market). Prices go straight into one Float64Array per column while streaming.
import { isoOfDayNumber } from '../engine/calendar-date.js';
import { badDate, badPrice, repeatedDate } from './cell-problems.js';
import type { CellPlace } from './cell-problems.js';
import { visitCsv } from './csv-records.js';
import { ascendingOrder, findRepeatedDate, permuteFloat64, permuteInt32 } from './date-order.js';
import { compileDateFormat } from './date-format.js';
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
}

function toColumns(blocks: readonly Float64Array[], width: number, rows: number): Float64Array[] {
  const columns = Array.from({ length: width }, () => new Float64Array(rows));
  blocks.forEach((block, b) => {
    const first = b * BLOCK_ROWS;
    const count = Math.min(BLOCK_ROWS, rows - first);
    for (let k = 0; k < width; k++) {
      const column = columns[k]!;
      for (let r = 0; r < count; r++) column[first + r] = block[r * width + k]!;
    }
  });
  return columns;
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
  };
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
      const place = (field: number): CellPlace => ({ file, line, field, columnName: state.names[field]! });
      const day = format.parse(trimPadding(fields[state.dateField]!));
      if (Number.isNaN(day)) throw badDate(place(state.dateField), fields[state.dateField]!, format);
      const row = state.days.length;
      pushInt32(state.days, day);
      pushInt32(state.lines, line);
      const width = state.valueFields.length;
      if (row % BLOCK_ROWS === 0) state.blocks.push(new Float64Array(BLOCK_ROWS * width));
      const block = state.blocks[state.blocks.length - 1]!;
      const offset = (row % BLOCK_ROWS) * width;
      for (let k = 0; k < width; k++) {
        const field = state.valueFields[k]!;
        const price = fastPrice(fields[field]!);
        if (price === -1) throw badPrice(place(field), fields[field]!);
        block[offset + k] = price;
      }
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
