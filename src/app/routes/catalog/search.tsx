import { Link, useSearchParams } from 'react-router-dom';
import { PageHeading, StitchedBox } from '../../../components/ui/card.tsx';
import { occasions, paths } from '../../../config/paths.ts';

/** Placeholder until the catalogue (src/features/catalog) lands: keeps the occasion links working. */
export function SearchPage() {
  const [params] = useSearchParams();
  const selected = occasions.find((o) => o.slug === params.get('occasion'));

  return (
    <div>
      <PageHeading eyebrow="Browse" title={selected ? selected.label : 'Everything on Namesake'} lead="Totes, tees, pouches and drawstring bags, personalised by small shops." />
      <ul className="mb-8 flex flex-wrap gap-2" aria-label="Occasions">
        {occasions.map((o) => {
          const active = o.slug === selected?.slug;
          return (
            <li key={o.slug}>
              <Link
                to={active ? paths.search.getHref() : paths.search.getHref({ occasion: o.slug })}
                aria-current={active ? 'page' : undefined}
                className={`flex min-h-11 items-center rounded-full border-2 px-4 font-bold ${active ? 'border-ink bg-ink text-paper' : 'border-thread bg-white text-thread-deep hover:bg-thread-wash'}`}
              >
                {o.label}
              </Link>
            </li>
          );
        })}
      </ul>
      <StitchedBox className="py-14 text-center">
        <p className="text-lg font-bold">Listings will appear here</p>
        <p className="mt-1 text-ink-soft">Once shops' listings are approved, you'll find them on this page.</p>
      </StitchedBox>
    </div>
  );
}
