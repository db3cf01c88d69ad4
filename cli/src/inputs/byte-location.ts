// Line and field of a byte offset, found by reading the file again up to it. Used only to report a
// bad byte, so it favours simplicity over speed.
import { createReadStream } from 'node:fs';

export interface ByteLocation {
  readonly line: number;
  readonly column: number;
}

const NEWLINE = 0x0a;
const QUOTE = 0x22;

/** 1-based line, and 1-based field on that line (delimiters inside quotes do not count). */
export async function locateByte(file: string, offset: number, delimiter: string): Promise<ByteLocation> {
  const delimiterByte = Buffer.from(delimiter)[0];
  let line = 1;
  let column = 1;
  let quoted = false;
  const stream = offset > 0 ? createReadStream(file, { start: 0, end: offset - 1 }) : null;
  for await (const chunk of stream ?? []) {
    for (const byte of chunk as Buffer) {
      if (byte === QUOTE) quoted = !quoted;
      else if (byte === NEWLINE && !quoted) {
        line++;
        column = 1;
      } else if (byte === NEWLINE) line++;
      else if (byte === delimiterByte && !quoted) column++;
    }
  }
  return { line, column };
}
