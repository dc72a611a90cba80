import { createColumnHelper, getCoreRowModel, getSortedRowModel, type SortingState, useReactTable } from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import { LEDGER_KIND_LABELS, type LedgerEntry, type MonthBalance } from '../../../../shared/business/ledger.ts';
import { formatMoney } from '../../../../shared/money.ts';
import type { LedgerQuery } from '../../../../shared/schemas/business.ts';
import { buttonClasses } from '../../../components/ui/button.tsx';
import { CardTable } from '../../../components/ui/card-table.tsx';
import { QueryBoundary } from '../../../components/ui/query-boundary.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useLedger } from '../api/get-ledger.ts';

const col = createColumnHelper<LedgerEntry>();
const monthCol = createColumnHelper<MonthBalance>();

/** The shop's ledger with date filters, CSV export and the balance by month. */
export function LedgerTable() {
  const [q, setQ] = useState<LedgerQuery>({});
  const ledger = useLedger(q);
  const currency = ledger.data?.currency ?? 'USD';
  const [sorting, setSorting] = useState<SortingState>([{ id: 'at', desc: true }]);
  const columns = useMemo(() => {
    const money = (m: number) => formatMoney(m, currency);
    return [
      col.accessor('at', { header: 'Date', cell: (c) => c.row.original.day }),
      col.accessor('kind', { header: 'Movement', cell: (c) => LEDGER_KIND_LABELS[c.getValue()] ?? c.getValue() }),
      col.accessor('orderNumber', { header: 'Order', cell: (c) => c.getValue() ?? '—' }),
      col.accessor('earnedMinor', { header: 'Earned', cell: (c) => (c.getValue() ? money(c.getValue()) : '—'), meta: { num: true } }),
      col.accessor('paidOutMinor', { header: 'Paid out', cell: (c) => (c.getValue() ? money(c.getValue()) : '—'), meta: { num: true } }),
      col.accessor('memo', { header: 'Note', enableSorting: false, cell: (c) => c.getValue() ?? '' }),
    ];
  }, [currency]);
  const table = useReactTable({
    data: ledger.data?.entries ?? [],
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });
  const monthColumns = useMemo(() => {
    const money = (m: number) => formatMoney(m, currency);
    const amount = (key: Exclude<keyof MonthBalance, 'month'>, header: string) => monthCol.accessor(key, { header, enableSorting: false, cell: (c) => money(c.getValue()), meta: { num: true } });
    return [
      monthCol.accessor('month', { header: 'Month', enableSorting: false }),
      amount('chargesMinor', 'Charges'),
      amount('feesMinor', 'Fees'),
      amount('refundsMinor', 'Refunds'),
      amount('earnedMinor', 'Earned'),
      amount('paidOutMinor', 'Paid out'),
      amount('balanceMinor', 'Owed at month end'),
    ];
  }, [currency]);
  const months = useReactTable({ data: ledger.data?.months ?? [], columns: monthColumns, getCoreRowModel: getCoreRowModel() });
  const rangeError = q.from && q.to && q.from > q.to ? 'The start date is after the end date.' : undefined;
  const csvParams = new URLSearchParams();
  if (q.from) csvParams.set('from', q.from);
  if (q.to) csvParams.set('to', q.to);
  const csvHref = `/api/business/ledger.csv${csvParams.toString() ? `?${csvParams.toString()}` : ''}`;

  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-wrap items-end gap-4">
        <TextField label="From" type="date" value={q.from ?? ''} onChange={(e) => setQ((p) => ({ ...p, from: e.target.value || undefined }))} className="w-48" error={rangeError} />
        <TextField label="To" type="date" value={q.to ?? ''} onChange={(e) => setQ((p) => ({ ...p, to: e.target.value || undefined }))} className="w-48" />
        {q.from || q.to ? (
          <button type="button" className={buttonClasses('quiet')} onClick={() => setQ({})}>
            Show all dates
          </button>
        ) : null}
        <a className={buttonClasses('secondary', 'ml-auto')} href={csvHref} download>
          Download CSV
        </a>
      </div>
      <QueryBoundary query={ledger} loading="Loading the ledger…">
        {(data) => (
          <>
            <section aria-labelledby="months-title" className="flex flex-col gap-2">
              <h2 id="months-title" className="text-xl font-extrabold">
                Balance by month
              </h2>
              <CardTable table={months} label="Balance by month" minWidthClass="min-w-[40rem]" rowHeaders phoneCards={false} empty="No money has moved yet." />
            </section>
            <section aria-labelledby="entries-title" className="flex flex-col gap-2">
              <h2 id="entries-title" className="text-xl font-extrabold">
                Movements <span className="text-base font-semibold text-ink-soft">({data.entries.length})</span>
              </h2>
              <CardTable table={table} label="Movements" minWidthClass="min-w-[40rem]" empty="Nothing in these dates." />
            </section>
          </>
        )}
      </QueryBoundary>
    </div>
  );
}
