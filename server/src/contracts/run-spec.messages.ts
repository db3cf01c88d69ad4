import { z } from 'zod';

/**
 * Messages for run-spec problems, phrased for the analyst who wrote the YAML: what was found and
 * what is allowed. The key path and the file position are added by the loader.
 */

const MAX_SHOWN = 40;

/** A short, safe rendering of an offending value (never more than a short excerpt). */
export function showValue(value: unknown): string {
  if (value === undefined) return 'nothing';
  if (value === null) return 'an empty value';
  if (typeof value === 'string') {
    const excerpt = value.length > MAX_SHOWN ? `${value.slice(0, MAX_SHOWN)}…` : value;
    return JSON.stringify(excerpt);
  }
  if (typeof value === 'number' || typeof value === 'boolean') return String(value);
  if (Array.isArray(value)) return 'a list';
  return 'a mapping';
}

export function notAllowed(value: unknown, allowed: string): string {
  return `${showValue(value)} is not allowed; allowed: ${allowed}`;
}

const EXPECTED: Readonly<Record<string, string>> = {
  string: 'text',
  number: 'a number',
  int: 'a whole number',
  boolean: 'true or false',
  object: 'a mapping of keys',
  array: 'a list',
  record: 'a mapping of names to values',
};

function expectedText(expected: string): string {
  return EXPECTED[expected] ?? expected;
}

type RawIssue = z.core.$ZodRawIssue;

function sizeText(kind: 'at least' | 'more than' | 'at most' | 'less than', bound: unknown, origin: string): string {
  if (origin === 'string') return `text of ${kind} ${String(bound)} character(s)`;
  if (origin === 'array' || origin === 'set') return `${kind} ${String(bound)} item(s)`;
  return `${kind} ${String(bound)}`;
}

function rangeMessage(issue: RawIssue & { code: 'too_small' | 'too_big' }): string {
  const small = issue.code === 'too_small';
  const bound = small ? issue.minimum : issue.maximum;
  const kind = small ? (issue.inclusive ? 'at least' : 'more than') : issue.inclusive ? 'at most' : 'less than';
  const shown = Array.isArray(issue.input) ? `a list of ${issue.input.length} item(s)` : showValue(issue.input);
  return `${shown} is not allowed; allowed: ${sizeText(kind, bound, issue.origin)}`;
}

function unionMessage(issue: RawIssue & { code: 'invalid_union' }): string {
  const input = issue.input;
  if ('discriminator' in issue && typeof issue.discriminator === 'string' && Array.isArray(issue.options)) {
    const value = typeof input === 'object' && input !== null ? (input as Record<string, unknown>)[issue.discriminator] : input;
    if (value === undefined) return `is required; allowed: ${issue.options.map(String).join(', ')}`;
    return notAllowed(value, issue.options.map(String).join(', '));
  }
  return `${showValue(input)} is not allowed`;
}

/**
 * The error map the loader passes to zod. Messages set on a schema itself (formats, rates, unions)
 * take precedence; this one covers types, choices, ranges and unknown keys.
 */
export const specIssueMessage: z.core.$ZodErrorMap = (issue) => {
  switch (issue.code) {
    case 'invalid_type':
      if (issue.input === undefined) return `is required: ${expectedText(issue.expected)}`;
      return notAllowed(issue.input, expectedText(issue.expected));
    case 'invalid_value':
      return notAllowed(issue.input, issue.values.map(String).join(', '));
    case 'too_small':
    case 'too_big':
      return rangeMessage(issue);
    case 'unrecognized_keys': {
      const allowed = issue.inst instanceof z.ZodObject ? Object.keys(issue.inst.shape).join(', ') : 'none';
      return `unknown key; allowed: ${allowed}`;
    }
    case 'invalid_union':
      return unionMessage(issue);
    default:
      return undefined;
  }
};
