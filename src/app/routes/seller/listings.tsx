import { useCallback, useState } from 'react';
import type { SellerListing } from '../../../../shared/schemas/listing.ts';
import { ButtonLink, Spinner } from '../../../components/ui/button.tsx';
import { PageHeading, StitchedBox } from '../../../components/ui/card.tsx';
import { Pager, usePageParam } from '../../../components/ui/pager.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { paths } from '../../../config/paths.ts';
import { useSellerListings } from '../../../features/listings-editor/api/get-seller-listings.ts';
import { useListingAction, type ListingAction } from '../../../features/listings-editor/api/listing-actions.ts';
import { ListingsTable } from '../../../features/listings-editor/components/listings-table.tsx';
import { SellerNav } from './seller-nav.tsx';

const done: Record<ListingAction, string> = { submit: 'sent for review', pause: 'paused', unpause: 'back on sale' };

export function SellerListingsPage() {
  const [page, setPage] = usePageParam();
  const listings = useSellerListings({ page });
  const toast = useToast();
  const { mutate } = useListingAction();
  const [busyId, setBusyId] = useState<string | null>(null);

  const onAction = useCallback(
    (l: SellerListing, action: ListingAction) => {
      setBusyId(l.id);
      mutate(
        { id: l.id, action },
        {
          onSuccess: () => toast.success(`“${l.draft.title}” is ${done[action]}.`),
          onError: (e) => toast.error(e.message),
          onSettled: () => setBusyId(null),
        },
      );
    },
    [mutate, toast],
  );

  return (
    <div>
      <SellerNav />
      <PageHeading eyebrow="Workroom" title="Listings" lead="Everything you offer. New listings and changes are checked by the Namesake team before shoppers see them." />
      <ButtonLink to={paths.seller.newListing.getHref()} className="mb-6">
        New listing
      </ButtonLink>
      {listings.isPending ? <Spinner label="Loading listings…" /> : null}
      {listings.isError ? <p role="alert" className="font-semibold text-danger">{listings.error.message}</p> : null}
      {listings.data && listings.data.total === 0 ? (
        <StitchedBox>
          <p className="font-bold">No listings yet.</p>
          <p className="text-ink-soft">Start with a blank, a name field and the colours you stock.</p>
        </StitchedBox>
      ) : null}
      {listings.data && listings.data.total > 0 ? (
        <div className="flex flex-col gap-4">
          <div className={listings.isPlaceholderData ? 'opacity-60 transition-opacity' : ''}>
            <ListingsTable listings={listings.data.items} editHref={paths.seller.editListing.getHref} onAction={onAction} busyId={busyId} />
          </div>
          <Pager page={page} total={listings.data.total} limit={listings.data.limit} label="Listing pages" noun="listings" onPageChange={setPage} />
        </div>
      ) : null}
    </div>
  );
}

export default SellerListingsPage;
