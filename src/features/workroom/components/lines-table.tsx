import { createColumnHelper, getCoreRowModel, getSortedRowModel, type RowSelectionState, type SortingState, useReactTable } from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import { isNewLine } from '../../../../shared/business/new-line.ts';
import type { WorkLine, WorkLinesPage } from '../../../../shared/schemas/workroom.ts';
import { WORK_STATES } from '../../../../shared/schemas/workroom.ts';
import { CardTable } from '../../../components/ui/card-table.tsx';
import { LineStateBadge } from '../../../components/ui/line-state-badge.tsx';
import { ShipByCell, type ShipByLookup } from '../../../components/ui/ship-by-cell.tsx';
import { paths } from '../../../config/paths.ts';
import { formatDate, stateWords } from './format.ts';
import { MaterialChips } from './material-chips.tsx';

/** a line with its ship-by sort key beside it, so the table sorts on data it holds */
type Row = WorkLine & { shipByKey: string };
const col = createColumnHelper<Row>();

const selectClass = 'min-h-11 w-full rounded-lg border-2 border-field bg-white px-3 py-2 text-base hover:border-ink';

/** The table's filters, as they sit in the page's URL (dates as YYYY-MM-DD, '' = any). */
export type LinesFilterValues = { state: string; from: string; to: string; material: string; listing: string };

type Props = {
  /** the lines of the current page (the server filtered them) */
  lines: WorkLine[];
  /** how many lines pass the filters, on every page */
  total: number;
  filters: LinesFilterValues;
  onFiltersChange: (patch: Partial<LinesFilterValues>) => void;
  /** what the material and listing filters offer (across every line of the shop) */
  options: WorkLinesPage['options'];
  /** bulk actions on the selected lines (of this page) */
  actions?: (selected: WorkLine[], clear: () => void) => React.ReactNode;
  /** each line's ship-by date and mark (from the business feature, handed in by the route) */
  shipBy: ShipByLookup;
};

/**
 * One page of the shop's lines: filter by state, date paid, material and listing (the server
 * filters and pages); sort the page by any column; select lines of the page for bulk actions.
 */
export function LinesTable({ lines, total, filters, onFiltersChange, options, actions, shipBy }: Props) {
  // most urgent first: late, due today, at risk, then by ship-by date (shared/business/marks.ts)
  const [sorting, setSorting] = useState<SortingState>([{ id: 'shipBy', desc: false }]);
  const { state, from, to, material, listing } = filters;
  const [rowSelection, setRowSelection] = useState<RowSelectionState>({});
  // a selection belongs to the rows on screen: another page or filter starts with none selected
  const [selectionRows, setSelectionRows] = useState(lines);
  if (selectionRows !== lines) {
    setSelectionRows(lines);
    setRowSelection({});
  }
  const materials = options.materials;
  const listings = options.listings;

  const columns = useMemo(
    () => [
      col.display({
        id: 'select',
        header: ({ table }) => (
          <input type="checkbox" className="size-5 accent-thread" aria-label="Select every line shown" checked={table.getIsAllRowsSelected()} onChange={table.getToggleAllRowsSelectedHandler()} />
        ),
        cell: ({ row }) => (
          <input
            type="checkbox"
            className="size-5 accent-thread"
            aria-label={`Select ${row.original.orderNumber} ${row.original.text || row.original.listingTitle}`}
            checked={row.getIsSelected()}
            onChange={row.getToggleSelectedHandler()}
          />
        ),
      }),
      col.accessor('orderNumber', {
        header: 'Order',
        cell: (c) => (
          <span className="flex flex-col items-start gap-1">
            <Link className="font-bold whitespace-nowrap underline decoration-thread decoration-2" to={paths.workroomOrder.getHref(c.row.original.orderId)}>
              {c.getValue()}
            </Link>
            {isNewLine(c.row.original, Date.now()) ? (
              <span className="rounded-full bg-marigold px-2 py-0.5 text-xs font-extrabold text-ink" data-testid="new-line">
                New
              </span>
            ) : null}
          </span>
        ),
      }),
      col.accessor('paidAt', { header: 'Paid', cell: (c) => <span className="whitespace-nowrap">{formatDate(c.getValue())}</span> }),
      col.accessor('shipByKey', { id: 'shipBy', header: 'Ship by', cell: (c) => <ShipByCell info={shipBy.get(c.row.original.id)} /> }),
      col.accessor('listingTitle', {
        header: 'Listing',
        cell: (c) => (
          <span>
            {c.getValue()}
            {c.row.original.blankChoice ? (
              <span className="block font-bold whitespace-nowrap" data-testid="blank-choice">
                {c.row.original.blankChoice}
              </span>
            ) : null}
          </span>
        ),
      }),
      col.accessor('text', {
        header: 'Personalisation',
        cell: (c) => (
          <span className="font-bold">
            {c.getValue() || '—'}
            {c.row.original.quantity > 1 ? <span className="ml-1 font-normal text-ink-soft">× {c.row.original.quantity}</span> : null}
          </span>
        ),
      }),
      col.accessor('materials', { header: 'Materials', enableSorting: false, cell: (c) => <MaterialChips materials={c.getValue()} /> }),
      col.accessor('state', {
        header: 'State',
        cell: (c) => <LineStateBadge state={c.getValue()} words="workroom" />,
        sortingFn: (a, b) => WORK_STATES.indexOf(a.original.state as never) - WORK_STATES.indexOf(b.original.state as never),
      }),
      col.display({
        id: 'actions',
        header: () => <span className="sr-only">Open</span>,
        cell: ({ row }) => (
          <Link
            className="-my-2.5 inline-flex min-h-11 items-center rounded-lg px-3 font-bold whitespace-nowrap text-thread-deep underline decoration-2 underline-offset-4 hover:bg-thread-wash"
            to={paths.workroomProof.getHref(row.original.id)}
          >
            {row.original.state === 'awaiting_proof' ? 'Check proof' : 'Open'}
          </Link>
        ),
      }),
    ],
    [shipBy],
  );

  // the table caches each row's sort values, so the ship-by key goes into the rows themselves:
  // fresh rows when the ship-by marks arrive
  // new lines (shared/business/new-line.ts) go before the others of the same urgency mark
  const data = useMemo<Row[]>(() => {
    const now = Date.now();
    return lines.map((l) => {
      const [mark, day] = shipBy.sortKey(l.id).split('|');
      return { ...l, shipByKey: `${mark}|${isNewLine(l, now) ? 0 : 1}|${day}` };
    });
  }, [lines, shipBy]);
  const table = useReactTable({
    data,
    columns,
    state: { sorting, rowSelection },
    getRowId: (r) => r.id,
    onSortingChange: setSorting,
    onRowSelectionChange: setRowSelection,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });
  const visible = table.getRowModel().rows;
  const selected = visible.filter((r) => r.getIsSelected()).map((r) => r.original);

  return (
    <section aria-labelledby="lines-title" className="flex min-w-0 max-w-full flex-col gap-4">
      <h2 id="lines-title" className="text-xl font-extrabold">
        Order lines
      </h2>
      <fieldset className="grid gap-3 rounded-lg border border-line bg-white p-4 sm:grid-cols-2 lg:grid-cols-5">
        <legend className="px-1 text-sm font-bold text-ink-soft">Filter</legend>
        <label className="flex flex-col gap-1 font-bold">
          State
          <select className={selectClass} value={state} onChange={(e) => onFiltersChange({ state: e.target.value })}>
            <option value="">Every state</option>
            {[...WORK_STATES, 'cancelled', 'refunded'].map((s) => (
              <option key={s} value={s}>
                {stateWords(s)}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1 font-bold">
          Paid from
          <input type="date" className={selectClass} value={from} onChange={(e) => onFiltersChange({ from: e.target.value })} />
        </label>
        <label className="flex flex-col gap-1 font-bold">
          Paid until
          <input type="date" className={selectClass} value={to} onChange={(e) => onFiltersChange({ to: e.target.value })} />
        </label>
        <label className="flex flex-col gap-1 font-bold">
          Material
          <select className={selectClass} value={material} onChange={(e) => onFiltersChange({ material: e.target.value })}>
            <option value="">Any material</option>
            {materials.map((m) => (
              <option key={m.id} value={m.id}>
                {m.colour} ({m.kind})
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1 font-bold">
          Listing
          <select className={selectClass} value={listing} onChange={(e) => onFiltersChange({ listing: e.target.value })}>
            <option value="">Any listing</option>
            {listings.map(({ id, title }) => (
              <option key={id} value={id}>
                {title}
              </option>
            ))}
          </select>
        </label>
      </fieldset>

      <div className="flex flex-wrap items-center gap-3" aria-live="polite">
        <p className="text-ink-soft">
          {total} line{total === 1 ? '' : 's'} match{total === 1 ? 'es' : ''}; {visible.length} shown on this page{selected.length ? `, ${selected.length} selected` : ''}.
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
