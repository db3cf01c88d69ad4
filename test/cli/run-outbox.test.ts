// `clino run --post` with the server out of reach: without an outbox it fails (exit 5) and says how to
// spool; with --outbox / CLINO_OUTBOX it leaves the delivery in a drop folder's outbox/, and the
// `clino watch` serving that folder delivers it (at its start, and on its rescan while it runs) to a
// stand-in ingest server switched off and on. Waits poll for an outcome; no duration is asserted.
import { createServer } from 'node:net';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { clino, eventually, isolatedEnv, startClino } from './support/clino.js';
import { startFakeIngestServer, type FakeIngestServer } from './support/fake-ingest-server.js';
import { DROP_SPEC, priceFile, riskFreeFile } from './support/small-drop-files.js';

const root = mkdtempSync(path.join(tmpdir(), 'clino-run-outbox-'));
const drop = path.join(root, 'drop');
const outbox = path.join(drop, 'outbox');
const specFile = path.join(root, 'drop-test.yaml');
const at = (...parts: string[]) => path.join(root, ...parts);
let server: FakeIngestServer;
let env: Record<string, string>;
let watcher: ReturnType<typeof startClino> | undefined;

const pending = (): string[] => (existsSync(outbox) ? readdirSync(outbox).filter((name) => name.endsWith('.json')) : []);
const delivered = (): string[] => (existsSync(path.join(outbox, 'delivered')) ? readdirSync(path.join(outbox, 'delivered')) : []);

/** A loopback URL nothing listens on. */
async function deadUrl(): Promise<string> {
  const probe = createServer();
  await new Promise<void>((resolve) => probe.listen(0, '127.0.0.1', resolve));
  const { port } = probe.address() as { port: number };
  await new Promise<void>((resolve) => probe.close(() => resolve()));
  return `http://127.0.0.1:${port}`;
}

beforeAll(async () => {
  server = await startFakeIngestServer();
  await server.stop();
  env = isolatedEnv({ CLINO_SERVER_URL: server.url, CLINO_TOKEN: server.token });
  writeFileSync(specFile, DROP_SPEC);
  mkdirSync(outbox, { recursive: true });
  writeFileSync(at('px-a.csv'), priceFile(18));
  writeFileSync(at('px-b.csv'), priceFile(18, 1));
  writeFileSync(at('rf-a.csv'), riskFreeFile(18));
});

afterAll(async () => {
  if (watcher) {
    watcher.process.kill('SIGTERM');
    await watcher.process;
  }
  await server.stop().catch(() => undefined);
});

describe('clino run --post with the server out of reach', { timeout: 180_000 }, () => {
  it('fails with exit 5 when no outbox is named, with a hint naming --outbox and CLINO_OUTBOX, and still writes --out', async () => {
    const result = await clino(['run', specFile, at('px-a.csv'), at('rf-a.csv'), '--post', '--out', at('local.csv')], { env });
    expect(result.exitCode).toBe(5);
    expect(result.stderr).toContain('(SERVER_UNREACHABLE)');
    expect(result.stderr).toMatch(/hint: to keep the run for later, add --outbox <folder> \(or set CLINO_OUTBOX\)/);
    expect(existsSync(at('local.csv'))).toBe(true);
    expect(pending()).toEqual([]);
  });

  it('refuses an outbox folder that does not exist with exit 2, before computing', async () => {
    const result = await clino(['run', specFile, at('px-a.csv'), at('rf-a.csv'), '--post', '--outbox', at('no-such-folder')], { env });
    expect(result.exitCode).toBe(2);
    expect(result.stderr).toContain(`the outbox folder ${at('no-such-folder')} does not exist (USAGE)`);
    expect(result.stderr).not.toContain('run computed');
  });

  it('leaves the delivery in --outbox, exits 0 and names the item in the --json answer', async () => {
    const result = await clino(['run', specFile, at('px-a.csv'), at('rf-a.csv'), '--post', '--outbox', outbox, '--json'], { env });
    expect(result.exitCode).toBe(0);
    expect(result.stderr).toContain('the run waits in the outbox');
    const answer = JSON.parse(result.stdout) as { outbox: string; runId?: string };
    expect(answer.runId).toBeUndefined();
    expect(pending()).toEqual([path.basename(answer.outbox)]);
    const item = JSON.parse(readFileSync(answer.outbox, 'utf8')) as { delivery: { specName: string; inputs: { path: string }[] } };
    expect(item.delivery.specName).toBe('drop-test');
    expect(item.delivery.inputs.map((input) => input.path).sort()).toEqual([at('px-a.csv'), at('rf-a.csv')]);
  });

  it('is delivered by clino watch on that drop folder once the server is back', async () => {
    await server.start();
    watcher = startClino(['watch', drop, '--spec', specFile, '--retry-ms', '200', '--retry-max-ms', '1000', '--rescan-seconds', '1'], env);
    await eventually(() => delivered().length === 1 && server.results.length === 1, 'the spooled run to be delivered');
    expect(pending()).toEqual([]);
    expect(server.uploads.size).toBe(2);
    expect(server.results[0]!.body.rows.map((row) => row.security)).toEqual(['QZ-A', 'QZ-B']);
  });

  it('spools through CLINO_OUTBOX too, and a running watcher delivers it on its next rescan', async () => {
    const spoolEnv = { ...env, CLINO_OUTBOX: outbox, CLINO_SERVER_URL: await deadUrl() };
    const result = await clino(['run', specFile, at('px-b.csv'), at('rf-a.csv'), '--post'], { env: spoolEnv });
    expect(result.exitCode).toBe(0);
    expect(result.stdout).toMatch(/^security,/);
    await eventually(() => delivered().length === 2 && server.results.length === 2, 'the second spooled run to be delivered');
    expect(pending()).toEqual([]);
  });
});
