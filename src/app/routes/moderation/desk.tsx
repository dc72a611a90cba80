import { useEffect } from 'react';
import { Link, useLocation } from 'react-router-dom';
import { formatDateTime } from '../../../../shared/dates.ts';
import { Spinner } from '../../../components/ui/button.tsx';
import { PageHeading, StitchedBox } from '../../../components/ui/card.tsx';
import { Badge } from '../../../components/ui/form-controls.tsx';
import { Pager, usePageParam } from '../../../components/ui/pager.tsx';
import { paths } from '../../../config/paths.ts';
import { useListingQueue, useShopChangeQueue, useShopQueue } from '../../../features/moderation/api/get-queue.ts';
import { ShopActions } from '../../../features/moderation/components/shop-actions.tsx';
import { ShopChangeCard } from '../../../features/moderation/components/shop-change.tsx';
import { ShopFinder } from '../../../features/moderation/components/shop-finder.tsx';
import { SHOPS_SECTION_ID } from './desk-nav.tsx';

const shopStateLabel = { in_review: 'In review', live: 'Live', suspended: 'Suspended', rejected: 'Rejected' } as const;

export function ModerationDeskPage() {
  // two queues on one page, each with its own page in the URL
  const [listingsPage, setListingsPage] = usePageParam('listingsPage');
  const [shopsPage, setShopsPage] = usePageParam('shopsPage');
  const [changesPage, setChangesPage] = usePageParam('changesPage');
  const listingQueue = useListingQueue({ page: listingsPage });
  const shopQueue = useShopQueue({ page: shopsPage });
  const changeQueue = useShopChangeQueue({ page: changesPage });
  const pending = listingQueue.isPending || shopQueue.isPending || changeQueue.isPending;
  const error = listingQueue.error ?? shopQueue.error ?? changeQueue.error;
  const queue = listingQueue.data && shopQueue.data && changeQueue.data ? { listings: listingQueue.data, shops: shopQueue.data, changes: changeQueue.data } : undefined;
  const { hash } = useLocation();
  const loaded = Boolean(queue);
  // the navigation's "Shops" leads to the shop sections of this page
  useEffect(() => {
    if (loaded && hash === `#${SHOPS_SECTION_ID}`) document.getElementById(SHOPS_SECTION_ID)?.scrollIntoView({ block: 'start' });
  }, [loaded, hash]);

  return (
    <div>
      <PageHeading eyebrow="Moderation desk" title="Waiting for review" lead="Approve what is ready, or send it back with a reason the seller will receive by e-mail." />
      {pending ? <Spinner label="Loading the queue…" /> : null}
      {error ? (
        <p role="alert" className="font-semibold text-danger">
          {error.message}
        </p>
      ) : null}
      {queue ? (
        <div className="flex flex-col gap-10">
          <section aria-labelledby="q-listings" className="flex flex-col gap-4">
            <h2 id="q-listings" className="text-2xl font-extrabold">
              Listings <span className="text-ink-soft">({queue.listings.total})</span>
            </h2>
            {queue.listings.total === 0 ? (
              <StitchedBox>
                <p>No listings are waiting. New listings and edits to live ones appear here.</p>
              </StitchedBox>
            ) : (
              <ul className="flex flex-col gap-3">
                {queue.listings.items.map((l) => (
                  <li key={l.id} className="flex flex-col gap-3 rounded-lg border border-line bg-white p-4 sm:flex-row sm:items-center sm:justify-between">
                    <div className="flex min-w-0 flex-col gap-1">
                      <span className="flex flex-wrap items-center gap-2">
                        <Badge tone={l.kind === 'new' ? 'marigold' : 'thread'}>{l.kind === 'new' ? 'New listing' : 'Edited, live version on sale'}</Badge>
                        {l.shop.state !== 'live' ? <Badge tone="danger">Shop {shopStateLabel[l.shop.state].toLowerCase()}</Badge> : null}
                      </span>
                      <p className="font-extrabold break-words">{l.title}</p>
                      <p className="text-sm text-ink-soft">
                        {l.shop.name} · sent {formatDateTime(l.submittedAt)}
                      </p>
                    </div>
                    <Link
                      to={paths.moderation.reviewListing.getHref(l.id)}
                      className="inline-flex min-h-11 shrink-0 items-center justify-center rounded-lg bg-marigold px-5 font-bold text-ink shadow-[0_2px_0_0_var(--color-marigold-deep)] hover:bg-marigold-light"
                    >
                      Review<span className="sr-only">&nbsp;{l.title}</span>
                    </Link>
                  </li>
                ))}
              </ul>
            )}
            <Pager page={listingsPage} total={queue.listings.total} limit={queue.listings.limit} label="Listing queue pages" noun="listings" onPageChange={setListingsPage} />
          </section>

          <section id={SHOPS_SECTION_ID} aria-labelledby="q-shops" className="flex scroll-mt-4 flex-col gap-4">
            <h2 id="q-shops" className="text-2xl font-extrabold">
              New shops <span className="text-ink-soft">({queue.shops.total})</span>
            </h2>
            {queue.shops.total === 0 ? (
              <StitchedBox>
                <p>No shops are waiting.</p>
              </StitchedBox>
            ) : (
              <ul className="grid grid-cols-1 gap-4 md:grid-cols-2">
                {queue.shops.items.map((s) => (
                  <li key={s.id} className="flex flex-col gap-3 rounded-lg border border-line bg-white p-4" aria-label={`Shop ${s.name}`}>
                    <div>
                      <p className="text-lg font-extrabold break-words">{s.name}</p>
                      <p className="text-sm [overflow-wrap:anywhere] text-ink-soft">
                        /shops/{s.slug} · {s.owner.name} ({s.owner.email}) · opened {formatDateTime(s.createdAt)}
                      </p>
                    </div>
                    {s.description ? <p className="whitespace-pre-wrap">{s.description}</p> : <p className="text-ink-faint">No description yet.</p>}
                    <ShopActions shop={s} />
                  </li>
                ))}
              </ul>
            )}
            <Pager page={shopsPage} total={queue.shops.total} limit={queue.shops.limit} label="New shop queue pages" noun="shops" onPageChange={setShopsPage} />
          </section>

          <section aria-labelledby="q-changes" className="flex flex-col gap-4">
            <h2 id="q-changes" className="text-2xl font-extrabold">
              Shop detail changes <span className="text-ink-soft">({queue.changes.total})</span>
            </h2>
            <p className="-mt-2 max-w-prose text-ink-soft">A live shop keeps showing its current name and description until you approve the new ones.</p>
            {queue.changes.total === 0 ? (
              <StitchedBox>
                <p>No shop changes are waiting.</p>
              </StitchedBox>
            ) : (
              <ul className="grid grid-cols-1 gap-4 md:grid-cols-2">
                {queue.changes.items.map((c) => (
                  <ShopChangeCard key={c.id} change={c} />
                ))}
              </ul>
            )}
            <Pager page={changesPage} total={queue.changes.total} limit={queue.changes.limit} label="Shop change pages" noun="changes" onPageChange={setChangesPage} />
          </section>

          <section aria-labelledby="q-known" className="flex flex-col gap-4">
            <h2 id="q-known" className="text-2xl font-extrabold">
              All shops
            </h2>
            <p className="-mt-2 max-w-prose text-ink-soft">
              Find any shop, live, in review or suspended. Suspending hides every listing of the shop from browse and search at once; the seller gets your reason by e-mail.
            </p>
            <ShopFinder />
          </section>
        </div>
      ) : null}
    </div>
  );
}

export default ModerationDeskPage;
