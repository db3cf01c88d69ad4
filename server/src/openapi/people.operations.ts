import { auditQuerySchema } from '../audit/audit.schemas.js';
import { signInSchema } from '../auth/session.schemas.js';
import { createMachineTokenSchema } from '../people/machine-tokens.schemas.js';
import { createPersonSchema, idParamsSchema, updatePersonSchema } from '../people/people.schemas.js';
import type { ApiOperation } from './api-operation.js';

/** Health, sessions, people, machine tokens and the audit trail. */
export const PEOPLE_OPERATIONS: readonly ApiOperation[] = [
  { method: 'GET', path: '/api/health', tag: 'health', summary: 'Whether the server runs and reaches its database', success: { status: 200, description: '{ status, database } (503 when the database is unreachable)' } },
  { method: 'GET', path: '/api/session', tag: 'session', summary: 'Who is signed in; sets the XSRF-TOKEN cookie', success: { status: 200, description: 'The session' } },
  { method: 'POST', path: '/api/session', tag: 'session', summary: 'Sign in with user name and password', body: signInSchema, success: { status: 200, description: 'The session' }, errors: ['UNAUTHENTICATED', 'TOO_MANY_REQUESTS', 'CSRF_REJECTED'] },
  { method: 'DELETE', path: '/api/session', tag: 'session', summary: 'Sign out', success: { status: 204, description: 'Signed out', produces: 'empty' } },
  { method: 'GET', path: '/api/people', tag: 'people', summary: 'People and their roles', success: { status: 200, description: 'The people' } },
  { method: 'POST', path: '/api/people', tag: 'people', summary: 'Add a person', body: createPersonSchema, success: { status: 201, description: 'The person' } },
  { method: 'PATCH', path: '/api/people/:id', tag: 'people', summary: 'Change a person (role, name, password, active)', params: idParamsSchema, body: updatePersonSchema, success: { status: 200, description: 'The person' } },
  { method: 'GET', path: '/api/machine-tokens', tag: 'people', summary: 'Machine tokens (never their values)', success: { status: 200, description: 'The tokens' } },
  { method: 'POST', path: '/api/machine-tokens', tag: 'people', summary: 'Create a machine token: its value is shown once', body: createMachineTokenSchema, success: { status: 201, description: 'The token with its value' } },
  { method: 'DELETE', path: '/api/machine-tokens/:id', tag: 'people', summary: 'Revoke a machine token', params: idParamsSchema, success: { status: 200, description: 'The revoked token' } },
  { method: 'GET', path: '/api/audit', tag: 'audit', summary: 'The audit trail, filtered and paged', query: auditQuerySchema, success: { status: 200, description: 'A page of audit events' } },
];
