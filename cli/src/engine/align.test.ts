// The worked example of ../shared/reference/WORKED-EXAMPLE.md reproduced column by column from
// its two input files (test/fixtures/worked-example/), read through the real readers. The table's
// values are given to 10 significant digits, so they are compared with a relative tolerance of 1e-9.
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { readPriceFile } from '../inputs/price-file.js';
import { readRiskFreeFile, riskFreeFromFile } from '../inputs/risk-free-file.js';
import type { RiskFreeSource } from './risk-free.js';
import type { DaySeries } from './sampling.js';
import { alignReturns } from './align.js';
import type { AlignedSample } from './align.js';
import { windowBounds, windowSample } from './window.js';

const fixtures = join(import.meta.dirname, '../../../test/fixtures/worked-example');
const nan = Number.NaN;

// month, security price, market level, security return, market return, yield used (%), per-period r_f
const table: readonly [string, number, number, number, number, number, number][] = [
  ['2025-10', 102.5, 2021, nan, nan, nan, nan],
  ['2025-11', 101.8, 2012, -0.006829268293, -0.00445324097, 3.55, 0.002911263007],
  ['2025-12', 106, 2079, 0.04125736739, 0.03330019881, 3.50, 0.002870898719],
  ['2026-01', 105.2, 2048, -0.007547169811, -0.01491101491, 3.40, 0.002790116491],
  ['2026-02', 109.3, 2115, 0.03897338403, 0.03271484375, 3.35, 0.002749698517],
  ['2026-03', nan, 2087, nan, -0.01323877069, 3.30, 0.002709262615],
  ['2026-04', 110.7, 2142, nan, 0.02635361763, 3.25, 0.002668808768],
  ['2026-05', 111.2, 2151, 0.004516711834, 0.004201680672, 3.20, 0.002628336959],
  ['2026-06', 115.6, 2214, 0.03956834532, 0.02928870293, 3.10, 0.002547339389],
  ['2026-07', 117.8, 2236, 0.01903114187, 0.009936766034, 3.05, 0.002506813595],
  ['2026-08', 115.4, 2203, -0.02037351443, -0.01475849732, 3.00, 0.002466269772],
  ['2026-09', 120.1, 2266, 0.04072790295, 0.02859736723, 2.95, 0.002425707904],
  ['2026-10', 121.9, 2290, 0.01498751041, 0.0105913504, 2.90, 0.002385127974],
];

function expectColumn(actual: Float64Array, expected: readonly number[]): void {
  expect(actual.length).toBe(expected.length);
  expected.forEach((value, t) => {
    if (Number.isNaN(value)) expect(actual[t]).toBeNaN();
    else expect(Math.abs(actual[t]! - value)).toBeLessThanOrEqual(1e-9 * Math.abs(value));
  });
}

/** Sample standard deviation (n − 1), the textbook formula. */
function sampleSd(values: Float64Array): number {
  const mean = values.reduce((sum, v) => sum + v, 0) / values.length;
  return Math.sqrt(values.reduce((sum, v) => sum + (v - mean) ** 2, 0) / (values.length - 1));
}

describe('worked example: monthly sampling, returns, risk-free and window', () => {
  let market: DaySeries;
  let security: DaySeries;
  let riskFree: RiskFreeSource;
  let aligned: AlignedSample;

  beforeAll(async () => {
    const prices = await readPriceFile(join(fixtures, 'prices.csv'), {
      delimiter: ',', dateFormat: 'YYYY-MM-DD', columns: { layout: 'wide', dateColumn: 'date' }, marketId: 'MKT',
    });
    const yields = await readRiskFreeFile(join(fixtures, 'risk-free.csv'), {
      delimiter: ',', dateFormat: 'YYYY-MM-DD', dateColumn: 'date', unit: 'percent',
    });
    market = prices.market!;
    security = prices.securities[0]!;
    riskFree = riskFreeFromFile(yields);
    aligned = alignReturns({
      frequency: 'monthly', asOf: '2026-10-30', returnKind: 'simple', market, securities: [security], riskFree, keepSampledPrices: true,
    });
  });

  it('builds the month grid 2025-10 to 2026-10', () => {
    expect(aligned.grid.labels).toEqual(table.map((row) => row[0]));
  });

  it('prices each month by its last available price (January by its earlier price, March empty)', () => {
    expectColumn(aligned.securities[0]!.sampledPrices!, table.map((row) => row[1]));
    expectColumn(aligned.marketLevels, table.map((row) => row[2]));
  });

  it('forms the security and market returns of the table', () => {
    expectColumn(aligned.securities[0]!.raw, table.map((row) => row[3]));
    expectColumn(aligned.marketRaw, table.map((row) => row[4]));
  });

  it('uses the yields of the table and their per-period rates', () => {
    expectColumn(aligned.yieldsUsed.map((y) => y * 100), table.map((row) => row[5]));
    expectColumn(aligned.riskFree, table.map((row) => row[6]));
  });

  it('has n = 8 in the 10-period window 2026-01 to 2026-10, with the excess returns of the table', () => {
    const bounds = windowBounds(aligned.asOfIndex, 10);
    const sample = windowSample(aligned, aligned.securities[0]!.excess, bounds, 8);
    expect([aligned.grid.labels[bounds.first], aligned.grid.labels[bounds.last]]).toEqual(['2026-01', '2026-10']);
    expect([sample.n, sample.status, sample.firstPeriod, sample.lastPeriod]).toEqual([8, 'ok', '2026-01', '2026-10']);
    const kept = table.filter((row, t) => t >= bounds.first && !Number.isNaN(row[3]));
    expectColumn(sample.securityExcess, kept.map((row) => row[3] - row[6]));
    expectColumn(sample.marketExcess, kept.map((row) => row[4] - row[6]));
  });

  it('gives the excess-return volatilities and beta (ρ·σ_s/σ_m) of the example\'s results', () => {
    const sample = windowSample(aligned, aligned.securities[0]!.excess, windowBounds(aligned.asOfIndex, 10), 8);
    const sdSecurity = sampleSd(sample.securityExcess);
    const sdMarket = sampleSd(sample.marketExcess);
    const meanS = sample.securityExcess.reduce((s, v) => s + v, 0) / sample.n;
    const meanM = sample.marketExcess.reduce((s, v) => s + v, 0) / sample.n;
    const covariance = sample.securityExcess.reduce((s, v, i) => s + (v - meanS) * (sample.marketExcess[i]! - meanM), 0) / (sample.n - 1);
    expect(sdSecurity).toBeCloseTo(0.0230468187746, 12);
    expect(sdMarket).toBeCloseTo(0.0189067380995, 12);
    expect(covariance / sdMarket ** 2).toBeCloseTo(1.19590747062, 10);
  });

  it('takes "latest" as the market\'s last date (2026-10-30) and gets the same grid', () => {
    const latest = alignReturns({ frequency: 'monthly', asOf: 'latest', returnKind: 'simple', market, securities: [security], riskFree });
    expect(latest.grid.labels).toEqual(aligned.grid.labels);
    expectColumn(latest.securities[0]!.excess, Array.from(aligned.securities[0]!.excess));
    expect(latest.securities[0]!.sampledPrices).toBeNull();
  });

  it('switches to ln(1 + r) − ln(1 + r_f) with log returns', () => {
    const log = alignReturns({ frequency: 'monthly', asOf: '2026-10-30', returnKind: 'log', market, securities: [security], riskFree });
    const expected = table.map((row) => Math.log(1 + row[3]) - Math.log(1 + row[6]));
    expectColumn(log.securities[0]!.excess, expected);
  });
});

describe('daily and weekly alignment on invented series', () => {
  const days = (isos: readonly string[]) => Int32Array.from(isos, (iso) => Date.UTC(+iso.slice(0, 4), +iso.slice(5, 7) - 1, +iso.slice(8)) / 86_400_000);
  // Market closed on Wednesday 2026-03-04 (a holiday: no row) and empty on 2026-03-10.
  const marketDates = ['2026-03-02', '2026-03-03', '2026-03-05', '2026-03-06', '2026-03-09', '2026-03-10', '2026-03-11', '2026-03-12'];
  const market: DaySeries = { id: 'MKT', days: days(marketDates), prices: Float64Array.from([100, 101, 100, 102, 103, nan, 104, 105]) };
  const constant: RiskFreeSource = { kind: 'constant', annualYield: 0.0252 };

  it('forms daily returns on market dates only; an empty security cell removes two returns', () => {
    const security: DaySeries = {
      id: 'QZ1',
      days: days(['2026-03-02', '2026-03-03', '2026-03-04', '2026-03-05', '2026-03-06', '2026-03-09', '2026-03-11', '2026-03-12']),
      prices: Float64Array.from([10, 11, 99, 12, nan, 13, 14, 15]),
    };
    const aligned = alignReturns({ frequency: 'daily', asOf: 'latest', returnKind: 'simple', market, securities: [security], riskFree: constant });
    expect(aligned.grid.labels).toEqual(['2026-03-02', '2026-03-03', '2026-03-05', '2026-03-06', '2026-03-09', '2026-03-11', '2026-03-12']);
    // The holiday price 99 is ignored; the empty 2026-03-06 cell removes the returns of 03-06 and 03-09.
    expect(Array.from(aligned.securities[0]!.raw, Number.isNaN)).toEqual([true, false, false, true, true, false, false]);
    expect(aligned.securities[0]!.raw[2]).toBeCloseTo(12 / 11 - 1, 15);
    // 2026-03-10 is no period: the 03-11 return runs from 03-09 (103) to 03-11 (104).
    expect(aligned.marketRaw[5]).toBeCloseTo(104 / 103 - 1, 15);
    expect(aligned.riskFree[1]).toBeCloseTo(1.0252 ** (1 / 252) - 1, 15);
  });

  it('samples weeks ending on Thursday and counts a late listing\'s observations in the window', () => {
    const late: DaySeries = { id: 'QZ2', days: days(['2026-03-09', '2026-03-12']), prices: Float64Array.from([20, 21]) };
    const aligned = alignReturns({ frequency: 'weekly', weekEnd: 'thursday', asOf: '2026-03-12', returnKind: 'simple', market, securities: [late], riskFree: constant });
    expect(aligned.grid.labels).toEqual(['2026-03-05', '2026-03-12']);
    expect(Array.from(aligned.marketLevels)).toEqual([100, 105]);
    const sample = windowSample(aligned, aligned.securities[0]!.excess, windowBounds(aligned.asOfIndex, 156), 104);
    expect([sample.n, sample.status]).toEqual([0, 'insufficient']);
  });
});
