// The 1:1 placement template of one line (server/workers/template-pdf.ts builds it in the worker
// pool): the line's design, where it sits on the blank, and the print area.
import { defaultBlank } from '../../../shared/engine/blanks.ts';
import type { Paper } from '../../../shared/schemas/workroom.ts';
import type { Db } from '../../db/client.ts';
import type { TemplateInput } from '../../workers/template-pdf.ts';
import { listingContent, proofBlank } from './blank-view.ts';
import { lineSnapshot, ownLine, type WorkroomPoolDeps } from './lines.service.ts';

/**
 * What the template draws for a line of this shop (404 for another shop's line). The print area is
 * the proof's (proofBlank: the listing's print area and top offset on the blank's default size).
 * Seam for sizes: when a line records its blank size, take that size's print area and blank size
 * here — the template itself draws whatever print area and blank it is given.
 */
export function templateInput(db: Db, shopId: string, lineId: string, paper: Paper): TemplateInput {
  const row = ownLine(db, shopId, lineId);
  const s = lineSnapshot(row.line);
  const { topOffsetMm } = listingContent(db, row.line.listingId);
  const b = proofBlank(s, topOffsetMm);
  const base = defaultBlank(s.blank.kind) ?? defaultBlank('tote')!;
  return {
    paper,
    orderNumber: row.order.number,
    title: s.listingTitle.slice(0, 200),
    text: s.summary
      .map((x) => x.value)
      .join(' · ')
      .slice(0, 500),
    blank: { name: b.name.slice(0, 120), widthMm: b.widthMm, heightMm: b.heightMm, topOffsetFrom: base.topOffsetFrom },
    printArea: b.printArea,
    pieces: s.geometry.pieces.map((p) => ({ d: p.d, colourHex: /^#[0-9a-f]{6}$/i.test(p.colourHex) ? p.colourHex : '#1f2a44' })),
  };
}

export async function placementTemplate(deps: WorkroomPoolDeps, shopId: string, lineId: string, paper: Paper): Promise<{ pdf: Buffer; name: string }> {
  const input = templateInput(deps.db, shopId, lineId, paper);
  const u = await deps.pool.run({ kind: 'template', input });
  const pdf = Buffer.isBuffer(u) ? u : Buffer.from(u.buffer, u.byteOffset, u.byteLength);
  return { pdf, name: `placement-template-${input.orderNumber.replace(/[^A-Za-z0-9-]+/g, '-')}-${lineId.slice(0, 8)}.pdf` };
}
