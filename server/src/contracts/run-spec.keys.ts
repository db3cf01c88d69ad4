import { z } from 'zod';
import { runSpecSchema } from './run-spec.schema.js';

/**
 * Every key of the run spec, found by walking the zod schema: its path, description, default and
 * allowed values. docs/run-spec.md is checked against this list, and `clino new-spec` can use it.
 * Paths: `a.b` for nested keys, `*` for a name the analyst chooses (a security code, a premium's
 * name), `[]` for the items of a list.
 */
export interface SpecKey {
  readonly path: string;
  readonly description: string | undefined;
  readonly hasDefault: boolean;
  readonly defaultValue: unknown;
  readonly optional: boolean;
  /** Allowed values of a choice (enum or literal); empty for free values. */
  readonly allowed: readonly string[];
}

interface Unwrapped {
  readonly inner: z.ZodType;
  readonly description: string | undefined;
  readonly hasDefault: boolean;
  readonly defaultValue: unknown;
  readonly optional: boolean;
}

function unwrap(schema: z.ZodType): Unwrapped {
  let current: z.ZodType = schema;
  let description: string | undefined;
  let hasDefault = false;
  let defaultValue: unknown;
  let optional = false;
  for (;;) {
    description ??= current.description;
    if (current instanceof z.ZodDefault || current instanceof z.ZodPrefault) {
      hasDefault = true;
      defaultValue = current.def.defaultValue;
      current = current.unwrap() as z.ZodType;
    } else if (current instanceof z.ZodOptional || current instanceof z.ZodNullable) {
      optional = true;
      current = current.unwrap() as z.ZodType;
    } else {
      return { inner: current, description, hasDefault, defaultValue, optional };
    }
  }
}

function allowedValues(schema: z.ZodType): string[] {
  if (schema instanceof z.ZodEnum) return schema.options.map(String);
  if (schema instanceof z.ZodLiteral) return [...schema.values].map(String);
  if (schema instanceof z.ZodUnion) return (schema.options as z.ZodType[]).flatMap((option) => allowedValues(unwrap(option).inner));
  return [];
}

function join(path: string, key: string): string {
  return path === '' ? key : `${path}.${key}`;
}

/** Walks the keys below a schema; containers (record values, list items) add no key of their own. */
function walk(schema: z.ZodType, path: string, keys: Map<string, SpecKey>): void {
  if (schema instanceof z.ZodObject) {
    for (const [key, child] of Object.entries(schema.shape as Record<string, z.ZodType>)) {
      const childPath = join(path, key);
      const info = unwrap(child);
      const earlier = keys.get(childPath);
      const allowed = [...new Set([...(earlier?.allowed ?? []), ...allowedValues(info.inner)])];
      keys.set(childPath, {
        path: childPath,
        description: earlier?.description ?? info.description,
        hasDefault: info.hasDefault,
        defaultValue: info.defaultValue,
        optional: info.optional,
        allowed,
      });
      walk(info.inner, childPath, keys);
    }
  } else if (schema instanceof z.ZodUnion) {
    for (const option of schema.options as z.ZodType[]) walk(unwrap(option).inner, path, keys);
  } else if (schema instanceof z.ZodRecord) {
    walk(unwrap(schema.valueType as z.ZodType).inner, join(path, '*'), keys);
  } else if (schema instanceof z.ZodArray) {
    walk(unwrap(schema.element as z.ZodType).inner, `${path}[]`, keys);
  }
}

export function listSpecKeys(schema: z.ZodType = runSpecSchema): SpecKey[] {
  const keys = new Map<string, SpecKey>();
  walk(unwrap(schema).inner, '', keys);
  return [...keys.values()];
}
