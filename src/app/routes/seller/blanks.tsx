import { useState } from 'react';
import { BLANK_PRESETS, type BlankTypeInput, presetInput, type SellerBlankType } from '../../../../shared/schemas/blanks.ts';
import { Button, Spinner } from '../../../components/ui/button.tsx';
import { PageHeading } from '../../../components/ui/card.tsx';
import { useBlankTypes } from '../../../features/blanks/api/blanks.ts';
import { BlankTypeForm } from '../../../features/blanks/components/blank-type-form.tsx';
import { StockGrid } from '../../../features/blanks/components/stock-grid.tsx';
import { useOwnShop } from '../../../features/shop-settings/api/get-own-shop.ts';
import { PhotoPicker } from '../../../features/uploads/components/photo-picker.tsx';

/** /workroom/blanks: the shop's blank types (sizes, colours) and their stock per size × colour. */
export function BlanksPage() {
  const types = useBlankTypes();
  const shop = useOwnShop();
  const [editing, setEditing] = useState<{ type?: SellerBlankType; start: BlankTypeInput } | null>(null);
  const currency = shop.data?.currency ?? 'USD';
  const taken = new Set((types.data ?? []).map((t) => t.name.toLowerCase()));

  return (
    <div>
      <PageHeading eyebrow="Workroom" title="Blanks" lead="The items you press onto: the sizes and colours shoppers choose from, and how many of each you have." />
      {editing ? (
        <div className="mb-8 max-w-4xl">
          <h2 className="mb-4 text-2xl font-extrabold">{editing.type ? `Edit ${editing.type.name}` : 'Add a blank type'}</h2>
          <BlankTypeForm key={editing.type?.id ?? editing.start.name} type={editing.type} start={editing.start} currency={currency} PhotoPicker={PhotoPicker} onDone={() => setEditing(null)} />
        </div>
      ) : (
        <div className="mb-6 flex flex-wrap gap-3">
          {BLANK_PRESETS.filter((p) => !taken.has(p.name.toLowerCase())).map((p) => (
            <Button key={p.name} variant="secondary" onClick={() => setEditing({ start: presetInput(p.shape, p.name) })}>
              Add {p.name.toLowerCase()}
            </Button>
          ))}
          <Button variant="secondary" onClick={() => setEditing({ start: presetInput('tote', '') })}>
            Add another kind
          </Button>
        </div>
      )}
      {types.isPending ? <Spinner label="Loading blanks…" /> : null}
      {types.isError ? (
        <p role="alert" className="font-semibold text-danger">
          {types.error.message}
        </p>
      ) : null}
      {types.data?.length === 0 ? <p className="text-ink-soft">No blank types yet. Add one, then offer its sizes and colours on a listing.</p> : null}
      <div className="flex flex-col gap-6">
        {types.data?.map((t) => (
          <section key={t.id} aria-labelledby={`blank-${t.id}`} className="flex flex-col gap-3 rounded-lg border border-line bg-white p-5">
            <div className="flex flex-wrap items-baseline justify-between gap-3">
              <h2 id={`blank-${t.id}`} className="text-xl font-extrabold">
                {t.name}
              </h2>
              <Button variant="quiet" onClick={() => setEditing({ type: t, start: presetInput(t.shape, t.name) })}>
                Edit sizes and colours
              </Button>
            </div>
            <p className="text-sm text-ink-soft">
              {t.sizes.length} {t.sizes.length === 1 ? 'size' : 'sizes'} · {t.colours.length} {t.colours.length === 1 ? 'colour' : 'colours'}
            </p>
            <StockGrid key={`${t.id}-${t.updatedAt}-${t.stock.map((r) => r.quantity).join(',')}`} type={t} />
          </section>
        ))}
      </div>
    </div>
  );
}

export default BlanksPage;
