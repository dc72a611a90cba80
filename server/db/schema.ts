// Namesake's tables. snake_case in SQL, camelCase in TS. Money: integer minor units.
// Lengths: millimetres (real). Temperatures: °C. Timestamps: integer ms since epoch.
// JSON columns hold plain data validated by the shared zod schemas before they are written.
import { sql } from 'drizzle-orm';
import { index, integer, real, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core';
import type { WeedingRates } from '../../shared/business/labour.ts';
import type { StoredMotifGeometry } from '../../shared/engine/motif.ts';
import type { BlankColour, BlankSize } from '../../shared/schemas/blanks.ts';
import type { LineSnapshot } from '../../shared/schemas/cart.ts';
import type { PricedCheckout, ShipTo } from '../../shared/schemas/checkout.ts';
import type { ListingContent } from '../../shared/schemas/listing.ts';
import type { SheetLayout, StoredSheetPiece } from '../../shared/schemas/workroom.ts';
import { user } from './auth-schema.ts';

export * from './auth-schema.ts';

const id = () => text('id').primaryKey();
const createdAt = () => integer('created_at').notNull();
const json = <T>(name: string) => text(name, { mode: 'json' }).$type<T>();

// ---------------------------------------------------------------- shops
/** Only the fields the seller changed; the live shop keeps its approved values until approval. */
export type ShopChange = { name?: string; description?: string; submittedAt: number };
export const shops = sqliteTable(
  'shops',
  {
    id: id(),
    ownerId: text('owner_id')
      .notNull()
      .references(() => user.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    slug: text('slug').notNull(),
    description: text('description').notNull().default(''),
    logoPath: text('logo_path'),
    /** in_review | live | suspended | rejected */
    state: text('state').notNull().default('in_review'),
    stateReason: text('state_reason'),
    currency: text('currency').notNull().default('USD'),
    processingDays: integer('processing_days').notNull().default(3),
    shippingMinor: integer('shipping_minor').notNull().default(0),
    /** the shop's own estimate of the parcel's time in the post, in working days (needed-by dates) */
    shippingDays: integer('shipping_days').notNull().default(3),
    returnPolicy: text('return_policy').notNull().default(''),
    /** handheld | clamshell */
    pressType: text('press_type').notNull().default('clamshell'),
    /** ISO weekday numbers 1 (Mon) … 7 (Sun) the shop works on */
    workingDays: json<number[]>('working_days').notNull().default([1, 2, 3, 4, 5]),
    daysOff: json<string[]>('days_off').notNull().default([]),
    hourlyRateMinor: integer('hourly_rate_minor').notNull().default(0),
    /** the shop presses each item once more from the back after the final press (the press run shows the step) */
    backPress: integer('back_press', { mode: 'boolean' }).notNull().default(false),
    /** the shop's own weeding rates (shared/business/labour.ts); null: the default rates */
    weedingRates: json<WeedingRates>('weeding_rates'),
    paymentAccountId: text('payment_account_id'),
    /** a change of name/description to a shop already approved, waiting for moderation (null: none) */
    pendingChange: json<ShopChange>('pending_change'),
    /** bumped whenever the pending change is altered; an admin's decision names the one it saw */
    changeRevision: integer('change_revision').notNull().default(0),
    /** why the last name/description change was not approved (cleared by the next change) */
    changeRejectionReason: text('change_rejection_reason'),
    createdAt: createdAt(),
    updatedAt: integer('updated_at').notNull(),
  },
  (t) => [uniqueIndex('shops_slug_uq').on(t.slug), uniqueIndex('shops_owner_uq').on(t.ownerId)],
);

// ---------------------------------------------------------------- materials (vinyl stock)
export type PressProfile = {
  handheld: { tempC: number; timeS: number };
  clamshell: { tempC: number; timeS: number };
  tackS: number;
  peel: 'hot' | 'warm' | 'cold' | 'hot or cold';
  topOnly: boolean;
  coolS?: number;
};
export const materials = sqliteTable(
  'materials',
  {
    id: id(),
    shopId: text('shop_id')
      .notNull()
      .references(() => shops.id, { onDelete: 'cascade' }),
    /** smooth | glitter | flock | metallic | patterned */
    kind: text('kind').notNull(),
    colourName: text('colour_name').notNull(),
    colourHex: text('colour_hex').notNull(),
    rollWidthMm: real('roll_width_mm').notNull(),
    stockMm: real('stock_mm').notNull(),
    lowStockMm: real('low_stock_mm').notNull().default(1000),
    pricePerMetreMinor: integer('price_per_metre_minor').notNull().default(0),
    pressProfile: json<PressProfile>('press_profile').notNull(),
    archived: integer('archived', { mode: 'boolean' }).notNull().default(false),
    createdAt: createdAt(),
  },
  (t) => [index('materials_shop_idx').on(t.shopId)],
);

// ---------------------------------------------------------------- motifs (sanitised, normalised geometry)
export const motifs = sqliteTable(
  'motifs',
  {
    id: id(),
    shopId: text('shop_id')
      .notNull()
      .references(() => shops.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    /** the engine's normalised motif: layers with path data in mm, bbox, area */
    geometry: json<StoredMotifGeometry>('geometry').notNull(),
    /** shared/engine/motif-fingerprint.ts of the geometry: the same artwork in two shops is flagged in review */
    geometryHash: text('geometry_hash'),
    createdAt: createdAt(),
  },
  (t) => [index('motifs_shop_idx').on(t.shopId), index('motifs_geometry_hash_idx').on(t.geometryHash)],
);

// ---------------------------------------------------------------- uploads (photos, logos)
export const uploads = sqliteTable('uploads', {
  id: id(),
  ownerId: text('owner_id')
    .notNull()
    .references(() => user.id, { onDelete: 'cascade' }),
  shopId: text('shop_id').references(() => shops.id, { onDelete: 'cascade' }),
  /** photo | logo */
  kind: text('kind').notNull(),
  path: text('path').notNull(),
  thumbPath: text('thumb_path').notNull(),
  mime: text('mime').notNull(),
  width: integer('width').notNull(),
  height: integer('height').notNull(),
  bytes: integer('bytes').notNull(),
  createdAt: createdAt(),
});

// ---------------------------------------------------------------- listings
export const listings = sqliteTable(
  'listings',
  {
    id: id(),
    shopId: text('shop_id')
      .notNull()
      .references(() => shops.id, { onDelete: 'cascade' }),
    slug: text('slug').notNull(),
    /** draft | in_review | live | rejected | paused */
    state: text('state').notNull().default('draft'),
    /** the seller's working copy (what the editor shows and review checks), as the editor's schema outputs it */
    draft: json<ListingContent>('draft').notNull(),
    /** the approved copy on sale; stays on sale while an edit waits for review */
    live: json<ListingContent>('live'),
    /** true when the working copy has changes not yet approved */
    pendingReview: integer('pending_review', { mode: 'boolean' }).notNull().default(false),
    /** bumped on every seller edit of the working copy; approve/reject name the revision reviewed */
    revision: integer('revision').notNull().default(1),
    rejectionReason: text('rejection_reason'),
    // denormalised from `live` for the catalogue's filters and sort
    liveTitle: text('live_title'),
    livePriceMinor: integer('live_price_minor'),
    liveBlankKind: text('live_blank_kind'),
    /** the live occasions as `,slug,slug,` so a filter is one LIKE '%,slug,%' */
    liveOccasions: text('live_occasions'),
    /** the live copy's first photo's thumbnail file name (under /uploads), for catalogue cards */
    liveThumbPath: text('live_thumb_path'),
    currency: text('currency').notNull().default('USD'),
    publishedAt: integer('published_at'),
    createdAt: createdAt(),
    updatedAt: integer('updated_at').notNull(),
  },
  (t) => [uniqueIndex('listings_slug_uq').on(t.slug), index('listings_shop_idx').on(t.shopId), index('listings_state_idx').on(t.state), index('listings_catalog_idx').on(t.state, t.publishedAt)],
);

// ---------------------------------------------------------------- moderation audit log
export const auditLog = sqliteTable(
  'audit_log',
  {
    id: id(),
    actorId: text('actor_id')
      .notNull()
      .references(() => user.id),
    /** e.g. listing.approve, listing.reject, shop.approve, shop.suspend, shop.restore, order.refund */
    action: text('action').notNull(),
    subjectType: text('subject_type').notNull(),
    subjectId: text('subject_id').notNull(),
    reason: text('reason'),
    createdAt: createdAt(),
  },
  (t) => [index('audit_created_idx').on(t.createdAt)],
);

// ---------------------------------------------------------------- carts
export const carts = sqliteTable(
  'carts',
  {
    id: id(),
    /** null for a guest cart (identified by its id in an HttpOnly cookie) */
    userId: text('user_id').references(() => user.id, { onDelete: 'cascade' }),
    /** bumped on every change; a checkout is made for one (cart, version), so two tabs share it */
    version: integer('version').notNull().default(1),
    createdAt: createdAt(),
    updatedAt: integer('updated_at').notNull(),
  },
  (t) => [index('carts_user_idx').on(t.userId)],
);

export const cartLines = sqliteTable('cart_lines', {
  id: id(),
  cartId: text('cart_id')
    .notNull()
    .references(() => carts.id, { onDelete: 'cascade' }),
  listingId: text('listing_id')
    .notNull()
    .references(() => listings.id),
  quantity: integer('quantity').notNull().default(1),
  /** immutable snapshot of the shopper's choices and the computed geometry summary */
  snapshot: json<LineSnapshot>('snapshot').notNull(),
  createdAt: createdAt(),
});

// ---------------------------------------------------------------- checkouts, orders, lines
export const checkouts = sqliteTable(
  'checkouts',
  {
    id: id(),
    userId: text('user_id')
      .notNull()
      .references(() => user.id),
    cartId: text('cart_id').notNull(),
    cartVersion: integer('cart_version').notNull().default(0),
    /** open | paid | expired | cancelled */
    state: text('state').notNull().default('open'),
    providerSessionId: text('provider_session_id'),
    currency: text('currency').notNull(),
    totalMinor: integer('total_minor').notNull(),
    /** the priced cart frozen at session creation: shops, lines, shipping */
    priced: json<PricedCheckout>('priced').notNull(),
    paymentIntentId: text('payment_intent_id'),
    chargeId: text('charge_id'),
    /** set when the confirmation e-mails were handed to the mailer (sent once) */
    mailedAt: integer('mailed_at'),
    createdAt: createdAt(),
    paidAt: integer('paid_at'),
  },
  (t) => [uniqueIndex('checkouts_session_uq').on(t.providerSessionId), uniqueIndex('checkouts_cart_version_uq').on(t.cartId, t.cartVersion)],
);

export const orders = sqliteTable(
  'orders',
  {
    id: id(),
    /** a short number shown to people, e.g. NS-1042 */
    number: text('number').notNull(),
    checkoutId: text('checkout_id')
      .notNull()
      .references(() => checkouts.id),
    shopId: text('shop_id')
      .notNull()
      .references(() => shops.id),
    buyerId: text('buyer_id')
      .notNull()
      .references(() => user.id),
    currency: text('currency').notNull(),
    subtotalMinor: integer('subtotal_minor').notNull(),
    shippingMinor: integer('shipping_minor').notNull(),
    platformFeeMinor: integer('platform_fee_minor').notNull(),
    totalMinor: integer('total_minor').notNull(),
    transferId: text('transfer_id'),
    /**
     * The payout call claimed and not yet recorded (a transfer to the shop or a reversal of it), with
     * its Idempotency-Key and amount frozen, so a retry after a crash sends exactly the same request.
     */
    payoutStep: json<PayoutStep>('payout_step'),
    /** how many payout calls were claimed: numbers the keys of later ones */
    payoutSeq: integer('payout_seq').notNull().default(0),
    shipTo: json<ShipTo>('ship_to'),
    carrier: text('carrier'),
    trackingNumber: text('tracking_number'),
    shipByDate: text('ship_by_date'),
    /** the shopper's "needed by" date for this shop's parcel ('yyyy-MM-dd'), or null */
    neededBy: text('needed_by'),
    /** what the shop's discount code took off the lines (subtotal − discount + shipping = total) */
    discountMinor: integer('discount_minor').notNull().default(0),
    discountCode: text('discount_code'),
    paidAt: integer('paid_at').notNull(),
    shippedAt: integer('shipped_at'),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex('orders_number_uq').on(t.number),
    uniqueIndex('orders_checkout_shop_uq').on(t.checkoutId, t.shopId),
    index('orders_shop_idx').on(t.shopId),
    index('orders_buyer_idx').on(t.buyerId),
  ],
);

export type PayoutStep = { kind: 'transfer' | 'reversal'; key: string; amountMinor: number; destination?: string };

export const orderLines = sqliteTable(
  'order_lines',
  {
    id: id(),
    orderId: text('order_id')
      .notNull()
      .references(() => orders.id, { onDelete: 'cascade' }),
    listingId: text('listing_id')
      .notNull()
      .references(() => listings.id),
    listingTitle: text('listing_title').notNull(),
    quantity: integer('quantity').notNull(),
    unitPriceMinor: integer('unit_price_minor').notNull(),
    /** what the shopper paid for the line: unit price × quantity − its share of the order's discount */
    totalMinor: integer('total_minor').notNull(),
    /** the line's share of the order's discount (largest remainder, so the shares sum exactly) */
    discountMinor: integer('discount_minor').notNull().default(0),
    /** awaiting_proof | changes_requested | approved | cut | pressed | shipped | cancelled | refunded */
    state: text('state').notNull().default('awaiting_proof'),
    /** the current personalisation snapshot (latest version) */
    snapshot: json<LineSnapshot>('snapshot').notNull(),
    version: integer('version').notNull().default(1),
    refundedMinor: integer('refunded_minor').notNull().default(0),
    createdAt: createdAt(),
    updatedAt: integer('updated_at').notNull(),
  },
  (t) => [index('order_lines_order_idx').on(t.orderId), index('order_lines_state_idx').on(t.state)],
);

/** every personalisation version a line has had (proof history) */
export const lineVersions = sqliteTable(
  'line_versions',
  {
    id: id(),
    lineId: text('line_id')
      .notNull()
      .references(() => orderLines.id, { onDelete: 'cascade' }),
    version: integer('version').notNull(),
    snapshot: json<LineSnapshot>('snapshot').notNull(),
    authorId: text('author_id').references(() => user.id),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('line_versions_uq').on(t.lineId, t.version)],
);

/** the timeline: every state change and message on a line (who, when) */
export const lineEvents = sqliteTable(
  'line_events',
  {
    id: id(),
    lineId: text('line_id')
      .notNull()
      .references(() => orderLines.id, { onDelete: 'cascade' }),
    actorId: text('actor_id').references(() => user.id),
    fromState: text('from_state'),
    toState: text('to_state').notNull(),
    message: text('message'),
    createdAt: createdAt(),
  },
  (t) => [index('line_events_line_idx').on(t.lineId)],
);

// ---------------------------------------------------------------- money movements
export const ledger = sqliteTable(
  'ledger',
  {
    id: id(),
    shopId: text('shop_id')
      .notNull()
      .references(() => shops.id),
    orderId: text('order_id').references(() => orders.id),
    /** charge | platform_fee | transfer | refund | refund_reversal */
    kind: text('kind').notNull(),
    amountMinor: integer('amount_minor').notNull(),
    currency: text('currency').notNull(),
    providerRef: text('provider_ref'),
    memo: text('memo'),
    createdAt: createdAt(),
  },
  (t) => [index('ledger_shop_idx').on(t.shopId, t.createdAt)],
);

export const refunds = sqliteTable('refunds', {
  id: id(),
  orderId: text('order_id')
    .notNull()
    .references(() => orders.id),
  lineId: text('line_id').references(() => orderLines.id),
  amountMinor: integer('amount_minor').notNull(),
  providerRefundId: text('provider_refund_id'),
  actorId: text('actor_id')
    .notNull()
    .references(() => user.id),
  reason: text('reason'),
  createdAt: createdAt(),
});

/**
 * A refund claimed before the provider is asked: the amount is taken from what is left to refund in
 * one transaction, so two requests at once can never give back more than was paid. `scope` is
 * `line:<id>` or `remainder`; at most one pending or succeeded intent per (order, scope).
 */
export const refundIntents = sqliteTable(
  'refund_intents',
  {
    id: id(),
    orderId: text('order_id')
      .notNull()
      .references(() => orders.id),
    lineId: text('line_id').references(() => orderLines.id),
    scope: text('scope').notNull(),
    idempotencyKey: text('idempotency_key').notNull(),
    amountMinor: integer('amount_minor').notNull(),
    /** pending | succeeded | failed */
    state: text('state').notNull().default('pending'),
    providerRefundId: text('provider_refund_id'),
    actorId: text('actor_id')
      .notNull()
      .references(() => user.id),
    reason: text('reason'),
    error: text('error'),
    createdAt: createdAt(),
    updatedAt: integer('updated_at').notNull(),
  },
  (t) => [uniqueIndex('refund_intents_key_uq').on(t.idempotencyKey), uniqueIndex('refund_intents_live_uq').on(t.orderId, t.scope).where(sql`state <> 'failed'`)],
);

/** payment-provider webhook events already processed (each handled once) */
export const webhookEvents = sqliteTable('webhook_events', {
  id: text('id').primaryKey(),
  type: text('type').notNull(),
  processedAt: integer('processed_at').notNull(),
});

// ---------------------------------------------------------------- workroom: cut sheets
export const cutSheets = sqliteTable(
  'cut_sheets',
  {
    id: id(),
    shopId: text('shop_id')
      .notNull()
      .references(() => shops.id, { onDelete: 'cascade' }),
    materialId: text('material_id')
      .notNull()
      .references(() => materials.id),
    batchId: text('batch_id').notNull(),
    rollWidthMm: real('roll_width_mm').notNull(),
    lengthMm: real('length_mm').notNull(),
    utilisation: real('utilisation').notNull(),
    /** nested pieces: [{ lineId, layerId, xMm, yMm, widthMm, heightMm, rotated, path }] */
    pieces: json<StoredSheetPiece[]>('pieces').notNull(),
    /** order groups (weeding borders, lines, labels) and the tightest nest's length; null = tightest */
    layout: json<SheetLayout>('layout'),
    /** planned | cut */
    state: text('state').notNull().default('planned'),
    consumedMm: real('consumed_mm'),
    costMinor: integer('cost_minor'),
    cutAt: integer('cut_at'),
    createdAt: createdAt(),
  },
  (t) => [index('cut_sheets_shop_idx').on(t.shopId)],
);

// ---------------------------------------------------------------- scheduled jobs run once per key
export const jobRuns = sqliteTable('job_runs', {
  /** e.g. digest:2026-12-01:<shopId> */
  key: text('key').primaryKey(),
  ranAt: integer('ran_at').notNull(),
});

// ---------------------------------------------------------------- shop offers: discount codes, order-by dates
export const discountCodes = sqliteTable(
  'discount_codes',
  {
    id: id(),
    shopId: text('shop_id')
      .notNull()
      .references(() => shops.id, { onDelete: 'cascade' }),
    /** upper case, unique per shop */
    code: text('code').notNull(),
    /** percent | amount */
    kind: text('kind').notNull(),
    /** percent: basis points off (1500 = 15 %); amount: minor units off */
    value: integer('value').notNull(),
    minSpendMinor: integer('min_spend_minor').notNull().default(0),
    /** first and last calendar day the code works ('yyyy-MM-dd', shops' time zone), null = open */
    startsOn: text('starts_on'),
    endsOn: text('ends_on'),
    /** how many paid (or reserved) checkouts may use it; null = no limit */
    usageLimit: integer('usage_limit'),
    /** null = every listing of the shop */
    listingIds: json<string[]>('listing_ids'),
    active: integer('active', { mode: 'boolean' }).notNull().default(true),
    createdAt: createdAt(),
    updatedAt: integer('updated_at').notNull(),
  },
  (t) => [uniqueIndex('discount_codes_shop_code_uq').on(t.shopId, t.code)],
);

/** One use of a code by a checkout: reserved when the payment page opens, used when paid, released when it expires. */
export const discountUses = sqliteTable(
  'discount_uses',
  {
    id: id(),
    codeId: text('code_id')
      .notNull()
      .references(() => discountCodes.id, { onDelete: 'cascade' }),
    checkoutId: text('checkout_id')
      .notNull()
      .references(() => checkouts.id),
    /** reserved | used | released */
    state: text('state').notNull().default('reserved'),
    createdAt: createdAt(),
    updatedAt: integer('updated_at').notNull(),
  },
  (t) => [uniqueIndex('discount_uses_code_checkout_uq').on(t.codeId, t.checkoutId), index('discount_uses_code_idx').on(t.codeId, t.state)],
);

/** The shopper's choices for one shop's part of a cart: a discount code and a needed-by date. */
export const cartShopChoices = sqliteTable(
  'cart_shop_choices',
  {
    cartId: text('cart_id')
      .notNull()
      .references(() => carts.id, { onDelete: 'cascade' }),
    shopId: text('shop_id')
      .notNull()
      .references(() => shops.id, { onDelete: 'cascade' }),
    /** as the shopper typed it (upper-cased); checked again every time the cart is priced */
    code: text('code'),
    neededBy: text('needed_by'),
    updatedAt: integer('updated_at').notNull(),
  },
  (t) => [uniqueIndex('cart_shop_choices_uq').on(t.cartId, t.shopId)],
);

/** "Order by" dates a shop sets per occasion, shown as banners on its listings until they pass. */
export const orderByDates = sqliteTable(
  'order_by_dates',
  {
    id: id(),
    shopId: text('shop_id')
      .notNull()
      .references(() => shops.id, { onDelete: 'cascade' }),
    occasion: text('occasion').notNull(),
    orderBy: text('order_by').notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('order_by_dates_shop_idx').on(t.shopId, t.orderBy)],
);

// ---------------------------------------------------------------- order messages (issue 16)
/** One message in an order's thread between its shopper and its shop (admins read it too). */
export const orderMessages = sqliteTable(
  'order_messages',
  {
    id: id(),
    orderId: text('order_id')
      .notNull()
      .references(() => orders.id, { onDelete: 'cascade' }),
    authorId: text('author_id')
      .notNull()
      .references(() => user.id),
    /** shopper | shop | admin: which side wrote it (the other side is told and counts it unread) */
    side: text('side').notNull(),
    body: text('body').notNull(),
    /** an attached photo, re-encoded by the upload checks, kept in a private folder (served only to the thread's readers) */
    photoPath: text('photo_path'),
    photoThumbPath: text('photo_thumb_path'),
    photoWidth: integer('photo_width'),
    photoHeight: integer('photo_height'),
    /** when the shopper read a shop/admin message; null: unread */
    shopperReadAt: integer('shopper_read_at'),
    /** when the shop read a shopper/admin message; null: unread */
    shopReadAt: integer('shop_read_at'),
    createdAt: createdAt(),
  },
  (t) => [index('order_messages_order_idx').on(t.orderId, t.createdAt)],
);

// ---------------------------------------------------------------- reviews (issue 16)
/** A shopper's review of one shipped order line: one per line; the shop may reply once; admins may hide it. */
export const reviews = sqliteTable(
  'reviews',
  {
    id: id(),
    lineId: text('line_id')
      .notNull()
      .references(() => orderLines.id, { onDelete: 'cascade' }),
    orderId: text('order_id')
      .notNull()
      .references(() => orders.id, { onDelete: 'cascade' }),
    listingId: text('listing_id')
      .notNull()
      .references(() => listings.id),
    shopId: text('shop_id')
      .notNull()
      .references(() => shops.id),
    authorId: text('author_id')
      .notNull()
      .references(() => user.id),
    /** 1 … 5 */
    rating: integer('rating').notNull(),
    body: text('body').notNull(),
    photoPath: text('photo_path'),
    photoThumbPath: text('photo_thumb_path'),
    photoWidth: integer('photo_width'),
    photoHeight: integer('photo_height'),
    reply: text('reply'),
    repliedAt: integer('replied_at'),
    hiddenAt: integer('hidden_at'),
    hiddenReason: text('hidden_reason'),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('reviews_line_uq').on(t.lineId), index('reviews_listing_idx').on(t.listingId, t.createdAt), index('reviews_shop_idx').on(t.shopId, t.createdAt)],
);

// ---------------------------------------------------------------- several server processes (WORKERS)
/** Who runs the once-only work (scheduled jobs, work sheet PDFs): one row per lease, held until expiresAt. */
export const leases = sqliteTable('leases', {
  name: text('name').primaryKey(),
  /** e.g. "pid 1234 · 3f2a…": a process's own token, new at each start */
  holder: text('holder').notNull(),
  expiresAt: integer('expires_at').notNull(),
});

/** Our per-account and per-address limits (express-rate-limit), counted here so every process shares them. */
export const rateLimitHits = sqliteTable('rate_limit_hits', {
  /** the limiter's name and its key, e.g. cart-adds:user:abc */
  key: text('key').primaryKey(),
  hits: integer('hits').notNull(),
  resetAt: integer('reset_at').notNull(),
});

/** Work sheet PDF jobs: any process answers their state; the lease holder builds them (file in DATA_DIR/worksheets). */
export const worksheetJobs = sqliteTable(
  'worksheet_jobs',
  {
    id: id(),
    shopId: text('shop_id')
      .notNull()
      .references(() => shops.id, { onDelete: 'cascade' }),
    batchId: text('batch_id').notNull(),
    paper: text('paper').notNull(),
    /** queued | running | done | failed */
    state: text('state').notNull(),
    progress: real('progress').notNull().default(0),
    pages: integer('pages'),
    /** the PDF's input, checked by worksheetInputSchema before it is written; cleared once built */
    input: json<unknown>('input'),
    error: text('error'),
    createdAt: createdAt(),
    updatedAt: integer('updated_at').notNull(),
  },
  (t) => [index('worksheet_jobs_state_idx').on(t.state, t.createdAt)],
);

// ---------------------------------------------------------------- blanks: types, stock, holds
/**
 * A shop's blank type (tee, tote, …): sizes and colours as JSON rows with stable ids, checked by
 * shared/schemas/blanks.ts before they are written.
 */
export const blankTypes = sqliteTable(
  'blank_types',
  {
    id: id(),
    shopId: text('shop_id')
      .notNull()
      .references(() => shops.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    /** the engine blank kind it is drawn and placed as */
    shape: text('shape').notNull(),
    sizes: json<BlankSize[]>('sizes').notNull(),
    colours: json<BlankColour[]>('colours').notNull(),
    createdAt: createdAt(),
    updatedAt: integer('updated_at').notNull(),
  },
  (t) => [index('blank_types_shop_idx').on(t.shopId)],
);

/** Items in stock per blank type × size × colour; `quantity` is what is free to sell (holds already taken out). */
export const blankStock = sqliteTable(
  'blank_stock',
  {
    blankTypeId: text('blank_type_id')
      .notNull()
      .references(() => blankTypes.id, { onDelete: 'cascade' }),
    sizeId: text('size_id').notNull(),
    colourId: text('colour_id').notNull(),
    quantity: integer('quantity').notNull().default(0),
    lowStock: integer('low_stock').notNull().default(3),
  },
  (t) => [uniqueIndex('blank_stock_uq').on(t.blankTypeId, t.sizeId, t.colourId)],
);

/**
 * Stock taken out for a checkout while its payment page is open: `held` → `sold` when it is paid,
 * `held` → `released` (the count goes back) when the payment session expires or is replaced.
 */
export const stockHolds = sqliteTable(
  'stock_holds',
  {
    id: id(),
    checkoutId: text('checkout_id').notNull(),
    blankTypeId: text('blank_type_id').notNull(),
    sizeId: text('size_id').notNull(),
    colourId: text('colour_id').notNull(),
    quantity: integer('quantity').notNull(),
    /** held | sold | released */
    state: text('state').notNull().default('held'),
    createdAt: createdAt(),
  },
  (t) => [index('stock_holds_checkout_idx').on(t.checkoutId)],
);
