// The invented demo scenario (DEVELOPERS.md, "Demo scenario"). Runs when the database has no users
// and DEMO_DATA is on (the default outside production; never implied in production).
import crypto from 'node:crypto';
import type { AppDeps } from '../deps.ts';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from './demo-accounts.ts';
import { seedRepo } from './seed.repo.ts';
import { seedBlanks } from './seed-blanks.ts';
import { seedCatalog } from './seed-catalog.ts';
import type { SeedContext } from './seed-context.ts';
import { seedOffers } from './seed-offers.ts';
import { seedOrders } from './seed-orders.ts';
import { seedReviews } from './seed-reviews.ts';

const SHOPS = [
  {
    owner: 'fern@namesake.test',
    name: 'Fern & Fable Goods',
    slug: 'fern-and-fable-goods',
    state: 'live',
    processingDays: 3,
    shippingMinor: 450,
    pressType: 'clamshell',
    description: 'Totes and drawstring bags with names and woodland motifs, pressed by hand in a small studio.',
  },
  {
    owner: 'comet@namesake.test',
    name: 'Little Comet Print Co.',
    slug: 'little-comet-print-co',
    state: 'live',
    processingDays: 4,
    shippingMinor: 395,
    pressType: 'handheld',
    description: "Kids' tees and zip pouches with bright names, rockets and sea creatures.",
  },
  {
    owner: 'harbour@namesake.test',
    name: 'Harbour Thread',
    slug: 'harbour-thread',
    state: 'in_review',
    processingDays: 5,
    shippingMinor: 500,
    pressType: 'clamshell',
    description: 'Seaside-themed bags and pouches. New shop, waiting for review.',
  },
] as const;

export function isEmpty(deps: Pick<AppDeps, 'db'>): boolean {
  return seedRepo.userCount(deps.db) === 0;
}

export async function seedDemo(deps: AppDeps): Promise<void> {
  // accounts with a published password: only when asked for (DEMO_DATA=true, or outside production)
  if (!deps.env.demoData) throw new Error('Demo data is off: set DEMO_DATA=true to seed the demo scenario (never on a real shop: its passwords are public).');
  const userIds: Record<string, string> = {};
  for (const a of DEMO_ACCOUNTS) {
    const res = await deps.auth.api.signUpEmail({ body: { email: a.email, password: DEMO_PASSWORD, name: a.name } });
    userIds[a.email] = res.user.id;
    seedRepo.setRole(deps.db, res.user.id, a.role);
  }
  const shopIds: Record<string, string> = {};
  const at = deps.now();
  for (const s of SHOPS) {
    const ownerId = userIds[s.owner];
    if (!ownerId) throw new Error(`Demo shop ${s.slug}: its owner ${s.owner} is not one of the demo accounts.`);
    const id = crypto.randomUUID();
    shopIds[s.slug] = id;
    seedRepo.insertShop(deps.db, {
      id,
      ownerId,
      name: s.name,
      slug: s.slug,
      state: s.state,
      description: s.description,
      processingDays: s.processingDays,
      shippingMinor: s.shippingMinor,
      pressType: s.pressType,
      hourlyRateMinor: 1800, // demo: $18.00 an hour for labour in the cost of goods
      returnPolicy: 'Personalised items can be returned only if they arrive damaged or with a mistake on our side. Tell us within 14 days.',
      // a coherent story: the live shops opened months ago; the shop in review opened yesterday
      createdAt: s.state === 'live' ? at - 90 * 86_400_000 : at - 86_400_000,
      updatedAt: s.state === 'live' ? at - 90 * 86_400_000 : at - 86_400_000,
    });
  }
  const ctx: SeedContext = { userIds, shopIds };
  // in order: the orders are made from the catalogue's live listings and materials
  await seedCatalog(deps, ctx);
  await seedOrders(deps, ctx);
  seedOffers(deps, ctx);
  await seedReviews(deps, ctx);
  // after the demo orders (bought before the shops counted sizes and colours)
  seedBlanks(deps, ctx);
}
