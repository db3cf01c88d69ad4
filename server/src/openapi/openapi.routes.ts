import { Router } from 'express';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { projectRoot } from '../config.js';
import { requireRole } from '../auth/require-role.js';
import { buildOpenApiDocument } from './openapi-document.js';

function productVersion(): string {
  const manifest = JSON.parse(readFileSync(path.join(projectRoot, 'package.json'), 'utf8')) as { version?: unknown };
  return typeof manifest.version === 'string' ? manifest.version : '0.0.0';
}

/** GET /api/docs: the OpenAPI document, built once per app. */
export function openapiRoutes(): Router {
  const router = Router();
  const document = buildOpenApiDocument(productVersion());
  router.get('/docs', requireRole(), (_req, res) => {
    res.json(document);
  });
  return router;
}
