import { Router } from 'express';
import type { AppDependencies } from './app.js';
import { healthRoutes } from './health/health.routes.js';

/** Every feature's routes under /api, one line each. */
export function apiRoutes(deps: AppDependencies): Router {
  const router = Router();
  router.use(healthRoutes(deps.sequelize));
  return router;
}
