import { Router } from 'express';
import type { AppDependencies } from './app.js';
import { sessionRoutes } from './auth/session.routes.js';
import { healthRoutes } from './health/health.routes.js';

/** Every feature's routes under /api, one line each. */
export function apiRoutes(deps: AppDependencies): Router {
  const router = Router();
  router.use(healthRoutes(deps.sequelize));
  router.use(sessionRoutes(deps));
  return router;
}
