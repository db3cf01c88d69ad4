// Numbers in input cells. Plain decimal text with an optional sign, point and exponent
// (`1.5`, `-0.25`, `2.5E+3`); surrounding spaces and tabs are trimmed; an empty cell is "missing".
// Refused: hexadecimal, binary or octal forms, `NaN`, `Infinity`, thousands separators, decimal commas.

/** A cell's value: a finite number, NaN for an empty (missing) cell, or a problem. */
export type CellReading =
  | { readonly kind: 'value'; readonly value: number }
  | { readonly kind: 'missing' }
  | { readonly kind: 'not-number' }
  | { readonly kind: 'not-finite' };

/**
 * Decimal text starts with a digit, sign or point and ends with a digit or point; Number() would also
 * take `0x1f`, `0b1`, `0o7`, `Infinity` and Unicode spaces, so those are refused here first.
 */
function hasDecimalShape(text: string): boolean {
  const first = text.charCodeAt(0);
  const last = text.charCodeAt(text.length - 1);
  const firstOk = (first >= 48 && first <= 57) || first === 43 || first === 45 || first === 46;
  const lastOk = (last >= 48 && last <= 57) || last === 46;
  if (!firstOk || !lastOk) return false;
  if (text.length < 2 || first !== 48) return true;
  const next = text.charCodeAt(1) | 0x20;
  return next !== 0x78 && next !== 0x62 && next !== 0x6f;
}

const SPACE = 0x20;
const TAB = 0x09;

/** Trims spaces and tabs only (not other Unicode spaces), without allocating when nothing is padded. */
export function trimPadding(text: string): string {
  let start = 0;
  let end = text.length;
  while (start < end && (text.charCodeAt(start) === SPACE || text.charCodeAt(start) === TAB)) start++;
  while (end > start && (text.charCodeAt(end - 1) === SPACE || text.charCodeAt(end - 1) === TAB)) end--;
  return start === 0 && end === text.length ? text : text.slice(start, end);
}

export function readNumberCell(cell: string): CellReading {
  const text = trimPadding(cell);
  if (text.length === 0) return { kind: 'missing' };
  if (/^[+-]?Infinity$/.test(text)) return { kind: 'not-finite' };
  const value = hasDecimalShape(text) ? Number(text) : Number.NaN;
  if (Number.isNaN(value)) return { kind: 'not-number' };
  return Number.isFinite(value) ? { kind: 'value', value } : { kind: 'not-finite' };
}

/**
 * Fast path for price cells: the price, NaN for an empty cell, or -1 for anything that is not a
 * finite positive decimal number (the caller then asks readNumberCell why).
 */
export function fastPrice(cell: string): number {
  const text = trimPadding(cell);
  if (text.length === 0) return Number.NaN;
  const value = hasDecimalShape(text) ? Number(text) : -1;
  return value > 0 && value < Number.POSITIVE_INFINITY ? value : -1;
}
