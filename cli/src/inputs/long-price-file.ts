// Reader for the long layout: `date,security,close`, one row per security and date, in any order.
// Each security keeps its own calendar; a security and date given twice is refused. The common row is
// read straight from the file's bytes (LongRowBytes), any other by the text tokeniser.
import { isoOfDayNumber } from '../engine/calendar-date.js';
import { badDate, badPrice, repeatedDate } from './cell-problems.js';
import { visitCsv } from './csv-records.js';
import { ascendingOrder, findRepeatedDate, permuteFloat64, permuteInt32 } from './date-order.js';
import { compileDateFormat } from './date-format.js';
import type { DateFormat } from './date-format.js';
import { DateCells, NOT_PLAIN, plainPrice, skipAsciiCell, skipCell } from './byte-cells.js';
import type { ByteCursor } from './byte-cells.js';
import {
  growableFloat64, growableInt32, pushFloat64, pushInt32, trimmedFloat64, trimmedInt32,
} from './growable-array.js';
import type { GrowableFloat64, GrowableInt32 } from './growable-array.js';
import { requireColumn } from './header-columns.js';
import { excerpt, InputError } from './input-error.js';
import { fastPrice, trimPadding } from './number-cell.js';
import type { DatedSeries, PriceFileContents, LongLayout, PriceFileOptions } from './price-file-options.js';

interface SecurityRows {
  readonly days: GrowableInt32;
  readonly prices: GrowableFloat64;
  readonly lines: GrowableInt32;
}

interface LongFields {
  names: readonly string[];
  date: number;
  security: number;
  close: number;
}

function rowsOf(bySecurity: Map<string, SecurityRows>, code: string): SecurityRows {
  let rows = bySecurity.get(code);
  if (rows === undefined) {
    rows = { days: growableInt32(16), prices: growableFloat64(16), lines: growableInt32(16) };
    bySecurity.set(code, rows);
  }
  return rows;
}

/**
 * The byte path for the common row (long files are millions of short rows): a date the format reads
 * as it stands, a security code without padding, a plain price or an empty cell (byte-cells.ts),
 * as many fields as the header. Answers false to leave the row to the text path.
 */
class LongRowBytes {
  private readonly cursor: ByteCursor = { at: 0 };
  private readonly dates: DateCells;
  private readonly byHash = new Map<number, KnownCode[]>();
  private last: KnownCode | null = null;

  constructor(
    private readonly fields: LongFields,
    private readonly bySecurity: Map<string, SecurityRows>,
    format: DateFormat,
    private readonly delimiter: number,
  ) {
    this.dates = new DateCells((text) => format.parse(text));
  }

  take(bytes: Buffer, start: number, end: number, line: number): boolean {
    const { cursor, delimiter, fields } = this;
    const count = fields.names.length;
    cursor.at = start;
    let day = Number.NaN;
    let price = Number.NaN;
    let rows: SecurityRows | null = null;
    for (let field = 0; field < count; field++) {
      if (field > 0) {
        if (cursor.at >= end || bytes[cursor.at] !== delimiter) return false; // too few fields
        cursor.at++;
      }
      const first = cursor.at;
      if (field === fields.date) {
        if (!skipAsciiCell(bytes, cursor, end, delimiter)) return false;
        day = this.dates.dayOf(bytes, first, cursor.at);
        if (Number.isNaN(day)) return false;
      } else if (field === fields.security) {
        skipCell(bytes, cursor, end, delimiter);
        rows = this.rowsFor(bytes, first, cursor.at);
        if (rows === null) return false;
      } else if (field === fields.close) {
        price = plainPrice(bytes, cursor, end, delimiter);
        if (price === NOT_PLAIN) return false;
      } else {
        skipCell(bytes, cursor, end, delimiter);
      }
    }
    if (cursor.at !== end || rows === null) return false; // more fields than the header: the text path says so
    pushInt32(rows.days, day);
    pushFloat64(rows.prices, price);
    pushInt32(rows.lines, line);
    return true;
  }

  /**
   * The series of the code in bytes [start, end); null for an empty or padded code (the text path's
   * case). Codes are found by their bytes (FNV-1a hash, then a byte comparison), so a row makes no
   * string; a new code is decoded once and shares its series with the text path (rowsOf).
   */
  private rowsFor(bytes: Buffer, start: number, end: number): SecurityRows | null {
    const length = end - start;
    if (length === 0 || isPadding(bytes[start]!) || isPadding(bytes[end - 1]!)) return null;
    if (this.last !== null && sameBytes(this.last.code, bytes, start, end)) return this.last.rows;
    let hash = 0x811c9dc5;
    for (let i = start; i < end; i++) hash = Math.imul(hash ^ bytes[i]!, 0x01000193);
    let bucket = this.byHash.get(hash);
    let found: KnownCode | undefined = bucket?.find((known) => sameBytes(known.code, bytes, start, end));
    if (found === undefined) {
      found = { code: Uint8Array.prototype.slice.call(bytes, start, end), rows: rowsOf(this.bySecurity, bytes.toString('utf8', start, end)) };
      if (bucket === undefined) this.byHash.set(hash, (bucket = []));
      bucket.push(found);
    }
    this.last = found;
    return found.rows;
  }
}

interface KnownCode {
  readonly code: Uint8Array;
  readonly rows: SecurityRows;
}

function sameBytes(code: Uint8Array, bytes: Uint8Array, start: number, end: number): boolean {
  if (code.length !== end - start) return false;
  for (let i = 0; i < code.length; i++) if (code[i] !== bytes[start + i]) return false;
  return true;
}

/** Space or tab: a padded code is trimmed by the text path. */
function isPadding(code: number): boolean {
  return code === 0x20 || code === 0x09;
}

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
