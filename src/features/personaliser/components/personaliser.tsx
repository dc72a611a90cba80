/**
 * The live personaliser (loaded lazily on the listing page only: it brings the font engine).
 * Every keystroke lays the name out with the engine and the very font file the shop will cut,
 * places it as compose() does and repaints the preview in the same frame; nothing the shopper
 * sees is debounced. The full compose() (weeding, true outline) follows from a worker.
 */
import { useEffect, useId, useLayoutEffect, useMemo, useRef, useState, type FormEvent } from 'react';
import type { Cart } from '../../../../shared/schemas/cart.ts';
import type { ListingPage, PublicMaterial } from '../../../../shared/schemas/catalog.ts';
import type { FontRegistry } from '../../../../shared/engine/fonts.ts';
import { priceForChoices, layersForChoices, type Choices } from '../../../../shared/schemas/listing.ts';
import { MAX_LINE_QUANTITY } from '../../../../shared/schemas/cart.ts';
import { formatMoney } from '../../../../shared/money.ts';
import { formatLength, formatSize, formatSmallLength } from '../../../../shared/units.ts';
import { Button, ButtonLink } from '../../../components/ui/button.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { isApiError } from '../../../lib/api-client.ts';
import { useFonts } from '../api/get-fonts.ts';
import { ComposeClient, type ComposeReply } from '../lib/compose-client.ts';
import { blankFor, designInput } from '../lib/design.ts';
import { loadClientRegistry } from '../lib/font-registry.ts';
import { placeDesign, type Placement } from '../lib/place.ts';
import { loadChoices, saveChoices } from '../lib/saved-choices.ts';
import { BlankPreview } from './blank-preview.tsx';
import { FieldError, FontPicker, MotifPicker, SwatchPicker } from './pickers.tsx';

export type PersonaliserProps = {
  listing: ListingPage;
  /** posts { listingId, quantity, choices } to the cart; rejects with an ApiError */
  addToCart: (input: { listingId: string; quantity: number; choices: Choices }) => Promise<Cart>;
  cartHref: string;
};

type Registry = { registry: FontRegistry; client: ComposeClient };

export default function Personaliser({ listing, addToCart, cartHref }: PersonaliserProps) {
  const p = listing.content.personalisation;
  const fonts = useFonts();
  const toast = useToast();
  const [choices, setChoices] = useState<Choices>(() => loadChoices(listing.id, p));
  const [engine, setEngine] = useState<Registry | null>(null);
  const [engineError, setEngineError] = useState<string | null>(null);
  const [full, setFull] = useState<ComposeReply | null>(null);
  const [quantity, setQuantity] = useState(1);
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const [added, setAdded] = useState<{ itemCount: number } | null>(null);
  const [pending, setPending] = useState(false);
  const inputStart = useRef<number | null>(null);
  const formId = useId();

  const allowedFontIds = useMemo(() => [...new Set(p.textFields.flatMap((f) => f.fontIds))], [p.textFields]);

  // fonts: fetched once (cached per page load), parsed by the engine, handed to the worker too
  useEffect(() => {
    if (!fonts.data) return;
    let live = true;
    loadClientRegistry(fonts.data, allowedFontIds)
      .then(({ registry, sources }) => {
        if (!live) return;
        const client = new ComposeClient(registry, sources);
        client.onResult((r) => setFull(r));
        setEngine({ registry, client });
      })
      .catch((e: unknown) => live && setEngineError(e instanceof Error ? e.message : 'The fonts did not load.'));
    return () => {
      live = false;
    };
  }, [fonts.data, allowedFontIds]);
  useEffect(() => () => engine?.client.dispose(), [engine]);

  // stored just after the frame, so the write never sits between a keystroke and its paint
  useEffect(() => {
    const t = setTimeout(() => saveChoices(listing.id, choices), 0);
    return () => clearTimeout(t);
  }, [listing.id, choices]);

  const input = useMemo(() => designInput(listing, choices), [listing, choices]);
  const placement = useMemo<{ value: Placement | null; error: string | null }>(() => {
    if (!engine || !input) return { value: null, error: null };
    try {
      return { value: placeDesign(engine.registry, input), error: null };
    } catch (e) {
      return { value: null, error: e instanceof Error ? e.message : 'The design could not be placed.' };
    }
  }, [engine, input]);

  // the full composition for weeding and the outline, newest input only
  const [requestId, setRequestId] = useState(-1);
  useEffect(() => {
    if (!engine || !input || !placement.value) return setRequestId(-1);
    // posted after the frame: copying the input to the worker is not on the keystroke's path
    const t = setTimeout(() => setRequestId(engine.client.request(input)), 0);
    return () => clearTimeout(t);
  }, [engine, input, placement.value]);
  const fullNow = full && full.id === requestId && full.ok && engine?.client.current === requestId ? full : null;

  // keystroke → painted: measured from the first input not yet on screen to the frame after it
  useLayoutEffect(() => {
    if (inputStart.current === null) return;
    const start = inputStart.current;
    requestAnimationFrame(() =>
      setTimeout(() => {
        const end = performance.mark('preview-painted').startTime;
        performance.measure('preview', { start, end });
        if (inputStart.current === start) inputStart.current = null;
      }, 0),
    );
  }, [placement]);

  const markInput = () => {
    if (inputStart.current === null) inputStart.current = performance.mark('preview-input').startTime;
  };
  const update = (fn: (c: Choices) => Choices, clear?: string) => {
    markInput();
    setAdded(null);
    if (clear && fieldErrors[clear]) setFieldErrors(({ [clear]: _drop, ...rest }) => rest);
    setChoices(fn);
  };

  const materials = useMemo(() => new Map(listing.materials.map((m) => [m.id, m])), [listing.materials]);
  const mats = (ids: readonly string[] | undefined): PublicMaterial[] => (ids ?? []).flatMap((id) => materials.get(id) ?? []);
  const price = priceForChoices(listing.content, choices);
  const layerCount = layersForChoices(listing.content, choices).length;
  const blank = useMemo(() => blankFor(listing.content), [listing.content]);
  const motifChoice = p.motifChoices.find((m) => m.motifId === choices.motifId);
  const fontInfos = fonts.data ?? [];
  const bb = placement.value?.bboxMm;
  const size = bb ? { w: bb.maxX - bb.minX, h: bb.maxY - bb.minY } : null;
  const texts = p.textFields.map((f) => choices.texts[f.id]?.text.trim()).filter(Boolean).join(', ');
  const previewLabel = `Preview on the ${blank.name.toLowerCase()}${texts ? `: ${texts}` : ''}${size ? `, design ${formatSize(size.w, size.h)}` : ''}`;

  async function submit(e: FormEvent) {
    e.preventDefault();
    setPending(true);
    setFieldErrors({});
    try {
      const cart = await addToCart({ listingId: listing.id, quantity, choices });
      setAdded({ itemCount: cart.itemCount });
    } catch (err) {
      if (isApiError(err) && err.fields) {
        const mapped: Record<string, string> = {};
        for (const [k, v] of Object.entries(err.fields)) mapped[k.replace(/^choices\./, '')] = v;
        setFieldErrors(mapped);
        const known = Object.keys(mapped).some((k) => isKnownField(k));
        if (!known) toast.error(err.message);
      } else toast.error(err instanceof Error ? err.message : 'Adding to the cart failed. Please try again.');
    } finally {
      setPending(false);
    }
  }
  const isKnownField = (k: string) => /^(texts\.[^.]+\.(text|fontId)|textColours\.|motifId$|motifColours\.|outlineMaterialId$|quantity$)/.test(k);

  return (
    <form id={formId} onSubmit={submit} noValidate className="grid gap-8 lg:grid-cols-[minmax(0,1.1fr)_minmax(0,1fr)]" aria-label="Personalise this item">
      {/* preview first on small screens too: it is what the shopper is checking */}
      <div className="flex flex-col gap-3 lg:sticky lg:top-4 lg:self-start">
        <div className="rounded-lg border border-line bg-white p-3 shadow-sm">
          <BlankPreview blank={blank} placement={placement.value} full={fullNow} label={previewLabel} />
        </div>
        <div aria-live="polite" className="flex flex-col gap-1 text-sm">
          <p>
            <span className="font-bold">Print area: </span>
            {formatSize(blank.printArea.widthMm, blank.printArea.heightMm)}, starting {formatLength(blank.topOffsetMm)} from the {blank.topOffsetFrom}
          </p>
          <p data-testid="design-size">
            <span className="font-bold">Design: </span>
            {size ? formatSize(size.w, size.h) : engine ? 'type a name or pick a motif to see its size' : 'loading the fonts…'}
          </p>
          {placement.value
            ? Object.entries(placement.value.letterHeights).map(([fid, h]) => (
                <p key={fid}>
                  <span className="font-bold">{p.textFields.find((f) => f.id === fid)?.label ?? fid} letter height: </span>
                  {formatSmallLength(h)}
                </p>
              ))
            : null}
          <WeedingLine full={fullNow} waiting={!!placement.value && !fullNow} failed={full && !full.ok && full.id === requestId ? full.message : null} />
        </div>
        {engineError ? <p role="alert" className="font-semibold text-danger">The fonts didn't load: {engineError}. Reload the page to try again; what you typed is kept.</p> : null}
        {placement.error ? <p className="font-semibold text-danger">{placement.error}</p> : null}
      </div>

      <div className="flex flex-col gap-7">
        {p.textFields.map((f) => {
          const c = choices.texts[f.id] ?? { text: '', fontId: f.defaultFontId, letterHeightMm: f.defaultLetterHeightMm };
          const warnings = (placement.value?.warnings ?? []).filter((w) => w.fieldId === f.id);
          const count = [...c.text.trim()].length;
          const err = fieldErrors[`texts.${f.id}.text`];
          const inputId = `${formId}-${f.id}`;
          const warnId = `${inputId}-warnings`;
          const minH = Math.max(5, Math.round(f.defaultLetterHeightMm / 2));
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
                  onChange={(e) => {
                    const text = e.target.value;
                    update((s) => ({ ...s, texts: { ...s.texts, [f.id]: { ...c, ...s.texts[f.id], text } } }), `texts.${f.id}.text`);
                  }}
                  className={`min-h-12 w-full rounded-lg border-2 bg-white px-3.5 py-2 text-lg text-ink ${err ? 'border-danger' : 'border-field hover:border-ink'}`}
                />
                <p id={`${inputId}-count`} className={`text-sm ${count > f.maxLength ? 'font-semibold text-danger' : 'text-ink-soft'}`}>
                  {count} of {f.maxLength} characters
                </p>
                <div id={warnId} aria-live="polite" className="flex flex-col gap-1">
                  <FieldError message={err} />
                  {warnings.map((w, i) => (
                    <p key={`${w.code}-${i}`} className={`rounded-lg border-l-4 px-3 py-2 text-sm ${w.code === 'missing_characters' || w.code === 'below_min_letter_height' || w.code === 'too_long' ? 'border-danger bg-danger-wash' : 'border-marigold bg-marigold-wash'}`} data-warning={w.code}>
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
                  registry={engine?.registry ?? null}
                  onChange={(fontId) => update((s) => ({ ...s, texts: { ...s.texts, [f.id]: { ...c, ...s.texts[f.id], fontId } } }), `texts.${f.id}.fontId`)}
                  error={fieldErrors[`texts.${f.id}.fontId`]}
                />
              ) : null}

              <div className="flex flex-col gap-1.5">
                <label htmlFor={`${inputId}-height`} className="font-bold">Letter height</label>
                <div className="flex items-center gap-3">
                  <input
                    id={`${inputId}-height`}
                    type="range"
                    min={minH}
                    max={f.defaultLetterHeightMm * 2}
                    step={1}
                    value={c.letterHeightMm}
                    onChange={(e) => {
                      const letterHeightMm = Number(e.target.value);
                      update((s) => ({ ...s, texts: { ...s.texts, [f.id]: { ...c, ...s.texts[f.id], letterHeightMm } } }));
                    }}
                    className="h-6 flex-1 accent-thread"
                    aria-valuetext={formatSmallLength(c.letterHeightMm)}
                  />
                  <span className="w-36 text-sm">{formatSmallLength(c.letterHeightMm)}</span>
                </div>
                <p className="text-sm text-ink-soft">Long names are made smaller to fit the print area.</p>
              </div>

              {f.colourChoices.length > 0 ? (
                <SwatchPicker
                  legend={`${f.label} colour`}
                  name={`${formId}-${f.id}-colour`}
                  options={mats(f.colourChoices)}
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
            options={p.motifChoices.map((m) => ({
              motifId: m.motifId,
              label: m.label,
              geometry: listing.motifs.find((x) => x.id === m.motifId)?.geometry ?? null,
              colours: Object.fromEntries(
                m.layers.map((l) => [l.layerId, materials.get(l.mode === 'fixed' ? (l.materialId ?? '') : (m.motifId === choices.motifId ? choices.motifColours[l.layerId] : undefined) ?? l.colourChoices?.[0] ?? '')?.colourHex]),
              ),
            }))}
            onChange={(motifId) =>
              update((s) => {
                const layers = p.motifChoices.find((m) => m.motifId === motifId)?.layers ?? [];
                const motifColours: Choices['motifColours'] = {};
                for (const l of layers) if (l.mode === 'shopper' && l.colourChoices?.length) motifColours[l.layerId] = s.motifColours[l.layerId] && l.colourChoices.includes(s.motifColours[l.layerId]) ? s.motifColours[l.layerId] : l.colourChoices[0];
                return { ...s, motifId, motifColours };
              }, 'motifId')
            }
            error={fieldErrors.motifId}
          />
        ) : null}

        {motifChoice?.layers
          .filter((l) => l.mode === 'shopper' && (l.colourChoices?.length ?? 0) > 0)
          .map((l) => (
            <SwatchPicker
              key={l.layerId}
              legend={`${motifChoice.label}: ${l.layerId} colour`}
              name={`${formId}-motif-${l.layerId}`}
              options={mats(l.colourChoices)}
              value={choices.motifColours[l.layerId]}
              onChange={(id) => update((s) => ({ ...s, motifColours: { ...s.motifColours, [l.layerId]: id } }), `motifColours.${l.layerId}`)}
              error={fieldErrors[`motifColours.${l.layerId}`]}
            />
          ))}

        {p.outline ? (
          <SwatchPicker
            legend="Outline colour"
            name={`${formId}-outline`}
            options={mats(p.outline.colourChoices)}
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
                {formatMoney(price, listing.currency)}
              </p>
              <p className="text-sm text-ink-soft">
                {layerCount} {layerCount === 1 ? 'layer' : 'layers'} of vinyl
                {listing.content.extraLayerPriceMinor > 0 ? ` · each layer after the first adds ${formatMoney(listing.content.extraLayerPriceMinor, listing.currency)}` : ''}
              </p>
            </div>
            <div className="flex flex-col gap-1.5">
              <label htmlFor={`${formId}-qty`} className="font-bold">Quantity</label>
              <input
                id={`${formId}-qty`}
                type="number"
                min={1}
                max={MAX_LINE_QUANTITY}
                value={quantity}
                onChange={(e) => setQuantity(Math.max(1, Math.min(MAX_LINE_QUANTITY, Math.floor(Number(e.target.value) || 1))))}
                className="min-h-11 w-24 rounded-lg border-2 border-field bg-white px-3 py-2"
                aria-describedby={fieldErrors.quantity ? `${formId}-qty-err` : undefined}
              />
              <FieldError id={`${formId}-qty-err`} message={fieldErrors.quantity} />
            </div>
          </div>
          <Button type="submit" pending={pending} pendingLabel="Adding…" className="w-full text-lg">
            Add to cart · {formatMoney(price * quantity, listing.currency)}
          </Button>
          {added ? (
            <div role="status" data-testid="added-to-cart" className="flex flex-col gap-3 rounded-lg border-2 border-thread bg-thread-wash p-4">
              <p className="font-bold">
                <span aria-hidden="true">✓ </span>Added to your cart{texts ? ` with “${texts}”` : ''}. Your cart has {added.itemCount} {added.itemCount === 1 ? 'item' : 'items'}.
              </p>
              <div className="flex flex-wrap gap-3">
                <ButtonLink to={cartHref}>Go to your cart</ButtonLink>
                <Button variant="secondary" onClick={() => setAdded(null)}>Keep personalising</Button>
              </div>
            </div>
          ) : null}
          <p className="text-sm text-ink-soft">The shop checks your text letter by letter before cutting. What you type here is kept if you reload.</p>
        </div>
      </div>
    </form>
  );
}

function WeedingLine({ full, waiting, failed }: { full: Extract<ComposeReply, { ok: true }> | null; waiting: boolean; failed: string | null }) {
  if (failed) return <p className="text-danger">{failed}</p>;
  if (!full) return waiting ? <p className="text-ink-soft"><span className="font-bold text-ink">Weeding: </span>checking…</p> : null;
  const w = full.weeding;
  const tone = w.label === 'quick' ? 'bg-thread-wash text-thread-deep' : w.label === 'moderate' ? 'bg-marigold-wash text-ink' : 'bg-danger-wash text-danger';
  const bits = [`${w.pieces} ${w.pieces === 1 ? 'piece' : 'pieces'}`, `${w.counters} ${w.counters === 1 ? 'counter' : 'counters'} to pick out`];
  if (w.smallestPieceAreaMm2 !== null) bits.push(`smallest piece ${Math.round(w.smallestPieceAreaMm2)} mm²`);
  if (w.narrowPieces + w.narrowCounters > 0) bits.push(`${w.narrowPieces + w.narrowCounters} under ${formatSmallLength(1.5)} wide`);
  return (
    <p data-testid="weeding">
      <span className="font-bold">Weeding: </span>
      <span className={`rounded-full px-2 py-0.5 font-bold ${tone}`}>{w.label}</span> — {bits.join(', ')}
      {w.label !== 'quick' ? <span className="block text-ink-soft">Why: {w.reasons.join('; ')}.</span> : null}
    </p>
  );
}
