import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { projectRoot } from '../config.js';
import { DEMO_PEOPLE } from '../people/demo-people.js';
import { roleMatrix } from './role-matrix.js';
import { renderRoleMatrixDoc } from './role-matrix-doc.js';

describe('docs/roles.md', () => {
  it('matches the committed role matrix (re-render: node --import tsx server/src/auth/render-role-matrix.ts)', () => {
    const committed = readFileSync(path.join(projectRoot, 'docs/roles.md'), 'utf8');
    expect(committed).toBe(renderRoleMatrixDoc(roleMatrix, DEMO_PEOPLE));
  });

  it('marks a public route open to every column and a restricted one only for its roles', () => {
    const doc = renderRoleMatrixDoc({ 'GET /api/things': ['public'], 'POST /api/things': ['admin', 'machine'] });
    expect(doc).toContain('| `GET /api/things` (public) | yes | yes | yes | yes | yes | yes |');
    expect(doc).toContain('| `POST /api/things` | - | - | - | yes | - | yes |');
  });

  it('groups routes by their area under /api', () => {
    const doc = renderRoleMatrixDoc({ 'GET /api/a/1': ['admin'], 'GET /api/b': ['admin'], 'PATCH /api/a/:id': ['admin'] });
    expect(doc.indexOf('## a')).toBeLessThan(doc.indexOf('PATCH /api/a/:id'));
    expect(doc.indexOf('PATCH /api/a/:id')).toBeLessThan(doc.indexOf('## b'));
  });
});
