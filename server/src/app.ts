import { randomUUID } from 'node:crypto';
import { existsSync } from 'node:fs';
import path from 'node:path';
import express, { type Express } from 'express';
import helmet from 'helmet';
import type { Logger } from 'pino';
import type { Sequelize } from 'sequelize';
import { resolveFromRoot, type Settings } from './config.js';
import { apiRoutes } from './api-routes.js';
import { authMiddleware } from './auth/auth-middleware.js';
import { initModels } from './db/init-models.js';
import { apiNotFound, errorHandler } from './shared/error-handler.js';

export interface AppDependencies {
  settings: Settings;
  sequelize: Sequelize;
  logger: Logger;
}

/** The Express application: API under /api, the built console for everything else. */
export function createApp({ settings, sequelize, logger }: AppDependencies): Express {
  initModels(sequelize);
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(helmet({ contentSecurityPolicy: { directives: { 'upgrade-insecure-requests': settings.server.secureCookies ? [] : null } } }));
  app.use((req, res, next) => {
    const requestId = randomUUID();
    res.setHeader('x-request-id', requestId);
    req.log = logger.child({ requestId });
    next();
  });
  app.use('/api', express.json({ limit: settings.server.bodyLimit }));
  app.use('/api', authMiddleware({ settings, sequelize, logger }));
  app.use('/api', apiRoutes({ settings, sequelize, logger }));
  app.use('/api', apiNotFound);
  app.use('/api', errorHandler(logger));
  serveConsole(app, resolveFromRoot(settings.server.consoleDir));
  return app;
}

/** Static files of the built console, and index.html for the console's own routes. */
function serveConsole(app: Express, dir: string): void {
  const index = path.join(dir, 'index.html');
  app.use(express.static(dir, { index: false, maxAge: '1h' }));
  app.get('/{*splat}', (_req, res) => {
    if (existsSync(index)) res.sendFile(index);
    else res.status(503).type('text').send('The console is not built yet: run npm start (it builds it) or npx ng build.');
  });
}

declare module 'express-serve-static-core' {
  interface Request {
    log: Logger;
  }
}
