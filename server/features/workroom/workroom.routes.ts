import { Router } from 'express';
import type { PageQuery } from '../../../shared/schemas/pagination.ts';
import {
  buildCutSheetsSchema,
  idParams,
  type LinesQuery,
  lineIdsSchema,
  linesQuerySchema,
  lowStockSchema,
  type Paper,
  requestChangeSchema,
  shipSchema,
  stockQuerySchema,
  templateQuerySchema,
  worksheetRequestSchema,
} from '../../../shared/schemas/workroom.ts';
import type { AppDeps } from '../../deps.ts';
import { perAccountLimit } from '../../http/account-rate-limit.ts';
import { currentUser, ownShop, requireRole, requireUser } from '../../http/auth-guards.ts';
import { validate } from '../../http/validate.ts';
import { batch, buildCutSheets, discardBatch, markCut, recentBatches, sheetSvg } from './cut-sheets.service.ts';
import { listLines, orderView, summary } from './lines.service.ts';
import { markPressed, pressCards } from './press.service.ts';
import { personalisationForEdit, savePersonalisation } from './proof-edit.service.ts';
import { approve, proof, requestChange } from './proofs.service.ts';
import { ship } from './shipping.service.ts';
import { setLowStock, stock } from './stock.service.ts';
import { placementTemplate } from './template.service.ts';
import { createWorksheetJobs } from './worksheet-jobs.ts';

/**
 * /api/workroom — the signed-in seller's production desk. Every route is seller-only and scoped by
 * the seller's own shop: another shop's order, line, sheet or job id answers 404 like an unknown one.
 */
export function workroomRouter(deps: AppDeps): Router {
  const r = Router();
  const jobs = createWorksheetJobs({ db: deps.db, now: deps.now, dir: deps.env.worksheetsDir, builder: deps.worksheetBuilder });
  const shopId = (req: Parameters<typeof ownShop>[1]) => ownShop(deps.db, req).id;
  const id = (req: { params: Record<string, unknown> }) => String(req.params.id);
  r.use(requireRole('seller'));

  r.get('/summary', (req, res) => {
    res.json(summary(deps.db, shopId(req)));
  });
  r.get('/lines', validate({ query: linesQuerySchema }), (req, res) => {
    res.json(listLines(deps.db, shopId(req), res.locals.query as LinesQuery));
  });
  r.get('/orders/:id', validate({ params: idParams }), (req, res) => {
    res.json({ order: orderView(deps.db, shopId(req), id(req)) });
  });
  r.post('/orders/:id/ship', validate({ params: idParams, body: shipSchema }), async (req, res) => {
    res.json({ order: await ship(deps, shopId(req), currentUser(req).id, id(req), req.body) });
  });

  // proofs
  r.get('/lines/:id/proof', validate({ params: idParams }), (req, res) => {
    res.json({ proof: proof(deps.db, shopId(req), id(req)) });
  });
  r.post('/lines/:id/approve', validate({ params: idParams }), (req, res) => {
    res.json({ lines: approve(deps, shopId(req), currentUser(req).id, [id(req)]) });
  });
  r.post('/proofs/approve', validate({ body: lineIdsSchema }), (req, res) => {
    res.json({ lines: approve(deps, shopId(req), currentUser(req).id, req.body.lineIds) });
  });
  r.post('/lines/:id/request-change', validate({ params: idParams, body: requestChangeSchema }), async (req, res) => {
    res.json({ line: await requestChange(deps, shopId(req), currentUser(req).id, id(req), req.body.message) });
  });

  // press cards
  r.get('/lines/:id/press-card', validate({ params: idParams }), (req, res) => {
    res.json(pressCards(deps.db, shopId(req), { lineId: id(req) })[0]);
  });
  r.get('/press-cards', (req, res) => {
    res.json({ cards: pressCards(deps.db, shopId(req), { state: 'cut' }) });
  });
  r.post('/lines/:id/pressed', validate({ params: idParams }), (req, res) => {
    res.json({ lines: markPressed(deps, shopId(req), currentUser(req).id, [id(req)]) });
  });
  r.post('/pressed', validate({ body: lineIdsSchema }), (req, res) => {
    res.json({ lines: markPressed(deps, shopId(req), currentUser(req).id, req.body.lineIds) });
  });

  // the 1:1 placement template of a line (PDF, built in the worker pool)
  r.get('/lines/:id/template', validate({ params: idParams, query: templateQuerySchema }), async (req, res) => {
    const { paper } = res.locals.query as { paper: Paper };
    const { pdf, name } = await placementTemplate(deps, shopId(req), id(req), paper);
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', `inline; filename="${name}"`);
    res.setHeader('Cache-Control', 'private, no-store');
    res.send(pdf);
  });

  // cut sheets
  r.post('/cut-sheets', perAccountLimit(deps.rateLimits.cutSheetsPerMinute, 'cut-sheet builds', deps.limitStore('cut-sheets')), validate({ body: buildCutSheetsSchema }), async (req, res) => {
    res.status(201).json(await buildCutSheets(deps, shopId(req), currentUser(req).id, req.body.lineIds, { grouping: req.body.grouping, weedingLines: req.body.weedingLines }));
  });
  r.get('/batches', (req, res) => {
    res.json({ batches: recentBatches(deps.db, shopId(req)) });
  });
  r.get('/batches/:id', validate({ params: idParams }), (req, res) => {
    res.json({ batchId: id(req), sheets: batch(deps.db, shopId(req), id(req)) });
  });
  r.post('/batches/:id/cut', validate({ params: idParams }), (req, res) => {
    const sheets = batch(deps.db, shopId(req), id(req));
    res.json(
      markCut(
        deps,
        shopId(req),
        currentUser(req).id,
        sheets.map((s) => s.id),
      ),
    );
  });
  r.post('/batches/:id/discard', validate({ params: idParams }), (req, res) => {
    res.json(discardBatch(deps, shopId(req), currentUser(req).id, id(req)));
  });
  r.get('/cut-sheets/:id/svg', validate({ params: idParams }), (req, res) => {
    // ?labels=0: the order labels left out, for cutter software that would cut text
    const { svg, name } = sheetSvg(deps.db, shopId(req), id(req), { labels: req.query.labels !== '0' });
    res.setHeader('Content-Type', 'image/svg+xml; charset=utf-8');
    res.setHeader('Cache-Control', 'private, no-store');
    // our own SVG has no script, but never let a browser run anything from it anyway
    res.setHeader('Content-Security-Policy', "default-src 'none'; style-src 'unsafe-inline'");
    if (req.query.download !== undefined) res.setHeader('Content-Disposition', `attachment; filename="${name}"`);
    res.send(svg);
  });
  r.post('/cut-sheets/:id/cut', validate({ params: idParams }), (req, res) => {
    res.json(markCut(deps, shopId(req), currentUser(req).id, [id(req)]));
  });

  // work sheet PDF: start, poll, download
  r.post(
    '/batches/:id/worksheet',
    perAccountLimit(deps.rateLimits.pdfJobsPerMinute, 'work sheets', deps.limitStore('work-sheets')),
    validate({ params: idParams, body: worksheetRequestSchema }),
    (req, res) => {
      res.status(202).json({ job: jobs.start(shopId(req), id(req), req.body.paper) });
    },
  );
  r.get('/worksheets/:id', validate({ params: idParams }), (req, res) => {
    res.json({ job: jobs.get(shopId(req), id(req)) });
  });
  r.get('/worksheets/:id/file', validate({ params: idParams }), (req, res) => {
    const { pdf, name } = jobs.file(shopId(req), id(req));
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', `attachment; filename="${name}"`);
    res.setHeader('Cache-Control', 'private, no-store');
    res.send(pdf);
  });

  // stock
  r.get('/stock', validate({ query: stockQuerySchema }), (req, res) => {
    res.json(stock(deps.db, shopId(req), res.locals.query as PageQuery));
  });
  r.patch('/stock/:id', validate({ params: idParams, body: lowStockSchema }), (req, res) => {
    res.json(setLowStock(deps.db, shopId(req), id(req), req.body.lowStockMm));
  });
  return r;
}

/** /api/order-lines — the shopper edits a line's personalisation after the shop asked for a change. */
export function proofEditRouter(deps: AppDeps): Router {
  const r = Router();
  r.use(requireUser);
  r.get('/:id/personalisation', validate({ params: idParams }), (req, res) => {
    res.json(personalisationForEdit(deps.db, currentUser(req).id, String(req.params.id)));
  });
  r.put('/:id/personalisation', validate({ params: idParams }), async (req, res) => {
    res.json(await savePersonalisation(deps, currentUser(req).id, String(req.params.id), req.body));
  });
  return r;
}
