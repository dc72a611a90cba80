/**
 * The one pagination contract of every list the API serves: `?page=&limit=` in, a `Page` out.
 * Pages are numbered from 1; `limit` is bounded so no request can ask for a whole table.
 */
import { z } from 'zod';

export const PAGE_LIMIT_DEFAULT = 25;
export const PAGE_LIMIT_MAX = 100;
/** the highest page number a request may ask for (deep offsets are refused before any query) */
export const PAGE_MAX = 10_000;

const wholePage = 'Give the page as a whole number, 1 or more.';
const wholeLimit = `Give the number of rows per page as a whole number from 1 to ${PAGE_LIMIT_MAX}.`;

/** `?page=&limit=` with the list's own default page size. */
export function pageQuery(defaultLimit: number = PAGE_LIMIT_DEFAULT) {
  return z.object({
    page: z.coerce
      .number({ error: wholePage })
      .int(wholePage)
      .min(1, 'Pages start at 1.')
      .max(PAGE_MAX, `Ask for page ${PAGE_MAX.toLocaleString('en-US')} or lower.`)
      .default(1),
    limit: z.coerce.number({ error: wholeLimit }).int(wholeLimit).min(1, wholeLimit).max(PAGE_LIMIT_MAX, wholeLimit).default(defaultLimit),
  });
}
export const pageQuerySchema = pageQuery();
export type PageQuery = z.output<typeof pageQuerySchema>;
/** what a client sends: both optional (the server fills the defaults) */
export type PageInput = { page?: number; limit?: number };

/** One page of a list: the rows, how many rows the whole (filtered) list has, and where we are. */
export type Page<T> = { items: T[]; total: number; page: number; limit: number };
export const pageSchema = <T extends z.ZodType>(item: T) => z.object({ items: z.array(item), total: z.number().int().min(0), page: z.number().int().min(1), limit: z.number().int().min(1) });

/** rows to skip for this page */
export const pageOffset = (q: PageQuery): number => (q.page - 1) * q.limit;
export const toPage = <T>(items: T[], total: number, q: PageQuery): Page<T> => ({ items, total, page: q.page, limit: q.limit });
/** pages in a list of `total` rows (an empty list still has its one, empty, page) */
export const pageCount = (total: number, limit: number): number => Math.max(1, Math.ceil(total / Math.max(1, limit)));

/** `page=…&limit=…` for a request, leaving out what the server defaults anyway. */
export function pageSearch(p: PageInput, into = new URLSearchParams()): URLSearchParams {
  if (p.page && p.page > 1) into.set('page', String(p.page));
  if (p.limit) into.set('limit', String(p.limit));
  return into;
}
