import { Fragment } from 'react';
import { formatMoney } from '../../../../shared/money.ts';
import type { CostsView } from '../../../../shared/schemas/business.ts';
import { QueryBoundary } from '../../../components/ui/query-boundary.tsx';
import { SimpleTable } from '../../../components/ui/simple-table.tsx';
import { useCosts } from '../api/get-costs.ts';

const COLS = [
  ['revenueMinor', 'Price'],
  ['shippingMinor', 'Shipping'],
  ['blankMinor', 'Blank'],
  ['vinylMinor', 'Vinyl'],
  ['labourMinor', 'Labour'],
  ['platformFeeMinor', 'Platform fee'],
  ['paymentFeeMinor', 'Payment fee'],
  ['marginMinor', 'Margin'],
] as const;
const COLUMNS = ['Order / item', ...COLS.map(([, header]) => ({ header, num: true }))];

/** Cost of goods and margin per line and per order. */
export function CostsTable() {
  const costs = useCosts();
  return (
    <QueryBoundary query={costs} loading="Working out costs…">
      {(data) => <CostsBody costs={data} />}
    </QueryBoundary>
  );
}

function CostsBody({ costs: { currency, orders, totals } }: { costs: CostsView }) {
  const money = (m: number) => formatMoney(m, currency);
  return (
    <section aria-labelledby="costs-title" className="flex flex-col gap-3">
      <h2 id="costs-title" className="text-xl font-extrabold">
        Cost of goods and margin
      </h2>
      <p className="text-ink-soft">
        Vinyl is each line’s share of its cut sheets by piece area once cut (marked “cut”), an estimate from the design before. Fees and shipping are split across an order’s lines so every column adds
        up.
      </p>
      <SimpleTable columns={COLUMNS} minWidthClass="min-w-[56rem]" className="text-sm">
        {[...orders].reverse().map((o) => (
          <Fragment key={o.orderId}>
            {o.lines.map((l) => (
              <tr key={l.lineId} className="border-t border-line/60">
                <th scope="row" className="px-3 py-1.5 font-normal">
                  {l.quantity} × {l.listingTitle} <span className="text-ink-soft">({l.vinylSource === 'cut' ? 'cut' : 'estimate'})</span>
                </th>
                {COLS.map(([k]) => (
                  <td key={k} className={`px-3 py-1.5 text-right tabular-nums ${k === 'marginMinor' && l[k] < 0 ? 'font-bold text-danger' : ''}`}>
                    {money(l[k])}
                  </td>
                ))}
              </tr>
            ))}
            <tr className="border-t border-line bg-paper">
              <th scope="row" className="px-3 py-1.5 font-bold">
                Order {o.orderNumber}
              </th>
              {COLS.map(([k]) => (
                <td key={k} className={`px-3 py-1.5 text-right font-bold tabular-nums ${k === 'marginMinor' && o.totals[k] < 0 ? 'text-danger' : ''}`}>
                  {money(o.totals[k])}
                </td>
              ))}
            </tr>
          </Fragment>
        ))}
        <tr className="border-t-2 border-ink">
          <th scope="row" className="px-3 py-2 font-extrabold">
            All orders
          </th>
          {COLS.map(([k]) => (
            <td key={k} className="px-3 py-2 text-right font-extrabold tabular-nums">
              {money(totals[k])}
            </td>
          ))}
        </tr>
      </SimpleTable>
    </section>
  );
}
