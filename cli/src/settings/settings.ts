// The one place settings resolve: command-line flags > environment (CLINO_*) > the user's config file
// > defaults. Commands receive the resolved object and never read process.env themselves.
import { z } from 'zod';
import { CliError } from '../errors/cli-error.js';
import { configFilePath, readConfigFile } from './config-file.js';

export const LOG_LEVELS = ['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent'] as const;
export type LogLevel = (typeof LOG_LEVELS)[number];

export const DEFAULT_SERVER_URL = 'http://127.0.0.1:8640';

export interface Settings {
  readonly serverUrl: string;
  /** The machine token, or undefined when none is configured anywhere. */
  readonly token: string | undefined;
  readonly logLevel: LogLevel;
  readonly configFile: string;
  /** Where each value came from, for `--log-level debug` and error hints. */
  readonly sources: Readonly<Record<'serverUrl' | 'token' | 'logLevel', 'flag' | 'environment' | 'config file' | 'default'>>;
}

/** What the global options of `clino` can set. */
export interface SettingFlags {
  readonly server?: string;
  readonly logLevel?: string;
}

const serverUrlSchema = z.url({ protocol: /^https?$/ });
const logLevelSchema = z.enum(LOG_LEVELS);

function nonEmpty(value: string | undefined): string | undefined {
  return value === undefined || value.trim() === '' ? undefined : value.trim();
}

type Source = Settings['sources']['serverUrl'];

function pick<T>(candidates: readonly [Source, T | undefined][], fallback: T): [T, Source] {
  for (const [source, value] of candidates) if (value !== undefined) return [value, source];
  return [fallback, 'default'];
}

function checked<T>(schema: z.ZodType<T>, value: unknown, what: string, source: Source): T {
  const parsed = schema.safeParse(value);
  if (parsed.success) return parsed.data;
  throw new CliError('USAGE', `${what} ${JSON.stringify(String(value).slice(0, 80))} from the ${source} is not valid`, {
    hint: what === 'the server URL' ? 'give an http:// or https:// URL, e.g. http://127.0.0.1:8640' : `allowed: ${LOG_LEVELS.join(', ')}`,
  });
}

export async function resolveSettings(flags: SettingFlags, env: NodeJS.ProcessEnv): Promise<Settings> {
  const configFile = configFilePath(env);
  const file = await readConfigFile(configFile);
  const [rawUrl, urlSource] = pick<string>(
    [['flag', nonEmpty(flags.server)], ['environment', nonEmpty(env['CLINO_SERVER_URL'])], ['config file', file.serverUrl]],
    DEFAULT_SERVER_URL,
  );
  const [token, tokenSource] = pick<string | undefined>([['environment', nonEmpty(env['CLINO_TOKEN'])], ['config file', file.token]], undefined);
  const [rawLevel, levelSource] = pick<string>(
    [['flag', nonEmpty(flags.logLevel)], ['environment', nonEmpty(env['CLINO_LOG_LEVEL'])], ['config file', file.logLevel]],
    'info',
  );
  return Object.freeze({
    serverUrl: checked(serverUrlSchema, rawUrl, 'the server URL', urlSource).replace(/\/+$/, ''),
    token,
    logLevel: checked(logLevelSchema, rawLevel, 'the log level', levelSource),
    configFile,
    sources: { serverUrl: urlSource, token: tokenSource, logLevel: levelSource },
  });
}
