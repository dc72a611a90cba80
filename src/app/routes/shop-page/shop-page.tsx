import { useParams } from 'react-router-dom';
import { formatMoney } from '../../../../shared/money.ts';
import { Spinner } from '../../../components/ui/button.tsx';
import { Card, PageHeading, StitchedBox } from '../../../components/ui/card.tsx';
import { useMe } from '../../../features/auth/api/get-me.ts';
import { useShop } from '../../../features/catalog/api/get-shop.ts';
import { ListingGrid } from '../../../features/catalog/components/listing-card.tsx';
import { ReviewList } from '../../../features/reviews/components/review-list.tsx';
import { RatingLine } from '../../../features/reviews/components/stars.tsx';
import { isApiError } from '../../../lib/api-client.ts';
import { NotFoundPage } from '../errors/not-found.tsx';

/** /shops/:slug — a live shop's public page with its live listings only. */
export function ShopPage() {
  const { slug = '' } = useParams();
  const shop = useShop(slug);
  const me = useMe();
  if (shop.isPending) return <Spinner label="Loading the shop…" />;
  if (shop.isError) return isApiError(shop.error) && shop.error.status === 404 ? <NotFoundPage /> : <p role="alert">{shop.error.message}</p>;
  const { shop: s, listings, rating } = shop.data;
  return (
    <div className="flex flex-col gap-10">
      <div className="flex flex-col gap-6 md:flex-row md:items-start">
        {s.logoUrl ? <img src={s.logoUrl} alt="" width={96} height={96} className="size-24 shrink-0 rounded-lg border border-line bg-white object-cover" /> : null}
        <div className="flex-1">
          <PageHeading eyebrow="Shop" title={s.name} lead={s.description || undefined} />
          {rating.count ? (
            <a href="#reviews" className="rounded hover:underline">
              <RatingLine summary={rating} />
            </a>
          ) : null}
        </div>
      </div>
      <dl className="grid gap-4 sm:grid-cols-3">
        <Card className="!p-5">
          <dt className="text-sm font-bold text-ink-soft">Made and sent within</dt>
          <dd className="text-lg font-extrabold">
            {s.processingDays} working {s.processingDays === 1 ? 'day' : 'days'}
          </dd>
        </Card>
        <Card className="!p-5">
          <dt className="text-sm font-bold text-ink-soft">Shipping per order</dt>
          <dd className="text-lg font-extrabold">{s.shippingMinor === 0 ? 'Free' : formatMoney(s.shippingMinor, s.currency)}</dd>
        </Card>
        <Card className="!p-5">
          <dt className="text-sm font-bold text-ink-soft">Returns</dt>
          <dd className="text-sm">{s.returnPolicy || 'Ask the shop.'}</dd>
        </Card>
      </dl>
      <section aria-labelledby="shop-listings" className="flex flex-col gap-4">
        <h2 id="shop-listings" className="text-2xl font-extrabold">
          On sale at {s.name}
        </h2>
        {listings.length === 0 ? <StitchedBox className="py-10 text-center text-ink-soft">This shop has nothing on sale right now.</StitchedBox> : <ListingGrid items={listings} />}
      </section>
      <ReviewList source={{ kind: 'shops', slug: s.slug }} shopName={s.name} isAdmin={me.data?.user.role === 'admin'} />
    </div>
  );
}
