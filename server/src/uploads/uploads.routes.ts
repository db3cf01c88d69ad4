import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { requestIdOf } from '../audit/audit.service.js';
import { requireRole } from '../auth/require-role.js';
import type { AppDependencies } from '../app.js';
import { actorOfRequest } from '../runs/actor.js';
import { AppError, ValidationError } from '../shared/errors.js';
import { validate } from '../shared/validate.js';
import { contentStoreOf, parseByteSize } from '../store/store-of-settings.js';
import { contentStoreEngine } from './store-storage-engine.js';
import { requireUtf8Text } from './text-check.js';
import { hasAllowedContentType, hasAllowedExtension, sanitiseFileName, UPLOAD_EXTENSIONS } from './upload-file-name.js';
import { listUploadsQuery, uploadFields } from './uploads.schemas.js';
import { createUpload, listUploads } from './uploads.service.js';

/** multer's own errors (too many files, an unexpected field) answered as the API's envelope. */
function receiveOneFile(middleware: RequestHandler): RequestHandler {
  return (req, res, next) => {
    middleware(req, res, (err?: unknown) => {
      if (err instanceof multer.MulterError) next(new ValidationError(`Upload refused: ${err.message}${err.field ? ` (${err.field})` : ''}`));
      else next(err);
    });
  };
}

/** Files uploaded from the console: stored by checksum, then an upload job turns them into runs. */
export function uploadsRoutes({ settings, sequelize }: AppDependencies): Router {
  const router = Router();
  const store = contentStoreOf(settings);
  const maxBytes = parseByteSize(settings.server.inputLimit);
  const upload = multer({
    storage: contentStoreEngine(store, maxBytes),
    limits: { files: 1, fields: 5, fieldSize: 1024, parts: 6, fieldNameSize: 50 },
    fileFilter(_req, file, accept) {
      if (!hasAllowedExtension(file.originalname)) accept(new AppError(415, 'VALIDATION_FAILED', `Only ${UPLOAD_EXTENSIONS.join(' and ')} files may be uploaded`));
      else if (!hasAllowedContentType(file.mimetype)) accept(new AppError(415, 'VALIDATION_FAILED', `Files of type ${file.mimetype} may not be uploaded: send CSV text`));
      else accept(null, true);
    },
  });
  const fields = validate({ body: uploadFields });
  const list = validate({ query: listUploadsQuery });

  router.post('/uploads', requireRole(), receiveOneFile(upload.single('file')), fields, async (req, res) => {
    const file = req.file;
    if (!file) throw new ValidationError('Send the file in the multipart field "file"');
    const fileName = sanitiseFileName(file.originalname);
    await requireUtf8Text(file.path, fileName);
    const view = await createUpload(
      sequelize,
      actorOfRequest(req),
      { originalName: file.originalname.slice(0, 255), fileName, contentType: file.mimetype, sha256: file.filename, size: file.size, specName: fields.of(req).body.spec },
      requestIdOf(req),
    );
    res.status(201).json(view);
  });
  router.get('/uploads', requireRole(), list, async (req, res) => {
    const { page, pageSize } = list.of(req).query;
    res.json(await listUploads(page, pageSize));
  });
  return router;
}
