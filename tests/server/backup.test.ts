// Backups: `npm run db:backup` copies the database with SQLite's online backup API while the real
// server runs and orders keep being written (sqlite.org, "SQLite Online Backup API": the copy is
// one consistent point in time); `npm run db:restore FILE` checks the file, refuses while a server
// runs on DATA_DIR, keeps the old database aside and puts the backup in place. Restored into a
// fresh DATA_DIR, a server started on it shows the shopper every order.

import { spawn } from 'node:child_process';
import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import Database from 'better-sqlite3';
import request from 'supertest';
import { afterAll, describe, expect, test } from 'vitest';
import { type Running, startNamesake } from '../../server/runtime.ts';
import { offlineServerEnv } from '../factories/offline-env.ts';

const TSX = path.resolve('node_modules/.bin/tsx');
const dirs: string[] = [];
const running: Running[] = [];
const tmp = (p: string) => {
  const d = fs.mkdtempSync(path.join(os.tmpdir(), p));
  dirs.push(d);
  return d;
};
afterAll(async () => {
  for (const r of running) await r.stop();
  for (const d of dirs) fs.rmSync(d, { recursive: true, force: true });
});

const envFor = offlineServerEnv;

/** Runs one of our npm scripts the way `npm run` does (tsx on the file), with DATA_DIR set. */
function runScript(script: string, args: string[], dataDir: string): Promise<{ code: number | null; out: string; err: string }> {
  return new Promise((resolve) => {
    const child = spawn(TSX, [script, ...args], { env: { ...process.env, ...envFor(dataDir) }, stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    let err = '';
    child.stdout.on('data', (d) => (out += d));
    child.stderr.on('data', (d) => (err += d));
    child.on('exit', (code) => resolve({ code, out, err }));
  });
}

type Row = Record<string, unknown>;
/** Copies a row of `table` with new values (a new order like the seeded ones, made straight in SQL). */
function clone(db: Database.Database, table: string, row: Row, over: Row) {
  const r = { ...row, ...over };
  const cols = Object.keys(r);
  db.prepare(`insert into ${table} (${cols.map((c) => `"${c}"`).join(',')}) values (${cols.map(() => '?').join(',')})`).run(...cols.map((c) => r[c] as never));
}

describe('db:backup and db:restore', () => {
  test('when orders are written during a backup, then the copy is consistent, restore refuses while running, and a fresh restore shows every order', async () => {
    const live = tmp('namesake-live-');
    const app = await startNamesake({ envSource: envFor(live), seed: true, log: () => {} });
    running.push(app);
    const dbFile = path.join(live, 'namesake.db');
    const writer = new Database(dbFile);
    writer.pragma('busy_timeout = 5000');
    const danaId = (writer.prepare("select id from user where email = 'dana@namesake.test'").get() as { id: string }).id;
    const template = writer.prepare('select * from orders where buyer_id = ? limit 1').get(danaId) as Row;
    const tplCheckout = writer.prepare('select * from checkouts where id = ?').get(template.checkout_id) as Row;
    const tplLines = writer.prepare('select * from order_lines where order_id = ?').all(template.id) as Row[];
    const before = new Set((writer.prepare('select id from orders').all() as { id: string }[]).map((r) => r.id));
    expect(before.size).toBeGreaterThan(0);

    const newOrder = writer.transaction((n: number) => {
      const checkoutId = crypto.randomUUID();
      const orderId = crypto.randomUUID();
      clone(writer, 'checkouts', tplCheckout, {
        id: checkoutId,
        cart_id: crypto.randomUUID(),
        provider_session_id: `cs_backup_${n}_${checkoutId.slice(0, 8)}`,
        payment_intent_id: `pi_backup_${n}`,
        charge_id: `ch_backup_${n}`,
      });
      clone(writer, 'orders', template, { id: orderId, checkout_id: checkoutId, number: `NS-BK${String(n).padStart(5, '0')}`, transfer_id: null });
      for (const l of tplLines) clone(writer, 'order_lines', l, { id: crypto.randomUUID(), order_id: orderId });
      return orderId;
    });
    // a few orders before the backup starts: these must all be in it
    for (let n = 0; n < 20; n++) before.add(newOrder(n));

    // Act: back up while a writer keeps adding orders (each with its lines, in one transaction)
    const out = path.join(tmp('namesake-bk-'), 'nightly.db');
    const backup = runScript('scripts/db-backup.ts', [out], live);
    let done = false;
    void backup.then(() => (done = true));
    const during: string[] = [];
    for (let n = 1000; !done; n++) {
      during.push(newOrder(n));
      await new Promise((r) => setTimeout(r, 1));
    }
    const b = await backup;
    expect(b.code, b.err).toBe(0);
    expect(b.out).toMatch(/integrity ok/);
    expect(during.length).toBeGreaterThan(0);
    writer.close();

    // the copy: sound, every order from before is there, and every order in it is whole
    const copy = new Database(out, { readonly: true });
    expect(copy.pragma('integrity_check', { simple: true })).toBe('ok');
    expect(copy.pragma('foreign_key_check')).toEqual([]);
    const copied = copy.prepare('select o.id, (select count(*) from order_lines l where l.order_id = o.id) as n from orders o').all() as { id: string; n: number }[];
    const ids = new Set(copied.map((r) => r.id));
    for (const id of before) expect(ids.has(id)).toBe(true);
    for (const r of copied.filter((c) => during.includes(c.id))) expect(r.n).toBe(tplLines.length);
    const danaInCopy = (copy.prepare('select id from orders where buyer_id = ?').all(danaId) as { id: string }[]).map((r) => r.id);
    copy.close();
    expect(fs.existsSync(`${out}-wal`)).toBe(false);

    // restore while the server runs on that DATA_DIR: refused, nothing touched
    const sizeBefore = fs.statSync(dbFile).size;
    const refused = await runScript('scripts/db-restore.ts', [out], live);
    expect(refused.code).toBe(1);
    expect(refused.err).toMatch(/is running on .*Stop it first/);
    expect(fs.statSync(dbFile).size).toBe(sizeBefore);
    expect(fs.readdirSync(live).some((f) => f.includes('before-restore'))).toBe(false);

    // restore into a fresh DATA_DIR, start a server on it: Dana sees every order the copy holds
    const fresh = tmp('namesake-restored-');
    const restored = await runScript('scripts/db-restore.ts', [out], fresh);
    expect(restored.code, restored.err).toBe(0);
    const app2 = await startNamesake({ envSource: envFor(fresh), seed: false, log: () => {} });
    running.push(app2);
    const agent = request.agent(app2.url);
    expect((await agent.post('/api/auth/sign-in/email').set('Origin', app2.url).send({ email: 'dana@namesake.test', password: 'namesake-demo' })).status).toBe(200);
    // every page of her orders, 100 at a time
    const shown = new Set<string>();
    for (let page = 1; ; page++) {
      const list = await agent.get(`/api/orders?limit=100&page=${page}`);
      expect(list.status).toBe(200);
      expect(list.body.total).toBe(danaInCopy.length);
      for (const o of list.body.items as { id: string }[]) shown.add(o.id);
      if (list.body.items.length < 100) break;
    }
    expect(shown.size).toBe(danaInCopy.length);
    for (const id of danaInCopy) expect(shown.has(id)).toBe(true);
    await app2.stop();
    running.pop();

    // restoring over an existing database keeps the old one aside, whole
    const again = await runScript('scripts/db-restore.ts', [out], fresh);
    expect(again.code, again.err).toBe(0);
    const kept = fs.readdirSync(fresh).find((f) => f.startsWith('namesake.db.before-restore-'));
    expect(kept).toBeTruthy();
    const old = new Database(path.join(fresh, kept!), { readonly: true });
    expect((old.prepare('select count(*) as n from orders').get() as { n: number }).n).toBe(copied.length);
    old.close();
  }, 120_000);

  test('when the file is not a Namesake database, then restore refuses and the current database stays', async () => {
    const dir = tmp('namesake-bad-');
    fs.writeFileSync(path.join(dir, 'namesake.db'), 'current');
    const garbage = path.join(dir, 'garbage.db');
    fs.writeFileSync(garbage, crypto.randomBytes(4096));
    const other = path.join(dir, 'other.db');
    const o = new Database(other);
    o.exec('create table notes (id integer primary key, body text)');
    o.close();
    const r1 = await runScript('scripts/db-restore.ts', [garbage], dir);
    expect(r1.code).toBe(1);
    expect(r1.err).toMatch(/not a SQLite database|integrity/);
    const r2 = await runScript('scripts/db-restore.ts', [other], dir);
    expect(r2.code).toBe(1);
    expect(r2.err).toMatch(/not a Namesake database \(missing tables: user/);
    const r3 = await runScript('scripts/db-restore.ts', [], dir);
    expect(r3.code).toBe(1);
    expect(r3.err).toMatch(/Name the backup file/);
    expect(fs.readFileSync(path.join(dir, 'namesake.db'), 'utf8')).toBe('current');
  }, 60_000);
});
