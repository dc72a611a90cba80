import type { ReactNode } from 'react';
import { type Blank, defaultBlank } from '../../../shared/engine/blanks.ts';
import { blankFor } from '../../../shared/engine/listing-design.ts';
import { offerColour, type ResolvedBlankOffer } from '../../../shared/schemas/blanks.ts';
import { MM_PER_IN } from '../../../shared/units.ts';

/**
 * The one drawing of a design on its blank, used wherever a blank is shown: the live personaliser,
 * cart and order thumbnails, the workroom proof, the moderation preview and listing cards.
 * One SVG user unit is one millimetre; the blank is laid flat with its top-left corner at 0,0 (the
 * engine's coordinates, shared/engine/blanks.ts), so any design the engine placed drops in as is.
 */

/** What the drawing needs to know about a blank: its kind, size and (when known) the print area. */
export type BlankPicture = {
  kind: string;
  widthMm: number;
  heightMm: number;
  /** the print area on the blank, mm from its top-left corner; left out on small thumbnails */
  printArea?: { xMm: number; yMm: number; widthMm: number; heightMm: number } | null;
  /** the blank's colour (`#rrggbb`, a shop's blank colour); the kind's plain cloth when left out */
  colourHex?: string | null;
};

/**
 * An engine blank as a picture: the print area centred across, `topOffsetMm` down (shared/engine/compose.ts
 * places it so). A chosen size's print area comes in through the engine blank (blankFor); its colour as `colourHex`.
 */
export function pictureOfBlank(b: Pick<Blank, 'kind' | 'widthMm' | 'heightMm' | 'printArea' | 'topOffsetMm'>, colourHex?: string | null): BlankPicture {
  return {
    kind: b.kind,
    widthMm: b.widthMm,
    heightMm: b.heightMm,
    printArea: { xMm: (b.widthMm - b.printArea.widthMm) / 2, yMm: b.topOffsetMm, widthMm: b.printArea.widthMm, heightMm: b.printArea.heightMm },
    colourHex: colourHex ?? null,
  };
}

/**
 * A listing's blank as it is first shown (listing page, social image): the listing's print area, in
 * the colour the shop shows first when the listing offers colours.
 */
export function pictureOfListingBlank(listing: { content: Parameters<typeof blankFor>[0]; blankOffer: Pick<ResolvedBlankOffer, 'colours' | 'defaultColourId'> | null }): BlankPicture {
  return pictureOfBlank(blankFor(listing.content), offerColour(listing.blankOffer, listing.blankOffer?.defaultColourId)?.hex ?? null);
}

/** A blank kind alone (a listing card without a photo): the engine's default size and print area. */
export function pictureOfKind(kind: string): BlankPicture | null {
  const b = defaultBlank(kind);
  return b ? pictureOfBlank(b) : null;
}

/**
 * The blank of a cart or order line: the snapshot keeps the kind and the print area's size only,
 * so the blank takes the engine's default size (as the server's proof does) and no print area is
 * drawn (where the seller put it is not in the snapshot).
 */
export function pictureOfLineBlank(blank: { kind: string; colourHex?: string | null }): BlankPicture {
  const b = defaultBlank(blank.kind) ?? defaultBlank('tote')!;
  return { kind: blank.kind, widthMm: b.widthMm, heightMm: b.heightMm, printArea: null, colourHex: blank.colourHex ?? null };
}

const INK = '#1f2a44';
const INK_SOFT = '#4a5470';
const CLOTH_PLAIN = '#efe6d4';
const TEE_PLAIN = '#ffffff';
const THREAD = '#2f7d6d';
const THREAD_DEEP = '#23604f';
const FONT = 'Nunito Variable, Nunito, sans-serif';

const isTee = (kind: string) => kind === 'kids_tee' || kind === 'adult_tee';

/** How far handles and drawstrings reach above the blank's own box, mm. */
export function headroomMm(kind: string, heightMm: number): number {
  return kind === 'tote' ? heightMm * 0.25 : kind === 'drawstring_bag' ? heightMm * 0.12 : 4;
}

/** The outline of each kind of blank, laid flat: tee (kids and adult), tote, zip pouch, drawstring bag; filled with its colour. */
export function BlankOutline({ kind, widthMm: W, heightMm: H, colourHex }: Pick<BlankPicture, 'kind' | 'widthMm' | 'heightMm' | 'colourHex'>) {
  const stroke = { stroke: INK, strokeWidth: 2.5, strokeLinejoin: 'round' as const };
  const cloth = colourHex && /^#[0-9a-fA-F]{6}$/.test(colourHex) ? colourHex : null;
  const CLOTH = cloth ?? CLOTH_PLAIN;
  const TEE = cloth ?? TEE_PLAIN;
  if (isTee(kind)) {
    return (
      <path
        d={`M${W * 0.36} 0 Q${W / 2} ${W * 0.1} ${W * 0.64} 0 L${W * 0.82} ${H * 0.02} L${W} ${H * 0.2} L${W * 0.87} ${H * 0.3} L${W * 0.86} ${H} L${W * 0.14} ${H} L${W * 0.13} ${H * 0.3} L0 ${H * 0.2} L${W * 0.18} ${H * 0.02} Z`}
        fill={TEE}
        {...stroke}
      />
    );
  }
  if (kind === 'pouch') {
    return (
      <g>
        <rect x="0" y="0" width={W} height={H} rx="12" fill={CLOTH} {...stroke} />
        <line x1="8" y1="12" x2={W - 8} y2="12" stroke={INK_SOFT} strokeWidth="3" strokeDasharray="3 2" />
        <rect x={W - 34} y="6" width="20" height="12" rx="3" fill={INK_SOFT} />
      </g>
    );
  }
  if (kind === 'drawstring_bag') {
    return (
      <g>
        <path d={`M${W * 0.06} 20 Q${W * 0.25} ${-H * 0.12} ${W * 0.5} ${-H * 0.04} Q${W * 0.75} ${-H * 0.12} ${W * 0.94} 20`} fill="none" stroke={INK_SOFT} strokeWidth="3" />
        <rect x="0" y="0" width={W} height={H} rx="6" fill={CLOTH} {...stroke} />
        <line x1="0" y1="26" x2={W} y2="26" stroke={INK_SOFT} strokeWidth="1.5" />
      </g>
    );
  }
  // tote (and any kind we do not know yet: a plain bag shape)
  return (
    <g>
      {kind === 'tote' ? <path d={`M${W * 0.3} 2 C${W * 0.3} ${-H * 0.3} ${W * 0.7} ${-H * 0.3} ${W * 0.7} 2`} fill="none" stroke={INK} strokeWidth="9" strokeLinecap="round" /> : null}
      <rect x="0" y="0" width={W} height={H} rx="6" fill={CLOTH} {...stroke} />
    </g>
  );
}

const RULER_GAP = 14;
const RULER_H = 26;

/** A centimetre or inch ruler as long as the blank is wide, labelled every 5 cm / every inch. */
function Ruler({ y, lengthMm, unit }: { y: number; lengthMm: number; unit: 'cm' | 'in' }) {
  const step = unit === 'cm' ? 10 : MM_PER_IN / 4;
  const label = unit === 'cm' ? 5 : 4;
  const n = Math.floor(lengthMm / step + 1e-9);
  const ticks = [];
  for (let i = 0; i <= n; i++) {
    const x = i * step;
    const major = i % label === 0;
    const half = unit === 'cm' ? false : i % 2 === 0;
    ticks.push(<line key={i} x1={x} y1={y} x2={x} y2={y + (major ? 10 : half ? 7 : 4)} />);
    if (major) {
      ticks.push(
        <text key={`t${i}`} x={x + 1.5} y={y + 21} fontSize="10" fill={INK} stroke="none" fontFamily={FONT} fontWeight="700">
          {unit === 'cm' ? i : i / 4}
          {i === 0 ? ` ${unit}` : ''}
        </text>,
      );
    }
  }
  return (
    <g stroke={INK_SOFT} strokeWidth="0.8">
      <line x1="0" y1={y} x2={n * step} y2={y} />
      {ticks}
    </g>
  );
}

const safeHex = (h: string) => (/^#[0-9a-fA-F]{6}$/.test(h) ? h : INK);

/**
 * Engine pieces already placed on the blank (a line's frozen snapshot), in their own colours. Path
 * data is numbers and commands made by our engine, never user markup.
 */
export function DesignPieces({ pieces }: { pieces: ReadonlyArray<{ d: string; colourHex: string }> }) {
  return (
    <g>
      {pieces.map((p, i) => (
        // biome-ignore lint/suspicious/noArrayIndexKey: a frozen snapshot, never reordered or edited; a piece's place in it is its identity (two pieces may share path data)
        <path key={i} d={p.d} fill={safeHex(p.colourHex)} fillRule="nonzero" stroke={INK} strokeOpacity="0.25" strokeWidth="0.3" />
      ))}
    </g>
  );
}

type Props = {
  blank: BlankPicture;
  /** the accessible name of the picture; leave it out for a decorative one (hidden from assistive tech) */
  label?: string;
  /** the design, in the blank's millimetres (e.g. <DesignPieces>) */
  children?: ReactNode;
  /** centimetre and inch rulers under the blank, and the print area named */
  rulers?: boolean;
  /** a fixed square size in px (thumbnails); otherwise the drawing fills its box's width, or the whole box with `fit="box"` */
  size?: number;
  fit?: 'width' | 'box';
  className?: string;
  testId?: string;
};

/** The blank laid flat, to scale, with its print area dashed and the design on it. */
export function DesignOnBlank({ blank, label, children, rulers = false, size, fit = 'width', className = '', testId }: Props) {
  const W = blank.widthMm,
    H = blank.heightMm;
  const top = headroomMm(blank.kind, H) + 6;
  const bottom = rulers ? RULER_GAP + 2 * RULER_H + 4 : 8;
  const pa = blank.printArea;
  return (
    <svg
      viewBox={`-8 ${-top} ${W + 24} ${top + H + bottom}`}
      role={label ? 'img' : undefined}
      aria-label={label}
      aria-hidden={label ? undefined : true}
      width={size}
      height={size}
      preserveAspectRatio="xMidYMid meet"
      className={`${size ? 'shrink-0' : fit === 'box' ? 'size-full' : 'h-auto w-full'} ${className}`}
      data-testid={testId}
    >
      <BlankOutline kind={blank.kind} widthMm={W} heightMm={H} colourHex={blank.colourHex} />
      {pa ? (
        <>
          <rect x={pa.xMm} y={pa.yMm} width={pa.widthMm} height={pa.heightMm} fill="none" stroke={THREAD} strokeWidth="1.2" strokeDasharray="5 4" />
          {rulers ? (
            <text x={pa.xMm + 2} y={pa.yMm - 3} fontSize="9" fill={THREAD_DEEP} fontFamily={FONT} fontWeight="700">
              print area
            </text>
          ) : null}
        </>
      ) : null}
      {children}
      {rulers ? (
        <>
          <Ruler y={H + RULER_GAP} lengthMm={W} unit="cm" />
          <Ruler y={H + RULER_GAP + RULER_H} lengthMm={W} unit="in" />
        </>
      ) : null}
    </svg>
  );
}
