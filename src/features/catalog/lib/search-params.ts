/**
 * The search page keeps its whole state in the URL (shareable, survives a reload, back button
 * works). Prices are in major units in the URL ("minPrice=15") and in minor units for the API.
 */

import { parseMajor } from '../../../../shared/money.ts';
import { CATALOG_SORTS, type CatalogQuery } from '../../../../shared/schemas/catalog.ts';
import { BLANK_KINDS, type BlankKind, OCCASIONS, type Occasion } from '../../../../shared/schemas/listing.ts';
import type { CatalogFilters } from '../api/keys.ts';

export type SearchState = {
  q: string;
  occasion: Occasion | '';
  blank: BlankKind | '';
  shop: string;
  minPrice: string;
  maxPrice: string;
  sort: CatalogQuery['sort'];
  page: number;
};

/** The marketplace's display currency for price filters (listings are priced in it). */
export const FILTER_CURRENCY = 'USD';

export function readSearchState(params: URLSearchParams): SearchState {
  const occasion = params.get('occasion') ?? '';
  const blank = params.get('blank') ?? '';
  const sort = params.get('sort') ?? 'newest';
  const page = Number(params.get('page') ?? '1');
  return {
    q: params.get('q') ?? '',
    occasion: (OCCASIONS as readonly string[]).includes(occasion) ? (occasion as Occasion) : '',
    blank: (BLANK_KINDS as readonly string[]).includes(blank) ? (blank as BlankKind) : '',
    shop: params.get('shop') ?? '',
    minPrice: params.get('minPrice') ?? '',
    maxPrice: params.get('maxPrice') ?? '',
    sort: (CATALOG_SORTS as readonly string[]).includes(sort) ? (sort as CatalogQuery['sort']) : 'newest',
    page: Number.isInteger(page) && page >= 1 && page <= 1000 ? page : 1,
  };
}

/** The URL query for a state; defaults are left out so URLs stay short. */
export function writeSearchState(state: SearchState): Record<string, string | undefined> {
  return {
    q: state.q.trim() || undefined,
    occasion: state.occasion || undefined,
    blank: state.blank || undefined,
    shop: state.shop || undefined,
    minPrice: state.minPrice.trim() || undefined,
    maxPrice: state.maxPrice.trim() || undefined,
    sort: state.sort === 'newest' ? undefined : state.sort,
    page: state.page > 1 ? String(state.page) : undefined,
  };
}

/** The API filters for a state, or the field that doesn't parse (a price like "abc"). */
export function toFilters(state: SearchState): { filters: CatalogFilters; invalid: 'minPrice' | 'maxPrice' | null } {
  const min = state.minPrice.trim() ? parseMajor(state.minPrice, FILTER_CURRENCY) : undefined;
  const max = state.maxPrice.trim() ? parseMajor(state.maxPrice, FILTER_CURRENCY) : undefined;
  const filters: CatalogFilters = { sort: state.sort, page: state.page };
  if (state.q.trim()) filters.q = state.q.trim();
  if (state.occasion) filters.occasion = state.occasion;
  if (state.blank) filters.blank = state.blank;
  if (state.shop) filters.shop = state.shop;
  if (min !== null && min !== undefined) filters.minPrice = min;
  if (max !== null && max !== undefined) filters.maxPrice = max;
  return { filters, invalid: min === null ? 'minPrice' : max === null ? 'maxPrice' : null };
}
