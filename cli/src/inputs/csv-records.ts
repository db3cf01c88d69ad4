// Streams a CSV file record by record with the physical line each record starts on. Strict per
// INPUT-RULES.md: UTF-8 (BOM skipped), CRLF or LF, RFC 4180 quoting, every row as many fields as the
// header, blank lines only at the end. Records are handed to the visitor as they are parsed, so a
// large file is never held in memory as text or as rows.
import { createReadStream } from 'node:fs';
import { pipeline } from 'node:stream/promises';
import { CsvError, parse } from 'csv-parse';
import type { Info } from 'csv-parse';
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
  lastEndLine: number;
  pendingBlankLine: number;
  rows: number;
}

function handleRecord(file: string, visitor: CsvVisitor, state: RecordTracker, fields: string[], info: Info): void {
  const line = state.lastEndLine + 1;
  state.lastEndLine = info.lines;
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
  const line = unclosed ? state.lastEndLine + 1 : Number(error['lines'] ?? state.lastEndLine + 1);
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

/** Reads `file`, calling the visitor for the header and each data row, or throws an InputError. */
export async function visitCsv(file: string, dialect: CsvDialect, visitor: CsvVisitor): Promise<void> {
  const state: RecordTracker = { headerLength: 0, lastEndLine: 0, pendingBlankLine: 0, rows: 0 };
  const parser = parse({
    bom: true,
    delimiter: dialect.delimiter,
    relax_column_count: true,
    on_record: (fields: string[], info: Info) => {
      handleRecord(file, visitor, state, fields, info);
      return undefined;
    },
  });
  try {
    await pipeline(createReadStream(file, { highWaterMark: 1 << 20 }), createUtf8Guard(), parser);
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
