import crypto from 'node:crypto';
import slugify from 'slugify';
import type { Me, OpenShopInput } from '../../../shared/schemas/auth.ts';
import type { Db } from '../../db/client.ts';
import { conflict } from '../../http/app-error.ts';
import type { SessionUser } from '../../http/auth-guards.ts';
import { findShopByOwner, insertShop, setUserRole, slugsLike } from './account.repo.ts';

type ShopState = NonNullable<Me['shop']>['state'];

export function getMe(db: Db, user: SessionUser): Me {
  const shop = findShopByOwner(db, user.id);
  return {
    user,
    shop: shop ? { id: shop.id, slug: shop.slug, name: shop.name, state: shop.state as ShopState } : null,
  };
}

/** "Fern & Fable Goods" → "fern-and-fable-goods"; a taken slug gets -2, -3, … */
export function uniqueShopSlug(db: Db, name: string): string {
  const base = slugify(name, { lower: true, strict: true }).slice(0, 48) || 'shop';
  const taken = new Set(slugsLike(db, base));
  if (!taken.has(base)) return base;
  for (let i = 2; ; i++) if (!taken.has(`${base}-${i}`)) return `${base}-${i}`;
}

/** A shopper opens a shop: it waits in review, and the account becomes a seller. */
export function openShop(deps: { db: Db; now: () => number }, user: SessionUser, input: OpenShopInput) {
  const { db } = deps;
  if (findShopByOwner(db, user.id)) throw conflict('You already have a shop.', { name: 'You already have a shop.' });
  const at = deps.now();
  const shop = db.transaction((tx) => {
    const row = insertShop(tx as unknown as Db, {
      id: crypto.randomUUID(),
      ownerId: user.id,
      name: input.name,
      slug: uniqueShopSlug(tx as unknown as Db, input.name),
      state: 'in_review',
      createdAt: at,
      updatedAt: at,
    });
    if (user.role === 'shopper') setUserRole(tx as unknown as Db, user.id, 'seller');
    return row;
  });
  return { id: shop.id, slug: shop.slug, name: shop.name, state: shop.state as ShopState };
}
