// sha256 and size of each input file, streamed, for the run's fingerprint and the server's
// content-addressed store.
import { createHash } from 'node:crypto';
import { createReadStream } from 'node:fs';
import path from 'node:path';
import type { RunInputPaths } from './input-roles.js';

export interface InputChecksum {
  /** The file's name as dropped (never a path). */
  readonly name: string;
  readonly sha256: string;
  readonly size: number;
  /** Where it was read from (local only; never sent). */
  readonly path: string;
}

export async function fileChecksum(file: string): Promise<InputChecksum> {
  const hash = createHash('sha256');
  let size = 0;
  for await (const chunk of createReadStream(file)) {
    hash.update(chunk as Buffer);
    size += (chunk as Buffer).length;
  }
  return { name: path.basename(file), sha256: hash.digest('hex'), size, path: file };
}

export async function inputChecksums(paths: RunInputPaths): Promise<InputChecksum[]> {
  const files = [paths.prices, paths.market, paths.riskFree].filter((file): file is string => file !== undefined);
  const checksums: InputChecksum[] = [];
  for (const file of files) checksums.push(await fileChecksum(file));
  return checksums;
}
