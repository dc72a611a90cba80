// The workroom's lines: the views of a line and its order that every part of the workroom shows,
// the home page's counts and list, and one order with its timeline. Every call takes the seller's
// shop id; a line or order of another shop is "not found".

import { blankChoiceLabel } from '../../../shared/schemas/blanks.ts';
import type { LineSnapshot } from '../../../shared/schemas/cart.ts';
import { parseShipTo } from '../../../shared/schemas/checkout.ts';
import type { LineState } from '../../../shared/schemas/order.ts';
import { pageOffset, toPage } from '../../../shared/schemas/pagination.ts';
import { type LinesQuery, type MaterialRef, type TimelineEvent, WORK_STATES, type WorkLine, type WorkLinesPage, type WorkOrder, type WorkroomSummary } from '../../../shared/schemas/workroom.ts';
import type { Db } from '../../db/client.ts';
import type { AppDeps } from '../../deps.ts';
import { notFound } from '../../http/app-error.ts';
import { type LineRow, type MaterialRow, type OrderRow, workroomRepo as repo } from './workroom.repo.ts';

export type WorkroomDeps = Pick<AppDeps, 'db' | 'now' | 'env' | 'mailer'>;
/** What the work that runs in the worker pool (nesting cut sheets) needs besides. */
export type WorkroomPoolDeps = WorkroomDeps & Pick<AppDeps, 'pool'>;

/** A line of the shop with its order. */
export type LineWithOrder = { line: LineRow; order: OrderRow };

export const lineSnapshot = (l: LineRow) => l.snapshot;

/** The material ids a line uses, bottom → top (the snapshot's pieces are in press order). */
export function lineMaterialIds(s: LineSnapshot): string[] {
  const out: string[] = [];
  for (const p of s.geometry.pieces) if (p.materialId && !out.includes(p.materialId)) out.push(p.materialId);
  return out;
}

/** The listing's title with the blank's size and colour, "Rocket name tee (4T · Heather grey)": cut list, packing slip, e-mails. */
export function lineTitle(l: Pick<LineRow, 'listingTitle' | 'snapshot'>): string {
  const b = blankChoiceLabel(l.snapshot.blank);
  return b ? `${l.listingTitle} (${b})` : l.listingTitle;
}

export const lineText = (s: LineSnapshot) =>
  Object.values(s.choices.texts)
    .map((t) => t.text)
    .filter((t) => t.trim() !== '')
    .join(' / ');

function materialRef(m: MaterialRow | undefined, id: string, s: LineSnapshot): MaterialRef {
  if (m) return { id: m.id, kind: m.kind, colour: m.colourName, colourHex: m.colourHex };
  const hex = s.geometry.pieces.find((p) => p.materialId === id)?.colourHex ?? '#000000';
  return { id, kind: 'unknown', colour: 'a material no longer in stock', colourHex: hex };
}

export function lineViews(db: Db, shopId: string, rows: LineWithOrder[], shopMaterials = repo.materialsOfShop(db, shopId)): WorkLine[] {
  const mats = new Map(shopMaterials.map((m) => [m.id, m]));
  const buyers = new Map(repo.users(db, [...new Set(rows.map((r) => r.order.buyerId))]).map((u) => [u.id, u]));
  return rows.map(({ line, order }) => {
    const s = lineSnapshot(line);
    return {
      id: line.id,
      orderId: order.id,
      orderNumber: order.number,
      state: line.state as LineState,
      listingId: line.listingId,
      listingTitle: line.listingTitle,
      quantity: line.quantity,
      text: lineText(s),
      blankChoice: blankChoiceLabel(s.blank),
      buyerName: buyers.get(order.buyerId)?.name ?? 'A shopper',
      paidAt: order.paidAt,
      version: line.version,
      materials: lineMaterialIds(s).map((id) => materialRef(mats.get(id), id, s)),
    };
  });
}

export function ownLine(db: Db, shopId: string, lineId: string): LineWithOrder {
  const row = repo.linesByIds(db, shopId, [lineId])[0];
  if (!row) throw notFound('We could not find that order line in your shop.');
  return row;
}

export function summary(db: Db, shopId: string): WorkroomSummary {
  const counts = Object.fromEntries(WORK_STATES.map((s) => [s, 0])) as WorkroomSummary['counts'];
  for (const { state, n } of repo.stateCounts(db, shopId)) if (state in counts) counts[state as keyof typeof counts] = n;
  return { counts };
}

/** One page of the shop's lines (most urgent first), and what the filters can offer. */
export function listLines(db: Db, shopId: string, q: LinesQuery): WorkLinesPage {
  const { page, limit, ...filter } = q;
  const rows = repo.linesPage(db, shopId, filter, limit, pageOffset({ page, limit }));
  const mats = repo.materialsOfShop(db, shopId);
  return {
    ...toPage(lineViews(db, shopId, rows, mats), repo.linesCount(db, shopId, filter), { page, limit }),
    options: {
      materials: mats.map((m) => ({ id: m.id, kind: m.kind, colour: m.colourName, colourHex: m.colourHex })).sort((a, b) => a.colour.localeCompare(b.colour)),
      listings: repo.soldListings(db, shopId),
    },
  };
}

export function orderView(db: Db, shopId: string, orderId: string): WorkOrder {
  const order = repo.order(db, shopId, orderId);
  if (!order) throw notFound('We could not find that order in your shop.');
  const lines = repo.linesOfOrder(db, order.id);
  const shop = repo.shop(db, shopId);
  const events = repo.events(
    db,
    lines.map((l) => l.id),
  );
  const people = new Map(repo.users(db, [...new Set([order.buyerId, ...events.map((e) => e.actorId).filter((x): x is string => !!x)])]).map((u) => [u.id, u]));
  const buyer = people.get(order.buyerId);
  const timeline: TimelineEvent[] = events.map((e) => ({
    id: e.id,
    lineId: e.lineId,
    fromState: e.fromState as LineState | null,
    toState: e.toState as LineState,
    message: e.message,
    at: e.createdAt,
    actorName: e.actorId ? (people.get(e.actorId)?.name ?? 'Someone') : null,
    actorRole: e.actorId === null ? null : e.actorId === order.buyerId ? 'shopper' : e.actorId === shop?.ownerId ? 'shop' : 'namesake',
  }));
  return {
    id: order.id,
    number: order.number,
    buyerName: buyer?.name ?? 'A shopper',
    buyerEmail: buyer?.email ?? '',
    paidAt: order.paidAt,
    shipByDate: order.shipByDate,
    currency: order.currency,
    totalMinor: order.totalMinor,
    carrier: order.carrier,
    trackingNumber: order.trackingNumber,
    shippedAt: order.shippedAt,
    shipTo: parseShipTo(order.shipTo),
    lines: lineViews(
      db,
      shopId,
      lines.map((line) => ({ line, order })),
    ),
    timeline,
  };
}
