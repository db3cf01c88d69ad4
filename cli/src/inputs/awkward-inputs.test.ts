// Awkward but valid files (test/fixtures/bad-inputs/awkward/) give exactly the clean file's series.
// Accepted forms per DESIGN.md "Input rules" and INPUT-RULES.md: a UTF-8 BOM, CRLF, RFC 4180
// quoting, exponent notation, trailing blank lines, no final newline, padded fields, dates in any
// order, other delimiters and date formats, the date column anywhere, the long layout.
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readPriceFile } from './price-file.js';
import type { DatedSeries, PriceFile, PriceFileOptions } from './price-file-options.js';

const dir = join(import.meta.dirname, '../../../test/fixtures/bad-inputs/awkward');
const wide: PriceFileOptions = { delimiter: ',', dateFormat: 'YYYY-MM-DD', columns: { layout: 'wide', dateColumn: 'date' }, marketId: 'MKT' };
const long: PriceFileOptions = { ...wide, columns: { layout: 'long', dateColumn: 'date', securityColumn: 'security', closeColumn: 'close' } };

/** Each series as id → [ISO date, price] for the dates with a price, ids sorted. */
function observed(file: PriceFile): Record<string, [string, number][]> {
  const all: DatedSeries[] = [...file.securities, ...(file.market === null ? [] : [file.market])];
  const entries = all.map((series) => [
    series.id,
    series.dates.flatMap((date, i) => (Number.isNaN(series.prices[i]!) ? [] : [[date, series.prices[i]!] as [string, number]])),
  ] as const);
  return Object.fromEntries([...entries].sort(([a], [b]) => a.localeCompare(b)));
}

const variants: readonly { behaviour: string; name: string; options: PriceFileOptions }[] = [
  { behaviour: 'a UTF-8 byte order mark', name: 'bom.csv', options: wide },
  { behaviour: 'CRLF line ends', name: 'crlf.csv', options: wide },
  { behaviour: 'every field quoted', name: 'quoted.csv', options: wide },
  { behaviour: 'exponent notation', name: 'exponent.csv', options: wide },
  { behaviour: 'trailing blank lines', name: 'trailing-blank-lines.csv', options: wide },
  { behaviour: 'no final newline', name: 'no-final-newline.csv', options: wide },
  { behaviour: 'fields padded with spaces', name: 'padded.csv', options: wide },
  { behaviour: 'dates newest first', name: 'reversed.csv', options: wide },
  { behaviour: 'dates in no order', name: 'shuffled.csv', options: wide },
  { behaviour: 'a semicolon delimiter', name: 'semicolon.csv', options: { ...wide, delimiter: ';' } },
  { behaviour: 'a tab delimiter', name: 'tab.tsv', options: { ...wide, delimiter: '\t' } },
  { behaviour: 'DD/MM/YYYY dates', name: 'day-month-year.csv', options: { ...wide, dateFormat: 'DD/MM/YYYY' } },
  { behaviour: 'YYYYMMDD dates', name: 'compact-date.csv', options: { ...wide, dateFormat: 'YYYYMMDD' } },
  { behaviour: 'the date column not first', name: 'date-not-first.csv', options: wide },
  { behaviour: 'the long layout', name: 'long-layout.csv', options: long },
  { behaviour: 'the long layout with columns reordered and rows reversed', name: 'long-layout-shuffled.csv', options: long },
];

describe('awkward but valid price files', () => {
  it('reads the clean file as written', async () => {
    const clean = await readPriceFile(join(dir, 'clean.csv'), wide);
    expect(clean.securities.map((series) => series.id)).toEqual(['QZ1', 'QZ7']);
    expect(clean.market?.dates).toEqual(['2026-01-30', '2026-02-27', '2026-03-31', '2026-04-30', '2026-05-29']);
    expect(Array.from(clean.securities[1]!.prices)).toEqual([55.2, 54.8, Number.NaN, 56.1, 57.35]);
    expect(Array.from(clean.market!.prices)).toEqual([2000, 2031.5, 2010, 2064.25, 2080]);
  });

  it.each(variants)('gives the clean result for $behaviour ($name)', async ({ name, options }) => {
    const clean = observed(await readPriceFile(join(dir, 'clean.csv'), wide));
    expect(observed(await readPriceFile(join(dir, name), options))).toEqual(clean);
  });

  it('keeps the header order of securities and their day numbers in step with the ISO dates', async () => {
    const file = await readPriceFile(join(dir, 'shuffled.csv'), wide);
    const series = file.securities[0]!;
    expect(series.days.length).toBe(series.dates.length);
    // Day numbers checked against ECMAScript Date.UTC(y, m - 1, d) / 86 400 000 (ECMA-262, MakeDay).
    expect(Array.from(series.days)).toEqual([20483, 20511, 20543, 20573, 20602]);
  });
});
