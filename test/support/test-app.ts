import type { Express } from 'express';
import { createApp } from '../../server/src/app.js';
import { createLogger } from '../../server/src/shared/logger.js';
import type { TestDatabase } from './test-database.js';

/** The real app over a test database, logging nothing. */
export function appOver(db: Pick<TestDatabase, 'settings' | 'sequelize'>): Express {
  return createApp({ settings: db.settings, sequelize: db.sequelize, logger: createLogger('silent') });
}
