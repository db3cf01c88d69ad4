// The benchmark's outputs: result rows (the engine's results with the Vasicek beta across the run and
// no pricing or capital structure), and the rolling-beta CSV, dates × securities, assembled from the
// slices' pre-formatted rows.
import { open } from 'node:fs/promises';
import type { FileHandle } from 'node:fs/promises';
import { applyVasicek } from '../cli/src/engine/adjustments.js';
import type { SecurityResult } from '../cli/src/engine/types.js';
import { resultRowOf } from '../server/src/contracts/result-columns.js';
import type { ResultRow, RowPricing } from '../server/src/contracts/result-columns.js';
import { BLOCKS_AHEAD, FORMAT_SLOTS, ROWS_PER_BLOCK } from './batch-slice.js';
import type { FormattedBlock } from './slice-pool.js';

const NO_PRICING: RowPricing = {
  group: null, expectedReturn: NaN, expectedReturnLow: NaN, expectedReturnHigh: NaN, debtToEquity: NaN, taxRate: NaN,
  unleveredBeta: NaN, peerGroup: null, peerUnleveredBeta: NaN, releveredBeta: NaN, costOfDebtAfterTax: NaN, wacc: NaN,
};

/** Vasicek across the whole run (the prior needs every slice), Blume as the adjusted beta. */
export function resultRowsOf(results: readonly SecurityResult[]): ResultRow[] {
  return applyVasicek(results, { adjustment: 'blume', vasicekPrior: 'cross-section' }).map((result) => resultRowOf(result, NO_PRICING));
}

/** The file is written in chunks of this size, two of them reused in turn (one filling, one being written). */
const CHUNK_BYTES = 4 << 20;

export type RowBlockSource = (from: number, to: number, slot: number) => Promise<readonly FormattedBlock[]>;

/** Appends byte pieces to a file through two reused chunks: one fills while the other is written. */
class ChunkedFile {
  private readonly chunks = [Buffer.allocUnsafe(CHUNK_BYTES), Buffer.allocUnsafe(CHUNK_BYTES)];
  private current = 0;
  private used = 0;
  private writing: Promise<unknown> = Promise.resolve();

  constructor(private readonly handle: FileHandle) {}

  /** Room for `bytes` more in the current chunk, after handing the full one to the file if need be. */
  async reserve(bytes: number): Promise<void> {
    if (this.used + bytes > CHUNK_BYTES) await this.flush();
    if (bytes > CHUNK_BYTES) throw new RangeError(`a row of ${bytes} bytes is longer than a chunk`);
  }

  put(bytes: Uint8Array): void {
    this.chunks[this.current]!.set(bytes, this.used);
    this.used += bytes.length;
  }

  putByte(byte: number): void {
    this.chunks[this.current]![this.used++] = byte;
  }

  async flush(): Promise<void> {
    await this.writing; // the other chunk is free again
    const chunk = this.chunks[this.current]!;
    const used = this.used;
    this.writing = used === 0 ? Promise.resolve() : this.handle.write(chunk, 0, used);
    this.current ^= 1;
    this.used = 0;
  }

  async close(): Promise<void> {
    await this.flush();
    await this.writing;
    await this.handle.close();
  }
}

const COMMA = 0x2c;
const NEWLINE = 0x0a;

/**
 * Header `date,<ids>`, then one line per rolling end: its label and every slice's cells in order.
 * The slices format the next blocks of rows (into format slots) while this one is written.
 */
export async function writeRollingCsv(path: string, ids: readonly string[], labels: readonly string[], blockOf: RowBlockSource): Promise<void> {
  const file = new ChunkedFile(await open(path, 'w'));
  try {
    const header = Buffer.from(`date,${ids.join(',')}\n`);
    await file.reserve(header.length);
    file.put(header);
    const pending: Promise<readonly FormattedBlock[]>[] = [];
    let requested = 0;
    const requestAhead = (): void => {
      while (pending.length < BLOCKS_AHEAD && requested < labels.length) {
        const slot = (requested / ROWS_PER_BLOCK) % FORMAT_SLOTS;
        pending.push(blockOf(requested, Math.min(requested + ROWS_PER_BLOCK, labels.length), slot));
        requested += ROWS_PER_BLOCK;
      }
    };
    requestAhead();
    for (let from = 0; pending.length > 0; from += ROWS_PER_BLOCK) {
      const parts = (await pending.shift()!).filter((part) => part.columns > 0);
      requestAhead(); // into another slot: these parts stay valid until the loop comes back to theirs
      const to = Math.min(from + ROWS_PER_BLOCK, labels.length);
      for (let r = 0; r < to - from; r++) {
        const label = Buffer.from(labels[from + r]!);
        let length = label.length + 1;
        for (const part of parts) length += 1 + part.offsets[r + 1]! - part.offsets[r]!;
        await file.reserve(length);
        file.put(label);
        for (const part of parts) {
          file.putByte(COMMA);
          file.put(part.bytes.subarray(part.offsets[r]!, part.offsets[r + 1]!));
        }
        file.putByte(NEWLINE);
      }
    }
  } finally {
    await file.close();
  }
}
