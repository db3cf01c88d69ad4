// The one error handler: turns whatever reached the top into lines on stderr (each file problem as
// `file:line:column reason`), the error envelope on stdout under --json, and an exit code.
import { errorEnvelope, type ErrorCode } from '../../../server/src/contracts/errors.js';
import { SpecError, formatSpecProblem } from '../../../server/src/contracts/run-spec.load.js';
import { InputError } from '../inputs/input-error.js';
import { CliError, exitCodeOf } from './cli-error.js';
import { EXIT, type ExitCode } from './exit-codes.js';

export interface ErrorOutput {
  readonly stderr: (text: string) => void;
  readonly stdout: (text: string) => void;
  /** --json: the envelope goes to stdout as data too. */
  readonly json: boolean;
}

interface Described {
  readonly code: ErrorCode;
  readonly lines: readonly string[];
  readonly exitCode: ExitCode;
  readonly message: string;
  readonly details?: unknown;
}

function describe(error: unknown): Described {
  if (error instanceof SpecError) {
    const lines = [...error.problems.map(formatSpecProblem), `clino: the run spec ${error.file} is invalid (SPEC_INVALID)`];
    return { code: error.code, lines, exitCode: EXIT.spec, message: error.message, details: error.problems };
  }
  if (error instanceof InputError) {
    const details = { file: error.file, line: error.line, column: error.column, columnName: error.columnName, reason: error.reason, code: error.code };
    return { code: error.code, lines: [`${error.message} (${error.code})`], exitCode: EXIT.input, message: error.message, details };
  }
  if (error instanceof CliError) {
    const lines = [`clino: ${error.message} (${error.code})`];
    if (error.hint !== undefined) lines.push(`hint: ${error.hint}`);
    return { code: error.code, lines, exitCode: error.exitCode, message: error.message, details: error.details };
  }
  const message = error instanceof Error ? error.message : String(error);
  return { code: 'INTERNAL', lines: [`clino: internal error: ${message} (INTERNAL)`], exitCode: EXIT.internal, message };
}

export function handleError(error: unknown, output: ErrorOutput): ExitCode {
  const described = describe(error);
  for (const line of described.lines) output.stderr(`${line}\n`);
  // Every code is a shared one (the CLI's own among them), so the envelope carries it as it is.
  if (output.json) output.stdout(`${JSON.stringify(errorEnvelope(described.code, described.message, described.details))}\n`);
  return described.exitCode === EXIT.internal && described.code !== 'INTERNAL' ? exitCodeOf(described.code) : described.exitCode;
}
