// What the resource handlers and the hosted page share: the state, the event queue, the clock and the
// public URL of the hosted pages.
import type { Store } from './store.ts';
import type { Webhooks } from './webhooks.ts';

export interface Fake {
  store: Store;
  webhooks: Webhooks;
  /** The fake's clock (ms); tests move it on to expire sessions. */
  now(): number;
  /** The same clock in unix seconds, as object timestamps use it. */
  nowSec(): number;
  /** Base of the hosted payment page URLs (no trailing slash); set once the server listens. */
  publicUrl: string;
}
