// The benchmark's outputs: result rows (the engine's results with the Vasicek beta across the run and
// no pricing or capital structure), and the rolling-beta CSV, dates × securities, assembled from the
// slices' pre-formatted rows.
import { createWriteStream } from 'node:fs';
import { once } from 'node:events';
import { applyVasicek } from '../cli/src/engine/adjustments.js';
import type { SecurityResult } from '../cli/src/engine/types.js';
import type { ResultRow } from '../server/src/contracts/result-columns.js';
import type { FormattedRows } from './batch-slice.js';

const NO_PRICING = {
  group: null, expectedReturn: NaN, expectedReturnLow: NaN, expectedReturnHigh: NaN, debtToEquity: NaN, taxRate: NaN,
  unleveredBeta: NaN, peerGroup: null, peerUnleveredBeta: NaN, releveredBeta: NaN, costOfDebtAfterTax: NaN, wacc: NaN,
} as const;

/** Vasicek across the whole run (the prior needs every slice), Blume as the adjusted beta. */
export function resultRowsOf(results: readonly SecurityResult[]): ResultRow[] {
  return applyVasicek(results, { adjustment: 'blume', vasicekPrior: 'cross-section' }).map((result) => ({ ...result, ...NO_PRICING }));
}

const CHUNK_BYTES = 4 << 20;
/** Rows formatted per request: small enough to keep memory flat, large enough to keep the slices busy. */
const BLOCK_ROWS = 64;
/** Blocks requested before the first is written: each slice always has rows to format. */
const BLOCKS_AHEAD = 4;

export type RowBlockSource = (from: number, to: number) => Promise<readonly FormattedRows[]>;

/**
 * Header `date,<ids>`, then one line per rolling end: its label and every slice's cells in order.
 * The slices format the next blocks of rows while this one is written.
 */
export async function writeRollingCsv(path: string, ids: readonly string[], labels: readonly string[], blockOf: RowBlockSource): Promise<void> {
  const out = createWriteStream(path);
  let chunk = Buffer.allocUnsafe(CHUNK_BYTES);
  let used = 0;
  const flush = async (): Promise<void> => {
    if (used === 0) return;
    if (!out.write(chunk.subarray(0, used))) await once(out, 'drain');
    chunk = Buffer.allocUnsafe(CHUNK_BYTES);
    used = 0;
  };
  const put = async (bytes: Uint8Array): Promise<void> => {
    if (used + bytes.length > CHUNK_BYTES) await flush();
    if (bytes.length > CHUNK_BYTES) {
      if (!out.write(bytes)) await once(out, 'drain');
      return;
    }
    chunk.set(bytes, used);
    used += bytes.length;
  };
  await put(Buffer.from(`date,${ids.join(',')}\n`));
  const separator = Buffer.from(','), newline = Buffer.from('\n');
  const pending: Promise<readonly FormattedRows[]>[] = [];
  let requested = 0;
  const requestAhead = (): void => {
    while (pending.length < BLOCKS_AHEAD && requested < labels.length) {
      pending.push(blockOf(requested, Math.min(requested + BLOCK_ROWS, labels.length)));
      requested += BLOCK_ROWS;
    }
  };
  requestAhead();
  for (let from = 0; pending.length > 0; from += BLOCK_ROWS) {
    const parts = await pending.shift()!;
    requestAhead();
    const to = Math.min(from + BLOCK_ROWS, labels.length);
    for (let r = 0; r < to - from; r++) {
      await put(Buffer.from(labels[from + r]!));
      for (const part of parts) {
        if (part.columns === 0) continue;
        await put(separator);
        await put(part.bytes.subarray(part.offsets[r]!, part.offsets[r + 1]!));
      }
      await put(newline);
    }
  }
  await flush();
  out.end();
  await once(out, 'finish');
}
