// Helpers for API tests (imported by *.test.ts files only): people, machine tokens and signed-in agents.
import type { Express } from 'express';
import request from 'supertest';
import { MachineToken } from '../people/machine-token.model.js';
import { User } from '../people/user.model.js';
import { CSRF_COOKIE, CSRF_HEADER } from './csrf.js';
import { machineTokenSha256, newMachineTokenValue } from './machine-tokens.js';
import { hashPassword } from './passwords.js';
import type { Role } from './principal.js';

/** The lowest bcrypt cost bcryptjs accepts: test people are made fast; sign-in still runs the real compare. */
const TEST_HASH_ROUNDS = 4;

export interface TestPerson {
  id: number;
  userName: string;
  password: string;
  role: Role;
}

let serial = 0;

/** A person with the role, stored directly (initModels must have run, e.g. through createApp). */
export async function createTestPerson(role: Role, overrides: { userName?: string; password?: string; active?: boolean } = {}): Promise<TestPerson> {
  serial += 1;
  const userName = overrides.userName ?? `test.${role}.${serial}`;
  const password = overrides.password ?? `test-${role}-password-${serial}`;
  const user = await User.create({
    userName,
    displayName: `Test ${role} ${serial}`,
    email: `${userName}@test.invalid`,
    role,
    passwordHash: await hashPassword(password, TEST_HASH_ROUNDS),
    active: overrides.active ?? true,
  });
  return { id: user.id, userName, password, role };
}

/** A machine token stored by its hash (with an owner when given); returns the plain value to send as `Authorization: Bearer`. */
export async function createTestMachineToken(name = 'test-machine', ownerUserId: number | null = null): Promise<{ id: number; value: string }> {
  const value = newMachineTokenValue();
  const token = await MachineToken.create({ name, tokenSha256: machineTokenSha256(value), createdByUserId: null, ownerUserId, lastUsedAt: null, revokedAt: null });
  return { id: token.id, value };
}

export type TestAgent = ReturnType<typeof request.agent>;

/** The value of the CSRF cookie the agent holds (Angular would copy it into the X-XSRF-TOKEN header). */
export function csrfCookieOf(agent: TestAgent): string {
  const cookie = agent.jar.getCookie(CSRF_COOKIE, { domain: '127.0.0.1', path: '/', secure: false, script: true });
  if (!cookie) throw new Error('the agent holds no XSRF-TOKEN cookie: call GET /api/session first');
  return cookie.value;
}

/** An agent that has fetched the CSRF cookie, as the console does on start. */
export async function anonymousAgent(app: Express): Promise<{ agent: TestAgent; csrf: string }> {
  const agent = request.agent(app);
  await agent.get('/api/session').expect(200);
  return { agent, csrf: csrfCookieOf(agent) };
}

/**
 * A signed-in agent and its CSRF token: send writes as `agent.post(url).set(CSRF_HEADER, csrf)`.
 * Signs in through the real route (session cookie, passport, bcrypt compare).
 */
export async function signedInAgent(app: Express, person: Pick<TestPerson, 'userName' | 'password'>): Promise<{ agent: TestAgent; csrf: string }> {
  const { agent, csrf } = await anonymousAgent(app);
  await agent.post('/api/session').set(CSRF_HEADER, csrf).send({ userName: person.userName, password: person.password }).expect(200);
  return { agent, csrf: csrfCookieOf(agent) };
}

export { CSRF_HEADER };
