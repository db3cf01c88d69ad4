// The wide and long readers take the common row straight from bytes and leave any other row to the
// text path (wide-price-file.ts, long-rows.ts, byte-cells.ts, record-sink.ts). Whichever path
// reads a row, the prices must be what an independent reading gives: csv-parse (the npm CSV parser, RFC 4180) for the records and
// JavaScript's Number() for the cells (ECMA-262 StringToNumber), on random files that mix plain rows
// with rows the byte path must leave alone (padding, quotes, exponents, 16+ digits), larger than the
// reader's 1 MB read size so rows also straddle reads.
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parse } from 'csv-parse/sync';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readPriceFile } from './price-file.js';
import type { PriceFile, PriceFileOptions } from './price-file-options.js';
import { InputError } from './input-error.js';
import { seededRandom } from '../engine/test-support/seeded-random.js';

const longOptions: PriceFileOptions = {
  delimiter: ',', dateFormat: 'YYYY-MM-DD', columns: { layout: 'long', dateColumn: 'date', securityColumn: 'security', closeColumn: 'close' }, marketId: 'MKT',
};
const options: PriceFileOptions = { delimiter: ',', dateFormat: 'YYYY-MM-DD', columns: { layout: 'wide', dateColumn: 'date' }, marketId: 'MKT' };

/** Seeded uniform draws (mulberry32), so a failing file can be made again. */
const uniformFrom = (seed: number): (() => number) => seededRandom(seed).uniform;

function isoDate(dayNumber: number): string {
  return new Date(Date.UTC(2001, 0, 1) + dayNumber * 86_400_000).toISOString().slice(0, 10);
}

/** A price cell: mostly plain decimals, sometimes a form only the text path reads. */
function priceCell(random: () => number, awkward: boolean): string {
  const price = (0.5 + random() * 400).toFixed(Math.floor(random() * 7));
  if (!awkward) return random() < 0.03 ? '' : price;
  const pick = Math.floor(random() * 5);
  if (pick === 0) return ` ${price} `;
  if (pick === 1) return `"${price}"`;
  if (pick === 2) return Number(price).toExponential(4);
  if (pick === 3) return (Number(price) + 1e-9 * random()).toPrecision(17);
  return `+${price}`;
}

interface Made { readonly text: string; readonly name: string }

function makeFile(seed: number, rows: number, securities: number, lineEnd: string, awkwardShare: number): Made {
  const random = uniformFrom(seed);
  const ids = ['MKT', ...Array.from({ length: securities }, (_, k) => `QZ-T${String(k).padStart(4, '0')}`)];
  const lines = [['date', ...ids].join(',')];
  for (let r = 0; r < rows; r++) {
    const awkwardRow = random() < awkwardShare;
    const cells = ids.map(() => priceCell(random, awkwardRow && random() < 0.2));
    cells[0] = cells[0] === '' ? '100' : cells[0]!;
    lines.push([isoDate(r), ...cells].join(','));
  }
  return { text: `${lines.join(lineEnd)}${lineEnd}`, name: `wide-${seed}.csv` };
}

/** The independent reading: csv-parse records, trimmed cells, Number(), keyed by id and date. */
function referenceReading(text: string): Map<string, Map<string, number>> {
  const [header, ...records] = parse(text, { relax_column_count: false }) as string[][];
  const byId = new Map<string, Map<string, number>>();
  header!.slice(1).forEach((id, k) => {
    const prices = new Map<string, number>();
    for (const record of records) {
      const cell = record[k + 1]!.trim();
      if (cell !== '') prices.set(record[0]!, Number(cell));
    }
    byId.set(id, prices);
  });
  return byId;
}

function readingOf(file: PriceFile): Map<string, Map<string, number>> {
  const byId = new Map<string, Map<string, number>>();
  for (const series of [file.market!, ...file.securities]) {
    const prices = new Map<string, number>();
    series.dates.forEach((date, i) => {
      if (!Number.isNaN(series.prices[i]!)) prices.set(date, series.prices[i]!);
    });
    byId.set(series.id, prices);
  }
  return byId;
}

let dir = '';
beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), 'clino-wide-bytes-'));
});
afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

async function written(made: Made): Promise<string> {
  const path = join(dir, made.name);
  await writeFile(path, made.text);
  return path;
}

describe('wide price files read from bytes', () => {
  const cases = [
    { behaviour: 'plain rows only, LF', seed: 11, lineEnd: '\n', awkwardShare: 0 },
    { behaviour: 'plain rows with one row in twenty awkward, LF', seed: 12, lineEnd: '\n', awkwardShare: 0.05 },
    { behaviour: 'plain rows with one row in twenty awkward, CRLF', seed: 13, lineEnd: '\r\n', awkwardShare: 0.05 },
    { behaviour: 'mostly awkward rows (the byte path gives up)', seed: 14, lineEnd: '\n', awkwardShare: 0.9 },
  ];
  for (const { behaviour, seed, lineEnd, awkwardShare } of cases) {
    it(`gives csv-parse and Number()'s prices for ${behaviour}`, async () => {
      const made = makeFile(seed, 700, 300, lineEnd, awkwardShare);
      expect(made.text.length).toBeGreaterThan(1 << 20); // more than one read of the reader
      const file = await readPriceFile(await written(made), options);
      expect(readingOf(file)).toEqual(referenceReading(made.text));
    });
  }

  it('names the line and column of a bad cell that follows rows read from bytes', async () => {
    const made = makeFile(21, 600, 300, '\n', 0);
    const lines = made.text.split('\n');
    const cells = lines[457]!.split(',');
    cells[123] = '12;5';
    lines[457] = cells.join(',');
    const path = await written({ text: lines.join('\n'), name: 'bad-cell.csv' });
    const error = await readPriceFile(path, options).then(() => null, (caught: unknown) => caught);
    expect(error).toBeInstanceOf(InputError);
    expect(error).toMatchObject({ code: 'INPUT_BAD_PRICE', file: path, line: 458, column: 124 });
  });

  it('splits on a `.` delimiter as the text path does (a point never joins two cells)', async () => {
    // `101.7.9` is three cells (101, 7, 9) for a header of two after the date, not the prices 101.7 and 9.
    const text = 'date.MKT.QZ-A\n2024-01-02.100.7\n2024-01-03.101.7.9\n2024-01-04.99.9\n';
    const path = await written({ text, name: 'dot-delimiter.csv' });
    const error = await readPriceFile(path, { ...options, delimiter: '.' }).then(() => null, (caught: unknown) => caught);
    expect(error).toMatchObject({ code: 'INPUT_FIELD_COUNT', file: path, line: 3, column: 4 });
    const good = await written({ text: 'date.MKT.QZ-A\n2024-01-02.100.7\n2024-01-03.101.8\n2024-01-04.99.9\n', name: 'dot-delimiter-good.csv' });
    const file = await readPriceFile(good, { ...options, delimiter: '.' });
    expect(Array.from(file.securities[0]!.prices)).toEqual([7, 8, 9]);
  });

  it('names the line of a short row that follows rows read from bytes', async () => {
    const made = makeFile(22, 600, 300, '\n', 0);
    const lines = made.text.split('\n');
    lines[300] = lines[300]!.split(',').slice(0, 200).join(',');
    const path = await written({ text: lines.join('\n'), name: 'short-row.csv' });
    const error = await readPriceFile(path, options).then(() => null, (caught: unknown) => caught);
    expect(error).toMatchObject({ code: 'INPUT_FIELD_COUNT', file: path, line: 301, column: 201 });
  });
});

/** A long file (date, security, close, volume) of `securities` × `days`, rows in the given order. */
function makeLongFile(seed: number, days: number, securities: number, order: 'by date' | 'by security' | 'shuffled', awkwardShare: number): Made {
  const random = uniformFrom(seed);
  const ids = ['MKT', ...Array.from({ length: securities }, (_, k) => `QZ-L${String(k).padStart(3, '0')}`)];
  const rows: string[] = [];
  for (const id of ids) {
    for (let d = 0; d < days; d++) {
      const awkward = random() < awkwardShare;
      let code = id;
      if (awkward && random() < 0.3) code = random() < 0.5 ? ` ${id}\t` : `"${id}"`;
      const close = id === 'MKT' ? (100 + d + random()).toFixed(3) : priceCell(random, awkward);
      rows.push(`${isoDate(d)},${code},${close},${Math.floor(random() * 1000)}`);
    }
  }
  if (order === 'by date') rows.sort((a, b) => a.slice(0, 10).localeCompare(b.slice(0, 10)));
  if (order === 'shuffled') {
    for (let i = rows.length - 1; i > 0; i--) {
      const j = Math.floor(random() * (i + 1));
      [rows[i], rows[j]] = [rows[j]!, rows[i]!];
    }
  }
  return { text: `date,security,close,volume\n${rows.join('\n')}\n`, name: `long-${seed}.csv` };
}

/** csv-parse records, trimmed codes and cells, Number(): id → date → price for the non-empty cells. */
function referenceLongReading(text: string): Map<string, Map<string, number>> {
  const [, ...records] = parse(text) as string[][];
  const byId = new Map<string, Map<string, number>>();
  for (const [date, code, close] of records) {
    const id = code!.trim();
    if (!byId.has(id)) byId.set(id, new Map());
    if (close!.trim() !== '') byId.get(id)!.set(date!, Number(close!.trim()));
  }
  return byId;
}

describe('long price files read from bytes', () => {
  const cases = [
    { behaviour: 'rows by date, all plain', seed: 31, order: 'by date', awkwardShare: 0 },
    { behaviour: 'rows by security, one in twenty awkward', seed: 32, order: 'by security', awkwardShare: 0.05 },
    { behaviour: 'rows shuffled, one in twenty awkward', seed: 33, order: 'shuffled', awkwardShare: 0.05 },
    { behaviour: 'rows by date, mostly awkward (the byte path gives up)', seed: 34, order: 'by date', awkwardShare: 0.9 },
  ] as const;
  for (const { behaviour, seed, order, awkwardShare } of cases) {
    it(`gives csv-parse and Number()'s prices for ${behaviour}`, async () => {
      const made = makeLongFile(seed, 500, 80, order, awkwardShare);
      expect(made.text.length).toBeGreaterThan(1 << 20); // more than one read of the reader
      const file = await readPriceFile(await written(made), longOptions);
      const reading = readingOf(file);
      expect(new Map([...reading].sort(([a], [b]) => a.localeCompare(b)))).toEqual(new Map([...referenceLongReading(made.text)].sort(([a], [b]) => a.localeCompare(b))));
    });
  }

  it('names the line and column of a bad close, and of an empty code, after rows read from bytes', async () => {
    const made = makeLongFile(35, 300, 40, 'by date', 0);
    const lines = made.text.split('\n');
    const badClose = lines[5000]!.split(',');
    badClose[2] = '1;5';
    lines[5000] = badClose.join(',');
    const path = await written({ text: lines.join('\n'), name: 'long-bad-close.csv' });
    await expect(readPriceFile(path, longOptions)).rejects.toMatchObject({ code: 'INPUT_BAD_PRICE', file: path, line: 5001, column: 3 });
    const again = made.text.split('\n');
    const noCode = again[7000]!.split(',');
    noCode[1] = '  ';
    again[7000] = noCode.join(',');
    const emptyCode = await written({ text: again.join('\n'), name: 'long-empty-code.csv' });
    await expect(readPriceFile(emptyCode, longOptions)).rejects.toMatchObject({ code: 'INPUT_EMPTY_SECURITY', file: emptyCode, line: 7001, column: 2 });
  });
});
