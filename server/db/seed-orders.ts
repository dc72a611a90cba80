// Demo orders (PRODUCT.md's invented scenario): Dana has bought from Fern & Fable Goods, so the
// workroom has work on first start — some proofs waiting, most approved, over several materials.
// Every line is composed by the engine from the real demo listings and materials (the same
// buildSnapshot the cart uses), and the money rows follow checkout: a paid checkout, one order per
// shop, a charge, the platform fee (PLATFORM_FEE_BPS, 8 % by default) and the transfer.
import crypto from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import type { AppDeps } from '../app.ts';
import type { Db } from './client.ts';
import { checkouts, lineEvents, listings, materials, motifs, orderLines, orders, ledger } from './schema.ts';
import type { SeedContext } from './seed.ts';
import { getFontRegistry } from '../integrations/fonts.ts';
import { buildSnapshot, readLiveContent, type MaterialInfo, type MotifInfo } from '../features/cart/design.ts';
import type { ShipTo } from '../../shared/schemas/checkout.ts';
import { createOrdersForCheckout, type PricedShop } from '../features/orders/orders.service.ts';
import type { ChoicesInput } from '../../shared/schemas/listing.ts';
import { choicesSchema } from '../../shared/schemas/listing.ts';

const DEMO_SHIP_TO: ShipTo = { name: 'Dana Whitlock', line1: '12 Acorn Lane', line2: null, city: 'Harbourtown', postalCode: 'HT1 2AB', state: null, country: 'GB' };

const DAY = 86_400_000;

/** One demo purchase: the listing (by title), the name, the colours by material colour name. */
type Item = { listing: string; name: string; font?: string; textColour: string; motifColours?: Record<string, string>; quantity?: number; approved: boolean };

// Two names are left to be checked on purpose: "mIRA" (mixed case) and "Zoë" typed with a
// combining diaeresis (U+0065 U+0308) rather than the precomposed U+00EB.
const PURCHASES: Array<{ daysAgo: number; items: Item[] }> = [
  { daysAgo: 4, items: [
    { listing: 'Autumn fox tote with a name', name: 'Theo', textColour: 'Ink navy', motifColours: { body: 'Fox orange' }, approved: true },
    { listing: 'Harvest pumpkin drawstring bag with ribbon bow', name: 'Kai', textColour: 'Acorn brown', motifColours: { stem: 'Pine flock' }, approved: true },
  ] },
  { daysAgo: 3, items: [
    { listing: 'Spring picnic tote with hot-air balloon', name: 'Anouk', font: 'dancing-script-bold', textColour: 'Thread green', motifColours: { envelope: 'Berry red' }, approved: true },
    { listing: 'Winter lights drawstring bag with snowman', name: 'Leon', textColour: 'Ink navy', motifColours: { 'hat-and-scarf': 'Berry red' }, approved: true },
    { listing: 'Autumn fox tote with a name', name: 'Priya', textColour: 'Fox orange', motifColours: { body: 'Acorn brown' }, approved: true },
  ] },
  { daysAgo: 2, items: [
    { listing: 'Winter lights drawstring bag with snowman', name: 'Bartholomew', font: 'bebas-neue', textColour: 'Silver foil', motifColours: { 'hat-and-scarf': 'Thread green' }, approved: true },
    { listing: 'Autumn fox tote with a name', name: 'Mira', textColour: 'Marigold glitter', motifColours: { body: 'Fox orange' }, quantity: 2, approved: true },
  ] },
  { daysAgo: 1, items: [
    { listing: 'Autumn fox tote with a name', name: 'mIRA', textColour: 'Ink navy', motifColours: { body: 'Fox orange' }, approved: false },
    { listing: 'Spring picnic tote with hot-air balloon', name: 'Zoe\u0308', font: 'baloo-bold', textColour: 'Ink navy', motifColours: { envelope: 'Thread green' }, approved: false },
    { listing: 'Harvest pumpkin drawstring bag with ribbon bow', name: 'Leon', textColour: 'Fox orange', motifColours: { stem: 'Thread green' }, approved: false },
  ] },
];

export async function seedOrders(deps: AppDeps, ctx: SeedContext): Promise<void> {
  const db = deps.db;
  const shopId = ctx.shopIds['fern-and-fable-goods'];
  const buyerId = ctx.userIds['dana@namesake.test'];
  const sellerId = ctx.userIds['fern@namesake.test'];
  if (!shopId || !buyerId || !sellerId) return;

  const mats = db.select().from(materials).where(eq(materials.shopId, shopId)).all();
  const matByName = new Map(mats.map((m) => [m.colourName, m]));
  const matInfo = new Map<string, MaterialInfo>(mats.map((m) => [m.id, { id: m.id, kind: m.kind, colourName: m.colourName, colourHex: m.colourHex }]));
  const motifInfo = new Map<string, MotifInfo>(
    db.select().from(motifs).where(eq(motifs.shopId, shopId)).all().map((m) => [m.id, { id: m.id, name: m.name, geometry: m.geometry }]),
  );
  const shopListings = db.select().from(listings).where(and(eq(listings.shopId, shopId), eq(listings.state, 'live'))).all();
  const mat = (name: string) => {
    const m = matByName.get(name);
    if (!m) throw new Error(`demo orders: no material ${name} in Fern & Fable Goods`);
    return m.id;
  };
  const registry = getFontRegistry();
  const now = deps.now();

  for (const [k, purchase] of PURCHASES.entries()) {
    const paidAt = now - purchase.daysAgo * DAY - k * 3_600_000;
    const lines: PricedShop['lines'] = [];
    const approvedIdx: boolean[] = [];
    for (const item of purchase.items) {
      const listing = shopListings.find((l) => l.liveTitle === item.listing);
      const content = listing ? readLiveContent(listing.live) : null;
      if (!listing || !content) throw new Error(`demo orders: no live listing “${item.listing}”`);
      const field = content.personalisation.textFields[0]!;
      const motif = content.personalisation.motifChoices[0];
      const raw: ChoicesInput = {
        texts: { [field.id]: { text: item.name, fontId: item.font ?? field.defaultFontId, letterHeightMm: field.defaultLetterHeightMm } },
        textColours: { [field.id]: mat(item.textColour) },
        motifId: motif?.motifId ?? null,
        motifColours: Object.fromEntries(Object.entries(item.motifColours ?? {}).map(([layer, name]) => [layer, mat(name)])),
        outlineMaterialId: null,
      };
      const choices = choicesSchema.parse(raw);
      const snapshot = buildSnapshot({
        registry,
        listing: { id: listing.id, slug: listing.slug, shopId, currency: listing.currency },
        content,
        choices,
        materials: matInfo,
        motifs: motifInfo,
      });
      const quantity = item.quantity ?? 1;
      lines.push({ listingId: listing.id, title: content.title, quantity, unitPriceMinor: snapshot.unitPriceMinor, totalMinor: snapshot.unitPriceMinor * quantity, snapshot });
      approvedIdx.push(item.approved);
    }
    const shippingMinor = 450;
    const subtotalMinor = lines.reduce((a, l) => a + l.totalMinor, 0);
    const shop: PricedShop = { shopId, shopName: 'Fern & Fable Goods', shippingMinor, subtotalMinor, totalMinor: subtotalMinor + shippingMinor, lines };
    const checkoutId = crypto.randomUUID();
    const ref = crypto.randomBytes(6).toString('hex');
    db.transaction((tx) => {
      const t = tx as unknown as Db;
      t.insert(checkouts).values({
        id: checkoutId, userId: buyerId, cartId: crypto.randomUUID(), cartVersion: 1, state: 'paid', providerSessionId: `cs_demo_${ref}`,
        currency: 'USD', totalMinor: shop.totalMinor,
        priced: { currency: 'USD', totalMinor: shop.totalMinor, shops: [{ ...shop, lines: lines.map((l) => ({ ...l, cartLineId: crypto.randomUUID() })) }] },
        paymentIntentId: `pi_demo_${ref}`, chargeId: `ch_demo_${ref}`, mailedAt: paidAt, createdAt: paidAt - 120_000, paidAt,
      }).run();
      const [order] = createOrdersForCheckout(t, { checkoutId, buyerId, currency: 'USD', shops: [shop], paidAt, feeBps: deps.env.PLATFORM_FEE_BPS, paymentIntentId: `pi_demo_${ref}` });
      // the settlement that follows a real payment: fee and transfer rows, the transfer id on the order
      const transferId = `tr_demo_${ref}`;
      // an invented address in the demo scenario, so packing slips and the order pages show one
      t.update(orders).set({ transferId, shipTo: DEMO_SHIP_TO }).where(eq(orders.id, order!.id)).run();
      t.insert(ledger).values([
        { id: crypto.randomUUID(), shopId, orderId: order!.id, kind: 'platform_fee', amountMinor: order!.platformFeeMinor, currency: 'USD', providerRef: `ch_demo_${ref}`, memo: `fee ${deps.env.PLATFORM_FEE_BPS} bps`, createdAt: paidAt + 1000 },
        { id: crypto.randomUUID(), shopId, orderId: order!.id, kind: 'transfer', amountMinor: order!.totalMinor - order!.platformFeeMinor, currency: 'USD', providerRef: transferId, memo: 'payout to the shop', createdAt: paidAt + 1000 },
      ]).run();
      const made = t.select().from(orderLines).where(eq(orderLines.orderId, order!.id)).orderBy(orderLines.createdAt, orderLines.id).all();
      // lines are inserted in the priced order; match them by listing + text to be safe
      for (const line of made) {
        const i = lines.findIndex((l, j) => approvedIdx[j] !== undefined && l.listingId === line.listingId && JSON.stringify(l.snapshot.choices) === JSON.stringify(line.snapshot.choices));
        if (i < 0 || !approvedIdx[i]) continue;
        const at = paidAt + 6 * 3_600_000;
        t.update(orderLines).set({ state: 'approved', updatedAt: at }).where(eq(orderLines.id, line.id)).run();
        t.insert(lineEvents).values({ id: crypto.randomUUID(), lineId: line.id, actorId: sellerId, fromState: 'awaiting_proof', toState: 'approved', message: 'Proof approved (version 1).', createdAt: at }).run();
      }
    });
  }
}
