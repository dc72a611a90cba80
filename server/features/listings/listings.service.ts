import crypto from 'node:crypto';
import slugify from 'slugify';
import { type ListingContent, type ListingState, materialIdsOf, type SellerListing, type SellerListingsQuery } from '../../../shared/schemas/listing.ts';
import { type Page, pageOffset, toPage } from '../../../shared/schemas/pagination.ts';
import type { Db } from '../../db/client.ts';
import { AppError, conflict, notFound } from '../../http/app-error.ts';
import { checkOffer } from '../blanks/index.ts';
import { countOwn, deleteOwn, findOwn, insertListing, type ListingRow, listOwn, ownMaterials, ownMotifs, ownPhotos, slugsLike, updateOwn } from './listings.repo.ts';

type Deps = { db: Db; now: () => number };

export function toSellerListing(l: ListingRow): SellerListing {
  return {
    id: l.id,
    slug: l.slug,
    state: l.state as ListingState,
    pendingReview: l.pendingReview,
    rejectionReason: l.rejectionReason,
    revision: l.revision,
    draft: l.draft,
    live: l.live,
    currency: l.currency,
    publishedAt: l.publishedAt,
    createdAt: l.createdAt,
    updatedAt: l.updatedAt,
  };
}

const gone = () => notFound('No such listing in your shop.');

/**
 * Everything a listing refers to must belong to the seller's own shop: materials (not archived),
 * motifs (and the layer ids must exist in the motif), photos. Another shop's id reads as unknown.
 */
function checkReferences(db: Db, shopId: string, c: ListingContent) {
  const fields: Record<string, string> = {};
  const p = c.personalisation;
  const mats = new Map(ownMaterials(db, shopId, materialIdsOf(p)).map((m) => [m.id, m]));
  const checkMat = (id: string | undefined, path: string) => {
    if (!id) return;
    const m = mats.get(id);
    if (!m) fields[path] = 'Pick a material from your shop.';
    else if (m.archived) fields[path] = 'This material is archived; pick another.';
  };
  p.textFields.forEach((f, i) => f.colourChoices.forEach((m, j) => checkMat(m, `personalisation.textFields.${i}.colourChoices.${j}`)));
  p.outline?.colourChoices.forEach((m, j) => checkMat(m, `personalisation.outline.colourChoices.${j}`));
  const motifs = new Map(
    ownMotifs(
      db,
      shopId,
      p.motifChoices.map((m) => m.motifId),
    ).map((m) => [m.id, m]),
  );
  p.motifChoices.forEach((mc, i) => {
    const motif = motifs.get(mc.motifId);
    if (!motif) {
      fields[`personalisation.motifChoices.${i}.motifId`] = 'Pick a motif from your shop.';
      return;
    }
    const layerIds = new Set(motif.geometry.layers.map((l) => l.id));
    mc.layers.forEach((l, j) => {
      if (!layerIds.has(l.layerId)) fields[`personalisation.motifChoices.${i}.layers.${j}.layerId`] = 'This motif has no such layer.';
      checkMat(l.materialId, `personalisation.motifChoices.${i}.layers.${j}.materialId`);
      l.colourChoices?.forEach((m, k) => checkMat(m, `personalisation.motifChoices.${i}.layers.${j}.colourChoices.${k}`));
    });
  });
  const photos = new Set(
    ownPhotos(db, shopId, c.photoIds)
      .filter((u) => u.kind === 'photo')
      .map((u) => u.id),
  );
  c.photoIds.forEach((id, i) => {
    if (!photos.has(id)) fields[`photoIds.${i}`] = 'Upload this photo to your shop first.';
  });
  if (Object.keys(fields).length) throw new AppError(400, 'invalid_input', 'Some fields need attention.', fields);
  checkOffer(db, shopId, c.blankOffer);
}

function uniqueSlug(db: Db, title: string): string {
  const base = slugify(title, { lower: true, strict: true }).slice(0, 60).replace(/-+$/, '') || 'listing';
  const taken = new Set(slugsLike(db, base));
  if (!taken.has(base)) return base;
  for (let i = 2; ; i++) if (!taken.has(`${base}-${i}`)) return `${base}-${i}`;
}

/** One page of the shop's listings, last changed first, optionally in one state. */
export function list(db: Db, shopId: string, q: SellerListingsQuery): Page<SellerListing> {
  return toPage(listOwn(db, shopId, q.state, q.limit, pageOffset(q)).map(toSellerListing), countOwn(db, shopId, q.state), q);
}

export function get(db: Db, shopId: string, id: string): SellerListing {
  const l = findOwn(db, shopId, id);
  if (!l) throw gone();
  return toSellerListing(l);
}

export function create(deps: Deps, shop: { id: string; currency: string }, content: ListingContent): SellerListing {
  checkReferences(deps.db, shop.id, content);
  const at = deps.now();
  return toSellerListing(
    insertListing(deps.db, {
      id: crypto.randomUUID(),
      shopId: shop.id,
      slug: uniqueSlug(deps.db, content.title),
      state: 'draft',
      draft: content,
      currency: shop.currency,
      createdAt: at,
      updatedAt: at,
    }),
  );
}

/**
 * Saves the working copy as a new revision. A listing on sale (live or paused) keeps its approved
 * copy on sale and the change waits for review (pendingReview); a listing in review stays in the
 * queue with the new revision, so a moderator who opened an older one cannot approve it (409); a
 * rejected listing becomes a draft again.
 */
export function update(deps: Deps, shopId: string, id: string, content: ListingContent): SellerListing {
  const l = findOwn(deps.db, shopId, id);
  if (!l) throw gone();
  checkReferences(deps.db, shopId, content);
  const onSale = l.live !== null && (l.state === 'live' || l.state === 'paused');
  const state = l.state === 'rejected' ? 'draft' : l.state;
  return toSellerListing(
    updateOwn(deps.db, shopId, id, {
      draft: content,
      state,
      pendingReview: onSale ? true : l.pendingReview,
      rejectionReason: onSale ? l.rejectionReason : null,
      revision: l.revision + 1,
      updatedAt: deps.now(),
    })!,
  );
}

/** draft | rejected → in_review. */
export function submit(deps: Deps, shopId: string, id: string): SellerListing {
  const l = findOwn(deps.db, shopId, id);
  if (!l) throw gone();
  if (l.state === 'in_review' || l.pendingReview) return toSellerListing(l);
  if (l.state !== 'draft' && l.state !== 'rejected') throw conflict('Only a draft or a rejected listing can be sent for review; edit a live listing to send its changes.');
  return toSellerListing(updateOwn(deps.db, shopId, id, { state: 'in_review', rejectionReason: null, updatedAt: deps.now() })!);
}

export function setPaused(deps: Deps, shopId: string, id: string, paused: boolean): SellerListing {
  const l = findOwn(deps.db, shopId, id);
  if (!l) throw gone();
  const from = paused ? 'live' : 'paused';
  if (l.state !== from) throw conflict(paused ? 'Only a live listing can be paused.' : 'Only a paused listing can be put back on sale.');
  return toSellerListing(updateOwn(deps.db, shopId, id, { state: paused ? 'paused' : 'live', updatedAt: deps.now() })!);
}

/** A listing that was never on sale can be deleted; one that was (orders may point at it) is paused instead. */
export function remove(deps: Deps, shopId: string, id: string) {
  const l = findOwn(deps.db, shopId, id);
  if (!l) throw gone();
  if (l.live !== null || l.publishedAt !== null) throw conflict('This listing has been on sale; pause it instead of deleting it.');
  deleteOwn(deps.db, shopId, id);
  return { deleted: true };
}
