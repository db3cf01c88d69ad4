// Watches incoming/ with chokidar. A file counts only once its size has stopped changing for the
// settle time (awaitWriteFinish), so a half-written file is never read; files present at start are
// reported too. Each change queues one pass of the processor; passes never overlap.
import path from 'node:path';
import { watch, type FSWatcher } from 'chokidar';
import type { Logger } from 'pino';
import type { DropProcessor } from './drop-processor.js';
import { isIgnoredName, type DropLayout } from './layout.js';

export interface WatcherOptions {
  /** How long a file's size must stay the same before it counts as written (ms). */
  readonly settleMs: number;
  /** A pass also runs this often, so waiting runs see new specs (ms). */
  readonly rescanMs: number;
}

export interface DropWatcher {
  /** Resolves once the files present at start have been seen. */
  readonly ready: Promise<void>;
  /** Resolves when the queued passes are done. */
  idle(): Promise<void>;
  close(): Promise<void>;
}

export function startDropWatcher(layout: DropLayout, processor: DropProcessor, logger: Logger, options: WatcherOptions): DropWatcher {
  const settled = new Set<string>();
  let pass: Promise<void> = Promise.resolve();
  let queued = false;
  let closed = false;

  function queuePass(): void {
    if (queued || closed) return;
    queued = true;
    pass = pass.then(async () => {
      queued = false;
      try {
        await processor.process([...settled]);
      } catch (error) {
        logger.error({ err: error }, 'drop folder pass failed; the files stay in incoming/');
      }
    });
  }

  const watcher: FSWatcher = watch(layout.incoming, {
    ignoreInitial: false,
    depth: 0,
    awaitWriteFinish: { stabilityThreshold: options.settleMs, pollInterval: Math.max(20, Math.min(250, Math.floor(options.settleMs / 4))) },
    ignored: (file: string) => file !== layout.incoming && isIgnoredName(path.basename(file)),
  });
  const settle = (file: string): void => {
    if (path.dirname(file) !== layout.incoming) return;
    settled.add(file);
    logger.debug({ file: path.basename(file) }, 'file settled in incoming');
    queuePass();
  };
  watcher.on('add', settle).on('change', settle).on('unlink', (file: string) => settled.delete(file));
  watcher.on('error', (error: unknown) => logger.error({ err: error }, 'watcher error'));
  const ready = new Promise<void>((resolve) => watcher.once('ready', () => resolve()));
  const rescan = setInterval(queuePass, options.rescanMs);

  return {
    ready,
    idle: () => pass,
    async close() {
      closed = true;
      clearInterval(rescan);
      processor.stop();
      await watcher.close();
      await pass;
    },
  };
}
