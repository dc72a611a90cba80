/**
 * The query cache a server render hands to the browser: dehydrated after the render, written into
 * the page as JSON (never run as script: the page's CSP allows no inline script), taken back in
 * before hydrating. Failed queries (a listing's 404) travel too, so the first browser render
 * shows what the server showed; their errors come back as ApiError.
 */
import { type DehydratedState, dehydrate, hydrate, type QueryClient } from '@tanstack/react-query';
import { ApiError } from '../../lib/api-client.ts';

export const SSR_STATE_ID = 'namesake-ssr-state';

/** JSON safe inside a <script> element: no `<` (so no `</script>`), no line separators. */
export function jsonForScript(value: unknown): string {
  return JSON.stringify(value)
    .replace(/</g, '\\u003c')
    .replace(/\u2028/g, '\\u2028')
    .replace(/\u2029/g, '\\u2029');
}

export function dehydrateQueryCache(client: QueryClient): string {
  const state = dehydrate(client, {
    shouldDehydrateQuery: (q) => q.state.status === 'success' || q.state.status === 'error',
    shouldRedactErrors: () => false,
  });
  for (const q of state.queries) {
    const e = q.state.error;
    if (e instanceof ApiError) (q.state as { error: unknown }).error = { status: e.status, code: e.code, message: e.message };
    q.state.fetchFailureReason = null;
    // no clock in the page: the same data gives the same HTML (and ETag); the browser dates it on arrival
    q.state.dataUpdatedAt = 0;
    q.state.errorUpdatedAt = 0;
    (q as { dehydratedAt?: number }).dehydratedAt = undefined;
  }
  return jsonForScript(state);
}

export function hydrateQueryCache(client: QueryClient, json: string): void {
  const state = JSON.parse(json) as DehydratedState;
  const now = Date.now();
  for (const q of state.queries) {
    if (q.state.status === 'success') q.state.dataUpdatedAt = now;
    if (q.state.status === 'error') q.state.errorUpdatedAt = now;
    const e = q.state.error as { status?: number; code?: string; message?: string } | null;
    if (e && typeof e.status === 'number') {
      (q.state as { error: unknown }).error = new ApiError(e.status, e.code ?? `http_${e.status}`, e.message ?? '');
      // the server already asked (a 404 stays a 404): no second, failing request on mount
      client.setQueryDefaults(q.queryKey, { retryOnMount: false });
    }
  }
  hydrate(client, state);
}
