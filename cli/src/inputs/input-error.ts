// The one error every input reader throws. It names the file, the physical line (1-based), the field
// (1-based, with the header's name where there is one) and the reason, and never echoes more than a
// short excerpt of the offending text.

export type InputErrorCode =
  | 'INPUT_UNREADABLE'
  | 'INPUT_NOT_UTF8'
  | 'INPUT_NOT_CSV'
  | 'INPUT_EMPTY'
  | 'INPUT_NO_DATE_COLUMN'
  | 'INPUT_NO_VALUE_COLUMN'
  | 'INPUT_FIELD_COUNT'
  | 'INPUT_BAD_DATE'
  | 'INPUT_DUPLICATE_DATE'
  | 'INPUT_BAD_PRICE'
  | 'INPUT_DUPLICATE_SECURITY'
  | 'INPUT_EMPTY_SECURITY'
  | 'INPUT_FLAT_MARKET'
  | 'INPUT_BAD_RATE';

export interface InputErrorDetails {
  readonly code: InputErrorCode;
  readonly file: string;
  readonly line: number | null;
  readonly column: number | null;
  readonly columnName?: string | null;
  readonly reason: string;
}

export const EXCERPT_LIMIT = 40;

/** At most 40 characters of input text, quoted, control characters escaped. */
export function excerpt(text: string): string {
  const short = text.length > EXCERPT_LIMIT ? `${text.slice(0, EXCERPT_LIMIT - 1)}…` : text;
  return JSON.stringify(short);
}

function locationOf(details: InputErrorDetails): string {
  let location = details.file;
  if (details.line !== null) location += `:${details.line}`;
  if (details.line !== null && details.column !== null) location += `:${details.column}`;
  const name = details.columnName ?? null;
  if (name !== null) location += ` (column ${excerpt(name).slice(1, -1)})`;
  return location;
}

export class InputError extends Error {
  readonly code: InputErrorCode;
  readonly file: string;
  readonly line: number | null;
  readonly column: number | null;
  readonly columnName: string | null;
  readonly reason: string;

  constructor(details: InputErrorDetails) {
    super(`${locationOf(details)}: ${details.reason}`);
    this.name = 'InputError';
    this.code = details.code;
    this.file = details.file;
    this.line = details.line;
    this.column = details.column;
    this.columnName = details.columnName ?? null;
    this.reason = details.reason;
  }
}
