import { Router } from 'express';
import type { AppDependencies } from './app.js';
import { auditRoutes } from './audit/audit.routes.js';
import { sessionRoutes } from './auth/session.routes.js';
import { healthRoutes } from './health/health.routes.js';
import { machineTokenRoutes } from './people/machine-tokens.routes.js';
import { peopleRoutes } from './people/people.routes.js';

/** Every feature's routes under /api, one line each. */
export function apiRoutes(deps: AppDependencies): Router {
  const router = Router();
  router.use(healthRoutes(deps.sequelize));
  router.use(sessionRoutes(deps));
  router.use(peopleRoutes(deps));
  router.use(machineTokenRoutes(deps));
  router.use(auditRoutes());
  return router;
}
