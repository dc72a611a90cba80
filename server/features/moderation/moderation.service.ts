import crypto from 'node:crypto';
import { type ListingPage, type ModerationShopsFilter, type ModerationShopsPage, STALE_LISTING_MESSAGE, STALE_SHOP_CHANGE_MESSAGE } from '../../../shared/schemas/catalog.ts';
import { liveColumns } from '../../../shared/schemas/listing.ts';
import { type PageQuery, pageOffset, toPage } from '../../../shared/schemas/pagination.ts';
import type { ShopState } from '../../../shared/schemas/shop.ts';
import type { Db } from '../../db/client.ts';
import { AppError, conflict, forbidden, notFound } from '../../http/app-error.ts';
import type { SessionUser } from '../../http/auth-guards.ts';
import type { Mailer } from '../../integrations/mailer.ts';
import { escapeHtml, mailLayout } from '../../integrations/mailer.ts';
import { listingPage } from '../catalog/index.ts';
import * as repo from './moderation.repo.ts';

type Deps = { db: Db; now: () => number; mailer: Mailer; env: { baseUrl: string } };

/** One audit-log row: every moderation decision, and other admin acts on people's content (hiding a review). */
export function recordAudit(deps: Pick<Deps, 'db' | 'now'>, actor: SessionUser, action: string, subjectType: 'shop' | 'listing' | 'review', subjectId: string, reason: string | null) {
  repo.insertAudit(deps.db, { id: crypto.randomUUID(), actorId: actor.id, action, subjectType, subjectId, reason, createdAt: deps.now() });
}

/** Mail is sent after the change is committed; a mail failure is logged, never undoes a decision. */
async function tell(deps: Deps, shopId: string, subject: string, lines: string[]) {
  const owner = repo.ownerOf(deps.db, shopId);
  if (!owner) return;
  const text = `Hello ${owner.name},\n\n${lines.join('\n\n')}\n\n— Namesake moderation`;
  const html = mailLayout(subject, `<p>Hello ${escapeHtml(owner.name)},</p>${lines.map((l) => `<p style="white-space:pre-wrap">${escapeHtml(l)}</p>`).join('')}<p>— Namesake moderation</p>`);
  try {
    await deps.mailer.send({ to: owner.email, subject, text, html });
  } catch (e) {
    console.error('moderation mail failed', e);
  }
}

const stale = (message: string) => new AppError(409, 'stale_revision', message);

/** Separation of duties: an admin who also keeps a shop cannot decide on that shop's things. */
function notOwnShop(db: Db, actor: SessionUser, shopId: string) {
  if (repo.findShop(db, shopId)?.ownerId === actor.id) throw forbidden('This is your own shop: another admin must decide on it.');
}

/** Shops waiting for their first review, oldest first, a page at a time. */
export function shopQueue(db: Db, q: PageQuery) {
  const rows = repo.shopsInReview(db, q.limit, pageOffset(q)).map(({ shop, ownerEmail, ownerName }) => ({
    id: shop.id,
    name: shop.name,
    slug: shop.slug,
    state: shop.state,
    description: shop.description,
    owner: { name: ownerName, email: ownerEmail },
    createdAt: shop.createdAt,
    /** the revision of the name/description shown; approving may name it */
    revision: shop.changeRevision,
  }));
  return toPage(rows, repo.shopsInReviewCount(db), q);
}

/** Name/description changes of approved shops: the public shop keeps `before` until approval. */
export function shopChangeQueue(db: Db, q: PageQuery) {
  const rows = repo.shopsWithChanges(db, q.limit, pageOffset(q)).map(({ shop, ownerEmail, ownerName }) => ({
    id: shop.id,
    slug: shop.slug,
    state: shop.state,
    owner: { name: ownerName, email: ownerEmail },
    revision: shop.changeRevision,
    before: { name: shop.name, description: shop.description },
    after: { name: shop.pendingChange?.name ?? shop.name, description: shop.pendingChange?.description ?? shop.description },
    changed: [...(shop.pendingChange?.name !== undefined ? ['name' as const] : []), ...(shop.pendingChange?.description !== undefined ? ['description' as const] : [])],
    submittedAt: shop.pendingChange?.submittedAt ?? shop.updatedAt,
  }));
  return toPage(rows, repo.shopsWithChangesCount(db), q);
}

function queueListing({ listing, shop }: { listing: repo.ListingRow; shop: repo.ShopRow }) {
  return {
    id: listing.id,
    slug: listing.slug,
    state: listing.state,
    pendingReview: listing.pendingReview,
    /** the revision shown here; approve/reject must name it */
    revision: listing.revision,
    /** "new" waits for its first approval; "edit" is a change to a listing already on sale */
    kind: listing.live ? ('edit' as const) : ('new' as const),
    title: listing.draft.title,
    shop: { id: shop.id, name: shop.name, slug: shop.slug, state: shop.state },
    draft: listing.draft,
    live: listing.live,
    /** the listing page as a shopper would see it: GET this URL (admin only for drafts) */
    previewUrl: `/api/listings/${listing.slug}?version=draft`,
    submittedAt: listing.updatedAt,
  };
}

/** Listings waiting for review (new ones and edits of live ones), oldest first, a page at a time. */
export function listingQueue(db: Db, q: PageQuery) {
  return toPage(repo.listingsInReview(db, q.limit, pageOffset(q)).map(queueListing), repo.listingsInReviewCount(db), q);
}

/** One listing of the queue, whatever page of the queue it is on (404 once it is decided). */
export function listingQueueItem(db: Db, id: string) {
  const row = repo.listingInReview(db, id);
  if (!row) throw notFound('This listing is not waiting for review (it may have been decided already).');
  return queueListing(row);
}

/** A motif of the listing that is the same artwork as another shop's (same geometry fingerprint). */
export type MotifReuse = { motifId: string; motifName: string; otherShop: { name: string; slug: string }; otherMotifName: string };

/**
 * One listing waiting for review, with its page rendered from the same read of the row: the
 * revision returned is the one whose text the moderator is shown.
 */
export function listingForReview(db: Db, actor: SessionUser, id: string): { listing: ReturnType<typeof queueListing>; page: ListingPage; motifReuse: MotifReuse[] } {
  const l = repo.findListing(db, id);
  const shop = l ? repo.findShop(db, l.shopId) : undefined;
  if (!l || !shop) throw notFound('No such listing.');
  if (l.state !== 'in_review' && !l.pendingReview) throw notFound('This listing is not waiting for review (it may have been decided already).');
  const motifIds = l.draft.personalisation.motifChoices.map((m) => m.motifId);
  return { listing: queueListing({ listing: l, shop }), page: listingPage(db, l.slug, 'draft', actor), motifReuse: repo.motifsSharedWithOtherShops(db, shop.id, motifIds) };
}

/** The desk's shop directory: any shop in any state, so a live one can be found and suspended. */
export function shops(db: Db, f: ModerationShopsFilter): ModerationShopsPage {
  const rows = repo.shopsPage(db, f, f.limit, pageOffset(f));
  const items = rows.map(({ shop, ownerEmail, ownerName }) => ({
    id: shop.id,
    name: shop.name,
    slug: shop.slug,
    state: shop.state as ShopState,
    stateReason: shop.stateReason ?? null,
    owner: { name: ownerName, email: ownerEmail },
    createdAt: shop.createdAt,
  }));
  return toPage(items, repo.shopsCount(db, f), f);
}

/** The listing a moderator decides on: waiting for review, not in their own shop, still at the revision they saw. */
function waiting(db: Db, actor: SessionUser, id: string, revision: number) {
  const l = repo.findListing(db, id);
  if (!l) throw notFound('No such listing.');
  if (l.state !== 'in_review' && !l.pendingReview) throw conflict('This listing is not waiting for review.');
  notOwnShop(db, actor, l.shopId);
  if (l.revision !== revision) throw stale(STALE_LISTING_MESSAGE);
  return l;
}

/** Publishes exactly the revision the moderator reviewed; a later seller edit makes this a 409. */
export async function approveListing(deps: Deps, actor: SessionUser, id: string, revision: number) {
  const l = waiting(deps.db, actor, id, revision);
  const content = l.draft;
  const at = deps.now();
  const row = deps.db.transaction((tx) => {
    const db = tx as unknown as Db;
    const updated = repo.updateListingAt(db, id, revision, {
      live: l.draft,
      ...liveColumns(content),
      liveThumbPath: repo.thumbOf(db, l.shopId, content.photoIds[0]),
      state: l.state === 'paused' ? 'paused' : 'live',
      pendingReview: false,
      rejectionReason: null,
      publishedAt: l.publishedAt ?? at,
      updatedAt: at,
    });
    if (!updated) throw stale(STALE_LISTING_MESSAGE);
    recordAudit(deps, actor, 'listing.approve', 'listing', id, null);
    return updated;
  });
  await tell(deps, l.shopId, `Approved: ${content.title}`, [
    l.live ? `Your changes to "${content.title}" are approved and now on sale.` : `Your listing "${content.title}" is approved and on sale.`,
    `${deps.env.baseUrl}/listings/${l.slug}`,
  ]);
  return { id: row.id, state: row.state, pendingReview: row.pendingReview };
}

export async function rejectListing(deps: Deps, actor: SessionUser, id: string, revision: number, reason: string) {
  const l = waiting(deps.db, actor, id, revision);
  const content = l.draft;
  const at = deps.now();
  // a rejected edit leaves the approved copy on sale; a new listing goes back to the seller
  const row = deps.db.transaction((tx) => {
    const updated = repo.updateListingAt(
      tx as unknown as Db,
      id,
      revision,
      l.live ? { pendingReview: false, rejectionReason: reason, updatedAt: at } : { state: 'rejected', rejectionReason: reason, updatedAt: at },
    );
    if (!updated) throw stale(STALE_LISTING_MESSAGE);
    recordAudit(deps, actor, 'listing.reject', 'listing', id, reason);
    return updated;
  });
  await tell(deps, l.shopId, `Changes needed: ${content.title}`, [
    l.live ? `Your changes to "${content.title}" were not approved. The approved version stays on sale.` : `Your listing "${content.title}" was not approved yet.`,
    `Reason from the moderator:\n${reason}`,
    'Edit the listing in your workroom and send it for review again.',
  ]);
  return { id: row.id, state: row.state, pendingReview: row.pendingReview, rejectionReason: row.rejectionReason };
}

const SHOP_MOVES = {
  approve: { from: ['in_review'], to: 'live', action: 'shop.approve' },
  reject: { from: ['in_review'], to: 'rejected', action: 'shop.reject' },
  // a shop in review is not public yet: it is approved or rejected, there is nothing to suspend
  suspend: { from: ['live'], to: 'suspended', action: 'shop.suspend' },
  restore: { from: ['suspended'], to: 'live', action: 'shop.restore' },
} as const;
export type ShopMove = keyof typeof SHOP_MOVES;

/**
 * Shop decisions. The catalogue shows only listings of live shops (it joins on the shop's state),
 * so a suspension takes the shop's listings out of browse and search in this one update.
 */
export async function moveShop(deps: Deps, actor: SessionUser, id: string, move: ShopMove, reason: string | null, revision?: number) {
  const shop = repo.findShop(deps.db, id);
  if (!shop) throw notFound('No such shop.');
  if (shop.ownerId === actor.id) throw forbidden('This is your own shop: another admin must decide on it.');
  const m = SHOP_MOVES[move];
  if (!(m.from as readonly string[]).includes(shop.state)) throw conflict(`A shop that is ${shop.state.replace('_', ' ')} cannot be moved that way.`);
  // the desk sends the revision of the name/description it showed; a rename since then is a 409
  if (move === 'approve' && revision !== undefined && revision !== shop.changeRevision) throw stale(STALE_SHOP_CHANGE_MESSAGE);
  const row = deps.db.transaction((tx) => {
    const updated = repo.updateShop(tx as unknown as Db, id, { state: m.to, stateReason: reason, updatedAt: deps.now() })!;
    recordAudit(deps, actor, m.action, 'shop', id, reason);
    return updated;
  });
  const text: Record<ShopMove, string[]> = {
    approve: [`Your shop "${shop.name}" is approved. Listings you send for review can now go on sale.`],
    reject: [`Your shop "${shop.name}" was not approved.`, `Reason from the moderator:\n${reason ?? ''}`],
    suspend: [`Your shop "${shop.name}" is suspended; its listings are hidden from shoppers.`, `Reason from the moderator:\n${reason ?? ''}`],
    restore: [`Your shop "${shop.name}" is restored; its live listings are on sale again.`],
  };
  const subjects: Record<ShopMove, string> = { approve: 'Your shop is approved', reject: 'Your shop was not approved', suspend: 'Your shop is suspended', restore: 'Your shop is restored' };
  await tell(deps, id, subjects[move], text[move]);
  return { id: row.id, state: row.state, stateReason: row.stateReason };
}

function changeWaiting(db: Db, actor: SessionUser, id: string, revision: number) {
  const shop = repo.findShop(db, id);
  if (!shop) throw notFound('No such shop.');
  if (shop.ownerId === actor.id) throw forbidden('This is your own shop: another admin must decide on it.');
  if (!shop.pendingChange) throw conflict('This shop has no change waiting for review.');
  if (shop.changeRevision !== revision) throw stale(STALE_SHOP_CHANGE_MESSAGE);
  return { shop, change: shop.pendingChange };
}

/** Applies exactly the reviewed name/description change to the public shop. */
export async function approveShopChange(deps: Deps, actor: SessionUser, id: string, revision: number) {
  const { shop, change } = changeWaiting(deps.db, actor, id, revision);
  const name = change.name ?? shop.name;
  const row = deps.db.transaction((tx) => {
    const updated = repo.updateShopAt(tx as unknown as Db, id, revision, {
      name,
      description: change.description ?? shop.description,
      pendingChange: null,
      changeRejectionReason: null,
      updatedAt: deps.now(),
    });
    if (!updated) throw stale(STALE_SHOP_CHANGE_MESSAGE);
    recordAudit(deps, actor, 'shop.change.approve', 'shop', id, null);
    return updated;
  });
  await tell(deps, id, 'Your shop details are approved', [
    change.name !== undefined ? `Your shop is now called "${name}".` : `The new description of "${name}" is approved.`,
    'Shoppers see the new details from now on.',
  ]);
  return { id: row.id, name: row.name, description: row.description };
}

/** The public shop keeps its approved name/description; the seller gets the reason. */
export async function rejectShopChange(deps: Deps, actor: SessionUser, id: string, revision: number, reason: string) {
  const { shop } = changeWaiting(deps.db, actor, id, revision);
  const row = deps.db.transaction((tx) => {
    const updated = repo.updateShopAt(tx as unknown as Db, id, revision, { pendingChange: null, changeRejectionReason: reason, updatedAt: deps.now() });
    if (!updated) throw stale(STALE_SHOP_CHANGE_MESSAGE);
    recordAudit(deps, actor, 'shop.change.reject', 'shop', id, reason);
    return updated;
  });
  await tell(deps, id, 'Your shop details were not approved', [
    `Your change to the name or description of "${shop.name}" was not approved; shoppers keep seeing the current details.`,
    `Reason from the moderator:\n${reason}`,
    'Change them in your shop settings and they will be reviewed again.',
  ]);
  return { id: row.id, name: row.name, description: row.description, changeRejectionReason: row.changeRejectionReason };
}

/** Every moderation decision, newest first, a page at a time. */
export function auditLog(db: Db, q: PageQuery & { action?: string | undefined }) {
  const rows = repo.auditPage(db, q.limit, pageOffset(q), q.action);
  const shopIds = rows.filter((r) => r.entry.subjectType === 'shop').map((r) => r.entry.subjectId);
  const listingIds = rows.filter((r) => r.entry.subjectType === 'listing').map((r) => r.entry.subjectId);
  const labels = new Map<string, string>([
    ...repo.shopNames(db, shopIds).map((s) => [s.id, s.name] as [string, string]),
    ...repo.listingTitles(db, listingIds).map((l) => [l.id, l.draft.title] as [string, string]),
  ]);
  // where the subject can be opened: a shop's public page, a listing's page (admins may see drafts)
  const hrefs = new Map<string, string>([
    ...repo.shopNames(db, shopIds).map((s) => [s.id, `/shops/${encodeURIComponent(s.slug)}`] as [string, string]),
    ...repo.listingTitles(db, listingIds).map((l) => [l.id, `/listings/${encodeURIComponent(l.slug)}`] as [string, string]),
  ]);
  const items = rows.map(({ entry, actorName, actorEmail }) => ({
    id: entry.id,
    at: entry.createdAt,
    actor: { id: entry.actorId, name: actorName, email: actorEmail },
    action: entry.action,
    subject: { type: entry.subjectType, id: entry.subjectId, label: labels.get(entry.subjectId) ?? null, href: hrefs.get(entry.subjectId) ?? null },
    reason: entry.reason,
  }));
  return toPage(items, repo.auditCount(db, q.action), q);
}
