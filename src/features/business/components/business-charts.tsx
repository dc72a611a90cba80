import { type ReactNode, useState } from 'react';
import { Bar, BarChart, CartesianGrid, ComposedChart, Legend, Line, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { formatMoney, minorDigits } from '../../../../shared/money.ts';
import type { ChartsView } from '../../../../shared/schemas/business.ts';
import { formatLength } from '../../../../shared/units.ts';
import { QueryBoundary } from '../../../components/ui/query-boundary.tsx';
import { SimpleTable } from '../../../components/ui/simple-table.tsx';
import { useCharts } from '../api/get-charts.ts';

const INK = '#1f2a44';
const THREAD = '#2f7d6d';
const MARIGOLD = '#e0a526';
const PALETTE = [THREAD, MARIGOLD, INK, '#8a5a9e', '#b5523b', '#4f7fb8'];

const TICK = { fill: INK, fontSize: 12 };

/**
 * A chart over time periods (weeks, months) along the bottom: the grid, both axes, the tooltip
 * (`format` writes a value) and the legend; `children` are the series (bars, lines).
 */
function PeriodChart({ data, period, unit, format, children }: { data: object[]; period: string; unit?: string; format: (value: number) => string; children: ReactNode }) {
  return (
    <ResponsiveContainer width="100%" height="100%">
      <ComposedChart data={data} margin={{ top: 8, right: 8, left: 0, bottom: 0 }}>
        <CartesianGrid stroke="#e4dccd" vertical={false} />
        <XAxis dataKey={period} tick={TICK} />
        <YAxis tick={TICK} width={48} unit={unit} />
        <Tooltip formatter={(v) => format(Number(v))} />
        <Legend />
        {children}
      </ComposedChart>
    </ResponsiveContainer>
  );
}

/** A table of a chart's numbers: each row has a key of its own and one cell per column of `head`. */
type TableSpec = { caption: string; head: string[]; rows: Array<{ key: string; cells: Array<string | number> }> };

/**
 * A chart panel with a switch between the chart and the same numbers as a table; with no rows in
 * the table, the `empty` words instead of either.
 */
function ChartPanel({ id, title, lead, chart, table: spec, empty: emptyWords }: { id: string; title: string; lead: string; chart: ReactNode; table: TableSpec; empty: string }) {
  const [asTable, setAsTable] = useState(false);
  const empty = spec.rows.length === 0 ? emptyWords : undefined;
  const table = <Table {...spec} />;
  return (
    <section aria-labelledby={`${id}-title`} className="flex flex-col gap-3 rounded-lg border border-line bg-white p-4 sm:p-6">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div>
          <h2 id={`${id}-title`} className="text-xl font-extrabold">
            {title}
          </h2>
          <p className="text-sm text-ink-soft">{lead}</p>
        </div>
        {empty ? null : (
          <button
            type="button"
            aria-pressed={asTable}
            className="min-h-11 rounded-lg border-2 border-thread px-3 font-bold text-thread-deep hover:bg-thread-wash"
            onClick={() => setAsTable((v) => !v)}
          >
            {asTable ? 'Show chart' : 'Show table'}
          </button>
        )}
      </div>
      {/* the chart is a picture of the table: screen readers get the table either way */}
      {empty ? (
        <p className="rounded-lg bg-paper-deep p-4 text-ink-soft">{empty}</p>
      ) : asTable ? (
        table
      ) : (
        <>
          <div aria-hidden="true" className="h-64 w-full">
            {chart}
          </div>
          <div className="sr-only">{table}</div>
        </>
      )}
    </section>
  );
}

/** The chart's numbers as a table: the first column names each row, the others are amounts. */
function Table({ caption, head, rows }: TableSpec) {
  return (
    <SimpleTable caption={caption} columns={head.map((h, i) => ({ header: h, num: i > 0 }))} minWidthClass="min-w-[22rem]" framed={false} empty={rows.length === 0 ? 'Nothing yet.' : null}>
      {rows.map(({ key, cells }) => (
        <tr key={key} className="border-t border-line">
          {cells.map((v, i) =>
            i === 0 ? (
              <th key={head[i]} scope="row" className="px-3 py-2 font-semibold">
                {v}
              </th>
            ) : (
              <td key={head[i]} className="px-3 py-2 text-right tabular-nums">
                {v}
              </td>
            ),
          )}
        </tr>
      ))}
    </SimpleTable>
  );
}

export function BusinessCharts() {
  const charts = useCharts();
  return (
    <QueryBoundary query={charts} loading="Loading charts…">
      {(data) => <ChartsBody data={data} />}
    </QueryBoundary>
  );
}

function ChartsBody({ data }: { data: ChartsView }) {
  const { currency } = data;
  const major = (m: number) => m / 10 ** minorDigits(currency);
  const money = (m: number) => formatMoney(m, currency);
  const weeks = data.weeks.map((w) => ({ week: w.week, sales: major(w.salesMinor), margin: major(w.marginMinor) }));
  const materials = [...new Map(data.vinyl.map((v) => [v.materialId, v.material])).entries()];
  const months = [...new Set(data.vinyl.map((v) => v.month))].map((month) => ({
    month,
    ...Object.fromEntries(materials.map(([id]) => [id, (data.vinyl.find((v) => v.month === month && v.materialId === id)?.usedMm ?? 0) / 10])),
  }));
  return (
    <div className="grid grid-cols-1 gap-6 xl:grid-cols-2">
      <ChartPanel
        id="sales-week"
        empty="No sales yet."
        title="Sales and margin by week"
        lead="Weeks start on Monday. Sales include shipping; margin is after every cost and fee."
        chart={
          <PeriodChart data={weeks} period="week" format={(v) => formatMoney(Math.round(v * 10 ** minorDigits(currency)), currency)}>
            <Bar dataKey="sales" name="Sales" fill={THREAD} radius={[4, 4, 0, 0]} isAnimationActive={false} />
            <Line dataKey="margin" name="Margin" stroke={MARIGOLD} strokeWidth={3} dot={{ r: 4 }} isAnimationActive={false} />
          </PeriodChart>
        }
        table={{
          caption: 'Sales and margin by week',
          head: ['Week of', 'Items', 'Sales', 'Margin'],
          rows: data.weeks.map((w) => ({ key: w.week, cells: [w.week, w.items, money(w.salesMinor), money(w.marginMinor)] })),
        }}
      />
      <ChartPanel
        id="vinyl-month"
        empty="No cut sheets marked cut yet. Vinyl shows here once you cut."
        title="Vinyl used per material, by month"
        lead="Length of roll taken by cut sheets, trim included, in cm."
        chart={
          <PeriodChart data={months} period="month" unit=" cm" format={(v) => formatLength(v * 10)}>
            {materials.map(([id, label], i) => (
              <Bar key={id} dataKey={id} name={label} stackId="v" fill={PALETTE[i % PALETTE.length]} isAnimationActive={false} />
            ))}
          </PeriodChart>
        }
        table={{
          caption: 'Vinyl used per material per month',
          head: ['Month', 'Material', 'Used'],
          rows: data.vinyl.map((v) => ({ key: `${v.month}:${v.materialId}`, cells: [v.month, v.material, formatLength(v.usedMm)] })),
        }}
      />
      <ChartPanel
        id="by-listing"
        empty="No orders yet."
        title="Orders by listing"
        lead="How many orders included each listing."
        chart={
          <ResponsiveContainer width="100%" height="100%">
            <BarChart data={data.listings} layout="vertical" margin={{ top: 8, right: 16, left: 8, bottom: 0 }}>
              <CartesianGrid stroke="#e4dccd" horizontal={false} />
              <XAxis type="number" allowDecimals={false} tick={TICK} />
              <YAxis type="category" dataKey="title" width={140} tick={TICK} />
              <Tooltip />
              <Bar dataKey="orders" name="Orders" fill={THREAD} radius={[0, 4, 4, 0]} isAnimationActive={false} />
            </BarChart>
          </ResponsiveContainer>
        }
        table={{
          caption: 'Orders by listing',
          head: ['Listing', 'Orders', 'Items', 'Sales'],
          rows: data.listings.map((l) => ({ key: l.listingId, cells: [l.title, l.orders, l.items, money(l.salesMinor)] })),
        }}
      />
    </div>
  );
}
