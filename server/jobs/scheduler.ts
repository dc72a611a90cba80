// Scheduled jobs (croner): the sellers' morning digest at DIGEST_CRON in BUSINESS_TIME_ZONE, plus a
// catch-up at start-up when today's run time has already passed (a server that was down at 07:00
// still sends today's digest). runDigest itself makes a second run for the same day a no-op.
import { Cron } from 'croner';
import { dayInZone } from '../../shared/business/working-days.ts';
import { type DigestDeps, type DigestResult, runDigest } from '../features/business/index.ts';

export type Jobs = { stop(): Promise<void>; catchUp: Promise<DigestResult | null>; nextRun(): Date | null };

export function startJobs(deps: DigestDeps, log: (s: string) => void = () => {}): Jobs {
  const tz = deps.env.BUSINESS_TIME_ZONE;
  let running: Promise<unknown> = Promise.resolve();
  const digest = () => {
    const p = runDigest(deps)
      .then((r) => {
        if (r.sent.length) log(`  digest ${r.day}: sent to ${r.sent.length} shop(s)`);
        return r;
      })
      .catch((e: unknown) => {
        console.error('digest: run failed', e);
        return null;
      });
    running = p;
    return p;
  };
  // protect: a slow run is never overlapped by the next tick
  const job = new Cron(deps.env.DIGEST_CRON, { timezone: tz, protect: true, catch: true, name: 'digest' }, () => {
    void digest();
  });
  const now = new Date(deps.now());
  const last = job.previousRuns(1, now)[0];
  const catchUp = last && dayInZone(last.getTime(), tz) === dayInZone(now.getTime(), tz) ? digest() : Promise.resolve(null);
  return {
    catchUp,
    nextRun: () => job.nextRun(),
    async stop() {
      job.stop();
      await running; // let a digest in flight finish before the database closes
    },
  };
}
