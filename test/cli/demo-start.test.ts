// The demo as `npm start` brings it up, end to end: the sample specs pushed by the demo analyst, the
// demo drop folder seeded, and `clino watch --once` with the demo machine token running every sample
// spec on the demo files and delivering the runs to the server.
import { mkdtempSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { seedDemo } from '../../server/src/db/seed-demo.js';
import { createLogger } from '../../server/src/shared/logger.js';
import { seedDemoDrop } from '../../scripts/demo-drop.js';
import { pushDemoSpecs } from '../../scripts/demo-specs.js';
import { startServer, type RunningServer } from '../support/running-server.js';
import { useTestDatabase, type TestDatabase } from '../support/test-database.js';
import { ROOT, clino, isolatedEnv } from './support/clino.js';

const TOKEN = 'clino_demo-start-test-token-0123456789';
let db: TestDatabase;
let server: RunningServer;

useTestDatabase(async (made) => {
  db = made;
  server = await startServer(db);
  await seedDemo(db.sequelize, createLogger('silent'), { ...db.settings.auth, passwordHashRounds: 4, demoMachineToken: TOKEN });
});

afterAll(async () => {
  await server?.close();
});

describe('the demo start', { timeout: 180_000 }, () => {
  it('pushes the four sample specs as the demo analyst, once', async () => {
    expect(await pushDemoSpecs(server.baseUrl, path.join(ROOT, 'samples/specs'))).toEqual([
      'core-monthly revision 1 (new)', 'thin-daily revision 1 (new)', 'unlisted-wacc revision 1 (new)', 'weekly-long revision 1 (new)',
    ]);
    const list = await fetch(`${server.baseUrl}/api/specs`, { headers: { authorization: `Bearer ${TOKEN}` } });
    const specs = (await list.json()) as { items: { latest: { authorName: string } }[] };
    expect(specs.items.map((s) => s.latest.authorName)).toEqual(['ben.analyst', 'ben.analyst', 'ben.analyst', 'ben.analyst']);
    const again = await pushDemoSpecs(server.baseUrl, path.join(ROOT, 'samples/specs'));
    expect(again.every((line) => line.endsWith('revision 1 (unchanged)'))).toBe(true);
  });

  it('runs every sample spec on the seeded drop folder and delivers four runs', async () => {
    const drop = path.join(mkdtempSync(path.join(tmpdir(), 'clino-demo-')), 'drop');
    seedDemoDrop(drop);
    const env = isolatedEnv({ CLINO_SERVER_URL: server.baseUrl, CLINO_TOKEN: TOKEN });
    const result = await clino(['watch', drop, '--once'], { env });
    expect(result.exitCode).toBe(0);
    expect(result.stderr).not.toContain('"level":50');
    expect(readdirSync(path.join(drop, 'incoming'))).toEqual([]);
    expect(readdirSync(path.join(drop, 'outbox', 'delivered'))).toHaveLength(4);
    const response = await fetch(`${server.baseUrl}/api/runs?state=in-review`, { headers: { authorization: `Bearer ${TOKEN}` } });
    const runs = (await response.json()) as { items: { specName: string; securityCount: number }[] };
    expect(runs.items.map((r) => [r.specName, r.securityCount]).sort()).toEqual([
      ['core-monthly', 48], ['thin-daily', 48], ['unlisted-wacc', 48], ['weekly-long', 48],
    ]);
  });
});
