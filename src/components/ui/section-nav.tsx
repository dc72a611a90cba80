import { Fragment, useLayoutEffect, useRef } from 'react';
import { Link, useLocation } from 'react-router-dom';

export type SectionLink = {
  to: string;
  label: string;
  /** links of one group sit together; a thin rule separates the groups */
  group?: string;
  /** whether this link is the page being shown */
  current: (at: { pathname: string; hash: string }) => boolean;
};

/** `pathname` is `base` or a page below it. */
export const isUnder = (pathname: string, base: string) => pathname === base || pathname.startsWith(`${base}/`);

/**
 * The navigation between the pages of one area (the seller's workroom, the moderation desk): one
 * row of links with the current page marked (aria-current="page"). On a narrow screen the row
 * scrolls sideways inside itself, never the page, and starts scrolled to the current link.
 */
export function SectionNav({ label, links }: { label: string; links: SectionLink[] }) {
  const { pathname, hash } = useLocation();
  const row = useRef<HTMLUListElement>(null);
  const currentIndex = links.findIndex((l) => l.current({ pathname, hash }));

  useLayoutEffect(() => {
    if (currentIndex < 0) return;
    const ul = row.current;
    const el = ul?.querySelector<HTMLElement>('[aria-current="page"]');
    if (!ul || !el) return;
    // bring the current link into the row's view without moving the page
    if (el.offsetLeft + el.offsetWidth > ul.scrollLeft + ul.clientWidth || el.offsetLeft < ul.scrollLeft) ul.scrollLeft = el.offsetLeft - 16;
  }, [currentIndex]);

  return (
    <nav aria-label={label} className="-mx-4 mb-6 border-b-2 border-line sm:mx-0">
      <ul ref={row} className="relative flex items-stretch gap-1 overflow-x-auto overscroll-x-contain px-4 sm:px-0 [scrollbar-width:thin]">
        {links.map((l, i) => {
          const current = i === currentIndex;
          const newGroup = i > 0 && l.group !== links[i - 1]!.group;
          return (
            <Fragment key={l.to}>
              {newGroup ? <li aria-hidden="true" className="mx-1.5 my-3 w-px shrink-0 bg-line" /> : null}
              <li className="shrink-0">
                <Link
                  to={l.to}
                  aria-current={current ? 'page' : undefined}
                  className={`flex min-h-11 items-center rounded-t-lg border-b-[3px] px-3 font-bold whitespace-nowrap ${
                    current ? 'border-thread bg-thread-wash text-thread-deep' : 'border-transparent text-ink hover:border-line hover:bg-paper-deep'
                  }`}
                >
                  {l.label}
                </Link>
              </li>
            </Fragment>
          );
        })}
      </ul>
    </nav>
  );
}
