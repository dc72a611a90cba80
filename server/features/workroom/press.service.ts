// Press cards (the heat, time and peel for each layer of a line, on the shop's press) and marking
// lines pressed (through orders' transition()).

import { type PressType, pressCard } from '../../../shared/engine/press-card.ts';
import { MATERIAL_KINDS, type MaterialKind } from '../../../shared/engine/press-defaults.ts';
import { layerOverlaps } from '../../../shared/engine/press-order.ts';
import type { LineSnapshot } from '../../../shared/schemas/cart.ts';
import type { LineState } from '../../../shared/schemas/order.ts';
import type { PressCardView, WorkLine } from '../../../shared/schemas/workroom.ts';
import type { Db } from '../../db/client.ts';
import { notFound } from '../../http/app-error.ts';
import { assertEachCanMove, transitionAll } from '../orders/index.ts';
import { listingContent, proofBlank } from './blank-view.ts';
import { type LineWithOrder, lineMaterialIds, lineSnapshot, lineViews, ownLine, type WorkroomDeps } from './lines.service.ts';
import { type MaterialRow, workroomRepo as repo } from './workroom.repo.ts';

const asKind = (k: string): MaterialKind => ((MATERIAL_KINDS as readonly string[]).includes(k) ? (k as MaterialKind) : 'smooth');

/**
 * Which of a line's layers (its materials, bottom → top) overlap, from its frozen geometry. A
 * line's geometry never changes for a version, so the answer is kept per line version.
 */
const overlapMemo = new Map<string, Array<[string, string]>>();
const MEMO_SIZE = 2000;
export function lineOverlaps(line: { id: string; version: number; snapshot: LineSnapshot }): Array<[string, string]> {
  const key = `${line.id}:${line.version}`;
  const hit = overlapMemo.get(key);
  if (hit) return hit;
  const s = line.snapshot;
  const layers = lineMaterialIds(s).map((id) => ({ layerId: id, paths: s.geometry.pieces.filter((p) => p.materialId === id).map((p) => p.d) }));
  const pairs = layerOverlaps(layers);
  if (overlapMemo.size >= MEMO_SIZE) overlapMemo.delete(overlapMemo.keys().next().value!);
  overlapMemo.set(key, pairs);
  return pairs;
}

export function pressCardFor(db: Db, shopId: string, row: LineWithOrder, mats?: Map<string, MaterialRow>): PressCardView {
  const shop = repo.shop(db, shopId);
  const materials = mats ?? new Map(repo.materialsOfShop(db, shopId).map((m) => [m.id, m]));
  const s = lineSnapshot(row.line);
  const layers = lineMaterialIds(s).map((id) => {
    const m = materials.get(id);
    const pp = m?.pressProfile;
    return {
      layerId: id,
      materialKind: asKind(m?.kind ?? 'smooth'),
      colourName: (m?.colourName ?? 'Unknown colour').slice(0, 40),
      ...(pp ? { profile: { handheld: pp.handheld, clamshell: pp.clamshell, tackS: pp.tackS, peel: pp.peel, topOnly: pp.topOnly, ...(pp.coolS !== undefined ? { coolS: pp.coolS } : {}) } } : {}),
    };
  });
  const { topOffsetMm } = listingContent(db, row.line.listingId);
  const b = proofBlank(s, topOffsetMm);
  const card = pressCard({
    pressType: (shop?.pressType === 'handheld' ? 'handheld' : 'clamshell') as PressType,
    layers: layers.length ? layers : [{ layerId: 'design', materialKind: 'smooth', colourName: 'Design' }],
    ...(layers.length ? { overlaps: lineOverlaps(row.line) } : {}),
    backPress: shop?.backPress ?? false,
    blank: { kind: s.blank.kind, name: b.name, topOffsetMm: b.printArea.yMm },
  });
  return { line: lineViews(db, shopId, [row])[0]!, card, figure: { blank: b, pieces: s.geometry.pieces } };
}

export function pressCards(db: Db, shopId: string, opts: { lineId?: string; state?: LineState }): PressCardView[] {
  const rows = opts.lineId ? [ownLine(db, shopId, opts.lineId)] : repo.linesOfShop(db, shopId, opts.state ?? 'cut');
  const mats = new Map(repo.materialsOfShop(db, shopId).map((m) => [m.id, m]));
  return rows.map((r) => pressCardFor(db, shopId, r, mats));
}

export function markPressed(deps: WorkroomDeps, shopId: string, actorId: string, lineIds: string[]): WorkLine[] {
  const { db } = deps;
  const rows = repo.linesByIds(db, shopId, lineIds);
  if (rows.length !== lineIds.length) throw notFound('Some of these lines were not found in your shop.');
  assertEachCanMove(
    rows.map((r) => ({ id: r.line.id, state: r.line.state, name: r.order.number })),
    'pressed',
    'shop',
    'Only cut items can be marked pressed',
  );
  const at = deps.now();
  transitionAll(
    db,
    rows.map((r) => ({ line: r.line, to: 'pressed' as const, actor: 'shop' as const, actorId, at, message: 'Pressed.' })),
  );
  return lineViews(db, shopId, repo.linesByIds(db, shopId, lineIds));
}
