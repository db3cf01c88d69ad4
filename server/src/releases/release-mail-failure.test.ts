import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent } from '../audit/audit-event.model.js';
import { CSRF_HEADER } from '../auth/auth-test-support.js';
import { Run } from '../runs/run.model.js';
import { inputFile, pushSpec, reviewedRun, specText, startApiFixture, syntheticResults, type ApiFixture } from '../runs/runs-test-support.js';
import { ensureDemoDistributionList } from './demo-distribution-list.js';

describe('a release whose mail cannot be sent', () => {
  let fixture: ApiFixture;
  beforeAll(async () => {
    // No mail sink: the SMTP port (1) refuses connections.
    fixture = await startApiFixture();
    await ensureDemoDistributionList(fixture.db.sequelize);
  });
  afterAll(async () => {
    await fixture.close();
  });

  it('stands as released with mail state failed and the reason, audited, and may be sent again', async () => {
    const sha = await pushSpec(fixture, await fixture.as('analyst'), specText('mail-down', { window: 12, minimum: 8, rolling: 3 }));
    const runId = await reviewedRun(fixture, 'mail-down', sha, '2026-06-30', [inputFile('prices-1.csv', 'date,QZ1,MKT\n')], syntheticResults(2, 12, 3));
    const supervisor = await fixture.as('supervisor');
    const released = await supervisor.agent.post(`/api/runs/${runId}/release`).set(CSRF_HEADER, supervisor.csrf).send({}).expect(201);
    expect(released.body.mailState).toBe('failed');
    expect(released.body.mailError).toMatch(/ECONNREFUSED|connect/i);
    expect((await Run.findByPk(Number(runId)))?.state).toBe('released');
    expect(await AuditEvent.count({ where: { action: 'release.mail', entityId: released.body.id } })).toBe(1);
    const again = await supervisor.agent.post(`/api/releases/${released.body.id}/resend`).set(CSRF_HEADER, supervisor.csrf).send({}).expect(200);
    expect(again.body.mailState).toBe('failed');
    expect(await AuditEvent.count({ where: { action: 'release.mail', entityId: released.body.id } })).toBe(2);
  });

  it('refuses a release when neither the request nor the spec names a distribution list', async () => {
    const text = specText('no-list', { window: 12, minimum: 8, rolling: 3 }).replace('report:\n  distributionList: valuation-committee\n', '');
    const sha = await pushSpec(fixture, await fixture.as('analyst'), text);
    const runId = await reviewedRun(fixture, 'no-list', sha, '2026-06-30', [inputFile('prices-2.csv', 'date,QZ1,MKT\n')], syntheticResults(1, 12, 3));
    const supervisor = await fixture.as('supervisor');
    const res = await supervisor.agent.post(`/api/runs/${runId}/release`).set(CSRF_HEADER, supervisor.csrf).send({}).expect(400);
    expect(res.body.error.message).toMatch(/distribution list/);
    expect((await Run.findByPk(Number(runId)))?.state).toBe('in-review');
  });
});
