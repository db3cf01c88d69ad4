import { Router } from 'express';
import { requireRole } from '../auth/require-role.js';
import { validate } from '../shared/validate.js';
import { queryAudit } from './audit-query.service.js';
import { auditQuerySchema } from './audit.schemas.js';

/** GET /api/audit: the audit trail, filtered and paged, newest first. */
export function auditRoutes(): Router {
  const router = Router();
  const listRequest = validate({ query: auditQuerySchema });
  router.get('/audit', requireRole(), listRequest, async (req, res) => {
    res.json(await queryAudit(listRequest.of(req).query));
  });
  return router;
}
