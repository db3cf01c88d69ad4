// The role matrix, enforced: every route the matrix names, called as every role, as a machine token and
// unauthenticated; the expected answer is read from the matrix itself (role-matrix.yaml), so the sweep
// covers every feature's routes as they are added. Path parameters get ids that do not exist: a 404 or
// a 400 still shows that the caller got past requireRole().
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { useTestDatabase, type TestDatabase } from '../../../test/support/test-database.js';
import { createApp } from '../app.js';
import { anonymousAgent, createTestMachineToken, createTestPerson, CSRF_HEADER, signedInAgent, type TestAgent } from './auth-test-support.js';
import { ROLES } from './principal.js';
import { roleMatrix, type Grantee } from './role-matrix.js';
import { registeredRoutes } from './route-inventory.js';
import { appOver } from '../../../test/support/test-app.js';

type Caller = { name: Grantee | 'unauthenticated'; send(method: string, url: string): request.Test };

const UNKNOWN_ID = '999999999';

/** Sign-out ends the caller's session, so it runs after every other route. */
const endsSession = (key: string): boolean => key === 'DELETE /api/session';
const routeKeys = Object.keys(roleMatrix).sort((a, b) => Number(endsSession(a)) - Number(endsSession(b)));

function urlOf(path: string): string {
  return path.replace(/:\w+/g, UNKNOWN_ID).replace(/\*\w+/g, 'x');
}

function viaAgent(name: Caller['name'], agent: TestAgent, csrf: string): Caller {
  return { name, send: (method, url) => agent[method.toLowerCase() as 'get'](url).set(CSRF_HEADER, csrf) };
}

function expectedFor(grantees: readonly Grantee[], caller: Caller['name']): 'allowed' | 401 | 403 {
  if (grantees.includes('public')) return 'allowed';
  if (caller === 'unauthenticated') return 401;
  return grantees.includes(caller) ? 'allowed' : 403;
}

describe('the role matrix on the real app', () => {
  let db: TestDatabase;
  let app: ReturnType<typeof createApp>;
  const callers: Caller[] = [];

  useTestDatabase(async (made) => {
    db = made;
    app = appOver(db);
    for (const role of ROLES) {
      const { agent, csrf } = await signedInAgent(app, await createTestPerson(role));
      callers.push(viaAgent(role, agent, csrf));
    }
    const token = await createTestMachineToken('matrix-sweep');
    callers.push({ name: 'machine', send: (method, url) => request(app)[method.toLowerCase() as 'get'](url).set('Authorization', `Bearer ${token.value}`) });
    const anonymous = await anonymousAgent(app);
    callers.push(viaAgent('unauthenticated', anonymous.agent, anonymous.csrf));
  });

  it('lists every route registered in the app', () => {
    const missing = registeredRoutes(app).filter((key) => key.includes(' /api/') && !roleMatrix[key]);
    expect(missing).toEqual([]);
  });

  it('names only routes the app registers', () => {
    const registered = new Set(registeredRoutes(app));
    expect(Object.keys(roleMatrix).filter((key) => !registered.has(key))).toEqual([]);
  });

  it.each(routeKeys)('%s answers every caller as the matrix says', async (key) => {
    const [method = '', path = ''] = key.split(' ');
    const grantees = roleMatrix[key] ?? [];
    const seen: string[] = [];
    const wanted: string[] = [];
    for (const caller of callers) {
      const res = await caller.send(method, urlOf(path)).send(method === 'GET' ? undefined : {});
      const expected = expectedFor(grantees, caller.name);
      const verdict = expected === 'allowed' ? ([401, 403].includes(res.status) || res.status >= 500 ? `denied ${res.status}` : 'allowed') : res.status;
      seen.push(`${caller.name}: ${String(verdict)}`);
      wanted.push(`${caller.name}: ${String(expected)}`);
    }
    expect(seen).toEqual(wanted);
  });
});
