// The shopper's side of a change request: read what may be edited, and save the new
// personalisation. The new choices go through the same checks and the same engine composition as
// the cart (cart/design.ts buildSnapshot — reused, not copied, so the rules can't drift); the line
// gets a new line_versions row and goes back to `awaiting_proof` (through orders' transition()).
// Every version is kept.
import crypto from 'node:crypto';
import { catalogEntry } from '../../../shared/engine/font-catalog.ts';
import { materialLabel } from '../../../shared/material-label.ts';
import { formatMoney } from '../../../shared/money.ts';
import type { LineSnapshot } from '../../../shared/schemas/cart.ts';
import { canMoveLine, type LineState } from '../../../shared/schemas/order.ts';
import { type PersonalisationEdit, personalisationEditSchema } from '../../../shared/schemas/workroom.ts';
import type { Db } from '../../db/client.ts';
import { AppError, notFound } from '../../http/app-error.ts';
// the cart's snapshot builder is the one definition of "a valid personalisation" (one-way import)
import { resolveOffer } from '../blanks/index.ts';
import { buildSnapshotOffThread, readLiveContent, snapshotLookups } from '../cart/index.ts';
import { transition } from '../orders/index.ts';
import type { WorkroomPoolDeps } from './lines.service.ts';
import { workroomRepo as repo } from './workroom.repo.ts';

function buyersLine(db: Db, buyerId: string, lineId: string) {
  const line = repo.lineById(db, lineId);
  const order = line ? repo.orderById(db, line.orderId) : undefined;
  if (!line || !order || order.buyerId !== buyerId) throw notFound('We could not find that item in your orders.');
  return { line, order };
}

function contentOf(db: Db, listingId: string) {
  const l = repo.listing(db, listingId);
  // the copy the shopper bought from; a listing paused since then can still be corrected
  const content = readLiveContent(l?.live ?? l?.draft);
  if (!l || !content) throw new AppError(409, 'listing_gone', 'This listing can no longer be personalised. Write to the shop about the change.');
  return { listing: l, content };
}

export function personalisationForEdit(db: Db, buyerId: string, lineId: string): PersonalisationEdit {
  const { line } = buyersLine(db, buyerId, lineId);
  const { listing, content } = contentOf(db, line.listingId);
  const mats = new Map(repo.materialsOfShop(db, listing.shopId).map((m) => [m.id, m]));
  const events = repo.events(db, [line.id]);
  const request = [...events].reverse().find((e) => e.toState === 'changes_requested');
  return {
    line: { id: line.id, orderId: line.orderId, state: line.state, listingTitle: line.listingTitle, version: line.version },
    editable: canMoveLine(line.state as LineState, 'awaiting_proof', 'shopper'),
    changeRequest: line.state === 'changes_requested' ? (request?.message ?? null) : null,
    choices: line.snapshot.choices,
    textFields: content.personalisation.textFields.map((f) => ({
      id: f.id,
      label: f.label,
      maxLength: f.maxLength,
      required: f.required,
      fonts: f.fontIds.map((id) => {
        const e = catalogEntry(id);
        return { id, label: e ? `${e.family} (${e.style})` : id };
      }),
      colours: f.colourChoices.map((id) => {
        const m = mats.get(id);
        return { id, label: m ? materialLabel(m) : 'Unavailable colour', hex: m?.colourHex ?? '#000000' };
      }),
    })),
  };
}

export async function savePersonalisation(deps: WorkroomPoolDeps, buyerId: string, lineId: string, raw: unknown): Promise<PersonalisationEdit> {
  const { db } = deps;
  const { choices } = personalisationEditSchema.parse(raw);
  const { line } = buyersLine(db, buyerId, lineId);
  if (!canMoveLine(line.state as LineState, 'awaiting_proof', 'shopper')) {
    throw new AppError(409, 'wrong_state', 'This item can be edited only while the shop has asked for a change.');
  }
  const { listing, content } = contentOf(db, line.listingId);
  const old = line.snapshot;

  const p = content.personalisation;
  const { materials, motifs } = snapshotLookups(
    p,
    repo.materialsOfShop(db, listing.shopId),
    repo.motifsOfShop(
      db,
      listing.shopId,
      p.motifChoices.map((m) => m.motifId),
    ),
  );
  // the size and colour were paid for and taken from stock: a text correction keeps them (a line
  // bought before the listing offered sizes stays without)
  const offer = old.choices.sizeId ? resolveOffer(db, listing.shopId, content.blankOffer) : null;
  // composed in the worker pool: the request thread never runs the geometry
  const fresh = await buildSnapshotOffThread({
    pool: deps.pool,
    listing: { id: listing.id, slug: listing.slug, shopId: listing.shopId, currency: listing.currency },
    content,
    choices: { ...choices, sizeId: old.choices.sizeId ?? null, colourId: old.choices.colourId ?? null },
    materials,
    motifs,
    offer: offer && { ...offer, soldOut: [] },
  });
  // The item is paid: a correction may not add layers that would cost more than was paid.
  if (fresh.unitPriceMinor > old.unitPriceMinor) {
    throw new AppError(
      409,
      'price_changed',
      `This change adds a layer and would cost ${formatMoney(fresh.unitPriceMinor, old.currency)} instead of the ${formatMoney(old.unitPriceMinor, old.currency)} you paid. Keep the same colours, or write to the shop.`,
    );
  }
  // the line may have moved while the design was composed: save only onto the version we read
  const now = buyersLine(db, buyerId, lineId).line;
  if (now.version !== line.version || now.state !== line.state) {
    throw new AppError(409, 'line_changed', 'This item changed while your edit was being saved. Reload it and try again.');
  }
  const snapshot: LineSnapshot = { ...fresh, unitPriceMinor: old.unitPriceMinor, listingTitle: old.listingTitle };
  const at = deps.now();
  const version = line.version + 1;
  db.transaction((tx) => {
    const t = tx as unknown as Db;
    repo.insertVersion(t, { id: crypto.randomUUID(), lineId: line.id, version, snapshot, authorId: buyerId, createdAt: at });
    transition(t, { line, to: 'awaiting_proof', actor: 'shopper', actorId: buyerId, at, message: `Personalisation edited (version ${version}).`, set: { snapshot, version } });
  });
  return personalisationForEdit(db, buyerId, lineId);
}
