// Order messages: one thread per order between its shopper and its shop; admins read it and may
// write. Each message is mailed to the other party with a link to the thread; the other party's
// unread messages are counted for the header until they open the thread.
import crypto from 'node:crypto';
import { MESSAGES_PER_ORDER_MAX, type MessageSide, type MessageView, type ThreadView, type UnreadView } from '../../../shared/schemas/message.ts';
import type { Db } from '../../db/client.ts';
import { AppError } from '../../http/app-error.ts';
import type { SessionUser } from '../../http/auth-guards.ts';
import type { Mailer } from '../../integrations/mailer.ts';
import type { StoredImage } from '../../integrations/storage.ts';
import { orderParty } from '../orders/index.ts';
import { messageMail } from './message-mails.ts';
import { type MessageRow, messagesRepo as repo } from './messages.repo.ts';

type Deps = { db: Db; now: () => number; mailer: Mailer; env: { baseUrl: string } };
type Viewer = { user: SessionUser; shopId: string | null };

const photoUrl = (orderId: string, messageId: string, size: 'full' | 'thumb') =>
  `/api/orders/${encodeURIComponent(orderId)}/messages/${encodeURIComponent(messageId)}/photo${size === 'thumb' ? '?size=thumb' : ''}`;

function toView(m: MessageRow, authorName: string, viewer: Viewer): MessageView {
  return {
    id: m.id,
    side: m.side as MessageSide,
    // the shop speaks as the shop; the team as the team; the shopper by her name
    authorName,
    body: m.body,
    photo:
      m.photoPath && m.photoWidth && m.photoHeight ? { url: photoUrl(m.orderId, m.id, 'full'), thumbnailUrl: photoUrl(m.orderId, m.id, 'thumb'), width: m.photoWidth, height: m.photoHeight } : null,
    mine: m.authorId === viewer.user.id,
    createdAt: m.createdAt,
  };
}

export function thread(db: Db, orderId: string, viewer: Viewer): ThreadView {
  const { order, side } = orderParty(db, orderId, viewer.user, viewer.shopId);
  const shopName = repo.shopOwner(db, order.shopId)?.shopName ?? 'The shop';
  const rows = repo.thread(db, order.id);
  return {
    orderId: order.id,
    orderNumber: order.number,
    viewerSide: side,
    messages: rows.map(({ m, authorName }) => toView(m, m.side === 'shop' ? shopName : m.side === 'admin' ? 'Namesake team' : authorName, viewer)),
    full: rows.length >= MESSAGES_PER_ORDER_MAX,
    unread: rows.filter(({ m }) => (side === 'shopper' ? m.side !== 'shopper' && m.shopperReadAt === null : side === 'shop' ? m.side !== 'shop' && m.shopReadAt === null : false)).length,
  };
}

/** Checks who may post before anything is stored (a refused caller's photo never reaches the disk). */
export function assertCanPost(db: Db, orderId: string, viewer: Viewer): void {
  const { order } = orderParty(db, orderId, viewer.user, viewer.shopId);
  if (repo.count(db, order.id) >= MESSAGES_PER_ORDER_MAX) {
    throw new AppError(409, 'thread_full', `This order's thread has reached ${MESSAGES_PER_ORDER_MAX} messages. Write to the Namesake team if you still need help.`);
  }
}

/**
 * Posts a message (with a photo already checked and stored by the caller, or none), then mails the
 * other party. A mail failure is logged and never loses the message.
 */
export async function post(deps: Deps, orderId: string, viewer: Viewer, body: string, photo: StoredImage | null): Promise<MessageView> {
  const { db } = deps;
  const { order, side } = orderParty(db, orderId, viewer.user, viewer.shopId);
  const at = deps.now();
  const row = repo.insert(db, {
    id: crypto.randomUUID(),
    orderId: order.id,
    authorId: viewer.user.id,
    side,
    body,
    photoPath: photo?.fileName ?? null,
    photoThumbPath: photo?.thumbName ?? null,
    photoWidth: photo?.width ?? null,
    photoHeight: photo?.height ?? null,
    // the writer has read their own message
    shopperReadAt: side === 'shopper' ? at : null,
    shopReadAt: side === 'shop' ? at : null,
    createdAt: at,
  });
  const owner = repo.shopOwner(db, order.shopId);
  const buyer = repo.buyer(db, order.buyerId);
  const fromName = side === 'shop' ? (owner?.shopName ?? 'The shop') : side === 'admin' ? 'The Namesake team' : viewer.user.name;
  const base = deps.env.baseUrl;
  const recipients: Array<{ email: string; name: string; link: string }> = [];
  if (side !== 'shopper' && buyer) recipients.push({ ...buyer, link: `${base}/orders/${encodeURIComponent(order.id)}#messages` });
  if (side !== 'shop' && owner) recipients.push({ email: owner.email, name: owner.name, link: `${base}/workroom/orders/${encodeURIComponent(order.id)}#messages` });
  for (const r of recipients) {
    await deps.mailer.send(messageMail(r, { fromName, orderNumber: order.number, body, hasPhoto: !!photo, link: r.link })).catch((e: unknown) => console.error('messages: e-mail failed', e));
  }
  return toView(row, side === 'shop' ? (owner?.shopName ?? 'The shop') : side === 'admin' ? 'Namesake team' : viewer.user.name, viewer);
}

/** The viewer opened the thread: the other side's messages are read (an admin reading changes nothing). */
export function markRead(deps: { db: Db; now: () => number }, orderId: string, viewer: Viewer): { marked: number } {
  const { order, side } = orderParty(deps.db, orderId, viewer.user, viewer.shopId);
  if (side === 'shopper') return { marked: repo.markShopperRead(deps.db, order.id, deps.now()) };
  if (side === 'shop') return { marked: repo.markShopRead(deps.db, order.id, deps.now()) };
  return { marked: 0 };
}

export function unread(db: Db, viewer: Viewer): UnreadView {
  const u = repo.unread(db, viewer.user.id, viewer.shopId);
  return { count: u.asShopper + u.asShop, ...u };
}

/** The stored file name of a message's photo, for the thread's readers only. */
export function photoFile(db: Db, orderId: string, messageId: string, viewer: Viewer, size: 'full' | 'thumb'): string {
  const { order } = orderParty(db, orderId, viewer.user, viewer.shopId);
  const m = repo.find(db, order.id, messageId);
  const name = size === 'thumb' ? m?.photoThumbPath : m?.photoPath;
  if (!name) throw new AppError(404, 'not_found', 'No such photo.');
  return name;
}
