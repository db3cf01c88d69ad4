// The benchmark's slices of securities: run in the main thread (one slice) or in worker threads (one
// slice each, the price arrays transferred to the worker, not copied). Every slice answers the same
// phase requests; the pool sends a request to every slice and waits for all the answers.
import { Worker } from 'node:worker_threads';
import { once } from 'node:events';
import { sliceWork } from './batch-slice.js';
import type { FormattedRows, RollingSummary, SliceData, SliceStatistics } from './batch-slice.js';
import type { PhaseRequest } from './batch-worker.js';
import type { DatedSeries } from '../cli/src/inputs/price-file-options.js';
import type { YieldSeries } from '../cli/src/engine/risk-free.js';

interface Slice {
  request(request: PhaseRequest): Promise<unknown>;
  close(): Promise<void>;
}

export interface SlicePool {
  readonly size: number;
  statistics(request: Extract<PhaseRequest, { phase: 'statistics' }>): Promise<SliceStatistics[]>;
  rolling(request: Extract<PhaseRequest, { phase: 'rolling' }>): Promise<RollingSummary[]>;
  /** Rows [from, to) of the rolling betas, formatted by every slice at once. */
  formatRolling(from: number, to: number): Promise<FormattedRows[]>;
  close(): Promise<void>;
}

function localSlice(data: SliceData): Slice {
  const work = sliceWork(data);
  return {
    request(request) {
      switch (request.phase) {
        case 'statistics': return Promise.resolve(work.statistics(request.frequency, request.window));
        case 'rolling': return Promise.resolve(work.rolling(request.window));
        case 'format-rolling': return Promise.resolve(work.formatRolling(request.from, request.to));
      }
    },
    close: () => Promise.resolve(),
  };
}

async function workerSlice(data: SliceData): Promise<Slice> {
  // Node 20 does not pass tsx's loader to a worker whose entry is a .ts file: register it first.
  const entry = JSON.stringify(new URL('./batch-worker.ts', import.meta.url).href);
  const bootstrap = `import('tsx/esm/api').then(({ register }) => { register(); return import(${entry}); });`;
  const worker = new Worker(bootstrap, {
    eval: true,
    workerData: data,
    transferList: data.prices.map((prices) => prices.buffer as ArrayBuffer),
  });
  await once(worker, 'message'); // 'ready': the worker's modules are loaded
  return {
    async request(request) {
      const reply = once(worker, 'message');
      worker.postMessage(request);
      const [message] = await reply;
      return message as unknown;
    },
    async close() {
      await worker.terminate();
    },
  };
}

/** Contiguous, nearly equal slices of the securities, each with the market and the yields. */
function slices(securities: readonly DatedSeries[], market: DatedSeries, yields: YieldSeries, count: number): SliceData[] {
  const days = securities[0]?.days ?? new Int32Array(0);
  return Array.from({ length: count }, (_, s) => {
    const part = securities.slice(Math.floor((s * securities.length) / count), Math.floor(((s + 1) * securities.length) / count));
    return {
      days, ids: part.map((series) => series.id), prices: part.map((series) => series.prices),
      marketDays: market.days, marketPrices: market.prices, yields,
    };
  });
}

/** One slice in this thread when `workers` ≤ 1; otherwise one worker thread per slice. */
export async function openSlicePool(
  securities: readonly DatedSeries[], market: DatedSeries, yields: YieldSeries, workers: number,
): Promise<SlicePool> {
  const parts = slices(securities, market, yields, Math.max(1, workers));
  const all: Slice[] = workers <= 1 ? parts.map(localSlice) : await Promise.all(parts.map(workerSlice));
  const each = <T>(request: PhaseRequest) => Promise.all(all.map((slice) => slice.request(request))) as Promise<T[]>;
  return {
    size: all.length,
    statistics: (request) => each<SliceStatistics>(request),
    rolling: (request) => each<RollingSummary>(request),
    formatRolling: (from, to) => each<FormattedRows>({ phase: 'format-rolling', from, to }),
    close: async () => { await Promise.all(all.map((slice) => slice.close())); },
  };
}
