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

const EXACT_POWERS_OF_TEN = Array.from({ length: 23 }, (_, k) => 10 ** k);

/**
 * Plain `digits[.digits]` with at most 15 significant digits, as mantissa / 10^k: both operands are
 * exact doubles and one IEEE division rounds correctly, so the result equals Number(text)
 * (Clinger 1990, "How to Read Floating Point Numbers Accurately", the fast path). NaN otherwise.
 */
function plainDecimal(text: string): number {
  let mantissa = 0;
  let digits = 0;
  let fraction = -1;
  for (let i = 0; i < text.length; i++) {
    const code = text.charCodeAt(i);
    if (code >= 48 && code <= 57) {
      mantissa = mantissa * 10 + (code - 48);
      if (mantissa !== 0) digits++;
      if (fraction !== -1) fraction++;
    } else if (code === 46 && fraction === -1) fraction = 0;
    else return Number.NaN;
  }
  if (digits > 15 || fraction > 22 || text.length === (fraction === -1 ? 0 : 1)) return Number.NaN;
  return fraction > 0 ? mantissa / EXACT_POWERS_OF_TEN[fraction]! : mantissa;
}

/**
 * Fast path for price cells: the price, NaN for an empty cell, or -1 for anything that is not a
 * finite positive decimal number (the caller then asks readNumberCell why).
 */
export function fastPrice(cell: string): number {
  const text = trimPadding(cell);
  if (text.length === 0) return Number.NaN;
  let value = plainDecimal(text);
  if (Number.isNaN(value)) value = hasDecimalShape(text) ? Number(text) : -1;
  return value > 0 && value < Number.POSITIVE_INFINITY ? value : -1;
}
