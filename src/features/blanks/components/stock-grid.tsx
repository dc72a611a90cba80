/**
 * Stock per size × colour of one blank type: what is free to sell (holds for open payment pages
 * already taken out), when to warn, a low-stock mark for the seller and "sold out" where none is left.
 */
import { useState } from 'react';
import { blankStockInputSchema, isLowStock, type SellerBlankType, stockKey } from '../../../../shared/schemas/blanks.ts';
import { Button } from '../../../components/ui/button.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { useSetBlankStock } from '../api/blanks.ts';

export function StockGrid({ type }: { type: SellerBlankType }) {
  const toast = useToast();
  const save = useSetBlankStock();
  const [counts, setCounts] = useState(() => new Map(type.stock.map((r) => [stockKey(r.sizeId, r.colourId), String(r.quantity)])));
  const [error, setError] = useState<string | null>(null);
  const row = (sizeId: string, colourId: string) => type.stock.find((r) => r.sizeId === sizeId && r.colourId === colourId)!;

  const submit = () => {
    const parsed = blankStockInputSchema.safeParse({
      rows: type.stock.map((r) => ({ sizeId: r.sizeId, colourId: r.colourId, quantity: Number(counts.get(stockKey(r.sizeId, r.colourId)) ?? r.quantity), lowStock: r.lowStock })),
    });
    if (!parsed.success) {
      setError('Enter whole numbers from 0 for every count.');
      return;
    }
    setError(null);
    save.mutate({ id: type.id, input: parsed.data }, { onSuccess: () => toast.success(`Stock of ${type.name.toLowerCase()} saved.`), onError: (e) => toast.error(e.message) });
  };

  return (
    <div className="flex flex-col gap-3">
      <div className="overflow-x-auto">
        <table className="border-collapse text-sm">
          <caption className="sr-only">Stock of {type.name} per size and colour</caption>
          <thead>
            <tr>
              <th scope="col" className="px-2 py-1 text-left">
                Size
              </th>
              {type.colours.map((c) => (
                <th key={c.id} scope="col" className="px-2 py-1 text-left">
                  <span aria-hidden="true" className="mr-1 inline-block size-3 rounded-full border border-ink/40 align-middle" style={{ background: c.hex }} />
                  {c.name}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {type.sizes.map((s) => (
              <tr key={s.id} className="border-t border-line">
                <th scope="row" className="px-2 py-1 text-left">
                  {s.label}
                </th>
                {type.colours.map((c) => {
                  const r = row(s.id, c.id);
                  const k = stockKey(s.id, c.id);
                  return (
                    <td key={c.id} className="px-2 py-1 align-top">
                      <input
                        type="number"
                        min={0}
                        inputMode="numeric"
                        aria-label={`${s.label} in ${c.name}`}
                        value={counts.get(k) ?? ''}
                        onChange={(e) => setCounts((m) => new Map(m).set(k, e.target.value))}
                        className="min-h-10 w-20 rounded-lg border-2 border-field bg-white px-2"
                      />
                      {r.quantity === 0 ? (
                        <span className="block font-semibold text-danger">sold out</span>
                      ) : isLowStock(r) ? (
                        <span className="block font-semibold text-ink">low: {r.quantity} left</span>
                      ) : null}
                      {r.held > 0 ? <span className="block text-ink-soft">{r.held} held at checkout</span> : null}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {error ? (
        <p role="alert" className="font-semibold text-danger">
          {error}
        </p>
      ) : null}
      <Button className="self-start" pending={save.isPending} pendingLabel="Saving…" onClick={submit}>
        Save stock
      </Button>
    </div>
  );
}
