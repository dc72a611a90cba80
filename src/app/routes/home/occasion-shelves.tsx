import { Link } from 'react-router-dom';
import { StitchedBox } from '../../../components/ui/card.tsx';
import { occasions, paths } from '../../../config/paths.ts';
import { useListings } from '../../../features/catalog/api/get-listings.ts';
import { ListingGrid } from '../../../features/catalog/components/listing-card.tsx';
import { ListingGridSkeleton } from '../../../features/catalog/components/listing-grid-skeleton.tsx';

const PER_SHELF = 4;

/** The home page's listings, one shelf per occasion (the five in shared/schemas/listing.ts), newest first. */
export function OccasionShelves() {
  return (
    <div className="flex flex-col gap-12">
      {occasions.map((o) => (
        <Shelf key={o.slug} slug={o.slug} label={o.label} />
      ))}
    </div>
  );
}

function Shelf({ slug, label }: { slug: (typeof occasions)[number]['slug']; label: string }) {
  const list = useListings({ occasion: slug, sort: 'newest' });
  const titleId = `shelf-${slug}`;
  return (
    <section aria-labelledby={titleId} className="flex flex-col gap-4">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 id={titleId} className="text-xl font-extrabold">
          {label}
        </h3>
        {list.data && list.data.total > 0 ? (
          <Link to={paths.search.getHref({ occasion: slug })} className="font-bold text-thread-deep underline decoration-thread/50 underline-offset-4 hover:decoration-thread">
            See all {list.data.total} for {label.toLowerCase()}
          </Link>
        ) : null}
      </div>
      {list.isPending ? (
        <ListingGridSkeleton count={PER_SHELF} />
      ) : list.isError ? (
        <p className="text-ink-soft">These listings didn't load. {list.error.message}</p>
      ) : list.data.items.length === 0 ? (
        <StitchedBox className="py-6 text-center text-ink-soft">Nothing for {label.toLowerCase()} yet — shops are getting ready.</StitchedBox>
      ) : (
        <ListingGrid items={list.data.items.slice(0, PER_SHELF)} />
      )}
    </section>
  );
}
