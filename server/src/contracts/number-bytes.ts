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
// - when N_16 >= 2^53 it is not an exact double: then it reads back when it lies within half an ulp
//   of |x| (the distance is known exactly from N_17's last digit and the rounding error);
// - 15 digits reading back means a shorter text may exist: then String(x) decides. Otherwise 16
//   digits if they read back, else 17 (17 significant digits always read back, and the nearest
//   17-digit decimal is the one Number::toString takes).
// Anything outside (exponent notation, a tie, a power of two next to 2^53·10^k, an exponent estimate
// off by one) falls back to String(x), so the bytes never differ from formatNumberCell.

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
 * last digit is 0 (a shorter text exists: String(v) decides) or the number is a whole one (n >= count).
 */
function writeDigits(bytes: Uint8Array, at: number, upper: number, lower: number, lowCount: number, count: number, n: number): number {
  if (n >= count || lower - ((lower / 10) | 0) * 10 === 0) return UNCERTAIN;
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

/** Exact powers of two, 2^-80 … 2^63, by index k + 80 (v < 1e15 < 2^50; its half ulp >= 2^-74). */
const POWERS_OF_TWO = Array.from({ length: 144 }, (_, k) => 2 ** (k - 80));

/** floor(log2 v) for 1e-6 <= v < 1e15. */
function binaryExponent(v: number): number {
  const estimate = Math.floor(Math.log2(v));
  if (POWERS_OF_TWO[estimate + 80]! > v) return estimate - 1;
  return POWERS_OF_TWO[estimate + 81]! <= v ? estimate + 1 : estimate;
}

/**
 * Whether a decimal `offset` away from v·10^q (in units of 10^-q; the offset exact to a few units in
 * the last place) reads back as v: it must lie within half an ulp of v. null when too close to tell,
 * or when v is a power of two (its interval is narrower below than above).
 */
function withinHalfUlp(v: number, scale: number, offset: number): boolean | null {
  const binary = binaryExponent(v);
  if (v === POWERS_OF_TWO[binary + 80]) return null;
  const halfUlp = scale * POWERS_OF_TWO[binary - 53 + 80]!; // exact: a power of ten times a power of two
  const distance = Math.abs(offset);
  if (Math.abs(distance - halfUlp) < 1e-9) return null;
  return distance < halfUlp;
}

const NOT_SHORT = 0;
/** The digits shortestUpTo15 found: shortUpper·10^(p − 8) + shortLower. */
let shortUpper = 0;
let shortLower = 0;

/**
 * The fewest digits p <= 15 whose N_p reads back as v, with N_p in shortUpper and shortLower;
 * NOT_SHORT when 15 digits do not read back (16 or 17 are needed); UNCERTAIN when it cannot tell
 * here (a tie, 9 digits or fewer reading back, v a power of two, a check that needs 10^-k).
 * N_17 = upper·1e9 + lower, the exact product N_17 + fraction. Reading back is monotone in p: if
 * p digits read back so do p + 1 (the nearest p + 1-digit decimal is at least as close), so the
 * search stops at the first p that does not.
 */
function shortestUpTo15(v: number, q: number, upper: number, lower: number, fraction: number): number {
  let found = NOT_SHORT;
  for (let p = 15; p >= 9; p--) {
    const check = q - 17 + p; // N_p / 10^check is the p-digit decimal
    if (check < 0) return UNCERTAIN;
    const divisor = EXACT_POWERS_OF_TEN[17 - p]!;
    const tail = lower - ((lower / divisor) | 0) * divisor;
    const over = tail + fraction;
    const half = divisor / 2;
    if (over === half) return UNCERTAIN; // a tie
    const lowLimit = EXACT_POWERS_OF_TEN[p - 8]!;
    let low = (lower - tail) / divisor + (over > half ? 1 : 0);
    let up = upper;
    if (low >= lowLimit) { up += 1; low -= lowLimit; }
    if ((up * lowLimit + low) / EXACT_POWERS_OF_TEN[check]! !== v) break;
    found = p;
    shortUpper = up;
    shortLower = low;
  }
  if (found === NOT_SHORT) return NOT_SHORT;
  if (found === 9 || v === POWERS_OF_TWO[binaryExponent(v) + 80]) return UNCERTAIN;
  return found;
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
  // N_p for p <= 16: the exact product rounded at p digits, from N17's last digits and the fraction.
  const lowerInt = lower | 0;
  const shortest = shortestUpTo15(v, q, upper, lowerInt, fraction);
  if (shortest !== NOT_SHORT) {
    if (shortest === UNCERTAIN) return UNCERTAIN;
    return writeDigits(bytes, at, shortUpper, shortLower, shortest - 8, shortest, exponent + 1);
  }
  const lastOne = lowerInt - ((lowerInt / 10) | 0) * 10;
  const over16 = lastOne + fraction;
  if (over16 === 5) return UNCERTAIN; // a tie
  let lower16 = (lower - lastOne) / 10 + (over16 > 5 ? 1 : 0);
  let upper16 = upper;
  if (lower16 >= 1e8) { upper16 += 1; lower16 -= 1e8; }
  const n16 = upper16 * 1e8 + lower16;
  const sixteenReadBack = n16 < TWO_POW_53
    ? n16 / EXACT_POWERS_OF_TEN[q - 1]! === v
    : withinHalfUlp(v, scale, (over16 > 5 ? 10 - lastOne : -lastOne) - fraction);
  if (sixteenReadBack === null) return UNCERTAIN;
  if (sixteenReadBack) return writeDigits(bytes, at, upper16, lower16, 8, 16, exponent + 1);
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
