import { flexRender, type Table } from '@tanstack/react-table';

/**
 * A sortable TanStack table that becomes one card per row on phones (each value beside its
 * column name; an `actions` column goes at the foot of the card).
 */
export function CardTable<T>({ table, label, minWidthClass, rowClassName }: { table: Table<T>; label: string; minWidthClass: string; rowClassName?: (row: T) => string }) {
  return (
    <>
      <ul className="flex flex-col gap-3 md:hidden" aria-label={label}>
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
        <table className={`w-full ${minWidthClass} border-collapse text-left`}>
          <caption className="sr-only">{label}</caption>
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
              <tr key={row.id} className={`border-t border-line ${rowClassName?.(row.original) ?? ''}`}>
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
