import { useId, useState } from 'react';
import { Link, NavLink, useLocation, useNavigate } from 'react-router-dom';
import type { Me } from '../../../shared/schemas/auth.ts';
import { useToast } from '../../components/ui/toast.tsx';
import { paths } from '../../config/paths.ts';
import { useMe } from '../../features/auth/api/get-me.ts';
import { useSignOut } from '../../features/auth/api/sign-out.ts';
import { useUnread } from '../../features/messages/api/get-unread.ts';
import { Wordmark } from './wordmark.tsx';

type NavItem = {
  to: string;
  label: string;
  /** when the item is the current section; default: its own path and everything below it */
  activeFor?: (pathname: string) => boolean;
};

const under = (base: string, pathname: string) => pathname === base || pathname.startsWith(`${base}/`);

/** 'page' on the item's own page, 'true' on its sub-pages (the section is current, not the page). */
export function currentFor(item: NavItem, pathname: string): 'page' | 'true' | undefined {
  const base = item.to.split('?')[0]!;
  const active = item.activeFor ? item.activeFor(pathname) : under(base, pathname);
  return active ? (pathname === base ? 'page' : 'true') : undefined;
}

/** Navigation by role: every account shops; sellers add the workroom; admins the desk and mail. */
export function navItemsFor(me: Me | null | undefined): NavItem[] {
  const items: NavItem[] = [
    { to: paths.search.getHref(), label: 'Browse' },
    { to: paths.cart.getHref(), label: 'Cart' },
  ];
  if (!me) return items;
  const role = me.user.role;
  // a seller's "orders" are her shop's (in the workroom): her own purchases are named as such
  items.push({ to: paths.orders.getHref(), label: role === 'seller' || me.shop ? 'My purchases' : 'Orders' });
  if (role === 'shopper' && !me.shop) items.push({ to: paths.openShop.getHref(), label: 'Open a shop' });
  if (role === 'seller' || me.shop) items.push({ to: paths.workroom.getHref(), label: 'Workroom' });
  if (role === 'admin') {
    const desk = paths.moderation.desk.getHref();
    const mail = paths.moderation.mail.path;
    // the desk's sub-pages (review, audit log) are the desk's; its mail page has its own item
    items.push({ to: desk, label: 'Moderation desk', activeFor: (p) => under(desk, p) && !under(mail, p) });
    items.push({ to: paths.moderation.mail.getHref(), label: 'Mail' });
  }
  return items;
}

const linkClasses = ({ isActive }: { isActive: boolean }) =>
  'flex min-h-11 items-center rounded-lg px-3 font-bold whitespace-nowrap transition-colors ' +
  (isActive ? 'bg-thread-wash text-thread-deep underline decoration-thread decoration-2 underline-offset-[6px]' : 'text-ink hover:bg-paper-deep');

/** How many unread messages wait behind a navigation item, said in words to screen readers. */
function UnreadBadge({ count }: { count: number }) {
  if (!count) return null;
  return (
    <span className="ml-1.5 inline-flex min-w-6 items-center justify-center rounded-full bg-marigold px-1.5 text-sm font-extrabold text-ink" data-testid="unread-badge">
      <span aria-hidden="true">{count > 99 ? '99+' : count}</span>
      <span className="sr-only">, {count === 1 ? '1 unread message' : `${count} unread messages`}</span>
    </span>
  );
}

export function SiteHeader() {
  const me = useMe();
  const signOut = useSignOut();
  const toast = useToast();
  const navigate = useNavigate();
  const location = useLocation();
  const [open, setOpen] = useState(false);
  const menuId = useId();

  // A tap on a link in the phone menu should close it: the menu closes whenever the page changes
  // (state adjusted during render, so the menu never paints open on the new page).
  const here = `${location.pathname}${location.search}`;
  const [shownAt, setShownAt] = useState(here);
  if (shownAt !== here) {
    setShownAt(here);
    setOpen(false);
  }

  const items = navItemsFor(me.data);
  const signedIn = Boolean(me.data);
  // unread order messages: the shopper's beside Orders, the shop's beside Workroom
  const unread = useUnread(signedIn).data;
  const unreadFor = (to: string) => (!unread ? 0 : to === paths.orders.getHref() ? unread.asShopper : to === paths.workroom.getHref() ? unread.asShop : 0);

  async function handleSignOut() {
    try {
      await signOut.mutateAsync();
      toast.success('You are signed out. See you soon.');
      navigate(paths.home.getHref());
    } catch (error) {
      toast.error(error instanceof Error ? error.message : 'Signing out failed. Please try again.');
    }
  }

  return (
    <header className="border-b border-line bg-paper/95">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:top-2 focus:left-2 focus:z-50 focus:rounded-lg focus:bg-ink focus:px-4 focus:py-2 focus:text-paper">
        Skip to content
      </a>
      <div className="mx-auto flex max-w-6xl flex-wrap items-center justify-between gap-x-6 gap-y-2 px-4 py-3 sm:px-6">
        <Link to={paths.home.getHref()} className="rounded-lg py-1" aria-label="Namesake, home">
          <Wordmark />
        </Link>

        <button
          type="button"
          className="flex min-h-11 items-center gap-2 rounded-lg border-2 border-ink px-3 font-bold md:hidden"
          aria-expanded={open}
          aria-controls={menuId}
          onClick={() => setOpen((v) => !v)}
        >
          <span aria-hidden="true" className="flex w-5 flex-col gap-1">
            <span className={`h-0.5 rounded bg-ink transition-transform ${open ? 'translate-y-1.5 rotate-45' : ''}`} />
            <span className={`h-0.5 rounded bg-ink ${open ? 'opacity-0' : ''}`} />
            <span className={`h-0.5 rounded bg-ink transition-transform ${open ? '-translate-y-1.5 -rotate-45' : ''}`} />
          </span>
          Menu
        </button>

        <nav id={menuId} aria-label="Main" className={`${open ? 'flex' : 'hidden'} w-full md:flex md:w-auto`}>
          <ul className="flex w-full flex-col gap-1 border-t border-line pt-2 pb-1 md:flex-row md:items-center md:border-0 md:p-0">
            {items.map((item) => {
              const current = currentFor(item, location.pathname);
              return (
                <li key={item.to}>
                  <Link to={item.to} aria-current={current} className={linkClasses({ isActive: Boolean(current) })}>
                    {item.label}
                    <UnreadBadge count={unreadFor(item.to)} />
                  </Link>
                </li>
              );
            })}
            <li className="mt-1 md:mt-0 md:ml-2">
              {signedIn ? (
                <button
                  type="button"
                  onClick={handleSignOut}
                  disabled={signOut.isPending}
                  className="flex min-h-11 w-full items-center rounded-lg border-2 border-thread px-3 font-bold text-thread-deep hover:bg-thread-wash disabled:opacity-60 md:w-auto"
                >
                  {signOut.isPending ? 'Signing out…' : 'Sign out'}
                </button>
              ) : me.isPending ? null : (
                <NavLink
                  to={paths.auth.signIn.getHref()}
                  className="flex min-h-11 items-center justify-center rounded-lg bg-marigold px-4 font-bold text-ink shadow-[0_2px_0_0_var(--color-marigold-deep)] hover:bg-marigold-light"
                >
                  Sign in
                </NavLink>
              )}
            </li>
          </ul>
        </nav>
      </div>
      {me.data ? (
        <p className="sr-only" aria-live="polite">
          Signed in as {me.data.user.name}
        </p>
      ) : null}
    </header>
  );
}
