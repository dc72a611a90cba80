import { useCallback, useState } from 'react';
import type { SellerListing } from '../../../../shared/schemas/listing.ts';
import { ButtonLink } from '../../../components/ui/button.tsx';
import { PageHeading } from '../../../components/ui/card.tsx';
import { PagedResults, usePagedQuery } from '../../../components/ui/pager.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { paths } from '../../../config/paths.ts';
import { useSellerListings } from '../../../features/listings-editor/api/get-seller-listings.ts';
import { type ListingAction, useListingAction } from '../../../features/listings-editor/api/listing-actions.ts';
import { ListingsTable } from '../../../features/listings-editor/components/listings-table.tsx';

const done: Record<ListingAction, string> = { submit: 'sent for review', pause: 'paused', unpause: 'back on sale' };

/** what the page says before the first one is added */
const EMPTY = { title: 'No listings yet.', hint: 'Start with a blank, a name field and the colours you stock.' };

export function SellerListingsPage() {
  const listings = usePagedQuery(useSellerListings);
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
      <PagedResults list={listings} loading="Loading listings…" label="Listing pages" noun="listings" empty={EMPTY}>
        {(items) => <ListingsTable listings={items} editHref={paths.seller.editListing.getHref} onAction={onAction} busyId={busyId} />}
      </PagedResults>
    </div>
  );
}

export default SellerListingsPage;
