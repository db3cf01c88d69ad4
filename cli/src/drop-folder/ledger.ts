// The drop folder's ledger: one JSON line per outcome (a run done, a file rejected, a duplicate
// skipped), appended. It is how the watcher knows, across restarts, that a spec already ran on
// the same content (by sha256): the run key is the spec's sha256 with the inputs' sha256s.
import { createHash } from 'node:crypto';
import { appendFile, readFile } from 'node:fs/promises';

export type LedgerEntry =
  | { readonly kind: 'run'; readonly runKey: string; readonly spec: string; readonly specSha256: string; readonly asOf: string; readonly deliveryKey: string; readonly inputs: readonly { name: string; sha256: string }[]; readonly at: string }
  | { readonly kind: 'rejected'; readonly name: string; readonly sha256: string; readonly code: string; readonly spec: string | null; readonly at: string }
  | { readonly kind: 'duplicate'; readonly name: string; readonly sha256: string; readonly at: string };

export function runKeyOf(specSha256: string, inputSha256s: readonly string[]): string {
  return createHash('sha256').update([specSha256, ...[...inputSha256s].sort()].join('\n')).digest('hex');
}

export interface Ledger {
  hasRun(runKey: string): boolean;
  append(entry: LedgerEntry): Promise<void>;
}

function parseLine(line: string): LedgerEntry | null {
  try {
    const value = JSON.parse(line) as { kind?: unknown };
    return typeof value === 'object' && value !== null && typeof value.kind === 'string' ? (value as LedgerEntry) : null;
  } catch {
    return null; // a line cut short by a crash: ignored
  }
}

export async function openLedger(file: string): Promise<Ledger> {
  const runs = new Set<string>();
  const text = await readFile(file, 'utf8').catch((error: NodeJS.ErrnoException) => {
    if (error.code === 'ENOENT') return '';
    throw error;
  });
  for (const line of text.split('\n')) {
    const entry = line.trim() === '' ? null : parseLine(line);
    if (entry?.kind === 'run') runs.add(entry.runKey);
  }
  // A line torn by a crash is closed off, so the next entry starts a line of its own.
  let prefix = text !== '' && !text.endsWith('\n') ? '\n' : '';
  return {
    hasRun: (runKey) => runs.has(runKey),
    async append(entry) {
      await appendFile(file, `${prefix}${JSON.stringify(entry)}\n`, { mode: 0o644 });
      prefix = '';
      if (entry.kind === 'run') runs.add(entry.runKey);
    },
  };
}
