// Writes a large invented wide price file, its market index and a risk-free file from a seeded
// one-factor model: r_i = a_i + b_i r_m + e_i on weekdays. Used by the benchmark and by parsing
// tests. Usage: node --import tsx bench/generate-wide.ts --out <dir> [--securities 3000]
// [--days 2520] [--seed 7]
import { createWriteStream } from 'node:fs';
import { mkdir } from 'node:fs/promises';
import { once } from 'node:events';
import { join } from 'node:path';
import { parseArgs } from 'node:util';
import { pathToFileURL } from 'node:url';
import { dayNumberOf, isoOfDayNumber, weekdayIndexOf } from '../cli/src/engine/calendar-date.js';

export interface WideFixtureOptions {
  readonly securities: number;
  readonly days: number;
  readonly seed: number;
}

export interface WideFixture {
  readonly pricesFile: string;
  readonly riskFreeFile: string;
  /** The betas the model used, one per security column in order. */
  readonly trueBetas: Float64Array;
  readonly marketId: string;
}

/** mulberry32: a small seeded 32-bit generator (public domain), uniform in [0, 1). */
function uniformSource(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal draws by the Box–Muller transform. */
function normalSource(uniform: () => number): () => number {
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

function weekdays(count: number): Int32Array {
  const days = new Int32Array(count);
  let day = dayNumberOf(2016, 1, 4);
  for (let i = 0; i < count; day++) if (weekdayIndexOf(day) < 5) days[i++] = day;
  return days;
}

/** Security k lists late (every 50th) or stops trading early (every 75th): empty cells outside its life. */
function trades(k: number, row: number, rows: number): boolean {
  if (k % 50 === 49 && row < rows / 3) return false;
  return !(k % 75 === 74 && row > (2 * rows) / 3);
}

async function writeLines(path: string, lines: Iterable<string>): Promise<void> {
  const out = createWriteStream(path);
  for (const line of lines) if (!out.write(line)) await once(out, 'drain');
  out.end();
  await once(out, 'finish');
}

function* priceLines(options: WideFixtureOptions, betas: Float64Array, marketId: string): Generator<string> {
  const normal = normalSource(uniformSource(options.seed));
  const codes = Array.from({ length: options.securities }, (_, k) => `S${String(k + 1).padStart(4, '0')}`);
  yield `date,${marketId},${codes.join(',')}\n`;
  const prices = new Float64Array(options.securities).fill(100);
  let level = 1000;
  const days = weekdays(options.days);
  for (let row = 0; row < options.days; row++) {
    const marketReturn = row === 0 ? 0 : 0.0003 + 0.01 * normal();
    level *= 1 + marketReturn;
    const cells = [isoOfDayNumber(days[row]!), level.toFixed(4)];
    for (let k = 0; k < options.securities; k++) {
      if (row > 0) prices[k]! *= 1 + 0.0001 + betas[k]! * marketReturn + 0.015 * normal();
      cells.push(trades(k, row, options.days) ? prices[k]!.toFixed(4) : '');
    }
    yield `${cells.join(',')}\n`;
  }
}

function* yieldLines(options: WideFixtureOptions): Generator<string> {
  const days = weekdays(options.days);
  yield 'date,rate_pct\n';
  for (let row = 0; row < options.days; row += 5) {
    yield `${isoOfDayNumber(days[row]!)},${(2 + Math.sin(row / 400)).toFixed(3)}\n`;
  }
}

export async function writeWideFixture(dir: string, options: WideFixtureOptions): Promise<WideFixture> {
  await mkdir(dir, { recursive: true });
  const uniform = uniformSource(options.seed ^ 0x5eed);
  const trueBetas = Float64Array.from({ length: options.securities }, () => 0.3 + 1.4 * uniform());
  const pricesFile = join(dir, 'prices-wide.csv');
  const riskFreeFile = join(dir, 'risk-free.csv');
  const marketId = 'MKT';
  await writeLines(pricesFile, priceLines(options, trueBetas, marketId));
  await writeLines(riskFreeFile, yieldLines(options));
  return { pricesFile, riskFreeFile, trueBetas, marketId };
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const { values } = parseArgs({
    options: {
      out: { type: 'string', default: 'bench/data' },
      securities: { type: 'string', default: '3000' },
      days: { type: 'string', default: '2520' },
      seed: { type: 'string', default: '7' },
    },
  });
  const fixture = await writeWideFixture(values.out, {
    securities: Number(values.securities), days: Number(values.days), seed: Number(values.seed),
  });
  process.stderr.write(`wrote ${fixture.pricesFile} and ${fixture.riskFreeFile}\n`);
}
