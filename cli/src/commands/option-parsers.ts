// Parsers for option values that commander hands over as text; a bad value is a usage error.
import { InvalidArgumentError } from 'commander';
import { isCalendarDate } from '../../../server/src/contracts/run-spec.fields.js';

export function asOfOption(value: string): string {
  if (value === 'latest' || isCalendarDate(value)) return value;
  throw new InvalidArgumentError('allowed: a calendar date YYYY-MM-DD, or latest');
}

export function positiveIntegerOption(value: string): number {
  const parsed = Number(value);
  if (Number.isInteger(parsed) && parsed > 0) return parsed;
  throw new InvalidArgumentError('allowed: a whole number above 0');
}
