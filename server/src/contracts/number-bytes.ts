// Number cells written straight into a byte buffer, with exactly the text of formatNumberCell (the
// shortest decimal that reads back as the same double, ECMA-262 Number::toString) but without making
// a string per cell: the rolling-beta CSV has millions of cells and String(x) plus copying its
// characters was most of its write time (docs/performance.md).
//
// The fast path covers 1e-6 <= |x| < 1e15, where the text is plain decimal notation:
// - N_p, the p-significant-digit integer nearest to |x|·10^(q − 17 + p) (q = 16 − exponent), is
//   found exactly: 10^q is an exact double (q <= 22) and Dekker's two-product gives the rounding
//   error of |x|·10^q exactly, so N_17, N_16 and N_15 are all rounded from the exact product;
// - N_p reads back as x when N_p / 10^q === |x|: with N_p < 2^53 both operands are exact and one IEEE
//   division rounds correctly (Clinger 1990, the fast path of reading decimals);
// - 15 digits reading back means a shorter text may exist: then String(x) decides. Otherwise 16
//   digits if they read back, else 17 (17 significant digits always read back, and the nearest
//   17-digit decimal is the one Number::toString takes).
// Anything outside (exponent notation, a tie, N_16 >= 2^53, an exponent estimate off by one) falls
// back to String(x), so the bytes never differ from formatNumberCell.

const EXACT_POWERS_OF_TEN = Array.from({ length: 23 }, (_, k) => 10 ** k);
/** 2^27 + 1: Dekker's splitter for doubles. */
const SPLITTER = 134217729;
const TWO_POW_53 = 2 ** 53;
const UNCERTAIN = -1;

/** a·b − fl(a·b), exactly (Dekker 1971, "A floating-point technique for extending the available precision"). */
function productError(a: number, b: number, product: number): number {
  let t = SPLITTER * a;
  const aHigh = t - (t - a);
  const aLow = a - aHigh;
  t = SPLITTER * b;
  const bHigh = t - (t - b);
  const bLow = b - bHigh;
  return ((aHigh * bHigh - product) + aHigh * bLow + aLow * bHigh) + aLow * bLow;
}

/**
 * Writes the `count` digits of upper·10^lowCount + lower (lower < 10^lowCount, both below 2^31) with
 * the decimal point after n of them (−6 < n < count), from the last digit back; UNCERTAIN when the
 * last digit is 0 (a shorter text exists: String(v) decides).
 */
function writeDigits(bytes: Uint8Array, at: number, upper: number, lower: number, lowCount: number, count: number, n: number): number {
  if (lower - ((lower / 10) | 0) * 10 === 0) return UNCERTAIN;
  let first = at;
  if (n <= 0) {
    bytes[first++] = 48; // '0'
    bytes[first++] = 46; // '.'
    for (let z = 0; z < -n; z++) bytes[first++] = 48;
  } else {
    bytes[at + n] = 46;
  }
  const end = n <= 0 ? first + count : at + count + 1;
  let rest = lower;
  for (let i = count - 1; i >= 0; i--) {
    if (i === count - lowCount - 1) rest = upper;
    const tenth = (rest / 10) | 0;
    bytes[n > 0 && i >= n ? first + i + 1 : first + i] = 48 + rest - tenth * 10;
    rest = tenth;
  }
  return end;
}

/** Writes v (1e-6 <= v < 1e15) at `at` and answers the end, or UNCERTAIN to leave it to String(v). */
function writePositive(bytes: Uint8Array, at: number, v: number): number {
  // Most cells are betas between 0.1 and 10; an estimate off by one is caught below.
  const exponent = v >= 1 ? (v < 10 ? 0 : Math.floor(Math.log10(v))) : (v >= 0.1 ? -1 : Math.floor(Math.log10(v)));
  const q = 16 - exponent; // v·10^q has 17 digits before the point
  if (q < 2 || q > 22) return UNCERTAIN;
  const scale = EXACT_POWERS_OF_TEN[q]!;
  const high = v * scale;
  // In [1e16, 1e17) doubles are even integers: the exact product is high + low, |low| <= 8.
  if (high <= 1e16 || high >= 1e17) return UNCERTAIN; // the exponent estimate was off
  const low = productError(v, scale, high);
  const step = Math.round(low);
  const fraction = low - step; // exact product = N17 + fraction, |fraction| <= 0.5
  if (fraction === 0.5 || fraction === -0.5) return UNCERTAIN;
  // N17 = upper·1e9 + lower (upper·1e9 and high − upper·1e9 are exact).
  let upper = Math.floor(high / 1e9);
  let lower = high - upper * 1e9 + step;
  if (lower < 0) { upper -= 1; lower += 1e9; }
  if (lower >= 1e9) { upper += 1; lower -= 1e9; }
  // N15 and N16, the exact product rounded at 15 and 16 digits, from N17's last digits and the fraction.
  const lowerInt = lower | 0;
  const lastTwo = lowerInt - ((lowerInt / 100) | 0) * 100;
  const over15 = lastTwo + fraction;
  const lastOne = lastTwo - ((lastTwo / 10) | 0) * 10;
  const over16 = lastOne + fraction;
  if (over15 === 50 || over16 === 5) return UNCERTAIN; // a tie
  const n15 = upper * 1e7 + (lower - lastTwo) / 100 + (over15 > 50 ? 1 : 0);
  if (n15 / EXACT_POWERS_OF_TEN[q - 2]! === v) return UNCERTAIN; // 15 digits or fewer: String(v) decides
  let lower16 = (lower - lastOne) / 10 + (over16 > 5 ? 1 : 0);
  let upper16 = upper;
  if (lower16 >= 1e8) { upper16 += 1; lower16 -= 1e8; }
  const n16 = upper16 * 1e8 + lower16;
  if (n16 >= TWO_POW_53) return UNCERTAIN; // cannot tell whether 16 digits read back
  if (n16 / EXACT_POWERS_OF_TEN[q - 1]! === v) return writeDigits(bytes, at, upper16, lower16, 8, 16, exponent + 1);
  return writeDigits(bytes, at, upper, lowerInt, 9, 17, exponent + 1);
}

function writeText(bytes: Uint8Array, at: number, text: string): number {
  for (let i = 0; i < text.length; i++) bytes[at + i] = text.charCodeAt(i); // ASCII: digits, '.', '-', 'e', '+'
  return at + text.length;
}

/** Longest cell writeNumberCell can write (`-1.2345678901234567e-308`). */
export const MAX_NUMBER_CELL_BYTES = 25;

/**
 * Writes formatNumberCell(x) as ASCII at `at` (nothing for a missing or non-finite value) and
 * answers the end. `bytes` needs MAX_NUMBER_CELL_BYTES free from `at`.
 */
export function writeNumberCell(bytes: Uint8Array, at: number, x: number): number {
  if (x === 0) {
    bytes[at] = 48;
    return at + 1;
  }
  if (!Number.isFinite(x)) return at;
  const negative = x < 0;
  const v = negative ? -x : x;
  if (v >= 1e-6 && v < 1e15) {
    if (negative) bytes[at] = 45; // '-'
    const end = writePositive(bytes, negative ? at + 1 : at, v);
    if (end !== UNCERTAIN) return end;
  }
  return writeText(bytes, at, String(x));
}
