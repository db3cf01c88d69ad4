// CSRF with Angular's defaults: the XSRF-TOKEN cookie is copied into the X-XSRF-TOKEN header, and the
// server compares it with the copy it keeps in the session (double submit bound to the session; OWASP
// Cross-Site Request Forgery Prevention Cheat Sheet, "Signed double-submit cookie" [memory]).
import { describe, expect, it } from 'vitest';
import { useTestDatabase, type TestDatabase } from '../../../test/support/test-database.js';
import { createApp } from '../app.js';
import { anonymousAgent, createTestPerson, CSRF_HEADER, signedInAgent, type TestPerson } from './auth-test-support.js';
import { appOver } from '../../../test/support/test-app.js';

describe('CSRF protection of cookie-authenticated writes', () => {
  let db: TestDatabase;
  let app: ReturnType<typeof createApp>;
  let admin: TestPerson;
  const body = () => ({ userName: `csrf.probe.${Math.random().toString(36).slice(2, 8)}`, displayName: 'Probe', email: 'probe@test.invalid', role: 'viewer', password: 'probe-password-1' });
  useTestDatabase(async (made) => {
    db = made;
    app = appOver(db);
    admin = await createTestPerson('admin');
  });

  it('rejects a signed-in write without the X-XSRF-TOKEN header', async () => {
    const { agent } = await signedInAgent(app, admin);
    const res = await agent.post('/api/people').send(body()).expect(403);
    expect(res.body.error.code).toBe('CSRF_REJECTED');
  });

  it('rejects a signed-in write whose header does not match the session token', async () => {
    const { agent, csrf } = await signedInAgent(app, admin);
    const res = await agent.post('/api/people').set(CSRF_HEADER, `${csrf.slice(0, -2)}xx`).send(body()).expect(403);
    expect(res.body.error.code).toBe('CSRF_REJECTED');
  });

  it("rejects another session's token: the token is bound to its session", async () => {
    const mine = await signedInAgent(app, admin);
    const theirs = await signedInAgent(app, admin);
    const res = await mine.agent.post('/api/people').set(CSRF_HEADER, theirs.csrf).send(body()).expect(403);
    expect(res.body.error.code).toBe('CSRF_REJECTED');
  });

  it('accepts a signed-in write with the matching header', async () => {
    const { agent, csrf } = await signedInAgent(app, admin);
    await agent.post('/api/people').set(CSRF_HEADER, csrf).send(body()).expect(201);
  });

  it('lets reads through without the header', async () => {
    const { agent } = await signedInAgent(app, admin);
    await agent.get('/api/people').expect(200);
  });

  it('rejects a sign-in without the header (login CSRF)', async () => {
    const { agent } = await anonymousAgent(app);
    const res = await agent.post('/api/session').send({ userName: admin.userName, password: admin.password }).expect(403);
    expect(res.body.error.code).toBe('CSRF_REJECTED');
  });

  it('gives a new token at sign-in and refuses the one from before', async () => {
    const { agent, csrf: before } = await anonymousAgent(app);
    await agent.post('/api/session').set(CSRF_HEADER, before).send({ userName: admin.userName, password: admin.password }).expect(200);
    const res = await agent.post('/api/people').set(CSRF_HEADER, before).send(body()).expect(403);
    expect(res.body.error.code).toBe('CSRF_REJECTED');
  });
});
