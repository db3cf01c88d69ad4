import { QueryTypes } from 'sequelize';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { useTestDatabase, type TestDatabase } from '../../../test/support/test-database.js';
import { createApp } from '../app.js';
import { signedInAgent } from '../auth/auth-test-support.js';
import { ROLES } from '../auth/principal.js';
import { DEMO_PEOPLE } from '../people/demo-people.js';
import { ensureDemoMachineToken } from '../people/demo-machine-token.js';
import { createLogger } from '../shared/logger.js';
import { seedDemo } from './seed-demo.js';
import { appOver } from '../../../test/support/test-app.js';

describe('the demo seed', () => {
  let db: TestDatabase;
  let app: ReturnType<typeof createApp>;
  const firstValue = 'demo-watcher-token-value-one-0123456789';
  const auth = () => ({ ...db.settings.auth, passwordHashRounds: 4 });

  useTestDatabase(async (made) => {
    db = made;
    app = appOver(db);
    await seedDemo(db.sequelize, createLogger('silent'), { ...auth(), demoMachineToken: firstValue });
  });

  it('has one person per role and a second supervisor', () => {
    expect(new Set(DEMO_PEOPLE.map((p) => p.role))).toEqual(new Set(ROLES));
    expect(DEMO_PEOPLE.filter((p) => p.role === 'supervisor')).toHaveLength(2);
  });

  it.each(DEMO_PEOPLE.map((p) => [p.userName, p]))('lets %s sign in with the documented demo password', async (_name, person) => {
    expect(person.password).toBe(`demo-${person.role}-pass`);
    const { agent } = await signedInAgent(app, person);
    expect((await agent.get('/api/session').expect(200)).body.principal).toMatchObject({ userName: person.userName, role: person.role });
  });

  it('gives the demo watcher a token whose value is the one from CLINO_DEMO_MACHINE_TOKEN', async () => {
    const res = await request(app).get('/api/session').set('Authorization', `Bearer ${firstValue}`).expect(200);
    expect(res.body.principal).toMatchObject({ kind: 'machine', name: 'demo-watcher' });
  });

  it('changes nothing when run again with the same settings', async () => {
    const count = async () =>
      db.sequelize.query<{ people: number; tokens: number; events: number }>(
        'SELECT (SELECT COUNT(*) FROM users) AS people, (SELECT COUNT(*) FROM machine_tokens) AS tokens, (SELECT COUNT(*) FROM audit_events WHERE actor_kind = ?) AS events',
        { replacements: ['system'], type: QueryTypes.SELECT },
      );
    const before = await count();
    await seedDemo(db.sequelize, createLogger('silent'), { ...auth(), demoMachineToken: firstValue });
    expect(await count()).toEqual(before);
    expect(Number(before[0]?.people)).toBe(DEMO_PEOPLE.length);
  });

  it('switches the watcher to a new value from the start script and revokes the old one', async () => {
    const secondValue = 'demo-watcher-token-value-two-9876543210';
    await seedDemo(db.sequelize, createLogger('silent'), { ...auth(), demoMachineToken: secondValue });
    await request(app).get('/api/session').set('Authorization', `Bearer ${secondValue}`).expect(200);
    await request(app).get('/api/session').set('Authorization', `Bearer ${firstValue}`).expect(401);
  });

  it('refuses a demo token value that is too short to be a secret', async () => {
    await expect(ensureDemoMachineToken(db.sequelize, 'short')).rejects.toThrow(/CLINO_DEMO_MACHINE_TOKEN: use at least 24 characters/);
  });

  it('audits what it created as the system actor demo-seed', async () => {
    const rows = await db.sequelize.query<{ action: string; n: number }>(
      "SELECT action, COUNT(*) AS n FROM audit_events WHERE actor_kind = 'system' AND actor_name = 'demo-seed' GROUP BY action ORDER BY action",
      { type: QueryTypes.SELECT },
    );
    expect(rows.map((r) => [r.action, Number(r.n)])).toEqual([
      ['machine-token.create', 2],
      ['machine-token.revoke', 1],
      ['person.create', DEMO_PEOPLE.length],
    ]);
  });
});

describe('the demo seed without a given token value', () => {
  let db: TestDatabase;
  useTestDatabase(async (made) => {
    db = made;
    appOver(db);
  });

  it('makes a random token once and returns its value, then leaves it alone', async () => {
    const first = await ensureDemoMachineToken(db.sequelize, '');
    expect(first.kind === 'created' && first.generatedValue?.startsWith('clino_')).toBe(true);
    expect(await ensureDemoMachineToken(db.sequelize, '')).toEqual({ kind: 'unchanged' });
  });
});
