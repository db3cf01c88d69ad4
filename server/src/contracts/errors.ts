import { z } from 'zod';

/**
 * Codes only the clino CLI raises, about its own situation (a usage mistake, a server it cannot reach,
 * no stored token, an input file not given, Ctrl-C). They never come from the server; they are shared
 * codes so that `clino --json` prints them in the same error envelope as the server's.
 */
export const CLI_ONLY_ERROR_CODES = ['USAGE', 'SERVER_UNREACHABLE', 'NOT_LOGGED_IN', 'INPUT_MISSING', 'INTERRUPTED'] as const;

export type CliOnlyErrorCode = (typeof CLI_ONLY_ERROR_CODES)[number];

/**
 * Every error code Clinometer's server, CLI and console exchange. Codes are SCREAMING_SNAKE strings,
 * never numbers; the message beside a code is for people and may change, the code may not.
 */
export const ERROR_CODES = [
  // Run specs
  'SPEC_INVALID',
  'SPEC_UNKNOWN',
  // Input files (the price, market and risk-free readers)
  'INPUT_UNREADABLE',
  'INPUT_NOT_UTF8',
  'INPUT_NOT_CSV',
  'INPUT_EMPTY',
  'INPUT_NO_DATE_COLUMN',
  'INPUT_NO_VALUE_COLUMN',
  'INPUT_FIELD_COUNT',
  'INPUT_BAD_DATE',
  'INPUT_DUPLICATE_DATE',
  'INPUT_BAD_PRICE',
  'INPUT_DUPLICATE_SECURITY',
  'INPUT_EMPTY_SECURITY',
  'INPUT_FLAT_MARKET',
  'INPUT_BAD_RATE',
  // Runs
  'RUN_NOT_FOUND',
  'RUN_NOT_RELEASABLE',
  'RUN_STATE_CONFLICT',
  'FOUR_EYES',
  'JOB_STATE_CONFLICT',
  'IDEMPOTENCY_KEY_REUSED',
  'CHECKSUM_MISMATCH',
  // HTTP and people
  'UNAUTHENTICATED',
  'FORBIDDEN',
  'CSRF_REJECTED',
  'VALIDATION_FAILED',
  'CONFLICT',
  'NOT_FOUND',
  'TOO_MANY_REQUESTS',
  'PAYLOAD_TOO_LARGE',
  'INTERNAL',
  // The CLI's own: never from the server (see CLI_ONLY_ERROR_CODES)
  ...CLI_ONLY_ERROR_CODES,
] as const;

export type ErrorCode = (typeof ERROR_CODES)[number];

/** The input-reader codes: a run that fails with one of these moves its file to `rejected/` (INPUT_MISSING, a file not given, is not one). */
export const INPUT_ERROR_CODES = ERROR_CODES.filter((code): code is Exclude<Extract<ErrorCode, `INPUT_${string}`>, CliOnlyErrorCode> =>
  code.startsWith('INPUT_') && !(CLI_ONLY_ERROR_CODES as readonly string[]).includes(code),
);

export function isErrorCode(value: unknown): value is ErrorCode {
  return typeof value === 'string' && (ERROR_CODES as readonly string[]).includes(value);
}

export const errorCodeSchema = z.enum(ERROR_CODES).describe('One of the shared error codes.');

/** The body of every error answer of the API, and of `clino --json` failures. */
export const errorEnvelopeSchema = z.strictObject({
  error: z.strictObject({
    code: errorCodeSchema,
    message: z.string().describe('What went wrong, for people; never a stack trace.'),
    details: z.unknown().optional().describe('Structured detail, e.g. the list of spec problems.'),
  }),
});

export interface ErrorBody {
  readonly code: ErrorCode;
  readonly message: string;
  readonly details?: unknown;
}

export interface ErrorEnvelope {
  readonly error: ErrorBody;
}

export function errorEnvelope(code: ErrorCode, message: string, details?: unknown): ErrorEnvelope {
  return { error: details === undefined ? { code, message } : { code, message, details } };
}
