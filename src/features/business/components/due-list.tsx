import { Link } from 'react-router-dom';
import { formatDate } from '../../../../shared/dates.ts';
import type { DueView } from '../../../../shared/schemas/business.ts';
import { QueryBoundary } from '../../../components/ui/query-boundary.tsx';
import { NeedMarkBadge, ShipMarkBadge } from '../../../components/ui/ship-mark-badge.tsx';
import { SimpleTable } from '../../../components/ui/simple-table.tsx';
import { paths } from '../../../config/paths.ts';
import { useDue } from '../api/get-due.ts';

const COLUMNS = ['Ship by', 'Mark', 'Order', 'Item', 'State'];

/** Open lines by ship-by date, most urgent first, with their marks. */
export function DueList() {
  const due = useDue();
  return (
    <QueryBoundary query={due} loading="Loading what is due…">
      {(data) => <DueBody due={data} />}
    </QueryBoundary>
  );
}

function DueBody({ due: { lines, today } }: { due: DueView }) {
  const late = lines.filter((l) => l.mark === 'late').length;
  const dueToday = lines.filter((l) => l.mark === 'due_today').length;
  const atRisk = lines.filter((l) => l.mark === 'at_risk').length;
  return (
    <section aria-labelledby="due-title" className="flex flex-col gap-3">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="due-title" className="text-xl font-extrabold">
          What is due
        </h2>
        <p className="text-ink-soft">
          Today is {today}: {late} late, {dueToday} due today, {atRisk} at risk.
        </p>
      </div>
      <SimpleTable columns={COLUMNS} minWidthClass="min-w-[34rem]" empty={lines.length === 0 ? 'Nothing open. Well done.' : null}>
        {lines.map((l) => (
          <tr key={l.lineId} className="border-t border-line">
            <td className="px-3 py-2 font-semibold tabular-nums">{l.shipBy ? formatDate(l.shipBy) : '—'}</td>
            <td className="px-3 py-2">
              <span className="flex flex-wrap gap-1">
                <ShipMarkBadge mark={l.mark} />
                <NeedMarkBadge mark={l.needMark} neededBy={l.neededBy} />
              </span>
            </td>
            <td className="px-3 py-2">
              <Link className="font-bold underline decoration-thread decoration-2 underline-offset-4" to={paths.workroomOrder.getHref(l.orderId)}>
                {l.orderNumber}
              </Link>
            </td>
            <td className="px-3 py-2">
              {l.quantity} × {l.listingTitle}
            </td>
            <td className="px-3 py-2">{l.state.replace(/_/g, ' ')}</td>
          </tr>
        ))}
      </SimpleTable>
    </section>
  );
}
