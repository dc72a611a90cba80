// Every database call of the shops' payouts (payouts.service.ts).
import { and, eq, isNull, sql } from 'drizzle-orm';
import type { Db } from '../../db/client.ts';
import { ledger, orders, type PayoutStep, refunds, shops, user } from '../../db/schema.ts';

export type { PayoutStep };

export const payoutsRepo = {
  shop: (db: Db, id: string) => db.select().from(shops).where(eq(shops.id, id)).get(),
  shopOwner: (db: Db, shopId: string) => db.select({ email: user.email, name: user.name }).from(shops).innerJoin(user, eq(user.id, shops.ownerId)).where(eq(shops.id, shopId)).get(),
  setShopAccount: (db: Db, shopId: string, accountId: string) =>
    db
      .update(shops)
      .set({ paymentAccountId: accountId })
      .where(and(eq(shops.id, shopId), isNull(shops.paymentAccountId)))
      .run(),

  /** what has been refunded on the order (recorded refunds) */
  refundedOf: (db: Db, orderId: string) => db.get<{ n: number | null }>(sql`select sum(${refunds.amountMinor}) as n from ${refunds} where ${refunds.orderId} = ${orderId}`)?.n ?? 0,
  /** what the shop holds from the order: transfers less reversals */
  paidOutOf: (db: Db, orderId: string) =>
    db.get<{ n: number | null }>(sql`select sum(${ledger.amountMinor}) as n from ${ledger} where ${ledger.orderId} = ${orderId} and ${ledger.kind} in ('transfer', 'refund_reversal')`)?.n ?? 0,
  claimPayoutStep: (db: Db, orderId: string, step: PayoutStep, seq: number) =>
    db
      .update(orders)
      .set({ payoutStep: step, payoutSeq: seq })
      .where(and(eq(orders.id, orderId), isNull(orders.payoutStep)))
      .run().changes === 1,
  /** clears the step only when it is still the one named (another caller may have recorded it) */
  clearPayoutStep: (db: Db, orderId: string, key: string) =>
    db
      .update(orders)
      .set({ payoutStep: null })
      .where(and(eq(orders.id, orderId), sql`json_extract(${orders.payoutStep}, '$.key') = ${key}`))
      .run().changes === 1,
};
