import { Navigate, Outlet, useLocation } from 'react-router-dom';
import type { Role } from '../../../../shared/schemas/auth.ts';
import { ButtonLink, Spinner } from '../../../components/ui/button.tsx';
import { paths } from '../../../config/paths.ts';
import { useMe } from '../api/get-me.ts';

const roleNames: Record<Role, string> = { shopper: 'shoppers', seller: 'sellers', admin: 'the moderation team' };

/**
 * Layout route for pages that need an account. A guest goes to sign-in and comes back here
 * afterwards (?next=); a signed-in user without one of `roles` gets a polite 403 page.
 */
export function RequireAuth({ roles }: { roles?: Role[] }) {
  const me = useMe();
  const location = useLocation();

  if (me.isPending) {
    return (
      <div className="py-16 text-center text-ink-soft">
        <Spinner label="Checking your sign-in…" />
      </div>
    );
  }
  if (me.isError) {
    return (
      <div role="alert" className="py-16 text-center">
        <p className="text-lg font-bold">We couldn't check your sign-in.</p>
        <p className="text-ink-soft">{me.error.message}</p>
      </div>
    );
  }
  if (!me.data) {
    return <Navigate to={paths.auth.signIn.getHref(location.pathname + location.search)} replace />;
  }
  if (roles && !roles.includes(me.data.user.role)) {
    return <Forbidden needed={roles} role={me.data.user.role} />;
  }
  return <Outlet />;
}

function Forbidden({ needed, role }: { needed: Role[]; role: Role }) {
  const forSellers = needed.includes('seller');
  return (
    <section aria-labelledby="forbidden-title" className="mx-auto max-w-xl py-12 text-center">
      <p className="text-sm font-bold tracking-wide text-thread-deep uppercase">403 · Not for this account</p>
      <h1 id="forbidden-title" className="mt-2 text-3xl font-extrabold">
        This page is kept for {needed.map((r) => roleNames[r]).join(' and ')}
      </h1>
      <p className="mt-3 text-lg text-ink-soft">
        {forSellers && role === 'shopper'
          ? 'The workroom opens once you have a shop. Opening one takes a minute; our team reviews it before it goes live.'
          : "You're signed in, but this account doesn't have access here. If you think it should, ask the Namesake team."}
      </p>
      <div className="mt-8 flex flex-wrap justify-center gap-3">
        {forSellers && role === 'shopper' ? <ButtonLink to={paths.openShop.getHref()}>Open a shop</ButtonLink> : null}
        <ButtonLink to={paths.home.getHref()} variant="secondary">
          Back to the home page
        </ButtonLink>
      </div>
    </section>
  );
}
