import { Router } from 'express';
import { z } from 'zod';
import { requireRole } from '../auth/require-role.js';
import type { AppDependencies } from '../app.js';
import { validate } from '../shared/validate.js';
import { contentStoreOf } from '../store/store-of-settings.js';
import { getMail, listMail, mailAttachment } from './mailroom.service.js';

const id = z.string().regex(/^[1-9]\d{0,9}$/, 'a message id').transform(Number);
const listQuery = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(500).default(50),
});

/** The Mailroom: messages the local mail sink received, and their attachments. */
export function mailroomRoutes({ settings }: AppDependencies): Router {
  const router = Router();
  const store = contentStoreOf(settings);
  const list = validate({ query: listQuery });
  const byId = validate({ params: z.object({ id }) });
  const attachment = validate({ params: z.object({ id, index: z.string().regex(/^\d{1,4}$/, 'an attachment index').transform(Number) }) });

  router.get('/mail', requireRole(), list, async (req, res) => {
    const { page, pageSize } = list.of(req).query;
    res.json(await listMail(page, pageSize));
  });
  router.get('/mail/:id', requireRole(), byId, async (req, res) => {
    res.json(await getMail(byId.of(req).params.id));
  });
  router.get('/mail/:id/attachments/:index', requireRole(), attachment, async (req, res) => {
    const { id: messageId, index } = attachment.of(req).params;
    const found = await mailAttachment(store, messageId, index);
    // Only plain text types keep their type; anything else downloads as bytes, never rendered.
    const type = /^text\/(csv|plain)\b/i.test(found.attachment.contentType) ? found.attachment.contentType : 'application/octet-stream';
    res.attachment(found.attachment.fileName).type(type).setHeader('x-content-sha256', found.attachment.sha256);
    res.send(found.bytes);
  });
  return router;
}
