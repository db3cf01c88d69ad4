import { z } from 'zod';
import { notAllowed } from './run-spec.messages.js';

/** Field types the run spec uses more than once. Each failure message says what is allowed. */

export function allowedError(allowed: string): { error: (issue: { input?: unknown }) => string } {
  return { error: (issue) => (issue.input === undefined ? `is required: ${allowed}` : notAllowed(issue.input, allowed)) };
}

/** A one-line text field: its type, length and pattern failures all say what is allowed. */
function textField(allowed: string, pattern: RegExp, maxLength: number): z.ZodString {
  const error = allowedError(maxLength > 1 ? `${allowed} (at most ${maxLength} characters)` : allowed);
  return z.string(error).refine((text) => text.length <= maxLength && pattern.test(text), error);
}

export const slug = textField('lowercase letters, digits and single hyphens, e.g. core-holdings', /^[a-z0-9]+(?:-[a-z0-9]+)*$/, 64);

/** A label chosen by the analyst (a peer-group name, a group label): one line, not blank. */
export const label = textField('one line of text that neither starts nor ends with a space', /^\S(?:[^\r\n]*\S)?$/, 100);

/** A security code as written in the price file. */
export const securityCode = textField('a security code as in the price file (one line, not empty)', /^[^\r\n]+$/, 100);

export const columnName = textField('a column name as in the file\'s header (one line, not empty)', /^[^\r\n]+$/, 200);

/** A glob matched against file names in the drop folder: a name, never a path. */
export const filePattern = textField('a file-name pattern such as prices-*.csv, without / or \\', /^(?!\.\.?$)[^/\\\r\n\0]+$/, 200);

/** One character that separates fields; a quote or a line break cannot. */
export const delimiter = textField('one character other than a quote or a line break, e.g. "," ";" or "\\t"', /^[^"\r\n]$/u, 1);

const DATE_FORMAT_ALLOWED = 'YYYY, MM and DD once each, separated by -, /, . or nothing, e.g. YYYY-MM-DD, DD/MM/YYYY, YYYYMMDD';

function isDateFormat(format: string): boolean {
  const tokens = format.match(/YYYY|MM|DD/g) ?? [];
  const rest = format.replace(/YYYY|MM|DD/g, '');
  return tokens.length === 3 && new Set(tokens).size === 3 && /^[-/.]*$/.test(rest) && rest.length <= 2;
}

export const dateFormat = z.string(allowedError(DATE_FORMAT_ALLOWED)).refine(isDateFormat, allowedError(DATE_FORMAT_ALLOWED));

function daysInMonth(year: number, month: number): number {
  if (month === 2) return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0 ? 29 : 28;
  return [4, 6, 9, 11].includes(month) ? 30 : 31;
}

/** Checks a `YYYY-MM-DD` calendar date by its digits: no Date object, no time zone. */
export function isCalendarDate(text: string): boolean {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(text);
  if (!match) return false;
  const [year, month, day] = [Number(match[1]), Number(match[2]), Number(match[3])];
  return month >= 1 && month <= 12 && day >= 1 && day <= daysInMonth(year, month);
}

const DATE_ALLOWED = 'a calendar date YYYY-MM-DD, e.g. 2026-06-30';

export const calendarDate = z.string(allowedError(DATE_ALLOWED)).refine(isCalendarDate, allowedError(DATE_ALLOWED));

/** A rate, return or premium as a decimal: 0.03 is 3%. */
export const rate = z
  .number(allowedError('a decimal number, e.g. 0.03 for 3%'))
  .min(-1, allowedError('a decimal from -1 to 1 (0.03 is 3%)'))
  .max(1, allowedError('a decimal from -1 to 1 (0.03 is 3%)'));

export const share = z
  .number(allowedError('a decimal from 0 to 1, e.g. 0.25'))
  .min(0, allowedError('a decimal from 0 to 1, e.g. 0.25'))
  .max(1, allowedError('a decimal from 0 to 1, e.g. 0.25'));

export const taxRate = z
  .number(allowedError('a decimal from 0 up to but excluding 1, e.g. 0.25 for 25%'))
  .min(0, allowedError('a decimal from 0 up to but excluding 1, e.g. 0.25 for 25%'))
  .lt(1, allowedError('a decimal from 0 up to but excluding 1, e.g. 0.25 for 25%'));

export const debtToEquity = z
  .number(allowedError('a ratio of 0 or more, e.g. 0.5'))
  .min(0, allowedError('a ratio of 0 or more, e.g. 0.5'))
  .max(1000, allowedError('a ratio from 0 to 1000'));

export function wholeNumber(min: number, max: number): z.ZodNumber {
  const allowed = `a whole number from ${min} to ${max}`;
  return z.number(allowedError(allowed)).int(allowedError(allowed)).min(min, allowedError(allowed)).max(max, allowedError(allowed));
}
