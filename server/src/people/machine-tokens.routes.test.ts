import { createHash } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { useTestDatabase, type TestDatabase } from '../../../test/support/test-database.js';
import { createApp } from '../app.js';
import { createTestPerson, CSRF_HEADER, signedInAgent, type TestAgent } from '../auth/auth-test-support.js';
import { appOver } from '../../../test/support/test-app.js';

describe('machine token administration', () => {
  let db: TestDatabase;
  let app: ReturnType<typeof createApp>;
  let admin: { agent: TestAgent; csrf: string };
  let adminName: string;

  async function createToken(name: string, ownerUserId?: number): Promise<{ id: number; value: string }> {
    const res = await admin.agent.post('/api/machine-tokens').set(CSRF_HEADER, admin.csrf).send({ name, ownerUserId }).expect(201);
    return { id: res.body.token.id as number, value: res.body.value as string };
  }

  useTestDatabase(async (made) => {
    db = made;
    app = appOver(db);
    const person = await createTestPerson('admin');
    adminName = person.userName;
    admin = await signedInAgent(app, person);
  });

  it('shows the value once at creation and stores only its sha256', async () => {
    const { id, value } = await createToken('nightly watcher');
    // SHA-256 per FIPS 180-4, computed here with Node's crypto as the reference.
    const expectedHash = createHash('sha256').update(value).digest('hex');
    const rows = await db.sequelize.query<Record<string, unknown>>('SELECT * FROM machine_tokens WHERE id = ?', { replacements: [id], type: QueryTypes.SELECT });
    expect(rows[0]?.token_sha256).toBe(expectedHash);
    expect(JSON.stringify(rows[0])).not.toContain(value);
    const listed = await admin.agent.get('/api/machine-tokens').expect(200);
    expect(JSON.stringify(listed.body)).not.toContain(value);
    expect(JSON.stringify(listed.body)).not.toContain(expectedHash);
  });

  it('lists tokens newest first with their creator', async () => {
    await createToken('first one');
    await createToken('second one');
    const res = await admin.agent.get('/api/machine-tokens').expect(200);
    const items = res.body.items as { name: string; createdBy: { userName: string } }[];
    expect(items.slice(0, 2).map((t) => t.name)).toEqual(['second one', 'first one']);
    expect(items[0]?.createdBy.userName).toBe(adminName);
  });

  it('works as a bearer token until revoked, then answers 401', async () => {
    const { id, value } = await createToken('short lived');
    await request(app).get('/api/session').set('Authorization', `Bearer ${value}`).expect(200);
    const res = await admin.agent.delete(`/api/machine-tokens/${id}`).set(CSRF_HEADER, admin.csrf).expect(200);
    expect(res.body.revokedAt).toEqual(expect.any(String));
    await request(app).get('/api/session').set('Authorization', `Bearer ${value}`).expect(401);
  });

  it('audits creation and revocation once each, without the value or the hash', async () => {
    const { id, value } = await createToken('audited');
    await admin.agent.delete(`/api/machine-tokens/${id}`).set(CSRF_HEADER, admin.csrf).expect(200);
    await admin.agent.delete(`/api/machine-tokens/${id}`).set(CSRF_HEADER, admin.csrf).expect(200);
    const rows = await db.sequelize.query<{ action: string; actor_name: string; after_state: unknown }>(
      "SELECT action, actor_name, after_state FROM audit_events WHERE entity_type = 'machine-token' AND entity_id = ? ORDER BY id",
      { replacements: [String(id)], type: QueryTypes.SELECT },
    );
    expect(rows.map((r) => [r.action, r.actor_name])).toEqual([
      ['machine-token.create', adminName],
      ['machine-token.revoke', adminName],
    ]);
    const hash = createHash('sha256').update(value).digest('hex');
    for (const row of rows) {
      const stored = JSON.stringify(row.after_state);
      expect(stored).toContain('"name":"audited"');
      expect(stored).not.toContain(value.slice(6));
      expect(stored).not.toContain(hash);
    }
  });

  it('answers an unknown token id with 404 and a malformed one with 400', async () => {
    await admin.agent.delete('/api/machine-tokens/424242').set(CSRF_HEADER, admin.csrf).expect(404);
    await admin.agent.delete('/api/machine-tokens/abc').set(CSRF_HEADER, admin.csrf).expect(400);
  });

  it('gives a token an owner, shown on the token list and in the audit event; a token without one shows null', async () => {
    const analyst = await createTestPerson('analyst');
    const { id } = await createToken('analyst laptop', analyst.id);
    const { id: ownerless } = await createToken('night worker');
    const items = (await admin.agent.get('/api/machine-tokens').expect(200)).body.items as { id: number; owner: unknown }[];
    expect(items.find((t) => t.id === id)?.owner).toEqual({ id: analyst.id, userName: analyst.userName, role: 'analyst' });
    expect(items.find((t) => t.id === ownerless)?.owner).toBeNull();
    const rows = await db.sequelize.query<{ after_state: { owner: unknown } }>(
      "SELECT after_state FROM audit_events WHERE entity_type = 'machine-token' AND action = 'machine-token.create' AND entity_id = ?",
      { replacements: [String(id)], type: QueryTypes.SELECT },
    );
    const after = typeof rows[0]?.after_state === 'string' ? JSON.parse(rows[0].after_state) : rows[0]?.after_state;
    expect(after.owner).toEqual({ id: analyst.id, userName: analyst.userName, role: 'analyst' });
  });

  it('refuses an owner who is unknown, inactive, or of a role that may not push specs, naming ownerUserId', async () => {
    const inactive = await createTestPerson('analyst', { active: false });
    const viewer = await createTestPerson('viewer');
    for (const [ownerUserId, reason] of [[424242, 'no person has id 424242'], [inactive.id, 'is inactive'], [viewer.id, 'a role that may not push specs']] as const) {
      const res = await admin.agent.post('/api/machine-tokens').set(CSRF_HEADER, admin.csrf).send({ name: 'refused', ownerUserId }).expect(400);
      expect(res.body.error.code).toBe('VALIDATION_FAILED');
      expect(res.body.error.details.issues[0]).toMatchObject({ in: 'body', path: 'ownerUserId', message: expect.stringContaining(reason) });
    }
  });

  it('refuses an empty token name', async () => {
    const res = await admin.agent.post('/api/machine-tokens').set(CSRF_HEADER, admin.csrf).send({ name: '  ' }).expect(400);
    expect(res.body.error.details.issues[0]).toMatchObject({ in: 'body', path: 'name' });
  });
});
