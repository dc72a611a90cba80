// Cart rules: one cart per signed-in user, a guest cart by cookie, merged on the first signed-in
// call; lines priced by the server from the live listing (the posted body has no price at all).
import crypto from 'node:crypto';
import { blankDefaults } from '../../../shared/schemas/blanks.ts';
import type { AddCartLineInput, Cart, CartLine, CartShop } from '../../../shared/schemas/cart.ts';
import { addCartLineSchema } from '../../../shared/schemas/cart.ts';
import { type ListingContent, materialIdsOf } from '../../../shared/schemas/listing.ts';
import type { Db } from '../../db/client.ts';
import type { AppDeps } from '../../deps.ts';
import { conflict, notFound } from '../../http/app-error.ts';
import { resolveOffer } from '../blanks/index.ts';
import { type CartRow, cartRepo } from './cart.repo.ts';
import { buildSnapshotOffThread, readLiveContent, snapshotLookups, unitPrice } from './design.ts';

export type CartDeps = Pick<AppDeps, 'db' | 'now' | 'env'>;

type ListingRow = NonNullable<ReturnType<typeof cartRepo.listingWithShop>>;

/** A listing can be bought while its approved copy is on sale and its shop is live. */
export function onSale(row: ListingRow): ListingContent | null {
  const { listing, shop } = row;
  if (shop.state !== 'live' || !listing.live) return null;
  const ok = listing.state === 'live' || (listing.state === 'in_review' && listing.pendingReview);
  return ok ? readLiveContent(listing.live) : null;
}

/** Who asks for a cart: the signed-in user (null for a guest) and the cart id the guest cookie names. */
export type CartAsker = { userId: string | null; cookieCartId: string | null };

/** What becomes of the guest cart cookie: set to a new cart's id, cleared, or left alone (null). */
export type CartCookieChange = { set: string } | 'clear' | null;

/**
 * The cart a request works on. Signed in: the user's cart, after folding in the guest cart the
 * cookie names (then the cookie is cleared). Guest: the cookie's cart. `create` makes one if none.
 * The route applies `cookie` (cart-cookie.ts): this rule never sees the request.
 */
export function resolveCart(deps: CartDeps, asker: CartAsker, opts: { create: boolean }): { cart: CartRow | null; cookie: CartCookieChange } {
  const { db } = deps;
  const at = deps.now();
  const cookieId = asker.cookieCartId;
  const cookieCart = cookieId ? cartRepo.find(db, cookieId) : undefined;
  if (asker.userId) {
    const userId = asker.userId;
    let mine = cartRepo.findForUser(db, userId);
    if (cookieCart && cookieCart.userId === null) {
      db.transaction((tx) => {
        if (!mine) {
          cartRepo.claim(tx as unknown as Db, cookieCart.id, userId, at);
        } else {
          cartRepo.moveLines(tx as unknown as Db, cookieCart.id, mine.id);
          cartRepo.touch(tx as unknown as Db, mine.id, at);
          cartRepo.remove(tx as unknown as Db, cookieCart.id);
        }
      });
      mine = cartRepo.findForUser(db, userId);
    }
    if (!mine && opts.create) mine = cartRepo.create(db, { id: crypto.randomUUID(), userId, at });
    return { cart: mine ?? null, cookie: cookieId ? 'clear' : null };
  }
  // a cookie naming a signed-in user's cart (left after sign-out) is not a guest's to use
  if (cookieCart && cookieCart.userId === null) return { cart: cookieCart, cookie: null };
  if (!opts.create) return { cart: null, cookie: null };
  const cart = cartRepo.create(db, { id: crypto.randomUUID(), userId: null, at });
  return { cart, cookie: { set: cart.id } };
}

/** The cart again under a new version (its checkout page timed out, so a fresh one is opened). */
export function newCartVersion(deps: Pick<CartDeps, 'db' | 'now'>, cartId: string): CartRow {
  cartRepo.touch(deps.db, cartId, deps.now());
  return cartRepo.find(deps.db, cartId)!;
}

export const emptyCart = (): Cart => ({ id: null, version: 0, currency: null, shops: [], itemCount: 0, subtotalMinor: 0, shippingMinor: 0, totalMinor: 0 });

/** The cart as shown and as checked out: lines re-priced from the live listings, grouped by shop. */
export function cartView(db: Db, cart: CartRow | null): Cart {
  if (!cart) return emptyCart();
  const lines = cartRepo.lines(db, cart.id);
  const rows = new Map(cartRepo.listingsWithShops(db, [...new Set(lines.map((l) => l.listingId))]).map((r) => [r.listing.id, r]));
  const byShop = new Map<string, CartShop>();
  let currency: string | null = null;
  for (const l of lines) {
    const snap = l.snapshot;
    const row = rows.get(l.listingId);
    const content = row ? onSale(row) : null;
    const price = content ? unitPrice(content, snap.choices, row && resolveOffer(db, row.shop.id, content.blankOffer)) : snap.unitPriceMinor;
    const line: CartLine = {
      id: l.id,
      listingId: l.listingId,
      quantity: l.quantity,
      unitPriceMinor: price,
      lineTotalMinor: price * l.quantity,
      snapshot: snap,
      available: content !== null,
    };
    const shopId = row?.shop.id ?? snap.shopId;
    let group = byShop.get(shopId);
    if (!group) {
      group = {
        shopId,
        shopName: row?.shop.name ?? 'A shop',
        shopSlug: row?.shop.slug ?? '',
        currency: row?.listing.currency ?? snap.currency,
        lines: [],
        subtotalMinor: 0,
        shippingMinor: row?.shop.shippingMinor ?? 0,
        totalMinor: 0,
      };
      byShop.set(shopId, group);
    }
    group.lines.push(line);
    currency ??= group.currency;
  }
  const shops = [...byShop.values()];
  for (const s of shops) {
    s.subtotalMinor = s.lines.reduce((a, l) => a + (l.available ? l.lineTotalMinor : 0), 0);
    // a shop whose every line went off sale ships nothing
    if (!s.lines.some((l) => l.available)) s.shippingMinor = 0;
    s.totalMinor = s.subtotalMinor + s.shippingMinor;
  }
  const subtotalMinor = shops.reduce((a, s) => a + s.subtotalMinor, 0);
  const shippingMinor = shops.reduce((a, s) => a + s.shippingMinor, 0);
  return {
    id: cart.id,
    version: cart.version,
    currency,
    shops,
    itemCount: lines.reduce((a, l) => a + l.quantity, 0),
    subtotalMinor,
    shippingMinor,
    totalMinor: subtotalMinor + shippingMinor,
  };
}

/** Adds one personalised item: choices checked against the live listing, composed, priced, frozen. */
export async function addLine(deps: CartDeps & Pick<AppDeps, 'pool'>, cart: CartRow, raw: AddCartLineInput): Promise<void> {
  const { db } = deps;
  const input = addCartLineSchema.parse(raw);
  const row = cartRepo.listingWithShop(db, input.listingId);
  const content = row ? onSale(row) : null;
  if (!row || !content) throw notFound('This listing is not on sale right now.');

  const p = content.personalisation;
  const { materials, motifs } = snapshotLookups(
    p,
    cartRepo.materials(db, row.shop.id, materialIdsOf(p)),
    cartRepo.motifs(
      db,
      row.shop.id,
      p.motifChoices.map((m) => m.motifId),
    ),
  );

  const offer = resolveOffer(db, row.shop.id, content.blankOffer);
  // composed in the worker pool: the request thread never runs the geometry
  const snapshot = await buildSnapshotOffThread({
    pool: deps.pool,
    listing: { id: row.listing.id, slug: row.listing.slug, shopId: row.shop.id, currency: row.listing.currency },
    content,
    // a one-size blank's size and the shop's default colour when the request names none
    choices: { ...input.choices, ...blankDefaults(offer, input.choices) },
    materials,
    motifs,
    offer,
  });

  const existing = cartView(db, cart);
  if (existing.currency && existing.currency !== snapshot.currency) {
    throw conflict(`Your cart is in ${existing.currency}; this item is priced in ${snapshot.currency}. Check out your cart first, then add it.`);
  }
  const at = deps.now();
  db.transaction((tx) => {
    cartRepo.addLine(tx as unknown as Db, { id: crypto.randomUUID(), cartId: cart.id, listingId: row.listing.id, quantity: input.quantity, snapshot, createdAt: at });
    cartRepo.touch(tx as unknown as Db, cart.id, at);
  });
}

export function setQuantity(deps: CartDeps, cart: CartRow | null, lineId: string, quantity: number): void {
  const line = cart ? cartRepo.line(deps.db, cart.id, lineId) : undefined;
  if (!cart || !line) throw notFound('That item is not in your cart.');
  deps.db.transaction((tx) => {
    cartRepo.setQuantity(tx as unknown as Db, lineId, quantity);
    cartRepo.touch(tx as unknown as Db, cart.id, deps.now());
  });
}

export function removeLine(deps: CartDeps, cart: CartRow | null, lineId: string): void {
  const line = cart ? cartRepo.line(deps.db, cart.id, lineId) : undefined;
  if (!cart || !line) throw notFound('That item is not in your cart.');
  deps.db.transaction((tx) => {
    cartRepo.deleteLine(tx as unknown as Db, lineId);
    cartRepo.touch(tx as unknown as Db, cart.id, deps.now());
  });
}
