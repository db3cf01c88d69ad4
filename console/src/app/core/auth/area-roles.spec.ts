import { AREAS } from '../areas';
import { mayOpenArea } from './area-roles';
import { ROLES } from './session-person';

// The server's role matrix, server/src/auth/role-matrix.yaml: "GET /api/people": [admin] and
// "GET /api/audit": [supervisor, admin]; the other areas' list routes are open to all five roles.
const MAY_OPEN = {
  ops: ['runs', 'specs', 'uploads', 'releases', 'mailroom'],
  analyst: ['runs', 'specs', 'uploads', 'releases', 'mailroom'],
  supervisor: ['runs', 'specs', 'uploads', 'releases', 'mailroom', 'audit'],
  admin: ['runs', 'specs', 'uploads', 'releases', 'mailroom', 'people', 'audit'],
  viewer: ['runs', 'specs', 'uploads', 'releases', 'mailroom'],
} as const;

describe('mayOpenArea', () => {
  it.each(ROLES)('opens to the %s role exactly the areas the role matrix lets it list', (role) => {
    const opened = AREAS.filter((area) => mayOpenArea(role, area.path)).map((area) => area.path);

    expect(opened).toEqual(MAY_OPEN[role]);
  });

  it('opens neither People nor Audit when nobody is signed in', () => {
    expect(mayOpenArea(null, 'people')).toBe(false);
    expect(mayOpenArea(null, 'audit')).toBe(false);
    expect(mayOpenArea(null, 'runs')).toBe(true);
  });
});
