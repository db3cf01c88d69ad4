// `clino spec push|pull|list`: specs live on the server. A push sends the YAML text exactly as
// written (its sha256 is the revision's identity); the text is checked locally first, so mistakes
// are reported with file:line:column before anything is sent.
import path from 'node:path';
import { Command } from 'commander';
import { loadRunSpec } from '../../../server/src/contracts/run-spec.load.js';
import { readSpecText } from '../batch/spec-file.js';
import { openContext, type CommandDeps } from '../command-context.js';
import { writeFileAtomic } from '../output/atomic-write.js';
import { parseAnswer, pushSpecAnswerSchema, specDetailSchema, specListSchema, type SpecSummaryAnswer } from '../transport/spec-answers.js';

export function renderSpecTable(items: readonly SpecSummaryAnswer[]): string {
  const rows = [['name', 'revision', 'sha256', 'author', 'pushed', 'description']];
  for (const item of items) {
    const description = (item.description ?? '').replace(/\s+/g, ' ');
    rows.push([item.name, String(item.latest.number), item.latest.sha256.slice(0, 12), item.latest.authorName, item.latest.createdAt, description]);
  }
  const widths = rows[0]!.map((_, c) => Math.max(...rows.map((row) => row[c]!.length)));
  return rows.map((row) => row.map((cell, c) => (c === row.length - 1 ? cell : cell.padEnd(widths[c]!))).join('  ').trimEnd()).join('\n') + '\n';
}

function pushCommand(deps: CommandDeps): Command {
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
      if (options.json === true) deps.stdout(`${JSON.stringify(pushed, null, 2)}\n`);
      else deps.stdout(`${pushed.name} revision ${pushed.revision.number} ${pushed.revision.sha256}${pushed.created ? '' : ' (unchanged)'}\n`);
    });
}

function pullCommand(deps: CommandDeps): Command {
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

function listCommand(deps: CommandDeps): Command {
  return new Command('list')
    .description('list the specs the server holds with their current revision')
    .option('--json', 'print the list as JSON')
    .action(async (options: { json?: boolean }, command: Command) => {
      const context = await openContext(deps, command.optsWithGlobals());
      const answer = await context.authorisedClient().request('GET', '/api/specs');
      const list = parseAnswer(specListSchema, answer.json(), 'GET /api/specs');
      deps.stdout(options.json === true ? `${JSON.stringify(list.items, null, 2)}\n` : renderSpecTable(list.items));
    });
}

export function specCommand(deps: CommandDeps): Command {
  return new Command('spec')
    .description('push, pull and list the run specs held by the server')
    .addCommand(pushCommand(deps))
    .addCommand(pullCommand(deps))
    .addCommand(listCommand(deps));
}
