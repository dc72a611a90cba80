// Two Namesakes on one machine (another PORT and DATA_DIR, same settings otherwise): the second one's
// local fakes find their usual ports taken by the first one's and take free ports instead, and each
// app talks to its own fakes. A taken app PORT is a one-line refusal.
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { afterAll, expect, test } from 'vitest';
import { listMail } from '../../fakes/mail/store.ts';
import { freePort } from '../../scripts/lib/server-process.ts';
import { createMailer } from '../../server/integrations/mailer.ts';
import { type Running, startNamesake } from '../../server/runtime.ts';
import { eventually } from '../factories/app.ts';

const running: Running[] = [];
const dirs: string[] = [];
afterAll(async () => {
  for (const r of running) await r.stop();
  for (const d of dirs) fs.rmSync(d, { recursive: true, force: true });
});

test('when a second runtime starts with the same fake ports, then it runs beside the first on free ones, each with its own mail and payments', async () => {
  // the "usual" ports both runtimes ask for (free ones here, so the test never touches 2525/12111)
  const [smtp, stripe] = [await freePort(), await freePort()];
  const envFor = (dir: string) => ({
    NODE_ENV: 'test',
    DATA_DIR: dir,
    PORT: '0',
    SMTP_PORT: String(smtp),
    STRIPE_API_BASE: `http://127.0.0.1:${stripe}`,
    DEMO_DATA: 'false',
    DIGEST: 'false',
    LOG_REQUESTS: 'false',
    BASE_URL: 'http://localhost:3999',
  });
  const [dirA, dirB] = [fs.mkdtempSync(path.join(os.tmpdir(), 'namesake-a-')), fs.mkdtempSync(path.join(os.tmpdir(), 'namesake-b-'))];
  dirs.push(dirA, dirB);

  const a = await startNamesake({ envSource: envFor(dirA), log: () => {} });
  running.push(a);
  const b = await startNamesake({ envSource: envFor(dirB), log: () => {} });
  running.push(b);

  expect(a.env.SMTP_PORT).toBe(smtp);
  expect(a.env.STRIPE_API_BASE).toBe(`http://127.0.0.1:${stripe}`);
  expect(b.env.SMTP_PORT).not.toBe(smtp);
  expect(b.env.STRIPE_API_BASE).not.toBe(a.env.STRIPE_API_BASE);
  expect(b.url).not.toBe(a.url);

  // each app answers, and each payment fake is a live one
  for (const r of [a, b]) {
    expect((await fetch(`${r.url.replace('localhost', '127.0.0.1')}/api/health`)).status).toBe(200);
    const charges = await fetch(`${r.env.STRIPE_API_BASE}/v1/charges`, { headers: { authorization: `Bearer ${r.env.STRIPE_SECRET_KEY}` } });
    expect(charges.status).toBe(200);
  }

  // mail sent through B's settings lands in B's store, not A's
  const mailer = createMailer(b.env);
  await mailer.send({ to: 'someone@example.com', subject: 'for B only', text: 'hello', html: '<p>hello</p>' });
  mailer.close();
  await eventually(async () => (await listMail(b.env.mailDir, { to: 'someone@example.com' })).length === 1);
  expect(await listMail(a.env.mailDir, { to: 'someone@example.com' })).toEqual([]);
});

test('when the app PORT itself is taken, then start-up refuses with a one-line message naming the port', async () => {
  const holder = net.createServer();
  await new Promise<void>((r) => holder.listen(0, '127.0.0.1', () => r()));
  const port = (holder.address() as net.AddressInfo).port;
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'namesake-c-'));
  dirs.push(dir);
  try {
    await expect(
      startNamesake({
        envSource: { NODE_ENV: 'test', DATA_DIR: dir, PORT: String(port), SMTP_PORT: '0', STRIPE_FAKE_PORT: '0', DEMO_DATA: 'false', DIGEST: 'false', LOG_REQUESTS: 'false' },
        log: () => {},
      }),
    ).rejects.toThrow(`127.0.0.1:${port} is already in use`);
  } finally {
    holder.close();
  }
});
