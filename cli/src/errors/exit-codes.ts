// The exit codes of `clino`, one per kind of outcome, so a scheduler can tell a bad file from a
// server that is down. Only main.ts sets the process's exit code; everything else throws.

export const EXIT = {
  ok: 0,
  internal: 1,
  usage: 2,
  spec: 3,
  input: 4,
  unreachable: 5,
  auth: 6,
  refused: 7,
  interrupted: 130,
} as const;

export type ExitCode = (typeof EXIT)[keyof typeof EXIT];

/** The table printed at the end of `clino --help`. */
export const EXIT_CODE_HELP = `Exit codes:
  0    success
  1    unexpected internal error (a bug: please report it with the log)
  2    usage: an unknown command, option or argument
  3    the run spec is invalid (SPEC_INVALID) or unknown to the server (SPEC_UNKNOWN)
  4    an input file was rejected (INPUT_*), or is missing
  5    the server could not be reached
  6    not signed in, or the machine token was refused (UNAUTHENTICATED, FORBIDDEN)
  7    the server refused the request (e.g. NOT_FOUND, VALIDATION_FAILED, RUN_STATE_CONFLICT)
  130  interrupted (Ctrl-C)`;
