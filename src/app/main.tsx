import '@fontsource-variable/nunito';
import './index.css';
import { StrictMode, startTransition, useEffect } from 'react';
import { createRoot, hydrateRoot } from 'react-dom/client';
import { matchRoutes, RouterProvider } from 'react-router-dom';
import { queryClient } from '../lib/query-client.ts';
import { AppProviders } from './providers.tsx';
import { createAppRouter, routes } from './router.tsx';
import { hydrateQueryCache, SSR_STATE_ID } from './ssr/query-state.ts';

const root = document.getElementById('root');
if (!root) throw new Error('index.html must contain <div id="root">.');

// Load the first page's lazy routes before the router starts, so the first render is the page itself.
// A server-rendered page (src/app/ssr/entry-server.tsx) also carries its query cache: take it in,
// then hydrate the HTML that is already on screen. Other pages render afresh.
const lazyMatches = matchRoutes(routes, window.location)?.filter((m) => m.route.lazy) ?? [];
await Promise.all(
  lazyMatches.map(async (m) => {
    const loaded = await (m.route.lazy as () => Promise<object>)();
    Object.assign(m.route, { ...loaded, lazy: undefined });
  }),
);
const stateEl = document.getElementById(SSR_STATE_ID);
if (stateEl?.textContent) {
  // let the browser breathe between running the scripts and hydrating (two shorter tasks, not one long one)
  await new Promise((resolve) => setTimeout(resolve, 0));
  hydrateQueryCache(queryClient, stateEl.textContent);
  // as a transition, hydration yields to the browser between pieces instead of one long task
  startTransition(() => {
    hydrateRoot(root, app());
  });
} else {
  createRoot(root).render(app());
}

/** Marks the page live once React has taken over the server's HTML (browser tests wait for it before tapping). */
function MarkHydrated() {
  useEffect(() => {
    document.documentElement.dataset.hydrated = 'true';
  }, []);
  return null;
}

function app() {
  return (
    <StrictMode>
      <MarkHydrated />
      <AppProviders>
        <RouterProvider router={createAppRouter()} />
      </AppProviders>
    </StrictMode>
  );
}
