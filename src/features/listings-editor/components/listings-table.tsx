import { createColumnHelper, getCoreRowModel, getSortedRowModel, type SortingState, useReactTable } from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import { formatDate } from '../../../../shared/dates.ts';
import { formatMoney } from '../../../../shared/money.ts';
import { BLANK_DEFAULTS, type SellerListing } from '../../../../shared/schemas/listing.ts';
import { CardTable } from '../../../components/ui/card-table.tsx';
import type { ListingAction } from '../api/listing-actions.ts';
import { ListingStateBadges } from './listing-state.tsx';

const col = createColumnHelper<SellerListing>();

const actionButton = 'min-h-11 rounded-lg px-3 font-bold underline decoration-2 underline-offset-4 whitespace-nowrap disabled:opacity-50';

export function ListingsTable({
  listings,
  editHref,
  onAction,
  busyId,
}: {
  listings: SellerListing[];
  editHref: (id: string) => string;
  onAction: (listing: SellerListing, action: ListingAction) => void;
  busyId: string | null;
}) {
  const [sorting, setSorting] = useState<SortingState>([{ id: 'updatedAt', desc: true }]);
  const columns = useMemo(
    () => [
      col.accessor((l) => l.draft.title, {
        id: 'title',
        header: 'Listing',
        cell: (c) => {
          const l = c.row.original;
          return (
            <span className="flex flex-col gap-1">
              <Link to={editHref(l.id)} className="font-bold text-ink underline decoration-thread decoration-2 underline-offset-4">
                {c.getValue()}
              </Link>
              <span className="text-sm text-ink-soft">{BLANK_DEFAULTS[l.draft.blank.kind]?.label ?? l.draft.blank.kind}</span>
              {l.rejectionReason ? <span className="text-sm text-danger">Reason: {l.rejectionReason}</span> : null}
            </span>
          );
        },
      }),
      col.accessor('state', { header: 'State', cell: (c) => <ListingStateBadges state={c.getValue()} pendingReview={c.row.original.pendingReview} /> }),
      col.accessor((l) => l.draft.basePriceMinor, { id: 'price', header: 'From', cell: (c) => formatMoney(c.getValue(), c.row.original.currency) }),
      col.accessor('updatedAt', { header: 'Changed', cell: (c) => <span className="whitespace-nowrap">{formatDate(c.getValue())}</span> }),
      col.display({
        id: 'actions',
        header: () => <span className="sr-only">Actions</span>,
        cell: (c) => {
          const l = c.row.original;
          const busy = busyId === l.id;
          const title = <span className="sr-only"> {l.draft.title}</span>;
          return (
            <span className="flex flex-wrap gap-1">
              <Link to={editHref(l.id)} className={`${actionButton} inline-flex items-center text-thread-deep hover:bg-thread-wash`}>
                Edit{title}
              </Link>
              {(l.state === 'draft' || l.state === 'rejected') && !l.pendingReview ? (
                <button type="button" disabled={busy} onClick={() => onAction(l, 'submit')} className={`${actionButton} text-thread-deep hover:bg-thread-wash`}>
                  Submit for review{title}
                </button>
              ) : null}
              {l.state === 'live' ? (
                <button type="button" disabled={busy} onClick={() => onAction(l, 'pause')} className={`${actionButton} text-ink-soft hover:bg-paper-deep`}>
                  Pause{title}
                </button>
              ) : null}
              {l.state === 'paused' ? (
                <button type="button" disabled={busy} onClick={() => onAction(l, 'unpause')} className={`${actionButton} text-thread-deep hover:bg-thread-wash`}>
                  Resume{title}
                </button>
              ) : null}
            </span>
          );
        },
      }),
    ],
    [editHref, onAction, busyId],
  );
  const table = useReactTable({ data: listings, columns, state: { sorting }, onSortingChange: setSorting, getCoreRowModel: getCoreRowModel(), getSortedRowModel: getSortedRowModel() });

  return <CardTable table={table} label="Your listings" minWidthClass="min-w-[46rem]" />;
}
