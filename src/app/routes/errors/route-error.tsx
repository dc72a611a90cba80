import { isRouteErrorResponse, useRouteError } from 'react-router-dom';
import { NotFoundPage } from './not-found.tsx';

/** Last line of defence: a render error shows a calm message, never a stack trace. */
export function RouteErrorPage() {
  const error = useRouteError();
  if (isRouteErrorResponse(error) && error.status === 404) return <NotFoundPage />;
  if (import.meta.env.DEV) console.error(error);
  return (
    <section role="alert" className="mx-auto max-w-xl px-4 py-16 text-center">
      <h1 className="text-3xl font-extrabold">Something went wrong on this page</h1>
      <p className="mt-3 text-lg text-ink-soft">Reloading usually helps. If it keeps happening, please tell us what you were doing.</p>
      <a href="/" className="mt-8 inline-flex min-h-11 items-center rounded-lg bg-marigold px-5 font-bold text-ink">
        Go to the home page
      </a>
    </section>
  );
}
