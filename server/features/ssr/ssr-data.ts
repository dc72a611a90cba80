// The public pages' data for a server render: the very values the JSON routes answer (same
// services, sent through JSON once so the browser's cache holds what a fetch would have given).
import crypto from 'node:crypto';
import type { ComposeInput } from '../../../shared/engine/compose.ts';
import { catalogQuerySchema } from '../../../shared/schemas/catalog.ts';
import type { PreviewPieces, SsrData } from '../../../shared/ssr-contract.ts';
import type { AppDeps } from '../../deps.ts';
import { AppError } from '../../http/app-error.ts';
import type { SessionUser } from '../../http/auth-guards.ts';
import { getMe } from '../account/index.ts';
import { listingPage, publicShop, search } from '../catalog/index.ts';

const asJson = <T>(v: T): T => JSON.parse(JSON.stringify(v)) as T;

function orNull<T>(read: () => T): T | null {
  try {
    return asJson(read());
  } catch (e) {
    if (e instanceof AppError && e.status === 404) return null;
    throw e;
  }
}

/** Composed designs by input (the same listing's first picture is asked for on every visit). */
export type PreviewCache = Map<string, Promise<PreviewPieces>>;
const PREVIEW_CACHE_MAX = 500;

/** compose() in the worker pool, the result kept by the input's content; failures are not kept. */
export function composeCached(deps: Pick<AppDeps, 'pool'>, cache: PreviewCache, input: ComposeInput): Promise<PreviewPieces> {
  const key = crypto.createHash('sha256').update(JSON.stringify(input)).digest('hex');
  const hit = cache.get(key);
  if (hit) return hit;
  const p = deps.pool.run({ kind: 'compose', input }).then((item) => item.pieces.map((pc) => ({ d: pc.path, colourHex: pc.colour })));
  p.catch(() => cache.delete(key));
  if (cache.size >= PREVIEW_CACHE_MAX) cache.delete(cache.keys().next().value as string);
  cache.set(key, p);
  return p;
}

export function ssrData(deps: AppDeps, user: SessionUser | undefined, cache: PreviewCache): SsrData {
  return {
    me: async () => (user ? asJson(getMe(deps.db, user)) : null),
    listing: async (slug) => orNull(() => listingPage(deps.db, slug, 'live', user)),
    shop: async (slug) => orNull(() => publicShop(deps.db, slug)),
    // the route's own schema: refused filters throw here as they answer 400 there
    search: async (filters) => asJson(search(deps.db, catalogQuerySchema.parse(filters))),
    compose: (input) => composeCached(deps, cache, input),
  };
}
