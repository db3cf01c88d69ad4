/**
 * The person `GET /api/session` and `POST /api/session` answer with. The server declares this
 * answer (`SessionDto`) in server/src/auth/session.schemas.ts, outside `contracts/`, so the console
 * repeats its shape here; move it to an import from `@contracts/` once the session DTO lives there.
 */
export const ROLES = ['ops', 'analyst', 'supervisor', 'admin', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

export interface SessionPerson {
  readonly kind: 'person';
  readonly id: number;
  readonly userName: string;
  readonly displayName: string;
  readonly role: Role;
}

/** What people read in the toolbar for each role. */
export const ROLE_LABELS: Readonly<Record<Role, string>> = {
  ops: 'Ops',
  analyst: 'Analyst',
  supervisor: 'Supervisor',
  admin: 'Admin',
  viewer: 'Viewer',
};

function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (ROLES as readonly string[]).includes(value);
}

function isPerson(value: unknown): value is SessionPerson {
  return (
    typeof value === 'object' &&
    value !== null &&
    'kind' in value &&
    value.kind === 'person' &&
    'id' in value &&
    typeof value.id === 'number' &&
    'userName' in value &&
    typeof value.userName === 'string' &&
    'displayName' in value &&
    typeof value.displayName === 'string' &&
    'role' in value &&
    isRole(value.role)
  );
}

/**
 * The signed-in person in a session answer (`{ principal: … }`), or null when nobody is signed in.
 * A machine principal is not a person: the console only ever shows people.
 */
export function personOf(answer: unknown): SessionPerson | null {
  if (typeof answer !== 'object' || answer === null || !('principal' in answer)) {
    return null;
  }
  const principal: unknown = answer.principal;
  if (!isPerson(principal)) {
    return null;
  }
  const { kind, id, userName, displayName, role } = principal;
  return { kind, id, userName, displayName, role };
}
