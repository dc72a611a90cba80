/**
 * The catalogue's reads. Search and list are hand-written SQL over prepared statements (the hot path
 * of the site; see bench/catalog.ts): FTS5 for `q`, the denormalised live_* columns for filters and
 * sort, and a join on the shop's state so a suspended shop's listings vanish at once.
 */

import type { Statement } from 'better-sqlite3';
import { and, eq, getTableColumns } from 'drizzle-orm';
import type { CatalogQuery } from '../../../shared/schemas/catalog.ts';
import type { Db } from '../../db/client.ts';
import { listings, materials, motifs, shops, uploads } from '../../db/schema.ts';
import { amongShop, listingsWithShop, materialSwatch } from '../../db/shared-queries.repo.ts';

export type CatalogRow = {
  id: string;
  slug: string;
  title: string;
  priceMinor: number;
  currency: string;
  occasions: string | null;
  thumb: string | null;
  shopSlug: string;
  shopName: string;
};

/** Words of the query as FTS5 prefix terms, quoted so no FTS syntax from the user is interpreted. */
export function ftsQuery(q: string): string | null {
  const words =
    q
      .normalize('NFC')
      .match(/[\p{L}\p{N}]+/gu)
      ?.slice(0, 8) ?? [];
  return words.length ? words.map((w) => `"${w}"*`).join(' AND ') : null;
}

const ORDER: Record<CatalogQuery['sort'], string> = {
  newest: 'l.published_at DESC, l.id',
  price_asc: 'l.live_price_minor ASC, l.published_at DESC, l.id',
  price_desc: 'l.live_price_minor DESC, l.published_at DESC, l.id',
};

type Built = { where: string; params: unknown[] };
function build(q: CatalogQuery & { fts: string | null }): Built {
  const where = ["l.state = 'live'", "s.state = 'live'"];
  const params: unknown[] = [];
  if (q.fts) {
    // the FROM clause starts at the FTS match (see catalogPage), then looks listings up by id
    where.push('listings_fts MATCH ?');
    params.push(q.fts);
  }
  if (q.occasion) {
    where.push('l.live_occasions LIKE ?');
    params.push(`%,${q.occasion},%`);
  }
  if (q.blank) {
    where.push('l.live_blank_kind = ?');
    params.push(q.blank);
  }
  if (q.shop) {
    where.push('s.slug = ?');
    params.push(q.shop);
  }
  if (q.minPrice !== undefined) {
    where.push('l.live_price_minor >= ?');
    params.push(q.minPrice);
  }
  if (q.maxPrice !== undefined) {
    where.push('l.live_price_minor <= ?');
    params.push(q.maxPrice);
  }
  return { where: where.join(' AND '), params };
}

type Stmts = { page: Map<string, Statement>; version: Statement };
const statements = new WeakMap<object, Stmts>();
function stmts(db: Db): Stmts {
  let s = statements.get(db.$client);
  if (!s) {
    s = { page: new Map(), version: db.$client.prepare('SELECT total_changes()').pluck() };
    statements.set(db.$client, s);
  }
  return s;
}
function prepared(db: Db, key: string, sqlText: string): Statement {
  const s = stmts(db);
  let st = s.page.get(key);
  if (!st) {
    st = db.$client.prepare(sqlText);
    s.page.set(key, st);
  }
  return st;
}

/**
 * A small read cache for catalogue pages, keyed by the query and the database's write counters:
 * `total_changes()` (every write on our connection) and `PRAGMA data_version` (writes by other
 * connections, e.g. a seed run). Any write anywhere invalidates it, so a suspension, approval or
 * edit is visible on the very next request; between writes, a popular search is answered from memory.
 */
const cache = new WeakMap<object, Map<string, { version: string; value: { rows: CatalogRow[]; total: number } }>>();
const CACHE_MAX = 500;

export function catalogPage(db: Db, q: CatalogQuery): { rows: CatalogRow[]; total: number } {
  const pageSize = q.limit;
  const fts = q.q ? ftsQuery(q.q) : null;
  if (q.q && !fts) return { rows: [], total: 0 };
  const version = `${stmts(db).version.get()}:${db.$client.pragma('data_version', { simple: true })}`;
  const key = JSON.stringify([fts, q.occasion, q.blank, q.shop, q.minPrice, q.maxPrice, q.sort, q.page, pageSize]);
  let c = cache.get(db.$client);
  if (!c) cache.set(db.$client, (c = new Map()));
  const hit = c.get(key);
  if (hit && hit.version === version) return hit.value;

  const { where, params } = build({ ...q, fts });
  const shape = JSON.stringify([!!fts, !!q.occasion, !!q.blank, !!q.shop, q.minPrice !== undefined, q.maxPrice !== undefined, q.sort]);
  const from = fts ? 'FROM listings_fts JOIN listings l ON l.id = listings_fts.listing_id JOIN shops s ON s.id = l.shop_id' : 'FROM listings l JOIN shops s ON s.id = l.shop_id';
  const total = prepared(db, `count:${shape}`, `SELECT count(*) ${from} WHERE ${where}`)
    .pluck()
    .get(...params) as number;
  const rows =
    total === 0
      ? []
      : (prepared(
          db,
          `page:${shape}`,
          `SELECT l.id, l.slug, l.live_title AS title, l.live_price_minor AS priceMinor, l.currency, l.live_occasions AS occasions,
       l.live_thumb_path AS thumb, s.slug AS shopSlug, s.name AS shopName
     ${from} WHERE ${where} ORDER BY ${ORDER[q.sort]} LIMIT ? OFFSET ?`,
        ).all(...params, pageSize, (q.page - 1) * pageSize) as CatalogRow[]);
  const value = { rows, total };
  if (c.size >= CACHE_MAX) c.delete(c.keys().next().value!);
  c.set(key, { version, value });
  return value;
}

export const liveListingBySlug = (db: Db, slug: string) =>
  listingsWithShop(db)
    .where(and(eq(listings.slug, slug), eq(listings.state, 'live'), eq(shops.state, 'live')))
    .get();
export const anyListingBySlug = (db: Db, slug: string) => listingsWithShop(db).where(eq(listings.slug, slug)).get();
export const liveShopBySlug = (db: Db, slug: string) =>
  db
    .select()
    .from(shops)
    .where(and(eq(shops.slug, slug), eq(shops.state, 'live')))
    .get();
export const shopOwnedBy = (db: Db, userId: string) => db.select({ id: shops.id }).from(shops).where(eq(shops.ownerId, userId)).get();

export const photosOf = (db: Db, shopId: string, ids: string[]) => amongShop(db, uploads, getTableColumns(uploads), shopId, ids);
export const motifsOf = (db: Db, shopId: string, ids: string[]) => amongShop(db, motifs, getTableColumns(motifs), shopId, ids);
export const materialsOf = (db: Db, shopId: string, ids: string[]) => amongShop(db, materials, materialSwatch, shopId, ids);
export { visibleRatings } from '../../db/shared-queries.repo.ts';
