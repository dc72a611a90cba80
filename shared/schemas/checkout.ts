/** Checkout: the session the client is sent to, and the status the return page polls. */
import { z } from 'zod';

export const checkoutStatusParams = z.object({
  sessionId: z
    .string()
    .min(8)
    .max(255)
    .regex(/^[A-Za-z0-9_]+$/, 'That is not a payment session id.'),
});

/** POST /api/checkout → where to send the shopper */
export type CheckoutStarted = { checkoutId: string; sessionId: string; url: string };

export const CHECKOUT_STATES = ['open', 'paid', 'expired', 'cancelled'] as const;
export type CheckoutState = (typeof CHECKOUT_STATES)[number];

/** GET /api/checkout/:sessionId/status and GET /api/checkout/latest */
export type CheckoutStatus = {
  checkoutId: string;
  sessionId: string | null;
  state: CheckoutState;
  /** open: the shopper may still pay on the payment page */
  payUrl: string | null;
  /** our words for the last decline, if the last attempt failed */
  problem: string | null;
  /** the provider has the money (orders follow as soon as its notice reaches us) */
  paymentReceived: boolean;
  totalMinor: number;
  currency: string;
  orders: Array<{ id: string; number: string; shopName: string; totalMinor: number }>;
};
