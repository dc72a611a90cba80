import { Link } from 'react-router-dom';
import { formatMoney } from '../../../../shared/money.ts';
import type { CatalogItem } from '../../../../shared/schemas/catalog.ts';
import { OCCASION_LABELS } from '../../../../shared/schemas/listing.ts';
import { DesignOnBlank, pictureOfKind } from '../../../components/design/design-on-blank.tsx';
import { paths } from '../../../config/paths.ts';

/** One listing in a grid: photo (or a drawn stand-in), title linking to the listing, shop, base price. */
export function ListingCard({ item, headingLevel = 3, eager = false }: { item: CatalogItem; headingLevel?: 2 | 3; eager?: boolean }) {
  const Heading = headingLevel === 2 ? 'h2' : 'h3';
  return (
    <article className="group relative flex h-full flex-col overflow-hidden rounded-lg border border-line bg-white shadow-sm transition-shadow focus-within:shadow-md hover:shadow-md">
      <div className="aspect-[4/3] bg-paper-deep">
        {/* the design on its blank in the shop's first colour, drawn by the server and cached by content */}
        <img src={paths.listingImage.getHref(item.slug, 'webp', 'card')} alt="" width={480} height={360} loading={eager ? 'eager' : 'lazy'} className="size-full object-cover" />
      </div>
      <div className="flex flex-1 flex-col gap-1.5 p-4">
        <Heading className="text-lg leading-snug font-extrabold">
          {/* the whole card is clickable through this link's ::after; the shop link sits above it */}
          <Link to={paths.listing.getHref(item.slug)} className="after:absolute after:inset-0 after:content-[''] hover:underline">
            {item.title}
          </Link>
        </Heading>
        <p className="text-sm text-ink-soft">
          by{' '}
          <Link to={paths.shopPage.getHref(item.shop.slug)} className="relative z-10 font-bold text-thread-deep underline decoration-thread/50 hover:decoration-thread">
            {item.shop.name}
          </Link>
        </p>
        {item.occasions.length > 0 ? (
          <ul className="mt-1 flex flex-wrap gap-1.5" aria-label="Occasions">
            {item.occasions.map((o) => (
              <li key={o} className="rounded-full bg-thread-wash px-2 py-0.5 text-xs font-bold text-thread-deep">
                {OCCASION_LABELS[o]}
              </li>
            ))}
          </ul>
        ) : null}
        <p className="mt-auto pt-2 text-base font-extrabold">
          <span className="text-sm font-semibold text-ink-soft">from </span>
          {formatMoney(item.priceMinor, item.currency)}
        </p>
      </div>
    </article>
  );
}

/** No photo yet: a blank drawn with its print area (the catalogue item does not carry its kind: a tote). */
function NoPhoto({ kind = 'tote' }: { kind?: string }) {
  const picture = pictureOfKind(kind) ?? pictureOfKind('tote')!;
  return (
    <div className="size-full p-4">
      <DesignOnBlank blank={picture} fit="box" />
    </div>
  );
}

/** `eagerFirst`: how many pictures may be on the first screen (loaded at once; the rest lazily). */
export function ListingGrid({ items, headingLevel, eagerFirst = 0 }: { items: CatalogItem[]; headingLevel?: 2 | 3; eagerFirst?: number }) {
  return (
    <ul className="grid grid-cols-1 gap-5 min-[480px]:grid-cols-2 lg:grid-cols-3 xl:grid-cols-4">
      {items.map((item, i) => (
        <li key={item.id}>
          <ListingCard item={item} headingLevel={headingLevel} eager={i < eagerFirst} />
        </li>
      ))}
    </ul>
  );
}
