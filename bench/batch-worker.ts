// Worker thread of the benchmark: holds one slice of the securities (its price arrays transferred,
// not copied) and answers the main thread's phase requests one at a time.
import { parentPort, workerData } from 'node:worker_threads';
import { sliceWork } from './batch-slice.js';
import type { SliceData, WindowSetting } from './batch-slice.js';
import type { Frequency } from '../cli/src/engine/types.js';

export type PhaseRequest =
  | { readonly phase: 'statistics'; readonly frequency: Frequency; readonly window: WindowSetting }
  | { readonly phase: 'rolling'; readonly window: WindowSetting }
  | { readonly phase: 'format-rolling'; readonly from: number; readonly to: number };

if (parentPort === null) throw new Error('batch-worker.ts runs only as a worker thread');
const port = parentPort;
const work = sliceWork(workerData as SliceData);

port.postMessage('ready');
port.on('message', (request: PhaseRequest) => {
  switch (request.phase) {
    case 'statistics':
      port.postMessage(work.statistics(request.frequency, request.window));
      return;
    case 'rolling':
      port.postMessage(work.rolling(request.window));
      return;
    case 'format-rolling': {
      const rows = work.formatRolling(request.from, request.to);
      port.postMessage(rows, [rows.bytes.buffer as ArrayBuffer, rows.offsets.buffer as ArrayBuffer]);
      return;
    }
  }
});
