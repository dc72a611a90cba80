// Access sweep (OWASP ASVS 5.0.0 8.2.1 function-level and 8.2.2 data-level authorisation, 8.3.1
// enforced on the server): every route of the live app is called as a guest, another shopper,
// another shop's seller and an admin, with ids that belong to Fern's shop or to Dana. Only the owner
// (or an admin, where the product says so) gets data; every refused call leaves the victims' rows
// unchanged. A route the table below cannot classify fails the test.

import request from 'supertest';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { listRoutes, makeSweepWorld, ROLES, type SweepRole, type SweepWorld } from '../factories/sweep.ts';

let w: SweepWorld;
beforeAll(async () => {
  w = await makeSweepWorld();
}, 120_000);
afterAll(async () => w?.t.close());

type Ids = SweepWorld['ids'];
type Kind =
  /** anyone may call it; the answer holds nothing private */
  | 'public'
  /** the caller's own things (a list, their cart, their shop); nothing of anyone else's in the answer */
  | 'mine'
  /** a thing of the victim's by id: everyone but the owner is refused (401/403/404), nothing changes */
  | 'owner'
  /** admins only: guest 401, others 403 */
  | 'admin'
  /** server-to-server and signed: an unsigned call is refused whoever sends it */
  | 'signed';
type Spec = {
  kind: Kind;
  url?: (i: Ids) => string;
  body?: (i: Ids) => unknown;
  /** for 'owner' GETs: who the id belongs to, called afterwards to prove the id is real */
  owner?: 'dana' | 'fern';
  /** an admin may also act on it (refunds, moderation) */
  admin?: boolean;
  /** a guest may call it too (the cart is kept by a cookie for guests) */
  guestOk?: boolean;
  /** secrets this route may show by design */
  shows?: string[];
};

const S = (kind: Kind, more: Omit<Spec, 'kind'> = {}): Spec => ({ kind, ...more });

/** Every route, keyed `METHOD path` as the router walk reports it. */
const SPECS: Record<string, Spec> = {
  // auth (better-auth behind our input guard; the catch-all is swept endpoint by endpoint below)
  'POST /api/auth/sign-up/email': S('public', { body: () => ({ email: `sweep-${Math.random().toString(36).slice(2)}@namesake.test`, password: 'a-long-sweep-password', name: 'Sweep' }) }),
  'POST /api/auth/sign-in/email': S('public', { body: () => ({ email: 'dana@namesake.test', password: 'wrong-password-here' }) }),
  'POST /api/auth/request-password-reset': S('public', { body: () => ({ email: 'nobody-here@namesake.test' }) }),
  'POST /api/auth/reset-password': S('public', { body: () => ({ token: 'not-a-token', newPassword: 'another-long-password' }) }),
  'POST /api/auth/change-password': S('mine', { body: () => ({ currentPassword: 'wrong-password-here', newPassword: 'a-long-sweep-password' }) }),
  'POST /api/auth/update-user': S('mine', { body: () => ({ role: 'admin' }) }),
  'POST /api/auth/admin/set-user-password': S('admin', { body: (i) => ({ userId: i.targetId, newPassword: 'sweep-new-password' }) }),
  'POST /api/auth/admin/create-user': S('admin', { body: () => ({ email: `sweep-${Math.random().toString(36).slice(2)}@namesake.test`, name: 'Sweep', password: 'a-long-sweep-password' }) }),
  'ALL /api/auth/{*any}': S('public'), // expanded in AUTH_ENDPOINTS
  'POST /api/payments/webhook': S('signed', { body: () => ({ id: 'evt_sweep', type: 'checkout.session.completed', data: { object: {} } }) }),
  'GET /api/listings': S('public'),
  'GET /api/health': S('public'),
  // in demo mode the sign-in page lists the demo accounts on purpose
  'GET /api/config': S('public', { shows: ['dana@namesake.test', 'fern@namesake.test'] }),
  // a guest gets 200 with no user (public pages ask it on every visit)
  'GET /api/me': S('mine', { guestOk: true }),
  'POST /api/shops': S('mine', { body: () => ({ name: 'Sweep shop' }) }),
  'GET /api/admin/mail': S('admin'),
  'GET /api/admin/mail/:id': S('admin', { url: (i) => `/api/admin/mail/${i.mailId}` }),
  'GET /api/shop': S('mine'),
  'PATCH /api/shop': S('mine', { body: () => ({ description: 'Changed by the sweep' }) }),
  'POST /api/shop/logo': S('mine'),
  'GET /api/materials/press-defaults': S('mine'),
  'GET /api/materials': S('mine'),
  'GET /api/seller/blanks': S('mine'),
  'POST /api/seller/blanks': S('mine', {
    body: () => ({ name: 'Sweep bag', shape: 'tote', sizes: [{ label: 'One', widthMm: 200, heightMm: 200, topOffsetMm: 50, priceDiffMinor: 0 }], colours: [{ name: 'Sweep', hex: '#112233' }] }),
  }),
  'PUT /api/seller/blanks/:id': S('owner', {
    url: (i) => `/api/seller/blanks/${i.blankType}`,
    body: () => ({ name: 'Taken', shape: 'tote', sizes: [{ label: 'One', widthMm: 200, heightMm: 200, topOffsetMm: 50, priceDiffMinor: 0 }], colours: [{ name: 'Sweep', hex: '#112233' }] }),
  }),
  'PUT /api/seller/blanks/:id/stock': S('owner', { url: (i) => `/api/seller/blanks/${i.blankType}/stock`, body: () => ({ rows: [] }) }),
  'POST /api/materials': S('mine', { body: () => ({ kind: 'smooth', colourName: 'Sweep', colourHex: '#112233', rollWidthMm: 305, stockMm: 1000 }) }),
  'GET /api/materials/:id': S('owner', { url: (i) => `/api/materials/${i.material}`, owner: 'fern' }),
  'PATCH /api/materials/:id': S('owner', { url: (i) => `/api/materials/${i.material}`, body: () => ({ stockMm: 1 }) }),
  'DELETE /api/materials/:id': S('owner', { url: (i) => `/api/materials/${i.material}` }),
  'GET /api/seller/listings': S('mine'),
  'POST /api/seller/listings': S('mine', { body: () => ({}) }),
  'GET /api/seller/listings/:id': S('owner', { url: (i) => `/api/seller/listings/${i.draftListing}`, owner: 'fern' }),
  'PUT /api/seller/listings/:id': S('owner', { url: (i) => `/api/seller/listings/${i.draftListing}`, body: () => ({ title: 'Taken over' }) }),
  'POST /api/seller/listings/:id/submit': S('owner', { url: (i) => `/api/seller/listings/${i.draftListing}/submit` }),
  'POST /api/seller/listings/:id/pause': S('owner', { url: (i) => `/api/seller/listings/${i.liveListing}/pause` }),
  'POST /api/seller/listings/:id/unpause': S('owner', { url: (i) => `/api/seller/listings/${i.liveListing}/unpause` }),
  'DELETE /api/seller/listings/:id': S('owner', { url: (i) => `/api/seller/listings/${i.draftListing}` }),
  'POST /api/uploads': S('mine'),
  'GET /api/uploads': S('mine'),
  'DELETE /api/uploads/:id': S('owner', { url: (i) => `/api/uploads/${i.upload}` }),
  'GET /api/motifs/:id/svg': S('owner', { url: (i) => `/api/motifs/${i.motif}/svg`, owner: 'fern', admin: true }) /* admins review motifs */,
  'POST /api/motifs': S('mine'),
  'GET /api/motifs': S('mine'),
  'GET /api/motifs/:id': S('owner', { url: (i) => `/api/motifs/${i.motif}`, owner: 'fern' }),
  'DELETE /api/motifs/:id': S('owner', { url: (i) => `/api/motifs/${i.motif}` }),
  'GET /api/moderation/queue/listings': S('admin'),
  'GET /api/moderation/queue/listings/:id': S('admin', { url: (i) => `/api/moderation/queue/listings/${i.pendingListing}` }),
  'GET /api/moderation/queue/shops': S('admin'),
  'GET /api/moderation/queue/shop-changes': S('admin'),
  'GET /api/moderation/listings/:id': S('admin', { url: (i) => `/api/moderation/listings/${i.pendingListing}` }),
  'POST /api/moderation/shops/:id/approve-change': S('admin', { url: (i) => `/api/moderation/shops/${i.fernShop}/approve-change`, body: () => ({ revision: 1 }) }),
  'POST /api/moderation/shops/:id/reject-change': S('admin', { url: (i) => `/api/moderation/shops/${i.fernShop}/reject-change`, body: () => ({ revision: 1, reason: 'Sweep reason' }) }),
  'POST /api/moderation/listings/:id/approve': S('admin', { url: (i) => `/api/moderation/listings/${i.pendingListing}/approve` }),
  'POST /api/moderation/listings/:id/reject': S('admin', { url: (i) => `/api/moderation/listings/${i.pendingListing}/reject`, body: () => ({ reason: 'Sweep reason' }) }),
  'POST /api/moderation/shops/:id/approve': S('admin', { url: (i) => `/api/moderation/shops/${i.pendingShop}/approve`, body: () => ({}) }),
  'POST /api/moderation/shops/:id/restore': S('admin', { url: (i) => `/api/moderation/shops/${i.pendingShop}/restore`, body: () => ({}) }),
  'POST /api/moderation/shops/:id/reject': S('admin', { url: (i) => `/api/moderation/shops/${i.pendingShop}/reject`, body: () => ({ reason: 'Sweep reason' }) }),
  'POST /api/moderation/shops/:id/suspend': S('admin', { url: (i) => `/api/moderation/shops/${i.pendingShop}/suspend`, body: () => ({ reason: 'Sweep reason' }) }),
  'GET /api/moderation/shops': S('admin'),
  'GET /api/moderation/audit': S('admin'),
  'GET /api/cart': S('mine', { guestOk: true }),
  'POST /api/cart/lines': S('mine', { guestOk: true, body: (i) => ({ listingId: i.draftListing, choices: { texts: {} } }) }),
  'PATCH /api/cart/lines/:lineId': S('owner', { url: (i) => `/api/cart/lines/${i.cartLine}`, body: () => ({ quantity: 5 }) }),
  'DELETE /api/cart/lines/:lineId': S('owner', { url: (i) => `/api/cart/lines/${i.cartLine}` }),
  // a code and a needed-by date on a shop's part of the caller's own cart
  'POST /api/cart/shops/:shopId/code': S('mine', { guestOk: true, url: (i) => `/api/cart/shops/${i.fernShop}/code`, body: () => ({ code: 'NOT-A-CODE' }) }),
  'DELETE /api/cart/shops/:shopId/code': S('mine', { guestOk: true, url: (i) => `/api/cart/shops/${i.fernShop}/code` }),
  'PUT /api/cart/shops/:shopId/needed-by': S('mine', { guestOk: true, url: (i) => `/api/cart/shops/${i.fernShop}/needed-by`, body: () => ({ neededBy: '2026-12-20' }) }),
  'GET /api/offers/listings/:slug/delivery': S('public', { url: (i) => `/api/offers/listings/${i.liveSlug}/delivery` }),
  'GET /api/seller/offers/discounts': S('mine'),
  'POST /api/seller/offers/discounts': S('mine', { body: () => ({ code: `SWEEP-${Math.random().toString(36).slice(2, 8).toUpperCase()}`, kind: 'percent', percentOff: 10 }) }),
  'PUT /api/seller/offers/discounts/:id': S('owner', { url: (i) => `/api/seller/offers/discounts/${i.discountCode}`, body: () => ({ code: 'SWEPT', kind: 'percent', percentOff: 50 }) }),
  'DELETE /api/seller/offers/discounts/:id': S('owner', { url: (i) => `/api/seller/offers/discounts/${i.discountCode}` }),
  'GET /api/seller/offers/delivery': S('mine'),
  'PUT /api/seller/offers/shipping-days': S('mine', { body: () => ({ shippingDays: 4 }) }),
  'POST /api/seller/offers/order-by-dates': S('mine', { body: () => ({ occasion: 'Sweep day', orderBy: '2026-12-24' }) }),
  'DELETE /api/seller/offers/order-by-dates/:id': S('owner', { url: (i) => `/api/seller/offers/order-by-dates/${i.orderByDate}` }),
  'GET /api/workroom/lines/:id/template': S('owner', { url: (i) => `/api/workroom/lines/${i.approvedLine}/template`, owner: 'fern' }),
  'POST /api/workroom/batches/:id/discard': S('owner', { url: (i) => `/api/workroom/batches/${i.batch}/discard` }),
  'POST /api/checkout': S('mine'),
  'GET /api/checkout/latest': S('mine'),
  'GET /api/checkout/:sessionId/status': S('owner', { url: (i) => `/api/checkout/${i.checkoutSession}/status`, owner: 'dana' }),
  'GET /api/orders': S('mine'),
  'GET /api/orders/:id': S('owner', { url: (i) => `/api/orders/${i.orderA}`, owner: 'dana' }),
  'POST /api/orders/:id/refunds': S('owner', { url: (i) => `/api/orders/${i.orderB}/refunds`, body: () => ({ reason: 'Sweep' }), admin: true }),
  'GET /api/workroom/summary': S('mine'),
  'GET /api/workroom/lines': S('mine'),
  'GET /api/workroom/orders/:id': S('owner', { url: (i) => `/api/workroom/orders/${i.orderA}`, owner: 'fern' }),
  'POST /api/workroom/orders/:id/ship': S('owner', { url: (i) => `/api/workroom/orders/${i.orderA}/ship`, body: () => ({ carrier: 'UPS', trackingNumber: '1Z999AA1' }) }),
  'GET /api/workroom/lines/:id/proof': S('owner', { url: (i) => `/api/workroom/lines/${i.changeLine}/proof`, owner: 'fern' }),
  'POST /api/workroom/lines/:id/approve': S('owner', { url: (i) => `/api/workroom/lines/${i.changeLine}/approve` }),
  'POST /api/workroom/proofs/approve': S('owner', { body: (i) => ({ lineIds: [i.changeLine] }) }),
  'POST /api/workroom/lines/:id/request-change': S('owner', { url: (i) => `/api/workroom/lines/${i.approvedLine}/request-change`, body: () => ({ message: 'Hijacked request' }) }),
  'GET /api/workroom/lines/:id/press-card': S('owner', { url: (i) => `/api/workroom/lines/${i.approvedLine}/press-card`, owner: 'fern' }),
  'GET /api/workroom/press-cards': S('mine'),
  'POST /api/workroom/lines/:id/pressed': S('owner', { url: (i) => `/api/workroom/lines/${i.approvedLine}/pressed` }),
  'POST /api/workroom/pressed': S('owner', { body: (i) => ({ lineIds: [i.approvedLine] }) }),
  'POST /api/workroom/cut-sheets': S('owner', { body: (i) => ({ lineIds: [i.approvedLine] }) }),
  'GET /api/workroom/batches': S('mine'),
  'GET /api/workroom/batches/:id': S('owner', { url: (i) => `/api/workroom/batches/${i.batch}`, owner: 'fern' }),
  'POST /api/workroom/batches/:id/cut': S('owner', { url: (i) => `/api/workroom/batches/${i.batch}/cut` }),
  'GET /api/workroom/cut-sheets/:id/svg': S('owner', { url: (i) => `/api/workroom/cut-sheets/${i.sheet}/svg`, owner: 'fern' }),
  'POST /api/workroom/cut-sheets/:id/cut': S('owner', { url: (i) => `/api/workroom/cut-sheets/${i.sheet}/cut` }),
  'POST /api/workroom/batches/:id/worksheet': S('owner', { url: (i) => `/api/workroom/batches/${i.batch}/worksheet`, body: () => ({ paper: 'A4' }) }),
  'GET /api/workroom/worksheets/:id': S('owner', { url: (i) => `/api/workroom/worksheets/${i.job}`, owner: 'fern' }),
  'GET /api/workroom/worksheets/:id/file': S('owner', { url: (i) => `/api/workroom/worksheets/${i.job}/file` }),
  'GET /api/workroom/stock': S('mine'),
  'PATCH /api/workroom/stock/:id': S('owner', { url: (i) => `/api/workroom/stock/${i.material}`, body: () => ({ lowStockMm: 1 }) }),
  'GET /api/order-lines/:id/personalisation': S('owner', { url: (i) => `/api/order-lines/${i.changeLine}/personalisation`, owner: 'dana' }),
  'PUT /api/order-lines/:id/personalisation': S('owner', {
    url: (i) => `/api/order-lines/${i.changeLine}/personalisation`,
    body: () => ({ choices: { texts: { name: { text: 'Hijack', fontId: 'baloo-bold', letterHeightMm: 40 } } } }),
  }),
  'GET /api/business/settings': S('mine'),
  'PATCH /api/business/settings': S('mine', { body: () => ({}) }),
  'GET /api/business/due': S('mine'),
  'GET /api/business/costs': S('mine'),
  'GET /api/business/orders/:orderId/costs': S('owner', { url: (i) => `/api/business/orders/${i.orderA}/costs`, owner: 'fern' }),
  'POST /api/business/price-check': S('mine', { body: () => ({}) }),
  'GET /api/business/ledger': S('mine'),
  'GET /api/business/ledger.csv': S('mine'),
  'GET /api/business/charts': S('mine'),
  'GET /api/fonts': S('public'),
  'GET /api/fonts/:id/file': S('public', { url: () => '/api/fonts/baloo-bold/file' }),
  'POST /api/layout/text': S('public', { body: () => ({ text: 'Ada', fontId: 'baloo-bold', letterHeightMm: 40 }) }),
  'GET /api/listings/:slug': S('public', { url: (i) => `/api/listings/${i.liveSlug}` }),
  'GET /api/shops/:slug': S('public', { url: (i) => `/api/shops/${i.fernSlug}` }),
  // an order's thread: its shopper, its shop and admins (who read it and may write)
  'GET /api/orders/:id/messages': S('owner', { url: (i) => `/api/orders/${i.orderA}/messages`, owner: 'dana', admin: true }),
  'POST /api/orders/:id/messages': S('owner', { url: (i) => `/api/orders/${i.orderA}/messages`, body: () => ({ body: 'Sweep says hello' }), admin: true }),
  'POST /api/orders/:id/messages/read': S('owner', { url: (i) => `/api/orders/${i.orderA}/messages/read`, admin: true }),
  'GET /api/orders/:id/messages/:messageId/photo': S('owner', { url: (i) => `/api/orders/${i.orderA}/messages/${i.message}/photo`, owner: 'dana', admin: true }),
  'GET /api/messages/unread': S('mine'),
  // reviews: an order's lines (its shopper, shop, admins); writing only by the shopper; the reply by the shop; hiding by admins
  'GET /api/orders/:id/reviews': S('owner', { url: (i) => `/api/orders/${i.orderA}/reviews`, owner: 'dana', admin: true }),
  'POST /api/orders/:id/lines/:lineId/review': S('owner', { url: (i) => `/api/orders/${i.orderA}/lines/${i.approvedLine}/review`, body: () => ({ rating: 1, body: 'Sweep review' }) }),
  'GET /api/reviews/listings/:slug': S('public', { url: (i) => `/api/reviews/listings/${i.liveSlug}` }),
  'GET /api/reviews/shops/:slug': S('public', { url: (i) => `/api/reviews/shops/${i.fernSlug}` }),
  'POST /api/reviews/:id/reply': S('owner', { url: (i) => `/api/reviews/${i.review}/reply`, body: () => ({ reply: 'Sweep reply' }) }),
  'POST /api/reviews/:id/hide': S('admin', { url: (i) => `/api/reviews/${i.review}/hide`, body: () => ({ reason: 'Sweep reason' }) }),
};

/**
 * The endpoints better-auth serves behind `ALL /api/auth/{*any}` that touch accounts: the
 * session ones answer only about the caller; the admin plugin's are admin-only (an admin's calls
 * aim at a throwaway account); update-user must never let anyone raise their own role.
 */
const AUTH_ENDPOINTS: Array<{ method: 'GET' | 'POST'; path: string; kind: Kind; body?: (i: Ids) => unknown; adminSafe?: boolean; guestOk?: boolean }> = [
  { method: 'GET', path: '/api/auth/get-session', kind: 'mine', guestOk: true },
  { method: 'GET', path: '/api/auth/list-sessions', kind: 'mine' },
  { method: 'POST', path: '/api/auth/update-user', kind: 'mine', body: () => ({ role: 'admin', banned: false }) },
  { method: 'GET', path: '/api/auth/admin/list-users', kind: 'admin' },
  { method: 'POST', path: '/api/auth/admin/set-role', kind: 'admin', body: (i) => ({ userId: i.targetId, role: 'shopper' }) },
  { method: 'POST', path: '/api/auth/admin/ban-user', kind: 'admin', body: (i) => ({ userId: i.targetId, banReason: 'sweep' }) },
  { method: 'POST', path: '/api/auth/admin/list-user-sessions', kind: 'admin', body: (i) => ({ userId: i.danaId }) },
  { method: 'POST', path: '/api/auth/admin/set-user-password', kind: 'admin', body: (i) => ({ userId: i.targetId, newPassword: 'sweep-new-password' }) },
  { method: 'POST', path: '/api/auth/admin/remove-user', kind: 'admin', body: (i) => ({ userId: i.targetId }), adminSafe: false },
  { method: 'POST', path: '/api/auth/admin/impersonate-user', kind: 'admin', body: (i) => ({ userId: i.danaId }), adminSafe: false },
];

const REFUSED = [401, 403, 404];

async function call(method: string, url: string, role: SweepRole | 'dana' | 'fern', body?: unknown) {
  let r = request(w.t.app)[method.toLowerCase() as 'get'](url).set('Origin', 'http://localhost:3000');
  if (w.cookies[role]) r = r.set('Cookie', w.cookies[role]);
  if (body !== undefined) r = r.send(body as object);
  const res = await r;
  const text = res.text ?? (Buffer.isBuffer(res.body) ? res.body.toString('latin1') : JSON.stringify(res.body ?? ''));
  return { status: res.status, text };
}

const leaks = (text: string) => w.secrets.filter((s) => text.includes(s));

describe('access sweep (OWASP ASVS 8.2.1, 8.2.2, 8.3.1)', () => {
  test('when every /api route is called as guest, another shopper, another seller and an admin with the victims’ ids, then only owner-scoped answers come back', async () => {
    const routes = listRoutes(w.t.app).filter((r) => r.path.startsWith('/api'));
    const unclassified = routes.map((r) => `${r.method} ${r.path}`).filter((k) => !SPECS[k]);
    // a new route must be added to SPECS (and so to this sweep) before it can ship
    expect(unclassified, 'routes the access sweep cannot classify').toEqual([]);
    const stale = Object.keys(SPECS).filter((k) => !routes.some((r) => `${r.method} ${r.path}` === k));
    expect(stale, 'SPECS entries for routes that no longer exist').toEqual([]);

    const problems: string[] = [];
    let calls = 0;
    let endpoints = 0;
    const sweepOne = async (key: string, method: string, url: string, spec: Spec, body: unknown, adminSafe = true) => {
      endpoints++;
      for (const role of ROLES) {
        if (role === 'admin' && !adminSafe) continue;
        const before = w.victimFingerprint();
        const res = await call(method, url, role, body);
        calls++;
        const changed = w.victimFingerprint() !== before;
        const leaked = leaks(res.text).filter((s) => !spec.shows?.includes(s));
        const tag = `${key} as ${role} → ${res.status}`;
        const adminAllowed = role === 'admin' && (spec.kind === 'admin' || spec.admin);
        // (the sweep's payment API is a closed port: an admin's allowed refund fails upstream, 502)
        if (res.status >= 500 && !(adminAllowed && res.status === 502)) problems.push(`${tag}: server error ${res.text.slice(0, 120)}`);
        if (adminAllowed) {
          if ([401, 403].includes(res.status)) problems.push(`${tag}: an admin is refused`);
          continue;
        }
        if (leaked.length) problems.push(`${tag}: leaks ${leaked.join(', ')}`);
        switch (spec.kind) {
          case 'public':
          case 'mine':
            if (spec.kind === 'mine' && role === 'guest' && !spec.guestOk && res.status !== 401) problems.push(`${tag}: a guest is not refused`);
            if (changed) problems.push(`${tag}: changed the victims’ rows`);
            break;
          case 'owner':
          case 'admin':
            if (!REFUSED.includes(res.status)) problems.push(`${tag}: not refused`);
            if (spec.kind === 'admin' && res.status !== (role === 'guest' ? 401 : 403)) problems.push(`${tag}: expected ${role === 'guest' ? 401 : 403}`);
            if (changed) problems.push(`${tag}: changed the victims’ rows`);
            break;
          case 'signed':
            if (res.status !== 400) problems.push(`${tag}: an unsigned call is not refused`);
            if (changed) problems.push(`${tag}: changed the victims’ rows`);
            break;
        }
      }
      // the id was real: its owner does get it (so a 404 above was a refusal, not a typo)
      if (spec.kind === 'owner' && spec.owner && method === 'GET') {
        const res = await call(method, url, spec.owner);
        if (res.status !== 200) problems.push(`${key} as its owner ${spec.owner} → ${res.status}: the id is not the owner's`);
      }
    };

    // opening a shop turns the caller into a seller: swept last so the roles hold for every other route
    const last = new Set(['POST /api/shops']);
    const ordered = [...routes.filter((r) => !last.has(`${r.method} ${r.path}`)), ...routes.filter((r) => last.has(`${r.method} ${r.path}`))];
    for (const e of AUTH_ENDPOINTS) await sweepOne(`${e.method} ${e.path}`, e.method, e.path, { kind: e.kind, guestOk: e.guestOk }, e.body?.(w.ids), e.adminSafe ?? true);
    for (const r of ordered) {
      const key = `${r.method} ${r.path}`;
      const spec = SPECS[key]!;
      if (r.method === 'ALL') continue; // swept below, endpoint by endpoint
      const url = spec.url ? spec.url(w.ids) : r.path;
      await sweepOne(key, r.method, url, spec, spec.body?.(w.ids));
    }

    expect(problems).toEqual([]);
    // nobody raised their own role through update-user
    const roles = w.t.sqlite.prepare('select email, role from user where id in (?, ?)').all(w.ids.samId, w.ids.danaId) as { role: string }[];
    expect(roles.map((x) => x.role)).not.toContain('admin');
    const routeCount = routes.filter((r) => r.method !== 'ALL').length;
    const skipped = endpoints * ROLES.length - calls;
    console.log(
      `access sweep: ${routeCount} routes + ${AUTH_ENDPOINTS.length} auth endpoints = ${endpoints} endpoints × 4 roles = ${calls} calls${skipped ? ` (${skipped} admin calls that would remove or impersonate an account left out)` : ''}, all refused or owner-only`,
    );
  }, 120_000);
});
