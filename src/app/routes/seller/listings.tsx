import { useCallback, useState } from 'react';
import type { SellerListing } from '../../../../shared/schemas/listing.ts';
import { ButtonLink } from '../../../components/ui/button.tsx';
import { PageHeading } from '../../../components/ui/card.tsx';
import { PagedResults, usePageParam } from '../../../components/ui/pager.tsx';
import { QueryBoundary } from '../../../components/ui/query-boundary.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { paths } from '../../../config/paths.ts';
import { useSellerListings } from '../../../features/listings-editor/api/get-seller-listings.ts';
import { type ListingAction, useListingAction } from '../../../features/listings-editor/api/listing-actions.ts';
import { ListingsTable } from '../../../features/listings-editor/components/listings-table.tsx';

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
      <PageHeading eyebrow="Workroom" title="Listings" lead="Everything you offer. New listings and changes are checked by the Namesake team before shoppers see them." />
      <ButtonLink to={paths.seller.newListing.getHref()} className="mb-6">
        New listing
      </ButtonLink>
      <QueryBoundary query={listings} loading="Loading listings…">
        {(data) => (
          <PagedResults
            data={data}
            stale={listings.isPlaceholderData}
            page={page}
            onPageChange={setPage}
            label="Listing pages"
            noun="listings"
            empty={
              <>
                <p className="font-bold">No listings yet.</p>
                <p className="text-ink-soft">Start with a blank, a name field and the colours you stock.</p>
              </>
            }
          >
            <ListingsTable listings={data.items} editHref={paths.seller.editListing.getHref} onAction={onAction} busyId={busyId} />
          </PagedResults>
        )}
      </QueryBoundary>
    </div>
  );
}

export default SellerListingsPage;
