import { lazy, Suspense, useRef, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { formatMoney } from '../../../../shared/money.ts';
import { OCCASION_LABELS } from '../../../../shared/schemas/listing.ts';
import { PREVIEW_NAME } from '../../../../shared/ssr-contract.ts';
import { formatSize } from '../../../../shared/units.ts';
import { Spinner } from '../../../components/ui/button.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { paths } from '../../../config/paths.ts';
import { useMe } from '../../../features/auth/api/get-me.ts';
import { useAddCartLine } from '../../../features/cart/api/add-cart-line.ts';
import { useListing } from '../../../features/catalog/api/get-listing.ts';
import { ListingPreview } from '../../../features/catalog/components/listing-preview.tsx';
import { ListingDates } from '../../../features/offers/components/listing-dates.tsx';
import { RatingLine } from '../../../features/reviews/components/stars.tsx';
import { isApiError } from '../../../lib/api-client.ts';
import { useWantedSoon } from '../../../lib/use-mounted.ts';
import { NotFoundPage } from '../errors/not-found.tsx';

// the personaliser brings the font engine (fontkit): it loads here, and only here
const Personaliser = lazy(() => import('../../../features/personaliser/components/personaliser.tsx'));
// the reviews sit below the fold: they load after the page, and leave its first download as it was
const ReviewList = lazy(() => import('../../../features/reviews/components/review-list.tsx').then((m) => ({ default: m.ReviewList })));

/** /listings/:slug — photos, shop, price, processing time, the personaliser, care card, safety notes. */
export function ListingPage() {
  const { slug = '' } = useParams();
  const listing = useListing(slug);
  const addLine = useAddCartLine();
  const [photo, setPhoto] = useState(0);
  const me = useMe();
  const personaliserRef = useRef<HTMLElement>(null);
  const wanted = useWantedSoon(personaliserRef);

  if (listing.isPending) return <Spinner label="Loading the listing…" />;
  if (listing.isError) return isApiError(listing.error) && listing.error.status === 404 ? <NotFoundPage /> : <p role="alert">{listing.error.message}</p>;
  const l = listing.data;
  const c = l.content;
  const current = l.photos[photo] ?? l.photos[0];
  const previewLabel = `${c.title}: the design for the name ${PREVIEW_NAME} on the ${c.blank.label.toLowerCase()}`;

  return (
    <div className="flex flex-col gap-10">
      <div className="grid gap-8 md:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
        <div className="flex flex-col gap-3">
          {current ? (
            <img
              src={current.url}
              alt={`${c.title}, ${photo + 1} of ${l.photos.length}`}
              width={current.width}
              height={current.height}
              srcSet={`${current.thumbnailUrl} ${thumbWidth(current)}w, ${current.url} ${current.width}w`}
              sizes="(min-width: 768px) 50vw, 100vw"
              fetchPriority="high"
              className="aspect-[4/3] w-full rounded-lg border border-line bg-white object-cover"
            />
          ) : (
            <div className="flex aspect-[4/3] items-center justify-center rounded-lg border-2 border-dashed border-line bg-paper-deep text-ink-soft">
              No photos yet — the preview below is drawn to scale.
            </div>
          )}
          {l.photos.length > 1 ? (
            <ul className="flex flex-wrap gap-2" aria-label="Photos">
              {l.photos.map((ph, i) => (
                <li key={ph.id}>
                  <button
                    type="button"
                    onClick={() => setPhoto(i)}
                    aria-pressed={i === photo}
                    aria-label={`Show photo ${i + 1}`}
                    className={`overflow-hidden rounded-lg border-2 ${i === photo ? 'border-thread' : 'border-line'}`}
                  >
                    <img src={ph.thumbnailUrl} alt="" width={64} height={64} loading="lazy" className="size-16 object-cover" />
                  </button>
                </li>
              ))}
            </ul>
          ) : null}
        </div>
        <div className="flex flex-col gap-4">
          <p className="text-sm font-bold tracking-wide text-thread-deep uppercase">{c.blank.label}</p>
          <h1 className="text-3xl font-extrabold tracking-tight sm:text-4xl">{c.title}</h1>
          <p>
            by{' '}
            <Link to={paths.shopPage.getHref(l.shop.slug)} className="font-bold text-thread-deep underline decoration-thread/50 hover:decoration-thread">
              {l.shop.name}
            </Link>
          </p>
          {l.rating.count ? (
            <a href="#reviews" className="self-start rounded hover:underline">
              <RatingLine summary={l.rating} />
            </a>
          ) : null}
          <p className="text-2xl font-black">
            <span className="text-base font-semibold text-ink-soft">from </span>
            {formatMoney(l.priceMinor, l.currency)}
          </p>
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1.5 text-sm">
            <dt className="font-bold">Made and sent within</dt>
            <dd>
              {l.shop.processingDays} working {l.shop.processingDays === 1 ? 'day' : 'days'}
            </dd>
            <dt className="font-bold">Shipping</dt>
            <dd>{l.shop.shippingMinor === 0 ? 'Free' : `${formatMoney(l.shop.shippingMinor, l.shop.currency)} per order from this shop`}</dd>
            <dt className="font-bold">Print area</dt>
            <dd>{formatSize(c.blank.widthMm, c.blank.heightMm)}</dd>
            {c.occasions.length ? (
              <>
                <dt className="font-bold">Occasions</dt>
                <dd>{c.occasions.map((o) => OCCASION_LABELS[o]).join(', ')}</dd>
              </>
            ) : null}
          </dl>
          <ListingDates slug={slug} />
          {l.descriptionHtml ? (
            // rendered by the server with raw HTML escaped (server/features/catalog/markdown.ts)
            <div className="prose-sm flex flex-col gap-2 text-ink-soft [&_a]:text-thread-deep [&_a]:underline" dangerouslySetInnerHTML={{ __html: l.descriptionHtml }} />
          ) : null}
          {l.safetyNotes ? (
            <section aria-labelledby="safety-title" className="rounded-lg border-2 border-danger bg-danger-wash p-4">
              <h2 id="safety-title" className="font-extrabold">
                Safety: small parts
              </h2>
              <ul className="mt-1 list-disc pl-5 text-sm">
                {l.safetyNotes.map((n) => (
                  <li key={n}>{n}</li>
                ))}
              </ul>
            </section>
          ) : null}
        </div>
      </div>

      <section ref={personaliserRef} aria-labelledby="personalise-title" className="flex flex-col gap-5">
        <div>
          <h2 id="personalise-title" className="text-2xl font-extrabold">
            Personalise it
          </h2>
          <p className="text-ink-soft">Type the name and pick the colours. The preview is set in the very font the shop will cut, to scale on the {c.blank.label.toLowerCase()}.</p>
        </div>
        {/* first paint: the server-made preview; the personaliser (and its font engine) loads once wanted */}
        {wanted ? (
          <Suspense fallback={<ListingPreview listing={l} label={previewLabel} />}>
            <Personaliser listing={l} addToCart={(input) => addLine.mutateAsync(input)} cartHref={paths.cart.getHref()} />
          </Suspense>
        ) : (
          <ListingPreview listing={l} label={previewLabel} />
        )}
      </section>

      <div className="grid gap-5 md:grid-cols-2">
        <Card>
          <h2 className="text-lg font-extrabold">Care card</h2>
          <ul className="mt-2 list-disc pl-5">
            {l.careCard.map((n) => (
              <li key={n}>{n}</li>
            ))}
          </ul>
        </Card>
        <Card>
          <h2 className="text-lg font-extrabold">Returns at {l.shop.name}</h2>
          <p className="mt-2 text-ink-soft">{l.shop.returnPolicy || 'Ask the shop about returns.'}</p>
        </Card>
      </div>
      <Suspense fallback={<Spinner label="Loading reviews…" />}>
        <ReviewList source={{ kind: 'listings', slug: l.slug }} shopName={l.shop.name} isAdmin={me.data?.user.role === 'admin'} />
      </Suspense>
    </div>
  );
}

/** The width of a photo's thumbnail: the server fits it inside 480 px (server/integrations/storage.ts, thumbSide). */
const thumbWidth = (p: { width: number; height: number }) => Math.round(p.width * Math.min(1, 480 / Math.max(p.width, p.height)));
