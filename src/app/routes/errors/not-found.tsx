import { ButtonLink } from '../../../components/ui/button.tsx';
import { paths } from '../../../config/paths.ts';

export function NotFoundPage() {
  return (
    <section aria-labelledby="not-found-title" className="mx-auto max-w-xl py-12 text-center">
      <p className="text-sm font-bold tracking-wide text-thread-deep uppercase">404 · Page not found</p>
      <h1 id="not-found-title" className="mt-2 text-3xl font-extrabold">
        This page has slipped off the press
      </h1>
      <p className="mt-3 text-lg text-ink-soft">The link may be old, or the address may have a typo. Let's get you back to something that exists.</p>
      <div className="mt-8 flex flex-wrap justify-center gap-3">
        <ButtonLink to={paths.home.getHref()}>Go to the home page</ButtonLink>
        <ButtonLink to={paths.search.getHref()} variant="secondary">
          Browse the shops
        </ButtonLink>
      </div>
    </section>
  );
}
