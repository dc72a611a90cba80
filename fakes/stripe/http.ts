// HTTP plumbing of the Stripe fake: Stripe-shaped errors, replies, request bodies and the parser for
// Stripe-style application/x-www-form-urlencoded bodies with bracket keys
// (`line_items[0][price_data][unit_amount]=1999`, `expand[]=payment_intent`).
import type http from 'node:http';

/** An error the API answers in Stripe's shape: `{ error: { type, message, code?, param?, decline_code? } }`. */
export class ApiError extends Error {
  constructor(
    public status: number,
    public type: string,
    message: string,
    public extra: { code?: string; param?: string; decline_code?: string } = {},
  ) {
    super(message);
  }
  body(): { error: { type: string; message: string; code?: string; param?: string; decline_code?: string } } {
    return { error: { type: this.type, message: this.message, ...this.extra } };
  }
}

/** A 400 `invalid_request_error`. */
export const invalid = (message: string, extra: ApiError['extra'] = {}) => new ApiError(400, 'invalid_request_error', message, extra);

/** A 404 `resource_missing` for an id that names nothing. */
export const missing = (what: string, id: string, param = 'id') => new ApiError(404, 'invalid_request_error', `No such ${what}: '${id}'`, { code: 'resource_missing', param });

// ---------- replies ----------

export function send(res: http.ServerResponse, status: number, body: string, headers: Record<string, string>): void {
  res.writeHead(status, { 'content-length': String(Buffer.byteLength(body)), ...headers });
  res.end(body);
}

/** Stripe pretty-prints its JSON; the fake does the same. */
export const sendJson = (res: http.ServerResponse, status: number, body: unknown, headers: Record<string, string> = {}) =>
  send(res, status, JSON.stringify(body, null, 2), { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store', ...headers });

const HTML_HEADERS = {
  'content-type': 'text/html; charset=utf-8',
  'cache-control': 'no-store',
  'x-content-type-options': 'nosniff',
  'referrer-policy': 'no-referrer',
  // No form-action: it would also block the redirect to the shop's success_url.
  'content-security-policy': "default-src 'none'; style-src 'unsafe-inline'; frame-ancestors 'none'; base-uri 'none'",
};

export const sendHtml = (res: http.ServerResponse, status: number, html: string) => send(res, status, html, HTML_HEADERS);

export const redirect = (res: http.ServerResponse, location: string) => send(res, 303, '', { location, 'cache-control': 'no-store' });

/** The 404 for a path no handler serves. */
export const unrecognized = (res: http.ServerResponse, method: string | undefined, pathname: string) =>
  sendJson(res, 404, { error: { type: 'invalid_request_error', message: `Unrecognized request URL (${method}: ${pathname}).` } });

export function readBody(req: http.IncomingMessage, limit: number): Promise<string> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let size = 0;
    req.on('data', (c: Buffer) => {
      size += c.length;
      if (size > limit) {
        reject(new ApiError(413, 'invalid_request_error', 'Request body too large.'));
        req.destroy();
        return;
      }
      chunks.push(c);
    });
    req.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
    req.on('error', reject);
  });
}

// ---------- form bodies with bracket keys ----------
// Written here rather than borrowing `qs` because `qs` is only a transitive dependency of express.

export class FormParseError extends Error {}

type Node = { [key: string]: Node | string };

const MAX_DEPTH = 8;
const MAX_PAIRS = 2000;

function decode(s: string): string {
  try {
    return decodeURIComponent(s.replace(/\+/g, ' '));
  } catch {
    throw new FormParseError(`Invalid URL encoding in '${s.slice(0, 40)}'`);
  }
}

/** 'a[b][0][]' → ['a', 'b', '0', '']; a key without brackets is one segment. */
function splitKey(key: string): string[] {
  const m = /^([^[\]]+)((?:\[[^[\]]*\])*)$/.exec(key);
  if (!m) return [key];
  const segs = [m[1]!];
  const rest = m[2] ?? '';
  for (const part of rest.matchAll(/\[([^[\]]*)\]/g)) segs.push(part[1]!);
  if (segs.length > MAX_DEPTH) throw new FormParseError(`Parameter '${key}' is nested too deeply`);
  return segs;
}

function assign(root: Node, segs: string[], value: string, fullKey: string): void {
  let node: Node = root;
  for (let i = 0; i < segs.length; i++) {
    let seg = segs[i]!;
    if (seg === '') seg = String(Object.keys(node).length); // `a[]` appends
    const last = i === segs.length - 1;
    if (last) {
      if (typeof node[seg] === 'object') throw new FormParseError(`Invalid value for '${fullKey}': it is also used as a hash`);
      node[seg] = value;
    } else {
      const next = node[seg];
      if (typeof next === 'string') throw new FormParseError(`Invalid hash '${fullKey}': '${seg}' already has a value`);
      if (next === undefined) {
        const created: Node = Object.create(null) as Node;
        node[seg] = created;
        node = created;
      } else {
        node = next;
      }
    }
  }
}

/** Turns nodes whose keys are all 0..n-1 style indices into arrays; metadata stays a hash. */
function finish(node: Node | string, parentKey: string | null): unknown {
  if (typeof node === 'string') return node;
  const keys = Object.keys(node);
  const isArray = parentKey !== 'metadata' && keys.length > 0 && keys.every((k) => /^\d+$/.test(k));
  if (isArray) {
    return keys
      .map((k) => [Number(k), node[k]!] as const)
      .sort((a, b) => a[0] - b[0])
      .map(([, v]) => finish(v, null));
  }
  // Object.fromEntries defines own properties, so a '__proto__' key cannot pollute prototypes.
  return Object.fromEntries(keys.map((k) => [k, finish(node[k]!, k)]));
}

/** Parses a form body (or a query string) into nested hashes and arrays; throws FormParseError. */
export function parseForm(body: string): Record<string, unknown> {
  const root: Node = Object.create(null) as Node;
  if (body.trim() === '') return {};
  const pairs = body.split('&');
  if (pairs.length > MAX_PAIRS) throw new FormParseError('Too many parameters');
  for (const pair of pairs) {
    if (!pair) continue;
    const eq = pair.indexOf('=');
    const key = decode(eq >= 0 ? pair.slice(0, eq) : pair);
    const value = decode(eq >= 0 ? pair.slice(eq + 1) : '');
    if (!key) continue;
    assign(root, splitKey(key), value, key);
  }
  return finish(root, null) as Record<string, unknown>;
}
