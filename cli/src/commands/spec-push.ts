// `clino spec push <file>`: checks the spec locally (problems reported with file:line:column before
// anything is sent), then sends its exact text; a changed text becomes a new revision on the server.
// A revision pushed with a token that has no owner is nobody's work: the command warns that four
// eyes then blocks its release until a person pushes the same text.
import path from 'node:path';
import { Command } from 'commander';
import { loadRunSpec } from '../../../server/src/contracts/run-spec.load.js';
import { readSpecText } from '../batch/spec-file.js';
import { openContext, type CommandDeps } from '../command-context.js';
import { parseAnswer, pushSpecAnswerSchema } from '../transport/spec-answers.js';

export function specPushCommand(deps: CommandDeps): Command {
  return new Command('push')
    .description('send a spec to the server; a changed text becomes a new revision')
    .argument('<file>', 'the spec (YAML)')
    .option('--json', 'print the server\'s answer as JSON')
    .action(async (file: string, options: { json?: boolean }, command: Command) => {
      const context = await openContext(deps, command.optsWithGlobals());
      const text = await readSpecText(file);
      const { spec } = loadRunSpec(text, file);
      const answer = await context.authorisedClient().request('POST', '/api/specs', { json: { text, file: path.basename(file) } });
      const pushed = parseAnswer(pushSpecAnswerSchema, answer.json(), 'POST /api/specs');
      context.logger.info({ spec: spec.name, revision: pushed.revision.number, created: pushed.created }, pushed.created ? 'spec pushed' : 'spec unchanged');
      if (pushed.revision.authorKind === 'machine') {
        context.logger.warn(
          { spec: spec.name, revision: pushed.revision.number, token: pushed.revision.authorName },
          'this machine token acts for no person: runs of this revision cannot be released until a person pushes the same text (the console, or clino spec push with a token that has an owner)',
        );
      }
      if (options.json === true) deps.stdout(`${JSON.stringify(pushed, null, 2)}\n`);
      else deps.stdout(`${pushed.name} revision ${pushed.revision.number} ${pushed.revision.sha256}${pushed.created ? '' : ' (unchanged)'}\n`);
    });
}
