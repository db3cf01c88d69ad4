// The `clino` program: global options, one addCommand per command, parseAsync. This is the only
// place that sets the exit code; everything below throws and the one handler reports.
import { readFileSync } from 'node:fs';
import { Command, CommanderError } from 'commander';
import type { CommandDeps } from './command-context.js';
import { checkCommand } from './commands/check.js';
import { exportCommand } from './commands/export.js';
import { loginCommand } from './commands/login.js';
import { newSpecCommand } from './commands/new-spec.js';
import { runCommand } from './commands/run.js';
import { specCommand } from './commands/spec.js';
import { watchCommand } from './commands/watch.js';
import { workCommand } from './commands/work.js';
import { EXIT, EXIT_CODE_HELP } from './errors/exit-codes.js';
import { handleError } from './errors/handle-error.js';
import { detectTerminal } from './output/terminal.js';

function packageVersion(): string {
  const text = readFileSync(new URL('../../package.json', import.meta.url), 'utf8');
  return (JSON.parse(text) as { version: string }).version;
}

export function buildProgram(deps: CommandDeps): Command {
  const program = new Command('clino')
    .description('Clinometer: betas, CAPM expected returns and WACC inputs from vendor price files, per a YAML run spec')
    .version(packageVersion(), '-V, --version')
    .option('--server <url>', 'server URL (env CLINO_SERVER_URL, else the config file from clino login)')
    .option('--log-level <level>', 'fatal, error, warn, info, debug, trace or silent (env CLINO_LOG_LEVEL)')
    .addHelpText('after', `\nSettings resolve as: flags > environment (CLINO_SERVER_URL, CLINO_TOKEN, CLINO_LOG_LEVEL,\nCLINO_CONFIG_DIR) > the config file written by clino login > defaults.\n\n${EXIT_CODE_HELP}\n`)
    .showHelpAfterError('(run clino --help for usage)')
    .configureOutput({ writeOut: deps.stdout, writeErr: deps.stderr })
    .exitOverride();
  for (const command of [
    runCommand(deps), checkCommand(deps), specCommand(deps), newSpecCommand(deps), watchCommand(deps),
    workCommand(deps), loginCommand(deps), exportCommand(deps),
  ]) {
    program.addCommand(command);
  }
  program.commands.forEach(function override(command: Command): void {
    command.exitOverride().configureOutput({ writeOut: deps.stdout, writeErr: deps.stderr });
    command.commands.forEach(override);
  });
  return program;
}

/** Runs the program and answers the exit code. */
export async function runClino(argv: readonly string[], deps: CommandDeps): Promise<number> {
  const json = argv.includes('--json');
  try {
    await buildProgram(deps).parseAsync([...argv], { from: 'user' });
    return EXIT.ok;
  } catch (error) {
    if (error instanceof CommanderError) return error.exitCode === 0 ? EXIT.ok : EXIT.usage;
    return handleError(error, { stderr: deps.stderr, stdout: deps.stdout, json });
  }
}

function stopSignal(): () => Promise<string> {
  let stop: Promise<string> | null = null;
  return () => {
    stop ??= new Promise((resolve) => {
      process.once('SIGTERM', () => resolve('SIGTERM'));
      process.once('SIGINT', () => resolve('SIGINT'));
    });
    return stop;
  };
}

if (process.argv[1] !== undefined && /(?:main\.ts|clino(?:\.js)?)$/.test(process.argv[1])) {
  const deps: CommandDeps = {
    env: process.env,
    terminal: detectTerminal(process.env),
    stdout: (text) => void process.stdout.write(text),
    stderr: (text) => void process.stderr.write(text),
    stdin: process.stdin,
    fetch,
    stopRequested: stopSignal(),
  };
  process.exitCode = await runClino(process.argv.slice(2), deps);
}
