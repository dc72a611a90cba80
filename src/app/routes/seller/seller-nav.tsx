import { NavLink } from 'react-router-dom';
import { paths } from '../../../config/paths.ts';

const links = [
  { to: paths.workroom.getHref(), label: 'Workroom', end: true },
  { to: paths.seller.listings.getHref(), label: 'Listings', end: false },
  { to: paths.seller.materials.getHref(), label: 'Materials', end: false },
  { to: paths.seller.shop.getHref(), label: 'Shop settings', end: false },
  { to: paths.business.overview.getHref(), label: 'Business', end: true },
  { to: paths.business.payouts.getHref(), label: 'Payouts', end: false },
];

/** The seller pages' own sub-navigation (scrolls sideways on a phone rather than wrapping). */
export function SellerNav() {
  return (
    <nav aria-label="Seller pages" className="-mx-4 mb-6 overflow-x-auto px-4 sm:mx-0 sm:px-0">
      <ul className="flex gap-1 border-b border-line pb-2">
        {links.map((l) => (
          <li key={l.to}>
            <NavLink
              to={l.to}
              end={l.end}
              className={({ isActive }) =>
                'flex min-h-11 items-center rounded-lg px-3 font-bold whitespace-nowrap ' + (isActive ? 'bg-thread-wash text-thread-deep' : 'text-ink hover:bg-paper-deep')
              }
            >
              {l.label}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}
