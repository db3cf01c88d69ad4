import { parse } from 'csv-parse/sync';
import { describe, expect, it } from 'vitest';
import { stringify } from 'csv-stringify/sync';
import { RESULT_COLUMNS, columnValue, toResultRecord } from './result-columns.js';
import type { ResultColumn } from './result-columns.js';
import {
  compareSecurityCodes,
  formatNumberCell,
  neutraliseText,
  renderResultCsv,
  renderResultCsvFromRecords,
  resultRecords,
} from './result-csv.js';
import { resultRow } from './result-rows.test-support.js';

describe('formatNumberCell', () => {
  // ECMA-262, Number::toString: the digits are the fewest that identify the double uniquely, so
  // String(x) is the shortest round-trip decimal for finite x.
  it('writes 0.1 + 0.2 as 0.30000000000000004, which reads back as the same double', () => {
    const cell = formatNumberCell(0.1 + 0.2);
    expect(cell).toBe('0.30000000000000004');
    expect(Number(cell)).toBe(0.1 + 0.2);
  });

  it('writes 1e-7 in exponent form as 1e-7', () => {
    expect(formatNumberCell(1e-7)).toBe('1e-7');
  });

  it('writes negative zero as 0', () => {
    expect(formatNumberCell(-0)).toBe('0');
  });

  it('writes NaN and infinities as an empty cell', () => {
    expect([formatNumberCell(Number.NaN), formatNumberCell(Infinity), formatNumberCell(-Infinity), formatNumberCell(null)]).toEqual(['', '', '', '']);
  });

  it('round-trips random doubles with no more significant digits than needed', () => {
    // Reference: the shortest precision p (1..17) at which toPrecision(p) reads back as x; 17
    // digits always suffice for a binary64 double (IEEE 754-2008, 5.12.2).
    const view = new DataView(new ArrayBuffer(8));
    let seed = 20260630;
    const next = (): number => {
      seed = (seed * 1103515245 + 12345) % 2147483648;
      return seed;
    };
    for (let i = 0; i < 2000; i += 1) {
      view.setUint32(0, next() * 2);
      view.setUint32(4, next() * 2);
      const x = view.getFloat64(0);
      if (!Number.isFinite(x) || x === 0) continue;
      const cell = formatNumberCell(x);
      expect(Number(cell)).toBe(x);
      let shortest = 17;
      while (shortest > 1 && Number(x.toPrecision(shortest - 1)) === x) shortest -= 1;
      const digits = cell.replace(/^-/, '').replace(/e.*$/, '').replace('.', '').replace(/^0+/, '').replace(/0+$/, '');
      expect(digits.length).toBeLessThanOrEqual(shortest);
    }
  });
});

describe('neutraliseText', () => {
  // OWASP "CSV Injection" [memory]: cells starting with =, +, -, @, tab or carriage return are read
  // as formulas by spreadsheets; prefixing a single quote makes them text.
  it.each(['=', '+', '-', '@', '\t', '\r'])('prefixes an apostrophe to text starting with %j', (first) => {
    expect(neutraliseText(`${first}QZ1`)).toBe(`'${first}QZ1`);
  });

  it('leaves other text alone, including those characters later in the text', () => {
    expect(['QZ1', 'A=B', 'Q-1', ' =1', "'quoted", ''].map(neutraliseText)).toEqual(['QZ1', 'A=B', 'Q-1', ' =1', "'quoted", '']);
  });
});

describe('renderResultCsv', () => {
  const rows = [resultRow('QZ2'), resultRow('QZ1', { flags: ['degenerate', 'thin-data'] }), resultRow('QZ3', { status: 'insufficient', n: 12 })];

  it('gives the same bytes whatever the order of the rows', () => {
    const reversed = [...rows].reverse();
    const shuffled = [rows[1], rows[2], rows[0]].filter((row) => row !== undefined);
    expect(renderResultCsv(reversed)).toBe(renderResultCsv(rows));
    expect(renderResultCsv(shuffled)).toBe(renderResultCsv(rows));
  });

  it('writes a header of every column name, then rows sorted by security, each line ending in \\n', () => {
    const csv = renderResultCsv(rows);
    const lines = csv.split('\n');
    expect(lines[0]).toBe(RESULT_COLUMNS.map((column) => column.name).join(','));
    expect(lines.slice(1, 4).map((line) => line.split(',')[0])).toEqual(['QZ1', 'QZ2', 'QZ3']);
    expect(csv.endsWith('\n')).toBe(true);
    expect(csv).not.toContain('\r');
  });

  it('sorts security codes in UTF-8 byte order, not UTF-16 order', () => {
    // U+FF5A (EF BD 9A in UTF-8) sorts before U+1F600 (F0 9F 98 80) by bytes, after it by UTF-16 units.
    const codes = ['\u{1F600}', '\uFF5A', 'b', 'B', '\u20ACX', 'a'];
    const csv = renderResultCsv(codes.map((code) => resultRow(code)));
    const written = csv.split('\n').slice(1, -1).map((line) => line.split(',')[0]);
    expect(written).toEqual(['B', 'a', 'b', '\u20ACX', '\uFF5A', '\u{1F600}']);
    expect(compareSecurityCodes('\uFF5A', '\u{1F600}')).toBeLessThan(0);
  });

  it('quotes per RFC 4180 so that a CSV parser reads the cells back', () => {
    const tricky = ['QZ,1', 'QZ"2', 'QZ\n3', 'QZ\r4'];
    const csv = renderResultCsv(tricky.map((code) => resultRow(code, { group: 'one, two' })));
    const parsed = parse(csv, { columns: true }) as Record<string, string>[];
    expect(parsed.map((record) => record.security).sort()).toEqual([...tricky].sort());
    expect(parsed.every((record) => record.group === 'one, two')).toBe(true);
  });

  it('neutralises input text but writes numbers as numbers', () => {
    const csv = renderResultCsv([resultRow('=QZ1', { group: '@risk', peerGroup: '+peers', alpha: -0.0012 })]);
    const record = (parse(csv, { columns: true }) as Record<string, string>[])[0];
    expect([record?.security, record?.group, record?.peer_group, record?.alpha]).toEqual(["'=QZ1", "'@risk", "'+peers", '-0.0012']);
  });

  it('writes empty cells for NaN and null, and flags in their fixed order', () => {
    const record = (parse(renderResultCsv(rows), { columns: true }) as Record<string, string>[])[0];
    expect([record?.vasicek_beta, record?.group, record?.wacc, record?.flags]).toEqual(['', '', '', 'thin-data degenerate']);
  });

  it('writes the spec\'s columns in the standard order, security always first', () => {
    const csv = renderResultCsv(rows, { columns: ['flags', 'beta', 'n'] });
    expect(csv.split('\n')[0]).toBe('security,n,beta,flags');
  });

  it('gives the same bytes from records that went through JSON', () => {
    const stored = JSON.parse(JSON.stringify(rows.map(toResultRecord))) as ReturnType<typeof toResultRecord>[];
    expect(renderResultCsvFromRecords(stored)).toBe(renderResultCsv(rows));
  });

  it('writes what csv-stringify writes for the same cells (random text with commas, quotes, CR, LF, non-ASCII)', () => {
    // Reference: csv-stringify (npm), RFC 4180 with `\n` records and a lone CR quoted, fed the cells
    // the writer writes (formatNumberCell for numbers, neutraliseText for input text).
    let seed = 7;
    const next = (): number => {
      seed = (seed * 1103515245 + 12345) % 2147483648;
      return seed / 2147483648;
    };
    const alphabet = ['a', 'Z', '0', ',', '"', '\r', '\n', ' ', '=', '-', '\u00e9', '\u20ac', '\u{1F600}', ';', "'"];
    const text = (): string => Array.from({ length: 1 + Math.floor(next() * 8) }, () => alphabet[Math.floor(next() * alphabet.length)]).join('');
    const many = Array.from({ length: 300 }, (_, i) => resultRow(`QZ${i}${text()}`, {
      group: next() < 0.2 ? null : text(), peerGroup: text(), beta: (next() - 0.5) * 4, alpha: next() < 0.1 ? Number.NaN : next() / 100,
    }));
    const columns = RESULT_COLUMNS as readonly ResultColumn[];
    const cells = [...many]
      .sort((a, b) => compareSecurityCodes(a.id, b.id))
      .map((row) => columns.map((column) => {
        const value = columnValue(column, row);
        if (column.type === 'number') return formatNumberCell(typeof value === 'number' ? value : null);
        if (value === null) return '';
        return column.fromInput ? neutraliseText(String(value)) : String(value);
      }));
    const reference = stringify([columns.map((column) => column.name), ...cells], { record_delimiter: '\n', quoted_match: /\r/ });
    expect(renderResultCsv(many)).toBe(reference);
  });

  it('refuses two rows for one security', () => {
    expect(() => renderResultCsv([resultRow('QZ1'), resultRow('QZ1')])).toThrow('Two result rows for security "QZ1"');
  });

});

describe('resultRecords', () => {
  it('gives the CSV content as JSON: numbers as numbers, null for empty, text as read', () => {
    const [record] = resultRecords([resultRow('-QZ1', { beta: -0, vasicekBeta: Number.NaN })]);
    expect(record).toMatchObject({ security: '-QZ1', beta: 0, vasicek_beta: null, n: 58, group: null });
    expect(Object.is(record?.beta, -0)).toBe(false);
  });
});
