import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { firstValueFrom } from 'rxjs';
import { Session } from './session';
import { SESSION_URL } from './session-api';
import type { Role, SessionPerson } from './session-person';

/** An invented person with the given role, as `GET /api/session` names them. Specs only. */
export function personWithRole(role: Role): SessionPerson {
  const people: Readonly<Record<Role, Omit<SessionPerson, 'kind' | 'role'>>> = {
    ops: { id: 11, userName: 'io.ops', displayName: 'Io Farrow' },
    analyst: { id: 12, userName: 'kit.analyst', displayName: 'Kit Lannery' },
    supervisor: { id: 13, userName: 'lu.supervisor', displayName: 'Lu Okonkwe' },
    admin: { id: 14, userName: 'mo.admin', displayName: 'Mo Bellweather' },
    viewer: { id: 15, userName: 'noa.viewer', displayName: 'Noa Pirrel' },
  };
  return { kind: 'person', role, ...people[role] };
}

/**
 * Lets the `Session` learn who is signed in the way the console does at start: one
 * `GET /api/session`, answered here through HttpTestingController. Specs only; needs
 * `provideHttpClientTesting()`.
 */
export async function answerSessionWith(person: SessionPerson | null): Promise<void> {
  const known = firstValueFrom(TestBed.inject(Session).whenKnown());
  TestBed.inject(HttpTestingController)
    .expectOne({ method: 'GET', url: SESSION_URL })
    .flush({ principal: person });
  await known;
}
