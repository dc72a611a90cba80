import type { ReactNode } from 'react';

/** A column heading: its words, or its words and whether it holds amounts (right-aligned, figures in columns). */
export type SimpleColumn = string | { header: string; num?: boolean };

const headerOf = (c: SimpleColumn) => (typeof c === 'string' ? c : c.header);
const numOf = (c: SimpleColumn) => typeof c !== 'string' && !!c.num;

/**
 * The shell of every data table: a box that scrolls sideways when the table is wider than the page
 * (framed, a white box with a border, unless it already sits on a panel), the caption for screen
 * readers, the head rows, the body rows, and `empty` as the one row across all `columnCount`
 * columns when it is given.
 */
export function TableShell({
  minWidthClass,
  className = '',
  caption,
  framed = true,
  head,
  columnCount,
  empty,
  emptyClassName,
  children,
}: {
  /** the table's least width before it scrolls sideways, e.g. `min-w-[34rem]` */
  minWidthClass: string;
  /** more classes on the table, e.g. `text-sm` */
  className?: string;
  caption?: string;
  framed?: boolean;
  /** the `<tr>`s of the table's head */
  head: ReactNode;
  columnCount: number;
  empty?: ReactNode;
  emptyClassName: string;
  children: ReactNode;
}) {
  return (
    <div className={framed ? 'relative max-w-full overflow-x-auto rounded-lg border border-line bg-white' : 'overflow-x-auto'}>
      <table className={`w-full ${minWidthClass} text-left ${className}`}>
        {caption ? <caption className="sr-only">{caption}</caption> : null}
        <thead className="bg-paper-deep text-sm">{head}</thead>
        <tbody>
          {children}
          {empty ? (
            <tr>
              <td colSpan={columnCount} className={emptyClassName}>
                {empty}
              </td>
            </tr>
          ) : null}
        </tbody>
      </table>
    </div>
  );
}

/**
 * A read-only table with fixed columns (for sorting and phone cards, CardTable): the column heads,
 * the rows the caller writes, and `empty` as the only row when it is given. `caption` names the
 * table for screen readers when no heading near it does.
 */
export function SimpleTable({
  columns,
  empty,
  children,
  ...shell
}: {
  columns: readonly SimpleColumn[];
  minWidthClass: string;
  caption?: string;
  className?: string;
  framed?: boolean;
  empty?: ReactNode;
  children: ReactNode;
}) {
  return (
    <TableShell
      {...shell}
      columnCount={columns.length}
      empty={empty}
      emptyClassName="px-3 py-4 text-ink-soft"
      head={
        <tr>
          {columns.map((c) => (
            <th key={headerOf(c)} scope="col" className={`px-3 py-2 ${numOf(c) ? 'text-right' : ''}`}>
              {headerOf(c)}
            </th>
          ))}
        </tr>
      }
    >
      {children}
    </TableShell>
  );
}
