import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent } from '../audit/audit-event.model.js';
import { CSRF_HEADER } from '../auth/auth-test-support.js';
import { startApiFixture, type ApiFixture, type SignedIn } from '../runs/runs-test-support.js';
import { DEMO_LIST_NAME, ensureDemoDistributionList } from './demo-distribution-list.js';

describe('distribution lists', () => {
  let fixture: ApiFixture;
  let admin: SignedIn;
  beforeAll(async () => {
    fixture = await startApiFixture();
    admin = await fixture.as('admin');
  });
  afterAll(async () => {
    await fixture.close();
  });

  it('lets an admin create a list and replace its recipients, each change audited', async () => {
    const created = await admin.agent
      .post('/api/distribution-lists')
      .set(CSRF_HEADER, admin.csrf)
      .send({ name: 'risk-desk', recipients: [{ address: 'risk.one@demo-fund.invalid', displayName: 'Risk one' }] })
      .expect(201);
    const edited = await admin.agent
      .put(`/api/distribution-lists/${created.body.id}`)
      .set(CSRF_HEADER, admin.csrf)
      .send({ name: 'risk-desk', description: 'Risk', recipients: [{ address: 'risk.two@demo-fund.invalid' }, { address: 'risk.three@demo-fund.invalid' }] })
      .expect(200);
    expect(edited.body.recipients.map((r: { address: string }) => r.address)).toEqual(['risk.three@demo-fund.invalid', 'risk.two@demo-fund.invalid']);
    expect(await AuditEvent.count({ where: { entityType: 'distribution-list', entityId: created.body.id } })).toBe(2);
  });

  it('refuses a malformed address and a repeated name', async () => {
    const bad = await admin.agent.post('/api/distribution-lists').set(CSRF_HEADER, admin.csrf).send({ name: 'x-list', recipients: [{ address: 'not an address' }] }).expect(400);
    expect(bad.body.error.details.issues[0].path).toBe('recipients.0.address');
    await admin.agent.post('/api/distribution-lists').set(CSRF_HEADER, admin.csrf).send({ name: 'dup', recipients: [{ address: 'a@demo-fund.invalid' }] }).expect(201);
    await admin.agent.post('/api/distribution-lists').set(CSRF_HEADER, admin.csrf).send({ name: 'dup', recipients: [{ address: 'b@demo-fund.invalid' }] }).expect(409);
  });

  it('keeps lists to admins: a supervisor reads but may not edit', async () => {
    const supervisor = await fixture.as('supervisor');
    await supervisor.agent.get('/api/distribution-lists').expect(200);
    await supervisor.agent.post('/api/distribution-lists').set(CSRF_HEADER, supervisor.csrf).send({ name: 'mine', recipients: [{ address: 'a@demo-fund.invalid' }] }).expect(403);
  });

  it('seeds the demo list once, with invented recipients at demo-fund.invalid', async () => {
    expect(await ensureDemoDistributionList(fixture.db.sequelize)).toBe('created');
    expect(await ensureDemoDistributionList(fixture.db.sequelize)).toBe('present');
    const lists = await admin.agent.get('/api/distribution-lists').expect(200);
    const demo = lists.body.items.find((l: { name: string }) => l.name === DEMO_LIST_NAME);
    expect(demo.recipients.length).toBeGreaterThan(0);
    expect(demo.recipients.every((r: { address: string }) => r.address.endsWith('@demo-fund.invalid'))).toBe(true);
  });
});
