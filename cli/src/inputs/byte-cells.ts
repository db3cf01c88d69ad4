// Cells read straight from a row's bytes, for the readers' byte paths (wide-price-file.ts,
// long-price-file.ts). Each reads only the plain form of its cell and answers "not plain" for
// anything else, so the row goes to the text path, which reads it or names its problem: the two
// paths store the same values (checked in price-bytes.test.ts against csv-parse and Number()).

const EXACT_POWERS_OF_TEN = Array.from({ length: 23 }, (_, k) => 10 ** k);
const DOT = 46;

/** Where a cell reader stopped: at the delimiter after the cell, or at the row's end. */
export interface ByteCursor {
  at: number;
}

/** plainPrice(): the cell is not a plain price; the text path decides. */
export const NOT_PLAIN = -1;

/**
 * The price in the cell at cursor.at: `digits[.digits]` with at most 15 significant digits, as
 * mantissa / 10^k (both exact, one correctly rounded division: fastPrice's value for the same
 * text); NaN for an empty cell; NOT_PLAIN for anything else, a zero price included. The delimiter
 * is tested before the point, so a `.` delimiter ends the cell as it does in the text path.
 */
export function plainPrice(bytes: Uint8Array, cursor: ByteCursor, end: number, delimiter: number): number {
  let mantissa = 0;
  let digits = 0;
  let fraction = -1;
  const first = cursor.at;
  let at = first;
  for (; at < end; at++) {
    const code = bytes[at]!;
    if (code >= 48 && code <= 57) {
      mantissa = mantissa * 10 + (code - 48);
      if (mantissa !== 0) digits++;
      if (fraction !== -1) fraction++;
    } else if (code === delimiter) {
      break;
    } else if (code === DOT && fraction === -1) {
      fraction = 0;
    } else {
      return NOT_PLAIN;
    }
  }
  cursor.at = at;
  if (at === first) return Number.NaN;
  if (digits > 15 || fraction > 22 || at - first === (fraction === -1 ? 0 : 1)) return NOT_PLAIN;
  const price = fraction > 0 ? mantissa / EXACT_POWERS_OF_TEN[fraction]! : mantissa;
  return price > 0 ? price : NOT_PLAIN;
}

/** Moves the cursor to the delimiter after the cell (or the row's end); false if a byte is not ASCII. */
export function skipAsciiCell(bytes: Uint8Array, cursor: ByteCursor, end: number, delimiter: number): boolean {
  let at = cursor.at;
  while (at < end && bytes[at] !== delimiter) {
    if (bytes[at]! >= 0x80) return false;
    at++;
  }
  cursor.at = at;
  return true;
}

/** Moves the cursor to the delimiter after the cell (or the row's end), whatever its bytes. */
export function skipCell(bytes: Uint8Array, cursor: ByteCursor, end: number, delimiter: number): void {
  let at = cursor.at;
  while (at < end && bytes[at] !== delimiter) at++;
  cursor.at = at;
}

/**
 * Dates of a format from bytes, remembering the last one: long files repeat a date on many rows in a
 * row, and wide files never, so a repeat costs a byte comparison instead of a parse.
 */
export class DateCells {
  private readonly last = new Uint8Array(64);
  private lastLength = -1;
  private lastDay = Number.NaN;

  constructor(private readonly parse: (text: string) => number) {}

  /** The day of the ASCII bytes [start, end), NaN when the format refuses them. */
  dayOf(bytes: Uint8Array, start: number, end: number): number {
    const length = end - start;
    if (length === this.lastLength) {
      let same = true;
      for (let i = 0; i < length && same; i++) same = bytes[start + i] === this.last[i];
      if (same) return this.lastDay;
    }
    const day = this.parse(String.fromCharCode.apply(null, bytes.subarray(start, end) as unknown as number[]));
    if (length <= this.last.length) {
      this.last.set(bytes.subarray(start, end));
      this.lastLength = length;
      this.lastDay = day;
    }
    return day;
  }
}
