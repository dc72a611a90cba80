import { useState } from 'react';
import { materialLabel } from '../../../../shared/material-label.ts';
import { formatMoney } from '../../../../shared/money.ts';
import type { StockMaterial, StockView } from '../../../../shared/schemas/workroom.ts';
import { lowStockSchema } from '../../../../shared/schemas/workroom.ts';
import { formatSmallLength } from '../../../../shared/units.ts';
import { Button } from '../../../components/ui/button.tsx';
import { SimpleTable } from '../../../components/ui/simple-table.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { isApiError } from '../../../lib/api-client.ts';
import { useUpdateLowStock } from '../api/update-low-stock.ts';
import { formatDateTime, formatLength } from './format.ts';

function LowStockEditor({ m }: { m: StockMaterial }) {
  const toast = useToast();
  const update = useUpdateLowStock();
  const [value, setValue] = useState(String(m.lowStockMm / 10));
  const [error, setError] = useState<string | null>(null);
  const save = async () => {
    const parsed = lowStockSchema.safeParse({ lowStockMm: Number(value) * 10 });
    if (!parsed.success || value.trim() === '') return setError(parsed.success ? 'Enter a length in cm.' : (parsed.error.issues[0]?.message ?? 'Enter a length in cm.'));
    setError(null);
    try {
      await update.mutateAsync({ materialId: m.id, ...parsed.data });
      toast.success(`Low-stock mark for ${m.colourName} saved.`);
    } catch (e) {
      toast.error(isApiError(e) ? e.message : 'That did not work.');
    }
  };
  const id = `low-${m.id}`;
  return (
    <div className="flex flex-wrap items-start gap-2">
      <div className="flex flex-col">
        <label htmlFor={id} className="sr-only">
          Low-stock mark for {m.colourName}, cm
        </label>
        <div className="flex items-center gap-1">
          <input
            id={id}
            inputMode="decimal"
            className={`min-h-11 w-24 rounded-lg border-2 bg-white px-2 ${error ? 'border-danger' : 'border-field'}`}
            value={value}
            onChange={(e) => setValue(e.target.value)}
            aria-invalid={error ? true : undefined}
            aria-describedby={error ? `${id}-e` : undefined}
          />
          <span className="text-sm">cm</span>
        </div>
        {error ? (
          <span id={`${id}-e`} className="text-sm font-semibold text-danger">
            {error}
          </span>
        ) : null}
      </div>
      <Button variant="quiet" onClick={save} pending={update.isPending} className="min-h-11 px-2">
        Save
      </Button>
    </div>
  );
}

const MATERIAL_COLUMNS = ['Material', 'Roll width', 'Remaining', 'Planned on uncut sheets', 'Low-stock mark'];
const SHEET_COLUMNS = ['Material', 'State', 'Length', 'Taken from stock', 'Cost', 'Lines', 'When'];

/** Every roll in use, and one page of what the cut sheets used (`sheetsPager` goes under it). */
export function StockTable({ stock, sheetsPager }: { stock: StockView; sheetsPager?: React.ReactNode }) {
  const byId = new Map(stock.materials.map((m) => [m.id, m]));
  return (
    <div className="flex flex-col gap-8">
      <section aria-labelledby="stock-mat">
        <h2 id="stock-mat" className="mb-3 text-xl font-extrabold">
          Remaining per material
        </h2>
        <SimpleTable columns={MATERIAL_COLUMNS} minWidthClass="min-w-[720px]">
          {stock.materials.map((m) => (
            <tr key={m.id} className="border-t border-line align-top" data-testid="stock-row">
              <th scope="row" className="px-3 py-2.5 font-bold">
                <span className="inline-flex items-center gap-2">
                  <span aria-hidden="true" className="size-4 rounded-full border border-ink/30" style={{ background: m.colourHex }} />
                  {m.colourName} <span className="font-normal text-ink-soft">({m.kind})</span>
                </span>
              </th>
              <td className="px-3 py-2.5">{formatLength(m.rollWidthMm)}</td>
              <td className="px-3 py-2.5">
                <span className="font-semibold">{formatLength(m.stockMm)}</span>
                {m.low ? <span className="ml-2 rounded-full bg-danger-wash px-2 py-0.5 text-sm font-bold text-danger">low</span> : null}
              </td>
              <td className="px-3 py-2.5">{m.plannedMm ? formatLength(m.plannedMm) : '—'}</td>
              <td className="px-3 py-2.5">
                <LowStockEditor m={m} />
              </td>
            </tr>
          ))}
        </SimpleTable>
      </section>
      <section aria-labelledby="stock-use">
        <h2 id="stock-use" className="mb-1 text-xl font-extrabold">
          What each cut sheet used
        </h2>
        <p className="mb-3 text-sm text-ink-soft">A cut sheet takes its nested length plus {formatSmallLength(stock.trimMm)} trim from the roll.</p>
        {stock.sheets.total === 0 ? (
          <p className="text-ink-soft">No cut sheets yet.</p>
        ) : (
          <SimpleTable columns={SHEET_COLUMNS} minWidthClass="min-w-[640px]">
            {stock.sheets.items.map((s) => {
              const m = byId.get(s.materialId);
              return (
                <tr key={s.id} className="border-t border-line">
                  <td className="px-3 py-2">{m ? materialLabel(m) : '—'}</td>
                  <td className="px-3 py-2">{s.state}</td>
                  <td className="px-3 py-2">{formatLength(s.lengthMm)}</td>
                  <td className="px-3 py-2">{s.consumedMm !== null ? formatLength(s.consumedMm) : 'not cut yet'}</td>
                  <td className="px-3 py-2">{s.costMinor !== null ? formatMoney(s.costMinor, stock.currency) : '—'}</td>
                  <td className="px-3 py-2">{s.lineCount}</td>
                  <td className="px-3 py-2">{formatDateTime(s.cutAt ?? s.createdAt)}</td>
                </tr>
              );
            })}
          </SimpleTable>
        )}
        {sheetsPager}
      </section>
    </div>
  );
}
