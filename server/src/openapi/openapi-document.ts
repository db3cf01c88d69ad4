import { z } from 'zod';
import { CLI_ONLY_ERROR_CODES, ERROR_CODES } from '../contracts/errors.js';
import { roleMatrix } from '../auth/role-matrix.js';
import type { ApiOperation, Produces } from './api-operation.js';
import { DELIVERY_OPERATIONS } from './delivery.operations.js';
import { PEOPLE_OPERATIONS } from './people.operations.js';
import { RUN_OPERATIONS } from './runs.operations.js';

/** Every documented operation; a test fails when the app registers a route not listed here. */
export const API_OPERATIONS: readonly ApiOperation[] = [...PEOPLE_OPERATIONS, ...RUN_OPERATIONS, ...DELIVERY_OPERATIONS];

type JsonSchema = Record<string, unknown>;

function jsonSchema(schema: z.ZodType): JsonSchema {
  const { $schema: _ignored, ...rest } = z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' }) as JsonSchema;
  return rest;
}

/** `/api/runs/:id` → `/api/runs/{id}` */
export function openApiPath(expressPath: string): string {
  return expressPath.replace(/:(\w+)/g, '{$1}');
}

function parameters(operation: ApiOperation): JsonSchema[] {
  const list: JsonSchema[] = [];
  const add = (schema: z.ZodType | undefined, where: 'path' | 'query'): void => {
    if (!schema) return;
    const object = jsonSchema(schema);
    const properties = (object['properties'] ?? {}) as Record<string, JsonSchema>;
    const required = new Set((object['required'] ?? []) as string[]);
    for (const [name, property] of Object.entries(properties)) {
      const { description, ...rest } = property;
      list.push({ name, in: where, required: where === 'path' || required.has(name), schema: rest, ...(description ? { description } : {}) });
    }
  };
  add(operation.params, 'path');
  add(operation.query, 'query');
  for (const header of operation.headers ?? []) list.push({ name: header.name, in: 'header', required: header.required, description: header.description, schema: { type: 'string', maxLength: 200 } });
  return list;
}

function requestBody(body: ApiOperation['body']): JsonSchema | undefined {
  if (body === undefined) return undefined;
  if (body === 'bytes') return { required: true, content: { 'application/octet-stream': { schema: { type: 'string', format: 'binary' } } } };
  if (body === 'multipart') {
    const form = { type: 'object', required: ['file'], properties: { file: { type: 'string', format: 'binary' }, spec: { type: 'string', description: 'Name of the spec the file is for (optional).' } } };
    return { required: true, content: { 'multipart/form-data': { schema: form } } };
  }
  return { required: true, content: { 'application/json': { schema: jsonSchema(body) } } };
}

const CONTENT: Record<Produces, JsonSchema | undefined> = {
  json: { 'application/json': { schema: { type: 'object' } } },
  csv: { 'text/csv': { schema: { type: 'string' } } },
  bytes: { 'application/octet-stream': { schema: { type: 'string', format: 'binary' } } },
  empty: undefined,
};

function responses(operation: ApiOperation): JsonSchema {
  const content = CONTENT[operation.success.produces ?? 'json'];
  const error = (description: string): JsonSchema => ({ description, content: { 'application/json': { schema: { $ref: '#/components/schemas/ErrorEnvelope' } } } });
  const extra = operation.errors?.length ? ` Codes: ${operation.errors.join(', ')}.` : '';
  return {
    [String(operation.success.status)]: { description: operation.success.description, ...(content ? { content } : {}) },
    '4XX': error(`The error envelope: VALIDATION_FAILED, UNAUTHENTICATED, FORBIDDEN, NOT_FOUND and the operation's own codes.${extra}`),
    '5XX': error('INTERNAL: an unexpected error, logged with the request id.'),
  };
}

function operationObject(operation: ApiOperation): JsonSchema {
  const key = `${operation.method} ${operation.path}`;
  const roles = roleMatrix[key] ?? [];
  const isPublic = roles.includes('public');
  return {
    operationId: `${operation.method.toLowerCase()}${operation.path.replace(/^\/api/, '').replace(/[/:-](\w)/g, (_m, c: string) => c.toUpperCase())}`,
    tags: [operation.tag],
    summary: operation.summary,
    description: `${operation.description ? `${operation.description}\n\n` : ''}Allowed: ${roles.join(', ') || 'nobody'}.`,
    'x-roles': roles,
    ...(isPublic ? { security: [] } : {}),
    parameters: parameters(operation),
    ...(operation.body !== undefined ? { requestBody: requestBody(operation.body) } : {}),
    responses: responses(operation),
  };
}

/** The OpenAPI 3.1 document of the whole API. */
export function buildOpenApiDocument(version: string): JsonSchema {
  const paths: Record<string, Record<string, JsonSchema>> = {};
  for (const operation of API_OPERATIONS) {
    const path = openApiPath(operation.path);
    paths[path] = { ...paths[path], [operation.method.toLowerCase()]: operationObject(operation) };
  }
  // The server's answers never carry the codes only the CLI raises.
  const serverCodes = ERROR_CODES.filter((code) => !(CLI_ONLY_ERROR_CODES as readonly string[]).includes(code));
  const errorEnvelope = {
    type: 'object',
    required: ['error'],
    properties: { error: { type: 'object', required: ['code', 'message'], properties: { code: { type: 'string', enum: serverCodes }, message: { type: 'string' }, details: {} } } },
  };
  return {
    openapi: '3.1.0',
    info: { title: 'Clinometer API', version, description: 'Betas, CAPM expected returns and WACC inputs: runs, ingest, review, release. Roles per operation in x-roles (docs/roles.md).' },
    servers: [{ url: '/' }],
    security: [{ session: [] }, { machineToken: [] }],
    components: {
      securitySchemes: {
        session: { type: 'apiKey', in: 'cookie', name: 'clino.sid', description: 'A person signed in through POST /api/session; writes also need the X-XSRF-TOKEN header.' },
        machineToken: { type: 'http', scheme: 'bearer', description: 'A machine token of the clino CLI.' },
      },
      schemas: { ErrorEnvelope: errorEnvelope },
    },
    paths,
  };
}
