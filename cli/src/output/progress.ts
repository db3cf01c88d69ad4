// Progress bars for long steps, on stderr and only when stderr is a TTY; on a pipe nothing is printed
// per step (the log says when a step starts and ends).
import cliProgress from 'cli-progress';
import type { Terminal } from './terminal.js';

export interface Progress {
  start(label: string, total: number): void;
  update(done: number): void;
  stop(): void;
}

export const silentProgress: Progress = { start() {}, update() {}, stop() {} };

export function createProgress(terminal: Terminal): Progress {
  if (!terminal.stderrIsTty) return silentProgress;
  let bar: cliProgress.SingleBar | null = null;
  return {
    start(label, total) {
      bar?.stop();
      bar = new cliProgress.SingleBar(
        { format: `${label} [{bar}] {value}/{total}`, stream: process.stderr, noTTYOutput: false, hideCursor: true },
        terminal.colour ? cliProgress.Presets.shades_classic : cliProgress.Presets.legacy,
      );
      bar.start(total, 0);
    },
    update(done) {
      bar?.update(done);
    },
    stop() {
      bar?.stop();
      bar = null;
    },
  };
}
