import type { ListingState } from '../../../../shared/schemas/listing.ts';
import { Badge, type BadgeTone } from '../../../components/ui/form-controls.tsx';

export const LISTING_STATE_LABELS: Record<ListingState, { label: string; tone: BadgeTone; help: string }> = {
  draft: { label: 'Draft', tone: 'neutral', help: 'Only you can see it. Send it for review when it is ready.' },
  in_review: { label: 'In review', tone: 'marigold', help: 'The Namesake team is checking it. You will get an e-mail.' },
  live: { label: 'Live', tone: 'thread', help: 'On sale: shoppers can find it.' },
  rejected: { label: 'Rejected', tone: 'danger', help: 'Not approved. Read the reason, edit it and send it again.' },
  paused: { label: 'Paused', tone: 'ink', help: 'Hidden from shoppers until you resume it.' },
};

export function ListingStateBadges({ state, pendingReview }: { state: ListingState; pendingReview: boolean }) {
  const s = LISTING_STATE_LABELS[state];
  return (
    <span className="flex flex-wrap gap-1.5">
      <Badge tone={s.tone}>{s.label}</Badge>
      {pendingReview ? <Badge tone="marigold">Changes waiting for review</Badge> : null}
    </span>
  );
}
