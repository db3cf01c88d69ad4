// `clino spec pull <name>`: the current revision's text, byte for byte (its sha256 is the revision's).
import { Command } from 'commander';
import { openContext, type CommandDeps } from '../command-context.js';
import { writeFileAtomic } from '../output/atomic-write.js';
import { parseAnswer, specDetailSchema } from '../transport/spec-answers.js';

export function specPullCommand(deps: CommandDeps): Command {
  return new Command('pull')
    .description('print the current revision of a spec (exactly as pushed), or write it to a file')
    .argument('<name>', 'the spec\'s name')
    .option('--out <file>', 'write the text to this file instead of stdout')
    .action(async (name: string, options: { out?: string }, command: Command) => {
      const context = await openContext(deps, command.optsWithGlobals());
      const answer = await context.authorisedClient().request('GET', `/api/specs/${encodeURIComponent(name)}`);
      const detail = parseAnswer(specDetailSchema, answer.json(), `GET /api/specs/${name}`);
      context.logger.info({ spec: detail.name, revision: detail.current.number, sha256: detail.current.sha256 }, 'spec pulled');
      if (options.out === undefined) deps.stdout(detail.current.text);
      else await writeFileAtomic(options.out, detail.current.text);
    });
}
