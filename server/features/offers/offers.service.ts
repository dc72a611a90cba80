// Shop offers: discount codes (the seller's forms, the cart's discount step after line pricing, a
// use reserved when the payment page opens), needed-by dates and order-by dates. The arithmetic is
// pure and lives in shared/business (discounts.ts, needed-by.ts); this file gathers the rows.
//
// The usage limit holds under concurrent checkouts: a use is reserved for the checkout in the same
// IMMEDIATE SQLite transaction that creates the checkout row, counting every use reserved or paid by
// other carts, so two payment pages opened at once can never both take the last use (SQLite runs one
// writer at a time, across processes too). A use is released when its payment page expires and
// becomes "used" when the payment comes in.
import crypto from 'node:crypto';
import { applyDiscount, type DiscountRule } from '../../../shared/business/discounts.ts';
import { earliestArrival, neededByVerdict } from '../../../shared/business/needed-by.ts';
import { calendarOfShop, dayInZone } from '../../../shared/business/working-days.ts';
import { formatMoney } from '../../../shared/money.ts';
import type { Cart } from '../../../shared/schemas/cart.ts';
import type { PricedCheckout } from '../../../shared/schemas/checkout.ts';
import {
  CODE_RE,
  type DiscountCodeValues,
  type DiscountCodeView,
  type DiscountsView,
  type ListingDelivery,
  type OrderByDate,
  type OrderByDateInput,
  orderByDateSchema,
} from '../../../shared/schemas/offers.ts';
import type { Db } from '../../db/client.ts';
import type { AppDeps } from '../../deps.ts';
import { badRequest, conflict, notFound } from '../../http/app-error.ts';
import { type DiscountCodeRow, type OffersShopRow, offersRepo as repo } from './offers.repo.ts';

export type OffersDeps = Pick<AppDeps, 'db' | 'now' | 'env'>;

const todayOf = (deps: OffersDeps) => dayInZone(deps.now(), deps.env.BUSINESS_TIME_ZONE);

export const MAX_ORDER_BY_DATES = 20;
export const MAX_CODES_PER_SHOP = 200;
/** a needed-by date further out than this is not a deadline anyone is worried about */
export const MAX_NEEDED_BY_DAYS = 366;

export function ruleOf(row: DiscountCodeRow): DiscountRule {
  return {
    code: row.code,
    kind: row.kind === 'amount' ? 'amount' : 'percent',
    value: row.value,
    minSpendMinor: row.minSpendMinor,
    startsOn: row.startsOn,
    endsOn: row.endsOn,
    usageLimit: row.usageLimit,
    listingIds: row.listingIds?.length ? row.listingIds : null,
    active: row.active,
  };
}

const planOf = (s: OffersShopRow) => ({ processingDays: s.processingDays, shippingDays: s.shippingDays, calendar: calendarOfShop(s) });

// ---------------------------------------------------------------- the cart's discount step

/**
 * The cart after line pricing, with each shop's code and needed-by date applied: each line's share
 * of the discount, the shop's and the cart's totals after it, and the shop's delivery dates.
 */
export function withOffers(deps: OffersDeps, view: Cart): Cart {
  if (!view.id || view.shops.length === 0) return view;
  const { db } = deps;
  const today = todayOf(deps);
  const choices = new Map(repo.choices(db, view.id).map((c) => [c.shopId, c]));
  const shopRows = new Map(
    repo
      .shops(
        db,
        view.shops.map((s) => s.shopId),
      )
      .map((s) => [s.id, s]),
  );
  let cartOff = 0;
  for (const s of view.shops) {
    const choice = choices.get(s.shopId);
    const row = shopRows.get(s.shopId);
    s.discount = null;
    s.discountMinor = 0;
    s.delivery = null;
    if (row) {
      const plan = planOf(row);
      if (choice?.neededBy) {
        const v = neededByVerdict(today, choice.neededBy, plan);
        s.delivery = { neededBy: choice.neededBy, shipBy: v.shipBy, arrival: v.arrival, canMake: v.canMake };
      } else {
        const e = earliestArrival(today, plan);
        s.delivery = { neededBy: null, shipBy: e.shipBy, arrival: e.arrival, canMake: null };
      }
    }
    if (!choice?.code) continue;
    const code = repo.codeByText(db, s.shopId, choice.code);
    if (!code) {
      s.discount = { code: choice.code, codeId: null, applied: false, discountMinor: 0, message: `${s.shopName} has no code ${choice.code} any more.` };
      continue;
    }
    const lines = s.lines.filter((l) => l.available).map((l) => ({ id: l.id, listingId: l.listingId, totalMinor: l.lineTotalMinor }));
    const out = applyDiscount(ruleOf(code), lines, { today, usesTaken: repo.usesTaken(db, code.id, view.id), currency: s.currency });
    if (!out.ok) {
      s.discount = { code: code.code, codeId: code.id, applied: false, discountMinor: 0, message: out.reason };
      continue;
    }
    for (const l of s.lines) l.discountMinor = out.perLine[l.id] ?? 0;
    s.discountMinor = out.discountMinor;
    s.totalMinor -= out.discountMinor;
    cartOff += out.discountMinor;
    s.discount = { code: code.code, codeId: code.id, applied: true, discountMinor: out.discountMinor, message: `${code.code} takes ${formatMoney(out.discountMinor, s.currency)} off.` };
  }
  view.discountMinor = cartOff;
  view.totalMinor -= cartOff;
  return view;
}

/** The shop's part of the cart must be in it before a code or a date can be set on it. */
function cartShop(view: Cart, shopId: string) {
  const s = view.shops.find((x) => x.shopId === shopId);
  if (!s) throw notFound('There is nothing from that shop in your cart.');
  return s;
}

/**
 * POST …/code: a code the shop has is kept on the cart even when it does not apply yet (the cart
 * says why, e.g. spend a little more); a code the shop does not have is refused and nothing changes.
 */
export function setCartCode(deps: OffersDeps, view: Cart, shopId: string, typed: string): void {
  const s = cartShop(view, shopId);
  const code = typed.trim().toUpperCase();
  if (!CODE_RE.test(code)) throw badRequest(`“${typed.trim().slice(0, 40)}” is not a code: codes are 3–20 letters, digits or dashes.`, { code: 'Codes are 3–20 letters, digits or dashes.' });
  if (!repo.codeByText(deps.db, shopId, code)) throw badRequest(`${s.shopName} has no code ${code}. Check the spelling with the shop.`, { code: `${s.shopName} has no code ${code}.` });
  repo.setChoice(deps.db, view.id!, shopId, { code }, deps.now());
}

export function removeCartCode(deps: OffersDeps, view: Cart, shopId: string): void {
  cartShop(view, shopId);
  repo.setChoice(deps.db, view.id!, shopId, { code: null }, deps.now());
}

export function setNeededBy(deps: OffersDeps, view: Cart, shopId: string, neededBy: string | null): void {
  cartShop(view, shopId);
  if (neededBy) {
    const today = todayOf(deps);
    if (neededBy <= today) throw badRequest('Pick a day after today.', { neededBy: 'Pick a day after today.' });
    const far = dayInZone(deps.now() + MAX_NEEDED_BY_DAYS * 86_400_000, deps.env.BUSINESS_TIME_ZONE);
    if (neededBy > far) throw badRequest('Pick a day within the next year.', { neededBy: 'Pick a day within the next year.' });
  }
  repo.setChoice(deps.db, view.id!, shopId, { neededBy }, deps.now());
}

// ---------------------------------------------------------------- checkout: freeze, reserve, release

/** Each shop's code and needed-by date as the checkout freezes them (the view came through withOffers). */
export function frozenOffers(s: Cart['shops'][number]): Pick<PricedCheckout['shops'][number], 'discount' | 'neededBy'> {
  const d = s.discount;
  return {
    discount: d?.applied && d.codeId ? { codeId: d.codeId, code: d.code, discountMinor: d.discountMinor } : null,
    neededBy: s.delivery?.neededBy ?? null,
  };
}

/**
 * A code on the cart that does not apply (any more) stops the checkout with its reason: the shopper
 * saw a price with it, and is never sent to pay a different one without being told.
 */
export function assertCodesApply(view: Cart): void {
  const off = view.shops.filter((s) => s.discount && !s.discount.applied);
  if (off.length) throw conflict(`${off.map((s) => s.discount!.message).join(' ')} Remove the code from your cart to pay without it.`);
}

/**
 * Reserves one use of each code in a checkout. Runs inside the transaction that creates the checkout
 * row (the caller's `db` is that transaction, begun IMMEDIATE); throws 409, rolling the checkout back,
 * when a code has no use left.
 */
export function reserveUses(db: Db, checkout: { id: string; cartId: string; priced: PricedCheckout }, at: number): void {
  for (const s of checkout.priced.shops) {
    if (!s.discount) continue;
    const code = repo.codeById(db, s.discount.codeId);
    if (!code) throw conflict(`${s.shopName} has just withdrawn the code ${s.discount.code}. Remove it from your cart to check out.`);
    const mine = repo.findUse(db, code.id, checkout.id);
    if (mine && mine.state !== 'released') continue;
    if (code.usageLimit !== null && repo.usesTaken(db, code.id, checkout.cartId) >= code.usageLimit) {
      throw conflict(`The code ${code.code} from ${s.shopName} has just been used as many times as the shop allows. Remove it from your cart to check out.`);
    }
    if (mine) repo.setUseState(db, mine.id, 'reserved', at);
    else repo.insertUse(db, { id: crypto.randomUUID(), codeId: code.id, checkoutId: checkout.id, state: 'reserved', createdAt: at, updatedAt: at });
  }
}

/** The payment page expired: its reserved uses go back. */
export const releaseUses = (db: Db, checkoutId: string, at: number) => repo.moveUses(db, checkoutId, 'reserved', 'released', at);

/** Paid: the checkout's uses count for good (even one released meanwhile: the discount was paid at that price). */
export function confirmUses(db: Db, checkoutId: string, at: number): void {
  repo.moveUses(db, checkoutId, 'reserved', 'used', at);
  repo.moveUses(db, checkoutId, 'released', 'used', at);
}

// ---------------------------------------------------------------- the seller's codes

function codeView(row: DiscountCodeRow, counts: Map<string, number>, given: Map<string, number>): DiscountCodeView {
  return {
    id: row.id,
    code: row.code,
    kind: row.kind === 'amount' ? 'amount' : 'percent',
    percentOff: row.kind === 'percent' ? row.value / 100 : null,
    amountOffMinor: row.kind === 'amount' ? row.value : null,
    minSpendMinor: row.minSpendMinor,
    startsOn: row.startsOn,
    endsOn: row.endsOn,
    usageLimit: row.usageLimit,
    listingIds: row.listingIds ?? [],
    active: row.active,
    usedCount: counts.get(`${row.id}|used`) ?? 0,
    reservedCount: counts.get(`${row.id}|reserved`) ?? 0,
    givenAwayMinor: given.get(row.code) ?? 0,
  };
}

/** The shop's codes, with uses and what each took off paid orders: the business view's "given away". */
export function discountsView(deps: OffersDeps, shop: OffersShopRow): DiscountsView {
  const counts = new Map(repo.countUses(deps.db, shop.id).map((c) => [`${c.codeId}|${c.state}`, c.n]));
  const givenRows = repo.givenAway(deps.db, shop.id);
  const given = new Map(givenRows.map((g) => [g.code ?? '', g.minor]));
  return {
    currency: shop.currency,
    codes: repo.codes(deps.db, shop.id).map((c) => codeView(c, counts, given)),
    givenAwayMinor: givenRows.reduce((a, g) => a + g.minor, 0),
    ordersWithCode: givenRows.reduce((a, g) => a + g.n, 0),
  };
}

function columnsOf(deps: OffersDeps, shop: OffersShopRow, v: DiscountCodeValues) {
  const listingIds = [...new Set(v.listingIds)];
  const own = repo.shopListingIds(deps.db, shop.id, listingIds);
  if (own.length !== listingIds.length) throw badRequest('Pick listings of your own shop.', { listingIds: 'Pick listings of your own shop.' });
  return {
    code: v.code,
    kind: v.kind,
    value: v.kind === 'percent' ? v.percentOff! * 100 : v.amountOffMinor!,
    minSpendMinor: v.minSpendMinor,
    startsOn: v.startsOn,
    endsOn: v.endsOn,
    usageLimit: v.usageLimit,
    listingIds: listingIds.length ? listingIds : null,
    active: v.active,
  };
}

export function createCode(deps: OffersDeps, shop: OffersShopRow, v: DiscountCodeValues): DiscountsView {
  if (repo.codes(deps.db, shop.id).length >= MAX_CODES_PER_SHOP) throw conflict(`A shop can have at most ${MAX_CODES_PER_SHOP} codes. Delete old ones first.`);
  if (repo.codeByText(deps.db, shop.id, v.code)) throw conflict(`You have a code ${v.code} already.`, { code: 'You have this code already.' });
  const at = deps.now();
  repo.insertCode(deps.db, { id: crypto.randomUUID(), shopId: shop.id, ...columnsOf(deps, shop, v), createdAt: at, updatedAt: at });
  return discountsView(deps, shop);
}

/**
 * Changes a code's terms for checkouts from now on (paid orders keep what they paid). A code that has
 * been used keeps its text: orders and the business view's "given away" name it.
 */
export function updateCode(deps: OffersDeps, shop: OffersShopRow, id: string, v: DiscountCodeValues): DiscountsView {
  const row = repo.code(deps.db, shop.id, id);
  if (!row) throw notFound('We could not find that code in your shop.');
  const cols = columnsOf(deps, shop, v);
  if (cols.code !== row.code && repo.hasUses(deps.db, id))
    throw conflict(`${row.code} has been used at checkout, so its text stays. Make a new code instead.`, { code: 'A code that has been used keeps its text.' });
  if (cols.code !== row.code && repo.codeByText(deps.db, shop.id, cols.code)) throw conflict(`You have a code ${cols.code} already.`, { code: 'You have this code already.' });
  repo.updateCode(deps.db, id, { ...cols, updatedAt: deps.now() });
  return discountsView(deps, shop);
}

export function deleteCode(deps: OffersDeps, shop: OffersShopRow, id: string): DiscountsView {
  const row = repo.code(deps.db, shop.id, id);
  if (!row) throw notFound('We could not find that code in your shop.');
  if (repo.hasUses(deps.db, id)) throw conflict(`${row.code} has been used at checkout, so it stays on record. Pause it instead.`);
  repo.deleteCode(deps.db, id);
  return discountsView(deps, shop);
}

// ---------------------------------------------------------------- delivery: shipping days, order-by dates, the listing's dates

export function setShippingDays(deps: OffersDeps, shop: OffersShopRow, days: number): { shippingDays: number } {
  repo.setShippingDays(deps.db, shop.id, days, deps.now());
  return { shippingDays: days };
}

export const orderByDatesOf = (deps: OffersDeps, shopId: string, fromToday = false): OrderByDate[] => repo.orderByDates(deps.db, shopId, fromToday ? todayOf(deps) : undefined);

export function addOrderByDate(deps: OffersDeps, shop: OffersShopRow, raw: OrderByDateInput): OrderByDate[] {
  const v = orderByDateSchema.parse(raw);
  if (v.orderBy < todayOf(deps)) throw badRequest('That date has passed.', { orderBy: 'Pick today or a later day.' });
  if (repo.countOrderByDates(deps.db, shop.id) >= MAX_ORDER_BY_DATES) throw conflict(`At most ${MAX_ORDER_BY_DATES} order-by dates. Delete past ones first.`);
  repo.insertOrderByDate(deps.db, { id: crypto.randomUUID(), shopId: shop.id, occasion: v.occasion, orderBy: v.orderBy, createdAt: deps.now() });
  return orderByDatesOf(deps, shop.id);
}

export function deleteOrderByDate(deps: OffersDeps, shop: OffersShopRow, id: string): OrderByDate[] {
  if (!repo.deleteOrderByDate(deps.db, shop.id, id)) throw notFound('We could not find that date in your shop.');
  return orderByDatesOf(deps, shop.id);
}

/** The listing page's dates: when an order placed today ships and arrives, the needed-by check, the banners. */
export function listingDelivery(deps: OffersDeps, slug: string, neededBy: string | null): ListingDelivery {
  const row = repo.liveListingShop(deps.db, slug);
  if (!row || row.shop.state !== 'live' || !row.live || !['live', 'in_review'].includes(row.listingState)) throw notFound('This listing is not on sale right now.');
  const today = todayOf(deps);
  const plan = planOf(row.shop);
  const e = earliestArrival(today, plan);
  return {
    processingDays: plan.processingDays,
    shippingDays: plan.shippingDays,
    shipBy: e.shipBy,
    arrival: e.arrival,
    verdict: neededBy && neededBy > today ? neededByVerdict(today, neededBy, plan) : null,
    orderBy: orderByDatesOf(deps, row.shop.id, true),
  };
}
