import { describe, expect, it } from 'vitest';
import { dateFormat, delimiter, filePattern, isCalendarDate, rate, slug } from './run-spec.fields.js';

describe('isCalendarDate', () => {
  // Gregorian leap years: divisible by 4, except centuries not divisible by 400 (common practice).
  it('accepts real dates including leap days', () => {
    expect(['2026-01-31', '2024-02-29', '2000-02-29', '2026-12-31'].map(isCalendarDate)).toEqual([true, true, true, true]);
  });

  it('rejects impossible dates and other shapes', () => {
    expect(['2026-02-29', '1900-02-29', '2026-04-31', '2026-13-01', '2026-00-10', '2026-6-30', '20260630', '2026-06-30T00:00'].map(isCalendarDate)).toEqual(
      [false, false, false, false, false, false, false, false],
    );
  });
});

describe('spec field types', () => {
  const ok = (schema: { safeParse: (value: unknown) => { success: boolean } }, values: unknown[]): boolean[] => values.map((v) => schema.safeParse(v).success);

  it('takes date formats with YYYY, MM and DD once each', () => {
    expect(ok(dateFormat, ['YYYY-MM-DD', 'DD/MM/YYYY', 'YYYYMMDD', 'MM.DD.YYYY'])).toEqual([true, true, true, true]);
    expect(ok(dateFormat, ['YYYY-MM', 'YYYY-MM-DD-DD', 'YY-MM-DD', 'YYYY MM DD', 'D/M/YYYY'])).toEqual([false, false, false, false, false]);
  });

  it('takes one-character delimiters other than a quote or a line break', () => {
    expect(ok(delimiter, [',', ';', '\t', '|'])).toEqual([true, true, true, true]);
    expect(ok(delimiter, ['"', '\n', ',,', ''])).toEqual([false, false, false, false]);
  });

  it('takes file-name globs, never paths', () => {
    expect(ok(filePattern, ['prices-*.csv', 'yields ?.csv'])).toEqual([true, true]);
    expect(ok(filePattern, ['incoming/prices.csv', '..\\prices.csv', '..', '.'])).toEqual([false, false, false, false]);
  });

  it('takes slugs as names', () => {
    expect(ok(slug, ['core-holdings', 'q3'])).toEqual([true, true]);
    expect(ok(slug, ['Core', 'core--holdings', '-core', 'core_holdings', 'a'.repeat(65)])).toEqual([false, false, false, false, false]);
  });

  it('takes rates as decimals from -1 to 1', () => {
    expect(ok(rate, [0.03, -0.005, 1, -1])).toEqual([true, true, true, true]);
    expect(ok(rate, [3, 1.0001, '0.03', Number.NaN])).toEqual([false, false, false, false]);
  });
});
