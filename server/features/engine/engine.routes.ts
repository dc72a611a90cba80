/**
 * Thin HTTP layer over the pure engine (mounted at /api by the app):
 *   GET  /fonts           → [{ id, family, kind, style, licence, fileUrl, characters, minLetterHeightMm }]
 *   GET  /fonts/:id/file  → the exact TTF bytes the engine uses (font/ttf, cached a year; URL is versioned)
 *   POST /layout/text     → { widthMm, heightMm, advanceMm, path, glyphs, missing, warnings, … }
 */
import { type RequestHandler, Router } from 'express';
import { rateLimit, type Store } from 'express-rate-limit';
import { layoutWarnings } from '../../../shared/engine/fit.ts';
import { LayoutError, layoutText, type TextLayout } from '../../../shared/engine/text-layout.ts';
import { type FontInfo, fontParamsSchema, type LayoutTextRequest, type LayoutTextResponse, layoutTextRequestSchema } from '../../../shared/schemas/engine.ts';
import { AppError, badRequest, notFound } from '../../http/app-error.ts';
import { validate } from '../../http/validate.ts';
import { getFontFile, getFontRegistry, listFontFiles } from '../../integrations/fonts.ts';
import { createLayoutCache } from '../../workers/layout.ts';
import type { WorkPool } from '../../workers/pool.ts';

export interface EngineRouterOptions {
  /** Layout requests per minute per client (default 240). */
  layoutPerMinute?: number;
  /** Font list/file requests per minute per client (default 600). */
  fontsPerMinute?: number;
  /** Where layouts that are not cached run (the app's worker pool); without it, in this thread. */
  pool?: WorkPool;
  /** Where the limits count (the app's shared store, so every server process sees them); default: this process's memory. */
  store?: (name: string) => Store;
}

const limiter = (limit: number, store?: Store) =>
  rateLimit({
    store,
    windowMs: 60_000,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) => next(new AppError(429, 'rate_limited', 'Too many requests. Please wait a moment and try again.')),
  });

export function fontList(): FontInfo[] {
  const reg = getFontRegistry();
  return listFontFiles().map(({ entry, hash }) => ({
    id: entry.id,
    family: entry.family,
    kind: entry.kind,
    style: entry.style,
    licence: entry.licence,
    fileUrl: `/api/fonts/${entry.id}/file?v=${hash}`,
    characters: reg.require(entry.id).characters,
    minLetterHeightMm: entry.minLetterHeightMm,
  }));
}

/** `l` is the layout when it was made elsewhere (the worker pool); by default it is made here. */
export function layoutTextResponse(input: LayoutTextRequest, layout?: TextLayout): LayoutTextResponse {
  const reg = getFontRegistry();
  const font = reg.require(input.fontId);
  const l = layout ?? layoutText(reg, input);
  const warnings = layoutWarnings(l, { letterHeightMm: input.letterHeightMm, minLetterHeightMm: font.minLetterHeightMm });
  return {
    text: l.text,
    fontId: l.fontId,
    letterHeightMm: l.letterHeightMm,
    widthMm: l.widthMm,
    heightMm: l.heightMm,
    advanceMm: l.advanceMm,
    bboxMm: l.bboxMm,
    path: l.path,
    glyphs: l.glyphs.map((g) => ({ char: g.char, advanceMm: g.advanceMm })),
    missing: [...l.missing],
    warnings,
  };
}

export function engineRouter(opts: EngineRouterOptions = {}): Router {
  const r = Router();
  const fontsLimit = limiter(opts.fontsPerMinute ?? 600, opts.store?.('fonts'));
  const layoutLimit = limiter(opts.layoutPerMinute ?? 240, opts.store?.('layout'));
  const layout = opts.pool ? createLayoutCache(opts.pool) : null;

  r.get('/fonts', fontsLimit, ((_req, res) => {
    res.set('Cache-Control', 'public, max-age=3600');
    res.json(fontList());
  }) satisfies RequestHandler);

  r.get('/fonts/:id/file', fontsLimit, validate({ params: fontParamsSchema }), ((req, res) => {
    const file = getFontFile(String(req.params.id));
    if (!file) throw notFound('No such font.');
    res.set({
      'Content-Type': 'font/ttf',
      'Cache-Control': 'public, max-age=31536000, immutable',
      ETag: `"${file.hash}"`,
      'X-Content-Type-Options': 'nosniff',
      'Cross-Origin-Resource-Policy': 'same-origin',
    });
    if (req.headers['if-none-match'] === `"${file.hash}"`) {
      res.status(304).end();
      return;
    }
    res.send(Buffer.from(file.bytes.buffer, file.bytes.byteOffset, file.bytes.byteLength));
  }) satisfies RequestHandler);

  r.post('/layout/text', layoutLimit, validate({ body: layoutTextRequestSchema }), (async (req, res) => {
    try {
      const input = req.body as LayoutTextRequest;
      res.json(layoutTextResponse(input, layout ? await layout(input) : undefined));
    } catch (e) {
      if (e instanceof LayoutError) throw badRequest(e.message, { text: e.message });
      throw e;
    }
  }) satisfies RequestHandler);

  return r;
}
