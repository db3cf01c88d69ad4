// Day numbers are checked against ECMAScript's own UTC day arithmetic (ECMA-262 "MakeDay" and
// "Day(t)": Date.UTC(y, m − 1, d) / 86 400 000), used here as the reference library only.
import { describe, expect, it } from 'vitest';
import {
  dayNumberOf, dayNumberOfIso, daysInMonth, isCalendarDate, isoOfDayNumber, lastDayOfMonthIndex, monthIndexOf,
  monthLabelOf, partsOfDayNumber, weekdayOf,
} from './calendar-date.js';

const MS_PER_DAY = 86_400_000;

describe('calendar dates as day numbers', () => {
  it('agrees with Date.UTC on every 5th day from 1800 to 2200, both ways', () => {
    for (let day = Date.UTC(1800, 0, 1) / MS_PER_DAY; day < Date.UTC(2200, 0, 1) / MS_PER_DAY; day += 5) {
      const reference = new Date(day * MS_PER_DAY);
      const parts = { year: reference.getUTCFullYear(), month: reference.getUTCMonth() + 1, day: reference.getUTCDate() };
      expect(partsOfDayNumber(day)).toEqual(parts);
      expect(dayNumberOf(parts.year, parts.month, parts.day)).toBe(day);
    }
  });

  it('counts 1970-01-01 as day 0, a Thursday', () => {
    expect(dayNumberOf(1970, 1, 1)).toBe(0);
    expect(weekdayOf(0)).toBe('thursday');
  });

  it('gives the weekday Date.UTC gives (getUTCDay, Sunday = 0)', () => {
    const names = ['sunday', 'monday', 'tuesday', 'wednesday', 'thursday', 'friday', 'saturday'];
    for (let day = -800; day < 30_000; day += 13) {
      expect(weekdayOf(day)).toBe(names[new Date(day * MS_PER_DAY).getUTCDay()]);
    }
    expect(weekdayOf(dayNumberOfIso('2026-10-30'))).toBe('friday');
  });

  it('follows the Gregorian leap-year rule (every 4th year, not centuries, except every 400th)', () => {
    expect(isCalendarDate(2000, 2, 29)).toBe(true);
    expect(isCalendarDate(1900, 2, 29)).toBe(false);
    expect(isCalendarDate(2024, 2, 29)).toBe(true);
    expect(isCalendarDate(2026, 2, 29)).toBe(false);
    expect(daysInMonth(2026, 4)).toBe(30);
  });

  it('refuses impossible dates and loose ISO text', () => {
    expect(isCalendarDate(2026, 2, 30)).toBe(false);
    expect(isCalendarDate(2026, 13, 1)).toBe(false);
    expect(() => dayNumberOfIso('2026-02-30')).toThrow(RangeError);
    expect(() => dayNumberOfIso('2026-2-3')).toThrow(RangeError);
    expect(() => dayNumberOfIso('2026-02-03T00:00')).toThrow(RangeError);
  });

  it('writes ISO text with four-digit years and round-trips it', () => {
    expect(isoOfDayNumber(dayNumberOf(2026, 2, 28))).toBe('2026-02-28');
    expect(isoOfDayNumber(dayNumberOf(812, 7, 4))).toBe('0812-07-04');
    expect(dayNumberOfIso('2025-12-31')).toBe(Date.UTC(2025, 11, 31) / MS_PER_DAY);
  });

  it('finds month labels and last calendar days of months', () => {
    const february2024 = monthIndexOf(dayNumberOfIso('2024-02-10'));
    expect(monthLabelOf(february2024)).toBe('2024-02');
    expect(isoOfDayNumber(lastDayOfMonthIndex(february2024))).toBe('2024-02-29');
    expect(isoOfDayNumber(lastDayOfMonthIndex(february2024 + 10))).toBe('2024-12-31');
    expect(monthLabelOf(february2024 + 11)).toBe('2025-01');
  });
});
