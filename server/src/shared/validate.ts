import type { Request, RequestHandler } from 'express';
import type { z } from 'zod';
import { ValidationError } from './errors.js';

/** Zod schemas for the parts of a request a route reads; each part left out is not checked. */
export interface RequestSchemas {
  params?: z.ZodType;
  query?: z.ZodType;
  body?: z.ZodType;
}

type Part<S, K extends keyof RequestSchemas> = S extends Record<K, z.ZodType> ? z.output<S[K]> : undefined;

/** The parsed request parts: typed by the schemas given to `validate`. */
export interface Parsed<S extends RequestSchemas> {
  params: Part<S, 'params'>;
  query: Part<S, 'query'>;
  body: Part<S, 'body'>;
}

/** A validating middleware that also hands the handler the parsed, typed parts: `v.of(req)`. */
export type Validator<S extends RequestSchemas> = RequestHandler & { of(req: Request): Parsed<S> };

export interface ValidationIssue {
  /** Which part of the request: params, query or body. */
  in: keyof RequestSchemas;
  /** Where inside it, e.g. `results.3.record.beta`. */
  path: string;
  message: string;
}

/**
 * Checks params, query and body against zod schemas before the handler runs. A failure answers
 * VALIDATION_FAILED with every issue (part, path, reason); the handler gets the parsed values
 * through `of(req)` (Express 5's `req.query` is read-only, so parsed values are kept beside it).
 */
export function validate<S extends RequestSchemas>(schemas: S): Validator<S> {
  const parsedByRequest = new WeakMap<Request, Parsed<S>>();
  const middleware: RequestHandler = (req, _res, next) => {
    const issues: ValidationIssue[] = [];
    const parsed: Record<keyof RequestSchemas, unknown> = { params: undefined, query: undefined, body: undefined };
    for (const part of ['params', 'query', 'body'] as const) {
      const schema = schemas[part];
      if (!schema) continue;
      const result = schema.safeParse(req[part] ?? (part === 'body' ? undefined : {}));
      if (result.success) parsed[part] = result.data;
      else for (const issue of result.error.issues) issues.push({ in: part, path: issue.path.join('.'), message: issue.message });
    }
    if (issues.length > 0) {
      const first = issues[0] as ValidationIssue;
      next(new ValidationError(`Invalid request ${first.in}${first.path ? ` at ${first.path}` : ''}: ${first.message}`, { issues: issues.slice(0, 50) }));
      return;
    }
    parsedByRequest.set(req, parsed as Parsed<S>);
    next();
  };
  return Object.assign(middleware, {
    of(req: Request): Parsed<S> {
      const parsed = parsedByRequest.get(req);
      if (!parsed) throw new Error('validate(): the handler ran without its validator');
      return parsed;
    },
  });
}
