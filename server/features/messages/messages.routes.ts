import path from 'node:path';
import { Router } from 'express';
import { messageParams, photoSizeQuery, postMessageSchema } from '../../../shared/schemas/message.ts';
import { orderIdParams } from '../../../shared/schemas/order.ts';
import type { AppDeps } from '../../deps.ts';
import { perAccountLimit } from '../../http/account-rate-limit.ts';
import { currentUser, requireUser, shopOfRequester } from '../../http/auth-guards.ts';
import { validate } from '../../http/validate.ts';
import { createStorage, IMAGE_LIMITS, sendStoredImage, singleFile } from '../../integrations/storage.ts';
import * as svc from './messages.service.ts';

/** Room for a message's text in a multipart body (its characters can take up to 4 bytes each). */
const TEXT_FIELD_BYTES = 8 * 1024;

/**
 * /api/orders/:id/messages — an order's thread (its shopper, its shop, admins; anyone else 404) —
 * and /api/messages/unread for the header. A photo comes as multipart `file` beside the field
 * `body`; it goes through the upload checks (server/integrations/storage.ts) in the worker pool and
 * is kept in a folder of its own, which /uploads does not serve: only the thread's readers get it.
 */
export function messagesRouters(deps: AppDeps): { thread: Router; unread: Router } {
  const dir = path.join(deps.env.uploadsDir, 'messages');
  const storage = createStorage(dir, { process: (bytes) => deps.pool.run({ kind: 'image', bytes }) });
  const limit = perAccountLimit(deps.rateLimits.messagesPerMinute, 'messages', deps.limitStore('messages'));
  const viewer = (req: Parameters<typeof currentUser>[0]) => ({ user: currentUser(req), shopId: shopOfRequester(deps.db, req)?.id ?? null });

  const r = Router();
  r.get('/:id/messages', requireUser, validate({ params: orderIdParams }), (req, res) => {
    res.json(svc.thread(deps.db, String(req.params.id), viewer(req)));
  });
  r.post(
    '/:id/messages',
    requireUser,
    validate({ params: orderIdParams }),
    // who may write is checked before a byte of the upload is read
    (req, _res, next) => (svc.assertCanPost(deps.db, String(req.params.id), viewer(req)), next()),
    limit,
    singleFile(IMAGE_LIMITS.maxBytes, { fieldSize: TEXT_FIELD_BYTES }),
    async (req, res) => {
      const { body } = postMessageSchema.parse(req.body ?? {});
      const photo = req.file ? await storage.saveImage(req.file.buffer) : null;
      res.status(201).json({ message: await svc.post(deps, String(req.params.id), viewer(req), body, photo) });
    },
  );
  r.post('/:id/messages/read', requireUser, validate({ params: orderIdParams }), (req, res) => {
    res.json(svc.markRead(deps, String(req.params.id), viewer(req)));
  });
  r.get('/:id/messages/:messageId/photo', requireUser, validate({ params: messageParams, query: photoSizeQuery }), (req, res, next) => {
    const { size } = res.locals.query as { size: 'full' | 'thumb' };
    sendStoredImage(res, next, dir, svc.photoFile(deps.db, String(req.params.id), String(req.params.messageId), viewer(req), size), 'private');
  });

  const unread = Router();
  unread.get('/unread', requireUser, (req, res) => {
    res.json(svc.unread(deps.db, viewer(req)));
  });
  return { thread: r, unread };
}
