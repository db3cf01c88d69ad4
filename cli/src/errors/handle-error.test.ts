import { describe, expect, it } from 'vitest';
import { CLI_ONLY_ERROR_CODES, errorEnvelopeSchema } from '../../../server/src/contracts/errors.js';
import { SpecError } from '../../../server/src/contracts/run-spec.load.js';
import { InputError } from '../inputs/input-error.js';
import { CliError } from './cli-error.js';
import { EXIT } from './exit-codes.js';
import { handleError } from './handle-error.js';

function capture(error: unknown, json = false) {
  let stderr = '';
  let stdout = '';
  const code = handleError(error, { stderr: (t) => (stderr += t), stdout: (t) => (stdout += t), json });
  return { code, stderr, stdout };
}

describe('the one error handler', () => {
  it('prints each spec problem as file:line:column and exits 3', () => {
    const error = new SpecError('s.yaml', [{ file: 's.yaml', line: 4, column: 14, path: 'sampling.frequency', message: '"montly" is not allowed' }]);
    const { code, stderr } = capture(error);
    expect(code).toBe(EXIT.spec);
    expect(stderr.split('\n')[0]).toBe('s.yaml:4:14 sampling.frequency: "montly" is not allowed');
  });

  it('prints an input problem as file:line:column with its code and exits 4', () => {
    const error = new InputError({ code: 'INPUT_BAD_DATE', file: 'p.csv', line: 9, column: 1, columnName: 'date', reason: 'date "2026-13-01" is not a calendar date' });
    const { code, stderr } = capture(error);
    expect(code).toBe(EXIT.input);
    expect(stderr).toBe('p.csv:9:1 (column date): date "2026-13-01" is not a calendar date (INPUT_BAD_DATE)\n');
  });

  it('maps server and usage codes to their exit codes, with the hint on its own line', () => {
    expect(capture(new CliError('SERVER_UNREACHABLE', 'down')).code).toBe(EXIT.unreachable);
    expect(capture(new CliError('UNAUTHENTICATED', 'no')).code).toBe(EXIT.auth);
    expect(capture(new CliError('SPEC_UNKNOWN', 'no')).code).toBe(EXIT.spec);
    expect(capture(new CliError('RUN_NOT_FOUND', 'no')).code).toBe(EXIT.refused);
    expect(capture(new CliError('USAGE', 'bad', { hint: 'try this' })).stderr).toBe('clino: bad (USAGE)\nhint: try this\n');
  });

  it('puts the CLI\'s own codes into the --json envelope as they are, a valid shared envelope', () => {
    for (const code of CLI_ONLY_ERROR_CODES) {
      const { stdout } = capture(new CliError(code, `probe ${code}`, { details: { probe: true } }), true);
      const envelope: unknown = JSON.parse(stdout);
      expect(envelope).toEqual({ error: { code, message: `probe ${code}`, details: { probe: true } } });
      expect(errorEnvelopeSchema.safeParse(envelope).success).toBe(true);
    }
  });

  it('gives an input file not named (INPUT_MISSING) exit 4 and its own code under --json', () => {
    const { code, stdout } = capture(new CliError('INPUT_MISSING', 'the spec needs the price file'), true);
    expect(code).toBe(EXIT.input);
    expect(JSON.parse(stdout).error.code).toBe('INPUT_MISSING');
  });

  it('answers an unexpected error with exit 1 and, under --json, the error envelope on stdout', () => {
    const { code, stdout } = capture(new TypeError('boom'), true);
    expect(code).toBe(EXIT.internal);
    expect(JSON.parse(stdout)).toEqual({ error: { code: 'INTERNAL', message: 'boom' } });
  });
});
