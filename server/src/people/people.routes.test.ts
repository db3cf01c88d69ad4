import { QueryTypes } from 'sequelize';
import { describe, expect, it } from 'vitest';
import { useTestDatabase, type TestDatabase } from '../../../test/support/test-database.js';
import { createApp } from '../app.js';
import { anonymousAgent, createTestPerson, CSRF_HEADER, signedInAgent, type TestAgent } from '../auth/auth-test-support.js';
import { createLogger } from '../shared/logger.js';

interface AuditRow {
  action: string;
  actor_name: string;
  entity_id: string;
  before_state: unknown;
  after_state: unknown;
}

/** The JSON columns as text, whether the driver hands them over parsed or not. */
const text = (value: unknown): string => (typeof value === 'string' ? value : JSON.stringify(value));

describe('people administration', () => {
  let db: TestDatabase;
  let app: ReturnType<typeof createApp>;
  let admin: { agent: TestAgent; csrf: string };
  let adminName: string;

  async function auditFor(entityId: number): Promise<AuditRow[]> {
    return db.sequelize.query<AuditRow>(
      "SELECT action, actor_name, entity_id, before_state, after_state FROM audit_events WHERE entity_type = 'person' AND entity_id = ? AND action LIKE 'person.%' ORDER BY id",
      { replacements: [String(entityId)], type: QueryTypes.SELECT },
    );
  }

  /** POST /api/people as the signed-in admin. */
  function postPerson(body: Record<string, string>) {
    return admin.agent.post('/api/people').set(CSRF_HEADER, admin.csrf).send(body);
  }

  async function create(userName: string, role = 'analyst', password = 'first-password-1'): Promise<number> {
    const res = await postPerson({ userName, displayName: `Person ${userName}`, email: `${userName}@demo-fund.invalid`, role, password })
      .expect(201);
    return res.body.id as number;
  }

  useTestDatabase(async (made) => {
    db = made;
    app = createApp({ settings: { ...db.settings, auth: { ...db.settings.auth, passwordHashRounds: 4 } }, sequelize: db.sequelize, logger: createLogger('silent') });
    const person = await createTestPerson('admin');
    adminName = person.userName;
    admin = await signedInAgent(app, person);
  });

  it('creates a person who can then sign in, and never shows the password hash', async () => {
    const res = await postPerson({ userName: 'Gus.Ops', displayName: 'Gus Ops', email: 'gus@demo-fund.invalid', role: 'ops', password: 'gus-password-12' })
      .expect(201);
    expect(res.body).toMatchObject({ userName: 'gus.ops', role: 'ops', active: true });
    expect(JSON.stringify(res.body)).not.toMatch(/password|\$2[aby]\$/i);
    const { agent } = await signedInAgent(app, { userName: 'gus.ops', password: 'gus-password-12' });
    expect((await agent.get('/api/session').expect(200)).body.principal.role).toBe('ops');
  });

  it('audits the creation with the admin as actor and no secret in the record', async () => {
    const id = await create('hal.audit');
    const rows = await auditFor(id);
    expect(rows.map((r) => [r.action, r.actor_name])).toEqual([['person.create', adminName]]);
    expect(text(rows[0]?.after_state)).toContain('"userName":"hal.audit"');
    expect(text(rows[0]?.after_state)).not.toMatch(/password|\$2[aby]\$/i);
  });

  it('lists people by user name', async () => {
    const res = await admin.agent.get('/api/people').expect(200);
    const names = (res.body.items as { userName: string }[]).map((p) => p.userName);
    expect(names).toEqual([...names].sort());
    expect(names).toContain('hal.audit');
  });

  it('refuses a taken user name with 409', async () => {
    await create('ivy.taken');
    const res = await postPerson({ userName: 'ivy.taken', displayName: 'Other', email: 'o@demo-fund.invalid', role: 'viewer', password: 'other-password-1' })
      .expect(409);
    expect(res.body.error.code).toBe('CONFLICT');
  });

  it('refuses a password shorter than 12 characters, naming the field', async () => {
    const res = await postPerson({ userName: 'jo.short', displayName: 'Jo', email: 'jo@demo-fund.invalid', role: 'viewer', password: 'short' })
      .expect(400);
    expect(res.body.error.details.issues[0]).toMatchObject({ in: 'body', path: 'password' });
  });

  it('changes a role, which applies to the open session at once, and audits before and after', async () => {
    const id = await create('kit.role', 'viewer', 'kit-password-12');
    const kit = await signedInAgent(app, { userName: 'kit.role', password: 'kit-password-12' });
    await admin.agent.patch(`/api/people/${id}`).set(CSRF_HEADER, admin.csrf).send({ role: 'supervisor' }).expect(200);
    expect((await kit.agent.get('/api/session').expect(200)).body.principal.role).toBe('supervisor');
    const update = (await auditFor(id)).find((r) => r.action === 'person.update');
    expect(JSON.parse(text(update?.before_state))).toMatchObject({ role: 'viewer' });
    expect(JSON.parse(text(update?.after_state))).toMatchObject({ role: 'supervisor' });
  });

  it('deactivates a person: their session ends and they cannot sign in', async () => {
    const id = await create('lou.leaving', 'ops', 'lou-password-12');
    const lou = await signedInAgent(app, { userName: 'lou.leaving', password: 'lou-password-12' });
    await admin.agent.patch(`/api/people/${id}`).set(CSRF_HEADER, admin.csrf).send({ active: false }).expect(200);
    expect((await lou.agent.get('/api/session').expect(200)).body).toEqual({ principal: null });
    const { agent, csrf } = await anonymousAgent(app);
    await agent.post('/api/session').set(CSRF_HEADER, csrf).send({ userName: 'lou.leaving', password: 'lou-password-12' }).expect(401);
  });

  it('resets a password: the old one stops working, open sessions end, and the reset is audited', async () => {
    const id = await create('max.reset', 'analyst', 'old-password-123');
    const max = await signedInAgent(app, { userName: 'max.reset', password: 'old-password-123' });
    await admin.agent.patch(`/api/people/${id}`).set(CSRF_HEADER, admin.csrf).send({ password: 'new-password-456' }).expect(200);
    expect((await max.agent.get('/api/session').expect(200)).body).toEqual({ principal: null });
    const { agent, csrf } = await anonymousAgent(app);
    await agent.post('/api/session').set(CSRF_HEADER, csrf).send({ userName: 'max.reset', password: 'old-password-123' }).expect(401);
    await signedInAgent(app, { userName: 'max.reset', password: 'new-password-456' });
    expect((await auditFor(id)).map((r) => r.action)).toEqual(['person.create', 'person.password-reset']);
  });

  it('keeps the last active admin: demoting or deactivating them is refused with 409', async () => {
    const admins = await db.sequelize.query<{ id: number }>("SELECT id FROM users WHERE role = 'admin' AND active = 1", { type: QueryTypes.SELECT });
    expect(admins).toHaveLength(1);
    const id = admins[0]?.id ?? 0;
    await admin.agent.patch(`/api/people/${id}`).set(CSRF_HEADER, admin.csrf).send({ role: 'viewer' }).expect(409);
    await admin.agent.patch(`/api/people/${id}`).set(CSRF_HEADER, admin.csrf).send({ active: false }).expect(409);
  });

  it('answers an unknown id with 404 and an empty change with 400', async () => {
    await admin.agent.patch('/api/people/999999').set(CSRF_HEADER, admin.csrf).send({ role: 'ops' }).expect(404);
    await admin.agent.patch('/api/people/1').set(CSRF_HEADER, admin.csrf).send({}).expect(400);
  });
});
