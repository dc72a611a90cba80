// The blank a line is shown and pressed on: the listing's content as sold (personalisation, top
// offset) and the blank with its print area, for the proof and the press card.
import { defaultBlank } from '../../../shared/engine/blanks.ts';
import type { LineSnapshot } from '../../../shared/schemas/cart.ts';
import { type Personalisation, personalisationSchema } from '../../../shared/schemas/listing.ts';
import type { Proof } from '../../../shared/schemas/workroom.ts';
import type { Db } from '../../db/client.ts';
import { workroomRepo as repo } from './workroom.repo.ts';

export function listingContent(db: Db, listingId: string): { personalisation: Personalisation | null; topOffsetMm: number | null } {
  const l = repo.listing(db, listingId);
  const c = l?.live ?? l?.draft;
  const p = personalisationSchema.safeParse(c?.personalisation);
  return { personalisation: p.success ? p.data : null, topOffsetMm: typeof c?.blank?.topOffsetMm === 'number' ? c.blank.topOffsetMm : null };
}

export function proofBlank(s: LineSnapshot, topOffsetMm: number | null): Proof['blank'] {
  const base = defaultBlank(s.blank.kind) ?? defaultBlank('tote')!;
  const top = topOffsetMm ?? base.topOffsetMm;
  return {
    kind: s.blank.kind,
    name: s.blank.label || base.name,
    widthMm: base.widthMm,
    heightMm: base.heightMm,
    printArea: { xMm: (base.widthMm - s.blank.widthMm) / 2, yMm: top, widthMm: s.blank.widthMm, heightMm: s.blank.heightMm },
  };
}
