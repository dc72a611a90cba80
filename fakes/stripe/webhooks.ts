// Events and their webhook deliveries: each event is POSTed to the webhook URL, signed the way
// stripe-node's src/Webhooks.ts checks it (`Stripe-Signature: t=<unix s>,v1=<hex HMAC-SHA256 of "t.body">`),
// retried with doubling back-off until a 2xx or `maxAttempts`. Deliveries live in the state file, so a
// restart resumes them.
import { createHmac } from 'node:crypto';
import { clone, type Delivery, newId, patch, type Store } from './store.ts';
import type { Charge, EventCause, EventObjects, EventType, StripeEvent } from './types.ts';

// The API version the installed SDK pins; sent back when a request does not name one.
export const DEFAULT_API_VERSION = '2026-10-28.endive';

export interface WebhookOptions {
  /** Where events are POSTed; deliveries wait (without using up attempts) while it is null. */
  url: string | null;
  /** `whsec_…` secret used to sign deliveries. */
  secret: string;
  /** First retry delay; doubles each attempt. */
  retryBaseMs: number;
  /** Cap on the retry delay. */
  retryMaxMs: number;
  /** Attempts per event before it is marked `failed`. */
  maxAttempts: number;
  /** Per-attempt timeout. */
  deliveryTimeoutMs: number;
  /** Event `created` (unix seconds), from the fake's clock. */
  nowSec: () => number;
  log: (message: string) => void;
}

/** The `Stripe-Signature` header value for `payload` sent at `t` (unix seconds). */
export function signature(secret: string, t: number, payload: string): string {
  const v1 = createHmac('sha256', secret).update(`${t}.${payload}`, 'utf8').digest('hex');
  return `t=${t},v1=${v1}`;
}

export class Webhooks {
  private url: string | null;
  private timer: NodeJS.Timeout | null = null;
  private closed = false;
  private readonly inFlight = new Map<string, AbortController>();
  private readonly inFlightDone = new Set<Promise<void>>();

  constructor(
    private readonly store: Store,
    private readonly opts: WebhookOptions,
  ) {
    this.url = opts.url;
  }

  get webhookUrl(): string | null {
    return this.url;
  }

  setUrl(url: string): void {
    this.url = url;
    this.schedule();
  }

  /** Records an event about `object` (a copy) and queues its delivery. */
  emit<T extends EventType>(type: T, object: EventObjects[T], cause: EventCause, previous?: Partial<Charge>): StripeEvent {
    const ev: StripeEvent = {
      id: newId('evt_'),
      object: 'event',
      api_version: cause.apiVersion ?? DEFAULT_API_VERSION,
      created: this.opts.nowSec(),
      data: { object: clone(object), ...(previous ? { previous_attributes: previous } : {}) },
      livemode: false,
      pending_webhooks: 1,
      request: { id: cause.requestId ?? null, idempotency_key: cause.idempotencyKey ?? null },
      type,
    };
    this.store.insert('events', ev);
    this.store.state.deliveries[ev.id] = {
      event_id: ev.id,
      status: 'pending',
      attempts: 0,
      next_attempt_at: Date.now(),
      delivered_at: null,
      last_url: null,
      attempts_log: [],
    };
    // Delivery starts on the next tick, after the caller has saved state.
    setImmediate(() => this.schedule());
    return ev;
  }

  /** Starts the deliveries that are due and sets a timer for the next one. */
  schedule(): void {
    if (this.closed) return;
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    if (!this.url) return; // deliveries wait for an endpoint
    let next = Infinity;
    const t = Date.now();
    for (const d of Object.values(this.store.state.deliveries)) {
      if (d.status !== 'pending' || this.inFlight.has(d.event_id)) continue;
      if (d.next_attempt_at <= t) {
        const p = this.deliver(d).finally(() => this.inFlightDone.delete(p));
        this.inFlightDone.add(p);
      } else next = Math.min(next, d.next_attempt_at);
    }
    if (next !== Infinity) {
      this.timer = setTimeout(() => this.schedule(), Math.max(0, next - Date.now()));
      this.timer.unref();
    }
  }

  /** Sends an event again from its first attempt (unless an attempt is under way); null when there is no such event. */
  async retry(eventId: string): Promise<Delivery | null> {
    const d = this.store.state.deliveries[eventId];
    if (!d) return null;
    if (!this.inFlight.has(d.event_id)) patch(d, { status: 'pending', attempts: 0, next_attempt_at: Date.now() });
    await this.store.persist();
    this.schedule();
    return d;
  }

  /** Stops the timer and cuts attempts short; a cut attempt does not count and is retried after a restart. */
  async close(): Promise<void> {
    this.closed = true;
    if (this.timer) clearTimeout(this.timer);
    for (const ac of this.inFlight.values()) ac.abort(new Error('stripe fake closing'));
    await Promise.allSettled([...this.inFlightDone]);
  }

  private async deliver(d: Delivery): Promise<void> {
    const ev = this.store.get('events', d.event_id);
    const url = this.url;
    if (!ev || !url) return;
    const { opts } = this;
    const ac = new AbortController();
    this.inFlight.set(d.event_id, ac);
    // Stripe sends the event pretty-printed; the same bytes each attempt, signed afresh with a new timestamp.
    const payload = JSON.stringify(ev, null, 2);
    const t = Math.floor(Date.now() / 1000);
    const started = Date.now();
    let status: number | null = null;
    let error: string | null = null;
    const timeout = setTimeout(() => ac.abort(new Error('timed out')), opts.deliveryTimeoutMs);
    try {
      const res = await fetch(url, {
        method: 'POST',
        headers: {
          'content-type': 'application/json; charset=utf-8',
          'stripe-signature': signature(opts.secret, t, payload),
          'user-agent': 'Stripe/1.0 (+https://stripe.com/docs/webhooks)',
        },
        body: payload,
        signal: ac.signal,
        redirect: 'manual',
      });
      status = res.status;
      await res.arrayBuffer().catch(() => undefined);
    } catch (e) {
      error = e instanceof Error ? (e.cause instanceof Error ? e.cause.message : e.message) : String(e);
    } finally {
      clearTimeout(timeout);
      this.inFlight.delete(d.event_id);
    }
    if (this.closed) return; // an attempt cut short by close() does not count; it is retried after restart
    d.attempts += 1;
    d.last_url = url;
    d.attempts_log.push({ at: started, status, error, duration_ms: Date.now() - started });
    if (d.attempts_log.length > 20) d.attempts_log.shift();
    if (status !== null && status >= 200 && status < 300) {
      d.status = 'delivered';
      d.delivered_at = Date.now();
      ev.pending_webhooks = 0;
      opts.log(`webhook ${ev.type} ${ev.id} delivered (${status})`);
    } else if (d.attempts >= opts.maxAttempts) {
      d.status = 'failed';
      opts.log(`webhook ${ev.type} ${ev.id} failed after ${d.attempts} attempts`);
    } else {
      d.next_attempt_at = Date.now() + Math.min(opts.retryBaseMs * 2 ** (d.attempts - 1), opts.retryMaxMs);
      opts.log(`webhook ${ev.type} ${ev.id} attempt ${d.attempts}: ${status ?? error}; retrying`);
    }
    await this.store.persist();
    this.schedule();
  }
}
