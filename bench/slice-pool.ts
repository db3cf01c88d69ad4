// The benchmark's slices of securities: run in the main thread (one slice) or in worker threads (one
// slice each, the price arrays transferred to the worker, not copied). Workers are started before the
// input is parsed (their module loading overlaps the parse) and loaded with their slice afterwards.
// Every slice answers the same phase requests; the pool sends a request to every slice and waits for
// all the answers.
import { Worker } from 'node:worker_threads';
import { once } from 'node:events';
import { sliceWork } from './batch-slice.js';
import type { FormattedRows, RollingSummary, SliceData, SliceStatistics } from './batch-slice.js';
import type { PhaseRequest, WorkerRequest } from './batch-worker.js';
import type { DatedSeries } from '../cli/src/inputs/price-file-options.js';
import type { YieldSeries } from '../cli/src/engine/risk-free.js';

type Ask = (request: PhaseRequest) => Promise<unknown>;

export interface SlicePool {
  readonly size: number;
  statistics(request: Extract<PhaseRequest, { phase: 'statistics' }>): Promise<SliceStatistics[]>;
  rolling(request: Extract<PhaseRequest, { phase: 'rolling' }>): Promise<RollingSummary[]>;
  /** Rows [from, to) of the rolling betas, formatted by every slice at once. */
  formatRolling(from: number, to: number): Promise<FormattedRows[]>;
  close(): Promise<void>;
}

export interface StartedPool {
  /** Hands each slice its securities (with the market and the yields) and answers the working pool. */
  load(securities: readonly DatedSeries[], market: DatedSeries, yields: YieldSeries): Promise<SlicePool>;
}

async function request(worker: Worker, message: WorkerRequest, transfer: ArrayBuffer[] = []): Promise<unknown> {
  const reply = once(worker, 'message');
  worker.postMessage(message, transfer);
  const [answer] = await reply;
  return answer as unknown;
}

async function startWorker(): Promise<Worker> {
  // Node 20 does not pass tsx's loader to a worker whose entry is a .ts file: register it first.
  const entry = JSON.stringify(new URL('./batch-worker.ts', import.meta.url).href);
  const bootstrap = `import('tsx/esm/api').then(({ register }) => { register(); return import(${entry}); });`;
  const worker = new Worker(bootstrap, { eval: true });
  await once(worker, 'message'); // 'ready': the worker's modules are loaded
  return worker;
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

function poolOf(asks: readonly Ask[], close: () => Promise<void>): SlicePool {
  const each = <T>(phase: PhaseRequest) => Promise.all(asks.map((ask) => ask(phase))) as Promise<T[]>;
  return {
    size: asks.length,
    statistics: (phase) => each<SliceStatistics>(phase),
    rolling: (phase) => each<RollingSummary>(phase),
    formatRolling: (from, to) => each<FormattedRows>({ phase: 'format-rolling', from, to }),
    close,
  };
}

function localAsk(data: SliceData): Ask {
  const work = sliceWork(data);
  return (phase) => {
    switch (phase.phase) {
      case 'statistics': return Promise.resolve(work.statistics(phase.frequency, phase.window));
      case 'rolling': return Promise.resolve(work.rolling(phase.window));
      case 'format-rolling': return Promise.resolve(work.formatRolling(phase.from, phase.to));
    }
  };
}

/** One slice in this thread when `workers` ≤ 1; otherwise one worker thread per slice, started now. */
export function startSlicePool(workers: number): StartedPool {
  if (workers <= 1) {
    return { load: (securities, market, yields) => Promise.resolve(poolOf(slices(securities, market, yields, 1).map(localAsk), () => Promise.resolve())) };
  }
  const started = Promise.all(Array.from({ length: workers }, startWorker));
  return {
    async load(securities, market, yields) {
      const threads = await started;
      const parts = slices(securities, market, yields, threads.length);
      await Promise.all(threads.map((worker, s) => request(worker, { phase: 'load', data: parts[s]! }, parts[s]!.prices.map((p) => p.buffer as ArrayBuffer))));
      const asks = threads.map((worker): Ask => (phase) => request(worker, phase));
      return poolOf(asks, async () => { await Promise.all(threads.map((worker) => worker.terminate())); });
    },
  };
}
