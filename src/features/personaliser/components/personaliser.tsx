/**
 * The live personaliser (loaded lazily on the listing page only: it brings the font engine).
 * Every keystroke lays the name out with the engine and the very font file the shop will cut,
 * places it with the engine's own placement and repaints the preview in the same frame; nothing
 * the shopper sees is debounced. The full compose() (weeding, true outline) follows from a worker.
 * The state and the work live in hooks (useDesignState, useLivePreview, useAddToCart); this
 * component only renders them.
 */
import { useId, useMemo } from 'react';
import { sizeFitWarning } from '../../../../shared/engine/fit.ts';
import type { ComposeWarning } from '../../../../shared/engine/place.ts';
import { fitBySize, largerSizeThatFits } from '../../../../shared/engine/size-fit.ts';
import { formatMoney } from '../../../../shared/money.ts';
import { MAX_LINE_QUANTITY } from '../../../../shared/schemas/cart.ts';
import type { ListingPage } from '../../../../shared/schemas/catalog.ts';
import { includedLayers } from '../../../../shared/schemas/listing.ts';
import { formatLength, formatSize, formatSmallLength } from '../../../../shared/units.ts';
import { Button, ButtonLink } from '../../../components/ui/button.tsx';
import { FieldError } from '../../../components/ui/form-controls.tsx';
import { useFonts } from '../api/get-fonts.ts';
import { type AddToCart, useAddToCart } from '../hooks/use-add-to-cart.ts';
import { type ChoicesUpdate, textChoice, useDesignState, withText } from '../hooks/use-design-state.ts';
import { useLivePreview } from '../hooks/use-live-preview.ts';
import { addToCartBlocker } from '../lib/add-blockers.ts';
import type { ComposeResult } from '../lib/compose-client.ts';
import { BlankColourPicker, ContrastNotes, SizeChart, SizePicker } from './blank-pickers.tsx';
import { BlankPreview } from './blank-preview.tsx';
import { FontPicker, MotifPicker, SwatchPicker } from './pickers.tsx';

export type PersonaliserProps = {
  listing: ListingPage;
  /** posts { listingId, quantity, choices } to the cart; rejects with an ApiError */
  addToCart: AddToCart;
  cartHref: string;
};

export default function Personaliser({ listing, addToCart, cartHref }: PersonaliserProps) {
  const fonts = useFonts();
  const design = useDesignState(listing);
  const preview = useLivePreview(design.input, fonts.data, design.fontIds);
  const cart = useAddToCart(listing.id, addToCart);
  const formId = useId();

  const { personalisation: p, choices, blank, materialsOf, texts } = design;
  /** Every change the shopper makes: timed for the preview, the confirmation and that field's server message dropped. */
  const update = (fn: ChoicesUpdate, clear?: string) => {
    preview.markInput();
    cart.dismissAdded();
    if (clear) cart.clearFieldError(clear);
    design.setChoices(fn);
  };
  const { fieldErrors } = cart;
  // fit per size: when the name comes out too small at the chosen size, place it on every size
  // offered to name the smallest larger one that takes it (shared/engine/size-fit.ts)
  const tooSmall = !!preview.placement?.warnings.some((w) => w.code === 'below_min_letter_height');
  const sizeFits = useMemo(
    () => (tooSmall && design.offer && design.size && preview.registry && design.input ? fitBySize(preview.registry, design.input, design.offer.sizes) : null),
    [tooSmall, design.offer, design.size, preview.registry, design.input],
  );
  const sizeAware = (ws: ComposeWarning[], fieldId: string, text: string) =>
    ws.map((w) => {
      if (w.code !== 'below_min_letter_height' || !sizeFits || !design.size) return w;
      const larger = largerSizeThatFits(sizeFits, design.size.id, fieldId);
      const message = sizeFitWarning({
        text,
        sizeLabel: design.size.label,
        letterHeightMm: w.letterHeightMm ?? 0,
        minLetterHeightMm: w.minLetterHeightMm ?? 0,
        larger: larger ? { label: larger.label, letterHeightMm: larger.letterHeights[fieldId] ?? 0 } : null,
      }).message;
      return { ...w, message };
    });
  const fontInfos = fonts.data ?? [];
  const bb = preview.placement?.bboxMm;
  const size = bb ? { w: bb.maxX - bb.minX, h: bb.maxY - bb.minY } : null;
  const blocker = addToCartBlocker(listing.content, choices, preview.placement, design.offer);
  const previewLabel = `Preview on the ${blank.name.toLowerCase()}${texts ? `: ${texts}` : ''}${size ? `, design ${formatSize(size.w, size.h)}` : ''}`;

  return (
    <form id={formId} onSubmit={(e) => cart.submit(e, choices)} noValidate className="grid gap-8 lg:grid-cols-[minmax(0,1.1fr)_minmax(0,1fr)]" aria-label="Personalise this item">
      {/* preview first on small screens too: it is what the shopper is checking */}
      {/* on a phone the column dissolves (contents) so the preview box alone stays on screen while the shopper types and picks */}
      <div className="flex flex-col gap-3 max-lg:contents lg:sticky lg:top-4 lg:self-start">
        <div
          data-testid="preview-box"
          className="rounded-lg border border-line bg-white p-3 shadow-sm max-lg:sticky max-lg:top-0 max-lg:z-10 max-lg:p-1.5 max-lg:shadow-md max-lg:[&_svg]:max-h-[34vh]"
        >
          <BlankPreview blank={blank} colourHex={design.colour?.hex ?? null} placement={preview.placement} full={preview.full} label={previewLabel} />
        </div>
        {design.contrast.length > 0 ? <ContrastNotes warnings={design.contrast} /> : null}
        <div aria-live="polite" className="flex flex-col gap-1 text-sm">
          {design.size ? (
            <p data-testid="chosen-blank">
              <span className="font-bold">Size: </span>
              {design.size.label}
              {design.colour ? ` · ${design.colour.name}` : ''}
            </p>
          ) : null}
          <p>
            <span className="font-bold">Print area: </span>
            {formatSize(blank.printArea.widthMm, blank.printArea.heightMm)}, starting {formatLength(blank.topOffsetMm)} from the {blank.topOffsetFrom}
          </p>
          <p data-testid="design-size">
            <span className="font-bold">Design: </span>
            {size ? formatSize(size.w, size.h) : preview.registry ? 'type a name or pick a motif to see its size' : 'loading the fonts…'}
          </p>
          {preview.placement
            ? Object.entries(preview.placement.letterHeights).map(([fid, h]) => (
                <p key={fid}>
                  <span className="font-bold">{p.textFields.find((f) => f.id === fid)?.label ?? fid} letter height: </span>
                  {formatSmallLength(h)}
                </p>
              ))
            : null}
          <WeedingLine full={preview.full} failed={preview.fullFailed} />
        </div>
        {preview.engineError ? (
          <p role="alert" className="font-semibold text-danger">
            The fonts didn't load: {preview.engineError}. Reload the page to try again; what you typed is kept.
          </p>
        ) : null}
        {preview.placementError ? <p className="font-semibold text-danger">{preview.placementError}</p> : null}
      </div>

      <div className="flex flex-col gap-7">
        {design.offer ? (
          <div className="flex flex-col gap-4">
            <SizePicker
              offer={design.offer}
              value={choices.sizeId}
              colourId={choices.colourId}
              currency={listing.currency}
              onChange={(sizeId) => update((s) => ({ ...s, sizeId }), 'sizeId')}
              error={fieldErrors.sizeId}
            />
            <SizeChart offer={design.offer} />
            <BlankColourPicker
              offer={design.offer}
              value={choices.colourId}
              sizeId={choices.sizeId}
              onChange={(colourId) => update((s) => ({ ...s, colourId }), 'colourId')}
              error={fieldErrors.colourId}
            />
          </div>
        ) : null}
        {p.textFields.map((f) => {
          const c = textChoice(choices, f);
          const warnings = sizeAware(
            (preview.placement?.warnings ?? []).filter((w) => w.fieldId === f.id),
            f.id,
            c.text,
          );
          const count = [...c.text.trim()].length;
          const err = fieldErrors[`texts.${f.id}.text`];
          const inputId = `${formId}-${f.id}`;
          const warnId = `${inputId}-warnings`;
          const minH = Math.max(5, Math.round(f.defaultLetterHeightMm / 2));
          // the slider shows the height the letters are really cut at: a long name is shrunk to fit
          const fitted = c.text.trim() ? preview.placement?.letterHeights[f.id] : undefined;
          const shown = fitted !== undefined ? Math.min(c.letterHeightMm, Math.round(fitted * 10) / 10) : c.letterHeightMm;
          const shrunk = shown < c.letterHeightMm - 0.05;
          return (
            <div key={f.id} className="flex flex-col gap-5">
              <div className="flex flex-col gap-1.5">
                <label htmlFor={inputId} className="font-bold">
                  {f.label}
                  {f.required ? null : <span className="font-normal text-ink-soft"> (optional)</span>}
                </label>
                <input
                  id={inputId}
                  name={`texts.${f.id}.text`}
                  value={c.text}
                  autoComplete="off"
                  spellCheck={false}
                  aria-invalid={err || count > f.maxLength ? true : undefined}
                  aria-describedby={`${inputId}-count ${warnId}`}
                  onChange={(e) => update(withText(f, { text: e.target.value }), `texts.${f.id}.text`)}
                  className={`min-h-12 w-full rounded-lg border-2 bg-white px-3.5 py-2 text-lg text-ink ${err ? 'border-danger' : 'border-field hover:border-ink'}`}
                />
                <p id={`${inputId}-count`} className={`text-sm ${count > f.maxLength ? 'font-semibold text-danger' : 'text-ink-soft'}`}>
                  {count} of {f.maxLength} characters
                </p>
                <div id={warnId} aria-live="polite" className="flex flex-col gap-1">
                  <FieldError message={err} />
                  {warnings.map((w) => (
                    // the warnings are this field's: one of each kind
                    <p
                      key={w.code}
                      className={`rounded-lg border-l-4 px-3 py-2 text-sm ${w.code === 'missing_characters' || w.code === 'below_min_letter_height' || w.code === 'too_long' ? 'border-danger bg-danger-wash' : 'border-marigold bg-marigold-wash'}`}
                      data-warning={w.code}
                    >
                      {w.message}
                    </p>
                  ))}
                </div>
              </div>

              {f.fontIds.length > 1 ? (
                <FontPicker
                  legend={`Font for the ${f.label.toLowerCase()}`}
                  name={`${formId}-${f.id}-font`}
                  fonts={f.fontIds.flatMap((id) => fontInfos.find((x) => x.id === id) ?? [])}
                  value={c.fontId}
                  text={c.text}
                  registry={preview.registry}
                  onChange={(fontId) => update(withText(f, { fontId }), `texts.${f.id}.fontId`)}
                  error={fieldErrors[`texts.${f.id}.fontId`]}
                />
              ) : null}

              <div className="flex flex-col gap-1.5">
                <label htmlFor={`${inputId}-height`} className="font-bold">
                  Letter height
                </label>
                <div className="flex items-center gap-3">
                  <input
                    id={`${inputId}-height`}
                    type="range"
                    min={Math.min(minH, Math.floor(shown))}
                    max={f.defaultLetterHeightMm * 2}
                    step={0.1}
                    value={shown}
                    onChange={(e) => update(withText(f, { letterHeightMm: Number(e.target.value) }))}
                    className="h-6 flex-1 accent-thread"
                    aria-valuetext={formatSmallLength(shown)}
                  />
                  <span className="w-36 text-sm" data-testid={`letter-height-${f.id}`}>
                    {formatSmallLength(shown)}
                  </span>
                </div>
                <p className="text-sm text-ink-soft">
                  {shrunk ? `Made smaller to fit the print area (you chose ${formatSmallLength(c.letterHeightMm)}).` : 'Long names are made smaller to fit the print area.'}
                </p>
              </div>

              {f.colourChoices.length > 0 ? (
                <SwatchPicker
                  legend={`${f.label} colour`}
                  name={`${formId}-${f.id}-colour`}
                  options={materialsOf(f.colourChoices)}
                  value={choices.textColours[f.id]}
                  onChange={(id) => update((s) => ({ ...s, textColours: { ...s.textColours, [f.id]: id } }), `textColours.${f.id}`)}
                  error={fieldErrors[`textColours.${f.id}`]}
                />
              ) : null}
            </div>
          );
        })}

        {p.motifChoices.length > 0 ? (
          <MotifPicker
            legend="Motif"
            name={`${formId}-motif`}
            allowNone={!p.motifRequired}
            value={choices.motifId}
            options={design.motifOptions}
            onChange={(motifId) => update(design.withMotif(motifId), 'motifId')}
            error={fieldErrors.motifId}
          />
        ) : null}

        {design.motifChoice?.layers
          .filter((l) => l.mode === 'shopper' && (l.colourChoices?.length ?? 0) > 0)
          .map((l) => (
            <SwatchPicker
              key={l.layerId}
              legend={`${design.motifChoice!.label}: ${l.layerId} colour`}
              name={`${formId}-motif-${l.layerId}`}
              options={materialsOf(l.colourChoices)}
              value={choices.motifColours[l.layerId]}
              onChange={(id) => update((s) => ({ ...s, motifColours: { ...s.motifColours, [l.layerId]: id } }), `motifColours.${l.layerId}`)}
              error={fieldErrors[`motifColours.${l.layerId}`]}
            />
          ))}

        {p.outline ? (
          <SwatchPicker
            legend="Outline colour"
            name={`${formId}-outline`}
            options={materialsOf(p.outline.colourChoices)}
            value={choices.outlineMaterialId}
            onChange={(id) => update((s) => ({ ...s, outlineMaterialId: id }), 'outlineMaterialId')}
            error={fieldErrors.outlineMaterialId}
          />
        ) : null}

        <div className="flex flex-col gap-4 rounded-lg border-2 border-ink/10 bg-white p-5">
          <div className="flex flex-wrap items-end justify-between gap-4">
            <div>
              <p className="text-sm font-bold text-ink-soft">Price for this design</p>
              <p className="text-3xl font-black" data-testid="price" aria-live="polite">
                {formatMoney(design.price, listing.currency)}
              </p>
              <p className="text-sm text-ink-soft">
                {design.layerCount} {design.layerCount === 1 ? 'layer' : 'layers'} of vinyl
                {listing.content.extraLayerPriceMinor > 0
                  ? ` · ${includedLayers(listing.content)} included, each one more adds ${formatMoney(listing.content.extraLayerPriceMinor, listing.currency)}`
                  : ''}
              </p>
            </div>
            <div className="flex flex-col gap-1.5">
              <label htmlFor={`${formId}-qty`} className="font-bold">
                Quantity
              </label>
              <input
                id={`${formId}-qty`}
                type="number"
                min={1}
                max={MAX_LINE_QUANTITY}
                value={cart.quantity}
                onChange={(e) => cart.setQuantity(e.target.value)}
                className="min-h-11 w-24 rounded-lg border-2 border-field bg-white px-3 py-2"
                aria-describedby={fieldErrors.quantity ? `${formId}-qty-err` : undefined}
              />
              <FieldError id={`${formId}-qty-err`} message={fieldErrors.quantity} />
            </div>
          </div>
          <Button type="submit" pending={cart.pending} pendingLabel="Adding…" className="w-full text-lg" disabled={!!blocker} aria-describedby={blocker ? `${formId}-blocker` : undefined}>
            Add to cart · {formatMoney(design.price * cart.quantity, listing.currency)}
          </Button>
          {blocker ? (
            <p id={`${formId}-blocker`} data-testid="add-blocker" className="text-sm font-semibold text-danger">
              Not yet: {blocker}
            </p>
          ) : null}
          {cart.added ? (
            <div role="status" data-testid="added-to-cart" className="flex flex-col gap-3 rounded-lg border-2 border-thread bg-thread-wash p-4">
              <p className="font-bold">
                <span aria-hidden="true">✓ </span>Added to your cart{texts ? ` with “${texts}”` : ''}. Your cart has {cart.added.itemCount} {cart.added.itemCount === 1 ? 'item' : 'items'}.
              </p>
              <div className="flex flex-wrap gap-3">
                <ButtonLink to={cartHref}>Go to your cart</ButtonLink>
                <Button variant="secondary" onClick={cart.dismissAdded}>
                  Keep personalising
                </Button>
              </div>
            </div>
          ) : null}
          <p className="text-sm text-ink-soft">The shop checks your text letter by letter before cutting. What you type here is kept if you reload.</p>
        </div>
      </div>
    </form>
  );
}

/**
 * What the design's fine detail means for the shopper, in their words. Weeding (picking the waste
 * vinyl out of the cut) is the maker's concern: the counts stay on the seller's proof; a shopper
 * hears only when small or thin parts make the item less sturdy, and what would help.
 */
function WeedingLine({ full, failed }: { full: ComposeResult | null; failed: string | null }) {
  if (failed) return <p className="text-danger">{failed}</p>;
  if (!full || full.weeding.label === 'quick') return null;
  const thin = full.weeding.narrowPieces + full.weeding.narrowCounters > 0;
  return (
    <p data-testid="fine-detail" className="text-ink-soft">
      <span className="font-bold text-ink">Fine detail: </span>
      {thin ? `some strokes are thinner than ${formatSmallLength(1.5)}, and thin parts can lift in the wash.` : 'this design has small parts, which need a gentle wash.'} Larger letters or a bolder
      font make it sturdier.
    </p>
  );
}
