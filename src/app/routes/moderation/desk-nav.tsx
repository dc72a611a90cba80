import { Outlet } from 'react-router-dom';
import { isUnder, type SectionLink, SectionNav } from '../../../components/ui/section-nav.tsx';
import { paths } from '../../../config/paths.ts';

/** The id of the desk's shop sections, so the navigation can lead straight to them. */
export const SHOPS_SECTION_ID = 'shops';

const links: SectionLink[] = [
  {
    to: paths.moderation.desk.getHref(),
    label: 'Queue',
    // a listing under review belongs to the queue
    current: ({ pathname, hash }) => (pathname === paths.moderation.desk.path && hash !== `#${SHOPS_SECTION_ID}`) || isUnder(pathname, '/moderation/listings'),
  },
  { to: `${paths.moderation.desk.getHref()}#${SHOPS_SECTION_ID}`, label: 'Shops', current: ({ pathname, hash }) => pathname === paths.moderation.desk.path && hash === `#${SHOPS_SECTION_ID}` },
  { to: paths.moderation.audit.getHref(), label: 'Audit log', current: ({ pathname }) => isUnder(pathname, paths.moderation.audit.path) },
  { to: paths.moderation.mail.getHref(), label: 'Mail', current: ({ pathname }) => isUnder(pathname, paths.moderation.mail.path) },
];

/** The one navigation of the moderation desk's pages. */
export function DeskNav() {
  return <SectionNav label="Moderation desk pages" links={links} />;
}

/** The layout of every page of the desk: the navigation above the page. */
export function DeskLayout() {
  return (
    <>
      <DeskNav />
      <Outlet />
    </>
  );
}
