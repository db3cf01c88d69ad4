import { pino, type Logger } from 'pino';

/** Secrets never reach the log: these paths are redacted wherever they appear. */
const redactPaths = [
  'password',
  '*.password',
  'token',
  '*.token',
  'req.headers.authorization',
  'req.headers.cookie',
  'res.headers["set-cookie"]',
  'database.password',
  'mail.password',
  'server.sessionSecret',
  'auth.demoMachineToken',
  '*.demoMachineToken',
];

export function createLogger(level: string, name = 'clinometer'): Logger {
  return pino({ name, level, redact: { paths: redactPaths, censor: '[redacted]' } });
}

export type { Logger };
