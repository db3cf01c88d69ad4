import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { ROLES } from '../../server/src/auth/principal.js';
import { roleMatrix } from '../../server/src/auth/role-matrix.js';

// The console hides areas a role may not open with a small table of its own
// (console/src/app/core/auth/area-roles.ts); the server's committed role matrix decides. This keeps
// the two in step: each area's table entry equals the roles the matrix gives its list route.
const AREA_LIST_ROUTE: Record<string, string> = {
  runs: 'GET /api/runs',
  specs: 'GET /api/specs',
  uploads: 'GET /api/uploads',
  releases: 'GET /api/releases',
  mailroom: 'GET /api/mail',
  people: 'GET /api/people',
  audit: 'GET /api/audit',
};

function consoleAreaTable(): Record<string, string[]> {
  const text = readFileSync(new URL('../../console/src/app/core/auth/area-roles.ts', import.meta.url), 'utf8');
  const block = /const AREA_ROLES[^=]*=\s*\{([^}]*)\}/.exec(text);
  if (!block) throw new Error('AREA_ROLES not found in area-roles.ts');
  const table: Record<string, string[]> = {};
  for (const [, area, roles] of block[1]!.matchAll(/(\w+):\s*\[([^\]]*)\]/g)) {
    table[area!] = [...roles!.matchAll(/'(\w+)'/g)].map((m) => m[1]!);
  }
  return table;
}

describe('the console area table and the role matrix', () => {
  const table = consoleAreaTable();

  it('lists exactly the areas whose list route some roles may not call', () => {
    const restricted = Object.entries(AREA_LIST_ROUTE)
      .filter(([, route]) => ROLES.some((role) => !(roleMatrix[route] ?? []).includes(role)))
      .map(([area]) => area);
    expect(Object.keys(table).sort()).toEqual(restricted.sort());
  });

  it.each(Object.entries(AREA_LIST_ROUTE))('gives area %s the people roles of %s', (area, route) => {
    const fromMatrix = (roleMatrix[route] ?? []).filter((g): g is (typeof ROLES)[number] => (ROLES as readonly string[]).includes(g));
    expect([...(table[area] ?? ROLES)].sort()).toEqual([...fromMatrix].sort());
  });
});
