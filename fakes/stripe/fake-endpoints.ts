// Endpoints of the fake itself (not Stripe's), for tests and local debugging: /_fake/health,
// /_fake/events (every event with its delivery record) and /_fake/events/:id/retry.
import type http from 'node:http';
import type { Fake } from './context.ts';
import { readBody, sendJson, unrecognized } from './http.ts';

export async function handleFake(fake: Fake, req: http.IncomingMessage, res: http.ServerResponse, pathname: string): Promise<void> {
  const { store, webhooks } = fake;
  const method = (req.method ?? 'GET').toUpperCase();
  if (method === 'GET' && pathname === '/_fake/health') return sendJson(res, 200, { ok: true });
  if (method === 'GET' && pathname === '/_fake/events') {
    const data = store
      .all('events')
      .reverse()
      .map((ev) => ({ id: ev.id, type: ev.type, created: ev.created, object_id: ev.data.object.id, delivery: store.state.deliveries[ev.id] ?? null, event: ev }));
    return sendJson(res, 200, { object: 'list', data, has_more: false, webhook_url: webhooks.webhookUrl });
  }
  const m = /^\/_fake\/events\/([^/]+)\/retry$/.exec(pathname);
  if (method === 'POST' && m?.[1]) {
    await readBody(req, 1024);
    const delivery = await webhooks.retry(m[1]);
    if (!delivery) return sendJson(res, 404, { error: { type: 'invalid_request_error', code: 'resource_missing', message: `No such event: '${m[1]}'` } });
    return sendJson(res, 200, { delivery });
  }
  return unrecognized(res, method, pathname);
}
