import { describe, expect, it } from 'vitest';
import { useTestDatabase, type TestDatabase } from '../../../test/support/test-database.js';
import { createTestPerson, signedInAgent, type TestAgent } from '../auth/auth-test-support.js';
import { AuditEvent } from './audit-event.model.js';
import { recordAudit } from './audit.service.js';
import { appOver } from '../../../test/support/test-app.js';

interface Item {
  id: number;
  occurredAt: string;
  actor: { kind: string; id: number | null; name: string };
  action: string;
  entity: { type: string; id: string | null };
  before: unknown;
  after: unknown;
}

describe('the audit trail', () => {
  let db: TestDatabase;
  let supervisor: TestAgent;

  async function list(query: Record<string, string>): Promise<{ items: Item[]; total: number; page: number; pageSize: number }> {
    const res = await supervisor.get('/api/audit').query(query).expect(200);
    return res.body as { items: Item[]; total: number; page: number; pageSize: number };
  }

  useTestDatabase(async (made) => {
    db = made;
    const app = appOver(db);
    supervisor = (await signedInAgent(app, await createTestPerson('supervisor'))).agent;
    // Five probe events at known instants, written out of order.
    const at = (iso: string, action: string, actorName: string, entityId: string) =>
      AuditEvent.create({ occurredAt: new Date(iso), actorKind: 'person', actorId: 7, actorName, action, entityType: 'probe', entityId, beforeState: null, afterState: { n: entityId }, requestId: null });
    await at('2031-03-01T10:00:00.000Z', 'probe.create', 'nia.one', 'p3');
    await at('2031-01-01T10:00:00.000Z', 'probe.create', 'nia.one', 'p1');
    await at('2031-05-01T10:00:00.000Z', 'probe.remove', 'oto.two', 'p5');
    await at('2031-02-01T10:00:00.000Z', 'probe.update', 'oto.two', 'p2');
    await at('2031-04-01T10:00:00.000Z', 'probe.update', 'nia.one', 'p4');
  });

  it('lists events newest first', async () => {
    const page = await list({ entityType: 'probe' });
    expect(page.items.map((e) => e.entity.id)).toEqual(['p5', 'p4', 'p3', 'p2', 'p1']);
    expect(page.total).toBe(5);
  });

  it('pages through the events with a stable order', async () => {
    const second = await list({ entityType: 'probe', page: '2', pageSize: '2' });
    expect(second.items.map((e) => e.entity.id)).toEqual(['p3', 'p2']);
    expect(second).toMatchObject({ page: 2, pageSize: 2, total: 5 });
  });

  it('filters by actor, by exact action and by all actions of an entity', async () => {
    expect((await list({ entityType: 'probe', actor: 'oto.two' })).items.map((e) => e.entity.id)).toEqual(['p5', 'p2']);
    expect((await list({ action: 'probe.update' })).items.map((e) => e.entity.id)).toEqual(['p4', 'p2']);
    expect((await list({ action: 'probe.*' })).total).toBe(5);
  });

  it('filters by entity id and by a time range (from inclusive, to exclusive)', async () => {
    expect((await list({ entityType: 'probe', entityId: 'p3' })).items.map((e) => e.action)).toEqual(['probe.create']);
    const range = await list({ entityType: 'probe', from: '2031-02-01T10:00:00.000Z', to: '2031-04-01T10:00:00.000Z' });
    expect(range.items.map((e) => e.entity.id)).toEqual(['p3', 'p2']);
  });

  it('returns before and after as JSON', async () => {
    const [event] = (await list({ entityType: 'probe', entityId: 'p1' })).items;
    expect(event).toMatchObject({ before: null, after: { n: 'p1' }, actor: { kind: 'person', id: 7, name: 'nia.one' } });
  });

  it('refuses a time that is not ISO 8601 with an offset, naming the query field', async () => {
    const res = await supervisor.get('/api/audit').query({ from: '01/02/2031' }).expect(400);
    expect(res.body.error.details.issues[0]).toMatchObject({ in: 'query', path: 'from' });
  });

  it('refuses a range whose end is not after its start', async () => {
    await supervisor.get('/api/audit').query({ from: '2031-02-01T00:00:00Z', to: '2031-01-01T00:00:00Z' }).expect(400);
  });
});

describe('recordAudit inside the caller’s transaction', () => {
  let db: TestDatabase;
  useTestDatabase(async (made) => {
    db = made;
    appOver(db);
  });

  it('writes the event when the transaction commits, with the actor columns of each principal kind', async () => {
    await db.sequelize.transaction(async (t) => {
      await recordAudit(t, { actor: { kind: 'person', userId: 3, userName: 'pia.three', role: 'supervisor' }, action: 'run.release', entityType: 'run', entityId: 41, requestId: 'req-1' });
      await recordAudit(t, { actor: { kind: 'machine', tokenId: 9, name: 'watcher' }, action: 'run.create', entityType: 'run', entityId: 41 });
      await recordAudit(t, { actor: { kind: 'system', name: 'demo-seed' }, action: 'person.create', entityType: 'person', entityId: null });
    });
    const rows = await AuditEvent.findAll({ order: [['id', 'ASC']] });
    expect(rows.map((r) => [r.actorKind, r.actorId, r.actorName, r.action, r.entityId, r.requestId])).toEqual([
      ['person', 3, 'pia.three', 'run.release', '41', 'req-1'],
      ['machine', 9, 'watcher', 'run.create', '41', null],
      ['system', null, 'demo-seed', 'person.create', null, null],
    ]);
  });

  it('writes nothing when the transaction rolls back', async () => {
    const before = await AuditEvent.count();
    await expect(
      db.sequelize.transaction(async (t) => {
        await recordAudit(t, { actor: { kind: 'system', name: 'probe' }, action: 'probe.fail', entityType: 'probe', entityId: 1 });
        throw new Error('the change failed');
      }),
    ).rejects.toThrow('the change failed');
    expect(await AuditEvent.count()).toBe(before);
  });
});
