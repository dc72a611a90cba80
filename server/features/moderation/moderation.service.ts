import crypto from 'node:crypto';
import type { Db } from '../../db/client.ts';
import type { Mailer } from '../../integrations/mailer.ts';
import { escapeHtml, mailLayout } from '../../integrations/mailer.ts';
import type { SessionUser } from '../../http/auth-guards.ts';
import { conflict, notFound } from '../../http/app-error.ts';
import { liveColumns } from '../../../shared/schemas/listing.ts';
import { MODERATION_SHOPS_PAGE_SIZE, type ModerationShopsPage } from '../../../shared/schemas/catalog.ts';
import type { ShopState } from '../../../shared/schemas/shop.ts';
import * as repo from './moderation.repo.ts';

type Deps = { db: Db; now: () => number; mailer: Mailer; env: { baseUrl: string } };

function audit(deps: Deps, actor: SessionUser, action: string, subjectType: 'shop' | 'listing', subjectId: string, reason: string | null) {
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

export function queue(db: Db) {
  return {
    shops: repo.shopsInReview(db).map(({ shop, ownerEmail, ownerName }) => ({
      id: shop.id, name: shop.name, slug: shop.slug, state: shop.state, description: shop.description, owner: { name: ownerName, email: ownerEmail }, createdAt: shop.createdAt,
    })),
    listings: repo.listingsInReview(db).map(({ listing, shop }) => ({
      id: listing.id, slug: listing.slug, state: listing.state, pendingReview: listing.pendingReview,
      /** "new" waits for its first approval; "edit" is a change to a listing already on sale */
      kind: listing.live ? ('edit' as const) : ('new' as const),
      title: listing.draft.title,
      shop: { id: shop.id, name: shop.name, slug: shop.slug, state: shop.state },
      draft: listing.draft,
      live: listing.live,
      /** the listing page as a shopper would see it: GET this URL (admin only for drafts) */
      previewUrl: `/api/listings/${listing.slug}?version=draft`,
      submittedAt: listing.updatedAt,
    })),
  };
}

/** The desk's shop directory: any shop in any state, so a live one can be found and suspended. */
export function shops(db: Db, f: { q: string; state?: ShopState; page: number }, pageSize = MODERATION_SHOPS_PAGE_SIZE): ModerationShopsPage {
  const rows = repo.shopsPage(db, f, pageSize, (f.page - 1) * pageSize);
  return {
    items: rows.map(({ shop, ownerEmail, ownerName }) => ({
      id: shop.id, name: shop.name, slug: shop.slug, state: shop.state as ShopState, stateReason: shop.stateReason ?? null,
      owner: { name: ownerName, email: ownerEmail }, createdAt: shop.createdAt,
    })),
    total: repo.shopsCount(db, f),
    page: f.page,
    pageSize,
  };
}

function waiting(db: Db, id: string) {
  const l = repo.findListing(db, id);
  if (!l) throw notFound('No such listing.');
  if (l.state !== 'in_review' && !l.pendingReview) throw conflict('This listing is not waiting for review.');
  return l;
}

export async function approveListing(deps: Deps, actor: SessionUser, id: string) {
  const l = waiting(deps.db, id);
  const content = l.draft;
  const at = deps.now();
  const row = deps.db.transaction((tx) => {
    const db = tx as unknown as Db;
    const updated = repo.updateListing(db, id, {
      live: l.draft, ...liveColumns(content), liveThumbPath: repo.thumbOf(db, l.shopId, content.photoIds[0]),
      state: l.state === 'paused' ? 'paused' : 'live', pendingReview: false, rejectionReason: null,
      publishedAt: l.publishedAt ?? at, updatedAt: at,
    })!;
    audit(deps, actor, 'listing.approve', 'listing', id, null);
    return updated;
  });
  await tell(deps, l.shopId, `Approved: ${content.title}`, [
    l.live ? `Your changes to "${content.title}" are approved and now on sale.` : `Your listing "${content.title}" is approved and on sale.`,
    `${deps.env.baseUrl}/listings/${l.slug}`,
  ]);
  return { id: row.id, state: row.state, pendingReview: row.pendingReview };
}

export async function rejectListing(deps: Deps, actor: SessionUser, id: string, reason: string) {
  const l = waiting(deps.db, id);
  const content = l.draft;
  const at = deps.now();
  // a rejected edit leaves the approved copy on sale; a new listing goes back to the seller
  const row = deps.db.transaction((tx) => {
    const updated = repo.updateListing(tx as unknown as Db, id, l.live ? { pendingReview: false, rejectionReason: reason, updatedAt: at } : { state: 'rejected', rejectionReason: reason, updatedAt: at })!;
    audit(deps, actor, 'listing.reject', 'listing', id, reason);
    return updated;
  });
  await tell(deps, l.shopId, `Changes needed: ${content.title}`, [
    l.live
      ? `Your changes to "${content.title}" were not approved. The approved version stays on sale.`
      : `Your listing "${content.title}" was not approved yet.`,
    `Reason from the moderator:\n${reason}`,
    'Edit the listing in your workroom and send it for review again.',
  ]);
  return { id: row.id, state: row.state, pendingReview: row.pendingReview, rejectionReason: row.rejectionReason };
}

const SHOP_MOVES = {
  approve: { from: ['in_review'], to: 'live', action: 'shop.approve' },
  reject: { from: ['in_review'], to: 'rejected', action: 'shop.reject' },
  suspend: { from: ['live', 'in_review'], to: 'suspended', action: 'shop.suspend' },
  restore: { from: ['suspended'], to: 'live', action: 'shop.restore' },
} as const;
export type ShopMove = keyof typeof SHOP_MOVES;

/**
 * Shop decisions. The catalogue shows only listings of live shops (it joins on the shop's state),
 * so a suspension takes the shop's listings out of browse and search in this one update.
 */
export async function moveShop(deps: Deps, actor: SessionUser, id: string, move: ShopMove, reason: string | null) {
  const shop = repo.findShop(deps.db, id);
  if (!shop) throw notFound('No such shop.');
  const m = SHOP_MOVES[move];
  if (!(m.from as readonly string[]).includes(shop.state)) throw conflict(`A shop that is ${shop.state.replace('_', ' ')} cannot be moved that way.`);
  const row = deps.db.transaction((tx) => {
    const updated = repo.updateShop(tx as unknown as Db, id, { state: m.to, stateReason: reason, updatedAt: deps.now() })!;
    audit(deps, actor, m.action, 'shop', id, reason);
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

export function auditLog(db: Db, page: number, pageSize = 50) {
  const rows = repo.auditPage(db, pageSize, (page - 1) * pageSize);
  const shopIds = rows.filter((r) => r.entry.subjectType === 'shop').map((r) => r.entry.subjectId);
  const listingIds = rows.filter((r) => r.entry.subjectType === 'listing').map((r) => r.entry.subjectId);
  const labels = new Map<string, string>([
    ...repo.shopNames(db, shopIds).map((s) => [s.id, s.name] as [string, string]),
    ...repo.listingTitles(db, listingIds).map((l) => [l.id, l.draft.title] as [string, string]),
  ]);
  return {
    items: rows.map(({ entry, actorName, actorEmail }) => ({
      id: entry.id, at: entry.createdAt, actor: { id: entry.actorId, name: actorName, email: actorEmail }, action: entry.action,
      subject: { type: entry.subjectType, id: entry.subjectId, label: labels.get(entry.subjectId) ?? null }, reason: entry.reason,
    })),
    total: repo.auditCount(db),
    page,
    pageSize,
  };
}
