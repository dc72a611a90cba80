import crypto from 'node:crypto';
import type { z } from 'zod';
import type { CreateMaterialInput, createMaterialSchema, Material, MaterialKind, MaterialsQuery, UpdateMaterialInput, updateMaterialSchema } from '../../../shared/schemas/material.ts';
import { type Page, pageOffset, toPage } from '../../../shared/schemas/pagination.ts';
import type { Db } from '../../db/client.ts';
import { conflict, notFound } from '../../http/app-error.ts';
import { countMaterials, deleteMaterial, findMaterial, insertMaterial, listingsUsing, listMaterials, type MaterialRow, updateMaterial } from './materials.repo.ts';

export function toMaterial(m: MaterialRow): Material {
  return {
    id: m.id,
    kind: m.kind as MaterialKind,
    colourName: m.colourName,
    colourHex: m.colourHex,
    rollWidthMm: m.rollWidthMm,
    stockMm: m.stockMm,
    lowStockMm: m.lowStockMm,
    lowStock: m.stockMm <= m.lowStockMm,
    pricePerMetreMinor: m.pricePerMetreMinor,
    pressProfile: m.pressProfile,
    archived: m.archived,
    createdAt: m.createdAt,
  };
}

const gone = () => notFound('No such material in your shop.');

/** One page of the shop's materials; `archived` undefined lists both. */
export function list(db: Db, shopId: string, q: MaterialsQuery): Page<Material> {
  const archived = q.archived === undefined ? undefined : q.archived === 'true';
  return toPage(listMaterials(db, shopId, archived, q.limit, pageOffset(q)).map(toMaterial), countMaterials(db, shopId, archived), q);
}

export function get(db: Db, shopId: string, id: string): Material {
  const m = findMaterial(db, shopId, id);
  if (!m) throw gone();
  return toMaterial(m);
}

export function create(deps: { db: Db; now: () => number }, shopId: string, input: z.output<typeof createMaterialSchema>): Material {
  return toMaterial(insertMaterial(deps.db, { id: crypto.randomUUID(), shopId, ...input, createdAt: deps.now() }));
}

export function update(db: Db, shopId: string, id: string, input: z.output<typeof updateMaterialSchema>): Material {
  const row = updateMaterial(db, shopId, id, input);
  if (!row) throw gone();
  return toMaterial(row);
}

/** A material still named by a listing is archived, not deleted, so the listing keeps working. */
export function remove(db: Db, shopId: string, id: string): { deleted: boolean; archived: boolean } {
  if (!findMaterial(db, shopId, id)) throw gone();
  const using = listingsUsing(db, shopId, id);
  if (using.length > 0) {
    throw conflict(`This material is used by ${using.length} listing${using.length === 1 ? '' : 's'}. Archive it instead, or take it out of those listings first.`);
  }
  deleteMaterial(db, shopId, id);
  return { deleted: true, archived: false };
}
export type { CreateMaterialInput, UpdateMaterialInput };
