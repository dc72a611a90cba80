import { createColumnHelper, getCoreRowModel, getSortedRowModel, type SortingState, useReactTable } from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import type { Material } from '../../../../shared/schemas/material.ts';
import { formatLength, formatTemperature } from '../../../../shared/units.ts';
import { CardTable } from '../../../components/ui/card-table.tsx';
import { Badge } from '../../../components/ui/form-controls.tsx';
import { KIND_LABELS } from './material-form.tsx';

const col = createColumnHelper<Material>();

export function MaterialsTable({
  materials,
  pressType,
  onEdit,
  onArchive,
}: {
  materials: Material[];
  pressType: 'handheld' | 'clamshell';
  onEdit: (m: Material) => void;
  onArchive: (m: Material) => void;
}) {
  const [sorting, setSorting] = useState<SortingState>([]);
  const columns = useMemo(
    () => [
      col.accessor('colourName', {
        header: 'Colour',
        cell: (c) => (
          <span className="flex items-center gap-2.5">
            <span aria-hidden="true" className="size-6 shrink-0 rounded-full border border-ink/30" style={{ background: c.row.original.colourHex }} />
            <span className="font-bold">{c.getValue()}</span>
            <span className="text-sm text-ink-soft">{c.row.original.colourHex}</span>
          </span>
        ),
      }),
      col.accessor('kind', { header: 'Kind', cell: (c) => KIND_LABELS[c.getValue()] }),
      col.accessor('rollWidthMm', { header: 'Roll width', cell: (c) => <span className="whitespace-nowrap">{formatLength(c.getValue())}</span> }),
      col.accessor('stockMm', {
        header: 'In stock',
        cell: (c) => (
          <span className="flex flex-col items-start gap-1">
            <span className="whitespace-nowrap">{formatLength(c.getValue())}</span>
            {c.row.original.lowStock ? <Badge tone="marigold">Low stock</Badge> : null}
            {c.row.original.archived ? <Badge>Archived</Badge> : null}
          </span>
        ),
      }),
      col.display({
        id: 'press',
        header: pressType === 'clamshell' ? 'Clamshell press' : 'Handheld press',
        cell: (c) => {
          const p = c.row.original.pressProfile;
          return (
            <span className="text-sm md:whitespace-nowrap">
              {formatTemperature(p[pressType].tempC)}, {p[pressType].timeS} s<br />
              tack {p.tackS} s · peel {p.peel}
              {p.topOnly ? ' · top only' : ''}
            </span>
          );
        },
      }),
      col.display({
        id: 'actions',
        header: () => <span className="sr-only">Actions</span>,
        cell: (c) => (
          <span className="flex gap-2">
            <button type="button" onClick={() => onEdit(c.row.original)} className="min-h-11 rounded-lg px-3 font-bold text-thread-deep underline decoration-2 underline-offset-4 hover:bg-thread-wash">
              Edit<span className="sr-only"> {c.row.original.colourName}</span>
            </button>
            <button type="button" onClick={() => onArchive(c.row.original)} className="min-h-11 rounded-lg px-3 font-bold text-ink-soft underline decoration-2 underline-offset-4 hover:bg-paper-deep">
              {c.row.original.archived ? 'Restore' : 'Archive'}
              <span className="sr-only"> {c.row.original.colourName}</span>
            </button>
          </span>
        ),
      }),
    ],
    [pressType, onEdit, onArchive],
  );
  const table = useReactTable({ data: materials, columns, state: { sorting }, onSortingChange: setSorting, getCoreRowModel: getCoreRowModel(), getSortedRowModel: getSortedRowModel() });

  return <CardTable table={table} label="Your materials" minWidthClass="min-w-[44rem]" rowClassName={(m) => (m.archived ? 'opacity-70' : '')} />;
}
