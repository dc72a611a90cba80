// The Stripe fake's state: typed tables kept in one JSON file (`stripe-state.json`) across restarts,
// written atomically with group commit; object ids; idempotency records.
import { createHash, randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { missing } from './http.ts';
import type { ApiObject, CollectionName, Collections, LineItem, Metadata, ShippingDetails } from './types.ts';

// ---------- what the fake keeps beside the API objects ----------

/** The card typed on the hosted page, as far as the fake keeps it. */
export interface PendingCard {
  last4: string;
  exp_month: number;
  exp_year: number;
  brand: string;
}

/** What a session needs that Stripe does not return on the session object itself. */
export interface SessionExtra {
  line_items: LineItem[];
  transfer_group: string | null;
  pi_metadata: Metadata;
  pi_description: string | null;
  api_version: string;
  pending_auth: PendingCard | null;
  /** The address typed with the card, held while a card asks for the extra confirmation step. */
  pending_shipping?: ShippingDetails | null;
}

export interface DeliveryAttempt {
  at: number;
  status: number | null;
  error: string | null;
  duration_ms: number;
}

export interface Delivery {
  event_id: string;
  status: 'pending' | 'delivered' | 'failed';
  attempts: number;
  next_attempt_at: number;
  delivered_at: number | null;
  last_url: string | null;
  attempts_log: DeliveryAttempt[];
}

export interface IdempotencyRecord {
  fingerprint: string;
  method: string;
  path: string;
  status: number;
  body: string;
  created: number;
}

/** One table per kind of API object, by id. */
export type Tables = { [K in CollectionName]: Record<string, Collections[K]> };

/** The state file (`stripe-state.json`); each table keeps insertion (creation) order. */
export interface State extends Tables {
  version: 1;
  session_extra: Record<string, SessionExtra>;
  idempotency: Record<string, IdempotencyRecord>;
  deliveries: Record<string, Delivery>;
}

// ---------- the store ----------

const IDEMPOTENCY_TTL_MS = 24 * 3600 * 1000; // Stripe keeps keys for at least 24 hours.

const B62 = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789';

/** A Stripe-style id: `prefix` then `length` random base-62 characters. */
export function newId(prefix: string, length = 24): string {
  const bytes = randomBytes(length);
  let out = prefix;
  for (const b of bytes) out += B62.charAt(b % 62);
  return out;
}

/** A deep copy through JSON, so a reply or an event never shares objects with the state. */
export const clone = <T>(v: T): T => JSON.parse(JSON.stringify(v)) as T;

/** Object.assign with the changes checked against the object's type; existing keys keep their place. */
export function patch<T extends object>(target: T, changes: Partial<T>): T {
  return Object.assign(target, changes);
}

/** JSON with object keys sorted, so the same parameters always give the same text. */
function canonical(v: unknown): string {
  if (Array.isArray(v)) return `[${v.map(canonical).join(',')}]`;
  if (v && typeof v === 'object') {
    const o = v as Record<string, unknown>;
    return `{${Object.keys(o)
      .sort()
      .map((k) => `${JSON.stringify(k)}:${canonical(o[k])}`)
      .join(',')}}`;
  }
  return JSON.stringify(v);
}

/** What an idempotency key is tied to: the method, the path and the parameters. */
export function requestFingerprint(method: string, pathname: string, params: Record<string, unknown>): string {
  return createHash('sha256')
    .update(`${method} ${pathname} ${canonical(params)}`)
    .digest('hex');
}

function emptyState(): State {
  return {
    version: 1,
    checkout_sessions: {},
    session_extra: {},
    payment_intents: {},
    charges: {},
    accounts: {},
    transfers: {},
    refunds: {},
    events: {},
    idempotency: {},
    deliveries: {},
  };
}

function loadState(file: string): State {
  if (!fs.existsSync(file)) return emptyState();
  const text = fs.readFileSync(file, 'utf8');
  try {
    const parsed = JSON.parse(text) as Partial<State>;
    return { ...emptyState(), ...parsed, version: 1 };
  } catch (e) {
    throw new Error(`Stripe fake: cannot read ${file} (${e instanceof Error ? e.message : String(e)}). Move it away to start with empty state.`);
  }
}

// Which table an id belongs to, by its prefix (used to expand ids into objects).
const PREFIXES: Array<[string, CollectionName]> = [
  ['cs_', 'checkout_sessions'],
  ['pi_', 'payment_intents'],
  ['ch_', 'charges'],
  ['acct_', 'accounts'],
  ['tr_', 'transfers'],
  ['re_', 'refunds'],
  ['evt_', 'events'],
];

export class Store {
  readonly state: State;
  private readonly file: string;
  private dirty = false;
  private flushing: Promise<void> | null = null;
  private closed = false;

  constructor(dataDir: string) {
    fs.mkdirSync(dataDir, { recursive: true });
    this.file = path.join(dataDir, 'stripe-state.json');
    this.state = loadState(this.file);
    // Drop idempotency records past their lifetime.
    for (const [k, rec] of Object.entries(this.state.idempotency)) {
      if (Date.now() - rec.created > IDEMPOTENCY_TTL_MS) delete this.state.idempotency[k];
    }
  }

  /** Writes the whole state now; rename is atomic, so a crash leaves the old or the new file, never half of one. */
  save(): void {
    const tmp = `${this.file}.${process.pid}.tmp`;
    fs.writeFileSync(tmp, JSON.stringify(this.state));
    fs.renameSync(tmp, this.file);
  }

  /**
   * Group commit: every change made in one turn of the event loop goes out in one write, and a
   * response waits for the write that holds its change, so what a client was told is on disk.
   */
  persist(): Promise<void> {
    this.dirty = true;
    this.flushing ??= new Promise<void>((resolve, reject) =>
      setImmediate(() => {
        this.flushing = null;
        try {
          if (this.dirty && !this.closed) {
            // after close() the final state has been written already
            this.dirty = false;
            this.save();
          }
          resolve();
        } catch (e) {
          reject(e);
        }
      }),
    );
    return this.flushing;
  }

  /** Resolves once the write in progress (if any) is on disk. */
  async settled(): Promise<void> {
    if (this.flushing) await this.flushing;
  }

  /** Writes the final state; later persist() calls write nothing. */
  close(): void {
    this.closed = true;
    this.save();
  }

  // ----- objects -----

  /** All objects of a table, oldest first. */
  all<K extends CollectionName>(table: K): Array<Collections[K]> {
    return Object.values(this.table(table));
  }

  get<K extends CollectionName>(table: K, id: string): Collections[K] | undefined {
    return this.table(table)[id];
  }

  insert<K extends CollectionName>(table: K, obj: Collections[K]): Collections[K] {
    this.table(table)[obj.id] = obj;
    return obj;
  }

  private table<K extends CollectionName>(name: K): Record<string, Collections[K]> {
    const tables: Tables = this.state;
    return tables[name];
  }

  /** The object, or a 404 `resource_missing` naming `what` and `param`. */
  mustGet<K extends CollectionName>(table: K, id: string, what: string, param = 'id'): Collections[K] {
    const o = this.get(table, id);
    if (!o) throw missing(what, id, param);
    return o;
  }

  /** Any stored object by id, whatever its table. */
  lookup(id: string): ApiObject | undefined {
    const table = PREFIXES.find(([prefix]) => id.startsWith(prefix))?.[1];
    return table ? this.get(table, id) : undefined;
  }

  // ----- idempotency -----

  idempotent(key: string): IdempotencyRecord | undefined {
    return this.state.idempotency[key];
  }

  remember(key: string, rec: IdempotencyRecord): void {
    this.state.idempotency[key] = rec;
  }
}
