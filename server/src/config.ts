import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { parse } from 'yaml';
import { z } from 'zod';

/** The repository root: config paths in settings are relative to it. */
export const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

const booleanText = z.union([z.boolean(), z.enum(['true', 'false', '1', '0']).transform((v) => v === 'true' || v === '1')]);
const port = z.coerce.number().int().min(1).max(65535);

const settingsSchema = z.object({
  server: z.object({
    host: z.string().min(1),
    port,
    secureCookies: booleanText,
    sessionSecret: z.string().min(8),
    consoleDir: z.string(),
    dataDir: z.string(),
    bodyLimit: z.string(),
    inputLimit: z.string().regex(/^\d+(kb|mb|gb)?$/i),
  }),
  database: z.object({ host: z.string(), port, name: z.string().regex(/^\w+$/), user: z.string(), password: z.string() }),
  mail: z.object({
    host: z.string(),
    port,
    secure: booleanText,
    user: z.string(),
    password: z.string(),
    from: z.string(),
    sink: booleanText,
  }),
  log: z.object({ level: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']) }),
  auth: z.object({
    sessionHours: z.coerce.number().positive().max(24 * 30),
    loginMaxFailures: z.coerce.number().int().min(1).max(1000),
    loginWindowMinutes: z.coerce.number().positive().max(24 * 60),
    passwordHashRounds: z.coerce.number().int().min(4).max(15),
    demoMachineToken: z.string(),
  }),
});

export type Settings = z.infer<typeof settingsSchema>;

/** Which environment variable overrides which setting (section, key). */
const environmentNames: Record<string, [keyof Settings, string]> = {
  CLINO_HOST: ['server', 'host'],
  CLINO_PORT: ['server', 'port'],
  CLINO_SECURE_COOKIES: ['server', 'secureCookies'],
  CLINO_SESSION_SECRET: ['server', 'sessionSecret'],
  CLINO_CONSOLE_DIR: ['server', 'consoleDir'],
  CLINO_DATA_DIR: ['server', 'dataDir'],
  CLINO_BODY_LIMIT: ['server', 'bodyLimit'],
  CLINO_INPUT_LIMIT: ['server', 'inputLimit'],
  CLINO_DB_HOST: ['database', 'host'],
  CLINO_DB_PORT: ['database', 'port'],
  CLINO_DB_NAME: ['database', 'name'],
  CLINO_DB_USER: ['database', 'user'],
  CLINO_DB_PASSWORD: ['database', 'password'],
  CLINO_SMTP_HOST: ['mail', 'host'],
  CLINO_SMTP_PORT: ['mail', 'port'],
  CLINO_SMTP_SECURE: ['mail', 'secure'],
  CLINO_SMTP_USER: ['mail', 'user'],
  CLINO_SMTP_PASSWORD: ['mail', 'password'],
  CLINO_MAIL_FROM: ['mail', 'from'],
  CLINO_MAIL_SINK: ['mail', 'sink'],
  CLINO_LOG_LEVEL: ['log', 'level'],
  CLINO_SESSION_HOURS: ['auth', 'sessionHours'],
  CLINO_LOGIN_MAX_FAILURES: ['auth', 'loginMaxFailures'],
  CLINO_LOGIN_WINDOW_MINUTES: ['auth', 'loginWindowMinutes'],
  CLINO_PASSWORD_HASH_ROUNDS: ['auth', 'passwordHashRounds'],
  CLINO_DEMO_MACHINE_TOKEN: ['auth', 'demoMachineToken'],
};

/** Settings resolve in one place: environment > config file > defaults in config/default.yaml. */
export function loadSettings(env: NodeJS.ProcessEnv = process.env, file = path.join(projectRoot, 'config/default.yaml')): Settings {
  const raw = parse(readFileSync(file, 'utf8')) as Record<string, Record<string, unknown>>;
  for (const [name, [section, key]] of Object.entries(environmentNames)) {
    const value = env[name];
    if (value !== undefined && value !== '') raw[section] = { ...raw[section], [key]: value };
  }
  const parsed = settingsSchema.safeParse(raw);
  if (!parsed.success) {
    const first = parsed.error.issues[0];
    throw new Error(`settings: ${first?.path.join('.')}: ${first?.message}`);
  }
  return parsed.data;
}

/** A path from the settings, resolved against the project root when relative. */
export function resolveFromRoot(p: string): string {
  return path.isAbsolute(p) ? p : path.join(projectRoot, p);
}
