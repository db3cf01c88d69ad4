// `clino export <run-id>`: downloads a run's result CSV from the server, byte for byte (stdout, or
// --out written whole by write-then-rename).
import { Command } from 'commander';
import { openContext, type CommandDeps } from '../command-context.js';
import { CliError } from '../errors/cli-error.js';
import { writeFileAtomic } from '../output/atomic-write.js';

export function exportCommand(deps: CommandDeps): Command {
  return new Command('export')
    .description('download the result CSV of a run')
    .argument('<run-id>', 'the run\'s id, as the server or clino run --post printed it')
    .option('--out <file>', 'write the CSV to this file instead of stdout')
    .action(async (runId: string, options: { out?: string }, command: Command) => {
      const context = await openContext(deps, command.optsWithGlobals());
      if (!/^[A-Za-z0-9_-]{1,64}$/.test(runId)) throw new CliError('USAGE', `${JSON.stringify(runId.slice(0, 80))} is not a run id`);
      const answer = await context.authorisedClient().request('GET', `/api/runs/${runId}/csv`);
      if (options.out === undefined) deps.stdout(answer.text());
      else await writeFileAtomic(options.out, answer.body);
      context.logger.info({ runId, bytes: answer.body.length }, 'result CSV downloaded');
    });
}
