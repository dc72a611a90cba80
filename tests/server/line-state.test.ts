// The order-line state machine: every pair of states × every actor, allowed and refused.
import crypto from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from '../factories/app.ts';
import { checkouts, lineEvents, listings, orderLines, orders } from '../../server/db/schema.ts';
import { transition, transitionAll } from '../../server/features/orders/line-state.ts';
import { LINE_STATES, LINE_TRANSITIONS, canMoveLine, type LineActor, type LineState } from '../../shared/schemas/order.ts';

const ACTORS: LineActor[] = ['shop', 'shopper', 'admin', 'system'];
let t: TestApp;
let lineId: string;
let otherLineId: string;

beforeAll(async () => {
  t = await makeTestApp();
  const seller = await t.makeSeller();
  const buyer = await t.makeUser('shopper');
  const at = Date.now();
  const listingId = crypto.randomUUID();
  t.db.insert(listings).values({ id: listingId, shopId: seller.shopId, slug: `l-${listingId.slice(0, 8)}`, draft: {} as never, createdAt: at, updatedAt: at }).run();
  const checkoutId = crypto.randomUUID();
  t.db.insert(checkouts).values({ id: checkoutId, userId: buyer.id, cartId: 'c', currency: 'USD', totalMinor: 2400, priced: {} as never, createdAt: at }).run();
  const orderId = crypto.randomUUID();
  t.db.insert(orders).values({ id: orderId, number: 'NS-9001', checkoutId, shopId: seller.shopId, buyerId: buyer.id, currency: 'USD', subtotalMinor: 2400, shippingMinor: 0, platformFeeMinor: 192, totalMinor: 2400, paidAt: at, createdAt: at }).run();
  lineId = crypto.randomUUID();
  otherLineId = crypto.randomUUID();
  for (const id of [lineId, otherLineId]) {
    t.db.insert(orderLines).values({ id, orderId, listingId, listingTitle: 'Name tote', quantity: 1, unitPriceMinor: 2400, totalMinor: 2400, snapshot: {} as never, createdAt: at, updatedAt: at }).run();
  }
});
afterAll(() => t.close());

const setState = (id: string, s: LineState) => t.db.update(orderLines).set({ state: s }).where(eq(orderLines.id, id)).run();
const stateOf = (id: string) => t.db.select().from(orderLines).where(eq(orderLines.id, id)).get()!.state;
const eventsOf = (id: string) => t.db.select().from(lineEvents).where(eq(lineEvents.lineId, id)).all();

describe('when any move is tried from any state by any actor', () => {
  it('then exactly the moves in the table land, each with one timeline event, and every other is refused with 409', () => {
    let allowed = 0;
    let refused = 0;
    for (const from of LINE_STATES) {
      for (const to of LINE_STATES) {
        for (const actor of ACTORS) {
          setState(lineId, from);
          const before = eventsOf(lineId).length;
          const ok = LINE_TRANSITIONS[from][to]?.includes(actor) ?? false;
          const run = () => transition(t.db, { line: { id: lineId, state: from }, to, actor, actorId: null, at: Date.now(), message: `${from}→${to}` });
          if (ok) {
            run();
            expect(stateOf(lineId)).toBe(to);
            expect(eventsOf(lineId)).toHaveLength(before + 1);
            allowed++;
          } else {
            expect(run).toThrow(expect.objectContaining({ status: 409 }));
            expect(stateOf(lineId)).toBe(from);
            expect(eventsOf(lineId)).toHaveLength(before);
            refused++;
          }
        }
      }
    }
    expect(allowed + refused).toBe(LINE_STATES.length ** 2 * ACTORS.length);
    expect(allowed).toBeGreaterThan(10);
  });

  it('then the workflow the shop follows is allowed and the shortcuts are not (the table itself is right)', () => {
    // the path a line takes in the workroom
    expect(canMoveLine('awaiting_proof', 'approved', 'shop')).toBe(true);
    expect(canMoveLine('awaiting_proof', 'changes_requested', 'shop')).toBe(true);
    expect(canMoveLine('changes_requested', 'awaiting_proof', 'shopper')).toBe(true);
    expect(canMoveLine('approved', 'cut', 'shop')).toBe(true);
    expect(canMoveLine('cut', 'pressed', 'shop')).toBe(true);
    expect(canMoveLine('pressed', 'shipped', 'shop')).toBe(true);
    // no skipping steps, no going back, nobody else doing the shop's work, nothing after the end
    expect(canMoveLine('awaiting_proof', 'cut', 'shop')).toBe(false);
    expect(canMoveLine('approved', 'shipped', 'shop')).toBe(false);
    expect(canMoveLine('shipped', 'pressed', 'shop')).toBe(false);
    expect(canMoveLine('awaiting_proof', 'approved', 'shopper')).toBe(false);
    expect(canMoveLine('refunded', 'shipped', 'admin')).toBe(false);
    expect(canMoveLine('cancelled', 'awaiting_proof', 'shopper')).toBe(false);
    // a cut item can be refunded but no longer cancelled (the vinyl is used)
    expect(canMoveLine('cut', 'cancelled', 'shop')).toBe(false);
    expect(canMoveLine('cut', 'refunded', 'admin')).toBe(true);
  });
});

describe('when two moves race on one line', () => {
  it('then the second, made from a state the line has left, is refused and writes nothing', () => {
    setState(lineId, 'awaiting_proof');
    const read = { id: lineId, state: 'awaiting_proof' };
    transition(t.db, { line: read, to: 'approved', actor: 'shop', actorId: null, at: Date.now() });
    const before = eventsOf(lineId).length;
    expect(() => transition(t.db, { line: read, to: 'changes_requested', actor: 'shop', actorId: null, at: Date.now() })).toThrow(expect.objectContaining({ status: 409 }));
    expect(stateOf(lineId)).toBe('approved');
    expect(eventsOf(lineId)).toHaveLength(before);
  });
});

describe('when several lines move together and one move is refused', () => {
  it('then none of them moves', () => {
    setState(lineId, 'awaiting_proof');
    setState(otherLineId, 'shipped');
    expect(() =>
      transitionAll(t.db, [
        { line: { id: lineId, state: 'awaiting_proof' }, to: 'approved', actor: 'shop', actorId: null, at: Date.now() },
        { line: { id: otherLineId, state: 'shipped' }, to: 'approved', actor: 'shop', actorId: null, at: Date.now() },
      ]),
    ).toThrow(expect.objectContaining({ status: 409 }));
    expect(stateOf(lineId)).toBe('awaiting_proof');
    expect(stateOf(otherLineId)).toBe('shipped');
  });
});
