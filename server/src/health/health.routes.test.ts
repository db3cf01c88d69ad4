import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { useTestDatabase, type TestDatabase } from '../../../test/support/test-database.js';
import { createApp } from '../app.js';
import { createSequelize } from '../db/sequelize.js';
import { createLogger } from '../shared/logger.js';
import { appOver } from '../../../test/support/test-app.js';

describe('GET /api/health', () => {
  let db: TestDatabase;
  useTestDatabase(async (made) => {
    db = made;
  });

  it('reports the database as connected when MariaDB answers', async () => {
    const app = appOver(db);
    const res = await request(app).get('/api/health').expect(200);
    expect(res.body).toEqual({ status: 'ok', database: 'connected' });
  });

  it('answers 503 with the database unreachable when nothing listens on its port', async () => {
    const settings = { ...db.settings, database: { ...db.settings.database, port: 1 } };
    const sequelize = createSequelize(settings.database);
    const app = createApp({ settings, sequelize, logger: createLogger('silent') });
    const res = await request(app).get('/api/health').expect(503);
    expect(res.body.database).toBe('unreachable');
    await sequelize.close();
  });

  it('answers an unknown API path with the error envelope', async () => {
    const app = appOver(db);
    const res = await request(app).get('/api/no-such-thing').expect(404);
    expect(res.body).toEqual({ error: { code: 'NOT_FOUND', message: 'No route for GET /no-such-thing' } });
  });
});
