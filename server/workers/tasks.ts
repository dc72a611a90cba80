/**
 * The CPU-heavy work the server hands its worker pool (pool.ts), one function per task kind.
 * Tasks are plain data in and plain data out (structured clone): no functions, no classes. An
 * error the caller must tell apart (a refused motif, a text the font cannot set, a limit…) comes
 * back as data in `error` and is rebuilt on the request thread by pool.ts.
 */
import type { MessagePort } from 'node:worker_threads';
import { type ComposedItem, ComposeError, type ComposeInput, compose } from '../../shared/engine/compose.ts';
import { withCutOutlines } from '../../shared/engine/cut-path.ts';
import { type CutSheet, CutSheetError, type NestInput, type NestPiece } from '../../shared/engine/cut-sheets.ts';
import { LimitError } from '../../shared/engine/limits.ts';
import { MotifError, type MotifGeometry, parseMotifSvg } from '../../shared/engine/motif.ts';
import { type GroupedSheet, nestOrderGroups, nestPieces } from '../../shared/engine/outline-nest.ts';
import { parsePathData, pathArea, pathBBox } from '../../shared/engine/path.ts';
import { LayoutError, type LayoutTextInput, layoutText, type TextLayout } from '../../shared/engine/text-layout.ts';
import type { Grouping } from '../../shared/schemas/workroom.ts';
import { AppError } from '../http/app-error.ts';
import { getFontRegistry } from '../integrations/fonts.ts';
import { type ProcessedImage, processImage } from '../integrations/storage.ts';
import { buildTemplatePdf, type TemplateInput } from './template-pdf.ts';
import { buildWorksheetPdf, type WorksheetInput } from './worksheet-pdf.ts';

/** A piece to nest as the workroom has it: its path data, not yet measured. */
export type RawPiece = Omit<NestPiece, 'widthMm' | 'heightMm' | 'areaMm2'>;

export type Task =
  | { kind: 'motif'; svg: string }
  | { kind: 'layout'; input: LayoutTextInput }
  | { kind: 'compose'; input: ComposeInput }
  | { kind: 'nest'; rollWidthMm: number; pieces: RawPiece[]; grouping?: Grouping; weedingLines?: boolean }
  | { kind: 'worksheet'; input: Omit<WorksheetInput, 'onProgress'>; progress?: MessagePort }
  | { kind: 'image'; bytes: Uint8Array }
  | { kind: 'template'; input: TemplateInput };

export type TaskValue = {
  motif: MotifGeometry;
  layout: TextLayout;
  compose: ComposedItem;
  nest: NestedSheet[];
  worksheet: Uint8Array;
  image: ProcessedImage;
  template: Uint8Array;
};
export type TaskKind = Task['kind'];

/** An error as data: its class name and the fields its class carries. */
export type TaskError = { name: string; message: string; code?: string; status?: number; fields?: Record<string, string>; fieldId?: string; limit?: string };
export type TaskResult<K extends TaskKind = TaskKind> = { ok: true; value: TaskValue[K] } | { ok: false; error: TaskError };

const r3 = (v: number) => Math.round(v * 1000) / 1000;

/**
 * Measures each piece's cut outline (an empty one cuts nothing and is left out) and nests them on
 * the roll by outline, the box packer as floor (shared/engine/outline-nest.ts). The nest sees the
 * same outline the SVG and the work sheet draw (withCutOutlines), so its gap holds for the cut.
 */
export function measureAndNest(rollWidthMm: number, raw: RawPiece[], opts: Pick<NestInput, 'gapMm' | 'marginMm'> & { grouping?: Grouping; weedingLines?: boolean } = {}): NestedSheet[] {
  const pieces: NestPiece[] = [];
  for (const p of withCutOutlines(raw)) {
    const path = parsePathData(p.path);
    const bb = pathBBox(path);
    const w = bb.maxX - bb.minX;
    const h = bb.maxY - bb.minY;
    if (!(w > 0 && h > 0)) continue;
    // a hair over the outline's bbox so float noise never makes the path larger than its slot
    pieces.push({ ...p, widthMm: r3(w) + 0.002, heightMm: r3(h) + 0.002, areaMm2: pathArea(path) });
  }
  const { grouping, weedingLines, ...spacing } = opts;
  const input = { rollWidthMm, pieces, ...spacing };
  if (grouping !== 'order') return nestPieces(input);
  // keep each order together; the tightest nest's length rides along, to show what grouping costs
  const tightest = nestPieces(input).reduce((s, sh) => s + sh.lengthMm, 0);
  return nestOrderGroups(input, { weedingLines: weedingLines ?? false }).map((sh) => ({ ...sh, tightestLengthMm: tightest }));
}

/** A nested sheet from the worker: with order groups, its borders, lines and the tightest length. */
export type NestedSheet = CutSheet & Partial<Pick<GroupedSheet, 'groups' | 'weedingLines'>> & { tightestLengthMm?: number };

async function perform(task: Task): Promise<TaskValue[TaskKind]> {
  switch (task.kind) {
    case 'motif':
      return parseMotifSvg(task.svg);
    case 'layout':
      return layoutText(getFontRegistry(), task.input);
    case 'compose':
      return compose(getFontRegistry(), task.input);
    case 'nest':
      return measureAndNest(task.rollWidthMm, task.pieces, { grouping: task.grouping, weedingLines: task.weedingLines });
    case 'worksheet': {
      const port = task.progress;
      try {
        return await buildWorksheetPdf({ ...task.input, onProgress: port ? (f) => port.postMessage(f) : undefined });
      } finally {
        port?.close();
      }
    }
    case 'image':
      return processImage(task.bytes);
    case 'template':
      return buildTemplatePdf(task.input);
  }
}

function asData(e: unknown): TaskError {
  if (!(e instanceof Error)) return { name: 'Error', message: String(e) };
  const out: TaskError = { name: e.name, message: e.message };
  if (e instanceof AppError) Object.assign(out, { status: e.status, code: e.code, fields: e.fields });
  else if (e instanceof MotifError) out.code = e.code;
  else if (e instanceof ComposeError) out.fieldId = e.fieldId;
  else if (e instanceof CutSheetError) Object.assign(out, { code: e.code, fields: e.fields });
  else if (e instanceof LimitError) out.limit = e.limit;
  else if (e instanceof LayoutError) out.code = e.code;
  else {
    // an unexpected failure: logged here with its stack, reported by the request thread as a 500
    console.error('worker task failed', e);
    out.name = 'Error';
  }
  return out;
}

/** What the pool posts: the task, and a port on which the worker says when it starts on it. */
export type TaskMessage = { task: Task; started?: MessagePort };

/**
 * What piscina calls (worker.mjs): tells the pool it has started (its time limit runs from here,
 * not from when the task was queued or the thread was still loading), then works. Never throws for
 * an expected refusal: that comes back as data.
 */
export async function runTask({ task, started }: TaskMessage): Promise<TaskResult> {
  started?.postMessage('started');
  started?.close();
  try {
    return { ok: true, value: await perform(task) };
  } catch (e) {
    return { ok: false, error: asData(e) };
  }
}
