import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent } from '../audit/audit-event.model.js';
import { createTestMachineToken, CSRF_HEADER } from '../auth/auth-test-support.js';
import { User } from '../people/user.model.js';
import { sha256Hex } from '../contracts/result-fingerprint.js';
import { specText, startApiFixture, type ApiFixture, type SignedIn } from '../runs/runs-test-support.js';

describe('specs on the server', () => {
  let fixture: ApiFixture;
  let analyst: SignedIn;
  const push = (text: string, file = 'core.yaml') => analyst.agent.post('/api/specs').set(CSRF_HEADER, analyst.csrf).send({ text, file });

  beforeAll(async () => {
    fixture = await startApiFixture();
    analyst = await fixture.as('analyst');
  });
  afterAll(async () => {
    await fixture.close();
  });

  it('makes revision 1 on the first push, with the sha256 of the text and the author', async () => {
    const text = specText('spec-one');
    const res = await push(text).expect(201);
    expect(res.body).toMatchObject({ name: 'spec-one', created: true, revision: { number: 1, sha256: sha256Hex(text), authorName: analyst.person.userName, authorKind: 'person' } });
    expect(await AuditEvent.count({ where: { action: 'spec.push' } })).toBeGreaterThanOrEqual(1);
  });

  it('makes no new revision when the pushed text is unchanged', async () => {
    const text = specText('spec-two');
    await push(text).expect(201);
    const again = await push(text).expect(200);
    expect(again.body).toMatchObject({ created: false, revision: { number: 1 } });
    const revisions = await analyst.agent.get('/api/specs/spec-two/revisions').expect(200);
    expect(revisions.body.items).toHaveLength(1);
  });

  it('numbers a changed text as the next revision and diffs it against the one before', async () => {
    await push(specText('spec-three', { window: 60 })).expect(201);
    await push(specText('spec-three', { window: 48 })).expect(201);
    const detail = await analyst.agent.get('/api/specs/spec-three').expect(200);
    expect(detail.body).toMatchObject({ name: 'spec-three', revisionCount: 2, current: { number: 2 } });
    expect(detail.body.current.spec.sampling.window).toBe(48);
    const diff = await analyst.agent.get('/api/specs/spec-three/revisions/2/diff').expect(200);
    expect(diff.body).toMatchObject({ from: 1, to: 2 });
    expect(diff.body.diff).toContain('-  window: 60');
    expect(diff.body.diff).toContain('+  window: 48');
    expect(diff.body.diff).toContain('--- spec-three@1');
    const first = await analyst.agent.get('/api/specs/spec-three/revisions/1').expect(200);
    expect(first.body.text).toBe(specText('spec-three', { window: 60 }));
  });

  it('refuses an invalid spec with SPEC_INVALID naming the file, line, column and reason', async () => {
    const text = specText('spec-bad').replace('  frequency: monthly', '  frequency: montly');
    const line = text.split('\n').findIndex((l) => l.includes('montly')) + 1;
    const res = await push(text, 'bad.yaml').expect(400);
    expect(res.body.error.code).toBe('SPEC_INVALID');
    expect(res.body.error.details.problems[0]).toMatchObject({ file: 'bad.yaml', line, column: 14, path: 'sampling.frequency' });
    expect(res.body.error.message).toMatch(new RegExp(`^bad\\.yaml:${line}:14 sampling\\.frequency: `));
    await analyst.agent.get('/api/specs/spec-bad').expect(404);
  });

  it('lets a machine push (clino spec push) but not a viewer', async () => {
    await request(fixture.app).post('/api/specs').set('Authorization', fixture.machine).send({ text: specText('spec-machine') }).expect(201);
    const viewer = await fixture.as('viewer');
    await viewer.agent.post('/api/specs').set(CSRF_HEADER, viewer.csrf).send({ text: specText('spec-viewer') }).expect(403);
  });

  it('authors a push through a token with an owner as that person, the audit event naming token and person', async () => {
    const token = await createTestMachineToken('analyst-pusher', analyst.person.id);
    const res = await request(fixture.app).post('/api/specs').set('Authorization', `Bearer ${token.value}`).send({ text: specText('spec-owned') }).expect(201);
    expect(res.body.revision).toMatchObject({ authorKind: 'person', authorName: analyst.person.userName });
    const event = await AuditEvent.findOne({ where: { action: 'spec.push', entityType: 'spec-revision' }, order: [['id', 'DESC']] });
    expect(event).toMatchObject({ actorKind: 'machine', actorId: token.id, actorName: 'analyst-pusher' });
    expect(event?.afterState).toMatchObject({ name: 'spec-owned', author: { kind: 'person', id: analyst.person.id, name: analyst.person.userName } });
  });

  it('records the same text again as a new revision when a person pushes what an ownerless machine pushed, and only then', async () => {
    const text = specText('spec-attested');
    const byMachine = await request(fixture.app).post('/api/specs').set('Authorization', fixture.machine).send({ text }).expect(201);
    expect(byMachine.body.revision).toMatchObject({ number: 1, authorKind: 'machine', authorName: 'test-worker' });
    const again = await request(fixture.app).post('/api/specs').set('Authorization', fixture.machine).send({ text }).expect(200);
    expect(again.body).toMatchObject({ created: false, revision: { number: 1 } });
    const byPerson = await push(text).expect(201);
    expect(byPerson.body.revision).toMatchObject({ number: 2, sha256: sha256Hex(text), authorKind: 'person', authorName: analyst.person.userName });
    const machineAfter = await request(fixture.app).post('/api/specs').set('Authorization', fixture.machine).send({ text }).expect(200);
    expect(machineAfter.body).toMatchObject({ created: false, revision: { number: 2, authorKind: 'person' } });
  });

  it('refuses FORBIDDEN a push through a token whose owner\'s role may no longer push specs', async () => {
    const owner = await fixture.as('analyst');
    const token = await createTestMachineToken('demoted-pusher', owner.person.id);
    await User.update({ role: 'viewer' }, { where: { id: owner.person.id } });
    const res = await request(fixture.app).post('/api/specs').set('Authorization', `Bearer ${token.value}`).send({ text: specText('spec-demoted') }).expect(403);
    expect(res.body.error).toMatchObject({ code: 'FORBIDDEN', message: expect.stringContaining('whose role (viewer) may not push specs') });
  });

  it('lists specs with their latest revision', async () => {
    const res = await analyst.agent.get('/api/specs').expect(200);
    const names = (res.body.items as { name: string }[]).map((s) => s.name);
    expect(names).toEqual([...names].sort());
    expect(names).toEqual(expect.arrayContaining(['spec-one', 'spec-three']));
  });
});
