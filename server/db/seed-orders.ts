// Demo orders (the invented demo scenario): Dana has bought from Fern & Fable Goods, so the
// workroom has work on first start — some proofs waiting, most approved, over several materials.
// Each purchase goes the way a shopper's does: the items into Dana's cart (priced and composed by
// the cart), a Checkout Session opened by our checkout service, paid at the local payment fake with
// a test card on its payment page, and the orders made by the same webhook handler from the
// provider's checkout.session.completed event; the shop is paid by its transfer. So the demo orders
// are real payments there, and refunds, transfers and payouts of them work. Each purchase is dated
// some days back (the clock handed to the services), and proofs are approved by the workroom's own
// approve. No e-mails go out for them.
import type Stripe from 'stripe';
import type { LineSnapshot } from '../../shared/schemas/cart.ts';
import type { ShipTo } from '../../shared/schemas/checkout.ts';
import type { ChoicesInput } from '../../shared/schemas/listing.ts';
import type { AppDeps } from '../deps.ts';
import { addLine, readLiveContent, resolveCart } from '../features/cart/index.ts';
import { openCheckout } from '../features/checkout/index.ts';
import { handleEvent, skipOrderMails } from '../features/payments/index.ts';
import { approve } from '../features/workroom/index.ts';
import { paymentsClient } from '../integrations/payments.ts';
import { seedRepo } from './seed.repo.ts';
import type { SeedContext } from './seed-context.ts';
import { demoPaymentProvider } from './seed-payments.ts';

const DEMO_SHIP_TO: ShipTo = { name: 'Dana Whitlock', line1: '12 Acorn Lane', line2: null, city: 'Harbourtown', postalCode: 'HT1 2AB', state: null, country: 'GB' };

const DAY = 86_400_000;

/** One demo purchase: the listing (by title), the name, the colours by material colour name. */
export type Item = { listing: string; name: string; font?: string; textColour: string; motifColours?: Record<string, string>; quantity?: number; approved: boolean };

// Two names are left to be checked on purpose: "mIRA" (mixed case) and "Zoë" typed with a
// combining diaeresis (U+0065 U+0308) rather than the precomposed U+00EB.
const PURCHASES: Array<{ daysAgo: number; items: Item[] }> = [
  {
    daysAgo: 4,
    items: [
      { listing: 'Autumn fox tote with a name', name: 'Theo', textColour: 'Ink navy', motifColours: { body: 'Fox orange' }, approved: true },
      { listing: 'Harvest pumpkin drawstring bag with ribbon bow', name: 'Kai', textColour: 'Acorn brown', motifColours: { stem: 'Pine flock' }, approved: true },
    ],
  },
  {
    daysAgo: 3,
    items: [
      { listing: 'Spring picnic tote with hot-air balloon', name: 'Anouk', font: 'dancing-script-bold', textColour: 'Thread green', motifColours: { envelope: 'Berry red' }, approved: true },
      { listing: 'Winter lights drawstring bag with snowman', name: 'Leon', textColour: 'Ink navy', motifColours: { 'hat-and-scarf': 'Berry red' }, approved: true },
      { listing: 'Autumn fox tote with a name', name: 'Priya', textColour: 'Fox orange', motifColours: { body: 'Acorn brown' }, approved: true },
    ],
  },
  {
    daysAgo: 2,
    items: [
      { listing: 'Winter lights drawstring bag with snowman', name: 'Bartholomew', font: 'bebas-neue', textColour: 'Silver foil', motifColours: { 'hat-and-scarf': 'Thread green' }, approved: true },
      { listing: 'Autumn fox tote with a name', name: 'Mira', textColour: 'Marigold glitter', motifColours: { body: 'Fox orange' }, quantity: 2, approved: true },
    ],
  },
  {
    daysAgo: 1,
    items: [
      { listing: 'Autumn fox tote with a name', name: 'mIRA', textColour: 'Ink navy', motifColours: { body: 'Fox orange' }, approved: false },
      { listing: 'Spring picnic tote with hot-air balloon', name: 'Zoe\u0308', font: 'baloo-bold', textColour: 'Ink navy', motifColours: { envelope: 'Thread green' }, approved: false },
      { listing: 'Harvest pumpkin drawstring bag with ribbon bow', name: 'Leon', textColour: 'Fox orange', motifColours: { stem: 'Thread green' }, approved: false },
    ],
  },
];

/**
 * A Saturday's run for Fern & Fable Goods: orders that came in over the last days, every proof
 * approved, over all four material kinds the shop stocks (smooth, glitter, flock, metallic) — a
 * real day at the cutter and the press. Siblings' and friends' names from the demo's example names,
 * so every line reads differently from the single-name orders above.
 */
const FOX = 'Autumn fox tote with a name';
const SNOWMAN = 'Winter lights drawstring bag with snowman';
const BALLOON = 'Spring picnic tote with hot-air balloon';
const PUMPKIN = 'Harvest pumpkin drawstring bag with ribbon bow';
type RunItem = [listing: string, name: string, textColour: string, motifColours: Record<string, string>, font?: string, quantity?: number];
const SATURDAY: RunItem[][] = [
  [
    [FOX, 'Mira and Kai', 'Ink navy', { body: 'Fox orange' }],
    [FOX, 'Team Theo', 'Marigold glitter', { body: 'Acorn brown' }],
    [SNOWMAN, 'LEON', 'Silver foil', { 'hat-and-scarf': 'Berry red' }, 'bebas-neue'],
    [SNOWMAN, 'Priya Z', 'Ink navy', { 'hat-and-scarf': 'Thread green' }],
    [BALLOON, 'Anouk B', 'Thread green', { envelope: 'Berry red' }, 'dancing-script-bold'],
    [PUMPKIN, 'Kai Leon', 'Pine flock', { stem: 'Thread green' }],
    [PUMPKIN, 'Little Mira', 'Fox orange', { stem: 'Pine flock' }],
  ],
  [
    [FOX, 'Theo and Zoe', 'Thread green', { body: 'Fox orange' }],
    [FOX, 'Priya K', 'Fox orange', { body: 'Acorn brown' }, undefined, 2],
    [SNOWMAN, 'Kai Mira', 'Berry red', { 'hat-and-scarf': 'Ink navy' }],
    [SNOWMAN, 'Mira M', 'Marigold glitter', { 'hat-and-scarf': 'Berry red' }],
    [BALLOON, 'Leon and Kai', 'Ink navy', { envelope: 'Thread green' }, 'patrick-hand'],
    [BALLOON, 'Zoe', 'Fox orange', { envelope: 'Ink navy' }, 'baloo-bold'],
    [PUMPKIN, 'Anouk T', 'Acorn brown', { stem: 'Pine flock' }, 'bangers'],
  ],
  [
    [FOX, 'Kai T', 'Marigold glitter', { body: 'Fox orange' }],
    [FOX, 'Anouk Mira', 'Ink navy', { body: 'Fox orange' }],
    [SNOWMAN, 'THEO', 'Silver foil', { 'hat-and-scarf': 'Thread green' }, 'bebas-neue'],
    [SNOWMAN, 'Leon P', 'Ink navy', { 'hat-and-scarf': 'Berry red' }],
    [BALLOON, 'Priya L', 'Thread green', { envelope: 'Berry red' }, 'dancing-script-bold'],
    [PUMPKIN, 'Zoe and Kai', 'Ink navy', { stem: 'Thread green' }],
    [PUMPKIN, 'Mira K', 'Pine flock', { stem: 'Thread green' }, 'bangers'],
  ],
  [
    [FOX, 'Leon B', 'Thread green', { body: 'Acorn brown' }],
    [FOX, 'Theo Kai', 'Ink navy', { body: 'Fox orange' }],
    [SNOWMAN, 'Kai and Zoe', 'Marigold glitter', { 'hat-and-scarf': 'Ink navy' }],
    [SNOWMAN, 'MIRA', 'Berry red', { 'hat-and-scarf': 'Thread green' }, 'bebas-neue'],
    [BALLOON, 'Theo K', 'Ink navy', { envelope: 'Berry red' }],
    [PUMPKIN, 'Priya Leon', 'Fox orange', { stem: 'Pine flock' }],
    [PUMPKIN, 'Anouk L', 'Pine flock', { stem: 'Thread green' }],
  ],
  [
    [FOX, 'Zoe T', 'Fox orange', { body: 'Acorn brown' }],
    [FOX, 'Kai and Theo', 'Marigold glitter', { body: 'Fox orange' }],
    [SNOWMAN, 'ANOUK', 'Silver foil', { 'hat-and-scarf': 'Berry red' }, 'bebas-neue'],
    [BALLOON, 'Mira Leon', 'Thread green', { envelope: 'Ink navy' }, 'patrick-hand'],
    [BALLOON, 'Leon Zoe', 'Fox orange', { envelope: 'Thread green' }],
    [PUMPKIN, 'Theo T', 'Acorn brown', { stem: 'Pine flock' }],
  ],
];
const SATURDAY_PURCHASES = SATURDAY.map((items, k) => ({
  daysAgo: k < 2 ? 2 : 1,
  items: items.map(
    ([listing, name, textColour, motifColours, font, quantity]): Item => ({ listing, name, textColour, motifColours, approved: true, ...(font ? { font } : {}), ...(quantity ? { quantity } : {}) }),
  ),
}));

/** The payment page's form as a shopper fills it: the parcel address and the test card that pays. */
const PAY_FORM = {
  ship_name: DEMO_SHIP_TO.name,
  ship_line1: DEMO_SHIP_TO.line1,
  ship_line2: '',
  ship_city: DEMO_SHIP_TO.city,
  ship_postal_code: DEMO_SHIP_TO.postalCode,
  ship_state: '',
  ship_country: DEMO_SHIP_TO.country,
  card_number: '4242 4242 4242 4242',
  card_expiry: '12/34',
  card_cvc: '123',
};

/** The provider's checkout.session.completed event of one session (the one its webhook delivers). */
async function completedEvent(stripe: Stripe, sessionId: string): Promise<Stripe.Event> {
  for await (const e of stripe.events.list({ type: 'checkout.session.completed', limit: 100 })) {
    if ((e.data.object as { id?: string }).id === sessionId) return e;
  }
  throw new Error(`demo orders: the payment provider has no completed event for session ${sessionId}`);
}

export async function seedOrders(deps: AppDeps, ctx: SeedContext): Promise<void> {
  await seedPurchases(deps, ctx, [...PURCHASES, ...SATURDAY_PURCHASES]);
}

/** Buys `purchases` for Dana in Fern & Fable Goods as above; returns the orders made, oldest purchase first. */
export async function seedPurchases(deps: AppDeps, ctx: SeedContext, purchases: Array<{ daysAgo: number; items: Item[] }>): Promise<string[]> {
  const shopId = ctx.shopIds['fern-and-fable-goods'];
  const buyerId = ctx.userIds['dana@namesake.test'];
  const sellerId = ctx.userIds['fern@namesake.test'];
  if (!shopId || !buyerId || !sellerId) return [];
  const provider = await demoPaymentProvider(deps.env);
  if (!provider) {
    console.log('  demo orders skipped: they are paid with a test card at the local payment fake, and STRIPE_API_BASE names a real provider');
    return [];
  }
  try {
    return await buyAll({ ...deps, env: provider.env }, shopId, buyerId, sellerId, purchases);
  } finally {
    await provider.close();
  }
}

async function buyAll(deps: AppDeps, shopId: string, buyerId: string, sellerId: string, purchases: Array<{ daysAgo: number; items: Item[] }>): Promise<string[]> {
  const made: string[] = [];
  const db = deps.db;
  const mats = new Map(seedRepo.materialsOf(db, shopId).map((m) => [m.colourName, m.id]));
  const shopListings = seedRepo.liveListingsOf(db, shopId);
  const mat = (name: string) => {
    const id = mats.get(name);
    if (!id) throw new Error(`demo orders: no material ${name} in Fern & Fable Goods`);
    return id;
  };
  const buyer = seedRepo.userEmail(db, buyerId)!;
  const stripe = paymentsClient(deps.env);
  const now = deps.now();
  const at = (ms: number): AppDeps => ({ ...deps, now: () => ms });

  for (const [k, purchase] of purchases.entries()) {
    const paidAt = now - purchase.daysAgo * DAY - k * 3_600_000;
    const dana = { userId: buyerId, cookieCartId: null };
    const cart = resolveCart(at(paidAt - 600_000), dana, { create: true }).cart!;
    const wanted: Array<{ listingId: string; name: string; approved: boolean }> = [];
    for (const item of purchase.items) {
      const listing = shopListings.find((l) => l.liveTitle === item.listing);
      const content = listing ? readLiveContent(listing.live) : null;
      if (!listing || !content) throw new Error(`demo orders: no live listing “${item.listing}”`);
      const field = content.personalisation.textFields[0]!;
      const motif = content.personalisation.motifChoices[0];
      const choices: ChoicesInput = {
        texts: { [field.id]: { text: item.name, fontId: item.font ?? field.defaultFontId, letterHeightMm: field.defaultLetterHeightMm } },
        textColours: { [field.id]: mat(item.textColour) },
        motifId: motif?.motifId ?? null,
        motifColours: Object.fromEntries(Object.entries(item.motifColours ?? {}).map(([layer, name]) => [layer, mat(name)])),
        outlineMaterialId: null,
      };
      await addLine(at(paidAt - 300_000), cart, { listingId: listing.id, quantity: item.quantity ?? 1, choices });
      wanted.push({ listingId: listing.id, name: item.name, approved: item.approved });
    }
    const started = await openCheckout(at(paidAt - 120_000), resolveCart(deps, dana, { create: false }).cart, { id: buyerId, email: buyer.email });
    skipOrderMails(deps, started.checkoutId, paidAt); // demo purchases send no e-mail
    const paid = await fetch(started.url, { method: 'POST', body: new URLSearchParams(PAY_FORM), redirect: 'manual' });
    if (paid.status !== 303) throw new Error(`demo orders: the payment page answered ${paid.status}: ${(await paid.text()).slice(0, 300)}`);
    await handleEvent(at(paidAt), await completedEvent(stripe, started.sessionId));

    const order = seedRepo.ordersOfCheckout(db, started.checkoutId)[0];
    if (!order?.transferId) throw new Error(`demo orders: checkout ${started.checkoutId} made no paid-out order`);
    const lines = seedRepo.linesOf(db, order.id);
    const toApprove = lines
      .filter((l) => wanted.some((w) => w.approved && w.listingId === l.listingId && Object.values((l.snapshot as LineSnapshot).choices.texts).some((t) => t.text === w.name)))
      .map((l) => l.id);
    if (toApprove.length) approve(at(paidAt + 6 * 3_600_000), shopId, sellerId, toApprove, { mail: false });
    made.push(order.id);
  }
  return made;
}
