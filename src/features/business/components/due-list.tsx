import { Link } from 'react-router-dom';
import { Spinner } from '../../../components/ui/button.tsx';
import { ShipMarkBadge } from '../../../components/ui/ship-mark-badge.tsx';
import { paths } from '../../../config/paths.ts';
import { useDue } from '../api/get-due.ts';

/** Open lines by ship-by date, most urgent first, with their marks. */
export function DueList() {
  const due = useDue();
  if (due.isPending) return <Spinner label="Loading what is due…" />;
  if (due.isError)
    return (
      <p role="alert" className="font-semibold text-danger">
        {due.error.message}
      </p>
    );
  const { lines, today } = due.data;
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
      <div className="overflow-x-auto rounded-lg border border-line bg-white">
        <table className="w-full min-w-[34rem] text-left">
          <thead className="bg-paper-deep text-sm">
            <tr>
              <th scope="col" className="px-3 py-2">
                Ship by
              </th>
              <th scope="col" className="px-3 py-2">
                Mark
              </th>
              <th scope="col" className="px-3 py-2">
                Order
              </th>
              <th scope="col" className="px-3 py-2">
                Item
              </th>
              <th scope="col" className="px-3 py-2">
                State
              </th>
            </tr>
          </thead>
          <tbody>
            {lines.map((l) => (
              <tr key={l.lineId} className="border-t border-line">
                <td className="px-3 py-2 font-semibold tabular-nums">{l.shipBy ?? '—'}</td>
                <td className="px-3 py-2">
                  <ShipMarkBadge mark={l.mark} />
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
            {lines.length === 0 ? (
              <tr>
                <td colSpan={5} className="px-3 py-4 text-ink-soft">
                  Nothing open. Well done.
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
    </section>
  );
}
