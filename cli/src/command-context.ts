// What every command gets: the process's streams and environment (injected, so tests can drive a
// command without a real terminal), and, once the global options are known, the resolved settings,
// the logger, the progress display and the server client.
import type { Logger } from 'pino';
import { createCliLogger } from './output/logger.js';
import { createProgress, type Progress } from './output/progress.js';
import type { Terminal } from './output/terminal.js';
import { resolveSettings, type SettingFlags, type Settings } from './settings/settings.js';
import { createServerClient, requireToken, type Fetch, type ServerClient } from './transport/server-client.js';

export interface CommandDeps {
  readonly env: NodeJS.ProcessEnv;
  readonly terminal: Terminal;
  /** Data only: CSV, JSON, tables. */
  readonly stdout: (text: string) => void;
  /** Messages for people (the logger writes there too). */
  readonly stderr: (text: string) => void;
  readonly stdin: NodeJS.ReadableStream;
  readonly fetch: Fetch;
  /**
   * Resolves when the process is asked to stop (SIGTERM or SIGINT). Only long-running commands call
   * it: the signal handlers are installed on the first call, so other commands keep the default.
   */
  readonly stopRequested: () => Promise<string>;
}

export interface CommandContext {
  readonly deps: CommandDeps;
  readonly settings: Settings;
  readonly logger: Logger;
  readonly progress: Progress;
  /** A client with the machine token; fails with NOT_LOGGED_IN when there is none. */
  authorisedClient(): ServerClient;
  /** A client without a token (login checks a token it was just given). */
  clientWithToken(serverUrl: string, token: string | undefined): ServerClient;
}

export async function openContext(deps: CommandDeps, flags: SettingFlags): Promise<CommandContext> {
  const settings = await resolveSettings(flags, deps.env);
  const logger = createCliLogger(settings.logLevel, deps.terminal);
  return {
    deps,
    settings,
    logger,
    progress: createProgress(deps.terminal),
    authorisedClient: () => createServerClient(settings.serverUrl, requireToken(settings.token), deps.fetch),
    clientWithToken: (serverUrl, token) => createServerClient(serverUrl, token, deps.fetch),
  };
}
