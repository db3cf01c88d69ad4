import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent } from '../audit/audit-event.model.js';
import { CSRF_HEADER } from '../auth/auth-test-support.js';
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

  it('lists specs with their latest revision', async () => {
    const res = await analyst.agent.get('/api/specs').expect(200);
    const names = (res.body.items as { name: string }[]).map((s) => s.name);
    expect(names).toEqual([...names].sort());
    expect(names).toEqual(expect.arrayContaining(['spec-one', 'spec-three']));
  });
});
