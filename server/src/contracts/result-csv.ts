import { stringify } from 'csv-stringify/sync';
import {
  RESULT_COLUMNS,
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

/** Records sorted by security; two records for one security is a bug upstream, not a tie to break. */
export function sortResultRecords(records: readonly ResultRecord[]): ResultRecord[] {
  const sorted = [...records].sort((a, b) => compareSecurityCodes(a.security ?? '', b.security ?? ''));
  for (let i = 1; i < sorted.length; i += 1) {
    if (sorted[i]?.security === sorted[i - 1]?.security) {
      throw new Error(`Two result rows for security ${JSON.stringify(sorted[i]?.security)}`);
    }
  }
  return sorted;
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

function cell(column: ResultColumn, record: ResultRecord): string {
  const value = (record as Readonly<Record<string, string | number | null>>)[column.name] ?? null;
  if (column.type === 'number') return formatNumberCell(typeof value === 'number' ? value : null);
  if (value === null) return '';
  const textValue = String(value);
  return column.fromInput ? neutraliseText(textValue) : textValue;
}

export interface ResultCsvOptions {
  /** The spec's `report.columns`. */
  readonly columns?: readonly ResultColumnName[];
}

/** The CSV from stored records (the server's release path). RFC 4180 quoting, `\n` line ends. */
export function renderResultCsvFromRecords(records: readonly ResultRecord[], options: ResultCsvOptions = {}): string {
  const columns = selectResultColumns(options.columns);
  const body = sortResultRecords(records).map((record) => columns.map((column) => cell(column, record)));
  return stringify([columns.map((column) => column.name), ...body], {
    record_delimiter: '\n',
    // csv-stringify quotes a field holding the delimiter, a quote or `\n`; a lone `\r` needs quoting too.
    quoted_match: /\r/,
  });
}

/** The CSV from the engine's rows (the CLI path); identical bytes to the records path. */
export function renderResultCsv(rows: readonly ResultRow[], options: ResultCsvOptions = {}): string {
  return renderResultCsvFromRecords(rows.map(toResultRecord), options);
}

/** The rows as data for `--json` and the ingest payload: same content, numbers as numbers, null for empty. */
export function resultRecords(rows: readonly ResultRow[], options: ResultCsvOptions = {}): Record<string, string | number | null>[] {
  const columns = selectResultColumns(options.columns);
  return sortResultRecords(rows.map(toResultRecord)).map((record) => {
    const source = record as Readonly<Record<string, string | number | null>>;
    return Object.fromEntries(columns.map((column) => [column.name, source[column.name] ?? null]));
  });
}
