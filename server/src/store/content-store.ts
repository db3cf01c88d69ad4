import { createHash, randomBytes } from 'node:crypto';
import { createReadStream, type ReadStream } from 'node:fs';
import { mkdir, open, rename, rm, stat } from 'node:fs/promises';
import path from 'node:path';
import type { Readable } from 'node:stream';
import { AppError } from '../shared/errors.js';

/** A lowercase sha256 hex digest: the only thing that names an object in the store. */
export const SHA256_PATTERN = /^[0-9a-f]{64}$/;

export interface StoredObject {
  sha256: string;
  size: number;
}

/**
 * The content-addressed store under `<dataDir>/store`: every input file, result CSV, uploaded file
 * and mail attachment, named by the sha256 of its bytes (`ab/cd/<sha256>`). Objects are written to a
 * temporary file in the same file system and renamed into place, so a reader never sees half an
 * object and two writers of the same content end with the same file.
 */
export class ContentStore {
  readonly root: string;
  private readonly tmp: string;

  constructor(dataDir: string) {
    this.root = path.join(dataDir, 'store');
    this.tmp = path.join(this.root, 'tmp');
  }

  pathOf(sha256: string): string {
    if (!SHA256_PATTERN.test(sha256)) throw new AppError(400, 'VALIDATION_FAILED', 'Not a lowercase sha256 hex digest');
    return path.join(this.root, sha256.slice(0, 2), sha256.slice(2, 4), sha256);
  }

  async has(sha256: string): Promise<boolean> {
    return (await this.sizeOf(sha256)) !== undefined;
  }

  async sizeOf(sha256: string): Promise<number | undefined> {
    try {
      return (await stat(this.pathOf(sha256))).size;
    } catch {
      return undefined;
    }
  }

  /** Stores bytes; answers their sha256 and size. */
  async put(bytes: Uint8Array | string): Promise<StoredObject> {
    async function* once(): AsyncGenerator<Uint8Array> {
      yield typeof bytes === 'string' ? Buffer.from(bytes, 'utf8') : bytes;
    }
    return this.putStream(once());
  }

  /**
   * Streams bytes into the store. With `expectedSha256`, refuses (and keeps nothing) when the bytes
   * hash to anything else; with `maxBytes`, refuses a larger stream.
   */
  async putStream(source: Readable | AsyncIterable<Uint8Array>, options: { expectedSha256?: string; maxBytes?: number } = {}): Promise<StoredObject> {
    await mkdir(this.tmp, { recursive: true });
    const tmpPath = path.join(this.tmp, `${Date.now()}-${randomBytes(8).toString('hex')}`);
    const handle = await open(tmpPath, 'wx', 0o640);
    const hash = createHash('sha256');
    let size = 0;
    try {
      for await (const chunk of source as AsyncIterable<Uint8Array>) {
        size += chunk.byteLength;
        if (options.maxBytes !== undefined && size > options.maxBytes) {
          throw new AppError(413, 'PAYLOAD_TOO_LARGE', `The content exceeds ${options.maxBytes} bytes`);
        }
        hash.update(chunk);
        await handle.write(chunk);
      }
      await handle.sync();
    } catch (err) {
      await handle.close();
      await rm(tmpPath, { force: true });
      throw err;
    }
    await handle.close();
    const sha256 = hash.digest('hex');
    if (options.expectedSha256 !== undefined && sha256 !== options.expectedSha256) {
      await rm(tmpPath, { force: true });
      throw new AppError(400, 'CHECKSUM_MISMATCH', 'The content does not match its sha256', { expected: options.expectedSha256, actual: sha256 });
    }
    const target = this.pathOf(sha256);
    await mkdir(path.dirname(target), { recursive: true });
    await rename(tmpPath, target);
    return { sha256, size };
  }

  /** A stream of a stored object, or NOT_FOUND. */
  async open(sha256: string): Promise<{ stream: ReadStream; size: number }> {
    const size = await this.sizeOf(sha256);
    if (size === undefined) throw new AppError(404, 'NOT_FOUND', `No stored content with sha256 ${sha256}`);
    return { stream: createReadStream(this.pathOf(sha256)), size };
  }

  async read(sha256: string): Promise<Buffer> {
    const { stream } = await this.open(sha256);
    const chunks: Buffer[] = [];
    for await (const chunk of stream) chunks.push(chunk as Buffer);
    return Buffer.concat(chunks);
  }
}
