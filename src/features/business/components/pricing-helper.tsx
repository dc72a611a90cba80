import { useEffect, useMemo, useState } from 'react';
import { formatMoney } from '../../../../shared/money.ts';
import { type PriceCheckInput, type PriceCheckResult, priceCheckSchema } from '../../../../shared/schemas/business.ts';
import { Spinner } from '../../../components/ui/button.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { usePriceCheck } from '../api/price-check.ts';

type Props = {
  /** the listing editor's current (watched) values; only the parts that cost are sent */
  values: unknown;
  currency: string;
};

const ROWS: Array<{ key: keyof PriceCheckResult['sample']; label: string; minus?: boolean }> = [
  { key: 'priceMinor', label: 'Price' },
  { key: 'blankMinor', label: 'Blank', minus: true },
  { key: 'vinylMinor', label: 'Vinyl (estimate)', minus: true },
  { key: 'labourMinor', label: 'Labour', minus: true },
  { key: 'platformFeeMinor', label: 'Platform fee', minus: true },
  { key: 'paymentFeeMinor', label: 'Payment fee', minus: true },
];

function useDebounced<T>(value: T, ms: number): T {
  const [v, setV] = useState(value);
  useEffect(() => {
    const t = window.setTimeout(() => setV(value), ms);
    return () => window.clearTimeout(t);
  }, [value, ms]);
  return v;
}

/**
 * Pricing helper for the listing editor: the expected cost of one item for a sample name, and the
 * margin at the price entered; warns when the longest name the listing allows would sell at a loss.
 */
export function PricingHelper({ values, currency }: Props) {
  const [sampleName, setSampleName] = useState('Mira');
  const input = useMemo<PriceCheckInput | null>(() => {
    const parsed = priceCheckSchema.shape.draft.safeParse(values);
    return parsed.success ? { draft: parsed.data as PriceCheckInput['draft'], sampleName } : null;
  }, [values, sampleName]);
  const debounced = useDebounced(input, 500);
  const check = usePriceCheck(debounced);
  const money = (m: number) => formatMoney(m, currency);
  const r = check.data;

  return (
    <section aria-labelledby="pricing-helper-title" className="flex flex-col gap-4 rounded-lg border border-line bg-paper p-4">
      <div>
        <h3 id="pricing-helper-title" className="text-lg font-extrabold text-ink">
          Pricing helper
        </h3>
        <p className="text-sm text-ink-soft">Expected cost of one item from the engine’s geometry, your material prices, blank cost, labour at your hourly rate and the fees.</p>
      </div>
      <TextField label="Sample name" hint="Try the names your shoppers type." value={sampleName} maxLength={40} onChange={(e) => setSampleName(e.target.value)} className="max-w-xs" />
      {!input ? <p className="text-ink-soft">Fill in the price and at least one personalisation field to see the margin.</p> : null}
      {input && check.isPending ? <Spinner label="Working out the cost…" /> : null}
      {check.isError ? (
        <p role="alert" className="font-semibold text-danger">
          {check.error.message}
        </p>
      ) : null}
      {r && input ? (
        <>
          <div className="overflow-x-auto">
            <table className="w-full min-w-[20rem] text-left">
              <caption className="sr-only">Cost and margin of one item</caption>
              <thead>
                <tr className="border-b border-line text-sm text-ink-soft">
                  <th scope="col" className="py-1.5 pr-3">
                    Per item
                  </th>
                  <th scope="col" className="py-1.5 pr-3 text-right">
                    “{r.sample.name}”
                  </th>
                  {r.longest ? (
                    <th scope="col" className="py-1.5 text-right">
                      Longest: “{r.longest.name}”
                    </th>
                  ) : null}
                </tr>
              </thead>
              <tbody>
                {ROWS.map((row) => (
                  <tr key={row.key} className="border-b border-line/60">
                    <th scope="row" className="py-1.5 pr-3 font-semibold">
                      {row.label}
                    </th>
                    <td className="py-1.5 pr-3 text-right tabular-nums">
                      {row.minus ? '−' : ''}
                      {money(r.sample[row.key] as number)}
                    </td>
                    {r.longest ? (
                      <td className="py-1.5 text-right tabular-nums">
                        {row.minus ? '−' : ''}
                        {money(r.longest[row.key] as number)}
                      </td>
                    ) : null}
                  </tr>
                ))}
                <tr className="font-extrabold">
                  <th scope="row" className="py-1.5 pr-3">
                    Margin
                  </th>
                  <td className={`py-1.5 pr-3 text-right tabular-nums ${r.sample.marginMinor < 0 ? 'text-danger' : 'text-thread-deep'}`}>{money(r.sample.marginMinor)}</td>
                  {r.longest ? <td className={`py-1.5 text-right tabular-nums ${r.longest.marginMinor < 0 ? 'text-danger' : 'text-thread-deep'}`}>{money(r.longest.marginMinor)}</td> : null}
                </tr>
              </tbody>
            </table>
          </div>
          {r.warnings.length ? (
            <ul role="status" className="flex flex-col gap-1.5 rounded-lg border border-danger bg-danger-wash p-3 text-sm font-semibold text-danger">
              {r.warnings.map((w) => (
                <li key={w}>{w}</li>
              ))}
            </ul>
          ) : (
            <p role="status" className="text-sm font-semibold text-thread-deep">
              No loss at this price, even for the longest name.
            </p>
          )}
        </>
      ) : null}
    </section>
  );
}
