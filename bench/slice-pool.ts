// The benchmark's slices of securities, one per thread: the main thread's own and one per worker
// thread (the price arrays transferred to the worker, not copied). Workers are started before the
// input is parsed (their module loading overlaps the parse) and loaded with their slice afterwards.
// Every slice answers the same phase requests; the pool sends a request to every slice and waits for
// all the answers. Formatted rows come back through shared memory, a few reused slots per slice, so
// the write phase does not allocate (fresh memory is costly: docs/performance.md).
import { Worker } from 'node:worker_threads';
import { once } from 'node:events';
import { FORMAT_SLOTS, MAX_CELL_BYTES, ROWS_PER_BLOCK, formatSlots, sliceWork } from './batch-slice.js';
import type { FormattedRows, RollingSummary, SliceData, SliceStatistics } from './batch-slice.js';
import type { PhaseRequest, WorkerRequest } from './batch-worker.js';
import type { DatedSeries } from '../cli/src/inputs/price-file-options.js';
import type { YieldSeries } from '../cli/src/engine/risk-free.js';

type Ask = (request: PhaseRequest) => Promise<unknown>;

/** A slice's formatted rows and the slot they are in (valid until that slot is asked for again). */
export interface FormattedBlock extends FormattedRows {
  readonly bytes: Uint8Array;
}

export interface SlicePool {
  readonly size: number;
  statistics(request: Extract<PhaseRequest, { phase: 'statistics' }>): Promise<SliceStatistics[]>;
  rolling(request: Extract<PhaseRequest, { phase: 'rolling' }>): Promise<RollingSummary[]>;
  /** Rows [from, to) (at most ROWS_PER_BLOCK) of the rolling betas, formatted by every slice at once into format slot `slot`. */
  formatRolling(from: number, to: number, slot: number): Promise<FormattedBlock[]>;
  close(): Promise<void>;
}

export interface StartedPool {
  /** Hands each slice its securities (with the market and the yields) and answers the working pool. */
  load(securities: readonly DatedSeries[], market: DatedSeries, yields: YieldSeries): Promise<SlicePool>;
}

/** A worker answers its requests in order: each answer settles the oldest request still waiting. */
interface Thread {
  readonly worker: Worker;
  request(message: WorkerRequest, transfer?: ArrayBuffer[]): Promise<unknown>;
}

/** The worker: batch-worker.js beside this module when the benchmark was built ahead (npm run bench), else the TypeScript through tsx. */
function newWorker(): Worker {
  if (import.meta.url.endsWith('.js')) return new Worker(new URL('./batch-worker.js', import.meta.url));
  // Node 20 does not pass tsx's loader to a worker whose entry is a .ts file: register it first.
  const entry = JSON.stringify(new URL('./batch-worker.ts', import.meta.url).href);
  return new Worker(`import('tsx/esm/api').then(({ register }) => { register(); return import(${entry}); });`, { eval: true });
}

async function startThread(): Promise<Thread> {
  const worker = newWorker();
  await once(worker, 'message'); // 'ready': the worker's modules are loaded
  const waiting: { resolve(answer: unknown): void; reject(error: Error): void }[] = [];
  worker.on('message', (answer: unknown) => waiting.shift()?.resolve(answer));
  worker.on('error', (error: Error) => { for (const request of waiting.splice(0)) request.reject(error); });
  return {
    worker,
    request(message, transfer = []) {
      return new Promise((resolve, reject) => {
        waiting.push({ resolve, reject });
        worker.postMessage(message, transfer);
      });
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

/** Format memory of one slice: FORMAT_SLOTS slots of a block of rows each. */
function formatMemoryOf(data: SliceData): { memory: SharedArrayBuffer; slotBytes: number; slots: Uint8Array[] } {
  const slotBytes = Math.max(1, ROWS_PER_BLOCK * data.ids.length * MAX_CELL_BYTES);
  const memory = new SharedArrayBuffer(FORMAT_SLOTS * slotBytes);
  return { memory, slotBytes, slots: formatSlots(memory, slotBytes) };
}

function poolOf(asks: readonly Ask[], slotsOfSlice: readonly Uint8Array[][], close: () => Promise<void>): SlicePool {
  const each = <T>(phase: PhaseRequest) => Promise.all(asks.map((ask) => ask(phase))) as Promise<T[]>;
  return {
    size: asks.length,
    statistics: (phase) => each<SliceStatistics>(phase),
    rolling: (phase) => each<RollingSummary>(phase),
    async formatRolling(from, to, slot) {
      const parts = await each<FormattedRows>({ phase: 'format-rolling', from, to, slot });
      return parts.map((part, s) => ({ ...part, bytes: slotsOfSlice[s]![slot]! }));
    },
    close,
  };
}

function localAsk(data: SliceData, slots: readonly Uint8Array[]): Ask {
  const work = sliceWork(data);
  return (phase) => {
    switch (phase.phase) {
      case 'statistics': return Promise.resolve(work.statistics(phase.frequency, phase.window));
      case 'rolling': return Promise.resolve(work.rolling(phase.window));
      case 'format-rolling': return Promise.resolve(work.formatRolling(phase.from, phase.to, slots[phase.slot]!));
    }
  };
}

/**
 * `threads` slices: the first `threads` − 1 in worker threads, started now, and the last in this
 * thread (which would otherwise only wait). Requests go to the workers first, so they work while
 * this thread does its own slice.
 */
export function startSlicePool(threads: number): StartedPool {
  const started = Promise.all(Array.from({ length: Math.max(0, threads - 1) }, startThread));
  return {
    async load(securities, market, yields) {
      const workers = await started;
      const parts = slices(securities, market, yields, workers.length + 1);
      const memories = parts.map(formatMemoryOf);
      await Promise.all(workers.map((thread, s) => thread.request(
        { phase: 'load', data: parts[s]!, formatMemory: memories[s]!.memory, slotBytes: memories[s]!.slotBytes },
        parts[s]!.prices.map((p) => p.buffer as ArrayBuffer),
      )));
      const asks = workers.map((thread): Ask => (phase) => thread.request(phase));
      asks.push(localAsk(parts[workers.length]!, memories[workers.length]!.slots));
      return poolOf(asks, memories.map((m) => m.slots), async () => { await Promise.all(workers.map((thread) => thread.worker.terminate())); });
    },
  };
}
