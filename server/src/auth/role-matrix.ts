import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { parse } from 'yaml';
import { z } from 'zod';
import { ROLES } from './principal.js';

const grantee = z.enum([...ROLES, 'machine', 'public']);
export type Grantee = z.infer<typeof grantee>;

const matrixSchema = z.object({ routes: z.record(z.string().regex(/^(GET|POST|PUT|PATCH|DELETE) \/api\//), z.array(grantee)) });

const file = path.join(path.dirname(fileURLToPath(import.meta.url)), 'role-matrix.yaml');

/** The committed role matrix: "METHOD /api/path/:param" → who may call it. */
export const roleMatrix: Readonly<Record<string, readonly Grantee[]>> = matrixSchema.parse(parse(readFileSync(file, 'utf8'))).routes;
