// `clino login <server-url>`: asks for a machine token (hidden prompt on a terminal, else the first
// line of stdin), checks it against the server, and stores URL and token in the user's config file
// (mode 0600). Later commands find both there unless a flag or CLINO_* variable says otherwise.
import { Command } from 'commander';
import { z } from 'zod';
import { openContext, type CommandDeps } from '../command-context.js';
import { CliError } from '../errors/cli-error.js';
import { updateConfigFile } from '../settings/config-file.js';
import { readSecret } from '../settings/read-secret.js';

const urlSchema = z.url({ protocol: /^https?$/ });

export function loginCommand(deps: CommandDeps): Command {
  return new Command('login')
    .description('store the server URL and a machine token for this user (config file, mode 0600)')
    .argument('<server-url>', 'e.g. http://127.0.0.1:8640')
    .option('--no-verify', 'store the token without asking the server whether it is valid')
    .action(async (serverUrl: string, options: { verify: boolean }, command: Command) => {
      const context = await openContext(deps, command.optsWithGlobals());
      const parsed = urlSchema.safeParse(serverUrl);
      if (!parsed.success) throw new CliError('USAGE', `${JSON.stringify(serverUrl.slice(0, 80))} is not an http:// or https:// URL`);
      const url = parsed.data.replace(/\/+$/, '');
      const token = await readSecret(`Machine token for ${url}:`, deps.stdin, deps.terminal.stdinIsTty);
      if (options.verify) await context.clientWithToken(url, token).request('GET', '/api/specs');
      await updateConfigFile(context.settings.configFile, { serverUrl: url, token });
      context.logger.info({ server: url, configFile: context.settings.configFile }, 'machine token stored');
    });
}
