// PLACEHOLDER: `clino work` lands once the server's job routes exist.
import { Command } from 'commander';
import type { CommandDeps } from '../command-context.js';

export function workCommand(deps: CommandDeps): Command {
  void deps;
  return new Command('work').description('claim rerun and upload jobs from the server and run them');
}
