// Date formats declared in a spec with the tokens YYYY, MM and DD (e.g. `YYYY-MM-DD`, `DD/MM/YYYY`,
// `YYYYMMDD`). Every token takes exactly its width in digits; every other character of the format
// must appear as is. A text that matches but names no real day (2026-02-30) is rejected too.
import { dayNumberOf, isCalendarDate } from '../engine/calendar-date.js';

export interface DateFormat {
  readonly pattern: string;
  /** Day number of `text`, or NaN when it does not match the format or is no calendar date. */
  parse(text: string): number;
  /** Why `text` was refused (call only after parse gave NaN). */
  explain(text: string): string;
}

interface TokenSlot {
  readonly offset: number;
  readonly width: number;
}

function digitsAt(text: string, slot: TokenSlot): number {
  let value = 0;
  for (let i = slot.offset; i < slot.offset + slot.width; i++) {
    const code = text.charCodeAt(i) - 48;
    if (code < 0 || code > 9) return Number.NaN;
    value = value * 10 + code;
  }
  return value;
}

function slotOf(pattern: string, token: string): TokenSlot {
  const offset = pattern.indexOf(token);
  if (offset === -1 || pattern.indexOf(token, offset + 1) !== -1) {
    throw new RangeError(`date format ${JSON.stringify(pattern)} must contain ${token} exactly once`);
  }
  return { offset, width: token.length };
}

/** Compiles a format; throws RangeError for a format without exactly one YYYY, MM and DD. */
export function compileDateFormat(pattern: string): DateFormat {
  const year = slotOf(pattern, 'YYYY');
  const month = slotOf(pattern, 'MM');
  const day = slotOf(pattern, 'DD');
  const literals: { offset: number; code: number }[] = [];
  const covered = (i: number): boolean =>
    [year, month, day].some((slot) => i >= slot.offset && i < slot.offset + slot.width);
  for (let i = 0; i < pattern.length; i++) {
    if (!covered(i)) literals.push({ offset: i, code: pattern.charCodeAt(i) });
  }
  const matchParts = (text: string): [number, number, number] | null => {
    if (text.length !== pattern.length) return null;
    for (const literal of literals) if (text.charCodeAt(literal.offset) !== literal.code) return null;
    const parts: [number, number, number] = [digitsAt(text, year), digitsAt(text, month), digitsAt(text, day)];
    return parts.some(Number.isNaN) ? null : parts;
  };
  return {
    pattern,
    parse(text: string): number {
      const parts = matchParts(text);
      if (parts === null || !isCalendarDate(parts[0], parts[1], parts[2])) return Number.NaN;
      return dayNumberOf(parts[0], parts[1], parts[2]);
    },
    explain(text: string): string {
      return matchParts(text) === null ? `does not match the date format ${pattern}` : 'is not a calendar date';
    },
  };
}
