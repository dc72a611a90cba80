import { type Cell, flexRender, type RowData, type Table } from '@tanstack/react-table';
import { type ReactNode, useSyncExternalStore } from 'react';
import { TableShell } from './simple-table.tsx';

declare module '@tanstack/react-table' {
  interface ColumnMeta<TData extends RowData, TValue> {
    /** an amount: right-aligned, figures in columns */
    num?: boolean;
  }
}

/** Column ids with a set place on a phone card: `select` (a row checkbox) beside the title, `actions` at the foot. */
const SELECT = 'select';
const ACTIONS = 'actions';

const PHONE_QUERY = '(max-width: 47.99rem)'; // below Tailwind's md breakpoint
const subscribe = (onChange: () => void) => {
  const mq = window.matchMedia(PHONE_QUERY);
  mq.addEventListener('change', onChange);
  return () => mq.removeEventListener('change', onChange);
};
/** True on a phone-width window. One layout is rendered at a time, so every row exists once in the page. */
function usePhoneWidth(): boolean {
  return useSyncExternalStore(
    subscribe,
    () => window.matchMedia(PHONE_QUERY).matches,
    () => false,
  );
}

type Props<T> = {
  table: Table<T>;
  /** the table's caption (screen readers) and the card list's name */
  label: string;
  /** the table's least width before it scrolls sideways, e.g. `min-w-[44rem]` */
  minWidthClass: string;
  rowClassName?: (row: T) => string;
  /** data attributes per row (on the row, or on the card on a phone) */
  rowAttributes?: (row: T) => Record<`data-${string}`, string>;
  /** one card per row on a phone (default); false keeps the table there, scrolling sideways */
  phoneCards?: boolean;
  /** shown instead of the rows when there are none */
  empty?: ReactNode;
  /** the first column names its row (a `th scope="row"`) */
  rowHeaders?: boolean;
};

const alignClass = (num?: boolean) => (num ? 'text-right tabular-nums' : '');
const headerText = <T,>(c: Cell<T, unknown>) => (typeof c.column.columnDef.header === 'string' ? c.column.columnDef.header : '');

/**
 * The app's one data table: a sortable TanStack table, with an optional row-selection column,
 * amounts right-aligned (`meta: { num: true }`), and one card per row on phones (each value beside
 * its column name; a `select` column beside the card's title, an `actions` column at its foot).
 */
export function CardTable<T>({ table, label, minWidthClass, rowClassName, rowAttributes, phoneCards = true, empty, rowHeaders = false }: Props<T>) {
  const phone = usePhoneWidth();
  const rows = table.getRowModel().rows;
  const columnCount = table.getVisibleLeafColumns().length;

  if (phone && phoneCards) {
    const selectHeader = table
      .getHeaderGroups()
      .at(-1)
      ?.headers.find((h) => h.column.id === SELECT);
    const cell = (c: Cell<T, unknown>) => flexRender(c.column.columnDef.cell, c.getContext());
    return (
      <div className="flex flex-col gap-3">
        {selectHeader && rows.length > 0 ? (
          <div className="flex min-h-11 items-center gap-3 rounded-lg border border-line bg-paper-deep px-4">
            {flexRender(selectHeader.column.columnDef.header, selectHeader.getContext())}
            <span aria-hidden="true" className="text-sm font-bold text-ink-soft">
              All shown
            </span>
          </div>
        ) : null}
        <ul className="flex flex-col gap-3" aria-label={label}>
          {rows.map((row) => {
            const cells = row.getVisibleCells();
            const select = cells.find((c) => c.column.id === SELECT);
            const actions = cells.filter((c) => c.column.id === ACTIONS);
            const [first, ...rest] = cells.filter((c) => c.column.id !== SELECT && c.column.id !== ACTIONS);
            return (
              <li key={row.id} className={`flex flex-col gap-2 rounded-lg border border-line bg-white p-4 ${rowClassName?.(row.original) ?? ''}`} {...rowAttributes?.(row.original)}>
                <div className="flex items-start gap-3">
                  {select ? <div className="pt-0.5">{cell(select)}</div> : null}
                  {first ? <div className="min-w-0 flex-1">{cell(first)}</div> : null}
                </div>
                {rest.length ? (
                  <dl className="grid grid-cols-[auto_minmax(0,1fr)] gap-x-3 gap-y-1.5">
                    {rest.map((c) => (
                      <div key={c.id} className="contents">
                        <dt className="text-sm font-bold text-ink-soft">{headerText(c)}</dt>
                        <dd className={alignClass(c.column.columnDef.meta?.num)}>{cell(c)}</dd>
                      </div>
                    ))}
                  </dl>
                ) : null}
                {actions.map((c) => (
                  <div key={c.id} className="-mx-3 border-t border-line pt-1">
                    {cell(c)}
                  </div>
                ))}
              </li>
            );
          })}
          {rows.length === 0 && empty ? <li className="rounded-lg border border-line bg-white p-4 text-ink-soft">{empty}</li> : null}
        </ul>
      </div>
    );
  }

  return (
    <TableShell
      minWidthClass={minWidthClass}
      className="border-collapse"
      caption={label}
      columnCount={columnCount}
      empty={rows.length === 0 ? empty : null}
      emptyClassName="px-4 py-6 text-ink-soft"
      head={table.getHeaderGroups().map((hg) => (
        <tr key={hg.id}>
          {hg.headers.map((h) => {
            const sorted = h.column.getIsSorted();
            const num = h.column.columnDef.meta?.num;
            return (
              <th
                key={h.id}
                scope="col"
                className={`px-4 py-3 text-sm font-extrabold ${num ? 'text-right' : ''}`}
                aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined}
              >
                {h.column.getCanSort() ? (
                  <button type="button" onClick={h.column.getToggleSortingHandler()} className={`inline-flex min-h-8 items-center gap-1 font-extrabold ${num ? 'flex-row-reverse' : ''}`}>
                    {flexRender(h.column.columnDef.header, h.getContext())}
                    <span aria-hidden="true">{sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}</span>
                  </button>
                ) : (
                  flexRender(h.column.columnDef.header, h.getContext())
                )}
              </th>
            );
          })}
        </tr>
      ))}
    >
      {rows.map((row) => (
        <tr key={row.id} className={`border-t border-line align-top hover:bg-paper ${rowClassName?.(row.original) ?? ''}`} {...rowAttributes?.(row.original)}>
          {row.getVisibleCells().map((c, i) => {
            const content = flexRender(c.column.columnDef.cell, c.getContext());
            const cls = `px-4 py-3 ${alignClass(c.column.columnDef.meta?.num)}`;
            return rowHeaders && i === 0 ? (
              <th key={c.id} scope="row" className={`${cls} font-bold whitespace-nowrap`}>
                {content}
              </th>
            ) : (
              <td key={c.id} className={cls}>
                {content}
              </td>
            );
          })}
        </tr>
      ))}
    </TableShell>
  );
}
