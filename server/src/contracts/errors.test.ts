import { describe, expect, it } from 'vitest';
import { CLI_ONLY_ERROR_CODES, ERROR_CODES, INPUT_ERROR_CODES, errorEnvelope, errorEnvelopeSchema, isErrorCode } from './errors.js';

describe('error codes', () => {
  it('are unique SCREAMING_SNAKE strings', () => {
    expect(new Set(ERROR_CODES).size).toBe(ERROR_CODES.length);
    for (const code of ERROR_CODES) expect(code).toMatch(/^[A-Z][A-Z0-9]*(_[A-Z0-9]+)*$/);
  });

  it('include the codes DESIGN.md and STYLE.md name', () => {
    for (const code of ['SPEC_INVALID', 'SPEC_UNKNOWN', 'INPUT_UNREADABLE', 'RUN_NOT_RELEASABLE']) expect(ERROR_CODES).toContain(code);
  });

  it('group the input readers\' codes, without the CLI\'s INPUT_MISSING (a file not given is not a file rejected)', () => {
    expect(INPUT_ERROR_CODES.length).toBeGreaterThan(0);
    expect(INPUT_ERROR_CODES.every((code) => code.startsWith('INPUT_'))).toBe(true);
    expect(INPUT_ERROR_CODES).toContain('INPUT_FLAT_MARKET');
    expect(INPUT_ERROR_CODES).not.toContain('INPUT_MISSING');
  });

  it('include the codes only the CLI raises, so its --json envelope is a valid shared one', () => {
    expect([...CLI_ONLY_ERROR_CODES].sort()).toEqual(['INPUT_MISSING', 'INTERRUPTED', 'NOT_LOGGED_IN', 'SERVER_UNREACHABLE', 'USAGE']);
    for (const code of CLI_ONLY_ERROR_CODES) {
      expect(ERROR_CODES).toContain(code);
      expect(errorEnvelopeSchema.safeParse(errorEnvelope(code, 'from the CLI')).success).toBe(true);
    }
  });

  it('recognise only their own strings', () => {
    expect([isErrorCode('FOUR_EYES'), isErrorCode('four_eyes'), isErrorCode(404), isErrorCode(undefined)]).toEqual([true, false, false, false]);
  });
});

describe('error envelope', () => {
  it('wraps code, message and details, leaving details out when absent', () => {
    expect(errorEnvelope('NOT_FOUND', 'No run 7')).toEqual({ error: { code: 'NOT_FOUND', message: 'No run 7' } });
    expect(errorEnvelope('SPEC_INVALID', 'bad', [{ line: 3 }])).toEqual({ error: { code: 'SPEC_INVALID', message: 'bad', details: [{ line: 3 }] } });
  });

  it('validates a received envelope and rejects an unknown code', () => {
    expect(errorEnvelopeSchema.safeParse(errorEnvelope('FORBIDDEN', 'no')).success).toBe(true);
    expect(errorEnvelopeSchema.safeParse({ error: { code: 'E42', message: 'no' } }).success).toBe(false);
    expect(errorEnvelopeSchema.safeParse({ error: { code: 'INTERNAL' } }).success).toBe(false);
  });
});
