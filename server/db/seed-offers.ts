// The demo's shop offers: a discount code per live shop and a Winter lights order-by date for Fern &
// Fable Goods (the next 14 December still to come), so the listing banner, the cart's code and the
// business view's "given away" have something to show.
import crypto from 'node:crypto';
import { dayInZone } from '../../shared/business/working-days.ts';
import type { AppDeps } from '../deps.ts';
import { seedRepo } from './seed.repo.ts';
import type { SeedContext } from './seed-context.ts';

export function seedOffers(deps: AppDeps, ctx: SeedContext): void {
  const at = deps.now();
  const fern = ctx.shopIds['fern-and-fable-goods'];
  const comet = ctx.shopIds['little-comet-print-co'];
  const today = dayInZone(at, deps.env.BUSINESS_TIME_ZONE);
  const year = Number(today.slice(0, 4));
  const winter = `${today <= `${year}-12-14` ? year : year + 1}-12-14`;
  if (fern) {
    seedRepo.insertDiscountCode(deps.db, { id: crypto.randomUUID(), shopId: fern, code: 'WINTER10', kind: 'percent', value: 1000, minSpendMinor: 0, createdAt: at, updatedAt: at });
    seedRepo.insertOrderByDate(deps.db, { id: crypto.randomUUID(), shopId: fern, occasion: 'Winter lights', orderBy: winter, createdAt: at });
  }
  if (comet) {
    seedRepo.insertDiscountCode(deps.db, {
      id: crypto.randomUUID(),
      shopId: comet,
      code: 'ROCKET3',
      kind: 'amount',
      value: 300,
      minSpendMinor: 2500,
      usageLimit: 50,
      createdAt: at,
      updatedAt: at,
    });
  }
}
