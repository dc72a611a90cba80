// Stock: every roll in use, what the uncut sheets will take from it, and its low-stock mark.

import { type PageQuery, pageOffset, toPage } from '../../../shared/schemas/pagination.ts';
import { type StockView, stockQuerySchema } from '../../../shared/schemas/workroom.ts';
import type { Db } from '../../db/client.ts';
import { notFound } from '../../http/app-error.ts';
import { TRIM_ALLOWANCE_MM } from '../../workers/worksheet-pdf.ts';
import { r3 } from './cut-sheets.service.ts';
import { workroomRepo as repo } from './workroom.repo.ts';

/** Every roll in use with what uncut sheets will take from it; the sheets' use a page at a time. */
export function stock(db: Db, shopId: string, q: PageQuery): StockView {
  const shop = repo.shop(db, shopId);
  const sheets = repo.sheetsPage(db, shopId, q.limit, pageOffset(q));
  // each uncut sheet takes its nested length plus the trim
  const planned = new Map(repo.plannedByMaterial(db, shopId).map((p) => [p.materialId, p.lengthMm + p.sheets * TRIM_ALLOWANCE_MM]));
  return {
    currency: shop?.currency ?? 'USD',
    trimMm: TRIM_ALLOWANCE_MM,
    materials: repo
      .materialsOfShop(db, shopId)
      .filter((m) => !m.archived)
      .map((m) => ({
        id: m.id,
        kind: m.kind,
        colourName: m.colourName,
        colourHex: m.colourHex,
        rollWidthMm: m.rollWidthMm,
        stockMm: m.stockMm,
        lowStockMm: m.lowStockMm,
        low: m.stockMm < m.lowStockMm,
        plannedMm: r3(planned.get(m.id) ?? 0),
      })),
    sheets: toPage(
      sheets.map((s) => ({
        id: s.id,
        batchId: s.batchId,
        materialId: s.materialId,
        state: s.state === 'cut' ? ('cut' as const) : ('planned' as const),
        lengthMm: s.lengthMm,
        consumedMm: s.consumedMm,
        costMinor: s.costMinor,
        cutAt: s.cutAt,
        createdAt: s.createdAt,
        lineCount: new Set(s.pieces.map((p) => p.lineId)).size,
      })),
      repo.sheetsCount(db, shopId),
      q,
    ),
  };
}

/** Sets a roll's low-stock mark; answers with the stock view's first page. */
export function setLowStock(db: Db, shopId: string, materialId: string, lowStockMm: number): StockView {
  const m = repo.material(db, shopId, materialId);
  if (!m) throw notFound('We could not find that material in your shop.');
  repo.setMaterial(db, m.id, { lowStockMm });
  return stock(db, shopId, stockQuerySchema.parse({}));
}
