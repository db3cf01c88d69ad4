import { ROLES } from './principal.js';
import type { Grantee } from './role-matrix.js';

const COLUMNS = [...ROLES, 'machine'] as const satisfies readonly Grantee[];

const WHO: Record<(typeof COLUMNS)[number], string> = {
  ops: 'ops engineer: schedules scripted runs, watches failures, holds machine tokens on the hosts',
  analyst: 'analyst: writes and dry-runs run specs, explains results',
  supervisor: 'supervisor: inspects runs, reruns failures, releases reports (never a run of a spec revision they authored)',
  admin: 'admin: people, roles, machine tokens, distribution lists',
  viewer: 'viewer: reads',
  machine: 'machine: the clino CLI with a bearer machine token (`Authorization: Bearer <token>`)',
};

/** The four-eyes rule and how machine tokens take part in it. */
const FOUR_EYES = [
  '',
  '## Four eyes and machine tokens',
  '',
  'Nobody releases a run whose spec text they authored (403 `FOUR_EYES`). The authors of a revision\'s text are',
  'the people who pushed that exact text to the spec: signed in, or through a machine token they own.',
  '',
  '- An admin may give a machine token an **owner** (`ownerUserId` on `POST /api/machine-tokens`): an active person',
  '  whose role may push specs. The token keeps the `machine` column above; a spec it pushes is authored by the',
  '  owner, and the audit event names both the token and the owner. A token whose owner is deactivated is refused',
  '  (401), and a push through a token whose owner\'s role may no longer push specs is refused (403 `FORBIDDEN`).',
  '- A spec pushed by a token **without an owner** (a watcher, a worker) has no author person: nobody can release',
  '  its runs (403 `FOUR_EYES`) until a person pushes the same text. That push records a new revision with the',
  '  same text and sha256, authored by the person (an ownerless machine\'s revision is the only one a same-text',
  '  push repeats); runs already posted on the machine\'s revision then count that person as the author.',
  '- The demo pushes its sample specs as the demo analyst (a person), so the demo supervisors may release their runs.',
];

/** The area of a route: its first path segment after /api (`runs`, `people`, ...). */
function areaOf(route: string): string {
  return /^\S+ \/api\/([^/]+)/.exec(route)?.[1] ?? 'other';
}

function row(route: string, grantees: readonly Grantee[]): string {
  const open = grantees.includes('public');
  const cells = COLUMNS.map((c) => (open || grantees.includes(c) ? 'yes' : '-'));
  return `| \`${route}\`${open ? ' (public)' : ''} | ${cells.join(' | ')} |`;
}

/** A demo account, listed at the end of the page (the demo seed creates them). */
export interface DemoAccount {
  userName: string;
  role: string;
  password: string;
}

function demoSection(accounts: readonly DemoAccount[]): string[] {
  if (accounts.length === 0) return [];
  return [
    '',
    '## Demo sign-ins',
    '',
    'Created by the demo seed (`npm start`) for invented people; demo passwords, never for a real installation.',
    'The demo watcher\'s machine token (`demo-watcher`) takes its value from `CLINO_DEMO_MACHINE_TOKEN` when set.',
    '',
    '| user name | role | password |',
    '| --- | --- | --- |',
    ...accounts.map((a) => `| \`${a.userName}\` | ${a.role} | \`${a.password}\` |`),
  ];
}

/** docs/roles.md, rendered from the role matrix: one table per area, in the order the matrix lists them. */
export function renderRoleMatrixDoc(matrix: Readonly<Record<string, readonly Grantee[]>>, demoAccounts: readonly DemoAccount[] = []): string {
  const areas = new Map<string, string[]>();
  for (const route of Object.keys(matrix)) areas.set(areaOf(route), [...(areas.get(areaOf(route)) ?? []), route]);
  const lines = [
    '# Roles: who may call which API route',
    '',
    '<!-- Rendered from server/src/auth/role-matrix.yaml; do not edit by hand. -->',
    'Rendered from `server/src/auth/role-matrix.yaml` (the one source of truth, enforced by `requireRole()`)',
    'with `node --import tsx server/src/auth/render-role-matrix.ts`; a test fails when this page is out of date.',
    '',
    ...COLUMNS.map((c) => `- **${WHO[c].split(':')[0]}**:${WHO[c].slice(WHO[c].indexOf(':') + 1)}`),
    '- **public**: no sign-in needed (a machine token is still checked when one is sent).',
    '',
    'A person signed in with a role that is not listed gets 403 `FORBIDDEN`; a caller who is not signed in gets',
    '401 `UNAUTHENTICATED`. Writes by a signed-in person also need the `X-XSRF-TOKEN` header (403 `CSRF_REJECTED`).',
    ...FOUR_EYES,
  ];
  for (const [area, routes] of areas) {
    lines.push('', `## ${area}`, '', `| route | ${COLUMNS.join(' | ')} |`, `| --- | ${COLUMNS.map(() => ':-:').join(' | ')} |`);
    for (const route of routes) lines.push(row(route, matrix[route] ?? []));
  }
  lines.push(...demoSection(demoAccounts));
  return `${lines.join('\n')}\n`;
}
