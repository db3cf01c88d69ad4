// Streaming check that a file is UTF-8 text (and not binary: no NUL byte). Chunks pass through
// untouched; the check uses Node's native validator, and only on failure a byte-level scan finds the
// first bad byte so the reader can name its line and column.
import { isUtf8 } from 'node:buffer';
import { Transform } from 'node:stream';

/** Where the byte stream stopped being UTF-8 text. */
export class ByteFault extends Error {
  constructor(readonly kind: 'not-utf8' | 'nul', readonly offset: number) {
    super(`${kind} at byte ${offset}`);
    this.name = 'ByteFault';
  }
}

function sequenceLength(lead: number): number {
  if (lead < 0x80) return 1;
  if (lead >= 0xc2 && lead <= 0xdf) return 2;
  if (lead >= 0xe0 && lead <= 0xef) return 3;
  if (lead >= 0xf0 && lead <= 0xf4) return 4;
  return 0;
}

/** Second-byte ranges that exclude overlongs, surrogates and code points above U+10FFFF (Unicode 15, table 3-7). */
function secondByteOk(lead: number, second: number): boolean {
  if (lead === 0xe0) return second >= 0xa0 && second <= 0xbf;
  if (lead === 0xed) return second >= 0x80 && second <= 0x9f;
  if (lead === 0xf0) return second >= 0x90 && second <= 0xbf;
  if (lead === 0xf4) return second >= 0x80 && second <= 0x8f;
  return second >= 0x80 && second <= 0xbf;
}

/** Offset of the first byte that does not start a well-formed UTF-8 sequence; -1 when all are fine. */
export function firstInvalidUtf8(bytes: Uint8Array): number {
  let i = 0;
  while (i < bytes.length) {
    const lead = bytes[i]!;
    const length = sequenceLength(lead);
    if (length === 0 || i + length > bytes.length) return i;
    if (length > 1 && !secondByteOk(lead, bytes[i + 1]!)) return i;
    for (let k = 2; k < length; k++) {
      if ((bytes[i + k]! & 0xc0) !== 0x80) return i;
    }
    i += length;
  }
  return -1;
}

/** Length of `bytes` without a trailing multi-byte sequence that the next chunk completes. */
function completePrefixLength(bytes: Uint8Array): number {
  let i = bytes.length - 1;
  let continuation = 0;
  while (i >= 0 && continuation < 3 && (bytes[i]! & 0xc0) === 0x80) {
    i--;
    continuation++;
  }
  if (i < 0) return bytes.length;
  const length = sequenceLength(bytes[i]!);
  return length > 1 && bytes.length - i < length ? i : bytes.length;
}

/** A pass-through stream that fails with a ByteFault at the first non-UTF-8 or NUL byte. */
export function createUtf8Guard(): Transform {
  let carry: Buffer = Buffer.alloc(0);
  let consumed = 0;
  const check = (bytes: Buffer): ByteFault | null => {
    const nul = bytes.indexOf(0);
    const valid = isUtf8(bytes);
    const bad = valid ? -1 : firstInvalidUtf8(bytes);
    if (nul !== -1 && (bad === -1 || nul < bad)) return new ByteFault('nul', consumed + nul);
    return bad === -1 ? null : new ByteFault('not-utf8', consumed + bad);
  };
  return new Transform({
    transform(chunk: Buffer, _encoding, callback) {
      const bytes = carry.length === 0 ? chunk : Buffer.concat([carry, chunk]);
      const complete = completePrefixLength(bytes);
      const fault = check(bytes.subarray(0, complete));
      if (fault !== null) return callback(fault);
      consumed += complete;
      carry = Buffer.from(bytes.subarray(complete));
      callback(null, chunk);
    },
    flush(callback) {
      callback(carry.length === 0 ? null : new ByteFault('not-utf8', consumed));
    },
  });
}
