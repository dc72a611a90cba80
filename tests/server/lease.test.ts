// The once-only lease (server/jobs/lease.ts) on a real SQLite file: two processes' worth of leases
// (two holder tokens) compete for one row. Time is a clock the test moves, and the renew timer is
// driven by vitest's fake timers, so no test waits on the wall clock.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, afterEach, beforeEach, describe, expect, test, vi } from 'vitest';
import { openDb } from '../../server/db/client.ts';
import { leaseRepo } from '../../server/jobs/lease.repo.ts';
import { type Lease, startLease } from '../../server/jobs/lease.ts';

const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'namesake-lease-'));
const { db, sqlite } = openDb(path.join(dataDir, 'namesake.db'));
afterAll(() => {
  sqlite.close();
  fs.rmSync(dataDir, { recursive: true, force: true });
});

const TTL = 15_000;
const RENEW = 5_000;
// tokens naming this test's own pid: a live process, so only expiry can free their lease
const token = (who: string) => `pid ${process.pid} · ${who}`;

let n = 0;
let name = '';
const started: Lease[] = [];
beforeEach(() => {
  vi.useFakeTimers({ now: 1_800_000_000_000 });
  name = `test-lease-${++n}`;
});
afterEach(async () => {
  for (const l of started.splice(0)) await l.stop();
  vi.useRealTimers();
});

function contender(who: string) {
  const events: string[] = [];
  const lease = startLease(db, {
    name,
    holder: token(who),
    ttlMs: TTL,
    renewMs: RENEW,
    onAcquire: () => events.push('acquire'),
    onRelease: () => void events.push('release'),
  });
  started.push(lease);
  return { lease, events };
}

describe('the once-only lease', () => {
  test('when two processes start, then exactly one holds the lease, and it keeps it while it renews', () => {
    const a = contender('a');
    const b = contender('b');
    expect(a.lease.held()).toBe(true);
    expect(b.lease.held()).toBe(false);
    expect(leaseRepo.holder(db, name, Date.now())).toBe(token('a'));
    // many renew rounds, well past one TTL: the holder renews, the other never gets in
    vi.advanceTimersByTime(TTL * 4);
    expect(a.lease.held()).toBe(true);
    expect(b.lease.held()).toBe(false);
    expect(a.events).toEqual(['acquire']);
    expect(b.events).toEqual([]);
  });

  test('when the holder stops renewing (it died), then another takes the lease over once it has expired, not before', () => {
    // a holder that took the lease once and then stopped (no timer of its own, as a killed process)
    expect(leaseRepo.take(db, name, token('dead'), Date.now(), TTL)).toBe(true);
    const b = contender('b');
    expect(b.lease.held()).toBe(false);
    vi.advanceTimersByTime(TTL - RENEW); // 10 s: still within the dead holder's lease
    expect(b.lease.held()).toBe(false);
    vi.advanceTimersByTime(RENEW); // 15 s: expired at this tick
    expect(b.lease.held()).toBe(true);
    expect(b.events).toEqual(['acquire']);
    expect(leaseRepo.holder(db, name, Date.now())).toBe(token('b'));
    // and the old holder, were it to come back, cannot take it while b renews
    expect(leaseRepo.take(db, name, token('dead'), Date.now(), TTL)).toBe(false);
  });

  test('when the holder stops cleanly, then it gives the lease up and the next try of another process takes it', async () => {
    const a = contender('a');
    const b = contender('b');
    await a.lease.stop();
    expect(a.events).toEqual(['acquire', 'release']);
    expect(leaseRepo.holder(db, name, Date.now())).toBeNull();
    vi.advanceTimersByTime(RENEW);
    expect(b.lease.held()).toBe(true);
  });

  test('when the holder named a process that no longer runs, then the lease is taken at once, without waiting for expiry', () => {
    // pid 2^22 + 1 is above Linux's pid_max, so no process has it
    const gone = `pid ${2 ** 22 + 1} · crashed`;
    expect(leaseRepo.take(db, name, gone, Date.now(), TTL)).toBe(true);
    const b = contender('b');
    expect(b.lease.held()).toBe(true);
  });

  test('when two takes race at the same instant, then the statement lets one win', () => {
    const at = Date.now();
    const results = [leaseRepo.take(db, name, token('x'), at, TTL), leaseRepo.take(db, name, token('y'), at, TTL)];
    expect(results).toEqual([true, false]);
  });
});
