import type { AreaPath } from '../areas';
import type { Role } from './session-person';

/**
 * The areas that only some roles may open, and those roles. It mirrors the server's role matrix
 * (server/src/auth/role-matrix.yaml: `GET /api/people` admin; `GET /api/audit` supervisor, admin)
 * and only tidies the navigation: the server enforces the matrix on every request. Areas not
 * listed are open to every role.
 */
const AREA_ROLES: Readonly<Partial<Record<AreaPath, readonly Role[]>>> = {
  people: ['admin'],
  audit: ['supervisor', 'admin'],
};

/** Whether a person with this role (null: nobody signed in) may open the area. */
export function mayOpenArea(role: Role | null, area: AreaPath): boolean {
  const roles = AREA_ROLES[area];
  return roles === undefined || (role !== null && roles.includes(role));
}
