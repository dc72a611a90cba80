import { type FormEvent, useEffect, useId, useMemo, useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { BLANK_DEFAULTS, BLANK_KINDS, OCCASION_LABELS, OCCASIONS } from '../../../../shared/schemas/listing.ts';
import { pageCount } from '../../../../shared/schemas/pagination.ts';
import { Button } from '../../../components/ui/button.tsx';
import { PageHeading, StitchedBox } from '../../../components/ui/card.tsx';
import { Pager } from '../../../components/ui/pager.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { paths } from '../../../config/paths.ts';
import { useListings } from '../../../features/catalog/api/get-listings.ts';
import { ListingGrid } from '../../../features/catalog/components/listing-card.tsx';
import { ListingGridSkeleton } from '../../../features/catalog/components/listing-grid-skeleton.tsx';
import { readSearchState, type SearchState, toFilters, writeSearchState } from '../../../features/catalog/lib/search-params.ts';

const SORT_LABELS = { newest: 'Newest first', price_asc: 'Price, low to high', price_desc: 'Price, high to low' } as const;

/** /search: full-text search with filters and sort; every choice lives in the URL. */
export function SearchPage() {
  const [params, setParams] = useSearchParams();
  const state = useMemo(() => readSearchState(params), [params]);
  const { filters, invalid } = toFilters(state);
  const list = useListings(filters);
  // shops for the shop filter: those with listings matching everything but the shop itself
  const { filters: withoutShop } = toFilters({ ...state, shop: '', page: 1 });
  const shopSource = useListings(withoutShop);
  const shops = useMemo(() => {
    const m = new Map<string, string>();
    for (const i of shopSource.data?.items ?? []) m.set(i.shop.slug, i.shop.name);
    for (const i of list.data?.items ?? []) m.set(i.shop.slug, i.shop.name);
    if (state.shop && !m.has(state.shop)) m.set(state.shop, state.shop);
    return [...m].sort((a, b) => a[1].localeCompare(b[1]));
  }, [shopSource.data, list.data, state.shop]);

  // typed fields apply on submit; selects apply at once
  const [q, setQ] = useState(state.q);
  const [minPrice, setMinPrice] = useState(state.minPrice);
  const [maxPrice, setMaxPrice] = useState(state.maxPrice);
  useEffect(() => {
    setQ(state.q);
    setMinPrice(state.minPrice);
    setMaxPrice(state.maxPrice);
  }, [state.q, state.minPrice, state.maxPrice]);

  const update = (patch: Partial<SearchState>) => {
    const next = { ...state, page: 1, ...patch };
    const out = new URLSearchParams();
    for (const [k, v] of Object.entries(writeSearchState(next))) if (v) out.set(k, v);
    setParams(out);
  };
  const submit = (e: FormEvent) => {
    e.preventDefault();
    update({ q, minPrice, maxPrice });
  };

  const selectId = useId();
  const [filtersOpen, setFiltersOpen] = useState(false);
  const filtersSet = [state.occasion, state.blank, state.shop, state.minPrice, state.maxPrice].filter(Boolean).length;
  const serverFields = list.error && 'fields' in list.error ? (list.error.fields as Record<string, string> | undefined) : undefined;
  const priceError = invalid ? 'Enter a price like 15 or 15.50.' : (serverFields?.minPrice ?? serverFields?.maxPrice);
  const title = state.q ? `Results for “${state.q}”` : state.occasion ? OCCASION_LABELS[state.occasion] : 'Everything on Namesake';
  const pages = list.data ? pageCount(list.data.total, list.data.limit) : 1;
  const selectClass = 'min-h-11 w-full rounded-lg border-2 border-field bg-white px-3 py-2 text-base text-ink hover:border-ink';

  return (
    <div>
      <PageHeading eyebrow="Browse" title={title} lead="Totes, tees, pouches and drawstring bags, personalised by small shops." />

      <search aria-label="Search listings">
        <form onSubmit={submit} className="mb-8 flex flex-col gap-5 rounded-lg border border-line bg-white p-5 shadow-sm">
          <div className="flex flex-col gap-3 sm:flex-row sm:items-end">
            <TextField label="Search" type="search" name="q" value={q} onChange={(e) => setQ(e.target.value)} placeholder="tote, rocket, birthday…" className="flex-1" maxLength={100} />
            <Button type="submit">Search</Button>
          </div>
          {/* on a phone the filters fold away behind one button, so the first screen shows listings */}
          <Button variant="secondary" className="sm:hidden" aria-expanded={filtersOpen} aria-controls={`${selectId}-filters`} onClick={() => setFiltersOpen((o) => !o)}>
            {filtersOpen ? 'Hide filters' : `Filters and sort${filtersSet ? ` (${filtersSet} set)` : ''}`}
          </Button>
          <div id={`${selectId}-filters`} className={`flex flex-col gap-5 ${filtersOpen ? '' : 'max-sm:hidden'}`}>
            <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
              <div className="flex flex-col gap-1.5">
                <label htmlFor={`${selectId}-occasion`} className="font-bold">
                  Occasion
                </label>
                <select id={`${selectId}-occasion`} className={selectClass} value={state.occasion} onChange={(e) => update({ occasion: e.target.value as SearchState['occasion'] })}>
                  <option value="">Any occasion</option>
                  {OCCASIONS.map((o) => (
                    <option key={o} value={o}>
                      {OCCASION_LABELS[o]}
                    </option>
                  ))}
                </select>
              </div>
              <div className="flex flex-col gap-1.5">
                <label htmlFor={`${selectId}-blank`} className="font-bold">
                  Item
                </label>
                <select id={`${selectId}-blank`} className={selectClass} value={state.blank} onChange={(e) => update({ blank: e.target.value as SearchState['blank'] })}>
                  <option value="">Any item</option>
                  {BLANK_KINDS.map((b) => (
                    <option key={b} value={b}>
                      {BLANK_DEFAULTS[b].label}
                    </option>
                  ))}
                </select>
              </div>
              <div className="flex flex-col gap-1.5">
                <label htmlFor={`${selectId}-shop`} className="font-bold">
                  Shop
                </label>
                <select id={`${selectId}-shop`} className={selectClass} value={state.shop} onChange={(e) => update({ shop: e.target.value })}>
                  <option value="">Any shop</option>
                  {shops.map(([slug, name]) => (
                    <option key={slug} value={slug}>
                      {name}
                    </option>
                  ))}
                </select>
              </div>
              <div className="flex flex-col gap-1.5">
                <label htmlFor={`${selectId}-sort`} className="font-bold">
                  Sort
                </label>
                <select id={`${selectId}-sort`} className={selectClass} value={state.sort} onChange={(e) => update({ sort: e.target.value as SearchState['sort'] })}>
                  {Object.entries(SORT_LABELS).map(([v, l]) => (
                    <option key={v} value={v}>
                      {l}
                    </option>
                  ))}
                </select>
              </div>
            </div>
            <fieldset className="flex flex-col gap-2">
              <legend className="mb-1.5 font-bold">Price (USD)</legend>
              <div className="flex flex-wrap items-end gap-3">
                <TextField
                  label="From"
                  inputMode="decimal"
                  value={minPrice}
                  onChange={(e) => setMinPrice(e.target.value)}
                  placeholder="0"
                  className="w-28"
                  aria-invalid={invalid === 'minPrice' || !!serverFields?.minPrice || undefined}
                />
                <TextField
                  label="To"
                  inputMode="decimal"
                  value={maxPrice}
                  onChange={(e) => setMaxPrice(e.target.value)}
                  placeholder="any"
                  className="w-28"
                  aria-invalid={invalid === 'maxPrice' || !!serverFields?.maxPrice || undefined}
                />
                <Button type="submit" variant="secondary">
                  Apply price
                </Button>
              </div>
              {priceError ? (
                <p role="alert" className="text-sm font-semibold text-danger">
                  {priceError}
                </p>
              ) : null}
            </fieldset>
          </div>
        </form>
      </search>

      <div aria-live="polite" className="mb-4 text-ink-soft">
        {list.data ? `${list.data.total} ${list.data.total === 1 ? 'listing' : 'listings'}${pages > 1 ? ` · page ${state.page} of ${pages}` : ''}` : null}
      </div>

      {list.isPending ? (
        <ListingGridSkeleton count={8} />
      ) : list.isError && !list.data ? (
        <StitchedBox className="py-10 text-center">
          <p className="text-lg font-bold">The listings didn't load</p>
          <p className="mt-1 text-ink-soft">{list.error.message}</p>
        </StitchedBox>
      ) : list.data.items.length === 0 ? (
        <StitchedBox className="py-14 text-center">
          <p className="text-lg font-bold">Nothing matches yet</p>
          <p className="mt-1 text-ink-soft">Try fewer words, another occasion, or clear the filters.</p>
          <Link to={paths.search.getHref()} className="mt-3 inline-block font-bold text-thread-deep underline">
            Clear all filters
          </Link>
        </StitchedBox>
      ) : (
        <div className={list.isPlaceholderData ? 'opacity-60 transition-opacity' : ''}>
          <ListingGrid items={list.data.items} eagerFirst={2} />
        </div>
      )}

      {list.data ? (
        <Pager className="mt-8 items-center" page={state.page} total={list.data.total} limit={list.data.limit} label="Result pages" noun="listings" onPageChange={(page) => update({ page })} />
      ) : null}
    </div>
  );
}
