import { useMemo, useState } from 'react';
import { createColumnHelper, flexRender, getCoreRowModel, getSortedRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import { formatMoney } from '../../../../shared/money.ts';
import { LEDGER_KIND_LABELS, type LedgerEntry } from '../../../../shared/business/ledger.ts';
import type { LedgerQuery } from '../../../../shared/schemas/business.ts';
import { buttonClasses, Spinner } from '../../../components/ui/button.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useLedger } from '../api/get-ledger.ts';

const col = createColumnHelper<LedgerEntry>();

/** The shop's ledger with date filters, CSV export and the balance by month. */
export function LedgerTable() {
  const [q, setQ] = useState<LedgerQuery>({});
  const ledger = useLedger(q);
  const currency = ledger.data?.currency ?? 'USD';
  const money = (m: number) => formatMoney(m, currency);
  const [sorting, setSorting] = useState<SortingState>([{ id: 'at', desc: true }]);
  const columns = useMemo(
    () => [
      col.accessor('at', { header: 'Date', cell: (c) => c.row.original.day }),
      col.accessor('kind', { header: 'Movement', cell: (c) => LEDGER_KIND_LABELS[c.getValue()] ?? c.getValue() }),
      col.accessor('orderNumber', { header: 'Order', cell: (c) => c.getValue() ?? '—' }),
      col.accessor('earnedMinor', { header: 'Earned', cell: (c) => (c.getValue() ? money(c.getValue()) : '—'), meta: { num: true } }),
      col.accessor('paidOutMinor', { header: 'Paid out', cell: (c) => (c.getValue() ? money(c.getValue()) : '—'), meta: { num: true } }),
      col.accessor('memo', { header: 'Note', enableSorting: false, cell: (c) => c.getValue() ?? '' }),
    ],
    [currency],
  );
  const table = useReactTable({ data: ledger.data?.entries ?? [], columns, state: { sorting }, onSortingChange: setSorting, getCoreRowModel: getCoreRowModel(), getSortedRowModel: getSortedRowModel() });
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
      {ledger.isPending ? <Spinner label="Loading the ledger…" /> : null}
      {ledger.isError ? <p role="alert" className="font-semibold text-danger">{ledger.error.message}</p> : null}
      {ledger.data ? (
        <>
          <section aria-labelledby="months-title" className="flex flex-col gap-2">
            <h2 id="months-title" className="text-xl font-extrabold">Balance by month</h2>
            <div className="overflow-x-auto rounded-lg border border-line bg-white">
              <table className="w-full min-w-[36rem] text-left">
                <thead className="bg-paper-deep text-sm">
                  <tr>
                    {['Month', 'Charges', 'Fees', 'Refunds', 'Earned', 'Paid out', 'Owed at month end'].map((h, i) => (
                      <th key={h} scope="col" className={`px-3 py-2 ${i ? 'text-right' : ''}`}>{h}</th>
                    ))}
                  </tr>
                </thead>
                <tbody>
                  {ledger.data.months.map((m) => (
                    <tr key={m.month} className="border-t border-line">
                      <th scope="row" className="px-3 py-2 font-bold">{m.month}</th>
                      {[m.chargesMinor, m.feesMinor, m.refundsMinor, m.earnedMinor, m.paidOutMinor, m.balanceMinor].map((v, i) => (
                        <td key={i} className="px-3 py-2 text-right tabular-nums">{money(v)}</td>
                      ))}
                    </tr>
                  ))}
                  {ledger.data.months.length === 0 ? (
                    <tr><td colSpan={7} className="px-3 py-4 text-ink-soft">No money has moved yet.</td></tr>
                  ) : null}
                </tbody>
              </table>
            </div>
          </section>
          <section aria-labelledby="entries-title" className="flex flex-col gap-2">
            <h2 id="entries-title" className="text-xl font-extrabold">Movements <span className="text-base font-semibold text-ink-soft">({ledger.data.entries.length})</span></h2>
            <div className="overflow-x-auto rounded-lg border border-line bg-white">
              <table className="w-full min-w-[40rem] text-left">
                <thead className="bg-paper-deep text-sm">
                  {table.getHeaderGroups().map((hg) => (
                    <tr key={hg.id}>
                      {hg.headers.map((h) => {
                        const num = (h.column.columnDef.meta as { num?: boolean } | undefined)?.num;
                        const sorted = h.column.getIsSorted();
                        return (
                          <th key={h.id} scope="col" aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined} className={`px-3 py-2 ${num ? 'text-right' : ''}`}>
                            {h.column.getCanSort() ? (
                              <button type="button" className="min-h-8 font-bold underline decoration-thread decoration-2 underline-offset-4" onClick={h.column.getToggleSortingHandler()}>
                                {flexRender(h.column.columnDef.header, h.getContext())}
                                {sorted ? (sorted === 'asc' ? ' ↑' : ' ↓') : ''}
                              </button>
                            ) : (
                              flexRender(h.column.columnDef.header, h.getContext())
                            )}
                          </th>
                        );
                      })}
                    </tr>
                  ))}
                </thead>
                <tbody>
                  {table.getRowModel().rows.map((r) => (
                    <tr key={r.id} className="border-t border-line">
                      {r.getVisibleCells().map((c) => (
                        <td key={c.id} className={`px-3 py-2 ${(c.column.columnDef.meta as { num?: boolean } | undefined)?.num ? 'text-right tabular-nums' : ''}`}>
                          {flexRender(c.column.columnDef.cell, c.getContext())}
                        </td>
                      ))}
                    </tr>
                  ))}
                  {ledger.data.entries.length === 0 ? (
                    <tr><td colSpan={6} className="px-3 py-4 text-ink-soft">Nothing in these dates.</td></tr>
                  ) : null}
                </tbody>
              </table>
            </div>
          </section>
        </>
      ) : null}
    </div>
  );
}
