import { Router } from 'express';
import { z } from 'zod';
import { listMail, readMail } from '../../../fakes/mail/store.ts';
import { requireRole } from '../../http/auth-guards.ts';
import { validate } from '../../http/validate.ts';
import { notFound } from '../../http/app-error.ts';
import type { AppDeps } from '../../app.ts';

/** Admin-only view of the mail the local fake captured (development and demo). */
export function adminMailRouter(deps: AppDeps): Router {
  const r = Router();
  r.use(requireRole('admin'));
  r.get('/', async (_req, res) => {
    const messages = await listMail(deps.env.mailDir, { limit: 200 });
    res.json({ messages: messages.map(({ id, to, from, subject, date }) => ({ id, to, from, subject, date })) });
  });
  r.get('/:id', validate({ params: z.object({ id: z.string().max(40) }) }), async (req, res) => {
    const m = await readMail(deps.env.mailDir, String(req.params.id));
    if (!m) throw notFound('No such message.');
    res.json(m);
  });
  return r;
}
