// Risk-free rules from DESIGN.md "Risk-free". Rate values: the worked example in
// ../shared/reference/WORKED-EXAMPLE.md (3.55% a year → 0.002911263007 a month) and arithmetic.
import { describe, expect, it } from 'vitest';
import { dayNumberOfIso } from './calendar-date.js';
import { perPeriodRate, perPeriodRates, yieldsUsed } from './risk-free.js';
import { buildGrid } from './sampling.js';

const day = dayNumberOfIso;
const noMarket = { id: 'MKT', days: new Int32Array(0), prices: new Float64Array(0) };

describe('per-period rate', () => {
  it('de-annualises geometrically: 3.55% a year is 0.002911263007 a month (worked example)', () => {
    expect(perPeriodRate(0.0355, 12)).toBeCloseTo(0.002911263007, 12);
  });

  it('compounds back to the annual yield over P periods for P = 12, 52 and 252', () => {
    for (const periods of [12, 52, 252]) {
      expect((1 + perPeriodRate(0.0425, periods)) ** periods).toBeCloseTo(1.0425, 13);
    }
  });

  it('gives zero for a zero yield and a negative rate for a negative yield', () => {
    expect(perPeriodRate(0, 52)).toBe(0);
    expect(perPeriodRate(-0.005, 252)).toBeLessThan(0);
  });
});

describe('the yield behind each period', () => {
  const grid = buildGrid({ frequency: 'monthly', firstDay: day('2025-11-03'), asOfDay: day('2026-03-31'), weekEnd: 'friday', market: noMarket });
  const series = {
    days: Int32Array.from(['2025-11-28', '2025-12-31', '2026-01-15', '2026-02-27', '2026-03-02'], day),
    yields: Float64Array.from([0.035, 0.034, Number.NaN, 0.033, 0.0325]),
  };

  it('uses the yield last observed at or before the previous month\'s last calendar day', () => {
    // 2025-12 ← yield at or before 2025-11-30 (0.035); 2026-01 ← 2025-12-31 (a holiday, still counts: 0.034);
    // 2026-02 ← the empty 2026-01-15 cell is skipped (0.034); 2026-03 ← 2026-02-27 (0.033).
    const used = yieldsUsed(grid, { kind: 'series', series });
    expect(grid.labels).toEqual(['2025-11', '2025-12', '2026-01', '2026-02', '2026-03']);
    expect(Array.from(used)).toEqual([Number.NaN, 0.035, 0.034, 0.034, 0.033]);
  });

  it('has no rate before the first published yield', () => {
    const late = { days: Int32Array.from([day('2026-01-31')]), yields: Float64Array.from([0.03]) };
    expect(Array.from(yieldsUsed(grid, { kind: 'series', series: late }))).toEqual([Number.NaN, Number.NaN, Number.NaN, 0.03, 0.03]);
  });

  it('uses a constant annual yield for every period with a return', () => {
    const rates = perPeriodRates(yieldsUsed(grid, { kind: 'constant', annualYield: 0.02 }), 12);
    expect(rates[0]).toBeNaN();
    expect(rates[4]).toBeCloseTo(1.02 ** (1 / 12) - 1, 15);
  });

  it('uses the previous market date for daily periods', () => {
    const market = { id: 'MKT', days: Int32Array.from(['2026-03-05', '2026-03-09'], day), prices: Float64Array.from([1, 2]) };
    const daily = buildGrid({ frequency: 'daily', firstDay: day('2026-03-05'), asOfDay: day('2026-03-09'), weekEnd: 'friday', market });
    const yields = { days: Int32Array.from(['2026-03-05', '2026-03-06'], day), yields: Float64Array.from([0.02, 0.05]) };
    // The return on 2026-03-09 uses the yield at or before 2026-03-05: 0.02, not the Friday 0.05.
    expect(Array.from(yieldsUsed(daily, { kind: 'series', series: yields }))).toEqual([Number.NaN, 0.02]);
  });
});
