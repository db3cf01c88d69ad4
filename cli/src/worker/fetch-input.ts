// Downloads an input from the server's content-addressed store and writes it whole (write-then-
// rename) under its dropped name, after checking that its bytes hash to the checksum asked for.
import { createHash } from 'node:crypto';
import path from 'node:path';
import { CliError } from '../errors/cli-error.js';
import { writeFileAtomic } from '../output/atomic-write.js';
import type { ServerClient } from '../transport/server-client.js';

/** A dropped name as a plain file name: never a path (security codes and names are labels). */
export function safeFileName(name: string): string {
  const base = path.basename(name.replaceAll('\\', '/'));
  return base === '' || base === '.' || base === '..' ? 'input.csv' : base;
}

export async function fetchInput(client: ServerClient, sha256: string, target: string): Promise<string> {
  const answer = await client.request('GET', `/api/inputs/${sha256}`);
  const actual = createHash('sha256').update(answer.body).digest('hex');
  if (actual !== sha256) throw new CliError('INPUT_UNREADABLE', `the server sent input ${sha256} with other bytes (sha256 ${actual})`);
  await writeFileAtomic(target, answer.body);
  return target;
}
