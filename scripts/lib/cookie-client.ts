// A browser-like API client for a running Namesake: Node's fetch keeps no cookies, so each client
// keeps its own cookie jar (the session cookie from sign-in) and sends the app's Origin, as a browser
// does on a same-origin request.

// biome-ignore lint/suspicious/noExplicitAny: callers read deep into the JSON answers without declaring each shape
type Json = Record<string, any>;

export type CookieClient = (p: string, init?: { method?: string; body?: unknown }) => Promise<{ status: number; body: Json }>;

/** A client of the API at `base`: GET without a body, POST (JSON) with one unless `method` says otherwise. */
export function cookieClient(base: string, origin = base): CookieClient {
  const jar = new Map<string, string>();
  return async (p, init = {}) => {
    const res = await fetch(base + p, {
      method: init.method ?? (init.body === undefined ? 'GET' : 'POST'),
      headers: { origin, cookie: [...jar].map(([k, v]) => `${k}=${v}`).join('; '), ...(init.body === undefined ? {} : { 'content-type': 'application/json' }) },
      body: init.body === undefined ? undefined : JSON.stringify(init.body),
    });
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const i = pair!.indexOf('=');
      jar.set(pair!.slice(0, i), pair!.slice(i + 1));
    }
    const text = await res.text();
    return { status: res.status, body: text ? (JSON.parse(text) as Json) : {} };
  };
}
