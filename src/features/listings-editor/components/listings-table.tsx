import { createColumnHelper, flexRender, getCoreRowModel, getSortedRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import { BLANK_DEFAULTS, type SellerListing } from '../../../../shared/schemas/listing.ts';
import { formatMoney } from '../../../../shared/money.ts';
import type { ListingAction } from '../api/listing-actions.ts';
import { ListingStateBadges } from './listing-state.tsx';

const col = createColumnHelper<SellerListing>();
const dateFmt = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium' });

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
      col.accessor('updatedAt', { header: 'Changed', cell: (c) => <span className="whitespace-nowrap">{dateFmt.format(c.getValue())}</span> }),
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

  return (
    <>
      {/* phones: one card per row, each value with its column name */}
      <ul className="flex flex-col gap-3 md:hidden" aria-label="Your listings">
        {table.getRowModel().rows.map((row) => {
          const [first, ...rest] = row.getVisibleCells();
          return (
            <li key={row.id} className="flex flex-col gap-2 rounded-lg border border-line bg-white p-4">
              {first ? <div>{flexRender(first.column.columnDef.cell, first.getContext())}</div> : null}
              <dl className="grid grid-cols-[auto_minmax(0,1fr)] gap-x-3 gap-y-1.5">
                {rest.map((cell) =>
                  cell.column.id === 'actions' ? null : (
                    <div key={cell.id} className="contents">
                      <dt className="text-sm font-bold text-ink-soft">{typeof cell.column.columnDef.header === 'string' ? cell.column.columnDef.header : ''}</dt>
                      <dd>{flexRender(cell.column.columnDef.cell, cell.getContext())}</dd>
                    </div>
                  ),
                )}
              </dl>
              {rest
                .filter((cell) => cell.column.id === 'actions')
                .map((cell) => (
                  <div key={cell.id} className="-mx-3 border-t border-line pt-1">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </div>
                ))}
            </li>
          );
        })}
      </ul>
    <div className="relative hidden overflow-x-auto rounded-lg border border-line bg-white md:block">
      <table className="w-full min-w-[46rem] border-collapse text-left">
        <caption className="sr-only">Your listings</caption>
        <thead className="bg-paper-deep">
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id}>
              {hg.headers.map((h) => (
                <th key={h.id} scope="col" className="px-4 py-3 text-sm font-extrabold" aria-sort={h.column.getIsSorted() === 'asc' ? 'ascending' : h.column.getIsSorted() === 'desc' ? 'descending' : undefined}>
                  {h.column.getCanSort() ? (
                    <button type="button" onClick={h.column.getToggleSortingHandler()} className="flex min-h-8 items-center gap-1 font-extrabold">
                      {flexRender(h.column.columnDef.header, h.getContext())}
                      <span aria-hidden="true">{h.column.getIsSorted() === 'asc' ? '▲' : h.column.getIsSorted() === 'desc' ? '▼' : '↕'}</span>
                    </button>
                  ) : (
                    flexRender(h.column.columnDef.header, h.getContext())
                  )}
                </th>
              ))}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className="border-t border-line">
              {row.getVisibleCells().map((cell) => (
                <td key={cell.id} className="px-4 py-3 align-top">
                  {flexRender(cell.column.columnDef.cell, cell.getContext())}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
    </>
  );
}
