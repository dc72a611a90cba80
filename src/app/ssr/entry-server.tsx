/**
 * Server rendering of the public pages (home, search, listing, shop, and the not-found page) with
 * React Router's data-mode static handler. The server (server/features/ssr) builds this file with
 * Vite (`vite build` also writes dist-ssr/entry-server.js) and calls render() for each page
 * request, handing it the pages' data (shared/ssr-contract.ts). The query cache is filled with
 * exactly what the JSON routes answer, under the keys the pages read, so the pages render as they
 * are; the browser takes the cache over (src/app/main.tsx) and hydrates.
 */
import { QueryClientProvider } from '@tanstack/react-query';
import { renderToStaticMarkup, renderToString } from 'react-dom/server';
import { createStaticHandler, createStaticRouter, StaticRouterProvider } from 'react-router-dom';
import { blankFor } from '../../../shared/engine/listing-design.ts';
import type { ListingPage } from '../../../shared/schemas/catalog.ts';
import { OCCASION_LABELS } from '../../../shared/schemas/listing.ts';
import { PREVIEW_NAME, type PreviewPieces, type SsrEntry, type SsrRenderInput, type SsrResult } from '../../../shared/ssr-contract.ts';
import { DesignOnBlank, DesignPieces, pictureOfListingBlank } from '../../components/design/design-on-blank.tsx';
import { ToastProvider } from '../../components/ui/toast.tsx';
import { occasions, paths } from '../../config/paths.ts';
import { authKeys } from '../../features/auth/api/keys.ts';
import { listingPreviewQueryOptions } from '../../features/catalog/api/get-listing-preview.ts';
import { catalogKeys } from '../../features/catalog/api/keys.ts';
import { readSearchState, toFilters } from '../../features/catalog/lib/search-params.ts';
import { designInput } from '../../features/personaliser/lib/design.ts';
import { defaultChoices } from '../../features/personaliser/lib/saved-choices.ts';
import { ApiError } from '../../lib/api-client.ts';
import { createQueryClient } from '../../lib/query-client.ts';
import { routes } from '../router.tsx';
import { homeMeta, listingMeta, notFoundMeta, type PageMeta, renderHead, searchMeta, shopMeta } from './head.ts';
import { dehydrateQueryCache } from './query-state.ts';

const handler = createStaticHandler(routes);

const notFoundError = () => new ApiError(404, 'not_found', "We couldn't find that.");

async function render({ url, origin, data }: SsrRenderInput): Promise<SsrResult> {
  const request = new Request(url, { method: 'GET' });
  const context = await handler.query(request);
  if (context instanceof Response) return null;
  const leaf = context.matches[context.matches.length - 1];
  const path = leaf?.route.path;
  const at = new URL(url);
  const client = createQueryClient();
  let meta: PageMeta;
  let status = 200;

  // a failed read is shown as such, here and in the browser's first render (no second try on mount)
  const failed = (key: readonly unknown[], error: Error) => {
    client.setQueryDefaults(key, { retryOnMount: false });
    return client.prefetchQuery({
      queryKey: key,
      queryFn: () => {
        throw error;
      },
      retry: false,
    });
  };

  if (path === paths.home.path) {
    for (const o of occasions) {
      const filters = { occasion: o.slug, sort: 'newest' as const };
      client.setQueryData(catalogKeys.list(filters), await data.search(filters));
    }
    meta = homeMeta(origin);
  } else if (path === paths.search.path) {
    const state = readSearchState(at.searchParams);
    const { filters, invalid } = toFilters(state);
    const { filters: withoutShop } = toFilters({ ...state, shop: '', page: 1 });
    let total: number | null = null;
    if (!invalid) {
      try {
        const page = await data.search(filters);
        client.setQueryData(catalogKeys.list(filters), page);
        client.setQueryData(catalogKeys.list(withoutShop), await data.search(withoutShop));
        total = page.total;
      } catch {
        // refused filters: the browser asks again and shows the server's message
      }
    }
    const heading = state.q ? `Results for “${state.q}”` : state.occasion ? OCCASION_LABELS[state.occasion] : 'Everything on Namesake';
    meta = searchMeta(origin, at, heading, total);
  } else if (path === paths.listing.path) {
    const slug = leaf?.params.slug ?? '';
    const listing = await data.listing(slug);
    if (listing) {
      client.setQueryData(catalogKeys.listing(slug), listing);
      const input = previewInput(listing);
      client.setQueryData(listingPreviewQueryOptions(slug).queryKey, input ? await data.compose(input).catch(() => null) : null);
      meta = listingMeta(origin, listing);
    } else {
      await failed(catalogKeys.listing(slug), notFoundError());
      status = 404;
      meta = notFoundMeta(origin, at);
    }
  } else if (path === paths.shopPage.path) {
    const slug = leaf?.params.slug ?? '';
    const shop = await data.shop(slug);
    if (shop) {
      client.setQueryData(catalogKeys.shop(slug), shop);
      meta = shopMeta(origin, shop);
    } else {
      await failed(catalogKeys.shop(slug), notFoundError());
      status = 404;
      meta = notFoundMeta(origin, at);
    }
  } else if (path === '*') {
    status = 404;
    meta = notFoundMeta(origin, at);
  } else {
    // pages behind sign-in, the cart and the auth forms render in the browser only
    return null;
  }
  client.setQueryData(authKeys.me(), await data.me());

  const router = createStaticRouter(handler.dataRoutes, context);
  const html = renderToString(
    <QueryClientProvider client={client}>
      <ToastProvider>
        <StaticRouterProvider router={router} context={context} hydrate={false} />
      </ToastProvider>
    </QueryClientProvider>,
  );
  const state = dehydrateQueryCache(client);
  client.clear();
  return { status, head: renderHead(meta), html, state };
}

/** The personaliser's first choices with the default name typed in the first text field. */
function previewInput(listing: ListingPage): ReturnType<SsrEntry['previewInput']> {
  const p = listing.content.personalisation;
  const choices = defaultChoices(p);
  const first = p.textFields[0];
  if (first && choices.texts[first.id]) choices.texts[first.id] = { ...choices.texts[first.id]!, text: PREVIEW_NAME.slice(0, first.maxLength) };
  return designInput(listing, choices);
}

/** The design on its blank as a standalone SVG document, through the one drawing of it. */
function designSvg(listing: ListingPage, pieces: PreviewPieces): string {
  const markup = renderToStaticMarkup(
    <DesignOnBlank blank={pictureOfListingBlank(listing)} label={listing.content.title}>
      <DesignPieces pieces={pieces} />
    </DesignOnBlank>,
  );
  return markup.replace('<svg ', '<svg xmlns="http://www.w3.org/2000/svg" ');
}

export const entry: SsrEntry = { render, designSvg, previewInput };
export { designSvg, previewInput, render };
