// What the process's terminals can do: stdout and stderr may each be a TTY or a pipe; colour only on
// a TTY and never when NO_COLOR is set (any value, per the NO_COLOR convention).

export interface Terminal {
  readonly stdoutIsTty: boolean;
  readonly stderrIsTty: boolean;
  readonly stdinIsTty: boolean;
  readonly colour: boolean;
}

export function detectTerminal(env: NodeJS.ProcessEnv): Terminal {
  const stderrIsTty = process.stderr.isTTY === true;
  const noColour = env['NO_COLOR'] !== undefined && env['NO_COLOR'] !== '';
  return {
    stdoutIsTty: process.stdout.isTTY === true,
    stderrIsTty,
    stdinIsTty: process.stdin.isTTY === true,
    colour: stderrIsTty && !noColour,
  };
}
