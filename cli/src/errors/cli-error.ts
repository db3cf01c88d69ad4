// The error the CLI throws on purpose: a code, a message for people, an optional hint, and the exit
// code main.ts will set. Codes are the shared SCREAMING_SNAKE codes, including those only the CLI
// raises (CLI_ONLY_ERROR_CODES: usage mistakes, a server out of reach, no stored token...).
import type { ErrorCode } from '../../../server/src/contracts/errors.js';
import { EXIT, type ExitCode } from './exit-codes.js';

export type CliErrorCode = ErrorCode;

export interface CliErrorOptions {
  readonly hint?: string;
  readonly exitCode?: ExitCode;
  readonly details?: unknown;
}

export class CliError extends Error {
  readonly hint: string | undefined;
  readonly exitCode: ExitCode;
  readonly details: unknown;

  constructor(
    readonly code: CliErrorCode,
    message: string,
    options: CliErrorOptions = {},
  ) {
    super(message);
    this.name = 'CliError';
    this.hint = options.hint;
    this.exitCode = options.exitCode ?? exitCodeOf(code);
    this.details = options.details;
  }
}

/** The exit code that belongs to an error code. */
export function exitCodeOf(code: string): ExitCode {
  if (code === 'USAGE') return EXIT.usage;
  if (code.startsWith('SPEC_')) return EXIT.spec;
  if (code.startsWith('INPUT_')) return EXIT.input;
  if (code === 'SERVER_UNREACHABLE') return EXIT.unreachable;
  if (code === 'NOT_LOGGED_IN' || code === 'UNAUTHENTICATED' || code === 'FORBIDDEN') return EXIT.auth;
  if (code === 'INTERRUPTED') return EXIT.interrupted;
  if (code === 'INTERNAL') return EXIT.internal;
  return EXIT.refused;
}
