import { createColumnHelper, flexRender, getCoreRowModel, getSortedRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import type { Material } from '../../../../shared/schemas/material.ts';
import { formatLength, formatTemperature } from '../../../../shared/units.ts';
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

  return (
    <>
      {/* phones: one card per row, each value with its column name */}
      <ul className="flex flex-col gap-3 md:hidden" aria-label="Your materials">
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
      <table className="w-full min-w-[44rem] border-collapse text-left">
        <caption className="sr-only">Your materials</caption>
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
            <tr key={row.id} className={`border-t border-line ${row.original.archived ? 'opacity-70' : ''}`}>
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
