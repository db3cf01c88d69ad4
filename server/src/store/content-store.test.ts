import { createHash } from 'node:crypto';
import { mkdtemp, readdir, readFile, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { Readable } from 'node:stream';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { AppError } from '../shared/errors.js';
import { ContentStore } from './content-store.js';

describe('ContentStore', () => {
  let dir: string;
  let store: ContentStore;
  beforeEach(async () => {
    dir = await mkdtemp(path.join(tmpdir(), 'clino-store-'));
    store = new ContentStore(dir);
  });
  afterEach(async () => {
    await rm(dir, { recursive: true, force: true });
  });

  it('names an object by the sha256 of its bytes, as node:crypto computes it', async () => {
    // Source: sha256 of "abc" per FIPS 180-2 appendix B.1 (ba7816bf…15ad), [memory]; cross-checked with node:crypto.
    const stored = await store.put('abc');
    expect(stored.sha256).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    expect(stored.sha256).toBe(createHash('sha256').update('abc').digest('hex'));
    expect(await readFile(store.pathOf(stored.sha256), 'utf8')).toBe('abc');
    expect(store.pathOf(stored.sha256)).toContain(path.join('store', 'ba', '78'));
  });

  it('refuses bytes that do not match the expected checksum and keeps nothing', async () => {
    const wrong = createHash('sha256').update('other').digest('hex');
    await expect(store.putStream(Readable.from([Buffer.from('abc')]), { expectedSha256: wrong })).rejects.toMatchObject({ status: 400 });
    expect(await store.has(wrong)).toBe(false);
    expect(await readdir(path.join(dir, 'store', 'tmp'))).toEqual([]);
  });

  it('refuses a stream longer than the limit', async () => {
    const error = await store.putStream(Readable.from([Buffer.alloc(10), Buffer.alloc(10)]), { maxBytes: 15 }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(AppError);
    expect((error as AppError).code).toBe('PAYLOAD_TOO_LARGE');
  });

  it('stores the same content twice as one object', async () => {
    const a = await store.put(Buffer.from('same bytes'));
    const b = await store.put('same bytes');
    expect(b).toEqual(a);
    expect(await store.sizeOf(a.sha256)).toBe(10);
  });

  it('answers NOT_FOUND for content it does not hold, and refuses a name that is not a digest', async () => {
    await expect(store.open('0'.repeat(64))).rejects.toMatchObject({ code: 'NOT_FOUND' });
    expect(() => store.pathOf('../../etc/passwd')).toThrow(AppError);
  });
});
