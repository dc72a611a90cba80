// Replies built from stored objects: copies with `expand[]` applied, and list pages (newest first,
// `starting_after` / `ending_before` paging), as the Stripe API reference describes them.
import { invalid } from './http.ts';
import type { ListQuery } from './params.ts';
import { clone, type Store } from './store.ts';
import type { ApiList, LineItem } from './types.ts';

/** A Checkout Session's line items as a list object. */
export function lineItemsList(store: Store, sessionId: string): ApiList<LineItem> {
  const data = clone(store.state.session_extra[sessionId]?.line_items ?? []);
  return { object: 'list', data, has_more: false, url: `/v1/checkout/sessions/${sessionId}/line_items` };
}

const isRecord = (v: unknown): v is Record<string, unknown> => v !== null && typeof v === 'object';

/** Replaces the id at `segs` (a path like `payment_intent.latest_charge`) by a copy of its object, in place. */
function expandPath(store: Store, o: unknown, segs: string[]): void {
  if (!isRecord(o) || segs.length === 0) return;
  const [head = '', ...rest] = segs;
  if (head === 'data' && o.object === 'list' && Array.isArray(o.data)) {
    for (const item of o.data) expandPath(store, item, rest);
    return;
  }
  if (head === 'line_items' && o.object === 'checkout.session' && typeof o.id === 'string') {
    o.line_items = lineItemsList(store, o.id);
    expandPath(store, o.line_items, rest);
    return;
  }
  const v = o[head];
  if (typeof v === 'string') {
    const found = store.lookup(v);
    if (found) o[head] = clone(found);
  }
  expandPath(store, o[head], rest);
}

/**
 * A copy of `o` with each `expand[]` path expanded. The reply type stays `T`: an expanded field
 * holds the object where `T` says id, as Stripe does.
 */
export function withExpand<T extends object>(store: Store, o: T, expand: string[] | undefined): T {
  const out = clone(o);
  for (const p of expand ?? []) expandPath(store, out, p.split('.'));
  return out;
}

/** One page of `items` (kept oldest first), newest first as Stripe lists them. */
export function listOf<T extends { id: string }>(store: Store, items: T[], url: string, q: ListQuery): ApiList<T> {
  const all = [...items].reverse();
  const limit = q.limit ?? 10;
  let page: T[];
  let hasMore: boolean;
  if (q.starting_after) {
    const i = all.findIndex((x) => x.id === q.starting_after);
    if (i < 0) throw invalid(`No such object: '${q.starting_after}'`, { code: 'resource_missing', param: 'starting_after' });
    page = all.slice(i + 1, i + 1 + limit);
    hasMore = i + 1 + limit < all.length;
  } else if (q.ending_before) {
    const i = all.findIndex((x) => x.id === q.ending_before);
    if (i < 0) throw invalid(`No such object: '${q.ending_before}'`, { code: 'resource_missing', param: 'ending_before' });
    page = all.slice(Math.max(0, i - limit), i);
    hasMore = i - limit > 0;
  } else {
    page = all.slice(0, limit);
    hasMore = limit < all.length;
  }
  const list: ApiList<T> = { object: 'list', data: page, has_more: hasMore, url };
  return withExpand(store, list, q.expand);
}
