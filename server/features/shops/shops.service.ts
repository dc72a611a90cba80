import crypto from 'node:crypto';
import type { OwnShop, ShopSettingsInput, ShopState } from '../../../shared/schemas/shop.ts';
import type { Db } from '../../db/client.ts';
import { badRequest, conflict } from '../../http/app-error.ts';
import type { SessionUser, ShopRow } from '../../http/auth-guards.ts';
import { type Storage, storedImageColumns, uploadUrl } from '../../integrations/storage.ts';
import { findOwnUpload, insertUpload, type ShopChange, slugTakenByOther, updateShop } from './shops.repo.ts';

export function toOwnShop(s: ShopRow): OwnShop {
  return {
    id: s.id,
    name: s.name,
    slug: s.slug,
    description: s.description,
    state: s.state as ShopState,
    stateReason: s.stateReason,
    currency: s.currency,
    processingDays: s.processingDays,
    shippingMinor: s.shippingMinor,
    returnPolicy: s.returnPolicy,
    pressType: s.pressType as OwnShop['pressType'],
    backPress: s.backPress,
    logoUrl: uploadUrl(s.logoPath),
    pendingChange: s.pendingChange ?? null,
    changeRejectionReason: s.changeRejectionReason,
  };
}

/** A shop that has been approved shows its name and description in public: changes wait for review. */
const reviewsChanges = (s: ShopRow) => s.state === 'live' || s.state === 'suspended';

/**
 * The pending change after this save: the saved name/description where given (else the one
 * already pending), minus whatever equals the approved value. `undefined` when nothing differs.
 */
function nextChange(s: ShopRow, input: { name?: string; description?: string }, at: number): ShopChange | undefined {
  const cur = s.pendingChange;
  const name = input.name ?? cur?.name;
  const description = input.description ?? cur?.description;
  const next: ShopChange = { submittedAt: at };
  if (name !== undefined && name !== s.name) next.name = name;
  if (description !== undefined && description !== s.description) next.description = description;
  if (next.name === undefined && next.description === undefined) return undefined;
  // unchanged content keeps its revision (saving other settings does not restart a review)
  if (cur && cur.name === next.name && cur.description === next.description) return cur;
  return next;
}

export function updateSettings(deps: { db: Db; now: () => number }, shop: ShopRow, input: ShopSettingsInput): OwnShop {
  const { db } = deps;
  const { logoId, name, description, ...rest } = input;
  const at = deps.now();
  const set: Record<string, unknown> = { ...rest, updatedAt: at };
  if (!reviewsChanges(shop)) {
    Object.assign(set, name === undefined ? {} : { name }, description === undefined ? {} : { description });
    // a shop in review is approved as a whole: a new name/description makes an opened review stale
    if ((name !== undefined && name !== shop.name) || (description !== undefined && description !== shop.description)) set.changeRevision = shop.changeRevision + 1;
  } else if (name !== undefined || description !== undefined) {
    const next = nextChange(shop, { name, description }, at);
    if ((next ?? null) !== (shop.pendingChange ?? null)) {
      // every altered change gets a new revision, so a moderator's decision on an older one is refused
      Object.assign(set, { pendingChange: next ?? null, changeRevision: shop.changeRevision + 1 });
      if (next) set.changeRejectionReason = null;
    }
  }
  if (rest.slug && slugTakenByOther(db, rest.slug, shop.id)) throw conflict('Another shop already uses this web address.', { slug: 'Another shop already uses this web address.' });
  if (logoId !== undefined) {
    if (logoId === null) set.logoPath = null;
    else {
      const up = findOwnUpload(db, shop.id, logoId);
      if (!up) throw badRequest('Upload the logo first.', { logoId: 'No such upload in your shop.' });
      set.logoPath = up.thumbPath;
    }
  }
  return toOwnShop(updateShop(db, shop.id, set)!);
}

/** Stores an uploaded logo (checked and re-encoded by storage) and makes it the shop's logo. */
export async function replaceLogo(deps: { db: Db; now: () => number; storage: Storage }, user: SessionUser, shop: ShopRow, buf: Buffer): Promise<OwnShop> {
  const img = await deps.storage.saveImage(buf);
  const at = deps.now();
  insertUpload(deps.db, {
    id: crypto.randomUUID(),
    ownerId: user.id,
    shopId: shop.id,
    kind: 'logo',
    ...storedImageColumns(img),
    createdAt: at,
  });
  return toOwnShop(updateShop(deps.db, shop.id, { logoPath: img.thumbName, updatedAt: at })!);
}
