// Worker thread of the benchmark: loads one slice of the securities (its price arrays transferred,
// not copied) and answers the main thread's phase requests one at a time.
import { parentPort } from 'node:worker_threads';
import { sliceWork } from './batch-slice.js';
import type { SliceData, SliceWork, WindowSetting } from './batch-slice.js';
import type { Frequency } from '../cli/src/engine/types.js';

export type PhaseRequest =
  | { readonly phase: 'statistics'; readonly frequency: Frequency; readonly window: WindowSetting }
  | { readonly phase: 'rolling'; readonly window: WindowSetting }
  | { readonly phase: 'format-rolling'; readonly from: number; readonly to: number };

export type WorkerRequest = { readonly phase: 'load'; readonly data: SliceData } | PhaseRequest;

if (parentPort === null) throw new Error('batch-worker.ts runs only as a worker thread');
const port = parentPort;
let work: SliceWork | null = null;

function answer(request: PhaseRequest, slice: SliceWork): void {
  switch (request.phase) {
    case 'statistics':
      port.postMessage(slice.statistics(request.frequency, request.window));
      return;
    case 'rolling':
      port.postMessage(slice.rolling(request.window));
      return;
    case 'format-rolling': {
      const rows = slice.formatRolling(request.from, request.to);
      port.postMessage(rows, [rows.bytes.buffer as ArrayBuffer, rows.offsets.buffer as ArrayBuffer]);
      return;
    }
  }
}

port.postMessage('ready');
port.on('message', (request: WorkerRequest) => {
  if (request.phase === 'load') {
    work = sliceWork(request.data);
    port.postMessage('loaded');
  } else if (work === null) {
    throw new Error(`phase ${request.phase} before the slice was loaded`);
  } else {
    answer(request, work);
  }
});
