import { NavLink } from 'react-router-dom';
import { paths } from '../../../config/paths.ts';

const items = [
  { to: paths.workroom.getHref(), label: 'Orders', end: true },
  { to: paths.workroomCutSheets.getHref(), label: 'Cut sheets', end: false },
  { to: paths.workroomPress.getHref(), label: 'Press cards', end: false },
  { to: paths.workroomStock.getHref(), label: 'Stock', end: false },
];

/** The production pages of the workroom. */
export function WorkroomNav() {
  return (
    <nav aria-label="Production" className="mb-6 flex flex-wrap gap-2">
      {items.map((i) => (
        <NavLink
          key={i.to}
          to={i.to}
          end={i.end}
          className={({ isActive }) =>
            `inline-flex min-h-11 items-center rounded-lg border-2 px-4 font-bold ${isActive ? 'border-ink bg-ink text-paper' : 'border-line bg-white text-ink hover:border-thread'}`
          }
        >
          {i.label}
        </NavLink>
      ))}
    </nav>
  );
}
