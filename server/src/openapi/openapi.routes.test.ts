import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { registeredRoutes } from '../auth/route-inventory.js';
import { roleMatrix } from '../auth/role-matrix.js';
import { CLI_ONLY_ERROR_CODES } from '../contracts/errors.js';
import { startApiFixture, type ApiFixture } from '../runs/runs-test-support.js';
import { openApiPath } from './openapi-document.js';

type Operation = { parameters: { name: string; in: string }[]; 'x-roles': string[]; responses: Record<string, unknown> };
type Document = {
  openapi: string;
  paths: Record<string, Record<string, Operation>>;
  components: { schemas: { ErrorEnvelope: { properties: { error: { properties: { code: { enum: string[] } } } } } } };
};

describe('GET /api/docs', () => {
  let fixture: ApiFixture;
  let document: Document;
  beforeAll(async () => {
    fixture = await startApiFixture();
    document = (await request(fixture.app).get('/api/docs').set('Authorization', fixture.machine).expect(200)).body as Document;
  });
  afterAll(async () => {
    await fixture.close();
  });

  const documented = (): string[] =>
    Object.entries(document.paths).flatMap(([path, operations]) => Object.keys(operations).map((method) => `${method.toUpperCase()} ${path}`));

  it('is an OpenAPI 3 document', () => {
    expect(document.openapi).toMatch(/^3\.\d+\.\d+$/);
  });

  it('lists the server\'s error codes in the error envelope, and none of those only the CLI raises', () => {
    const codes = document.components.schemas.ErrorEnvelope.properties.error.properties.code.enum;
    expect(codes).toEqual(expect.arrayContaining(['FOUR_EYES', 'SPEC_UNKNOWN', 'VALIDATION_FAILED']));
    expect(codes.filter((code) => (CLI_ONLY_ERROR_CODES as readonly string[]).includes(code))).toEqual([]);
  });

  it('describes every API route the app registers (walking the Express router stack)', () => {
    const routes = registeredRoutes(fixture.app).filter((key) => key.includes(' /api/'));
    expect(routes.length).toBeGreaterThan(40);
    const missing = routes.map((key) => key.replace(/ (\S+)$/, (_m, p: string) => ` ${openApiPath(p)}`)).filter((key) => !documented().includes(key));
    expect(missing).toEqual([]);
  });

  it('describes no route the app lacks', () => {
    const registered = new Set(registeredRoutes(fixture.app).map((key) => key.replace(/ (\S+)$/, (_m, p: string) => ` ${openApiPath(p)}`)));
    expect(documented().filter((key) => !registered.has(key))).toEqual([]);
  });

  it('declares every path parameter and the roles of the matrix on each operation', () => {
    for (const [path, operations] of Object.entries(document.paths)) {
      const names = [...path.matchAll(/\{(\w+)\}/g)].map((m) => m[1]);
      for (const [method, operation] of Object.entries(operations)) {
        const declared = operation.parameters.filter((p) => p.in === 'path').map((p) => p.name);
        expect(declared.sort(), `${method} ${path}`).toEqual([...names].sort());
        const key = `${method.toUpperCase()} ${path.replace(/\{(\w+)\}/g, ':$1')}`;
        expect(operation['x-roles'], key).toEqual(roleMatrix[key]);
      }
    }
  });
});
