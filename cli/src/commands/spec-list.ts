// `clino spec list`: the specs the server holds, with their current revision, as a table or JSON.
import { Command } from 'commander';
import { openContext, type CommandDeps } from '../command-context.js';
import { parseAnswer, specListSchema, type SpecSummaryAnswer } from '../transport/spec-answers.js';

export function renderSpecTable(items: readonly SpecSummaryAnswer[]): string {
  const rows = [['name', 'revision', 'sha256', 'author', 'pushed', 'description']];
  for (const item of items) {
    const description = (item.description ?? '').replace(/\s+/g, ' ');
    rows.push([item.name, String(item.latest.number), item.latest.sha256.slice(0, 12), item.latest.authorName, item.latest.createdAt, description]);
  }
  const widths = rows[0]!.map((_, c) => Math.max(...rows.map((row) => row[c]!.length)));
  return rows.map((row) => row.map((cell, c) => (c === row.length - 1 ? cell : cell.padEnd(widths[c]!))).join('  ').trimEnd()).join('\n') + '\n';
}

export function specListCommand(deps: CommandDeps): Command {
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
