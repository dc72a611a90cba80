/**
 * A lease row in the database decides which server process does the once-only work (the scheduled
 * jobs and the work sheet PDFs) when WORKERS starts several. Each process tries to take the lease
 * every `renewMs`; the holder renews it, so it stays held while the holder lives. A holder that dies
 * stops renewing, the row expires after `ttlMs`, and the next process to try takes it over. A process
 * that stops cleanly gives the lease up at once. With one process it simply always holds it.
 */
import crypto from 'node:crypto';
import type { Db } from '../db/client.ts';
import { leaseRepo } from './lease.repo.ts';

export type LeaseOptions = {
  name: string;
  /** how long a take lasts without renewal; a dead holder is replaced this long after its last renewal */
  ttlMs?: number;
  /** how often to renew (holder) or try to take over (others); well under ttlMs */
  renewMs?: number;
  /** this process's token; by default the pid plus a random part, new at each start */
  holder?: string;
  now?: () => number;
  /** called when this process becomes the holder: start the once-only work */
  onAcquire: () => void;
  /** called when the lease is lost (not renewed in time) or given up: stop that work */
  onRelease: () => Promise<void> | void;
};

export type Lease = { readonly holder: string; held(): boolean; stop(): Promise<void> };

export const LEASE_TTL_MS = 15_000;
export const LEASE_RENEW_MS = 5_000;

export const newHolderToken = () => `pid ${process.pid} · ${crypto.randomUUID().slice(0, 8)}`;

/** True when the token names a pid (`pid N · …`) that no longer runs here. */
function processGone(token: string): boolean {
  const pid = Number(/^pid (\d+) /.exec(token)?.[1]);
  if (!pid || pid === process.pid) return false;
  try {
    process.kill(pid, 0);
    return false;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === 'ESRCH';
  }
}

export function startLease(db: Db, opts: LeaseOptions): Lease {
  const ttlMs = opts.ttlMs ?? LEASE_TTL_MS;
  const renewMs = opts.renewMs ?? LEASE_RENEW_MS;
  const holder = opts.holder ?? newHolderToken();
  const now = opts.now ?? Date.now;
  let held = false;
  let stopped = false;
  let releasing: Promise<void> = Promise.resolve();

  const tick = () => {
    if (stopped) return;
    let got: boolean;
    try {
      // a holder on this machine whose process is gone gives way at once, not after its expiry
      if (!held) {
        const other = leaseRepo.holder(db, opts.name, now());
        if (other && other !== holder && processGone(other)) leaseRepo.expire(db, opts.name, other);
      }
      got = leaseRepo.take(db, opts.name, holder, now(), ttlMs);
    } catch (e) {
      // the database is busy past its timeout: treat as not renewed; the next tick tries again
      console.error(`lease ${opts.name}: could not renew`, e);
      got = false;
    }
    if (got && !held) {
      held = true;
      opts.onAcquire();
    } else if (!got && held) {
      held = false;
      releasing = Promise.resolve(opts.onRelease());
    }
  };
  tick();
  const timer = setInterval(tick, renewMs);
  timer.unref();
  return {
    holder,
    held: () => held,
    async stop() {
      if (stopped) return releasing;
      stopped = true;
      clearInterval(timer);
      if (held) {
        held = false;
        await opts.onRelease();
        leaseRepo.release(db, opts.name, holder);
      }
      await releasing;
    },
  };
}
