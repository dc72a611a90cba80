import { Outlet, ScrollRestoration } from 'react-router-dom';
import { SiteFooter } from './site-footer.tsx';
import { SiteHeader } from './site-header.tsx';

export function AppLayout() {
  return (
    <div className="flex min-h-dvh flex-col">
      <SiteHeader />
      <main id="main" tabIndex={-1} className="mx-auto w-full max-w-6xl flex-1 px-4 py-8 focus:outline-none sm:px-6 sm:py-12">
        <Outlet />
      </main>
      <SiteFooter />
      <ScrollRestoration />
    </div>
  );
}
