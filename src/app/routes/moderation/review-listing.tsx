import { useState } from 'react';
import { useNavigate, useParams } from 'react-router-dom';
import type { ListingContent } from '../../../../shared/schemas/listing.ts';
import { LISTING_CHANGE_REASONS } from '../../../../shared/schemas/moderation-reasons.ts';
import { Button, ButtonLink, Spinner } from '../../../components/ui/button.tsx';
import { PageHeading } from '../../../components/ui/card.tsx';
import { Badge } from '../../../components/ui/form-controls.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { paths } from '../../../config/paths.ts';
import { useApproveListing, useRejectListing } from '../../../features/moderation/api/decide-listing.ts';
import { useListingReview } from '../../../features/moderation/api/get-listing-review.ts';
import { ListingPreview } from '../../../features/moderation/components/listing-preview.tsx';
import { ReasonForm } from '../../../features/moderation/components/reason-form.tsx';
import { ShopActions } from '../../../features/moderation/components/shop-actions.tsx';
import { isApiError } from '../../../lib/api-client.ts';

const PARTS: [keyof ListingContent, string][] = [
  ['title', 'title'],
  ['description', 'description'],
  ['blank', 'blank'],
  ['basePriceMinor', 'base price'],
  ['extraLayerPriceMinor', 'extra-layer price'],
  ['occasions', 'occasions'],
  ['photoIds', 'photos'],
  ['hasSmallDecorations', 'small decorations'],
  ['personalisation', 'personalisation'],
];
/** Which parts of a live listing an edit changes (so the moderator knows where to look). */
function changedParts(draft: ListingContent, live: ListingContent): string[] {
  return PARTS.filter(([k]) => JSON.stringify(draft[k]) !== JSON.stringify(live[k])).map(([, label]) => label);
}

export function ReviewListingPage() {
  const { id } = useParams();
  const navigate = useNavigate();
  const toast = useToast();
  const review = useListingReview(id);
  const item = review.data?.listing;
  const approve = useApproveListing();
  const reject = useRejectListing();
  const [rejecting, setRejecting] = useState(false);
  // the seller saved a newer revision than the one on screen: the decision was refused (409)
  const [stale, setStale] = useState<string | null>(null);

  const back = () => navigate(paths.moderation.desk.getHref());
  /** true when the error was the 409 for a stale revision (then shown above the buttons) */
  const staleError = (e: unknown) => {
    if (!isApiError(e) || e.status !== 409) return false;
    setStale(e.message);
    setRejecting(false);
    return true;
  };
  const showNewVersion = async () => {
    await review.refetch();
    setStale(null);
  };

  return (
    <div>
      <PageHeading eyebrow="Moderation desk" title={item ? item.title : 'Review a listing'} />
      {review.isPending && id ? <Spinner label="Loading…" /> : null}
      {review.isError ? (
        <div className="flex flex-col items-start gap-3">
          <p>{isApiError(review.error) && review.error.status === 404 ? review.error.message : `This listing could not be loaded: ${review.error.message}`}</p>
          <ButtonLink to={paths.moderation.desk.getHref()} variant="secondary">
            Back to the queue
          </ButtonLink>
        </div>
      ) : null}
      {item && review.data ? (
        <div className="grid grid-cols-1 gap-6 lg:grid-cols-[minmax(0,1fr)_20rem]">
          <div className="flex min-w-0 flex-col gap-4">
            {item.kind === 'edit' && item.live ? (
              <p className="rounded-lg border border-thread bg-thread-wash p-3">
                <strong>Edit of a live listing.</strong> Changed: {changedParts(item.draft, item.live).join(', ') || 'nothing visible'}. The approved version stays on sale until you decide.
              </p>
            ) : null}
            {review.data.motifReuse?.length ? (
              <div role="note" data-testid="motif-reuse" className="rounded-lg border-2 border-danger bg-danger-wash p-3">
                <p className="font-extrabold">Same artwork as another shop</p>
                <ul className="mt-1 list-disc pl-5 text-sm">
                  {review.data.motifReuse.map((r) => (
                    <li key={`${r.motifId}:${r.otherShop.slug}:${r.otherMotifName}`}>
                      The motif “{r.motifName}” has the same cut shapes as “{r.otherMotifName}” of{' '}
                      <a className="font-bold underline" href={`/shops/${encodeURIComponent(r.otherShop.slug)}`}>
                        {r.otherShop.name}
                      </a>
                      . Check the seller may use it before approving.
                    </li>
                  ))}
                </ul>
              </div>
            ) : null}
            <ListingPreview page={review.data.page} />
          </div>
          <aside className="flex flex-col gap-5 lg:sticky lg:top-4 lg:self-start" aria-label="Decision">
            <div className="flex flex-col gap-3 rounded-lg border border-line bg-white p-4">
              <h2 className="text-lg font-extrabold">Decision</h2>
              <span>
                <Badge tone={item.kind === 'new' ? 'marigold' : 'thread'}>{item.kind === 'new' ? 'New listing' : 'Edited listing'}</Badge>
              </span>
              <p className="text-sm text-ink-soft">Version {item.revision} of the seller's text, as shown here.</p>
              {stale ? (
                <div role="alert" className="flex flex-col items-start gap-2 rounded-lg border border-danger bg-danger-wash p-3">
                  <p className="font-semibold text-danger">{stale}</p>
                  <Button variant="secondary" pending={review.isFetching} onClick={() => void showNewVersion()}>
                    Show the new version
                  </Button>
                </div>
              ) : rejecting ? (
                <ReasonForm
                  label="Reason for the seller"
                  submitLabel="Send back for changes"
                  presets={LISTING_CHANGE_REASONS}
                  danger
                  onCancel={() => setRejecting(false)}
                  onSubmit={async (reason) => {
                    try {
                      await reject.mutateAsync({ id: item.id, revision: item.revision, reason });
                    } catch (e) {
                      if (staleError(e)) return;
                      throw e;
                    }
                    toast.success(`“${item.title}” is sent back to the seller.`);
                    back();
                  }}
                />
              ) : (
                <div className="flex flex-col gap-2">
                  <Button
                    pending={approve.isPending}
                    onClick={() =>
                      approve.mutate(
                        { id: item.id, revision: item.revision },
                        {
                          onSuccess: () => {
                            toast.success(`“${item.title}” is approved and on sale.`);
                            back();
                          },
                          onError: (e) => {
                            if (!staleError(e)) toast.error(e.message);
                          },
                        },
                      )
                    }
                  >
                    Approve listing
                  </Button>
                  <Button variant="secondary" onClick={() => setRejecting(true)}>
                    Send back for changes…
                  </Button>
                </div>
              )}
            </div>
            <div className="flex flex-col gap-3 rounded-lg border border-line bg-white p-4">
              <h2 className="text-lg font-extrabold">Shop: {item.shop.name}</h2>
              <p className="text-sm text-ink-soft">State: {item.shop.state.replace('_', ' ')}</p>
              <ShopActions shop={item.shop} />
            </div>
          </aside>
        </div>
      ) : null}
    </div>
  );
}

export default ReviewListingPage;
