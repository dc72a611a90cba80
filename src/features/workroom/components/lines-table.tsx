import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import {
  createColumnHelper, getCoreRowModel, getFilteredRowModel, getSortedRowModel, useReactTable,
  type ColumnFiltersState, type FilterFn, type RowSelectionState, type SortingState,
} from '@tanstack/react-table';
import type { WorkLine } from '../../../../shared/schemas/workroom.ts';
import { WORK_STATES } from '../../../../shared/schemas/workroom.ts';
import { paths } from '../../../config/paths.ts';
import { CardTable } from '../../../components/ui/card-table.tsx';
import { formatDate, stateWords } from './format.ts';
import { MaterialChips } from './material-chips.tsx';
import { LineStateBadge } from '../../../components/ui/line-state-badge.tsx';
import { ShipByCell, useShipByLookup } from '../../business/components/ship-by-cell.tsx';

const col = createColumnHelper<WorkLine>();

const dateRange: FilterFn<WorkLine> = (row, _id, value: { from?: string; to?: string }) => {
  const paid = row.original.paidAt;
  if (value.from && paid < Date.parse(`${value.from}T00:00:00`)) return false;
  if (value.to && paid > Date.parse(`${value.to}T23:59:59.999`)) return false;
  return true;
};
const hasMaterial: FilterFn<WorkLine> = (row, _id, value: string) => row.original.materials.some((m) => m.id === value);

const selectClass = 'min-h-11 w-full rounded-lg border-2 border-field bg-white px-3 py-2 text-base hover:border-ink';

type Props = {
  lines: WorkLine[];
  state: string;
  onStateChange: (s: string) => void;
  /** bulk actions on the selected lines */
  actions?: (selected: WorkLine[], clear: () => void) => React.ReactNode;
};

/** Every line of the shop: filter by state, date paid, material and listing; sort by any column. */
export function LinesTable({ lines, state, onStateChange, actions }: Props) {
  // most urgent first: late, due today, at risk, then by ship-by date (shared/business/marks.ts)
  const [sorting, setSorting] = useState<SortingState>([{ id: 'shipBy', desc: false }]);
  const shipBy = useShipByLookup();
  const [from, setFrom] = useState('');
  const [to, setTo] = useState('');
  const [material, setMaterial] = useState('');
  const [listing, setListing] = useState('');
  const [rowSelection, setRowSelection] = useState<RowSelectionState>({});

  const materials = useMemo(() => {
    const m = new Map<string, WorkLine['materials'][number]>();
    for (const l of lines) for (const x of l.materials) m.set(x.id, x);
    return [...m.values()].sort((a, b) => a.colour.localeCompare(b.colour));
  }, [lines]);
  const listings = useMemo(() => [...new Map(lines.map((l) => [l.listingId, l.listingTitle])).entries()].sort((a, b) => a[1].localeCompare(b[1])), [lines]);

  const columnFilters: ColumnFiltersState = useMemo(
    () => [
      ...(state ? [{ id: 'state', value: state }] : []),
      ...(from || to ? [{ id: 'paidAt', value: { from, to } }] : []),
      ...(material ? [{ id: 'materials', value: material }] : []),
      ...(listing ? [{ id: 'listingTitle', value: listing }] : []),
    ],
    [state, from, to, material, listing],
  );

  const columns = useMemo(
    () => [
      col.display({
        id: 'select',
        header: ({ table }) => (
          <input type="checkbox" className="size-5 accent-thread" aria-label="Select every line shown" checked={table.getIsAllRowsSelected()} onChange={table.getToggleAllRowsSelectedHandler()} />
        ),
        cell: ({ row }) => (
          <input type="checkbox" className="size-5 accent-thread" aria-label={`Select ${row.original.orderNumber} ${row.original.text || row.original.listingTitle}`} checked={row.getIsSelected()} onChange={row.getToggleSelectedHandler()} />
        ),
      }),
      col.accessor('orderNumber', {
        header: 'Order',
        cell: (c) => (
          <Link className="font-bold whitespace-nowrap underline decoration-thread decoration-2" to={paths.workroomOrder.getHref(c.row.original.orderId)}>
            {c.getValue()}
          </Link>
        ),
      }),
      col.accessor('paidAt', { header: 'Paid', cell: (c) => <span className="whitespace-nowrap">{formatDate(c.getValue())}</span>, filterFn: dateRange }),
      col.accessor((r) => shipBy.sortKey(r.id), { id: 'shipBy', header: 'Ship by', cell: (c) => <ShipByCell info={shipBy.get(c.row.original.id)} /> }),
      col.accessor('listingTitle', { header: 'Listing', filterFn: (row, _id, v: string) => row.original.listingId === v }),
      col.accessor('text', {
        header: 'Personalisation',
        cell: (c) => (
          <span className="font-bold">
            {c.getValue() || '—'}
            {c.row.original.quantity > 1 ? <span className="ml-1 font-normal text-ink-soft">× {c.row.original.quantity}</span> : null}
          </span>
        ),
      }),
      col.accessor('materials', { header: 'Materials', enableSorting: false, cell: (c) => <MaterialChips materials={c.getValue()} />, filterFn: hasMaterial }),
      col.accessor('state', { header: 'State', cell: (c) => <LineStateBadge state={c.getValue()} words="workroom" />, filterFn: 'equals', sortingFn: (a, b) => WORK_STATES.indexOf(a.original.state as never) - WORK_STATES.indexOf(b.original.state as never) }),
      col.display({
        id: 'actions',
        header: () => <span className="sr-only">Open</span>,
        cell: ({ row }) => (
          <Link className="-my-2.5 inline-flex min-h-11 items-center rounded-lg px-3 font-bold whitespace-nowrap text-thread-deep underline decoration-2 underline-offset-4 hover:bg-thread-wash" to={paths.workroomProof.getHref(row.original.id)}>
            {row.original.state === 'awaiting_proof' ? 'Check proof' : 'Open'}
          </Link>
        ),
      }),
    ],
    [shipBy],
  );

  // a fresh array when the ship-by marks arrive, so the table re-reads the ship-by sort key
  const data = useMemo(() => [...lines], [lines, shipBy]);
  const table = useReactTable({
    data,
    columns,
    state: { sorting, columnFilters, rowSelection },
    getRowId: (r) => r.id,
    onSortingChange: setSorting,
    onRowSelectionChange: setRowSelection,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });
  const visible = table.getRowModel().rows;
  const selected = visible.filter((r) => r.getIsSelected()).map((r) => r.original);

  return (
    <section aria-labelledby="lines-title" className="flex min-w-0 max-w-full flex-col gap-4">
      <h2 id="lines-title" className="text-xl font-extrabold">Order lines</h2>
      <fieldset className="grid gap-3 rounded-lg border border-line bg-white p-4 sm:grid-cols-2 lg:grid-cols-5">
        <legend className="px-1 text-sm font-bold text-ink-soft">Filter</legend>
        <label className="flex flex-col gap-1 font-bold">
          State
          <select className={selectClass} value={state} onChange={(e) => onStateChange(e.target.value)}>
            <option value="">Every state</option>
            {[...WORK_STATES, 'cancelled', 'refunded'].map((s) => (
              <option key={s} value={s}>{stateWords(s)}</option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1 font-bold">
          Paid from
          <input type="date" className={selectClass} value={from} onChange={(e) => setFrom(e.target.value)} />
        </label>
        <label className="flex flex-col gap-1 font-bold">
          Paid until
          <input type="date" className={selectClass} value={to} onChange={(e) => setTo(e.target.value)} />
        </label>
        <label className="flex flex-col gap-1 font-bold">
          Material
          <select className={selectClass} value={material} onChange={(e) => setMaterial(e.target.value)}>
            <option value="">Any material</option>
            {materials.map((m) => (
              <option key={m.id} value={m.id}>{m.colour} ({m.kind})</option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1 font-bold">
          Listing
          <select className={selectClass} value={listing} onChange={(e) => setListing(e.target.value)}>
            <option value="">Any listing</option>
            {listings.map(([id, title]) => (
              <option key={id} value={id}>{title}</option>
            ))}
          </select>
        </label>
      </fieldset>

      <div className="flex flex-wrap items-center gap-3" aria-live="polite">
        <p className="text-ink-soft">
          {visible.length} line{visible.length === 1 ? '' : 's'} shown{selected.length ? `, ${selected.length} selected` : ''}.
        </p>
        {actions?.(selected, () => setRowSelection({}))}
      </div>

      <CardTable
        table={table}
        label="Order lines"
        minWidthClass="min-w-[760px]"
        rowAttributes={(l) => ({ 'data-testid': 'work-line', 'data-line-id': l.id })}
        empty={<span className="block text-center">No lines match these filters.</span>}
      />
    </section>
  );
}
