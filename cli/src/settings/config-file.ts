// The user's clino config file: `config.json` in the user's config folder (env-paths, or
// CLINO_CONFIG_DIR). It holds the server URL and the machine token, so it is written with mode 0600
// inside a 0700 folder, by write-then-rename so a crash never leaves half a file.
import { chmod, mkdir, readFile, rename, writeFile } from 'node:fs/promises';
import path from 'node:path';
import envPaths from 'env-paths';
import { z } from 'zod';
import { CliError } from '../errors/cli-error.js';

export const configFileSchema = z.strictObject({
  serverUrl: z.url().optional(),
  token: z.string().min(1).optional(),
  logLevel: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).optional(),
});

export type ConfigFile = z.infer<typeof configFileSchema>;

/** The folder: CLINO_CONFIG_DIR when set, else the platform's user config folder for clino. */
export function configDirectory(env: NodeJS.ProcessEnv): string {
  const override = env['CLINO_CONFIG_DIR'];
  return override !== undefined && override !== '' ? override : envPaths('clino', { suffix: '' }).config;
}

export function configFilePath(env: NodeJS.ProcessEnv): string {
  return path.join(configDirectory(env), 'config.json');
}

export async function readConfigFile(file: string): Promise<ConfigFile> {
  let text: string;
  try {
    text = await readFile(file, 'utf8');
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return {};
    throw new CliError('INTERNAL', `cannot read the config file ${file}: ${(error as Error).message}`);
  }
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch {
    throw new CliError('USAGE', `the config file ${file} is not JSON`, { hint: 'fix it, or remove it and run clino login again' });
  }
  const parsed = configFileSchema.safeParse(data);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    const where = issue === undefined ? '' : ` (${issue.path.join('.') || 'top'}: ${issue.message})`;
    throw new CliError('USAGE', `the config file ${file} is not valid${where}`, { hint: 'fix it, or remove it and run clino login again' });
  }
  return parsed.data;
}

/** Merges `changes` into the file, creating the folder (0700) and the file (0600). */
export async function updateConfigFile(file: string, changes: ConfigFile): Promise<ConfigFile> {
  const next = { ...(await readConfigFile(file)), ...changes };
  const folder = path.dirname(file);
  await mkdir(folder, { recursive: true, mode: 0o700 });
  const temporary = `${file}.${process.pid}.tmp`;
  await writeFile(temporary, `${JSON.stringify(next, null, 2)}\n`, { mode: 0o600 });
  await chmod(temporary, 0o600);
  await rename(temporary, file);
  return next;
}
