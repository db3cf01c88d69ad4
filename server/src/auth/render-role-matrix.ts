// `node --import tsx server/src/auth/render-role-matrix.ts`: writes docs/roles.md from the role matrix.
import { writeFileSync } from 'node:fs';
import path from 'node:path';
import { projectRoot } from '../config.js';
import { DEMO_PEOPLE } from '../people/demo-people.js';
import { roleMatrix } from './role-matrix.js';
import { renderRoleMatrixDoc } from './role-matrix-doc.js';

export const ROLES_DOC = path.join(projectRoot, 'docs/roles.md');

writeFileSync(ROLES_DOC, renderRoleMatrixDoc(roleMatrix, DEMO_PEOPLE));
process.stderr.write(`wrote ${path.relative(projectRoot, ROLES_DOC)}\n`);
