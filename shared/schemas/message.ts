// Order messages: the thread between an order's shopper and its shop (admins read it and may write).
import { z } from 'zod';

/** The longest message we take, in characters: room for a question and its details, not for an essay. */
export const MESSAGE_MAX_CHARS = 2000;
/** Messages one order's thread may hold: keeps every thread one bounded answer (no pager needed). */
export const MESSAGES_PER_ORDER_MAX = 200;

export const MESSAGE_SIDES = ['shopper', 'shop', 'admin'] as const;
export type MessageSide = (typeof MESSAGE_SIDES)[number];

/** POST /api/orders/:id/messages (JSON, or multipart with an optional `file` photo and the field `body`). */
export const postMessageSchema = z.object({
  body: z
    .string({ error: 'Write your message.' })
    .trim()
    .min(1, 'Write your message.')
    .max(MESSAGE_MAX_CHARS, `Use at most ${MESSAGE_MAX_CHARS.toLocaleString('en-US')} characters.`),
});
export type PostMessageInput = z.input<typeof postMessageSchema>;

export const messageParams = z.object({ id: z.string().min(1).max(64), messageId: z.string().min(1).max(64) });
export const photoSizeQuery = z.object({ size: z.enum(['full', 'thumb']).default('full') });

export type MessageView = {
  id: string;
  side: MessageSide;
  authorName: string;
  /** plain text: clients render it as text, never as markup */
  body: string;
  photo: { url: string; thumbnailUrl: string; width: number; height: number } | null;
  /** written by whoever is reading */
  mine: boolean;
  createdAt: number;
};
export type ThreadView = {
  orderId: string;
  orderNumber: string;
  viewerSide: MessageSide;
  messages: MessageView[];
  /** the thread holds MESSAGES_PER_ORDER_MAX messages: no more can be posted */
  full: boolean;
  /** messages from the other side the viewer has not read yet (always 0 for an admin) */
  unread: number;
};
/** unread messages for the header: on the user's own orders (as a shopper) and on their shop's orders */
export type UnreadView = { count: number; asShopper: number; asShop: number };
