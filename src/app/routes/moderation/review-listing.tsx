import { useState } from 'react';
import { useNavigate, useParams } from 'react-router-dom';
import type { ListingContent } from '../../../../shared/schemas/listing.ts';
import { Button, ButtonLink, Spinner } from '../../../components/ui/button.tsx';
import { PageHeading } from '../../../components/ui/card.tsx';
import { Badge } from '../../../components/ui/form-controls.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { paths } from '../../../config/paths.ts';
import { useApproveListing, useRejectListing } from '../../../features/moderation/api/decide-listing.ts';
import { useListingPreview } from '../../../features/moderation/api/get-listing-preview.ts';
import { useModerationQueue } from '../../../features/moderation/api/get-queue.ts';
import { ListingPreview } from '../../../features/moderation/components/listing-preview.tsx';
import { ReasonForm } from '../../../features/moderation/components/reason-form.tsx';
import { ShopActions } from '../../../features/moderation/components/shop-actions.tsx';
import { DeskNav } from './desk-nav.tsx';

const PARTS: [keyof ListingContent, string][] = [
  ['title', 'title'], ['description', 'description'], ['blank', 'blank'], ['basePriceMinor', 'base price'], ['extraLayerPriceMinor', 'extra-layer price'],
  ['occasions', 'occasions'], ['photoIds', 'photos'], ['hasSmallDecorations', 'small decorations'], ['personalisation', 'personalisation'],
];
/** Which parts of a live listing an edit changes (so the moderator knows where to look). */
function changedParts(draft: ListingContent, live: ListingContent): string[] {
  return PARTS.filter(([k]) => JSON.stringify(draft[k]) !== JSON.stringify(live[k])).map(([, label]) => label);
}

export function ReviewListingPage() {
  const { id } = useParams();
  const navigate = useNavigate();
  const toast = useToast();
  const queue = useModerationQueue();
  const item = queue.data?.listings.find((l) => l.id === id);
  const preview = useListingPreview(item?.slug);
  const approve = useApproveListing();
  const reject = useRejectListing();
  const [rejecting, setRejecting] = useState(false);

  const back = () => navigate(paths.moderation.desk.getHref());

  return (
    <div>
      <DeskNav />
      <PageHeading eyebrow="Moderation desk" title={item ? item.title : 'Review a listing'} />
      {queue.isPending ? <Spinner label="Loading…" /> : null}
      {queue.data && !item ? (
        <div className="flex flex-col items-start gap-3">
          <p>This listing is not waiting for review (it may have been decided already).</p>
          <ButtonLink to={paths.moderation.desk.getHref()} variant="secondary">
            Back to the queue
          </ButtonLink>
        </div>
      ) : null}
      {item ? (
        <div className="grid grid-cols-1 gap-6 lg:grid-cols-[minmax(0,1fr)_20rem]">
          <div className="flex min-w-0 flex-col gap-4">
            {item.kind === 'edit' && item.live ? (
              <p className="rounded-lg border border-thread bg-thread-wash p-3">
                <strong>Edit of a live listing.</strong> Changed: {changedParts(item.draft, item.live).join(', ') || 'nothing visible'}. The approved version stays on sale until you decide.
              </p>
            ) : null}
            {preview.isPending ? <Spinner label="Loading the preview…" /> : null}
            {preview.isError ? <p role="alert" className="text-danger">{preview.error.message}</p> : null}
            {preview.data ? <ListingPreview page={preview.data} /> : null}
          </div>
          <aside className="flex flex-col gap-5 lg:sticky lg:top-4 lg:self-start" aria-label="Decision">
            <div className="flex flex-col gap-3 rounded-lg border border-line bg-white p-4">
              <h2 className="text-lg font-extrabold">Decision</h2>
              <span>
                <Badge tone={item.kind === 'new' ? 'marigold' : 'thread'}>{item.kind === 'new' ? 'New listing' : 'Edited listing'}</Badge>
              </span>
              {rejecting ? (
                <ReasonForm
                  label="Reason for the seller"
                  submitLabel="Reject listing"
                  danger
                  onCancel={() => setRejecting(false)}
                  onSubmit={async (reason) => {
                    await reject.mutateAsync({ id: item.id, reason });
                    toast.success(`“${item.title}” is sent back to the seller.`);
                    back();
                  }}
                />
              ) : (
                <div className="flex flex-col gap-2">
                  <Button
                    pending={approve.isPending}
                    onClick={() =>
                      approve.mutate(item.id, {
                        onSuccess: () => {
                          toast.success(`“${item.title}” is approved and on sale.`);
                          back();
                        },
                        onError: (e) => toast.error(e.message),
                      })
                    }
                  >
                    Approve listing
                  </Button>
                  <Button variant="secondary" onClick={() => setRejecting(true)}>
                    Reject with a reason
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
