// Errors about single cells: dates and prices, with the file, line, field and header name.
import type { DateFormat } from './date-format.js';
import { excerpt, InputError } from './input-error.js';
import { readNumberCell, trimPadding } from './number-cell.js';

export interface CellPlace {
  readonly file: string;
  readonly line: number;
  /** 0-based field index; reported 1-based. */
  readonly field: number;
  readonly columnName: string;
}

export function badDate(place: CellPlace, cell: string, format: DateFormat): InputError {
  const text = trimPadding(cell);
  const reason = text === '' ? 'the date is empty' : `date ${excerpt(text)} ${format.explain(text)}`;
  return new InputError({
    code: 'INPUT_BAD_DATE', file: place.file, line: place.line, column: place.field + 1, columnName: place.columnName, reason,
  });
}

/** Why a price or level cell was refused (called after the fast path returned -1). */
export function badPrice(place: CellPlace, cell: string, what = 'price'): InputError {
  const reading = readNumberCell(cell);
  const text = excerpt(trimPadding(cell));
  const reason = reading.kind === 'not-number' ? `${what} ${text} is not a number`
    : reading.kind === 'not-finite' ? `${what} ${text} is not finite`
      : `${what} ${text} is not positive`;
  return new InputError({
    code: 'INPUT_BAD_PRICE', file: place.file, line: place.line, column: place.field + 1, columnName: place.columnName, reason,
  });
}

export function repeatedDate(place: CellPlace, isoDate: string, firstLine: number, subject: string): InputError {
  return new InputError({
    code: 'INPUT_DUPLICATE_DATE', file: place.file, line: place.line, column: place.field + 1, columnName: place.columnName,
    reason: `date ${isoDate}${subject} already appears on line ${firstLine}`,
  });
}
