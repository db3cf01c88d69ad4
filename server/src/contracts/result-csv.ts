import { MAX_NUMBER_CELL_BYTES, writeNumberCell } from './number-bytes.js';
import {
  RESULT_COLUMNS,
  columnValue,
  toResultRecord,
  type ResultColumn,
  type ResultColumnName,
  type ResultRecord,
  type ResultRow,
} from './result-columns.js';

/**
 * The one writer of the result CSV. The same records give the same bytes whatever their order:
 * rows sorted by security code in UTF-8 byte order, numbers in shortest round-trip decimal, no
 * timestamps. `clino run --out` and the release mail both call renderResultCsv.
 */

/**
 * Shortest round-trip decimal: for a finite double, ECMAScript's Number::toString gives the
 * shortest digit string that reads back as the same double. −0 is written `0`; NaN and ±Infinity
 * as an empty cell.
 */
export function formatNumberCell(x: number | null): string {
  if (x === null || !Number.isFinite(x)) return '';
  return x === 0 ? '0' : String(x);
}

/** First characters that a spreadsheet reads as the start of a formula or a control character. */
const FORMULA_START = /^[=+\-@\t\r]/;

/**
 * Spreadsheet-safe text: a cell from input (a security code, a group or peer-group name) that
 * starts with `=`, `+`, `-`, `@`, a tab or a carriage return is written with a leading apostrophe,
 * so a spreadsheet shows it as text instead of evaluating it. Other text is written unchanged.
 */
export function neutraliseText(value: string): string {
  return FORMULA_START.test(value) ? `'${value}` : value;
}

/** Byte order of the UTF-8 encodings (not UTF-16 code-unit order, which differs above U+FFFF). */
export function compareSecurityCodes(a: string, b: string): number {
  return Buffer.compare(Buffer.from(a, 'utf8'), Buffer.from(b, 'utf8'));
}

/** Items sorted by security code (compareSecurityCodes, each code encoded once); a code twice throws. */
function sortedBySecurity<T>(items: readonly T[], securityOf: (item: T) => string): T[] {
  const keyed = items.map((item) => {
    const security = securityOf(item);
    return { item, security, key: Buffer.from(security, 'utf8') };
  });
  keyed.sort((a, b) => Buffer.compare(a.key, b.key));
  for (let i = 1; i < keyed.length; i += 1) {
    if (keyed[i]!.security === keyed[i - 1]!.security) {
      throw new Error(`Two result rows for security ${JSON.stringify(keyed[i]!.security)}`);
    }
  }
  return keyed.map(({ item }) => item);
}

/** Records sorted by security; two records for one security is a bug upstream, not a tie to break. */
export function sortResultRecords(records: readonly ResultRecord[]): ResultRecord[] {
  return sortedBySecurity(records, (record) => record.security ?? '');
}

/**
 * The columns to write: the spec's `report.columns` in the canonical order, `security` always
 * included; every column when the spec names none.
 */
export function selectResultColumns(names?: readonly ResultColumnName[]): readonly ResultColumn[] {
  const all = RESULT_COLUMNS as readonly ResultColumn[];
  if (names === undefined || names.length === 0) return all;
  return all.filter((column) => column.name === 'security' || (names as readonly string[]).includes(column.name));
}

/** A text cell as RFC 4180 writes it: quoted when it holds a comma, a quote, CR or LF; quotes doubled. */
function csvTextField(text: string): string {
  return /[",\r\n]/.test(text) ? `"${text.replaceAll('"', '""')}"` : text;
}

/**
 * The CSV's bytes as they are written: number cells straight into the buffer (writeNumberCell, the
 * text of formatNumberCell without a string per cell), text cells quoted as needed.
 */
class CsvBytes {
  private bytes = Buffer.allocUnsafe(1 << 16);
  private length = 0;

  private room(more: number): void {
    if (this.length + more <= this.bytes.length) return;
    const bigger = Buffer.allocUnsafe(Math.max(this.bytes.length * 2, this.length + more));
    this.bytes.copy(bigger, 0, 0, this.length);
    this.bytes = bigger;
  }

  comma(): void {
    this.room(1);
    this.bytes[this.length++] = 0x2c;
  }

  lineEnd(): void {
    this.room(1);
    this.bytes[this.length++] = 0x0a;
  }

  text(text: string): void {
    const field = csvTextField(text);
    this.room(field.length * 3);
    this.length += this.bytes.write(field, this.length, 'utf8');
  }

  number(x: number | null): void {
    if (x === null) return;
    this.room(MAX_NUMBER_CELL_BYTES);
    this.length = writeNumberCell(this.bytes, this.length, x);
  }

  /** One cell of `column` holding `value` (a record's value for it). */
  cell(column: ResultColumn, value: string | number | null): void {
    if (column.type === 'number') {
      this.number(typeof value === 'number' ? value : null);
    } else if (value !== null) {
      const textValue = String(value);
      this.text(column.fromInput ? neutraliseText(textValue) : textValue);
    }
  }

  toString(): string {
    return this.bytes.toString('utf8', 0, this.length);
  }
}

/** Header and rows: `valueOf(item, column)` is the value the item's record holds for the column. */
function renderRows<T>(columns: readonly ResultColumn[], items: readonly T[], valueOf: (item: T, column: ResultColumn) => string | number | null): string {
  const out = new CsvBytes();
  columns.forEach((column, k) => {
    if (k > 0) out.comma();
    out.text(column.name);
  });
  out.lineEnd();
  for (const item of items) {
    for (let k = 0; k < columns.length; k++) {
      if (k > 0) out.comma();
      out.cell(columns[k]!, valueOf(item, columns[k]!));
    }
    out.lineEnd();
  }
  return out.toString();
}

export interface ResultCsvOptions {
  /** The spec's `report.columns`. */
  readonly columns?: readonly ResultColumnName[];
}

/**
 * The CSV from stored records (the server's release path). RFC 4180: a field is quoted when it holds
 * a comma, a quote, CR or LF (csv-stringify's choice, checked against it in the tests); `\n` line ends.
 */
export function renderResultCsvFromRecords(records: readonly ResultRecord[], options: ResultCsvOptions = {}): string {
  const columns = selectResultColumns(options.columns);
  return renderRows(columns, sortResultRecords(records), (record, column) => (record as Readonly<Record<string, string | number | null>>)[column.name] ?? null);
}

/**
 * The CSV from the engine's rows (the CLI path); identical bytes to the records path: the same
 * column values (toResultRecord's), without building a record per row.
 */
export function renderResultCsv(rows: readonly ResultRow[], options: ResultCsvOptions = {}): string {
  const columns = selectResultColumns(options.columns);
  const security = RESULT_COLUMNS.find((column) => column.name === 'security')! as ResultColumn;
  return renderRows(columns, sortedBySecurity(rows, (row) => String(security.value(row) ?? '')), (row, column) => columnValue(column, row));
}

/** The rows as data for `--json` and the ingest payload: same content, numbers as numbers, null for empty. */
export function resultRecords(rows: readonly ResultRow[], options: ResultCsvOptions = {}): Record<string, string | number | null>[] {
  const columns = selectResultColumns(options.columns);
  return sortResultRecords(rows.map(toResultRecord)).map((record) => {
    const source = record as Readonly<Record<string, string | number | null>>;
    return Object.fromEntries(columns.map((column) => [column.name, source[column.name] ?? null]));
  });
}
