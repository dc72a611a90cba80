/**
 * The blank's size and colour as the shopper picks them: two radio groups named "Size" and
 * "<item> colour" (keyboard: Tab into the group, arrows between options), the size chart in cm and
 * in, and the contrast warnings of the vinyl colours on the chosen blank colour.
 */
import type { ContrastWarning } from '../../../../shared/engine/contrast.ts';
import { formatMoney } from '../../../../shared/money.ts';
import { type ResolvedBlankOffer, stockKey } from '../../../../shared/schemas/blanks.ts';
import { formatLength, formatSize } from '../../../../shared/units.ts';
import { OptionGroup, optionBox } from './pickers.tsx';

const disabledBox = 'has-[:disabled]:cursor-not-allowed has-[:disabled]:opacity-60 has-[:disabled]:line-through';

export function SizePicker(props: { offer: ResolvedBlankOffer; value: string | null; colourId: string | null; currency: string; onChange: (sizeId: string) => void; error?: string }) {
  const { offer } = props;
  return (
    <OptionGroup legend="Size" error={props.error} layout="flex flex-wrap gap-2">
      {offer.sizes.map((s) => {
        const soldOut = !!props.colourId && offer.soldOut.includes(stockKey(s.id, props.colourId));
        return (
          <label key={s.id} className={`${optionBox} ${disabledBox} min-h-11 min-w-16 justify-center !py-1.5 px-3`}>
            <input type="radio" name="blank-size" value={s.id} checked={props.value === s.id} disabled={soldOut} onChange={() => props.onChange(s.id)} className="sr-only" />
            <span className="text-center leading-tight">
              <span className="block font-bold">{s.label}</span>
              {soldOut ? (
                <span className="block text-xs text-danger no-underline">sold out</span>
              ) : s.priceDiffMinor > 0 ? (
                <span className="block text-xs text-ink-soft">+{formatMoney(s.priceDiffMinor, props.currency)}</span>
              ) : null}
            </span>
          </label>
        );
      })}
    </OptionGroup>
  );
}

export function BlankColourPicker(props: { offer: ResolvedBlankOffer; value: string | null; sizeId: string | null; onChange: (colourId: string) => void; error?: string }) {
  const { offer } = props;
  return (
    <OptionGroup legend={`${offer.name} colour`} error={props.error} layout="flex flex-wrap gap-2">
      {offer.colours.map((c) => {
        const soldOut = !!props.sizeId && offer.soldOut.includes(stockKey(props.sizeId, c.id));
        return (
          <label key={c.id} className={`${optionBox} ${disabledBox} !py-1.5 pr-3.5`}>
            <input type="radio" name="blank-colour" value={c.id} checked={props.value === c.id} disabled={soldOut} onChange={() => props.onChange(c.id)} className="sr-only" />
            {c.photoUrl ? (
              <img src={c.photoUrl} alt="" className="size-7 shrink-0 rounded-full border-2 border-ink/30 object-cover" />
            ) : (
              <span aria-hidden="true" className="size-7 shrink-0 rounded-full border-2 border-ink/30" style={{ background: c.hex }} />
            )}
            <span className="text-sm leading-tight">
              <span className="block font-bold">{c.name}</span>
              {soldOut ? <span className="text-danger">sold out in this size</span> : null}
            </span>
          </label>
        );
      })}
    </OptionGroup>
  );
}

/** Garment measurements per size, in cm and in; the print area per size too. */
export function SizeChart({ offer }: { offer: ResolvedBlankOffer }) {
  const measured = offer.sizes.some((s) => s.chestMm || s.lengthMm);
  const tee = offer.shape === 'kids_tee' || offer.shape === 'adult_tee';
  return (
    <details className="rounded-lg border border-line bg-white px-3 py-2 text-sm">
      <summary className="cursor-pointer font-bold">Size chart</summary>
      <div className="mt-2 overflow-x-auto">
        <table className="w-full border-collapse text-left">
          <caption className="sr-only">Measurements of each size, laid flat</caption>
          <thead>
            <tr className="border-b border-line">
              <th scope="col" className="py-1 pr-3">
                Size
              </th>
              {measured ? (
                <>
                  <th scope="col" className="py-1 pr-3">
                    {tee ? 'Chest, laid flat' : 'Width'}
                  </th>
                  <th scope="col" className="py-1 pr-3">
                    Length
                  </th>
                </>
              ) : null}
              <th scope="col" className="py-1">
                Print area
              </th>
            </tr>
          </thead>
          <tbody>
            {offer.sizes.map((s) => (
              <tr key={s.id} className="border-b border-line/60">
                <th scope="row" className="py-1 pr-3">
                  {s.label}
                </th>
                {measured ? (
                  <>
                    <td className="py-1 pr-3">{s.chestMm ? formatLength(s.chestMm) : '—'}</td>
                    <td className="py-1 pr-3">{s.lengthMm ? formatLength(s.lengthMm) : '—'}</td>
                  </>
                ) : null}
                <td className="py-1">{formatSize(s.widthMm, s.heightMm)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </details>
  );
}

export function ContrastNotes({ warnings }: { warnings: ContrastWarning[] }) {
  return (
    <div aria-live="polite" className="flex flex-col gap-1">
      {warnings.map((w) => (
        <p key={w.materialId} data-warning="low_contrast" className="rounded-lg border-l-4 border-marigold bg-marigold-wash px-3 py-2 text-sm">
          {w.message}
        </p>
      ))}
    </div>
  );
}
