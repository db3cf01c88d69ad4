// Streams a CSV file record by record with the physical line each record starts on. Strict per
// INPUT-RULES.md: UTF-8 (BOM skipped), CRLF or LF, RFC 4180 quoting, every row as many fields as the
// header, blank lines only at the end. Records are handed to the visitor as they are parsed, so a
// large file is never held in memory as text or as rows. Line numbers are physical lines counted
// here (csv-parse counts a CRLF inside quotes as two): a record starts on the line after the
// previous one ended and spans one line plus the line breaks inside its quoted fields.
import { createReadStream } from 'node:fs';
import { Writable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { CsvError, parse } from 'csv-parse';
import { InputError } from './input-error.js';
import { ByteFault, createUtf8Guard } from './utf8-guard.js';
import { locateByte } from './byte-location.js';

export interface CsvDialect {
  /** One character, e.g. `,` `;` `|` or a tab. */
  readonly delimiter: string;
}

export interface CsvVisitor {
  /** The header's fields, trimmed. */
  header(names: readonly string[]): void;
  /** A data row with exactly as many fields as the header (untrimmed); `line` is 1-based. */
  row(fields: readonly string[], line: number): void;
}

function isBlank(fields: readonly string[]): boolean {
  return fields.length === 1 && fields[0]!.trim() === '';
}

interface RecordTracker {
  headerLength: number;
  /** Physical line where the previous record ended. */
  lastEndLine: number;
  pendingBlankLine: number;
  rows: number;
}

/** Line breaks inside a record's fields: a CRLF or a lone LF counts once. */
function breaksInside(fields: readonly string[]): number {
  let breaks = 0;
  for (const field of fields) {
    for (let at = field.indexOf('\n'); at !== -1; at = field.indexOf('\n', at + 1)) breaks++;
  }
  return breaks;
}

function handleRecord(file: string, visitor: CsvVisitor, state: RecordTracker, fields: string[]): void {
  const line = state.lastEndLine + 1;
  state.lastEndLine = line + breaksInside(fields);
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

function csvProblem(file: string, error: CsvError, state: RecordTracker): InputError {
  const unclosed = error.code === 'CSV_QUOTE_NOT_CLOSED';
  const line = state.lastEndLine + 1;
  const column = Number(error['column'] ?? 0) + 1;
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
  const parser = parse({ bom: true, delimiter: dialect.delimiter, relax_column_count: true });
  const sink = new Writable({
    objectMode: true,
    highWaterMark: 1024,
    write(fields: string[], _encoding, callback) {
      try {
        handleRecord(file, visitor, state, fields);
        callback();
      } catch (error) {
        callback(error as Error);
      }
    },
  });
  try {
    await pipeline(createReadStream(file, { highWaterMark: 1 << 20 }), createUtf8Guard(), parser, sink);
  } catch (error) {
    if (error instanceof InputError) throw error;
    if (error instanceof ByteFault) throw await byteProblem(file, error, dialect);
    if (error instanceof CsvError) throw csvProblem(file, error, state);
    throw unreadable(file, error as NodeJS.ErrnoException);
  }
  if (state.headerLength === 0) {
    throw new InputError({ code: 'INPUT_EMPTY', file, line: 1, column: null, reason: 'the file is empty' });
  }
  if (state.rows === 0) {
    throw new InputError({ code: 'INPUT_EMPTY', file, line: 1, column: null, reason: 'the header has no data rows below it' });
  }
}
