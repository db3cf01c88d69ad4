import { Router } from 'express';
import type { AppDependencies } from './app.js';
import { auditRoutes } from './audit/audit.routes.js';
import { sessionRoutes } from './auth/session.routes.js';
import { healthRoutes } from './health/health.routes.js';
import { jobsRoutes } from './jobs/jobs.routes.js';
import { mailroomRoutes } from './mail/mailroom.routes.js';
import { openapiRoutes } from './openapi/openapi.routes.js';
import { machineTokenRoutes } from './people/machine-tokens.routes.js';
import { peopleRoutes } from './people/people.routes.js';
import { distributionListsRoutes } from './releases/distribution-lists.routes.js';
import { releasesRoutes } from './releases/releases.routes.js';
import { ingestRoutes } from './runs/ingest.routes.js';
import { runsRoutes } from './runs/runs.routes.js';
import { specsRoutes } from './specs/specs.routes.js';
import { inputsRoutes } from './store/inputs.routes.js';
import { uploadsRoutes } from './uploads/uploads.routes.js';

/** Every feature's routes under /api, one line each. */
export function apiRoutes(deps: AppDependencies): Router {
  const router = Router();
  router.use(healthRoutes(deps.sequelize));
  router.use(sessionRoutes(deps));
  router.use(peopleRoutes(deps));
  router.use(machineTokenRoutes(deps));
  router.use(auditRoutes());
  router.use(specsRoutes(deps.sequelize));
  router.use(ingestRoutes(deps));
  router.use(inputsRoutes(deps));
  router.use(runsRoutes(deps));
  router.use(jobsRoutes(deps.sequelize));
  router.use(uploadsRoutes(deps));
  router.use(releasesRoutes(deps));
  router.use(distributionListsRoutes(deps.sequelize));
  router.use(mailroomRoutes(deps));
  router.use(openapiRoutes());
  return router;
}
