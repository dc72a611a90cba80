import { Router } from 'express';
import { z } from 'zod';
import { mailPage, readMail } from '../../../fakes/mail/store.ts';
import { type PageQuery, pageOffset, pageQuery, toPage } from '../../../shared/schemas/pagination.ts';
import type { AppDeps } from '../../deps.ts';
import { notFound } from '../../http/app-error.ts';
import { requireRole } from '../../http/auth-guards.ts';
import { validate } from '../../http/validate.ts';

/** messages per page of the admin mail list (newest first) */
export const MAIL_PAGE_SIZE = 50;

/** Admin-only view of the mail the local fake captured (development and demo). */
export function adminMailRouter(deps: AppDeps): Router {
  const r = Router();
  r.use(requireRole('admin'));
  r.get('/', validate({ query: pageQuery(MAIL_PAGE_SIZE) }), async (_req, res) => {
    const q = res.locals.query as PageQuery;
    const { items, total } = await mailPage(deps.env.mailDir, pageOffset(q), q.limit);
    res.json(
      toPage(
        items.map(({ id, to, from, subject, date }) => ({ id, to, from, subject, date })),
        total,
        q,
      ),
    );
  });
  r.get('/:id', validate({ params: z.object({ id: z.string().max(40) }) }), async (req, res) => {
    const m = await readMail(deps.env.mailDir, String(req.params.id));
    if (!m) throw notFound('No such message.');
    res.json(m);
  });
  return r;
}
