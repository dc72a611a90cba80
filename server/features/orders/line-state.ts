// The one place that changes an order line's state. Every move — proofs, shopper edits, cutting,
// pressing, shipping, refunds, cancellation and the demo seed — goes through transition(), which
// checks the move against LINE_TRANSITIONS (shared/schemas/order.ts) and writes the line and its
// timeline event in one transaction.
import crypto from 'node:crypto';
import { canMoveLine, type FIRST_LINE_STATE, LINE_STATE_LABELS, LINE_TRANSITIONS, type LineActor, type LineState } from '../../../shared/schemas/order.ts';
import type { Db } from '../../db/client.ts';
import { AppError } from '../../http/app-error.ts';
import { type OrderLineRow, ordersRepo } from './orders.repo.ts';

export type LineMove = {
  /** the line as read by the caller; the write only lands while the line is still in this state */
  line: Pick<OrderLineRow, 'id' | 'state'>;
  to: LineState;
  actor: LineActor;
  /** the user who made the move, shown on the timeline; null for the app itself */
  actorId: string | null;
  at: number;
  message?: string | null;
  /** other columns of the line written with the move (e.g. a new snapshot, the refunded amount) */
  set?: Partial<Omit<OrderLineRow, 'id' | 'state'>>;
};

const label = (s: string) => (LINE_STATE_LABELS as Record<string, string>)[s]?.toLowerCase() ?? s.replace(/_/g, ' ');

/** Why a move is refused, in words a seller or shopper can act on. */
export function refusal(from: LineState, to: LineState, actor: LineActor): string {
  const allowed = Object.keys(LINE_TRANSITIONS[from] ?? {}) as LineState[];
  if (!allowed.length) return `This item is ${label(from)}; nothing more can happen to it.`;
  if (allowed.includes(to)) return `This item is ${label(from)}; the ${actor === 'system' ? 'app' : actor} cannot move it to ${label(to)}.`;
  return `This item is ${label(from)}; it can't become ${label(to)} from there (next: ${allowed.map(label).join(' or ')}).`;
}

/** Throws the 409 a refused move answers with, or returns when the move is allowed. */
export function assertMove(from: LineState, to: LineState, actor: LineActor): void {
  if (!canMoveLine(from, to, actor)) throw new AppError(409, 'wrong_state', refusal(from, to, actor), { state: from });
}

/**
 * Refuses, in one 409 that names each of them, the lines `actor` may not move to `to`:
 * "<lead>: NS-1001 (cut), NS-1002 (shipped)." Each refused line is also a field `lineIds.<id>`
 * holding its state. Returns when every line may make the move.
 */
export function assertEachCanMove(lines: Array<{ id: string; state: string; name: string }>, to: LineState, actor: LineActor, lead: string): void {
  const wrong = lines.filter((l) => !canMoveLine(l.state as LineState, to, actor));
  if (!wrong.length) return;
  throw new AppError(409, 'wrong_state', `${lead}: ${wrong.map((l) => `${l.name} (${l.state.replace(/_/g, ' ')})`).join(', ')}.`, Object.fromEntries(wrong.map((l) => [`lineIds.${l.id}`, l.state])));
}

/**
 * Moves one line: checks the table, writes the new state (only if the line is still where the
 * caller read it — a concurrent move makes this one fail with 409) and the timeline event.
 */
export function transition(db: Db, move: LineMove): void {
  const from = move.line.state as LineState;
  assertMove(from, move.to, move.actor);
  db.transaction((tx) => {
    const t = tx as unknown as Db;
    const changed = ordersRepo.moveLine(t, move.line.id, from, { ...move.set, state: move.to, updatedAt: move.at });
    if (!changed) throw new AppError(409, 'wrong_state', 'This item changed while you were working on it; reload and try again.');
    ordersRepo.insertEvent(t, { id: crypto.randomUUID(), lineId: move.line.id, actorId: move.actorId, fromState: from, toState: move.to, message: move.message ?? null, createdAt: move.at });
  });
}

/** Moves several lines all or nothing. */
export function transitionAll(db: Db, moves: LineMove[]): void {
  for (const m of moves) assertMove(m.line.state as LineState, m.to, m.actor);
  db.transaction((tx) => {
    for (const m of moves) transition(tx as unknown as Db, m);
  });
}

/**
 * Records the first state of a new line on its timeline (the line row, inserted by the caller in
 * the same transaction, can only start in FIRST_LINE_STATE: ordersRepo.insertLine's type says so).
 */
export function recordFirstState(db: Db, line: { id: string; state: typeof FIRST_LINE_STATE }, actorId: string | null, at: number, message: string | null = null): void {
  ordersRepo.insertEvent(db, { id: crypto.randomUUID(), lineId: line.id, actorId, fromState: null, toState: line.state, message, createdAt: at });
}
