// Worker thread of the benchmark: loads one slice of the securities (its price arrays transferred,
// not copied) and answers the main thread's phase requests one at a time. Formatted rows go to the
// shared format memory the main thread reads them from.
import { parentPort } from 'node:worker_threads';
import { formatSlots, sliceWork } from './batch-slice.js';
import type { SliceData, SliceWork, WindowSetting } from './batch-slice.js';
import type { Frequency } from '../cli/src/engine/types.js';

export type PhaseRequest =
  | { readonly phase: 'statistics'; readonly frequency: Frequency; readonly window: WindowSetting }
  | { readonly phase: 'rolling'; readonly window: WindowSetting }
  | { readonly phase: 'format-rolling'; readonly from: number; readonly to: number; readonly slot: number };

/** The slice, and the shared memory its formatted rows go to (slots of `slotBytes` bytes). */
export interface LoadRequest {
  readonly phase: 'load';
  readonly data: SliceData;
  readonly formatMemory: SharedArrayBuffer;
  readonly slotBytes: number;
}

export type WorkerRequest = LoadRequest | PhaseRequest;

if (parentPort === null) throw new Error('batch-worker.ts runs only as a worker thread');
const port = parentPort;
let work: SliceWork | null = null;
let slots: Uint8Array[] = [];

function answer(request: PhaseRequest, slice: SliceWork): void {
  switch (request.phase) {
    case 'statistics':
      port.postMessage(slice.statistics(request.frequency, request.window));
      return;
    case 'rolling':
      port.postMessage(slice.rolling(request.window));
      return;
    case 'format-rolling':
      port.postMessage(slice.formatRolling(request.from, request.to, slots[request.slot]!));
      return;
  }
}

port.postMessage('ready');
port.on('message', (request: WorkerRequest) => {
  if (request.phase === 'load') {
    work = sliceWork(request.data);
    slots = formatSlots(request.formatMemory, request.slotBytes);
    port.postMessage('loaded');
  } else if (work === null) {
    throw new Error(`phase ${request.phase} before the slice was loaded`);
  } else {
    answer(request, work);
  }
});
