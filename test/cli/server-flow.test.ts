// clino against the real server (createApp on a fresh migrated MariaDB database): login, spec
// push/list/pull, run --post (the server refuses a spec it does not hold), export (the same bytes as
// run --out), a rerun job done by clino work, and a drop folder processed with the server's specs.
import { copyFileSync, existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { rerunRun } from '../../server/src/runs/rerun.service.js';
import { User } from '../../server/src/people/user.model.js';
import { seedDemo } from '../../server/src/db/seed-demo.js';
import { createLogger } from '../../server/src/shared/logger.js';
import { startServer, type RunningServer } from '../support/running-server.js';
import { useTestDatabase, type TestDatabase } from '../support/test-database.js';
import { ROOT, clino, isolatedEnv } from './support/clino.js';

const TOKEN = 'clino_cli-flow-test-token-0123456789';
const fixtures = path.join(ROOT, 'test/fixtures/worked-example');
const specFile = path.join(ROOT, 'test/cli/fixtures/worked-example.yaml');
const inputs = [path.join(fixtures, 'prices.csv'), path.join(fixtures, 'risk-free.csv')];
const work = mkdtempSync(path.join(tmpdir(), 'clino-flow-'));
let db: TestDatabase;
let server: RunningServer;
let env: Record<string, string>;
let runId = '';

async function machineGet(url: string): Promise<unknown> {
  const response = await fetch(`${server.baseUrl}${url}`, { headers: { authorization: `Bearer ${TOKEN}` } });
  return response.json();
}

useTestDatabase(async (made) => {
  db = made;
  server = await startServer(db);
  await seedDemo(db.sequelize, createLogger('silent'), { ...db.settings.auth, passwordHashRounds: 4, demoMachineToken: TOKEN });
  env = isolatedEnv();
});

afterAll(async () => {
  await server?.close();
});

describe('clino with the real server', { timeout: 180_000 }, () => {
  it('stores the server URL and the token read from stdin in a config file of mode 0600', async () => {
    const result = await clino(['login', server.baseUrl], { env, input: `${TOKEN}\n` });
    expect(result.exitCode).toBe(0);
    const file = path.join(env['CLINO_CONFIG_DIR']!, 'config.json');
    expect(statSync(file).mode & 0o777).toBe(0o600);
    expect(JSON.parse(readFileSync(file, 'utf8'))).toEqual({ serverUrl: server.baseUrl, token: TOKEN });
  });

  it('refuses a token the server does not know, and stores nothing', async () => {
    const other = isolatedEnv();
    const result = await clino(['login', server.baseUrl], { env: other, input: 'clino_not-a-real-token-000000000000\n' });
    expect(result.exitCode).toBe(6);
    expect(result.stderr).toContain('(UNAUTHENTICATED)');
    expect(existsSync(path.join(other['CLINO_CONFIG_DIR']!, 'config.json'))).toBe(false);
  });

  it('pushes a spec, lists it, and pulls back exactly the text pushed', async () => {
    const pushed = await clino(['spec', 'push', specFile], { env });
    expect(pushed.exitCode).toBe(0);
    expect(pushed.stdout).toMatch(/^worked-example revision 1 [0-9a-f]{64}\n$/);
    // The demo watcher's token has no owner: the push is the machine's, and four eyes will block its release.
    expect(pushed.stderr).toContain('this machine token acts for no person');
    const again = await clino(['spec', 'push', specFile], { env });
    expect(again.stdout).toMatch(/^worked-example revision 1 [0-9a-f]{64} \(unchanged\)\n$/);
    expect((await clino(['spec', 'list'], { env })).stdout).toMatch(/\nworked-example +1 /);
    const pulled = await clino(['spec', 'pull', 'worked-example'], { env });
    expect(pulled.stdout).toBe(readFileSync(specFile, 'utf8'));
  });

  it('posts a run, and answers the same run when the same spec and files are posted again', async () => {
    const first = await clino(['run', specFile, ...inputs, '--post', '--json'], { env });
    expect(first.exitCode).toBe(0);
    runId = (JSON.parse(first.stdout) as { runId: string }).runId;
    const second = await clino(['run', specFile, ...inputs, '--post', '--json'], { env });
    expect(second.exitCode).toBe(0);
    expect((JSON.parse(second.stdout) as { runId: string }).runId).toBe(runId);
    const run = (await machineGet(`/api/runs/${runId}`)) as { state: string; securityCount: number };
    expect([run.state, run.securityCount]).toEqual(['in-review', 1]);
  });

  it('exports the run\'s CSV with the same bytes clino run --out writes', async () => {
    const out = path.join(work, 'local.csv');
    expect((await clino(['run', specFile, ...inputs, '--out', out], { env })).exitCode).toBe(0);
    const exported = await clino(['export', runId], { env });
    expect(exported.exitCode).toBe(0);
    expect(exported.stdout).toBe(readFileSync(out, 'utf8'));
  });

  it('refuses to post a spec the server does not hold (SPEC_UNKNOWN, exit 3)', async () => {
    const changed = path.join(work, 'unpushed.yaml');
    const text = readFileSync(specFile, 'utf8').replace('window: 10', 'window: 9');
    writeFileSync(changed, text);
    const result = await clino(['run', changed, ...inputs, '--post'], { env });
    expect(result.exitCode).toBe(3);
    expect(result.stderr).toContain('(SPEC_UNKNOWN)');
  });

  it('runs a rerun job with clino work: the run gets a second attempt with results', async () => {
    const supervisor = (await User.findOne({ where: { role: 'supervisor' } }))!;
    const principal = { kind: 'person' as const, userId: supervisor.id, userName: supervisor.userName, role: 'supervisor' as const };
    await rerunRun(db.sequelize, { kind: 'person', id: supervisor.id, name: supervisor.userName, principal }, Number(runId), 'test rerun', null);
    const result = await clino(['work', '--once', '--work-dir', path.join(work, 'jobs')], { env });
    expect(result.exitCode).toBe(0);
    expect(result.stderr).toContain('rerun computed and posted');
    const run = (await machineGet(`/api/runs/${runId}`)) as { state: string; attempt: number };
    expect([run.state, run.attempt]).toEqual(['in-review', 2]);
  });

  it('processes a drop folder with the specs held by the server', async () => {
    const drop = path.join(work, 'drop');
    mkdirSync(path.join(drop, 'incoming'), { recursive: true });
    copyFileSync(inputs[0]!, path.join(drop, 'incoming', 'prices-20261030.csv'));
    copyFileSync(inputs[1]!, path.join(drop, 'incoming', 'risk-free-20261030.csv'));
    const result = await clino(['watch', drop, '--once'], { env });
    expect(result.exitCode).toBe(0);
    expect(result.stderr).not.toContain('"level":50');
    expect(readdirSync(path.join(drop, 'incoming'))).toEqual([]);
    expect(readdirSync(path.join(drop, 'outbox', 'delivered'))).toHaveLength(1);
    const runs = (await machineGet('/api/runs?spec=worked-example')) as { items: { id: string }[] };
    // The drop's files have other names than the posted run's, so their fingerprint (and run) differs.
    expect(runs.items.length).toBe(2);
  });
});
