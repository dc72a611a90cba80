import { NavLink } from 'react-router-dom';
import { paths } from '../../../config/paths.ts';

const links = [
  { to: paths.business.overview.getHref(), label: 'Overview', end: true },
  { to: paths.business.payouts.getHref(), label: 'Payouts', end: false },
  { to: paths.business.settings.getHref(), label: 'Calendar and rate', end: false },
];

export function BusinessNav() {
  return (
    <nav aria-label="Business pages" className="mb-6 overflow-x-auto">
      <ul className="flex gap-1">
        {links.map((l) => (
          <li key={l.to}>
            <NavLink to={l.to} end={l.end} className={({ isActive }) => 'flex min-h-11 items-center rounded-lg px-3 font-bold whitespace-nowrap ' + (isActive ? 'bg-marigold-wash text-ink' : 'text-ink hover:bg-paper-deep')}>
              {l.label}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}
