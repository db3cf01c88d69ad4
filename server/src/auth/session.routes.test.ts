import { QueryTypes } from 'sequelize';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { useTestDatabase, type TestDatabase } from '../../../test/support/test-database.js';
import { createApp } from '../app.js';
import { createLogger } from '../shared/logger.js';
import { anonymousAgent, createTestPerson, CSRF_HEADER, signedInAgent, type TestPerson } from './auth-test-support.js';
import { appOver } from '../../../test/support/test-app.js';

function setCookie(res: request.Response, name: string): string | undefined {
  const header = res.headers['set-cookie'] as unknown;
  const cookies = Array.isArray(header) ? header.filter((c): c is string => typeof c === 'string') : [];
  return cookies.find((c) => c.startsWith(`${name}=`));
}

function cookieValue(line: string | undefined): string | undefined {
  return line?.split(';')[0]?.split('=').slice(1).join('=');
}

describe('signing in and out', () => {
  let db: TestDatabase;
  let app: ReturnType<typeof createApp>;
  let analyst: TestPerson;
  useTestDatabase(async (made) => {
    db = made;
    app = appOver(db);
    analyst = await createTestPerson('analyst');
  });

  it('signs a person in with the right password and then answers who they are', async () => {
    const { agent } = await signedInAgent(app, analyst);
    const res = await agent.get('/api/session').expect(200);
    expect(res.body.principal).toMatchObject({ kind: 'person', id: analyst.id, userName: analyst.userName, role: 'analyst' });
  });

  it('refuses a wrong password with UNAUTHENTICATED and the same message as for an unknown user name', async () => {
    // OWASP Authentication Cheat Sheet: one generic answer, so user names cannot be probed [memory].
    const { agent, csrf } = await anonymousAgent(app);
    const wrong = await agent.post('/api/session').set(CSRF_HEADER, csrf).send({ userName: analyst.userName, password: 'not-the-password' }).expect(401);
    const unknown = await agent.post('/api/session').set(CSRF_HEADER, csrf).send({ userName: 'nobody.here', password: 'not-the-password' }).expect(401);
    expect(wrong.body.error.code).toBe('UNAUTHENTICATED');
    expect(unknown.body.error).toEqual(wrong.body.error);
  });

  it('refuses an inactive person even with the right password', async () => {
    const inactive = await createTestPerson('ops', { active: false });
    const { agent, csrf } = await anonymousAgent(app);
    await agent.post('/api/session').set(CSRF_HEADER, csrf).send({ userName: inactive.userName, password: inactive.password }).expect(401);
  });

  it('answers an anonymous caller with no principal', async () => {
    const res = await request(app).get('/api/session').expect(200);
    expect(res.body).toEqual({ principal: null });
  });

  it('issues a new session id at sign-in, so an id known before sign-in is useless after it', async () => {
    // OWASP Session Management Cheat Sheet: renew the session id after authentication [memory].
    const agent = request.agent(app);
    const before = await agent.get('/api/session').expect(200);
    const csrf = cookieValue(setCookie(before, 'XSRF-TOKEN')) ?? '';
    const signIn = await agent.post('/api/session').set(CSRF_HEADER, csrf).send({ userName: analyst.userName, password: analyst.password }).expect(200);
    const idBefore = cookieValue(setCookie(before, 'clino.sid'));
    const idAfter = cookieValue(setCookie(signIn, 'clino.sid'));
    expect(idBefore).toBeTruthy();
    expect(idAfter).toBeTruthy();
    expect(idAfter).not.toBe(idBefore);
  });

  it('keeps the session in the MariaDB sessions table with the person id', async () => {
    await signedInAgent(app, analyst);
    const rows = await db.sequelize.query<{ userId: string }>(
      "SELECT JSON_VALUE(data, '$.passport.user') AS userId FROM sessions WHERE JSON_VALUE(data, '$.passport.user') = ?",
      { replacements: [String(analyst.id)], type: QueryTypes.SELECT },
    );
    expect(rows.length).toBeGreaterThan(0);
  });

  it('signs out: the session row is gone and the next call is anonymous', async () => {
    const person = await createTestPerson('viewer');
    const { agent, csrf } = await signedInAgent(app, person);
    await agent.delete('/api/session').set(CSRF_HEADER, csrf).expect(204);
    expect((await agent.get('/api/session').expect(200)).body).toEqual({ principal: null });
    const rows = await db.sequelize.query("SELECT sid FROM sessions WHERE JSON_VALUE(data, '$.passport.user') = ?", {
      replacements: [String(person.id)],
      type: QueryTypes.SELECT,
    });
    expect(rows).toEqual([]);
  });

  it('audits a sign-in, a failed sign-in and a sign-out', async () => {
    const person = await createTestPerson('ops');
    const { agent, csrf } = await signedInAgent(app, person);
    await agent.post('/api/session').set(CSRF_HEADER, csrf).send({ userName: person.userName, password: 'wrong-password-1' }).expect(401);
    await agent.delete('/api/session').set(CSRF_HEADER, csrf).expect(204);
    const rows = await db.sequelize.query<{ action: string; actor_kind: string }>(
      'SELECT action, actor_kind FROM audit_events WHERE actor_name = ? ORDER BY id',
      { replacements: [person.userName], type: QueryTypes.SELECT },
    );
    expect(rows.map((r) => `${r.actor_kind} ${r.action}`)).toEqual(['person session.sign-in', 'anonymous session.sign-in-failed', 'person session.sign-out']);
  });
});

describe('session cookie flags', () => {
  let db: TestDatabase;
  let person: TestPerson;
  useTestDatabase(async (made) => {
    db = made;
    appOver(db);
    person = await createTestPerson('supervisor');
  });

  async function signInCookies(secureCookies: boolean, forwardedProto?: string): Promise<{ session: string; csrf: string }> {
    const settings = { ...db.settings, server: { ...db.settings.server, secureCookies } };
    const app = createApp({ settings, sequelize: db.sequelize, logger: createLogger('silent') });
    // Cookies are carried by hand: a cookie jar would (rightly) not send Secure cookies over plain HTTP.
    const first = await request(app).get('/api/session').set('X-Forwarded-Proto', forwardedProto ?? 'http').expect(200);
    const csrf = cookieValue(setCookie(first, 'XSRF-TOKEN')) ?? '';
    const sessionId = cookieValue(setCookie(first, 'clino.sid')) ?? '';
    const res = await request(app)
      .post('/api/session')
      .set('X-Forwarded-Proto', forwardedProto ?? 'http')
      .set('Cookie', `clino.sid=${sessionId}; XSRF-TOKEN=${csrf}`)
      .set(CSRF_HEADER, csrf)
      .send({ userName: person.userName, password: person.password })
      .expect(200);
    return { session: setCookie(res, 'clino.sid') ?? '', csrf: setCookie(res, 'XSRF-TOKEN') ?? '' };
  }

  it('sets the session cookie HttpOnly and SameSite=Lax, without Secure on loopback HTTP', async () => {
    // RFC 6265 §4.1.2.5–6 (Secure, HttpOnly); SameSite per RFC 6265bis §4.1.2.7 [memory].
    const { session } = await signInCookies(false);
    expect(session).toMatch(/; HttpOnly/);
    expect(session).toMatch(/; SameSite=Lax/);
    expect(session).not.toMatch(/; Secure/);
  });

  it('sets the XSRF-TOKEN cookie readable by scripts (no HttpOnly), SameSite=Lax', async () => {
    // Angular HttpClient's XSRF support reads the XSRF-TOKEN cookie from script (angular.dev, HttpClient security).
    const { csrf } = await signInCookies(false);
    expect(csrf).toMatch(/^XSRF-TOKEN=[\w-]{20,};/);
    expect(csrf).not.toMatch(/HttpOnly/);
    expect(csrf).toMatch(/; SameSite=Lax/);
  });

  it('marks both cookies Secure when the secureCookies setting is on and the request came over HTTPS', async () => {
    const { session, csrf } = await signInCookies(true, 'https');
    expect(session).toMatch(/; Secure/);
    expect(csrf).toMatch(/; Secure/);
  });
});

describe('sign-in throttling', () => {
  let db: TestDatabase;
  let app: ReturnType<typeof createApp>;
  useTestDatabase(async (made) => {
    db = made;
    app = appOver(db);
  });

  it('locks a user name out after the configured number of failures, even for the right password', async () => {
    // OWASP Authentication Cheat Sheet, "Account lockout"; 429 per RFC 6585 §4 [memory].
    const target = await createTestPerson('admin');
    const { agent, csrf } = await anonymousAgent(app);
    const limit = db.settings.auth.loginMaxFailures;
    for (let i = 0; i < limit; i += 1) {
      await agent.post('/api/session').set(CSRF_HEADER, csrf).send({ userName: target.userName, password: `wrong-password-${i}` }).expect(401);
    }
    const locked = await agent.post('/api/session').set(CSRF_HEADER, csrf).send({ userName: target.userName, password: target.password }).expect(429);
    expect(locked.body.error.code).toBe('TOO_MANY_REQUESTS');
  });

  it('keeps other user names from the same address signing in', async () => {
    const other = await createTestPerson('analyst');
    const { agent } = await signedInAgent(app, other);
    expect((await agent.get('/api/session').expect(200)).body.principal.userName).toBe(other.userName);
  });

  it('does not count successful sign-ins', async () => {
    const person = await createTestPerson('viewer');
    const statuses: number[] = [];
    for (let i = 0; i < db.settings.auth.loginMaxFailures + 1; i += 1) {
      const { agent, csrf } = await anonymousAgent(app);
      statuses.push((await agent.post('/api/session').set(CSRF_HEADER, csrf).send({ userName: person.userName, password: person.password })).status);
    }
    expect(statuses).toEqual(new Array<number>(db.settings.auth.loginMaxFailures + 1).fill(200));
  });
});
