// pino logs on stderr: JSON lines when stderr is not a TTY (for log collectors), short readable
// lines on a TTY, coloured only when the terminal allows. stdout never carries a log line.
import { Writable } from 'node:stream';
import pino, { type Logger } from 'pino';
import type { LogLevel } from '../settings/settings.js';
import type { Terminal } from './terminal.js';

const LEVEL_NAMES: Readonly<Record<number, string>> = { 10: 'trace', 20: 'debug', 30: 'info', 40: 'warn', 50: 'error', 60: 'fatal' };
const LEVEL_COLOURS: Readonly<Record<number, string>> = { 10: '90', 20: '90', 30: '36', 40: '33', 50: '31', 60: '31' };
const HIDDEN = new Set(['level', 'time', 'pid', 'hostname', 'msg', 'name']);

function field(value: unknown): string {
  return typeof value === 'string' && /^[^\s"=]+$/.test(value) ? value : JSON.stringify(value);
}

/** One JSON log line as `level message key=value …`. */
export function readableLine(json: string, colour: boolean): string {
  const entry = JSON.parse(json) as Record<string, unknown>;
  const level = typeof entry['level'] === 'number' ? entry['level'] : 30;
  const name = (LEVEL_NAMES[level] ?? 'info').padEnd(5);
  const shown = colour ? `\u001b[${LEVEL_COLOURS[level] ?? '0'}m${name}\u001b[0m` : name;
  const extras = Object.entries(entry)
    .filter(([key]) => !HIDDEN.has(key))
    .map(([key, value]) => `${key}=${field(value)}`);
  return `${shown} ${String(entry['msg'] ?? '')}${extras.length > 0 ? ` ${extras.join(' ')}` : ''}\n`;
}

function readableStream(write: (text: string) => void, colour: boolean): Writable {
  return new Writable({
    write(chunk: Buffer, _encoding, callback) {
      for (const line of chunk.toString('utf8').split('\n')) if (line.trim() !== '') write(readableLine(line, colour));
      callback();
    },
  });
}

export function createCliLogger(level: LogLevel, terminal: Terminal): Logger {
  const options = { name: 'clino', level, base: { pid: process.pid } };
  if (terminal.stderrIsTty) return pino(options, readableStream((text) => process.stderr.write(text), terminal.colour));
  return pino(options, pino.destination({ fd: 2, sync: true }));
}
