// Proofs: what the seller checks before anything is cut (the text letter by letter, warnings, the
// versions the shopper made), and the two answers — approve, or ask the shopper for a change.
// Both move the line through the order-line state machine (orders' transition()).

import { defaultBlank, usableArea } from '../../../shared/engine/blanks.ts';
import { fitText, textWarnings } from '../../../shared/engine/fit.ts';
import { blankFor } from '../../../shared/engine/listing-design.ts';
import type { LineSnapshot } from '../../../shared/schemas/cart.ts';
import type { Personalisation } from '../../../shared/schemas/listing.ts';
import type { CharInfo, Proof, ProofText, ProofVersion, ProofWarning, WorkLine } from '../../../shared/schemas/workroom.ts';
import { formatSmallLength } from '../../../shared/units.ts';
import type { Db } from '../../db/client.ts';
import { notFound } from '../../http/app-error.ts';
import { getFontRegistry } from '../../integrations/fonts.ts';
import { assertEachCanMove, transition, transitionAll } from '../orders/index.ts';
import { listingContent, proofBlank } from './blank-view.ts';
import { lineSnapshot, lineText, lineTitle, lineViews, ownLine, type WorkroomDeps } from './lines.service.ts';
import { pressCardFor } from './press.service.ts';
import { workroomRepo as repo } from './workroom.repo.ts';
import { changeRequestMail, inProductionMail } from './workroom-mails.ts';

/** Characters people mistake for others or can't see; named on the proof. */
const CHAR_NAMES: Record<number, string> = {
  0x20: 'space',
  0xa0: 'no-break space',
  0x2007: 'figure space',
  0x200b: 'zero-width space',
  0x200c: 'zero-width non-joiner',
  0x200d: 'zero-width joiner',
  0x2060: 'word joiner',
  0xfeff: 'zero-width no-break space',
  0x09: 'tab',
  0x300: 'combining grave accent',
  0x301: 'combining acute accent',
  0x302: 'combining circumflex',
  0x303: 'combining tilde',
  0x304: 'combining macron',
  0x306: 'combining breve',
  0x307: 'combining dot above',
  0x308: 'combining diaeresis',
  0x30a: 'combining ring above',
  0x30b: 'combining double acute',
  0x30c: 'combining caron',
  0x327: 'combining cedilla',
  0x328: 'combining ogonek',
  0x2018: 'left single quotation mark',
  0x2019: 'right single quotation mark (apostrophe)',
  0x2010: 'hyphen',
  0x2013: 'en dash',
  0x2014: 'em dash',
  0x0430: 'Cyrillic small a',
  0x0435: 'Cyrillic small ie',
  0x043e: 'Cyrillic small o',
  0x0440: 'Cyrillic small er',
  0x0441: 'Cyrillic small es',
  0x0456: 'Cyrillic small i',
};
const hex = (cp: number) => `U+${cp.toString(16).toUpperCase().padStart(4, '0')}`;

/** The text letter by letter: one entry per code point, so a combining mark is its own entry. */
export function charsOf(text: string): CharInfo[] {
  return [...text].map((ch) => {
    const cp = ch.codePointAt(0)!;
    return { char: ch, codePoints: [hex(cp)], ascii: cp >= 0x20 && cp < 0x7f, name: CHAR_NAMES[cp] ?? (/\p{M}/u.test(ch) ? 'combining mark' : null) };
  });
}

function normalForm(text: string): ProofText['normalized'] {
  if (/^[\x20-\x7e]*$/.test(text)) return 'ascii';
  const nfc = text.normalize('NFC') === text;
  const nfd = text.normalize('NFD') === text;
  return nfc ? 'NFC' : nfd ? 'NFD' : 'mixed';
}

/**
 * Warnings for the seller: the engine's text warnings on the text exactly as typed (extra spaces,
 * mixed case), the fit warnings at the blank's size (small letters, very long name, characters the
 * font can't draw), and a note when the text holds letters outside ASCII or combining marks.
 */
export function proofWarnings(s: LineSnapshot, p: Personalisation | null, topOffsetMm: number | null): { texts: ProofText[]; warnings: ProofWarning[] } {
  const registry = getFontRegistry();
  const base = defaultBlank(s.blank.kind) ?? defaultBlank('tote')!;
  // the blank as the cart composed on it (the listing's print area and top offset)
  const blank = blankFor({ blank: { ...s.blank, topOffsetMm: topOffsetMm ?? base.topOffsetMm } });
  const area = usableArea(blank);
  const entries = Object.entries(s.choices.texts).filter(([, t]) => t.text.trim() !== '');
  const blocks = entries.length + (s.choices.motifId ? 1 : 0);
  const stackGaps = Math.max(0, blocks - 1) * 8;
  const texts: ProofText[] = [];
  const warnings: ProofWarning[] = [];
  for (const [fieldId, t] of entries) {
    const field = p?.textFields.find((f) => f.id === fieldId);
    const label = field?.label ?? fieldId;
    texts.push({ fieldId, label, text: t.text, fontId: t.fontId, letterHeightMm: null, chars: charsOf(t.text), normalized: normalForm(t.text) });
    for (const w of textWarnings(t.text)) warnings.push({ code: w.code, fieldId, message: `${label}: ${w.message}` });
    try {
      // The motif takes about 55 % of the height (cart/design.ts); the text gets what is left.
      const motifShare = s.choices.motifId ? Math.min(blank.printArea.heightMm * 0.55, 120) : 0;
      const fitted = fitText(
        registry,
        { text: t.text.trim(), fontId: t.fontId, letterHeightMm: t.letterHeightMm },
        {
          maxWidthMm: area.widthMm,
          maxHeightMm: Math.max(1, area.heightMm - stackGaps - motifShare),
          maxChars: field?.maxLength,
        },
      );
      texts[texts.length - 1]!.letterHeightMm = Math.round(fitted.letterHeightMm * 10) / 10;
      for (const w of fitted.warnings) {
        if (w.code === 'extra_spaces' || w.code === 'mixed_case') continue; // already said on the raw text
        warnings.push({ code: w.code, fieldId, message: `${label}: ${w.message}` });
      }
      if (fitted.scale < 0.999 && !fitted.warnings.some((w) => w.code === 'too_long')) {
        warnings.push({
          code: 'shrunk_to_fit',
          fieldId,
          message: `${label}: shrunk to ${formatSmallLength(fitted.letterHeightMm)} letters to fit the print area (chosen ${formatSmallLength(t.letterHeightMm)}).`,
        });
      }
    } catch {
      warnings.push({ code: 'font_unavailable', fieldId, message: `${label}: the font ${t.fontId} is not available on this server.` });
    }
    const outside = [...new Set([...t.text].filter((c) => !/[\x20-\x7e]/.test(c)))];
    if (outside.length) {
      warnings.push({
        code: 'non_ascii',
        fieldId,
        message: `${label}: contains ${outside.map((c) => `“${/\p{M}/u.test(c) ? `◌${c}` : c}” ${hex(c.codePointAt(0)!)}`).join(', ')} — check the spelling letter by letter.`,
      });
    }
    if (normalForm(t.text) === 'NFD' || normalForm(t.text) === 'mixed') {
      warnings.push({ code: 'combining_marks', fieldId, message: `${label}: an accent is typed as a separate combining mark; the cut comes out the same, but check it sits on the right letter.` });
    }
  }
  return { texts, warnings };
}

export function proof(db: Db, shopId: string, lineId: string): Proof {
  const row = ownLine(db, shopId, lineId);
  const s = lineSnapshot(row.line);
  const { personalisation, topOffsetMm } = listingContent(db, row.line.listingId);
  const { texts, warnings } = proofWarnings(s, personalisation, topOffsetMm);
  // the press order from the design's geometry: a seller hears before cutting when none works
  for (const w of pressCardFor(db, shopId, row).card.warnings) if (w.code === 'top_only_covered') warnings.push({ code: w.code, fieldId: null, message: `Pressing: ${w.message}` });
  const versions = repo.versions(db, row.line.id);
  const authors = new Map(
    repo
      .users(
        db,
        versions.map((v) => v.authorId).filter((x): x is string => !!x),
      )
      .map((u) => [u.id, u.name]),
  );
  const events = repo.events(db, [row.line.id]);
  const lastRequest = [...events].reverse().find((e) => e.toState === 'changes_requested');
  return {
    line: lineViews(db, shopId, [row])[0]!,
    snapshot: s,
    blank: proofBlank(s, topOffsetMm),
    texts,
    warnings,
    versions: versions.map((v): ProofVersion => {
      const vs = v.snapshot;
      return {
        version: v.version,
        createdAt: v.createdAt,
        authorName: v.authorId ? (authors.get(v.authorId) ?? null) : null,
        summary: vs.summary,
        texts: Object.values(vs.choices.texts).map((t) => t.text),
      };
    }),
    changeRequest: row.line.state === 'changes_requested' ? (lastRequest?.message ?? null) : null,
  };
}

/**
 * Approves one or more proofs (all or nothing): each must be the shop's and awaiting its proof. The
 * shopper is e-mailed that the item is in production (`mail: false` only for the demo's history).
 */
export function approve(deps: WorkroomDeps, shopId: string, actorId: string, lineIds: string[], opts: { mail?: boolean } = {}): WorkLine[] {
  const { db } = deps;
  const rows = repo.linesByIds(db, shopId, lineIds);
  if (rows.length !== lineIds.length) throw notFound('Some of these lines were not found in your shop.');
  assertEachCanMove(
    rows.map((r) => ({ id: r.line.id, state: r.line.state, name: r.order.number })),
    'approved',
    'shop',
    'Only proofs waiting for a check can be approved',
  );
  const at = deps.now();
  transitionAll(
    db,
    rows.map((r) => ({ line: r.line, to: 'approved' as const, actor: 'shop' as const, actorId, at, message: `Proof approved (version ${r.line.version}).` })),
  );
  if (opts.mail !== false) sendInProductionMails(deps, shopId, rows);
  return lineViews(db, shopId, repo.linesByIds(db, shopId, lineIds));
}

/** One "in production" e-mail per order whose lines were just approved (sent after the answer; a failure is logged). */
function sendInProductionMails(deps: WorkroomDeps, shopId: string, rows: ReturnType<typeof repo.linesByIds>) {
  const shop = repo.shop(deps.db, shopId);
  const byOrder = new Map<string, typeof rows>();
  for (const r of rows) byOrder.set(r.order.id, [...(byOrder.get(r.order.id) ?? []), r]);
  const buyers = new Map(repo.users(deps.db, [...new Set(rows.map((r) => r.order.buyerId))]).map((u) => [u.id, u]));
  for (const group of byOrder.values()) {
    const { order } = group[0]!;
    const buyer = buyers.get(order.buyerId);
    if (!buyer) continue;
    const items = group.map((r) => {
      const text = lineText(lineSnapshot(r.line));
      return `${r.line.listingTitle}${text ? ` — “${text}”` : ''}`;
    });
    deps.mailer
      .send(inProductionMail(buyer, { shopName: shop?.name ?? 'The shop', orderNumber: order.number, orderId: order.id, items }, deps.env.baseUrl))
      .catch((e: unknown) => console.error('workroom: in-production e-mail failed', e));
  }
}

export async function requestChange(deps: WorkroomDeps, shopId: string, actorId: string, lineId: string, message: string): Promise<WorkLine> {
  const { db } = deps;
  const row = ownLine(db, shopId, lineId);
  assertEachCanMove([{ id: row.line.id, state: row.line.state, name: row.order.number }], 'changes_requested', 'shop', 'Only proofs waiting for a check can be sent back for a change');
  transition(db, { line: row.line, to: 'changes_requested', actor: 'shop', actorId, at: deps.now(), message });
  const buyer = repo.users(db, [row.order.buyerId])[0];
  const shop = repo.shop(db, shopId);
  if (buyer) {
    await deps.mailer
      .send(
        changeRequestMail(
          buyer,
          { shopName: shop?.name ?? 'The shop', orderNumber: row.order.number, orderId: row.order.id, lineTitle: lineTitle(row.line), text: lineText(lineSnapshot(row.line)), message },
          deps.env.baseUrl,
        ),
      )
      .catch((e: unknown) => console.error('workroom: change-request e-mail failed', e));
  }
  return lineViews(db, shopId, [ownLine(db, shopId, lineId)])[0]!;
}
