import { pipeline } from 'node:stream/promises';
import { Router } from 'express';
import { z } from 'zod';
import { recordAudit, requestIdOf } from '../audit/audit.service.js';
import { requireRole } from '../auth/require-role.js';
import type { AppDependencies } from '../app.js';
import { sha256Schema } from '../contracts/ingest.schemas.js';
import { actorOfRequest } from '../runs/actor.js';
import { RunInput } from '../runs/run-input.model.js';
import { AppError, NotFoundError } from '../shared/errors.js';
import { validate } from '../shared/validate.js';
import { Upload } from '../uploads/upload.model.js';
import { contentStoreOf, parseByteSize } from './store-of-settings.js';

const shaParams = z.object({ sha256: sha256Schema });

/**
 * Input files by checksum: `PUT` streams the raw body into the content-addressed store and refuses
 * bytes that do not hash to the checksum in the path; `GET` hands an input of a run or an upload to
 * a worker on any host.
 */
export function inputsRoutes({ settings, sequelize }: AppDependencies): Router {
  const router = Router();
  const store = contentStoreOf(settings);
  const maxBytes = parseByteSize(settings.server.inputLimit);
  const bySha = validate({ params: shaParams });

  router.put('/inputs/:sha256', requireRole(), bySha, async (req, res) => {
    if (req.is('application/json')) throw new AppError(415, 'VALIDATION_FAILED', 'Send the file\'s bytes as application/octet-stream (or text/csv), not JSON');
    const { sha256 } = bySha.of(req).params;
    const existed = await store.has(sha256);
    const stored = await store.putStream(req, { expectedSha256: sha256, maxBytes });
    if (!existed) {
      await sequelize.transaction((transaction) =>
        recordAudit(transaction, { actor: actorOfRequest(req).principal, action: 'input.store', entityType: 'input', entityId: sha256, after: stored, requestId: requestIdOf(req) }),
      );
    }
    res.status(existed ? 200 : 201).json({ ...stored, created: !existed });
  });
  router.get('/inputs/:sha256', requireRole(), bySha, async (req, res) => {
    const { sha256 } = bySha.of(req).params;
    const known = (await RunInput.count({ where: { sha256 } })) + (await Upload.count({ where: { sha256 } }));
    if (known === 0) throw new NotFoundError(`No run or upload has an input with sha256 ${sha256}`);
    const { stream, size } = await store.open(sha256);
    res.type('application/octet-stream').setHeader('content-length', String(size));
    res.setHeader('x-content-sha256', sha256);
    await pipeline(stream, res);
  });
  return router;
}
