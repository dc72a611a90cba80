import { Link } from 'react-router-dom';
import { formatDate } from '../../../../shared/dates.ts';
import { formatMoney } from '../../../../shared/money.ts';
import type { OrderSummary } from '../../../../shared/schemas/order.ts';
import { LineStateBadge } from '../../../components/ui/line-state-badge.tsx';
import { paths } from '../../../config/paths.ts';

export function OrderList({ orders }: { orders: OrderSummary[] }) {
  return (
    <ul className="flex flex-col gap-3">
      {orders.map((o) => (
        <li key={o.id}>
          <Link
            to={paths.orderDetail.getHref(o.id)}
            className="flex flex-col gap-2 rounded-lg border border-line bg-white p-4 shadow-sm hover:border-thread sm:flex-row sm:items-center sm:justify-between"
          >
            <span className="flex flex-col">
              <span className="text-lg font-extrabold">{o.number}</span>
              <span className="text-ink-soft">
                {o.shop.name} · {o.itemCount} {o.itemCount === 1 ? 'item' : 'items'} · paid {formatDate(o.paidAt)}
              </span>
            </span>
            <span className="flex flex-wrap items-center gap-2">
              {[...new Set(o.states)].map((s) => (
                <LineStateBadge key={s} state={s} />
              ))}
              <span className="font-bold">{formatMoney(o.totalMinor, o.currency)}</span>
            </span>
          </Link>
        </li>
      ))}
    </ul>
  );
}
