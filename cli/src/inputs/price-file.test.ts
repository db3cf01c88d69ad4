// Readers on generated and small invented files: shapes, typed storage, the market split, units.
// The generated file comes from bench/generate-wide.ts (seeded, invented data).
import { readFile, mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { writeWideFixture } from '../../../bench/generate-wide.js';
import type { WideFixture } from '../../../bench/generate-wide.js';
import { readMarketFile } from './market-series.js';
import { readPriceFile } from './price-file.js';
import type { PriceFileOptions } from './price-file-options.js';
import { constantRiskFree, readRiskFreeFile } from './risk-free-file.js';

const wide: PriceFileOptions = { delimiter: ',', dateFormat: 'YYYY-MM-DD', columns: { layout: 'wide', dateColumn: 'date' }, marketId: 'MKT' };
const dated = { delimiter: ',', dateFormat: 'YYYY-MM-DD', dateColumn: 'date' };
let dir = '';
let fixture: WideFixture;

beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), 'clino-inputs-'));
  fixture = await writeWideFixture(join(dir, 'generated'), { securities: 150, days: 600, seed: 11 });
});

afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

describe('a generated wide price file', () => {
  it('reads every security into its own Float64Array over one shared date list', async () => {
    const file = await readPriceFile(fixture.pricesFile, wide);
    expect(file.securities).toHaveLength(150);
    expect(file.market?.prices).toBeInstanceOf(Float64Array);
    for (const series of file.securities) {
      expect(series.prices).toBeInstanceOf(Float64Array);
      expect(series.prices.length).toBe(600);
      expect(series.dates).toBe(file.securities[0]!.dates);
    }
    expect(file.securities[0]!.days).toBeInstanceOf(Int32Array);
  });

  it('keeps the empty cells of a late listing (every 50th security) as NaN', async () => {
    const file = await readPriceFile(fixture.pricesFile, wide);
    const late = file.securities[49]!;
    expect(late.id).toBe('S0050');
    expect(Number.isNaN(late.prices[0]!)).toBe(true);
    expect(Number.isNaN(late.prices[599]!)).toBe(false);
  });

  it('writes the same bytes for the same seed', async () => {
    const again = await writeWideFixture(join(dir, 'again'), { securities: 150, days: 600, seed: 11 });
    expect((await readFile(again.pricesFile)).equals(await readFile(fixture.pricesFile))).toBe(true);
  });

  it('reads its risk-free file of percent yields as decimals', async () => {
    const yields = await readRiskFreeFile(fixture.riskFreeFile, { ...dated, unit: 'percent' });
    expect(yields.days.length).toBe(120);
    expect(yields.yields[0]).toBeCloseTo(0.02, 15);
  });
});

describe('small invented files', () => {
  it('splits the market off a long file by its code', async () => {
    const file = join(dir, 'long.csv');
    await writeFile(file, 'date,security,close\n2026-01-30,QZ1,10\n2026-01-30,IDX,100\n2026-02-27,QZ1,11\n2026-02-27,IDX,103\n2026-03-31,IDX,101\n');
    const read = await readPriceFile(file, { ...wide, marketId: 'IDX', columns: { layout: 'long', dateColumn: 'date', securityColumn: 'security', closeColumn: 'close' } });
    expect(read.securities.map((series) => series.id)).toEqual(['QZ1']);
    expect(read.market?.dates).toEqual(['2026-01-30', '2026-02-27', '2026-03-31']);
    expect(Array.from(read.securities[0]!.prices)).toEqual([10, 11]);
  });

  it('reads a market file of its own, named after its value column, sorted by date', async () => {
    const file = join(dir, 'market.csv');
    await writeFile(file, 'level,date\n2050,2026-02-27\n2000,2026-01-30\n2075.5,2026-03-31\n');
    const market = await readMarketFile(file, dated);
    expect([market.id, market.dates, Array.from(market.prices)]).toEqual(['level', ['2026-01-30', '2026-02-27', '2026-03-31'], [2000, 2050, 2075.5]]);
  });

  it('reads decimal yields as given and keeps an empty cell as missing', async () => {
    const file = join(dir, 'yields.csv');
    await writeFile(file, 'date,y,note\n2026-01-30,0.0335,a\n2026-02-27,,b\n2026-03-31,-0.001,c\n');
    const yields = await readRiskFreeFile(file, { ...dated, valueColumn: 'y', unit: 'decimal' });
    expect(Array.from(yields.yields)).toEqual([0.0335, Number.NaN, -0.001]);
  });

  it('accepts a constant yield above -100% and refuses anything else', () => {
    expect(constantRiskFree(0.02)).toEqual({ kind: 'constant', annualYield: 0.02 });
    expect(() => constantRiskFree(-1)).toThrow(RangeError);
    expect(() => constantRiskFree(Number.NaN)).toThrow(RangeError);
  });
});
