// The broken-file corpus in test/fixtures/bad-inputs/: every file must be refused with the exact
// code, line and column. The rules are DESIGN.md "Input rules" and cli/src/inputs/INPUT-RULES.md;
// quoting follows RFC 4180 and text encoding the UTF-8 definition of RFC 3629.
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { InputError } from './input-error.js';
import type { InputErrorCode } from './input-error.js';
import { readMarketFile } from './market-series.js';
import { readPriceFile } from './price-file.js';
import type { PriceFileOptions } from './price-file-options.js';
import { readRiskFreeFile } from './risk-free-file.js';

const dir = join(import.meta.dirname, '../../../test/fixtures/bad-inputs');
const wide: PriceFileOptions = { delimiter: ',', dateFormat: 'YYYY-MM-DD', columns: { layout: 'wide', dateColumn: 'date' }, marketId: 'MKT' };
const long: PriceFileOptions = { ...wide, columns: { layout: 'long', dateColumn: 'date', securityColumn: 'security', closeColumn: 'close' } };
const dated = { delimiter: ',', dateFormat: 'YYYY-MM-DD', dateColumn: 'date' };

type Reader = (file: string) => Promise<unknown>;
const readWide: Reader = (file) => readPriceFile(file, wide);
const readLong: Reader = (file) => readPriceFile(file, long);
const readRiskFree: Reader = (file) => readRiskFreeFile(file, { ...dated, unit: 'percent' });
const readMarket: Reader = (file) => readMarketFile(file, dated);

interface Case {
  readonly behaviour: string;
  readonly name: string;
  readonly read: Reader;
  readonly code: InputErrorCode;
  readonly line: number | null;
  readonly column: number | null;
  readonly columnName?: string;
  readonly reason?: string;
}

const cases: readonly Case[] = [
  { behaviour: 'an empty file', name: 'empty.csv', read: readWide, code: 'INPUT_EMPTY', line: 1, column: null },
  { behaviour: 'a header with no rows', name: 'header-only.csv', read: readWide, code: 'INPUT_EMPTY', line: 1, column: null },
  { behaviour: 'a header without the date column', name: 'no-date-column.csv', read: readWide, code: 'INPUT_NO_DATE_COLUMN', line: 1, column: null },
  { behaviour: 'a wide header with no security column', name: 'no-security-columns.csv', read: readWide, code: 'INPUT_NO_VALUE_COLUMN', line: 1, column: null },
  { behaviour: 'a price file without the named market column', name: 'no-market-column.csv', read: readWide, code: 'INPUT_NO_VALUE_COLUMN', line: 1, column: null },
  { behaviour: 'a row with too few fields', name: 'short-row.csv', read: readWide, code: 'INPUT_FIELD_COUNT', line: 4, column: 3, reason: 'row has 2 fields, the header has 4' },
  { behaviour: 'a row with too many fields', name: 'long-row.csv', read: readWide, code: 'INPUT_FIELD_COUNT', line: 5, column: 5 },
  { behaviour: 'a blank line between data rows', name: 'blank-line-inside.csv', read: readWide, code: 'INPUT_FIELD_COUNT', line: 4, column: 1 },
  { behaviour: 'a blank line before the header', name: 'blank-line-before-header.csv', read: readWide, code: 'INPUT_FIELD_COUNT', line: 1, column: 1 },
  { behaviour: 'a date in another format', name: 'date-wrong-format.csv', read: readWide, code: 'INPUT_BAD_DATE', line: 3, column: 1, columnName: 'date', reason: 'date "27/02/2026" does not match the date format YYYY-MM-DD' },
  { behaviour: 'an impossible date (30 February)', name: 'date-impossible.csv', read: readWide, code: 'INPUT_BAD_DATE', line: 3, column: 1, reason: 'date "2026-02-30" is not a calendar date' },
  { behaviour: 'an empty date', name: 'date-empty.csv', read: readWide, code: 'INPUT_BAD_DATE', line: 5, column: 1, reason: 'the date is empty' },
  { behaviour: 'a repeated date, naming the later line', name: 'date-repeated.csv', read: readWide, code: 'INPUT_DUPLICATE_DATE', line: 6, column: 1, reason: 'date 2026-02-27 already appears on line 3' },
  { behaviour: 'a price that is not a number', name: 'price-not-number.csv', read: readWide, code: 'INPUT_BAD_PRICE', line: 4, column: 3, columnName: 'QZ7', reason: 'price "abc" is not a number' },
  { behaviour: 'a NaN price', name: 'price-nan.csv', read: readWide, code: 'INPUT_BAD_PRICE', line: 4, column: 2, reason: 'price "NaN" is not a number' },
  { behaviour: 'an infinite price', name: 'price-infinite.csv', read: readWide, code: 'INPUT_BAD_PRICE', line: 5, column: 3, reason: 'price "Infinity" is not finite' },
  { behaviour: 'a price beyond the double range', name: 'price-overflow.csv', read: readWide, code: 'INPUT_BAD_PRICE', line: 5, column: 2, reason: 'price "1e999" is not finite' },
  { behaviour: 'a zero price', name: 'price-zero.csv', read: readWide, code: 'INPUT_BAD_PRICE', line: 3, column: 2, reason: 'price "0" is not positive' },
  { behaviour: 'a negative price', name: 'price-negative.csv', read: readWide, code: 'INPUT_BAD_PRICE', line: 3, column: 3, reason: 'price "-54.80" is not positive' },
  { behaviour: 'a hexadecimal price', name: 'price-hexadecimal.csv', read: readWide, code: 'INPUT_BAD_PRICE', line: 3, column: 2, reason: 'price "0x67" is not a number' },
  {
    behaviour: 'a decimal comma', name: 'price-decimal-comma.csv', read: (file) => readPriceFile(file, { ...wide, delimiter: ';' }),
    code: 'INPUT_BAD_PRICE', line: 3, column: 2, reason: 'price "103,1" is not a number',
  },
  { behaviour: 'a repeated security code', name: 'security-repeated.csv', read: readWide, code: 'INPUT_DUPLICATE_SECURITY', line: 1, column: 3, columnName: 'QZ1' },
  { behaviour: 'an empty security code', name: 'security-empty.csv', read: readWide, code: 'INPUT_EMPTY_SECURITY', line: 1, column: 3 },
  { behaviour: 'a market column with no variance', name: 'market-flat.csv', read: readWide, code: 'INPUT_FLAT_MARKET', line: 1, column: 4, columnName: 'MKT' },
  { behaviour: 'a Latin-1 byte', name: 'not-utf8-latin1.csv', read: readWide, code: 'INPUT_NOT_UTF8', line: 4, column: 3 },
  { behaviour: 'a UTF-16 file', name: 'not-utf8-utf16.csv', read: readWide, code: 'INPUT_NOT_UTF8', line: 1, column: 1 },
  { behaviour: 'a NUL byte', name: 'binary-nul.csv', read: readWide, code: 'INPUT_NOT_CSV', line: 3, column: 4 },
  { behaviour: 'a quote never closed, naming the line it opens on', name: 'quote-not-closed.csv', read: readWide, code: 'INPUT_NOT_CSV', line: 4, column: 2 },
  { behaviour: 'a quote inside an unquoted field', name: 'quote-misplaced.csv', read: readWide, code: 'INPUT_NOT_CSV', line: 5, column: 3 },
  { behaviour: 'a security and date given twice in the long layout', name: 'long-repeated.csv', read: readLong, code: 'INPUT_DUPLICATE_DATE', line: 9, column: 1, reason: 'date 2026-02-27 for security "QZ7" already appears on line 6' },
  { behaviour: 'an empty security code in the long layout', name: 'long-empty-security.csv', read: readLong, code: 'INPUT_EMPTY_SECURITY', line: 6, column: 2, columnName: 'security' },
  { behaviour: 'a long file without the close column', name: 'long-no-close-column.csv', read: readLong, code: 'INPUT_NO_VALUE_COLUMN', line: 1, column: null },
  { behaviour: 'a yield that is not a number', name: 'risk-free-not-number.csv', read: readRiskFree, code: 'INPUT_BAD_RATE', line: 3, column: 2, columnName: 'rate_pct', reason: 'yield "n/a" is not a number' },
  { behaviour: 'a NaN yield', name: 'risk-free-nan.csv', read: readRiskFree, code: 'INPUT_BAD_RATE', line: 4, column: 2 },
  { behaviour: 'a yield of -100%', name: 'risk-free-below-minus-100.csv', read: readRiskFree, code: 'INPUT_BAD_RATE', line: 3, column: 2 },
  { behaviour: 'a repeated risk-free date', name: 'risk-free-repeated.csv', read: readRiskFree, code: 'INPUT_DUPLICATE_DATE', line: 4, column: 1 },
  { behaviour: 'a risk-free file whose value column is ambiguous', name: 'risk-free-three-columns.csv', read: readRiskFree, code: 'INPUT_NO_VALUE_COLUMN', line: 1, column: null },
  { behaviour: 'a market file with no variance', name: 'market-file-flat.csv', read: readMarket, code: 'INPUT_FLAT_MARKET', line: 1, column: 2, columnName: 'level' },
];

async function refusal(read: Reader, file: string): Promise<InputError> {
  try {
    await read(file);
  } catch (error) {
    if (error instanceof InputError) return error;
    throw error;
  }
  throw new Error(`${file} was accepted`);
}

describe('input readers refuse broken files', () => {
  it.each(cases)('refuses $behaviour ($name) with $code at line $line, column $column', async (testCase) => {
    const file = join(dir, testCase.name);
    const error = await refusal(testCase.read, file);
    expect({ code: error.code, file: error.file, line: error.line, column: error.column }).toEqual({
      code: testCase.code, file, line: testCase.line, column: testCase.column,
    });
    if (testCase.columnName !== undefined) expect(error.columnName).toBe(testCase.columnName);
    if (testCase.reason !== undefined) expect(error.reason).toBe(testCase.reason);
  });

  it('writes the message as file:line:column (column name): reason', async () => {
    const file = join(dir, 'price-not-number.csv');
    const error = await refusal(readWide, file);
    expect(error.message).toBe(`${file}:4:3 (column QZ7): price "abc" is not a number`);
  });

  it('quotes at most 40 characters of the offending text', async () => {
    const error = await refusal(readWide, join(dir, 'price-long-garbage.csv'));
    const quoted = /"([^"]*)"/.exec(error.reason)?.[1] ?? '';
    expect(quoted.length).toBeLessThanOrEqual(40);
    expect(error.message).not.toContain('x'.repeat(41));
  });

  it('refuses a missing file as unreadable, naming it', async () => {
    const file = join(dir, 'no-such-file.csv');
    const error = await refusal(readWide, file);
    expect([error.code, error.file, error.line, error.column]).toEqual(['INPUT_UNREADABLE', file, null, null]);
  });
});
