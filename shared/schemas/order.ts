/** Orders as shoppers see them, and refunds. */
import { z } from 'zod';
import type { LineSnapshot } from './cart.ts';
import type { ShipTo } from './checkout.ts';
import { pageQuery } from './pagination.ts';

export const LINE_STATES = ['awaiting_proof', 'changes_requested', 'approved', 'planned', 'cut', 'pressed', 'shipped', 'cancelled', 'refunded'] as const;
export type LineState = (typeof LINE_STATES)[number];

/** Who moves a line: the shop that makes it, the shopper who bought it, an admin, or the app itself. */
export type LineActor = 'shop' | 'shopper' | 'admin' | 'system';

/**
 * The order-line state machine: every allowed move and who may make it. A move not in this table
 * is refused; `cancelled` and `refunded` are final. server/features/orders/line-state.ts is the only
 * code that changes a line's state, and it checks every move against this table.
 */
export const LINE_TRANSITIONS: Record<LineState, Partial<Record<LineState, readonly LineActor[]>>> = {
  awaiting_proof: { approved: ['shop'], changes_requested: ['shop'], cancelled: ['shop', 'admin'], refunded: ['shop', 'admin', 'system'] },
  changes_requested: { awaiting_proof: ['shopper'], cancelled: ['shop', 'admin'], refunded: ['shop', 'admin', 'system'] },
  // on a cut sheet that is built but not cut yet: `planned`; discarding its batch brings it back to `approved`
  approved: { planned: ['shop'], cancelled: ['shop', 'admin'], refunded: ['shop', 'admin', 'system'] },
  planned: { cut: ['shop'], approved: ['shop'], cancelled: ['shop', 'admin'], refunded: ['shop', 'admin', 'system'] },
  cut: { pressed: ['shop'], refunded: ['shop', 'admin', 'system'] },
  pressed: { shipped: ['shop'], refunded: ['shop', 'admin', 'system'] },
  shipped: { refunded: ['shop', 'admin', 'system'] },
  cancelled: {},
  refunded: {},
};

/** The state a new line starts in, when its order is paid. */
export const FIRST_LINE_STATE = 'awaiting_proof' satisfies LineState;

/** States where the work on a line is over: shipped, or never to be (the table leads nowhere near `shipped` from them). */
export const FINISHED_LINE_STATES = ['shipped', 'cancelled', 'refunded'] as const satisfies readonly LineState[];
/** States where the line's vinyl is still to be cut (the table can still lead to `cut`). */
export const UNCUT_LINE_STATES = ['awaiting_proof', 'changes_requested', 'approved', 'planned'] as const satisfies readonly LineState[];
/** Is the work on a line in `state` over? */
export const isFinishedLine = (state: string): boolean => (FINISHED_LINE_STATES as readonly string[]).includes(state);

/** May `actor` move a line from `from` to `to`? */
export const canMoveLine = (from: LineState, to: LineState, actor: LineActor): boolean => LINE_TRANSITIONS[from][to]?.includes(actor) ?? false;

/** Shown to people; the codes stay the product's state names (DEVELOPERS.md, "Order-line states"). */
export const LINE_STATE_LABELS: Record<LineState, string> = {
  awaiting_proof: 'Waiting for the proof check',
  changes_requested: 'Changes requested',
  approved: 'Proof approved',
  planned: 'Cutting planned',
  cut: 'Vinyl cut',
  pressed: 'Pressed',
  shipped: 'Shipped',
  cancelled: 'Cancelled',
  refunded: 'Refunded',
};

export const orderIdParams = z.object({ id: z.string().min(1).max(64) });

/** GET /api/orders: the shopper's orders, newest first, a page at a time */
export const ORDERS_PAGE_SIZE = 20;
export const ordersQuerySchema = pageQuery(ORDERS_PAGE_SIZE);

export const refundSchema = z.object({
  /** one line; omitted: the whole order (what is not refunded yet, shipping included) */
  lineId: z.string().min(1).max(64).optional(),
  reason: z.string().trim().max(500, 'Use at most 500 characters.').optional(),
});
export type RefundInput = z.infer<typeof refundSchema>;

export type OrderEvent = { id: string; fromState: LineState | null; toState: LineState; message: string | null; at: number; actor: 'you' | 'shop' | 'namesake' | null };

export type OrderLine = {
  id: string;
  listingId: string;
  listingTitle: string;
  quantity: number;
  unitPriceMinor: number;
  totalMinor: number;
  refundedMinor: number;
  state: LineState;
  version: number;
  snapshot: LineSnapshot;
  history: OrderEvent[];
};

export type OrderSummary = {
  id: string;
  number: string;
  shop: { id: string; name: string; slug: string };
  currency: string;
  totalMinor: number;
  itemCount: number;
  /** the states of its lines, for a compact progress view */
  states: LineState[];
  paidAt: number;
  shippedAt: number | null;
};

export type OrderDetail = OrderSummary & {
  subtotalMinor: number;
  shippingMinor: number;
  /** what the shop's code took off the items, and the code (subtotal − discount + shipping = total) */
  discountMinor?: number;
  discountCode?: string | null;
  /** the shopper's needed-by date for the parcel */
  neededBy?: string | null;
  refundedMinor: number;
  carrier: string | null;
  trackingNumber: string | null;
  /** where the parcel goes, as typed on the payment page; null for orders paid before we asked */
  shipTo: ShipTo | null;
  lines: OrderLine[];
};

export type RefundResult = { refundId: string; amountMinor: number; order: OrderDetail };
