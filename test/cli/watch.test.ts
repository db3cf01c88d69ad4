// `clino watch` on a drop folder, driven as ops would: files dropped into incoming/, a stand-in
// ingest server switched off and on, SIGTERM and a restart. Waits poll for an outcome; no duration
// is asserted.
import { existsSync, mkdtempSync, readFileSync, readdirSync, writeFileSync, appendFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eventually, isolatedEnv, startClino } from './support/clino.js';
import { startFakeIngestServer, type FakeIngestServer } from './support/fake-ingest-server.js';
import { DROP_SPEC, priceFile, riskFreeFile } from './support/small-drop-files.js';

const root = mkdtempSync(path.join(tmpdir(), 'clino-watch-'));
const drop = path.join(root, 'drop');
const specFile = path.join(root, 'drop-test.yaml');
const at = (...parts: string[]) => path.join(drop, ...parts);
let server: FakeIngestServer;
let env: Record<string, string>;
let watcher: ReturnType<typeof startClino>;

function archived(): string[] {
  if (!existsSync(at('archive'))) return [];
  return readdirSync(at('archive')).flatMap((day) => readdirSync(at('archive', day)));
}

function startWatcher(): ReturnType<typeof startClino> {
  return startClino(['watch', drop, '--spec', specFile, '--settle-ms', '1500', '--retry-ms', '200', '--retry-max-ms', '1000', '--rescan-seconds', '1'], env);
}

beforeAll(async () => {
  server = await startFakeIngestServer();
  env = isolatedEnv({ CLINO_SERVER_URL: server.url, CLINO_TOKEN: server.token, CLINO_LOG_LEVEL: 'info' });
  writeFileSync(specFile, DROP_SPEC);
  watcher = startWatcher();
  await eventually(() => watcher.stderr().includes('watcher ready'), 'the watcher to start');
});

afterAll(async () => {
  watcher.process.kill('SIGTERM');
  await watcher.process;
  await server.stop();
});

describe('clino watch', { timeout: 180_000 }, () => {
  it('keeps a price file waiting in incoming/ until the risk-free file arrives, then runs, posts once and archives both', async () => {
    writeFileSync(at('incoming', 'px-0101.csv'), priceFile(18));
    await eventually(() => watcher.stderr().includes('run waits for its inputs'), 'the run to wait');
    expect(readdirSync(at('incoming'))).toContain('px-0101.csv');
    writeFileSync(at('incoming', 'rf-0101.csv'), riskFreeFile(18));
    await eventually(() => server.results.length === 1 && archived().includes('px-0101.csv'), 'the run to be delivered and archived');
    expect(archived().sort()).toEqual(['px-0101.csv', 'px-0101.csv.sha256', 'rf-0101.csv', 'rf-0101.csv.sha256']);
    expect(server.results[0]!.body.rows.map((row) => row.security)).toEqual(['QZ-A', 'QZ-B']);
    expect(server.uploads.size).toBe(2);
    expect(readdirSync(at('outbox', 'delivered'))).toHaveLength(1);
  });

  it('does not run the same content twice: a copy under another name is archived, not posted', async () => {
    const creates = server.runs.size;
    writeFileSync(at('incoming', 'px-0101-copy.csv'), priceFile(18));
    await eventually(() => archived().includes('px-0101-copy.csv'), 'the copy to be archived');
    expect(watcher.stderr()).toContain('same spec and same content ran before: not run again');
    expect(server.runs.size).toBe(creates);
    expect(server.results).toHaveLength(1);
    const ledger = readFileSync(at('ledger.jsonl'), 'utf8').trim().split('\n').map((line) => JSON.parse(line) as { kind: string; name?: string });
    expect(ledger.map((entry) => entry.kind)).toEqual(['run', 'duplicate']);
    expect(ledger[1]!.name).toBe('px-0101-copy.csv');
  });

  it('moves a bad file to rejected/ beside an error file naming line and column', async () => {
    writeFileSync(at('incoming', 'px-bad.csv'), 'date,QZ-A,QZ-B,MKT\n2025-01-31,10,20,1000\n2025-02-28,11,x9,1001\n');
    await eventually(() => existsSync(at('rejected', 'px-bad.csv.error.txt')), 'the rejection');
    const text = readFileSync(at('rejected', 'px-bad.csv.error.txt'), 'utf8');
    expect(text).toContain('at: px-bad.csv:3:3 price "x9" is not a number (column "QZ-B")');
    expect(existsSync(at('rejected', 'px-bad.csv'))).toBe(true);
    expect(existsSync(at('incoming', 'px-bad.csv'))).toBe(false);
  });

  it('reads a file only once it is completely written', async () => {
    const full = priceFile(17, 1);
    const file = at('incoming', 'px-slow.csv');
    writeFileSync(file, full.slice(0, 60));
    for (let offset = 60; offset < full.length; offset += 60) {
      await new Promise((resolve) => setTimeout(resolve, 100));
      appendFileSync(file, full.slice(offset, offset + 60));
    }
    await eventually(() => archived().includes('px-slow.csv'), 'the slow file to be processed');
    expect(existsSync(at('rejected', 'px-slow.csv'))).toBe(false);
    const posted = server.results.at(-1)!.body.rows.find((row) => row.security === 'QZ-A')!;
    // 17 month-ends give 16 returns; the window keeps the last 12.
    expect(posted.n).toBe(12);
  });

  it('spools a run to outbox/ while the server is down and delivers it once when it is back', async () => {
    await server.stop();
    const before = server.results.length;
    writeFileSync(at('incoming', 'px-offline.csv'), priceFile(16, 2));
    await eventually(() => readdirSync(at('outbox')).some((name) => name.endsWith('.json')), 'the post to wait in outbox/');
    await eventually(() => watcher.stderr().includes('delivery postponed'), 'a failed attempt');
    expect(server.results).toHaveLength(before);
    await server.start();
    await eventually(() => server.results.length === before + 1, 'the delivery once the server is back');
    await eventually(() => !readdirSync(at('outbox')).some((name) => name.endsWith('.json')), 'the outbox to empty');
    expect(new Set(server.results.map((r) => r.key)).size).toBe(server.results.length);
  });

  it('stops on SIGTERM, and on restart processes the files left in incoming/', async () => {
    watcher.process.kill('SIGTERM');
    const ended = await watcher.process;
    expect(ended.exitCode).toBe(0);
    expect(watcher.stderr()).toContain('"msg":"stopped"');
    writeFileSync(at('incoming', 'px-queued.csv'), priceFile(15, 3));
    const before = server.results.length;
    watcher = startWatcher();
    await eventually(() => server.results.length === before + 1 && archived().includes('px-queued.csv'), 'the queued file after the restart');
  });
});
