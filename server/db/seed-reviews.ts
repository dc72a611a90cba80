// Demo reviews (the invented demo scenario): an older purchase of Dana's from Fern & Fable Goods,
// made, shipped and reviewed. Its lines move through the same state machine and the shipping
// service as a real order's (cut outside the app, so no cut sheet), and the reviews and the shop's
// reply are written by the reviews feature with the clock set days after shipping. Two lines are
// left unreviewed, so a shopper can try writing a review. No e-mails go out.
import type { AppDeps } from '../deps.ts';
import { transitionAll } from '../features/orders/index.ts';
import { replyToReview, writeReview } from '../features/reviews/index.ts';
import { ship } from '../features/workroom/index.ts';
import { seedRepo } from './seed.repo.ts';
import type { SeedContext } from './seed-context.ts';
import { type Item, seedPurchases } from './seed-orders.ts';

const DAY = 86_400_000;
const PAID_DAYS_AGO = 16;
const SHIPPED_AFTER_DAYS = 3;

const ITEMS: Item[] = [
  { listing: 'Autumn fox tote with a name', name: 'Noor', textColour: 'Ink navy', motifColours: { body: 'Fox orange' }, approved: true },
  { listing: 'Spring picnic tote with hot-air balloon', name: 'Ezra', textColour: 'Thread green', motifColours: { envelope: 'Berry red' }, approved: true },
  { listing: 'Autumn fox tote with a name', name: 'Rosa', textColour: 'Fox orange', motifColours: { body: 'Acorn brown' }, approved: true },
  { listing: 'Harvest pumpkin drawstring bag with ribbon bow', name: 'Otto', textColour: 'Acorn brown', motifColours: { stem: 'Pine flock' }, approved: true },
  { listing: 'Spring picnic tote with hot-air balloon', name: 'Mila', textColour: 'Ink navy', motifColours: { envelope: 'Thread green' }, approved: true },
];

/** Reviews by the name on the line ("Otto"'s pumpkin bag and "Mila"'s tote are left for the shopper to review). */
const REVIEWS: Record<string, { rating: number; body: string; daysAfterShipping: number; reply?: string }> = {
  Noor: {
    rating: 5,
    daysAfterShipping: 4,
    body: 'The fox is even sweeter in person and the name is crisp. Noor carries her library books in it every week.',
    reply: 'Thank you! Happy reading, Noor.',
  },
  Ezra: { rating: 4, daysAfterShipping: 5, body: 'Lovely colours and sturdy canvas. The balloon sits a little lower than I pictured, but it still looks great.' },
  Rosa: { rating: 4, daysAfterShipping: 7, body: 'Good size for a swimming kit. The orange letters are a touch brighter than they looked on screen.' },
};

export async function seedReviews(deps: AppDeps, ctx: SeedContext): Promise<void> {
  const shopId = ctx.shopIds['fern-and-fable-goods'];
  const buyerId = ctx.userIds['dana@namesake.test'];
  const sellerId = ctx.userIds['fern@namesake.test'];
  if (!shopId || !buyerId || !sellerId) return;
  const [orderId] = await seedPurchases(deps, ctx, [{ daysAgo: PAID_DAYS_AGO, items: ITEMS }]);
  if (!orderId) return; // no payment fake: no demo orders, so no reviews either
  const now = deps.now();
  const paidAt = now - PAID_DAYS_AGO * DAY;
  const silent: AppDeps = { ...deps, mailer: { send: async () => {}, close: () => {} } };
  const at = (ms: number): AppDeps => ({ ...silent, now: () => ms });

  for (const [to, day] of [
    ['planned', 1],
    ['cut', 1],
    ['pressed', 2],
  ] as const) {
    const lines = seedRepo.linesOf(deps.db, orderId);
    transitionAll(
      deps.db,
      lines.map((l) => ({ line: l, to, actor: 'shop' as const, actorId: sellerId, at: paidAt + day * DAY })),
    );
  }
  const shippedAt = paidAt + SHIPPED_AFTER_DAYS * DAY;
  await ship(at(shippedAt), shopId, sellerId, orderId, { carrier: 'Parcel post', trackingNumber: 'HT482910357' });

  const dana = { user: { id: buyerId, email: 'dana@namesake.test', name: 'Dana Whitlock', role: 'shopper' as const }, shopId: null };
  const fern = { user: { id: sellerId, email: 'fern@namesake.test', name: 'Fern', role: 'seller' as const }, shopId };
  for (const line of seedRepo.linesOf(deps.db, orderId)) {
    const name = Object.values(line.snapshot.choices.texts)[0]?.text ?? '';
    const r = REVIEWS[name];
    if (!r) continue;
    const writtenAt = shippedAt + r.daysAfterShipping * DAY;
    const review = writeReview(at(writtenAt), orderId, line.id, dana, { rating: r.rating, body: r.body }, null);
    if (r.reply) replyToReview(at(writtenAt + DAY), review.id, fern, r.reply);
  }
}
