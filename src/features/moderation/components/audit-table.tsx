import { createColumnHelper, flexRender, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import type { AuditEntry } from '../api/types.ts';

const col = createColumnHelper<AuditEntry>();
const when = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' });

export const ACTION_LABELS: Record<string, string> = {
  'listing.approve': 'Approved listing',
  'listing.reject': 'Rejected listing',
  'shop.approve': 'Approved shop',
  'shop.reject': 'Rejected shop',
  'shop.suspend': 'Suspended shop',
  'shop.restore': 'Restored shop',
};

const columns = [
  col.accessor('at', { header: 'When', cell: (c) => <span className="whitespace-nowrap">{when.format(c.getValue())}</span> }),
  col.accessor((e) => e.actor.name ?? e.actor.email ?? e.actor.id, {
    id: 'who',
    header: 'Who',
    cell: (c) => (
      <span className="flex flex-col">
        <span className="font-bold">{c.getValue()}</span>
        {c.row.original.actor.email ? <span className="text-sm break-all text-ink-soft">{c.row.original.actor.email}</span> : null}
      </span>
    ),
  }),
  col.accessor('action', {
    header: 'What',
    cell: (c) => (
      <span className="flex flex-col">
        <span className="font-bold">{ACTION_LABELS[c.getValue()] ?? c.getValue()}</span>
        <span className="text-sm break-words text-ink-soft">{c.row.original.subject.label ?? c.row.original.subject.id}</span>
      </span>
    ),
  }),
  col.accessor('reason', { header: 'Why', cell: (c) => <span className="whitespace-pre-wrap">{c.getValue() ?? '—'}</span> }),
];

/** Every moderator action, newest first: who, what, when, why. */
export function AuditTable({ items }: { items: AuditEntry[] }) {
  const table = useReactTable({ data: items, columns, getCoreRowModel: getCoreRowModel() });
  return (
    <div className="relative overflow-x-auto rounded-lg border border-line bg-white">
      <table className="w-full min-w-[40rem] border-collapse text-left">
        <caption className="sr-only">Audit log of moderator actions</caption>
        <thead className="bg-paper-deep">
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id}>
              {hg.headers.map((h) => (
                <th key={h.id} scope="col" className="px-4 py-3 text-sm font-extrabold">
                  {flexRender(h.column.columnDef.header, h.getContext())}
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
  );
}
