// SIGTERM while `clino watch` works through the demo files: the file in hand is finished, the rest
// stay in incoming/, and the next start completes them; every run is delivered exactly once.
import { mkdtempSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemoDrop } from '../../scripts/demo-drop.js';
import { ROOT, clino, eventually, isolatedEnv, startClino } from './support/clino.js';
import { startFakeIngestServer, type FakeIngestServer } from './support/fake-ingest-server.js';

const specs = ['core-monthly', 'weekly-long', 'thin-daily', 'unlisted-wacc'].map((name) => path.join(ROOT, 'samples/specs', `${name}.yaml`));
let server: FakeIngestServer;

beforeAll(async () => {
  server = await startFakeIngestServer();
});

afterAll(async () => {
  await server.stop();
});

describe('stopping clino watch', { timeout: 180_000 }, () => {
  it('finishes the file in hand on SIGTERM and leaves the rest for the next start', async () => {
    const drop = path.join(mkdtempSync(path.join(tmpdir(), 'clino-stop-')), 'drop');
    seedDemoDrop(drop);
    const env = isolatedEnv({ CLINO_SERVER_URL: server.url, CLINO_TOKEN: server.token });
    const watcher = startClino(['watch', drop, '--spec', ...specs, '--settle-ms', '300'], env);
    await eventually(() => watcher.stderr().includes('"msg":"run computed"'), 'the first run');
    watcher.process.kill('SIGTERM');
    expect((await watcher.process).exitCode).toBe(0);
    const left = readdirSync(path.join(drop, 'incoming'));
    const archived = readdirSync(path.join(drop, 'archive')).flatMap((day) => readdirSync(path.join(drop, 'archive', day)));
    const wide = 'tarn-equities-20261130.csv', long = 'tarn-equities-long-20261130.csv';
    for (const file of [wide, long]) expect(left.includes(file) !== archived.includes(file)).toBe(true);
    // A price file is archived only once each spec it triggers has run: three for the wide file, one for the long.
    expect(server.results).toHaveLength((archived.includes(wide) ? 3 : 0) + (archived.includes(long) ? 1 : 0));
    const restarted = await clino(['watch', drop, '--spec', ...specs, '--once'], { env });
    expect(restarted.exitCode).toBe(0);
    expect(readdirSync(path.join(drop, 'incoming'))).toEqual([]);
    expect(server.results).toHaveLength(4);
    expect(new Set(server.results.map((r) => r.key)).size).toBe(4);
  });
});
