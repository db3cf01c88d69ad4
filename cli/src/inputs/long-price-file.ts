// Reader for the long layout: `date,security,close`, one row per security and date, in any order.
// Each security keeps its own calendar; a security and date given twice is refused. The common row is
// read straight from the file's bytes (LongRowBytes), any other by the text tokeniser.
import { isoOfDayNumber } from '../engine/calendar-date.js';
import { badDate, badPrice, repeatedDate } from './cell-problems.js';
import { visitCsv } from './csv-records.js';
import { ascendingOrder, findRepeatedDate, permuteFloat64, permuteInt32 } from './date-order.js';
import { compileDateFormat } from './date-format.js';
import { pushFloat64, pushInt32, trimmedFloat64, trimmedInt32 } from './growable-array.js';
import { requireColumn } from './header-columns.js';
import { LongRowBytes, rowsOf } from './long-rows.js';
import type { LongFields, SecurityRows } from './long-rows.js';
import { excerpt, InputError } from './input-error.js';
import { fastPrice, trimPadding } from './number-cell.js';
import type { DatedSeries, PriceFileContents, LongLayout, PriceFileOptions } from './price-file-options.js';

async function readRows(file: string, options: PriceFileOptions, layout: LongLayout): Promise<{ fields: LongFields; bySecurity: Map<string, SecurityRows> }> {
  const format = compileDateFormat(options.dateFormat);
  const fields: LongFields = { names: [], date: 0, security: 0, close: 0 };
  const bySecurity = new Map<string, SecurityRows>();
  const fromBytes = new LongRowBytes(fields, bySecurity, format, options.delimiter.charCodeAt(0));
  const placeAt = (line: number, field: number) => ({ file, line, field, columnName: fields.names[field]! });
  await visitCsv(file, options, {
    header(names) {
      fields.names = names;
      fields.date = requireColumn(file, names, layout.dateColumn, 'INPUT_NO_DATE_COLUMN', 'date');
      fields.security = requireColumn(file, names, layout.securityColumn, 'INPUT_NO_VALUE_COLUMN', 'security');
      fields.close = requireColumn(file, names, layout.closeColumn, 'INPUT_NO_VALUE_COLUMN', 'close');
    },
    row(cells, line) {
      const day = format.parse(trimPadding(cells[fields.date]!));
      if (Number.isNaN(day)) throw badDate(placeAt(line, fields.date), cells[fields.date]!, format);
      const code = trimPadding(cells[fields.security]!);
      if (code === '') {
        throw new InputError({ code: 'INPUT_EMPTY_SECURITY', ...placeOf(placeAt(line, fields.security)), reason: 'the security code is empty' });
      }
      const price = fastPrice(cells[fields.close]!);
      if (price === -1) throw badPrice(placeAt(line, fields.close), cells[fields.close]!);
      const rows = rowsOf(bySecurity, code);
      pushInt32(rows.days, day);
      pushFloat64(rows.prices, price);
      pushInt32(rows.lines, line);
    },
    rowBytes(bytes, start, end, line) {
      return fromBytes.take(bytes, start, end, line);
    },
  });
  return { fields, bySecurity };
}

function placeOf(place: { file: string; line: number; field: number; columnName: string }) {
  return { file: place.file, line: place.line, column: place.field + 1, columnName: place.columnName };
}

/** Shares ISO date strings between securities so a long file holds one string per distinct date. */
function isoInterner(): (day: number) => string {
  const cache = new Map<number, string>();
  return (day) => {
    let iso = cache.get(day);
    if (iso === undefined) {
      iso = isoOfDayNumber(day);
      cache.set(day, iso);
    }
    return iso;
  };
}

/** Reads a long price file; securities in order of first appearance, each sorted by date. */
export async function readLongPriceFile(
  file: string, options: PriceFileOptions, layout: LongLayout,
): Promise<PriceFileContents> {
  const { fields, bySecurity } = await readRows(file, options, layout);
  const iso = isoInterner();
  const series: DatedSeries[] = [];
  let earliest: InputError | null = null;
  for (const [id, rows] of bySecurity) {
    const days = trimmedInt32(rows.days);
    const order = ascendingOrder(days);
    const repeat = findRepeatedDate(days, order);
    if (repeat !== null && (earliest === null || rows.lines.data[repeat.repeat]! < earliest.line!)) {
      const place = { file, line: rows.lines.data[repeat.repeat]!, field: fields.date, columnName: fields.names[fields.date]! };
      earliest = repeatedDate(place, iso(days[repeat.repeat]!), rows.lines.data[repeat.first]!, ` for security ${excerpt(id)}`);
    }
    const sortedDays = permuteInt32(days, order);
    series.push({ id, days: sortedDays, dates: Array.from(sortedDays, iso), prices: permuteFloat64(trimmedFloat64(rows.prices), order) });
  }
  if (earliest !== null) throw earliest;
  return { series, header: fields.names };
}
