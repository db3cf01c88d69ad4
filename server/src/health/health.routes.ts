import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { requireRole } from '../auth/require-role.js';
import { databaseReachable } from '../db/sequelize.js';

/** GET /api/health: whether the server runs and reaches its database. Open to everyone. */
export function healthRoutes(sequelize: Sequelize): Router {
  const router = Router();
  router.get('/health', requireRole(), async (_req, res) => {
    const connected = await databaseReachable(sequelize);
    res.status(connected ? 200 : 503).json({ status: connected ? 'ok' : 'degraded', database: connected ? 'connected' : 'unreachable' });
  });
  return router;
}
