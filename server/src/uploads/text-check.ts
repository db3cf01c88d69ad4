import { createReadStream } from 'node:fs';
import { pipeline } from 'node:stream/promises';
import { Writable } from 'node:stream';
import { locateByte } from '../../../cli/src/inputs/byte-location.js';
import { ByteFault, createUtf8Guard } from '../../../cli/src/inputs/utf8-guard.js';
import { ValidationError } from '../shared/errors.js';

/**
 * Refuses a stored upload that is not UTF-8 text (or holds a NUL byte), naming the file, the line,
 * the column (CSV field) and the reason, with the same guard the CLI's readers use.
 */
export async function requireUtf8Text(path: string, fileName: string): Promise<void> {
  try {
    await pipeline(createReadStream(path), createUtf8Guard(), new Writable({ write: (_chunk, _encoding, done) => done() }));
  } catch (err) {
    if (!(err instanceof ByteFault)) throw err;
    const { line, column } = await locateByte(path, err.offset, ',');
    const reason = err.kind === 'nul' ? 'a NUL byte: this is not a text file' : 'bytes that are not UTF-8 text';
    throw new ValidationError(`${fileName}:${line}:${column}: ${reason} (byte ${err.offset})`, { file: fileName, line, column, reason, offset: err.offset });
  }
}
