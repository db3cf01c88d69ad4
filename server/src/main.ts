// The server process: API, built console and (locally) the mail sink, all on loopback by default.
import type { Server } from 'node:http';
import { createApp } from './app.js';
import { loadSettings } from './config.js';
import { createSequelize } from './db/sequelize.js';
import { createMailSink, listen } from './mail/mail-sink.js';
import { storeSinkedMessage } from './mail/mail-store.service.js';
import { createLogger } from './shared/logger.js';
import { contentStoreOf } from './store/store-of-settings.js';

const settings = loadSettings();
const logger = createLogger(settings.log.level);
const sequelize = createSequelize(settings.database, logger);
const app = createApp({ settings, sequelize, logger });

const store = contentStoreOf(settings);
const sink = settings.mail.sink ? createMailSink((message) => storeSinkedMessage(store, message), logger) : undefined;
if (sink) {
  await listen(sink, settings.mail.port, settings.mail.host);
  logger.info(`mail sink listening on smtp://${settings.mail.host}:${settings.mail.port}`);
}

const server: Server = app.listen(settings.server.port, settings.server.host, () => {
  logger.info(`Clinometer console and API on http://${settings.server.host}:${settings.server.port}/`);
});

let stopping = false;
async function stop(signal: string): Promise<void> {
  if (stopping) return;
  stopping = true;
  logger.info({ signal }, 'stopping');
  server.close();
  server.closeAllConnections();
  await new Promise<void>((resolve) => (sink ? sink.close(() => resolve()) : resolve()));
  await sequelize.close();
}
process.once('SIGTERM', () => void stop('SIGTERM'));
process.once('SIGINT', () => void stop('SIGINT'));
