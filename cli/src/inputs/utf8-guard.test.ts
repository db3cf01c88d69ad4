// UTF-8 well-formedness per RFC 3629 / Unicode table 3-7 (no overlongs, no surrogates, nothing above
// U+10FFFF); Node's buffer.isUtf8 is the reference the byte-level scan must agree with.
import { isUtf8 } from 'node:buffer';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { Writable } from 'node:stream';
import { describe, expect, it } from 'vitest';
import { ByteFault, createUtf8Guard, firstInvalidUtf8 } from './utf8-guard.js';

async function guard(chunks: readonly Buffer[]): Promise<Buffer> {
  const out: Buffer[] = [];
  const sink = new Writable({ write(chunk: Buffer, _encoding, callback) { out.push(chunk); callback(); } });
  await pipeline(Readable.from(chunks), createUtf8Guard(), sink);
  return Buffer.concat(out);
}

describe('UTF-8 guard', () => {
  it('passes text split inside multi-byte characters unchanged', async () => {
    const text = Buffer.from('date,QZé,Ω€𝄞\n2026-01-30,1,2\n');
    const chunks = Array.from({ length: text.length }, (_, i) => text.subarray(i, i + 1));
    expect((await guard(chunks)).equals(text)).toBe(true);
  });

  it('reports the offset of the first invalid byte across chunks', async () => {
    const first = Buffer.from('ab\xc3'.split('').map((c) => c.charCodeAt(0)));
    const second = Buffer.from([0x41, 0x42]);
    await expect(guard([first, second])).rejects.toMatchObject({ kind: 'not-utf8', offset: 2 });
  });

  it('reports a sequence cut off at the end of the file', async () => {
    await expect(guard([Buffer.from([0x61, 0xe2, 0x82])])).rejects.toBeInstanceOf(ByteFault);
  });

  it('reports a NUL byte as binary content', async () => {
    await expect(guard([Buffer.from([0x61, 0x00, 0x62])])).rejects.toMatchObject({ kind: 'nul', offset: 1 });
  });

  it('agrees with buffer.isUtf8 on overlongs, surrogates and out-of-range sequences', () => {
    const samples = [
      [0xc0, 0xaf], [0xe0, 0x80, 0xaf], [0xed, 0xa0, 0x80], [0xf4, 0x90, 0x80, 0x80], [0xf5, 0x80, 0x80, 0x80],
      [0xe2, 0x82, 0xac], [0xf0, 0x9d, 0x84, 0x9e], [0x80], [0xc3, 0x28],
    ];
    for (const bytes of samples) {
      const buffer = Uint8Array.from(bytes);
      expect(firstInvalidUtf8(buffer) === -1).toBe(isUtf8(buffer));
    }
  });
});
