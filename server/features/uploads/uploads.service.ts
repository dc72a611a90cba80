import crypto from 'node:crypto';
import { checkMotifBounds, MOTIF_LIMIT_CODES, MotifError, type MotifGeometry, renderMotifSvg } from '../../../shared/engine/motif.ts';
import type { MotifView, UploadView } from '../../../shared/schemas/upload.ts';
import type { Db } from '../../db/client.ts';
import { AppError, conflict, notFound } from '../../http/app-error.ts';
import type { SessionUser } from '../../http/auth-guards.ts';
import { type Storage, storedImageColumns, uploadUrl } from '../../integrations/storage.ts';
import type { WorkPool } from '../../workers/pool.ts';
import {
  deleteMotif,
  deleteUpload,
  findMotif,
  findMotifAnyShop,
  findUpload,
  insertMotif,
  insertUpload,
  listingsMentioning,
  listMotifs,
  listUploads,
  type MotifRow,
  motifOnSale,
  type UploadRow,
} from './uploads.repo.ts';

export const toUpload = (u: UploadRow): UploadView => ({
  id: u.id,
  kind: u.kind,
  url: uploadUrl(u.path)!,
  thumbnailUrl: uploadUrl(u.thumbPath)!,
  width: u.width,
  height: u.height,
  bytes: u.bytes,
  createdAt: u.createdAt,
});

export async function savePhoto(deps: { db: Db; now: () => number; storage: Storage }, user: SessionUser, shopId: string, kind: 'photo' | 'logo', buf: Buffer) {
  const img = await deps.storage.saveImage(buf);
  return toUpload(
    insertUpload(deps.db, {
      id: crypto.randomUUID(),
      ownerId: user.id,
      shopId,
      kind,
      ...storedImageColumns(img),
      createdAt: deps.now(),
    }),
  );
}

export const listPhotos = (db: Db, shopId: string) => listUploads(db, shopId).map(toUpload);

export function removePhoto(deps: { db: Db; storage: Storage }, shopId: string, id: string) {
  const u = findUpload(deps.db, shopId, id);
  if (!u) throw notFound('No such upload in your shop.');
  if (listingsMentioning(deps.db, shopId, id).length > 0) throw conflict('This photo is used by a listing. Take it out of the listing first.');
  deleteUpload(deps.db, shopId, id);
  deps.storage.remove(u.path);
  deps.storage.remove(u.thumbPath);
  return { deleted: true };
}

// ---------------------------------------------------------------- motifs
const ACTIVE = /^(<script>|<foreignObject>|<iframe>|on\w+ attribute)$/i;

export function toMotif(m: MotifRow): MotifView {
  const g = m.geometry;
  return {
    id: m.id,
    name: m.name,
    widthMm: g.widthMm,
    heightMm: g.heightMm,
    layers: g.layers.map((l) => ({ id: l.id, colour: l.colour, areaMm2: l.areaMm2, bboxMm: l.bboxMm })),
    svgUrl: `/api/motifs/${m.id}/svg`,
    createdAt: m.createdAt,
  };
}

/**
 * A refused motif → our error shape: over the byte cap 413; over another limit (limits.ts) 400,
 * the message naming the limit; a broken or unusable file 422.
 */
function motifRefusal(e: MotifError): AppError {
  const status = e.code === 'too_large' ? 413 : MOTIF_LIMIT_CODES.has(e.code) ? 400 : 422;
  return new AppError(status, `motif_${e.code}`, e.message, { file: e.message });
}

/**
 * Sanitises an uploaded motif through the engine, in the worker pool; only the normalised geometry
 * is stored. The bounds that need no parsing are checked here first, before any work is queued.
 */
export async function saveMotif(deps: { db: Db; now: () => number; pool: WorkPool }, shopId: string, name: string, bytes: Buffer) {
  let geometry: MotifGeometry;
  const text = new TextDecoder('utf-8', { fatal: false }).decode(bytes);
  try {
    checkMotifBounds(text);
    geometry = await deps.pool.run({ kind: 'motif', svg: text });
  } catch (e) {
    if (e instanceof MotifError) throw motifRefusal(e);
    throw e;
  }
  const { dropped, ...stored } = geometry;
  // The engine strips active content and reports it; we go further and refuse such a file, so the
  // seller learns their file carried something that should never be there (ASVS 1.3.4, 1.5.1).
  const active = dropped.filter((d) => ACTIVE.test(d.what) || /external references/.test(d.reason));
  // the engine reads the root <svg>'s attributes only for its size, so handlers there are checked here
  const rootTag = /<svg\b[^>]*>/i.exec(text)?.[0] ?? '';
  for (const m of rootTag.matchAll(/\s(on[a-z]+)\s*=/gi)) active.push({ what: `${m[1]} attribute`, reason: 'event handlers are never kept', count: 1 });
  if (active.length > 0) {
    const what = active.map((d) => d.what).join(', ');
    throw new AppError(422, 'motif_active_content', `This SVG contains ${what}, which we never accept. Export the artwork again as plain shapes.`, { file: `Refused: ${what}.` });
  }
  const row = insertMotif(deps.db, { id: crypto.randomUUID(), shopId, name, geometry: stored, createdAt: deps.now() });
  return { motif: toMotif(row), dropped };
}

export const listOwnMotifs = (db: Db, shopId: string) => listMotifs(db, shopId).map(toMotif);

export function getOwnMotif(db: Db, shopId: string, id: string) {
  const m = findMotif(db, shopId, id);
  if (!m) throw notFound('No such motif in your shop.');
  return { ...toMotif(m), geometry: m.geometry };
}

export function removeMotif(db: Db, shopId: string, id: string) {
  if (!findMotif(db, shopId, id)) throw notFound('No such motif in your shop.');
  if (listingsMentioning(db, shopId, id).length > 0) throw conflict('This motif is used by a listing. Take it out of the listing first.');
  deleteMotif(db, shopId, id);
  return { deleted: true };
}

/**
 * The clean SVG we regenerate from stored geometry (never the uploaded file). Visible to its shop,
 * to admins, and to everyone once a listing on sale offers it; otherwise 404.
 */
export function motifSvg(db: Db, id: string, viewer: { role?: string; shopId?: string | null }): string {
  const m = findMotifAnyShop(db, id);
  if (!m) throw notFound('No such motif.');
  const allowed = viewer.role === 'admin' || (viewer.shopId && viewer.shopId === m.shopId) || motifOnSale(db, m);
  if (!allowed) throw notFound('No such motif.');
  return renderMotifSvg({ ...m.geometry, dropped: [] });
}
