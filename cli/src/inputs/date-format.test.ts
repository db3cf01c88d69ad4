// Date-format tokens YYYY, MM, DD as DESIGN.md "Units" defines them; expected day numbers come
// from ECMAScript Date.UTC (ECMA-262 MakeDay) as the reference.
import { describe, expect, it } from 'vitest';
import { compileDateFormat } from './date-format.js';

const utcDay = (y: number, m: number, d: number) => Date.UTC(y, m - 1, d) / 86_400_000;

describe('date formats', () => {
  it('reads YYYY-MM-DD, DD/MM/YYYY and YYYYMMDD to the same day', () => {
    const expected = utcDay(2026, 2, 27);
    expect(compileDateFormat('YYYY-MM-DD').parse('2026-02-27')).toBe(expected);
    expect(compileDateFormat('DD/MM/YYYY').parse('27/02/2026')).toBe(expected);
    expect(compileDateFormat('YYYYMMDD').parse('20260227')).toBe(expected);
    expect(compileDateFormat('MM.DD.YYYY').parse('02.27.2026')).toBe(expected);
  });

  it('needs every token at its full width and every literal in place', () => {
    const format = compileDateFormat('YYYY-MM-DD');
    for (const text of ['2026-2-27', '2026/02/27', '26-02-27', '2026-02-27 ', '2026-02-2a', '+026-02-27']) {
      expect(format.parse(text)).toBeNaN();
      expect(format.explain(text)).toBe('does not match the date format YYYY-MM-DD');
    }
  });

  it('refuses a matching text that is no calendar date', () => {
    const format = compileDateFormat('DD/MM/YYYY');
    for (const text of ['30/02/2026', '29/02/2025', '00/01/2026', '31/04/2026', '01/13/2026']) {
      expect(format.parse(text)).toBeNaN();
      expect(format.explain(text)).toBe('is not a calendar date');
    }
    expect(format.parse('29/02/2024')).toBe(utcDay(2024, 2, 29));
  });

  it('refuses a format without exactly one of each token', () => {
    expect(() => compileDateFormat('YYYY-MM')).toThrow(RangeError);
    expect(() => compileDateFormat('DD-MM-YY')).toThrow(RangeError);
    expect(() => compileDateFormat('YYYY-MM-DD-DD')).toThrow(RangeError);
  });
});
