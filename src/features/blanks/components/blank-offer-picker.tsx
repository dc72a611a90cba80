/**
 * The listing editor's choice of blank type and the sizes and colours this listing offers, with
 * every vinyl × blank colour pairing that will hardly show (WCAG 2.2 contrast below 3:1) listed so
 * the seller can mark the ones meant that way (tone on tone).
 */
import { contrastWarnings } from '../../../../shared/engine/contrast.ts';
import type { ListingBlankOffer } from '../../../../shared/schemas/blanks.ts';
import { FieldError, SelectField } from '../../../components/ui/form-controls.tsx';
import { useBlankTypes } from '../api/blanks.ts';

export type BlankOfferPickerProps = {
  value: ListingBlankOffer | null | undefined;
  onChange: (offer: ListingBlankOffer | null) => void;
  /** the vinyl colours the listing's personalisation offers */
  vinyls: Array<{ id: string; colourName: string; colourHex: string }>;
  error?: string;
};

const box = 'flex min-h-11 items-center gap-2';

export function BlankOfferPicker({ value, onChange, vinyls, error }: BlankOfferPickerProps) {
  const types = useBlankTypes();
  const type = types.data?.find((t) => t.id === value?.blankTypeId);
  const toggle = (list: string[], id: string) => (list.includes(id) ? list.filter((x) => x !== id) : [...list, id]);
  const pairs =
    type && value ? type.colours.filter((c) => value.colourIds.includes(c.id)).flatMap((c) => contrastWarnings(vinyls, { id: c.id, name: c.name, hex: c.hex, noun: type.name.toLowerCase() })) : [];

  return (
    <div className="flex flex-col gap-4">
      <SelectField
        label="Sizes and colours from"
        hint={types.data?.length === 0 ? 'Add a blank type under Blanks first.' : 'Offer some or all of a blank type’s sizes and colours; shoppers pick one of each.'}
        value={value?.blankTypeId ?? ''}
        onChange={(e) => {
          const t = types.data?.find((x) => x.id === e.target.value);
          onChange(t ? { blankTypeId: t.id, sizeIds: t.sizes.map((s) => s.id), colourIds: t.colours.map((c) => c.id), defaultColourId: t.colours[0]?.id ?? null, intendedPairs: [] } : null);
        }}
      >
        <option value="">No sizes or colours (one plain blank)</option>
        {types.data?.map((t) => (
          <option key={t.id} value={t.id}>
            {t.name}
          </option>
        ))}
      </SelectField>
      {type && value ? (
        <>
          <fieldset className="flex flex-col gap-1">
            <legend className="font-bold">Sizes offered</legend>
            <div className="flex flex-wrap gap-x-5">
              {type.sizes.map((s) => (
                <label key={s.id} className={box}>
                  <input type="checkbox" className="size-5 accent-thread" checked={value.sizeIds.includes(s.id)} onChange={() => onChange({ ...value, sizeIds: toggle(value.sizeIds, s.id) })} />{' '}
                  {s.label}
                </label>
              ))}
            </div>
          </fieldset>
          <fieldset className="flex flex-col gap-1">
            <legend className="font-bold">Colours offered</legend>
            <div className="flex flex-wrap gap-x-5">
              {type.colours.map((c) => (
                <label key={c.id} className={box}>
                  <input
                    type="checkbox"
                    className="size-5 accent-thread"
                    checked={value.colourIds.includes(c.id)}
                    onChange={() => {
                      const colourIds = toggle(value.colourIds, c.id);
                      onChange({ ...value, colourIds, defaultColourId: value.defaultColourId && colourIds.includes(value.defaultColourId) ? value.defaultColourId : (colourIds[0] ?? null) });
                    }}
                  />
                  <span aria-hidden="true" className="size-4 rounded-full border border-ink/40" style={{ background: c.hex }} /> {c.name}
                </label>
              ))}
            </div>
          </fieldset>
          <SelectField label="Shown first in" value={value.defaultColourId ?? ''} onChange={(e) => onChange({ ...value, defaultColourId: e.target.value || null })}>
            {type.colours
              .filter((c) => value.colourIds.includes(c.id))
              .map((c) => (
                <option key={c.id} value={c.id}>
                  {c.name}
                </option>
              ))}
          </SelectField>
          {pairs.length > 0 ? (
            <fieldset className="flex flex-col gap-1">
              <legend className="font-bold">Colours that will hardly show</legend>
              <p className="text-sm text-ink-soft">Shoppers are warned about these unless you mark them as meant (tone on tone).</p>
              {pairs.map((p) => {
                const intended = value.intendedPairs.some((x) => x.materialId === p.materialId && x.colourId === p.colourId);
                return (
                  <label key={`${p.materialId}:${p.colourId}`} className={box}>
                    <input
                      type="checkbox"
                      className="size-5 accent-thread"
                      checked={intended}
                      onChange={() =>
                        onChange({
                          ...value,
                          intendedPairs: intended
                            ? value.intendedPairs.filter((x) => !(x.materialId === p.materialId && x.colourId === p.colourId))
                            : [...value.intendedPairs, { materialId: p.materialId, colourId: p.colourId }],
                        })
                      }
                    />
                    {p.vinylName} on {p.blankColourName.toLowerCase()} ({(Math.floor(p.ratio * 10) / 10).toFixed(1)}:1): meant that way
                  </label>
                );
              })}
            </fieldset>
          ) : null}
        </>
      ) : null}
      <FieldError message={error} />
    </div>
  );
}
