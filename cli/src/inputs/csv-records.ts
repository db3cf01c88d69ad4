// Streams a CSV file record by record with the physical line each record starts on. Strict per
// INPUT-RULES.md: UTF-8 (BOM skipped), CRLF or LF, RFC 4180 quoting, every row as many fields as the
// header, blank lines only at the end. Records are handed to the visitor as they are tokenised, so a
// large file is never held in memory as text or as rows. The tokeniser (csv-tokeniser.ts, our own:
// csv-parse took most of the parse time, see there) reports the line breaks inside each record; a
// record starts on the line after the previous one ended and spans one line plus those breaks.
// A visitor may also read plain rows straight from the bytes (rowBytes: both price readers do; the
// byte sink is record-sink.ts); any row it leaves goes through the tokeniser as before.
import { createReadStream } from 'node:fs';
import { pipeline } from 'node:stream/promises';
import { InputError } from './input-error.js';
import { ByteFault, createUtf8Guard } from './utf8-guard.js';
import { locateByte } from './byte-location.js';
import { CsvQuoteError, CsvTokeniser } from './csv-tokeniser.js';
import { tokenisingSink } from './record-sink.js';

export interface CsvDialect {
  /** One character, e.g. `,` `;` `|` or a tab. */
  readonly delimiter: string;
}

export interface CsvVisitor {
  /** The header's fields, trimmed. */
  header(names: readonly string[]): void;
  /** A data row with exactly as many fields as the header (untrimmed); `line` is 1-based. */
  row(fields: readonly string[], line: number): void;
  /**
   * Optional fast path: a data row as bytes[start, end) — one physical line without a quote or its
   * line break, after the header. Read it and answer true only when it has as many fields as the
   * header and every one is read; answer false to have the row tokenised as text and given to row()
   * instead, which stores it afresh or names its problem.
   */
  rowBytes?(bytes: Buffer, start: number, end: number, line: number): boolean;
}

function isBlank(fields: readonly string[]): boolean {
  return fields.length === 1 && fields[0]!.trim() === '';
}

export interface RecordTracker {
  headerLength: number;
  /** Physical line where the previous record ended. */
  lastEndLine: number;
  pendingBlankLine: number;
  rows: number;
}

/** `breaksInside`: LF characters inside the record's fields (a CRLF counts once). */
function handleRecord(file: string, visitor: CsvVisitor, state: RecordTracker, fields: string[], breaksInside: number): void {
  const line = state.lastEndLine + 1;
  state.lastEndLine = line + breaksInside;
  if (isBlank(fields)) {
    if (state.pendingBlankLine === 0) state.pendingBlankLine = line;
    return;
  }
  if (state.pendingBlankLine !== 0) {
    const where = state.headerLength === 0 ? 'before the header' : 'between data rows';
    throw new InputError({ code: 'INPUT_FIELD_COUNT', file, line: state.pendingBlankLine, column: 1, reason: `blank line ${where}` });
  }
  if (state.headerLength === 0) {
    state.headerLength = fields.length;
    visitor.header(fields.map((name) => name.trim()));
    return;
  }
  if (fields.length !== state.headerLength) {
    const column = Math.min(fields.length, state.headerLength) + 1;
    const reason = `row has ${fields.length} fields, the header has ${state.headerLength}`;
    throw new InputError({ code: 'INPUT_FIELD_COUNT', file, line, column, reason });
  }
  state.rows++;
  visitor.row(fields, line);
}

function csvProblem(file: string, error: CsvQuoteError, state: RecordTracker): InputError {
  const unclosed = error.kind === 'unclosed';
  const line = state.lastEndLine + 1;
  const column = error.field + 1;
  const reason = unclosed ? 'a quoted field is never closed' : 'a quote is misplaced (RFC 4180: quotes enclose a whole field)';
  return new InputError({ code: 'INPUT_NOT_CSV', file, line, column, reason });
}

async function byteProblem(file: string, fault: ByteFault, dialect: CsvDialect): Promise<InputError> {
  const { line, column } = await locateByte(file, fault.offset, dialect.delimiter);
  const reason = fault.kind === 'nul'
    ? 'contains a NUL byte: not a text file'
    : `byte ${fault.offset + 1} is not valid UTF-8 text`;
  return new InputError({ code: fault.kind === 'nul' ? 'INPUT_NOT_CSV' : 'INPUT_NOT_UTF8', file, line, column, reason });
}

function unreadable(file: string, error: NodeJS.ErrnoException): InputError {
  return new InputError({ code: 'INPUT_UNREADABLE', file, line: null, column: null, reason: `cannot read the file (${error.code ?? error.message})` });
}

/** One character that is not a quote, a line break or a letter-or-digit; throws RangeError otherwise. */
export function checkDelimiter(delimiter: string): void {
  if (delimiter.length !== 1 || /["\r\n\p{L}\p{N}]/u.test(delimiter)) {
    throw new RangeError(`the delimiter must be one character other than a quote, a line break, a letter or a digit, got ${JSON.stringify(delimiter)}`);
  }
}

/** Reads `file`, calling the visitor for the header and each data row, or throws an InputError. */
export async function visitCsv(file: string, dialect: CsvDialect, visitor: CsvVisitor): Promise<void> {
  checkDelimiter(dialect.delimiter);
  const state: RecordTracker = { headerLength: 0, lastEndLine: 0, pendingBlankLine: 0, rows: 0 };
  const tokeniser = new CsvTokeniser(dialect.delimiter, (fields, breaksInside) => {
    handleRecord(file, visitor, state, fields, breaksInside);
  });
  try {
    await pipeline(createReadStream(file, { highWaterMark: 1 << 20 }), createUtf8Guard(), tokenisingSink(tokeniser, state, visitor));
  } catch (error) {
    if (error instanceof InputError) throw error;
    if (error instanceof ByteFault) throw await byteProblem(file, error, dialect);
    if (error instanceof CsvQuoteError) throw csvProblem(file, error, state);
    throw unreadable(file, error as NodeJS.ErrnoException);
  }
  if (state.headerLength === 0) {
    throw new InputError({ code: 'INPUT_EMPTY', file, line: 1, column: null, reason: 'the file is empty' });
  }
  if (state.rows === 0) {
    throw new InputError({ code: 'INPUT_EMPTY', file, line: 1, column: null, reason: 'the header has no data rows below it' });
  }
}
