// Calendar dates with no time of day and no time zone, held as integer day numbers: days since
// 1970-01-01 in the proleptic Gregorian calendar. Everything here is integer arithmetic; no `Date`
// object is ever built, so the host's time zone cannot shift a date.
import type { Weekday } from './types.js';

/** Monday first, as in ISO 8601. */
export const WEEKDAYS: readonly Weekday[] = [
  'monday', 'tuesday', 'wednesday', 'thursday', 'friday', 'saturday', 'sunday',
];

export function isLeapYear(year: number): boolean {
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
}

export function daysInMonth(year: number, month: number): number {
  if (month === 2) return isLeapYear(year) ? 29 : 28;
  return month === 4 || month === 6 || month === 9 || month === 11 ? 30 : 31;
}

/** Years 1 to 9999 (four-digit years), months 1 to 12, days within the month. */
export function isCalendarDate(year: number, month: number, day: number): boolean {
  return Number.isInteger(year) && Number.isInteger(month) && Number.isInteger(day)
    && year >= 1 && year <= 9999 && month >= 1 && month <= 12
    && day >= 1 && day <= daysInMonth(year, month);
}

/**
 * Day number of a valid calendar date. Algorithm `days_from_civil` from H. Hinnant,
 * "chrono-Compatible Low-Level Date Algorithms" (public domain): eras of 400 years, March-based years.
 */
export function dayNumberOf(year: number, month: number, day: number): number {
  const y = month <= 2 ? year - 1 : year;
  const era = Math.floor(y / 400);
  const yearOfEra = y - era * 400;
  const monthFromMarch = month > 2 ? month - 3 : month + 9;
  const dayOfYear = Math.floor((153 * monthFromMarch + 2) / 5) + day - 1;
  const dayOfEra = yearOfEra * 365 + Math.floor(yearOfEra / 4) - Math.floor(yearOfEra / 100) + dayOfYear;
  return era * 146097 + dayOfEra - 719468;
}

export interface CalendarParts {
  readonly year: number;
  readonly month: number;
  readonly day: number;
}

/** Inverse of dayNumberOf: `civil_from_days` from the same source. */
export function partsOfDayNumber(dayNumber: number): CalendarParts {
  const z = dayNumber + 719468;
  const era = Math.floor(z / 146097);
  const dayOfEra = z - era * 146097;
  const yearOfEra = Math.floor(
    (dayOfEra - Math.floor(dayOfEra / 1460) + Math.floor(dayOfEra / 36524) - Math.floor(dayOfEra / 146096)) / 365,
  );
  const dayOfYear = dayOfEra - (365 * yearOfEra + Math.floor(yearOfEra / 4) - Math.floor(yearOfEra / 100));
  const monthFromMarch = Math.floor((5 * dayOfYear + 2) / 153);
  const day = dayOfYear - Math.floor((153 * monthFromMarch + 2) / 5) + 1;
  const month = monthFromMarch < 10 ? monthFromMarch + 3 : monthFromMarch - 9;
  const year = yearOfEra + era * 400 + (month <= 2 ? 1 : 0);
  return { year, month, day };
}

function pad(value: number, width: number): string {
  return String(value).padStart(width, '0');
}

/** `YYYY-MM-DD`. */
export function isoOfDayNumber(dayNumber: number): string {
  const { year, month, day } = partsOfDayNumber(dayNumber);
  return `${pad(year, 4)}-${pad(month, 2)}-${pad(day, 2)}`;
}

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/** Day number of an ISO `YYYY-MM-DD` date; throws RangeError for anything else or an impossible date. */
export function dayNumberOfIso(iso: string): number {
  const match = ISO_DATE.exec(iso);
  const year = Number(match?.[1]);
  const month = Number(match?.[2]);
  const day = Number(match?.[3]);
  if (match === null || !isCalendarDate(year, month, day)) {
    throw new RangeError(`not an ISO calendar date (YYYY-MM-DD): ${JSON.stringify(iso.slice(0, 40))}`);
  }
  return dayNumberOf(year, month, day);
}

/** 1970-01-01 (day 0) was a Thursday (index 3 with Monday = 0). */
export function weekdayIndexOf(dayNumber: number): number {
  return (((dayNumber + 3) % 7) + 7) % 7;
}

export function weekdayOf(dayNumber: number): Weekday {
  return WEEKDAYS[weekdayIndexOf(dayNumber)] as Weekday;
}

export function weekdayIndex(weekday: Weekday): number {
  return WEEKDAYS.indexOf(weekday);
}

/** Months counted from year 0: year * 12 + (month - 1). Consecutive months differ by one. */
export function monthIndexOf(dayNumber: number): number {
  const { year, month } = partsOfDayNumber(dayNumber);
  return year * 12 + month - 1;
}

export function firstDayOfMonthIndex(monthIndex: number): number {
  return dayNumberOf(Math.floor(monthIndex / 12), (monthIndex % 12) + 1, 1);
}

export function lastDayOfMonthIndex(monthIndex: number): number {
  return firstDayOfMonthIndex(monthIndex + 1) - 1;
}

/** `YYYY-MM`. */
export function monthLabelOf(monthIndex: number): string {
  return `${pad(Math.floor(monthIndex / 12), 4)}-${pad((monthIndex % 12) + 1, 2)}`;
}
