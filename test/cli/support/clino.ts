// Runs the real `clino` (node cli/bin/clino.js) as a user would, with its own config folder so no
// test reads or writes the user's settings.
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { execa, type Options, type ResultPromise } from 'execa';

export const ROOT = path.join(import.meta.dirname, '../../..');
export const CLINO = path.join(ROOT, 'cli/bin/clino.js');

export function isolatedEnv(extra: Record<string, string> = {}): Record<string, string> {
  return { CLINO_CONFIG_DIR: mkdtempSync(path.join(tmpdir(), 'clino-config-')), NO_COLOR: '1', CLINO_LOG_LEVEL: 'info', ...extra };
}

export interface ClinoResult {
  readonly exitCode: number;
  readonly stdout: string;
  readonly stderr: string;
}

export async function clino(args: readonly string[], options: { env?: Record<string, string>; input?: string; cwd?: string } = {}): Promise<ClinoResult> {
  const result = await execa('node', [CLINO, ...args], {
    env: options.env ?? isolatedEnv(),
    input: options.input ?? '',
    cwd: options.cwd ?? ROOT,
    reject: false,
    stripFinalNewline: false,
  });
  return { exitCode: result.exitCode ?? -1, stdout: String(result.stdout), stderr: String(result.stderr) };
}

/** A long-running clino (watch, work) whose output is collected as it comes. */
export function startClino(args: readonly string[], env: Record<string, string>): { process: ResultPromise<Options>; stderr: () => string } {
  let stderr = '';
  const child = execa('node', [CLINO, ...args], { env, cwd: ROOT, reject: false, stdin: 'ignore' });
  child.stderr?.on('data', (chunk: Buffer) => (stderr += chunk.toString('utf8')));
  return { process: child, stderr: () => stderr };
}

/** Polls until `check` answers true (no timing is asserted: the limit only ends a stuck test). */
export async function eventually(check: () => Promise<boolean> | boolean, what: string, limitMs = 60_000): Promise<void> {
  const until = Date.now() + limitMs;
  while (Date.now() < until) {
    if (await check()) return;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error(`gave up waiting for: ${what}`);
}
