// The objects the Stripe fake stores and sends back, typed to the fields it actually returns (a subset
// of what Stripe returns; field names and value shapes follow the Stripe API reference). They are kept
// in the state file as they are (store.ts), so a field added here also appears in that file.

export type Metadata = Record<string, string>;

/** A page of a Stripe list (`object: 'list'`), newest first. */
export interface ApiList<T> {
  object: 'list';
  data: T[];
  has_more: boolean;
  url: string;
}

// ---------- Checkout ----------

export interface Product {
  id: string;
  object: 'product';
  name: string;
  description: string | null;
  images: string[];
  metadata: Metadata;
}

export interface Price {
  id: string;
  object: 'price';
  active: boolean;
  currency: string;
  type: 'one_time';
  unit_amount: number;
  product: Product;
}

export interface LineItem {
  id: string;
  object: 'item';
  amount_discount: number;
  amount_subtotal: number;
  amount_tax: number;
  amount_total: number;
  currency: string;
  description: string;
  quantity: number;
  price: Price;
}

export interface Address {
  line1: string;
  line2: string | null;
  city: string;
  postal_code: string;
  state: string | null;
  country: string;
}

export interface ShippingDetails {
  name: string;
  address: Address;
}

export interface CustomerDetails {
  email: string | null;
  name: string | null;
  address: null;
  phone: null;
  tax_exempt: 'none';
  tax_ids: string[];
}

export type CheckoutSessionStatus = 'open' | 'complete' | 'expired';

export interface CheckoutSession {
  id: string;
  object: 'checkout.session';
  amount_subtotal: number;
  amount_total: number;
  cancel_url: string | null;
  client_reference_id: string | null;
  collected_information: { shipping_details: ShippingDetails } | null;
  created: number;
  currency: string;
  customer: null;
  customer_details: CustomerDetails | null;
  customer_email: string | null;
  expires_at: number;
  livemode: boolean;
  locale: string | null;
  metadata: Metadata;
  mode: 'payment';
  payment_intent: string | null;
  payment_method_types: string[];
  payment_status: 'unpaid' | 'paid';
  shipping_address_collection: { allowed_countries: string[] } | null;
  /** Older API versions read the collected address here; newer ones under `collected_information`. */
  shipping_details: ShippingDetails | null;
  status: CheckoutSessionStatus;
  success_url: string;
  total_details: { amount_discount: number; amount_shipping: number; amount_tax: number };
  ui_mode: 'hosted';
  url: string | null;
}

// ---------- Payments ----------

export type PaymentIntentStatus = 'requires_payment_method' | 'requires_action' | 'succeeded' | 'canceled';

/** Why a payment attempt failed, as the hosted page decides it. */
export interface PaymentFailure {
  type: 'card_error' | 'invalid_request_error';
  code: string;
  decline_code?: string;
  message: string;
}

export interface LastPaymentError extends PaymentFailure {
  charge: string | null;
  payment_method: { id: string | null; object: 'payment_method'; type: 'card' };
}

export interface PaymentIntent {
  id: string;
  object: 'payment_intent';
  amount: number;
  amount_capturable: number;
  amount_received: number;
  canceled_at: number | null;
  cancellation_reason: 'abandoned' | null;
  capture_method: 'automatic_async';
  client_secret: string;
  confirmation_method: 'automatic';
  created: number;
  currency: string;
  customer: null;
  description: string | null;
  last_payment_error: LastPaymentError | null;
  latest_charge: string | null;
  livemode: boolean;
  metadata: Metadata;
  next_action: { type: 'use_stripe_sdk'; use_stripe_sdk: Record<string, never> } | null;
  payment_method: string | null;
  payment_method_types: string[];
  receipt_email: string | null;
  status: PaymentIntentStatus;
  transfer_group: string | null;
}

export interface ChargeOutcome {
  network_status: 'approved_by_network' | 'declined_by_network';
  reason: string | null;
  risk_level: 'normal';
  seller_message: string;
  type: 'authorized' | 'issuer_declined';
}

export interface Charge {
  id: string;
  object: 'charge';
  amount: number;
  amount_captured: number;
  amount_refunded: number;
  balance_transaction: string | null;
  billing_details: { email: string | null; name: null; address: null; phone: null };
  captured: boolean;
  created: number;
  currency: string;
  description: string | null;
  failure_code: string | null;
  failure_message: string | null;
  livemode: boolean;
  metadata: Metadata;
  outcome: ChargeOutcome;
  paid: boolean;
  payment_intent: string;
  payment_method: string | null;
  payment_method_details: {
    type: 'card';
    card: { brand: string; last4: string; exp_month: number; exp_year: number; funding: 'credit'; country: string };
  };
  receipt_email: string | null;
  refunded: boolean;
  refunds: ApiList<Refund>;
  status: 'succeeded' | 'failed';
  transfer_group: string | null;
}

export interface Refund {
  id: string;
  object: 'refund';
  amount: number;
  balance_transaction: string;
  charge: string;
  created: number;
  currency: string;
  metadata: Metadata;
  payment_intent: string;
  reason: 'duplicate' | 'fraudulent' | 'requested_by_customer' | null;
  status: 'succeeded';
}

export interface Balance {
  object: 'balance';
  available: Array<{ amount: number; currency: string }>;
  pending: Array<{ amount: number; currency: string }>;
  livemode: boolean;
}

// ---------- Connect ----------

export interface BusinessProfile {
  name: string | null;
  url: string | null;
  product_description: string | null;
  mcc: string | null;
}

export interface Account {
  id: string;
  object: 'account';
  business_profile: BusinessProfile;
  business_type: 'individual' | 'company' | 'non_profit' | 'government_entity' | null;
  capabilities: Record<string, 'active'>;
  charges_enabled: boolean;
  country: string;
  created: number;
  default_currency: string;
  details_submitted: boolean;
  email: string | null;
  metadata: Metadata;
  payouts_enabled: boolean;
  type: 'express' | 'standard' | 'custom';
}

export interface TransferReversal {
  id: string;
  object: 'transfer_reversal';
  amount: number;
  created: number;
  currency: string;
  metadata: Metadata;
  transfer: string;
}

export interface Transfer {
  id: string;
  object: 'transfer';
  amount: number;
  amount_reversed: number;
  balance_transaction: string;
  created: number;
  currency: string;
  description: string | null;
  destination: string;
  destination_payment: string;
  livemode: boolean;
  metadata: Metadata;
  reversals: ApiList<TransferReversal>;
  reversed: boolean;
  source_transaction: string | null;
  source_type: 'card';
  transfer_group: string | null;
}

// ---------- Events and webhook deliveries ----------

export type EventType = 'checkout.session.completed' | 'checkout.session.expired' | 'charge.refunded';

/** The object an event carries, by event type. */
export interface EventObjects {
  'checkout.session.completed': CheckoutSession;
  'checkout.session.expired': CheckoutSession;
  'charge.refunded': Charge;
}

/** Who caused an event: the API request, or nobody (the hosted page, the expiry sweep). */
export interface EventCause {
  apiVersion?: string;
  requestId?: string | null;
  idempotencyKey?: string | null;
}

export interface StripeEvent {
  id: string;
  object: 'event';
  api_version: string;
  created: number;
  data: { object: CheckoutSession | Charge; previous_attributes?: Partial<Charge> };
  livemode: boolean;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  type: EventType;
}

// ---------- All stored objects ----------

/** The API objects the fake keeps, by state key. */
export interface Collections {
  checkout_sessions: CheckoutSession;
  payment_intents: PaymentIntent;
  charges: Charge;
  accounts: Account;
  transfers: Transfer;
  refunds: Refund;
  events: StripeEvent;
}

export type CollectionName = keyof Collections;
export type ApiObject = Collections[CollectionName];
