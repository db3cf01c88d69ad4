// Rows of a long price file gathered by security: each security's growing day, price and line
// arrays (rowsOf), and the byte path that fills them for the common row (LongRowBytes).
import { DateCells, NOT_PLAIN, plainPrice, skipAsciiCell, skipCell } from './byte-cells.js';
import type { ByteCursor } from './byte-cells.js';
import type { DateFormat } from './date-format.js';
import { growableFloat64, growableInt32, pushFloat64, pushInt32 } from './growable-array.js';
import type { GrowableFloat64, GrowableInt32 } from './growable-array.js';

export interface SecurityRows {
  readonly days: GrowableInt32;
  readonly prices: GrowableFloat64;
  readonly lines: GrowableInt32;
}

export interface LongFields {
  names: readonly string[];
  date: number;
  security: number;
  close: number;
}

export function rowsOf(bySecurity: Map<string, SecurityRows>, code: string): SecurityRows {
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
export class LongRowBytes {
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
