// The fake's state across restarts (fakes/stripe/store.ts) and running it on its own (fakes/stripe/main.ts).

import { spawn } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import Stripe from 'stripe';
import { describe, expect, it } from 'vitest';
import { KEY, pay, SECRET, sessionParams, startReceiver, TOTAL, waitFor, withStripeFakes } from './helpers.ts';

const env = withStripeFakes();
const { fake, fakes, closers } = env;

describe('persistence', () => {
  it('when the fake restarts on the same dataDir, then sessions, idempotency records and pending webhooks survive', async () => {
    const failing = await startReceiver(() => 500);
    closers.push(failing.close);
    const first = await fake({ webhookUrl: failing.url, retryBaseMs: 5000 });
    const s = await first.stripe.checkout.sessions.create(sessionParams(), { idempotencyKey: 'restart-key' });
    await pay(s.url!, '4242424242424242');
    await waitFor(() => failing.received.length >= 1); // first attempt failed; the next is 5 s away
    await first.f.close();
    fakes.splice(fakes.indexOf(first.f), 1);

    const file = path.join(env.dir, 'stripe-state.json');
    expect(fs.existsSync(file)).toBe(true);
    expect(fs.readdirSync(env.dir).filter((n) => n.endsWith('.tmp'))).toEqual([]);

    const receiver = await startReceiver();
    closers.push(receiver.close);
    const second = await fake({ webhookUrl: receiver.url });
    const again = await second.stripe.checkout.sessions.retrieve(s.id);
    expect(again.status).toBe('complete');
    expect(again.amount_total).toBe(TOTAL);
    const replay = await second.stripe.checkout.sessions.create(sessionParams(), { idempotencyKey: 'restart-key' });
    expect(replay.id).toBe(s.id);
    expect(replay.lastResponse.headers['idempotent-replayed']).toBe('true');

    // The pending delivery resumes against the new endpoint after the restart.
    const got = await waitFor(() => receiver.received[0]);
    const ev = second.stripe.webhooks.constructEvent(got.body, got.signature, SECRET);
    expect(ev.type).toBe('checkout.session.completed');
    expect((ev.data.object as Stripe.Checkout.Session).id).toBe(s.id);
  });

  it('when main.ts runs from env, then it serves the API and stops cleanly on SIGTERM', async () => {
    const child = spawn(path.resolve('node_modules/.bin/tsx'), ['fakes/stripe/main.ts'], {
      env: { ...process.env, STRIPE_FAKE_PORT: '0', DATA_DIR: env.dir, STRIPE_WEBHOOK_SECRET: SECRET },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let out = '';
    child.stdout.on('data', (c: Buffer) => (out += c.toString()));
    const exited = new Promise<number | null>((r) => child.on('exit', (code) => r(code)));
    try {
      const url = await waitFor(() => /listening on (http:\/\/127\.0\.0\.1:\d+)/.exec(out)?.[1], 15000);
      const port = Number(new URL(url).port);
      const stripe = new Stripe(KEY, { host: '127.0.0.1', port, protocol: 'http' });
      const acct = await stripe.accounts.create({ type: 'express' });
      expect(acct.id).toMatch(/^acct_/);
    } finally {
      child.kill('SIGTERM');
    }
    expect(await exited).toBe(0);
    const saved = JSON.parse(fs.readFileSync(path.join(env.dir, 'stripe', 'stripe-state.json'), 'utf8')) as { accounts: Record<string, unknown> };
    expect(Object.keys(saved.accounts)).toHaveLength(1);
  });
});
