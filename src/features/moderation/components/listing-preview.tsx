import { blankFor } from '../../../../shared/engine/listing-design.ts';
import { materialLabel } from '../../../../shared/material-label.ts';
import { formatMoney } from '../../../../shared/money.ts';
import type { ListingPage } from '../../../../shared/schemas/catalog.ts';
import { OCCASION_LABELS } from '../../../../shared/schemas/listing.ts';
import { formatLength, formatSize, formatSmallLength } from '../../../../shared/units.ts';
import { DesignOnBlank, pictureOfBlank } from '../../../components/design/design-on-blank.tsx';
import { FontSample } from '../../../components/ui/font-sample.tsx';
import { Badge } from '../../../components/ui/form-controls.tsx';

/**
 * The listing as a shopper would see it, from the server's listing-page answer for the version
 * under review. The description is the server's rendered HTML (raw HTML in the seller's text comes
 * out as text there); everything else is plain React text. Motifs are the engine's clean SVG,
 * loaded as images (no script can run in an <img>).
 */
export function ListingPreview({ page }: { page: ListingPage }) {
  const c = page.content;
  const mat = new Map(page.materials.map((m) => [m.id, m]));
  const swatches = (ids: string[] | undefined) => (
    <span className="flex flex-wrap gap-2">
      {(ids ?? []).map((id) => {
        const m = mat.get(id);
        return (
          <span key={id} className="inline-flex items-center gap-1.5 rounded-full border border-line bg-white px-2 py-0.5 text-sm">
            <span aria-hidden="true" className="size-4 rounded-full border border-ink/30" style={{ background: m?.colourHex ?? '#ccc' }} />
            {m ? materialLabel(m) : 'Unknown material'}
          </span>
        );
      })}
    </span>
  );

  return (
    <article className="flex flex-col gap-6 rounded-lg border border-line bg-white p-5 sm:p-6" aria-label="Listing as shoppers see it">
      <div className="grid grid-cols-1 gap-6 md:grid-cols-2">
        <div className="flex flex-col gap-2">
          {page.photos.length > 0 ? (
            <>
              <img src={page.photos[0]!.url} alt={`${c.title}, 1 of ${page.photos.length}`} className="aspect-square w-full rounded-lg bg-paper-deep object-cover" />
              {page.photos.length > 1 ? (
                <ul className="grid grid-cols-4 gap-2">
                  {page.photos.slice(1).map((p, i) => (
                    <li key={p.id}>
                      <img src={p.thumbnailUrl} alt={`${c.title}, ${i + 2} of ${page.photos.length}`} className="aspect-square w-full rounded-md object-cover" />
                    </li>
                  ))}
                </ul>
              ) : null}
            </>
          ) : (
            <div className="flex aspect-square w-full items-center justify-center rounded-lg border-2 border-dashed border-line text-ink-faint">No photos</div>
          )}
        </div>
        <div className="flex min-w-0 flex-col gap-3">
          <p className="text-sm font-bold text-thread-deep">{page.shop.name}</p>
          <h2 className="text-2xl font-extrabold break-words">{c.title}</h2>
          <p className="text-xl font-extrabold">
            {formatMoney(page.priceMinor, page.currency)}
            {c.extraLayerPriceMinor > 0 ? <span className="ml-2 text-base font-semibold text-ink-soft">+ {formatMoney(c.extraLayerPriceMinor, page.currency)} per extra layer</span> : null}
          </p>
          <div className="flex items-center gap-3">
            <DesignOnBlank blank={pictureOfBlank(blankFor(c))} size={72} label={`The ${c.blank.label} with its print area`} className="rounded-md border border-line bg-paper-deep" />
            <p className="text-ink-soft">
              {c.blank.label} · print area {formatSize(c.blank.widthMm, c.blank.heightMm)}, {formatLength(c.blank.topOffsetMm)} from the top
            </p>
          </div>
          <p className="text-ink-soft">
            Ships in {page.shop.processingDays} working day{page.shop.processingDays === 1 ? '' : 's'} · shipping {formatMoney(page.shop.shippingMinor, page.shop.currency)}
          </p>
          {c.occasions.length ? (
            <span className="flex flex-wrap gap-1.5">
              {c.occasions.map((o) => (
                <Badge key={o}>{OCCASION_LABELS[o]}</Badge>
              ))}
            </span>
          ) : null}
          {/* server-rendered, escaped description (server/features/catalog/markdown.ts) */}
          <div className="prose-sm max-w-none break-words [&_ol]:list-decimal [&_ol]:pl-5 [&_p]:mb-2 [&_ul]:list-disc [&_ul]:pl-5" dangerouslySetInnerHTML={{ __html: page.descriptionHtml }} />
        </div>
      </div>

      <section className="flex flex-col gap-4">
        <h3 className="text-lg font-extrabold">Personalisation</h3>
        {c.personalisation.textFields.map((f) => (
          <div key={f.id} className="flex flex-col gap-1.5 rounded-lg bg-paper p-3">
            <p className="font-bold">
              {f.label}{' '}
              <span className="font-normal text-ink-soft">
                ({f.required ? 'required' : 'optional'}, up to {f.maxLength} characters, letters {formatSmallLength(f.defaultLetterHeightMm)})
              </span>
            </p>
            <div className="flex flex-wrap items-center gap-2 text-sm">
              <span>Fonts:</span>
              {f.fontIds.map((id) => (
                <FontSample key={id} fontId={id} />
              ))}
            </div>
            {swatches(f.colourChoices)}
          </div>
        ))}
        {page.motifs.length ? (
          <div className="flex flex-col gap-2">
            <p className="font-bold">Motifs {c.personalisation.motifRequired ? '(one required)' : '(optional)'}</p>
            <ul className="flex flex-wrap gap-4">
              {c.personalisation.motifChoices.map((mc) => {
                const m = page.motifs.find((x) => x.id === mc.motifId);
                return (
                  <li key={mc.motifId} className="flex max-w-xs flex-col gap-2 rounded-lg bg-paper p-3">
                    {m ? <img src={m.svgUrl} alt={`Motif: ${mc.label}`} className="h-28 w-full rounded-md bg-white object-contain p-1" /> : null}
                    <span className="font-bold">{mc.label}</span>
                    <ul className="flex flex-col gap-1 text-sm">
                      {mc.layers.map((l) => (
                        <li key={l.layerId}>
                          <span className="font-semibold">{l.layerId}:</span> {l.mode === 'fixed' ? swatches(l.materialId ? [l.materialId] : []) : <>shopper picks {swatches(l.colourChoices)}</>}
                        </li>
                      ))}
                    </ul>
                  </li>
                );
              })}
            </ul>
          </div>
        ) : null}
        {c.personalisation.outline ? (
          <div className="flex flex-col gap-1.5">
            <p className="font-bold">Outline, {formatSmallLength(c.personalisation.outline.offsetMm)} around the design</p>
            {swatches(c.personalisation.outline.colourChoices)}
          </div>
        ) : null}
      </section>

      {page.safetyNotes ? (
        <section className="rounded-lg border-2 border-marigold bg-marigold-wash p-4">
          <h3 className="font-extrabold">Safety</h3>
          <ul className="list-disc pl-5">
            {page.safetyNotes.map((n) => (
              <li key={n}>{n}</li>
            ))}
          </ul>
        </section>
      ) : null}
    </article>
  );
}
