/**
 * What crawlers and shared links read in a server-rendered page's <head>: title, description,
 * canonical URL, Open Graph and Twitter card tags (always with an image), and for a listing the
 * schema.org Product JSON-LD with its offer. Pure: data in, HTML text out.
 */
import { minorDigits } from '../../../shared/money.ts';
import { stockKey } from '../../../shared/schemas/blanks.ts';
import type { ListingPage, PublicShop } from '../../../shared/schemas/catalog.ts';
import { paths } from '../../config/paths.ts';
import { jsonForScript } from './query-state.ts';

export const SITE_NAME = 'Namesake';
/** the social card of pages without a picture of their own (public/social-card.png) */
export const DEFAULT_CARD = { path: '/social-card.png', width: 1200, height: 630, alt: 'Namesake: personalised totes, tees and pouches from small craft studios' };
export const DEFAULT_DESCRIPTION = "Personalised tote bags, kids' tees and pouches, cut in vinyl and pressed by hand by small craft studios. See the name to scale before it is cut.";

/** The listing's social card: its design on its blank, rendered by the server (server/features/listing-images). */
export const listingImagePath = (slug: string) => paths.listingImage.getHref(slug, 'png');
export const LISTING_IMAGE_SIZE = { width: 1200, height: 630 };

export type PageMeta = {
  title: string;
  description: string;
  /** absolute */
  canonical: string;
  image: { url: string; width: number; height: number; alt: string };
  type: 'website' | 'product' | 'profile';
  noindex?: boolean;
  jsonLd?: object;
};

const escapeHtml = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

/** The description as plain text, cut at a word to at most `max` characters. */
export function plainText(html: string, max = 160): string {
  const text = html
    .replace(/<[^>]*>/g, ' ')
    .replace(/&lt;/g, '<')
    .replace(/&gt;/g, '>')
    .replace(/&quot;/g, '"')
    .replace(/&#39;/g, "'")
    .replace(/&amp;/g, '&')
    .replace(/\s+/g, ' ')
    .trim();
  if (text.length <= max) return text;
  const cut = text.slice(0, max - 1);
  return `${cut.slice(0, Math.max(cut.lastIndexOf(' '), max / 2)).trimEnd()}…`;
}

/** A price in minor units as the decimal string schema.org's `price` takes ("12.50", "1200"). */
export function decimalPrice(amountMinor: number, currency: string): string {
  const digits = minorDigits(currency);
  return digits === 0 ? String(amountMinor) : (amountMinor / 10 ** digits).toFixed(digits);
}

export function renderHead(m: PageMeta): string {
  const tags = [
    `<title>${escapeHtml(m.title)}</title>`,
    `<meta name="description" content="${escapeHtml(m.description)}" />`,
    `<link rel="canonical" href="${escapeHtml(m.canonical)}" />`,
    m.noindex ? '<meta name="robots" content="noindex" />' : '',
    `<meta property="og:site_name" content="${SITE_NAME}" />`,
    `<meta property="og:type" content="${m.type}" />`,
    `<meta property="og:title" content="${escapeHtml(m.title)}" />`,
    `<meta property="og:description" content="${escapeHtml(m.description)}" />`,
    `<meta property="og:url" content="${escapeHtml(m.canonical)}" />`,
    `<meta property="og:image" content="${escapeHtml(m.image.url)}" />`,
    `<meta property="og:image:width" content="${m.image.width}" />`,
    `<meta property="og:image:height" content="${m.image.height}" />`,
    `<meta property="og:image:alt" content="${escapeHtml(m.image.alt)}" />`,
    '<meta name="twitter:card" content="summary_large_image" />',
    `<meta name="twitter:title" content="${escapeHtml(m.title)}" />`,
    `<meta name="twitter:description" content="${escapeHtml(m.description)}" />`,
    `<meta name="twitter:image" content="${escapeHtml(m.image.url)}" />`,
    `<meta name="twitter:image:alt" content="${escapeHtml(m.image.alt)}" />`,
    m.jsonLd ? `<script type="application/ld+json">${jsonForScript(m.jsonLd)}</script>` : '',
  ];
  return tags.filter(Boolean).join('\n    ');
}

const defaultImage = (origin: string): PageMeta['image'] => ({ ...DEFAULT_CARD, url: origin + DEFAULT_CARD.path });

/**
 * schema.org Product with one Offer (https://schema.org/Product, https://schema.org/Offer). A live
 * listing is made to order and can always be bought. `extra` is where more Product properties join
 * (e.g. aggregateRating once reviews exist).
 */
export function productJsonLd(l: ListingPage, origin: string, extra: Record<string, unknown> = {}): Record<string, unknown> {
  const url = origin + paths.listing.getHref(l.slug);
  return {
    '@context': 'https://schema.org',
    '@type': 'Product',
    name: l.content.title,
    description: plainText(l.descriptionHtml, 5000) || undefined,
    image: [origin + listingImagePath(l.slug), ...l.photos.map((p) => origin + p.url)],
    sku: l.id,
    url,
    category: l.content.blank.label,
    brand: { '@type': 'Brand', name: l.shop.name },
    offers: {
      '@type': 'Offer',
      url,
      price: decimalPrice(l.priceMinor, l.currency),
      priceCurrency: l.currency,
      availability: anyInStock(l) ? 'https://schema.org/InStock' : 'https://schema.org/OutOfStock',
      itemCondition: 'https://schema.org/NewCondition',
      seller: { '@type': 'Organization', name: l.shop.name, url: origin + paths.shopPage.getHref(l.shop.slug) },
    },
    ...(l.rating.count > 0 ? { aggregateRating: { '@type': 'AggregateRating', ratingValue: l.rating.average, reviewCount: l.rating.count, bestRating: 5, worstRating: 1 } } : {}),
    ...extra,
  };
}

/** Made to order: in stock unless every size × colour the listing offers is sold out. */
function anyInStock(l: ListingPage): boolean {
  const o = l.blankOffer;
  if (!o) return true;
  const sizes = o.sizes.length ? o.sizes.map((s) => s.id) : [''];
  const colours = o.colours.length ? o.colours.map((c) => c.id) : [''];
  return sizes.some((s) => colours.some((c) => !o.soldOut.includes(stockKey(s, c))));
}

export function homeMeta(origin: string): PageMeta {
  return {
    title: "Namesake · personalised totes, kids' tees and pouches",
    description: DEFAULT_DESCRIPTION,
    canonical: `${origin}/`,
    image: defaultImage(origin),
    type: 'website',
  };
}

export function searchMeta(origin: string, url: URL, heading: string, total: number | null): PageMeta {
  const keep = new URLSearchParams();
  for (const k of ['q', 'occasion', 'blank', 'shop', 'page']) {
    const v = url.searchParams.get(k);
    if (v && !(k === 'page' && v === '1')) keep.set(k, v);
  }
  const qs = keep.toString();
  return {
    title: `${heading} · ${SITE_NAME}`,
    description:
      total === null
        ? DEFAULT_DESCRIPTION
        : `${total} personalised ${total === 1 ? 'item' : 'items'} from small craft studios: ${heading.toLowerCase()}. Type the name and see it to scale before it is cut.`,
    canonical: `${origin}/search${qs ? `?${qs}` : ''}`,
    image: defaultImage(origin),
    type: 'website',
  };
}

export function listingMeta(origin: string, l: ListingPage): PageMeta {
  const description = plainText(l.descriptionHtml) || `${l.content.title}, personalised with your name and made by ${l.shop.name}.`;
  return {
    title: `${l.content.title} · ${l.shop.name} · ${SITE_NAME}`,
    description,
    canonical: origin + paths.listing.getHref(l.slug),
    image: { url: origin + listingImagePath(l.slug), ...LISTING_IMAGE_SIZE, alt: `${l.content.title}: the design on the ${l.content.blank.label.toLowerCase()}` },
    type: 'product',
    jsonLd: productJsonLd(l, origin),
  };
}

export function shopMeta(origin: string, s: PublicShop): PageMeta {
  return {
    title: `${s.shop.name} · ${SITE_NAME}`,
    description: plainText(s.shop.description) || `${s.shop.name} personalises ${s.listings.length} ${s.listings.length === 1 ? 'item' : 'items'} on ${SITE_NAME}.`,
    canonical: origin + paths.shopPage.getHref(s.shop.slug),
    image: s.listings[0] ? { url: origin + listingImagePath(s.listings[0].slug), ...LISTING_IMAGE_SIZE, alt: `${s.listings[0].title} from ${s.shop.name}` } : defaultImage(origin),
    type: 'profile',
  };
}

export function notFoundMeta(origin: string, url: URL): PageMeta {
  return {
    title: `Page not found · ${SITE_NAME}`,
    description: 'This page does not exist on Namesake.',
    canonical: origin + url.pathname,
    image: defaultImage(origin),
    type: 'website',
    noindex: true,
  };
}
