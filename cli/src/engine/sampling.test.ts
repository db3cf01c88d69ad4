// Grid and sampling rules from DESIGN.md "Grid"; the expected values follow by hand from the
// invented series written out in each test.
import { describe, expect, it } from 'vitest';
import { dayNumberOfIso, weekdayOf } from './calendar-date.js';
import { buildGrid, periodIndexOf, sampleOnGrid, weekEndOf } from './sampling.js';
import type { DaySeries } from './sampling.js';

function series(id: string, points: readonly [string, number][]): DaySeries {
  return {
    id,
    days: Int32Array.from(points, ([iso]) => dayNumberOfIso(iso)),
    prices: Float64Array.from(points, ([, price]) => price),
  };
}

const day = dayNumberOfIso;
const noMarket = series('MKT', []);

describe('monthly grid', () => {
  const grid = buildGrid({ frequency: 'monthly', firstDay: day('2026-01-15'), asOfDay: day('2026-04-15'), weekEnd: 'friday', market: noMarket });

  it('labels every calendar month YYYY-MM and ends it on its last calendar day', () => {
    expect(grid.labels).toEqual(['2026-01', '2026-02', '2026-03', '2026-04']);
    expect(grid.periodEnds).toEqual(['2026-01-31', '2026-02-28', '2026-03-31', '2026-04-30']);
  });

  it('prices a month by its last available price and leaves a month without one empty', () => {
    const prices = series('QZ1', [['2026-01-15', 10], ['2026-01-29', 11], ['2026-01-30', Number.NaN], ['2026-02-02', 12], ['2026-04-01', 13]]);
    expect(Array.from(sampleOnGrid(prices, grid, day('2026-04-15')))).toEqual([11, 12, Number.NaN, 13]);
  });

  it('prices the as-of month at or before the as-of date, never after', () => {
    const prices = series('QZ1', [['2026-04-14', 20], ['2026-04-15', 21], ['2026-04-16', 22]]);
    expect(sampleOnGrid(prices, grid, day('2026-04-15'))[3]).toBe(21);
    expect(sampleOnGrid(prices, grid, day('2026-04-14'))[3]).toBe(20);
  });
});

describe('weekly grid', () => {
  it('ends weeks on the chosen weekday and labels them by that day', () => {
    const grid = buildGrid({ frequency: 'weekly', firstDay: day('2026-03-02'), asOfDay: day('2026-03-19'), weekEnd: 'wednesday', market: noMarket });
    expect(grid.labels).toEqual(['2026-03-04', '2026-03-11', '2026-03-18', '2026-03-25']);
    expect(grid.labels.map((label) => weekdayOf(day(label)))).toEqual(['wednesday', 'wednesday', 'wednesday', 'wednesday']);
  });

  it('runs a week from the day after the previous week end, and uses the last price in it on a holiday week end', () => {
    const grid = buildGrid({ frequency: 'weekly', firstDay: day('2026-03-02'), asOfDay: day('2026-03-25'), weekEnd: 'wednesday', market: noMarket });
    const prices = series('QZ1', [
      ['2026-03-04', 1], // Wednesday: ends week 1
      ['2026-03-05', 2], // Thursday: first day of week 2
      ['2026-03-10', 3], // Tuesday; the Wednesday 2026-03-11 is a holiday
      ['2026-03-18', 4],
    ]);
    expect(Array.from(sampleOnGrid(prices, grid, day('2026-03-25')))).toEqual([1, 3, 4, Number.NaN]);
  });

  it('defaults to weeks ending on Friday when asked for the Friday of a date', () => {
    expect(weekdayOf(weekEndOf(day('2026-10-26'), 'friday'))).toBe('friday');
    expect(weekEndOf(day('2026-10-30'), 'friday')).toBe(day('2026-10-30'));
    expect(weekEndOf(day('2026-10-31'), 'friday')).toBe(day('2026-11-06'));
  });
});

describe('daily grid', () => {
  const market = series('MKT', [
    ['2026-03-02', 100], ['2026-03-03', 101], ['2026-03-04', Number.NaN], ['2026-03-05', 102], ['2026-03-09', 103],
  ]);
  const grid = buildGrid({ frequency: 'daily', firstDay: day('2026-03-02'), asOfDay: day('2026-03-09'), weekEnd: 'friday', market });

  it('has one period per market date with a level (holidays and empty market cells are not periods)', () => {
    expect(grid.labels).toEqual(['2026-03-02', '2026-03-03', '2026-03-05', '2026-03-09']);
  });

  it('prices a security only by its own price on that date', () => {
    const prices = series('QZ1', [['2026-03-02', 5], ['2026-03-04', 6], ['2026-03-06', 7], ['2026-03-09', 8]]);
    expect(Array.from(sampleOnGrid(prices, grid, day('2026-03-09')))).toEqual([5, Number.NaN, Number.NaN, 8]);
  });

  it('takes as the as-of period the last market date at or before a non-market as-of date', () => {
    const upToSunday = buildGrid({ frequency: 'daily', firstDay: day('2026-03-02'), asOfDay: day('2026-03-08'), weekEnd: 'friday', market });
    expect(upToSunday.labels.at(-1)).toBe('2026-03-05');
  });
});

describe('each security on its own calendar', () => {
  const grid = buildGrid({ frequency: 'monthly', firstDay: day('2025-01-31'), asOfDay: day('2025-06-30'), weekEnd: 'friday', market: noMarket });

  it('leaves the months before a late listing empty', () => {
    const late = series('QZ2', [['2025-04-10', 50], ['2025-05-30', 51], ['2025-06-30', 52]]);
    expect(Array.from(sampleOnGrid(late, grid, day('2025-06-30')))).toEqual([Number.NaN, Number.NaN, Number.NaN, 50, 51, 52]);
  });

  it('leaves the months after a delisting empty', () => {
    const gone = series('QZ3', [['2025-01-31', 9], ['2025-02-14', 8]]);
    expect(Array.from(sampleOnGrid(gone, grid, day('2025-06-30')))).toEqual([9, 8, Number.NaN, Number.NaN, Number.NaN, Number.NaN]);
  });

  it('finds the period that contains a date', () => {
    expect(periodIndexOf(grid, day('2025-03-15'))).toBe(2);
    expect(periodIndexOf(grid, day('2024-12-31'))).toBe(-1);
    expect(periodIndexOf(grid, day('2025-07-01'))).toBe(-1);
  });
});
