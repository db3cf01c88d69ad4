// The one place settings resolve: command-line flags > environment (CLINO_*) > the user's config file
// > defaults. Commands receive the resolved object and never read process.env themselves.
import path from 'node:path';
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
  /** Where `clino run --post` leaves a run the server could not take (an absolute path), or undefined: then it fails. */
  readonly outbox: string | undefined;
  readonly configFile: string;
  /** Where each value came from, for `--log-level debug` and error hints. */
  readonly sources: Readonly<Record<'serverUrl' | 'token' | 'logLevel' | 'outbox', 'flag' | 'environment' | 'config file' | 'default'>>;
}

/** What the global options of `clino` can set. */
export interface SettingFlags {
  readonly server?: string;
  readonly logLevel?: string;
  /** `clino run --outbox <folder>`. */
  readonly outbox?: string;
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
  const [outbox, outboxSource] = pick<string | undefined>([['flag', nonEmpty(flags.outbox)], ['environment', nonEmpty(env['CLINO_OUTBOX'])]], undefined);
  return Object.freeze({
    serverUrl: checked(serverUrlSchema, rawUrl, 'the server URL', urlSource).replace(/\/+$/, ''),
    token,
    logLevel: checked(logLevelSchema, rawLevel, 'the log level', levelSource),
    outbox: outbox === undefined ? undefined : path.resolve(outbox),
    configFile,
    sources: { serverUrl: urlSource, token: tokenSource, logLevel: levelSource, outbox: outboxSource },
  });
}
