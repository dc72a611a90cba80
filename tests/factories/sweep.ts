// Helpers for the security sweeps (tests/server/security-*.test.ts): the live route table of the
// Express app, a fixture world with two shops and two shoppers, XSS payloads, and a fingerprint of
// the database so a refused call can be shown to have changed nothing.
import crypto from 'node:crypto';
import type Database from 'better-sqlite3';
import type { Express } from 'express';
import sharp from 'sharp';
import request from 'supertest';
import { makeShopWithListing, nameChoices } from '../server/checkout.fixtures.ts';
import { createListing, makeMotif } from '../server/listings.fixtures.ts';
import { makeTestApp, type TestApp } from './app.ts';

export type RouteEntry = { method: string; path: string };

type LayerLike = {
  route?: { path: unknown; methods: Record<string, boolean> };
  handle?: { stack?: LayerLike[] };
  rawPath?: unknown;
};

const join = (a: string, b: string) => (a + (b === '/' ? '' : b)).replace(/\/{2,}/g, '/') || '/';

/**
 * Every route of the live app: walks `app.router.stack` and every mounted router's stack, joining
 * mount paths (Express 5 / router 2 keeps a layer's path in `rawPath`). A layer whose path is not
 * a plain string (a RegExp) is reported with its source so a test can refuse to classify it.
 */
export function listRoutes(app: Express): RouteEntry[] {
  const out: RouteEntry[] = [];
  const walk = (stack: LayerLike[], prefix: string) => {
    for (const layer of stack) {
      const paths = Array.isArray(layer.rawPath) ? layer.rawPath : [layer.rawPath];
      for (const p of paths) {
        const seg = typeof p === 'string' ? p : `<regexp ${String(p)}>`;
        if (layer.route) {
          const methods = Object.keys(layer.route.methods).filter((m) => layer.route!.methods[m]);
          // `app.all()` registers every HTTP method (router 2): report it once as ALL
          if (methods.includes('_all') || methods.length > 20) out.push({ method: 'ALL', path: join(prefix, seg) });
          else for (const m of methods) out.push({ method: m.toUpperCase(), path: join(prefix, seg) });
        } else if (layer.handle && Array.isArray(layer.handle.stack)) {
          walk(layer.handle.stack, join(prefix, seg));
        }
      }
    }
  };
  walk((app as unknown as { router: { stack: LayerLike[] } }).router.stack, '');
  return out;
}

/** A digest of every table's rows (auth rate-limit bookkeeping and sessions excepted). */
export function dbFingerprint(sqlite: Database.Database, skip: string[] = ['session', 'rate_limit', 'rateLimit', 'rate_limit_hits', 'verification']): string {
  const tables = (sqlite.prepare("select name from sqlite_master where type = 'table' and name not like 'sqlite_%' order by name").all() as { name: string }[])
    .map((t) => t.name)
    .filter((n) => !skip.includes(n) && !n.startsWith('__drizzle'));
  const h = crypto.createHash('sha256');
  for (const t of tables) {
    h.update(`#${t}\n`);
    for (const row of sqlite.prepare(`select * from "${t}" `).iterate()) h.update(JSON.stringify(row));
  }
  return h.digest('hex');
}

/**
 * Script-injection payloads (OWASP XSS Filter Evasion Cheat Sheet, common cases): tags with event
 * handlers, a script block, javascript: URLs, attribute break-outs, and Markdown link/image forms.
 */
export const XSS_PAYLOADS = [
  '<img src=x onerror=alert(1)>',
  '<script>alert(1)</script>',
  '"><svg onload=alert(1)>',
  "'><iframe src=javascript:alert(1)>",
  '[click](javascript:alert(1))',
  '![x](javascript:alert(1))',
  '<a href="javascript:alert(1)">x</a>',
  '<details open ontoggle=alert(1)>',
] as const;

/** Tags our own HTML (rendered Markdown, mail layouts) may contain; anything else raw came from a user. */
const OUR_TAGS = new Set([
  'html',
  'head',
  'body',
  'meta',
  'title',
  'style',
  'p',
  'a',
  'strong',
  'em',
  'b',
  'i',
  'del',
  'br',
  'hr',
  'h1',
  'h2',
  'h3',
  'h4',
  'h5',
  'h6',
  'ul',
  'ol',
  'li',
  'table',
  'thead',
  'tbody',
  'tr',
  'td',
  'th',
  'span',
  'div',
  'code',
  'pre',
  'blockquote',
  'center',
  'font',
]);

/**
 * What in an HTML string a browser would run or load: a raw <script, a tag we never write (so it
 * came from a user: img, svg, iframe, details …), an on…= handler or a javascript: URL inside a
 * real tag. Escaped text (&lt;img …) is inert and passes. Returns what was found, or null.
 */
export function unsafeHtml(html: string): string | null {
  if (/<script/i.test(html)) return '<script';
  for (const m of html.matchAll(/<([a-z][\w-]*)\b([^>]*)>/gi)) {
    const [, tag, attrs] = m as unknown as [string, string, string];
    if (!OUR_TAGS.has(tag.toLowerCase())) return `raw <${tag}> tag`;
    if (/\son\w+\s*=/i.test(attrs)) return `event handler on <${tag}>`;
    if (/\b(href|src|action|formaction)\s*=\s*["']?\s*javascript:/i.test(attrs)) return `javascript: URL on <${tag}>`;
  }
  return null;
}

// ---------------------------------------------------------------------------------------------
// The fixture world: the seeded demo (Fern & Fable Goods with Dana's paid orders; Little Comet
// Print Co.; an admin), plus private things of Fern's made here (a draft listing, a motif on no
// live listing, a photo, a cut sheet, a work-sheet job), a cart line of Dana's, a change request on
// one of Dana's lines, a pending shop for the moderation routes and two more shoppers.
// ---------------------------------------------------------------------------------------------

export const DEMO_PASSWORD = 'namesake-demo';
export const ROLES = ['guest', 'shopper', 'seller', 'admin'] as const;
export type SweepRole = (typeof ROLES)[number];

/** Signs in through the real route and returns the `Cookie` header value (no agent: the cookie never changes under us). */
export async function sessionCookie(t: TestApp, email: string, password: string): Promise<string> {
  const res = await request(t.app).post('/api/auth/sign-in/email').send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in ${email}: ${res.status}`);
  const set = ([] as string[]).concat(res.headers['set-cookie'] ?? []);
  return set.map((c) => c.split(';')[0]).join('; ');
}

const one = <T>(sqlite: TestApp['sqlite'], q: string, ...args: unknown[]) => sqlite.prepare(q).get(...args) as T;
const all = <T>(sqlite: TestApp['sqlite'], q: string, ...args: unknown[]) => sqlite.prepare(q).all(...args) as T[];

export async function makeSweepWorld() {
  // STRIPE_API_BASE on a closed port: payment calls fail fast instead of reaching anything
  const t = await makeTestApp({ seed: true, env: { STRIPE_API_BASE: 'http://127.0.0.1:9', STRIPE_SECRET_KEY: 'sk_test_sweep' } });
  const { sqlite } = t;
  const uid = (email: string) => one<{ id: string }>(sqlite, 'select id from user where email = ?', email).id;
  const danaId = uid('dana@namesake.test');
  const fernId = uid('fern@namesake.test');
  const fernShop = one<{ id: string; slug: string }>(sqlite, 'select id, slug from shops where owner_id = ?', fernId);
  const cometShop = one<{ id: string; slug: string }>(sqlite, 'select id, slug from shops where owner_id = ?', uid('comet@namesake.test'));
  const sam = await t.makeUser('shopper', { name: 'Sam Other' });
  const target = await t.makeUser('shopper', { name: 'Target of admin calls' });

  const fern = await t.signIn('fern@namesake.test', DEMO_PASSWORD);
  const dana = await t.signIn('dana@namesake.test', DEMO_PASSWORD);
  const marker = crypto.randomBytes(3).toString('hex');
  const draftTitle = `Sweep draft ${marker}`;
  const motifName = `Sweep motif ${marker}`;
  const draft = await createListing(fern, { title: draftTitle });
  const motif = await makeMotif(fern, undefined, motifName);
  const photo = await fern.post('/api/uploads').attach(
    'file',
    await sharp({ create: { width: 40, height: 30, channels: 3, background: '#2f7d6d' } })
      .png()
      .toBuffer(),
    { filename: 'p.png', contentType: 'image/png' },
  );
  if (photo.status !== 201) throw new Error(`upload: ${photo.status}`);
  const material = one<{ id: string }>(sqlite, 'select id from materials where shop_id = ? order by created_at limit 1', fernShop.id);
  const blankType = one<{ id: string }>(sqlite, 'select id from blank_types where shop_id = ? limit 1', fernShop.id);
  const discountCode = one<{ id: string }>(sqlite, 'select id from discount_codes where shop_id = ? limit 1', fernShop.id);
  const orderByDate = one<{ id: string }>(sqlite, 'select id from order_by_dates where shop_id = ? limit 1', fernShop.id);
  const liveListing = one<{ id: string; slug: string }>(sqlite, "select id, slug from listings where shop_id = ? and state = 'live' limit 1", fernShop.id);

  const danaOrders = all<{ id: string; number: string }>(sqlite, 'select id, number from orders where buyer_id = ? and shop_id = ? order by created_at', danaId, fernShop.id);
  const lineIn = (state: string) =>
    one<{ id: string; order_id: string } | undefined>(
      sqlite,
      'select l.id, l.order_id from order_lines l join orders o on o.id = l.order_id where o.shop_id = ? and o.buyer_id = ? and l.state = ? limit 1',
      fernShop.id,
      danaId,
      state,
    );
  const approved = lineIn('approved');
  const waiting = lineIn('awaiting_proof');
  if (!approved || !waiting || !danaOrders.length) throw new Error('the seed has no approved/awaiting lines of Dana in Fern’s shop');
  const sheets = await fern.post('/api/workroom/cut-sheets').send({ lineIds: [approved.id] });
  if (sheets.status !== 201) throw new Error(`cut sheets: ${sheets.status} ${JSON.stringify(sheets.body)}`);
  const job = await fern.post(`/api/workroom/batches/${sheets.body.batchId}/worksheet`).send({ paper: 'A4' });
  if (job.status !== 202) throw new Error(`worksheet: ${job.status}`);
  const change = await fern.post(`/api/workroom/lines/${waiting.id}/request-change`).send({ message: 'Please check the spelling.' });
  if (change.status !== 200) throw new Error(`request-change: ${change.status}`);

  const cartShop = await makeShopWithListing(t);
  const cart = await dana.post('/api/cart/lines').send({ listingId: cartShop.listingId, choices: nameChoices('Juniper') });
  if (cart.status !== 201) throw new Error(`cart: ${cart.status}`);
  const cartLineId = String(cart.body.shops[0].lines[0].id);
  const checkout = one<{ provider_session_id: string }>(sqlite, 'select provider_session_id from checkouts where user_id = ? and provider_session_id is not null limit 1', danaId);

  // the moderation routes act on a shop and listing of their own, so an admin's (allowed) moves
  // don't change the world the other routes look at
  const pending = await t.makeSeller({ state: 'pending' });
  const pendingAgent = await t.signIn(pending.email);
  const pendingListing = await createListing(pendingAgent, { title: `Pending ${marker}` });
  await pendingAgent.post(`/api/seller/listings/${pendingListing.id}/submit`).send({});

  const cookies: Record<SweepRole | 'dana' | 'fern', string> = {
    guest: '',
    shopper: await sessionCookie(t, sam.email, sam.password),
    seller: await sessionCookie(t, 'comet@namesake.test', DEMO_PASSWORD),
    admin: await sessionCookie(t, 'admin@namesake.test', DEMO_PASSWORD),
    dana: await sessionCookie(t, 'dana@namesake.test', DEMO_PASSWORD),
    fern: await sessionCookie(t, 'fern@namesake.test', DEMO_PASSWORD),
  };
  const mail = (await t.mailTo('dana@namesake.test'))[0];

  // a message with a photo on one of Dana's orders, and a seeded review of Fern's shop not yet replied to
  const messageText = `Sweep message ${marker}`;
  const message = await dana
    .post(`/api/orders/${approved.order_id}/messages`)
    .field('body', messageText)
    .attach(
      'file',
      await sharp({ create: { width: 30, height: 20, channels: 3, background: '#7a4fa0' } })
        .png()
        .toBuffer(),
      { filename: 'q.png', contentType: 'image/png' },
    );
  if (message.status !== 201) throw new Error(`message: ${message.status} ${JSON.stringify(message.body)}`);
  const review = one<{ id: string } | undefined>(sqlite, 'select id from reviews where shop_id = ? and reply is null limit 1', fernShop.id);
  if (!review) throw new Error('the seed has no review of Fern’s shop without a reply');

  const ids = {
    danaId,
    fernId,
    samId: sam.id,
    targetId: target.id,
    fernShop: fernShop.id,
    fernSlug: fernShop.slug,
    cometShop: cometShop.id,
    draftListing: draft.id,
    liveListing: liveListing.id,
    liveSlug: liveListing.slug,
    motif: motif.id,
    upload: String(photo.body.upload.id),
    material: material.id,
    blankType: blankType.id,
    discountCode: discountCode.id,
    orderByDate: orderByDate.id,
    orderA: approved.order_id,
    orderB: danaOrders[danaOrders.length - 1]!.id,
    approvedLine: approved.id,
    changeLine: waiting.id,
    sheet: String(sheets.body.sheets[0].id),
    batch: String(sheets.body.batchId),
    job: String(job.body.job.id),
    cartLine: cartLineId,
    checkoutSession: checkout.provider_session_id,
    pendingShop: pending.shopId,
    pendingListing: pendingListing.id,
    mailId: mail ? String((mail as { id: string }).id) : 'none',
    message: String(message.body.message.id),
    review: review.id,
  };
  /** strings only the owner (or an admin) may see */
  const secrets = [
    'dana@namesake.test',
    'fern@namesake.test',
    draftTitle,
    motifName,
    ids.upload,
    ids.sheet,
    ids.batch,
    ids.job,
    ids.cartLine,
    ids.checkoutSession,
    ...danaOrders.flatMap((o) => [o.id, o.number]),
    ids.approvedLine,
    ids.changeLine,
    messageText,
    ids.message,
  ];

  /** rows that belong to Fern, Dana, the pending shop and the admin-call target (what a refused call must not touch) */
  const victimFingerprint = () => {
    const h = crypto.createHash('sha256');
    const q = (s: string, ...a: unknown[]) => h.update(JSON.stringify(sqlite.prepare(s).all(...a)));
    const users = [danaId, fernId, target.id, pending.id];
    const shopIds = [fernShop.id, pending.shopId];
    const inList = (n: number) => Array(n).fill('?').join(',');
    q(`select * from user where id in (${inList(users.length)}) order by id`, ...users);
    q(`select * from account where user_id in (${inList(users.length)}) order by id`, ...users);
    q(`select id, user_id, expires_at from session where user_id in (${inList(users.length)}) order by id`, ...users);
    for (const tb of ['shops']) q(`select * from ${tb} where id in (${inList(shopIds.length)}) order by id`, ...shopIds);
    for (const tb of ['materials', 'motifs', 'uploads', 'listings', 'cut_sheets', 'ledger', 'blank_types', 'discount_codes', 'order_by_dates'])
      q(`select * from ${tb} where shop_id in (${inList(shopIds.length)}) order by id`, ...shopIds);
    q('select s.* from blank_stock s join blank_types b on b.id = s.blank_type_id where b.shop_id = ? order by s.blank_type_id, s.size_id, s.colour_id', fernShop.id);
    q('select * from orders where buyer_id = ? or shop_id = ? order by id', danaId, fernShop.id);
    q('select l.* from order_lines l join orders o on o.id = l.order_id where o.buyer_id = ? or o.shop_id = ? order by l.id', danaId, fernShop.id);
    q('select v.* from line_versions v join order_lines l on l.id = v.line_id join orders o on o.id = l.order_id where o.buyer_id = ? order by v.id', danaId);
    q('select * from refunds order by id');
    q('select * from carts where user_id = ? order by id', danaId);
    q('select c.* from cart_lines c join carts k on k.id = c.cart_id where k.user_id = ? order by c.id', danaId);
    q('select * from checkouts where user_id = ? order by id', danaId);
    q('select m.* from order_messages m join orders o on o.id = m.order_id where o.buyer_id = ? or o.shop_id = ? order by m.id', danaId, fernShop.id);
    q('select * from reviews where shop_id = ? or author_id = ? order by id', fernShop.id, danaId);
    q('select * from cart_shop_choices where shop_id = ? order by cart_id', fernShop.id);
    return h.digest('hex');
  };

  return { t, ids, secrets, cookies, victimFingerprint, fern, dana };
}
export type SweepWorld = Awaited<ReturnType<typeof makeSweepWorld>>;
