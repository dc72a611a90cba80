import type { ShopState } from '../../../../shared/schemas/shop.ts';
import type { AuditEntry, ModerationQueue } from '../api/types.ts';

const stateAfter: Record<string, ShopState> = { 'shop.approve': 'live', 'shop.reject': 'rejected', 'shop.suspend': 'suspended', 'shop.restore': 'live' };

/**
 * Shops the desk knows about without a shop directory: those in the queues (their state is
 * current) and those moderators acted on recently (state after the newest action; the audit log
 * comes newest first).
 */
export function knownShops(queue: ModerationQueue | undefined, audit: AuditEntry[] | undefined): { id: string; name: string; state: ShopState; reason: string | null }[] {
  const out = new Map<string, { id: string; name: string; state: ShopState; reason: string | null }>();
  for (const l of queue?.listings ?? []) out.set(l.shop.id, { id: l.shop.id, name: l.shop.name, state: l.shop.state, reason: null });
  for (const s of queue?.shops ?? []) out.set(s.id, { id: s.id, name: s.name, state: s.state, reason: null });
  for (const e of audit ?? []) {
    if (e.subject.type !== 'shop' || out.has(e.subject.id) || !stateAfter[e.action]) continue;
    out.set(e.subject.id, { id: e.subject.id, name: e.subject.label ?? e.subject.id, state: stateAfter[e.action]!, reason: e.reason });
  }
  return [...out.values()];
}
