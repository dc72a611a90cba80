import { Outlet } from 'react-router-dom';
import { isUnder, type SectionLink, SectionNav } from '../../../components/ui/section-nav.tsx';
import { paths } from '../../../config/paths.ts';

const links: SectionLink[] = [
  {
    to: paths.workroom.getHref(),
    label: 'Orders',
    group: 'make',
    // an order's page and a line's proof belong to the orders
    current: ({ pathname }) => pathname === paths.workroom.path || isUnder(pathname, '/workroom/orders') || isUnder(pathname, '/workroom/lines'),
  },
  { to: paths.workroomCutSheets.getHref(), label: 'Cut sheets', group: 'make', current: ({ pathname }) => isUnder(pathname, paths.workroomCutSheets.path) },
  { to: paths.workroomPress.getHref(), label: 'Press', group: 'make', current: ({ pathname }) => isUnder(pathname, paths.workroomPress.path) },
  { to: paths.workroomStock.getHref(), label: 'Stock', group: 'make', current: ({ pathname }) => isUnder(pathname, paths.workroomStock.path) },
  { to: paths.seller.listings.getHref(), label: 'Listings', group: 'sell', current: ({ pathname }) => isUnder(pathname, paths.seller.listings.path) },
  { to: paths.seller.materials.getHref(), label: 'Materials', group: 'sell', current: ({ pathname }) => isUnder(pathname, paths.seller.materials.path) },
  { to: paths.seller.offers.getHref(), label: 'Codes and dates', group: 'sell', current: ({ pathname }) => isUnder(pathname, paths.seller.offers.path) },
  { to: paths.seller.blanks.getHref(), label: 'Blanks', group: 'sell', current: ({ pathname }) => isUnder(pathname, paths.seller.blanks.path) },
  { to: paths.seller.shop.getHref(), label: 'Shop', group: 'sell', current: ({ pathname }) => isUnder(pathname, paths.seller.shop.path) },
  {
    to: paths.business.overview.getHref(),
    label: 'Business',
    group: 'money',
    // the calendar and rate page is part of the business view
    current: ({ pathname }) => pathname === paths.business.overview.path || isUnder(pathname, paths.business.settings.path),
  },
  { to: paths.business.payouts.getHref(), label: 'Payouts', group: 'money', current: ({ pathname }) => isUnder(pathname, paths.business.payouts.path) },
];

/** The one navigation of the seller's pages, on every one of them: production, shop, money. */
export function SellerNav() {
  return <SectionNav label="Seller pages" links={links} />;
}

/** The layout of every seller page: the navigation above the page. */
export function SellerLayout() {
  return (
    <>
      <SellerNav />
      <Outlet />
    </>
  );
}
