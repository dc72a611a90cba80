import { createColumnHelper, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { Link } from 'react-router-dom';
import { formatDateTime } from '../../../../shared/dates.ts';
import { AUDIT_ACTIONS } from '../../../../shared/schemas/catalog.ts';
import { CardTable } from '../../../components/ui/card-table.tsx';
import type { AuditEntry } from '../api/types.ts';

const col = createColumnHelper<AuditEntry>();

export const ACTION_LABELS: Record<string, string> = AUDIT_ACTIONS;

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
        {c.row.original.subject.href ? (
          <Link className="text-sm break-words text-thread-deep underline" to={c.row.original.subject.href}>
            {c.row.original.subject.label ?? c.row.original.subject.id}
          </Link>
        ) : (
          <span className="text-sm break-words text-ink-soft">{c.row.original.subject.label ?? c.row.original.subject.id}</span>
        )}
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
