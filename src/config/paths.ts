/**
 * Every URL of the client app, with href builders. Components link through these, never through
 * string literals, so a route can move in one place.
 */
export type Occasion = (typeof occasions)[number]['slug'];

export const occasions = [
  { slug: 'autumn-harvest', label: 'Autumn harvest' },
  { slug: 'winter-lights', label: 'Winter lights' },
  { slug: 'spring-picnic', label: 'Spring picnic' },
  { slug: 'back-to-school', label: 'Back to school' },
  { slug: 'birthday', label: 'Birthday' },
] as const;

function withQuery(path: string, query: Record<string, string | undefined>): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) if (value) params.set(key, value);
  const qs = params.toString();
  return qs ? `${path}?${qs}` : path;
}

export const paths = {
  home: { path: '/', getHref: () => '/' },
  search: {
    path: '/search',
    getHref: (query: { q?: string; occasion?: string; blank?: string; shop?: string; minPrice?: string; maxPrice?: string; sort?: string; page?: string } = {}) => withQuery('/search', query),
  },
  listing: { path: '/listings/:slug', getHref: (slug: string) => `/listings/${encodeURIComponent(slug)}` },
  /** a listing's design on its blank, drawn by the server (server/features/listing-images) */
  listingImage: {
    path: '/listing-images/:file',
    getHref: (slug: string, format: 'png' | 'webp' = 'png', size: 'social' | 'card' = 'social') => `/listing-images/${encodeURIComponent(slug)}${size === 'card' ? '.card' : ''}.${format}`,
  },
  shopPage: { path: '/shops/:slug', getHref: (slug: string) => `/shops/${encodeURIComponent(slug)}` },
  cart: { path: '/cart', getHref: () => '/cart' },
  orders: { path: '/orders', getHref: () => '/orders' },
  orderDetail: { path: '/orders/:orderId', getHref: (orderId: string) => `/orders/${encodeURIComponent(orderId)}` },
  checkoutReturn: { path: '/checkout/return', getHref: (sessionId: string) => withQuery('/checkout/return', { session_id: sessionId }) },
  openShop: { path: '/open-shop', getHref: () => '/open-shop' },
  workroom: { path: '/workroom', getHref: () => '/workroom' },
  workroomOrder: { path: '/workroom/orders/:orderId', getHref: (orderId: string) => `/workroom/orders/${encodeURIComponent(orderId)}` },
  workroomProof: { path: '/workroom/lines/:lineId', getHref: (lineId: string) => `/workroom/lines/${encodeURIComponent(lineId)}` },
  workroomCutSheets: { path: '/workroom/cut-sheets', getHref: (batchId?: string) => withQuery('/workroom/cut-sheets', { batch: batchId }) },
  workroomPress: { path: '/workroom/press', getHref: () => '/workroom/press' },
  workroomPressRun: { path: '/workroom/press/run', getHref: () => '/workroom/press/run' },
  workroomStock: { path: '/workroom/stock', getHref: () => '/workroom/stock' },
  seller: {
    shop: { path: '/workroom/shop', getHref: () => '/workroom/shop' },
    materials: { path: '/workroom/materials', getHref: () => '/workroom/materials' },
    blanks: { path: '/workroom/blanks', getHref: () => '/workroom/blanks' },
    listings: { path: '/workroom/listings', getHref: () => '/workroom/listings' },
    offers: { path: '/workroom/offers', getHref: () => '/workroom/offers' },
    newListing: { path: '/workroom/listings/new', getHref: () => '/workroom/listings/new' },
    editListing: { path: '/workroom/listings/:id/edit', getHref: (id: string) => `/workroom/listings/${encodeURIComponent(id)}/edit` },
  },
  business: {
    overview: { path: '/workroom/business', getHref: () => '/workroom/business' },
    payouts: { path: '/workroom/business/payouts', getHref: () => '/workroom/business/payouts' },
    settings: { path: '/workroom/business/settings', getHref: () => '/workroom/business/settings' },
  },
  moderation: {
    desk: { path: '/moderation', getHref: () => '/moderation' },
    reviewListing: { path: '/moderation/listings/:id', getHref: (id: string) => `/moderation/listings/${encodeURIComponent(id)}` },
    audit: { path: '/moderation/audit', getHref: () => '/moderation/audit' },
    mail: {
      path: '/moderation/mail',
      getHref: (messageId?: string, page?: number) => withQuery('/moderation/mail', { message: messageId, page: page && page > 1 ? String(page) : undefined }),
    },
  },
  auth: {
    signIn: { path: '/sign-in', getHref: (next?: string) => withQuery('/sign-in', { next: next && next !== '/' ? next : undefined }) },
    signUp: { path: '/sign-up', getHref: (next?: string) => withQuery('/sign-up', { next: next && next !== '/' ? next : undefined }) },
    forgotPassword: { path: '/forgot-password', getHref: () => '/forgot-password' },
    resetPassword: { path: '/reset-password', getHref: (token?: string) => withQuery('/reset-password', { token }) },
  },
} as const;

/**
 * Where to go after signing in. Only same-origin paths are allowed ("/x", never "//evil" or
 * "/\evil", which browsers treat as another host), so a crafted link can't bounce users away.
 */
export function safeNextPath(next: string | null | undefined): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return paths.home.getHref();
  if (next.startsWith(paths.auth.signIn.path) || next.startsWith(paths.auth.signUp.path)) return paths.home.getHref();
  return next;
}
