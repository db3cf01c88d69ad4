// The Clinometer side of `npm run bench`: the full batch on a wide daily file — parse; daily (252/200)
// and monthly (60/36) full-window statistics with the OLS and the Dimson (k = 1) base estimators,
// Blume and Vasicek; 252-day rolling betas ending at every day for every security; the result CSVs
// (the contracts' writer) and the rolling-beta CSV (dates × securities). Prints the wall time per
// phase and the peak RSS (stderr), and writes them as JSON to <out>/clinometer-timing.json.
// Usage: node --import tsx bench/run-bench.ts --data <dir> --out <dir> [--threads 2]
// (--threads 2: the main thread and one worker thread each take half the securities.)
import { mkdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { parseArgs } from 'node:util';
import { readPriceFile } from '../cli/src/inputs/price-file.js';
import { readRiskFreeFile } from '../cli/src/inputs/risk-free-file.js';
import { startSlicePool } from './slice-pool.js';
import type { SlicePool } from './slice-pool.js';
import { PhaseClock } from './phase-clock.js';
import { resultRowsOf, writeRollingCsv } from './batch-output.js';
import { renderResultCsv } from '../server/src/contracts/result-csv.js';
import type { ResultRow } from '../server/src/contracts/result-columns.js';
import type { Frequency } from '../cli/src/engine/types.js';

const WINDOWS: Readonly<Record<'daily' | 'monthly', { length: number; minimum: number }>> = {
  daily: { length: 252, minimum: 200 },
  monthly: { length: 60, minimum: 36 },
};

const { values } = parseArgs({
  options: {
    data: { type: 'string', default: '.data/bench/data' },
    out: { type: 'string', default: '.data/bench/out/clinometer' },
    threads: { type: 'string', default: '2' },
  },
});
const threads = Number(values.threads);
const out = values.out;
await mkdir(out, { recursive: true });
const clock = new PhaseClock();
const started = startSlicePool(threads);

let [prices, yields] = await clock.time('parse', () => Promise.all([
  readPriceFile(join(values.data, 'prices-wide.csv'), {
    delimiter: ',', dateFormat: 'YYYY-MM-DD', columns: { layout: 'wide', dateColumn: 'date' }, marketId: 'MKT',
  }),
  readRiskFreeFile(join(values.data, 'risk-free.csv'), {
    delimiter: ',', dateFormat: 'YYYY-MM-DD', dateColumn: 'date', valueColumn: 'rate_pct', unit: 'percent',
  }),
]));
const market = prices.market!;
const ids = prices.securities.map((series) => series.id);

const pool: SlicePool = await clock.time('hand out slices', () => started.load(prices.securities, market, yields));
prices = { ...prices, securities: [] }; // the slices own the price arrays now
const resultRows = new Map<string, ResultRow[]>();

// Monthly first: the slices let the prices go once the daily returns are aligned.
for (const frequency of ['monthly', 'daily'] as const satisfies readonly Frequency[]) {
  await clock.time(`${frequency} statistics`, async () => {
    const parts = await pool.statistics({ phase: 'statistics', frequency, window: WINDOWS[frequency] });
    resultRows.set(`${frequency}-ols.csv`, resultRowsOf(parts.flatMap((p) => p.ols)));
    resultRows.set(`${frequency}-dimson.csv`, resultRowsOf(parts.flatMap((p) => p.dimson)));
  });
}

const rolling = await clock.time('rolling betas', () => pool.rolling({ phase: 'rolling', window: WINDOWS.daily }));
const labels = rolling.find((part) => part.labels.length > 0)?.labels ?? [];

await clock.time('write results', async () => {
  const rollingCsv = writeRollingCsv(join(out, 'rolling-betas-daily.csv'), ids, labels, (from, to, slot) => pool.formatRolling(from, to, slot));
  await Promise.all([...resultRows].map(([name, rows]) => writeFile(join(out, name), renderResultCsv(rows))));
  await rollingCsv;
});
await pool.close();

const report = clock.report({ engine: 'clinometer', threads: pool.size, securities: ids.length, days: market.days.length });
await writeFile(join(out, 'clinometer-timing.json'), `${JSON.stringify(report, null, 2)}\n`);
process.stderr.write(clock.table('Clinometer'));
