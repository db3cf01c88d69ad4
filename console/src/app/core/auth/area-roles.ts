import { inject } from '@angular/core';
import type { CanMatchFn } from '@angular/router';
import { map } from 'rxjs';
import type { AreaPath } from '../areas';
import { Session } from './session';
import type { Role } from './session-person';

/**
 * The areas that only some roles may open, and those roles. It mirrors the server's role matrix
 * (server/src/auth/role-matrix.yaml: `GET /api/people` admin; `GET /api/audit` supervisor, admin)
 * and only tidies the console: the server enforces the matrix on every request. Areas not listed
 * are open to every role.
 */
const AREA_ROLES: Readonly<Partial<Record<AreaPath, readonly Role[]>>> = {
  people: ['admin'],
  audit: ['supervisor', 'admin'],
};

/** The roles that may open the area, or null when every role may. */
export function rolesForArea(area: AreaPath): readonly Role[] | null {
  return AREA_ROLES[area] ?? null;
}

/** Whether a person with this role (null: nobody signed in) may open the area. */
export function mayOpenArea(role: Role | null, area: AreaPath): boolean {
  const roles = rolesForArea(area);
  return roles === null || (role !== null && roles.includes(role));
}

/**
 * Matches the area's route only for a role that may open it; otherwise the router moves on to the
 * next route with the same path (the console's "not open to your role" page), keeping the address.
 */
export function openToRole(area: AreaPath): CanMatchFn {
  return () =>
    inject(Session)
      .whenKnown()
      .pipe(map((person) => mayOpenArea(person?.role ?? null, area)));
}
