// The specs a watcher runs: the current revisions held by the server (cached in the drop folder so
// runs go on while the server is unreachable), or local spec files given with --spec.
import { readFile, readdir } from 'node:fs/promises';
import path from 'node:path';
import type { Logger } from 'pino';
import { loadRunSpec } from '../../../server/src/contracts/run-spec.load.js';
import type { ResolvedRunSpec } from '../../../server/src/contracts/run-spec.schema.js';
import { readSpecFile } from '../batch/spec-file.js';
import { CliError } from '../errors/cli-error.js';
import { writeFileAtomic } from '../output/atomic-write.js';
import type { ServerClient } from '../transport/server-client.js';
import { parseAnswer, specDetailSchema, specListSchema } from '../transport/spec-answers.js';

export interface WatchedSpec {
  readonly name: string;
  readonly sha256: string;
  readonly spec: ResolvedRunSpec;
}

export interface SpecSource {
  current(): Promise<readonly WatchedSpec[]>;
}

export function localSpecSource(files: readonly string[]): SpecSource {
  return {
    async current() {
      const specs: WatchedSpec[] = [];
      for (const file of files) {
        const loaded = await readSpecFile(file);
        specs.push({ name: loaded.spec.name, sha256: loaded.sha256, spec: loaded.spec });
      }
      return specs;
    },
  };
}

async function fetchSpecs(client: ServerClient): Promise<{ name: string; text: string }[]> {
  const list = parseAnswer(specListSchema, (await client.request('GET', '/api/specs')).json(), 'GET /api/specs');
  const texts: { name: string; text: string }[] = [];
  for (const item of list.items) {
    const answer = await client.request('GET', `/api/specs/${encodeURIComponent(item.name)}`);
    texts.push({ name: item.name, text: parseAnswer(specDetailSchema, answer.json(), `GET /api/specs/${item.name}`).current.text });
  }
  return texts;
}

async function cachedSpecs(cache: string): Promise<{ name: string; text: string }[]> {
  const names = (await readdir(cache).catch(() => [] as string[])).filter((name) => name.endsWith('.yaml')).sort();
  return Promise.all(names.map(async (name) => ({ name: name.slice(0, -5), text: await readFile(path.join(cache, name), 'utf8') })));
}

export function serverSpecSource(client: ServerClient, cache: string, logger: Logger): SpecSource {
  return {
    async current() {
      let texts: { name: string; text: string }[];
      try {
        texts = await fetchSpecs(client);
        for (const { name, text } of texts) await writeFileAtomic(path.join(cache, `${name}.yaml`), text);
      } catch (error) {
        if (!(error instanceof CliError && error.code === 'SERVER_UNREACHABLE')) throw error;
        texts = await cachedSpecs(cache);
        logger.warn({ cached: texts.length }, 'server unreachable: using the specs fetched last time');
      }
      const specs: WatchedSpec[] = [];
      for (const { name, text } of texts) {
        const loaded = loadRunSpec(text, `spec ${name} (server)`);
        specs.push({ name: loaded.spec.name, sha256: loaded.sha256, spec: loaded.spec });
      }
      return specs;
    },
  };
}
