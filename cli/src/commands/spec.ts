// `clino spec push|pull|list`: specs live on the server; each subcommand has its own file.
import { Command } from 'commander';
import type { CommandDeps } from '../command-context.js';
import { specListCommand } from './spec-list.js';
import { specPullCommand } from './spec-pull.js';
import { specPushCommand } from './spec-push.js';

export function specCommand(deps: CommandDeps): Command {
  return new Command('spec')
    .description('push, pull and list the run specs held by the server')
    .addCommand(specPushCommand(deps))
    .addCommand(specPullCommand(deps))
    .addCommand(specListCommand(deps));
}
