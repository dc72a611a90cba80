// Blank types, their stock, and the holds a checkout takes on it. Stock is counted per blank type ×
// size × colour; `blank_stock.quantity` is what is free to sell. A checkout takes what its lines
// need in the same transaction that opens it, with a conditional decrement (`quantity >= n`), so
// SQLite's one writer at a time makes two shoppers racing for the last item come out as one hold
// and one refusal. The hold is sold when the payment is confirmed and given back when the payment
// session expires or is replaced.
import crypto from 'node:crypto';
import {
  type BlankStockInput,
  type BlankTypeInput,
  blankStockInputSchema,
  blankTypeInputSchema,
  type ListingBlankOffer,
  MAX_BLANK_TYPES,
  type ResolvedBlankOffer,
  type SellerBlankType,
  stockKey,
} from '../../../shared/schemas/blanks.ts';
import type { BlankKind } from '../../../shared/schemas/listing.ts';
import type { Db } from '../../db/client.ts';
import { badRequest, conflict, notFound } from '../../http/app-error.ts';
import { uploadUrl } from '../../integrations/storage.ts';
import { type BlankTypeRow, blanksRepo } from './blanks.repo.ts';

type Clock = { db: Db; now: () => number };

function photoUrls(db: Db, shopId: string, t: BlankTypeRow): Map<string, string> {
  const ids = t.colours.flatMap((c) => (c.photoId ? [c.photoId] : []));
  return new Map(blanksRepo.photos(db, shopId, ids).map((u) => [u.id, uploadUrl(u.thumbPath)!]));
}

function view(db: Db, t: BlankTypeRow): SellerBlankType {
  const photos = photoUrls(db, t.shopId, t);
  const held = new Map(blanksRepo.heldFor(db, t.id).map((h) => [stockKey(h.sizeId, h.colourId), Number(h.n)]));
  const rows = new Map(blanksRepo.stock(db, t.id).map((r) => [stockKey(r.sizeId, r.colourId), r]));
  return {
    id: t.id,
    name: t.name,
    shape: t.shape as BlankKind,
    sizes: t.sizes,
    colours: t.colours.map((c) => ({ ...c, photoUrl: c.photoId ? (photos.get(c.photoId) ?? null) : null })),
    // every size × colour, counted or not (an uncounted pair has none to sell)
    stock: t.sizes.flatMap((s) =>
      t.colours.map((c) => {
        const r = rows.get(stockKey(s.id, c.id));
        return { sizeId: s.id, colourId: c.id, quantity: r?.quantity ?? 0, lowStock: r?.lowStock ?? 3, held: held.get(stockKey(s.id, c.id)) ?? 0 };
      }),
    ),
    createdAt: t.createdAt,
    updatedAt: t.updatedAt,
  };
}

export const listTypes = (db: Db, shopId: string): SellerBlankType[] => blanksRepo.types(db, shopId).map((t) => view(db, t));

/** Sizes and colours keep their ids where the seller kept the row; new rows get new ids. */
function withIds(input: ReturnType<typeof blankTypeInputSchema.parse>, old: BlankTypeRow | undefined) {
  const keep = (id: string | undefined, known: Array<{ id: string }>) => (id && known.some((k) => k.id === id) ? id : crypto.randomUUID());
  return {
    sizes: input.sizes.map((s) => ({ ...s, id: keep(s.id, old?.sizes ?? []) })),
    colours: input.colours.map((c) => ({ ...c, id: keep(c.id, old?.colours ?? []) })),
  };
}

function checkPhotos(db: Db, shopId: string, colours: Array<{ photoId: string | null }>) {
  const ids = colours.flatMap((c) => (c.photoId ? [c.photoId] : []));
  const found = new Set(blanksRepo.photos(db, shopId, ids).map((u) => u.id));
  const bad = colours.findIndex((c) => c.photoId && !found.has(c.photoId));
  if (bad >= 0) throw badRequest('That photo is not one of your uploads.', { [`colours.${bad}.photoId`]: 'That photo is not one of your uploads.' });
}

export function createType(deps: Clock, shopId: string, raw: BlankTypeInput): SellerBlankType {
  const input = blankTypeInputSchema.parse(raw);
  if (blanksRepo.count(deps.db, shopId) >= MAX_BLANK_TYPES) throw conflict(`A shop has at most ${MAX_BLANK_TYPES} blank types.`);
  checkPhotos(deps.db, shopId, input.colours);
  const at = deps.now();
  const id = crypto.randomUUID();
  blanksRepo.insertType(deps.db, { id, shopId, name: input.name, shape: input.shape, ...withIds(input, undefined), createdAt: at, updatedAt: at });
  return view(deps.db, blanksRepo.type(deps.db, shopId, id)!);
}

export function updateType(deps: Clock, shopId: string, id: string, raw: BlankTypeInput): SellerBlankType {
  const old = blanksRepo.type(deps.db, shopId, id);
  if (!old) throw notFound('No such blank type.');
  const input = blankTypeInputSchema.parse(raw);
  checkPhotos(deps.db, shopId, input.colours);
  blanksRepo.updateType(deps.db, shopId, id, { name: input.name, shape: input.shape, ...withIds(input, old), updatedAt: deps.now() });
  return view(deps.db, blanksRepo.type(deps.db, shopId, id)!);
}

export function setStock(deps: Clock, shopId: string, id: string, raw: BlankStockInput): SellerBlankType {
  const t = blanksRepo.type(deps.db, shopId, id);
  if (!t) throw notFound('No such blank type.');
  const input = blankStockInputSchema.parse(raw);
  const bad = input.rows.findIndex((r) => !t.sizes.some((s) => s.id === r.sizeId) || !t.colours.some((c) => c.id === r.colourId));
  if (bad >= 0) throw badRequest('That size or colour is not part of this blank type.', { [`rows.${bad}`]: 'That size or colour is not part of this blank type.' });
  deps.db.transaction((tx) => {
    for (const r of input.rows) blanksRepo.upsertStock(tx as unknown as Db, { blankTypeId: id, ...r });
  });
  return view(deps.db, t);
}

/** A listing's blank offer must name the shop's own blank type and sizes and colours it has. */
export function checkOffer(db: Db, shopId: string, offer: ListingBlankOffer | null | undefined): void {
  if (!offer) return;
  const t = blanksRepo.type(db, shopId, offer.blankTypeId);
  if (!t) throw badRequest('Pick one of your blank types.', { 'blankOffer.blankTypeId': 'Pick one of your blank types.' });
  if (offer.sizeIds.some((s) => !t.sizes.some((x) => x.id === s))) throw badRequest('That size is not part of the blank type.', { 'blankOffer.sizeIds': 'That size is not part of the blank type.' });
  if (offer.colourIds.some((c) => !t.colours.some((x) => x.id === c)))
    throw badRequest('That colour is not part of the blank type.', { 'blankOffer.colourIds': 'That colour is not part of the blank type.' });
}

/**
 * A listing's offer resolved against its shop's blank type now: the sizes and colours it offers that
 * still exist (in the type's order), which pairs are sold out, and the default colour. Null when the
 * listing has no offer or nothing of it is left.
 */
export function resolveOffer(db: Db, shopId: string, offer: ListingBlankOffer | null | undefined): ResolvedBlankOffer | null {
  if (!offer) return null;
  const t = blanksRepo.type(db, shopId, offer.blankTypeId);
  if (!t) return null;
  const sizes = t.sizes.filter((s) => offer.sizeIds.includes(s.id));
  const photos = photoUrls(db, shopId, t);
  const colours = t.colours.filter((c) => offer.colourIds.includes(c.id)).map((c) => ({ ...c, photoUrl: c.photoId ? (photos.get(c.photoId) ?? null) : null }));
  if (!sizes.length || !colours.length) return null;
  const free = new Map(blanksRepo.stock(db, t.id).map((r) => [stockKey(r.sizeId, r.colourId), r.quantity]));
  const soldOut = sizes.flatMap((s) => colours.flatMap((c) => ((free.get(stockKey(s.id, c.id)) ?? 0) > 0 ? [] : [stockKey(s.id, c.id)])));
  const defaultColourId = offer.defaultColourId && colours.some((c) => c.id === offer.defaultColourId) ? offer.defaultColourId : colours[0]!.id;
  return { blankTypeId: t.id, name: t.name, shape: t.shape as BlankKind, sizes, colours, defaultColourId, intendedPairs: offer.intendedPairs, soldOut };
}

export type HoldItem = { blankTypeId: string; sizeId: string; colourId: string; quantity: number; what: string };

/**
 * Takes the items out of stock for a checkout (call inside the transaction that opens it). If any
 * one is short, throws 409 naming it and the caller's transaction gives back what was taken.
 * Does nothing when the checkout already holds (or has sold) its stock.
 */
export function holdStock(db: Db, checkoutId: string, items: HoldItem[], at: number): void {
  if (blanksRepo.holdsOf(db, checkoutId).some((h) => h.state !== 'released')) return;
  const merged = new Map<string, HoldItem>();
  for (const i of items) {
    const k = `${i.blankTypeId}:${stockKey(i.sizeId, i.colourId)}`;
    const m = merged.get(k);
    merged.set(k, m ? { ...m, quantity: m.quantity + i.quantity } : { ...i });
  }
  for (const i of merged.values()) {
    if (!blanksRepo.take(db, i, i.quantity)) {
      throw conflict(`${i.what} has just sold out${i.quantity > 1 ? ' (or fewer are left than you asked for)' : ''}. Nothing was charged; change the size or colour in your cart to check out.`);
    }
    blanksRepo.insertHold(db, { id: crypto.randomUUID(), checkoutId, blankTypeId: i.blankTypeId, sizeId: i.sizeId, colourId: i.colourId, quantity: i.quantity, state: 'held', createdAt: at });
  }
}

/**
 * Gives a checkout's held stock back (its payment session expired or was replaced); a second call
 * gives nothing. Call inside a transaction, with the checkout's own state change.
 */
export function releaseHolds(db: Db, checkoutId: string): number {
  let n = 0;
  for (const h of blanksRepo.holdsOf(db, checkoutId)) {
    if (h.state !== 'held' || !blanksRepo.moveHold(db, h.id, 'held', 'released')) continue;
    blanksRepo.adjust(db, h, h.quantity);
    n += h.quantity;
  }
  return n;
}

/**
 * The checkout was paid: its holds are sold. Holds given back before a late payment arrived are
 * taken again (the payment stands; the count may then go below zero and the seller sees it).
 */
export function sellHolds(db: Db, checkoutId: string): void {
  for (const h of blanksRepo.holdsOf(db, checkoutId)) {
    if (h.state === 'held') blanksRepo.moveHold(db, h.id, 'held', 'sold');
    else if (h.state === 'released' && blanksRepo.moveHold(db, h.id, 'released', 'sold')) blanksRepo.adjust(db, h, -h.quantity);
  }
}
