// The /v1 API: authentication with a secret test key, form or query parameters, routing to the
// resource handlers, and idempotent replays (Stripe API docs, "Idempotent requests").
import type http from 'node:http';
import type { Fake } from './context.ts';
import { ApiError, FormParseError, invalid, parseForm, readBody, send, sendJson } from './http.ts';
import { newId, requestFingerprint } from './store.ts';
import { DEFAULT_API_VERSION } from './webhooks.ts';

const MAX_BODY = 1024 * 1024;

/** One API request as a handler sees it. */
export interface ApiCall {
  params: Record<string, unknown>;
  /** The `:id` of the path, or '' when the route has none. */
  id: string;
  apiVersion: string;
  requestId: string;
  idempotencyKey: string | null;
}

/**
 * A resource handler. Handlers are synchronous, so no other request runs between an idempotency
 * key's check and its record. The reply is sent as JSON.
 */
export type Handler = (fake: Fake, call: ApiCall) => object;

function checkAuth(req: http.IncomingMessage): void {
  const h = req.headers.authorization ?? '';
  let key = '';
  const bearer = /^Bearer\s+(\S+)$/i.exec(h);
  const basic = /^Basic\s+(\S+)$/i.exec(h);
  if (bearer) key = bearer[1]!;
  else if (basic) key = Buffer.from(basic[1]!, 'base64').toString('utf8').split(':')[0] ?? '';
  if (!key) throw new ApiError(401, 'invalid_request_error', 'You did not provide an API key. Send it as `Authorization: Bearer sk_test_...`.');
  if (!/^sk_test_\S+$/.test(key)) {
    throw new ApiError(401, 'invalid_request_error', `Invalid API Key provided: ${key.slice(0, 8)}****. The local Stripe fake takes secret test keys (sk_test_...) only.`, { code: 'api_key_invalid' });
  }
}

function parseParams(text: string): Record<string, unknown> {
  try {
    return parseForm(text);
  } catch (e) {
    if (e instanceof FormParseError) throw invalid(e.message, { code: 'parameter_invalid' });
    throw e;
  }
}

interface Route {
  method: 'GET' | 'POST';
  re: RegExp;
  handler: Handler;
}

export class ApiRouter {
  private readonly routes: Route[] = [];

  constructor(private readonly fake: Fake) {}

  /** Adds a route; `:id` in `pattern` matches one path segment. */
  add(method: Route['method'], pattern: string, handler: Handler): this {
    this.routes.push({ method, re: new RegExp(`^${pattern.replace(/:(\w+)/g, '([^/]+)')}$`), handler });
    return this;
  }

  private match(method: string, pathname: string): { route: Route; id: string } | null {
    for (const route of this.routes) {
      const m = route.method === method ? route.re.exec(pathname) : null;
      if (m) return { route, id: m[1] ?? '' };
    }
    return null;
  }

  async handle(req: http.IncomingMessage, res: http.ServerResponse, url: URL, pathname: string): Promise<void> {
    const { store } = this.fake;
    const method = (req.method ?? 'GET').toUpperCase();
    const requestId = newId('req_', 14);
    const apiVersion = typeof req.headers['stripe-version'] === 'string' ? req.headers['stripe-version'] : DEFAULT_API_VERSION;
    const idemHeader = req.headers['idempotency-key'];
    const idempotencyKey = method === 'POST' && typeof idemHeader === 'string' && idemHeader ? idemHeader : null;
    const headers: Record<string, string> = { 'request-id': requestId, 'stripe-version': apiVersion };
    if (idempotencyKey) headers['idempotency-key'] = idempotencyKey;
    try {
      const raw = method === 'POST' ? await readBody(req, MAX_BODY) : '';
      checkAuth(req);
      if (idempotencyKey && idempotencyKey.length > 255) throw invalid('Idempotency-Key must be at most 255 characters.', { code: 'parameter_invalid' });
      const params = parseParams(method === 'POST' ? raw : url.search.slice(1));
      const found = this.match(method, pathname);
      if (!found) throw new ApiError(404, 'invalid_request_error', `Unrecognized request URL (${method}: ${pathname}).`);
      const { route, id } = found;

      let fingerprint = '';
      if (idempotencyKey) {
        fingerprint = requestFingerprint(method, pathname, params);
        const rec = store.idempotent(idempotencyKey);
        if (rec) {
          if (rec.fingerprint !== fingerprint) {
            throw new ApiError(
              400,
              'idempotency_error',
              `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${idempotencyKey}' if you meant to execute a different request.`,
            );
          }
          await store.settled();
          send(res, rec.status, rec.body, { 'content-type': 'application/json; charset=utf-8', ...headers, 'idempotent-replayed': 'true' });
          return;
        }
      }
      const body = route.handler(this.fake, { params, id, apiVersion, requestId, idempotencyKey });
      const text = JSON.stringify(body, null, 2);
      if (idempotencyKey) store.remember(idempotencyKey, { fingerprint, method, path: pathname, status: 200, body: text, created: Date.now() });
      if (method === 'POST') await store.persist();
      send(res, 200, text, { 'content-type': 'application/json; charset=utf-8', ...headers });
    } catch (e) {
      if (e instanceof ApiError) {
        sendJson(res, e.status, e.body(), headers);
        return;
      }
      throw e;
    }
  }
}
