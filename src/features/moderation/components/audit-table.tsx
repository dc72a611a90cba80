import { createColumnHelper, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { formatDateTime } from '../../../../shared/dates.ts';
import { CardTable } from '../../../components/ui/card-table.tsx';
import type { AuditEntry } from '../api/types.ts';

const col = createColumnHelper<AuditEntry>();

export const ACTION_LABELS: Record<string, string> = {
  'listing.approve': 'Approved listing',
  'listing.reject': 'Rejected listing',
  'shop.approve': 'Approved shop',
  'shop.reject': 'Rejected shop',
  'shop.suspend': 'Suspended shop',
  'shop.restore': 'Restored shop',
};

const columns = [
  col.accessor('at', { header: 'When', cell: (c) => <span className="whitespace-nowrap">{formatDateTime(c.getValue())}</span> }),
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
  return <CardTable table={table} label="Audit log of moderator actions" minWidthClass="min-w-[40rem]" />;
}
