// The drop folder's places. Vendors (or ops) drop files into incoming/; processed inputs move to
// archive/<YYYY-MM-DD>/ with a checksum file; rejected files to rejected/ beside <name>.error.txt;
// posts that could not be delivered wait in outbox/. The ledger remembers which runs were done.
import { mkdir } from 'node:fs/promises';
import path from 'node:path';

export interface DropLayout {
  readonly root: string;
  readonly incoming: string;
  readonly archive: string;
  readonly rejected: string;
  readonly outbox: string;
  /** Delivered outbox items, kept as a record (never deleted). */
  readonly outboxDelivered: string;
  /** Items the server refused (not retried), each beside its .error.txt. */
  readonly outboxRefused: string;
  /** One JSON line per run done, file rejected or duplicate skipped. */
  readonly ledgerFile: string;
  /** The last spec revisions fetched from the server, for runs while it is unreachable. */
  readonly specCache: string;
}

export function dropLayout(root: string): DropLayout {
  const at = (...parts: string[]): string => path.join(root, ...parts);
  return {
    root,
    incoming: at('incoming'),
    archive: at('archive'),
    rejected: at('rejected'),
    outbox: at('outbox'),
    outboxDelivered: at('outbox', 'delivered'),
    outboxRefused: at('outbox', 'refused'),
    ledgerFile: at('ledger.jsonl'),
    specCache: at('.spec-cache'),
  };
}

export async function ensureDropLayout(layout: DropLayout): Promise<void> {
  for (const folder of [layout.incoming, layout.archive, layout.rejected, layout.outbox, layout.outboxDelivered, layout.outboxRefused, layout.specCache]) {
    await mkdir(folder, { recursive: true });
  }
}

/** Names that are never inputs: hidden files and the usual partial-upload suffixes. */
export function isIgnoredName(name: string): boolean {
  return name.startsWith('.') || /\.(?:part|partial|tmp|crdownload|filepart)$/i.test(name) || /\.error\.txt$|\.sha256$/.test(name);
}

/** Today's calendar date in UTC, `YYYY-MM-DD`: the archive folder of a file processed now. */
export function utcDay(now: Date = new Date()): string {
  return now.toISOString().slice(0, 10);
}
