/**
 * Press cards: one item's pressing steps from its layers' materials and the shop's press type.
 * The rules (from memory unless DEVELOPERS.md, "Pressing", marks them): pre-press about 5 s; layers bottom →
 * top, every layer but the last gets a short tack of its own material's tack time, then its carrier
 * is peeled; a protective sheet whenever the press touches vinyl without a carrier; the final press
 * at the lowest temperature every layer accepts, for the top layer's time unless the seller
 * overrides; optional back press about 15 s; warnings for non-overlapping temperatures, a top-only
 * material that isn't last, and more than 4 layers. Settings come from a seller-editable table
 * (press-defaults.ts, the materials table); a layer's own profile overrides it. Pure.
 * Temperatures are kept in °C; °F is derived per NIST SP 811 (t/°F = 1.8 · t/°C + 32).
 */
import { z } from 'zod';
import { cToF, formatLength, formatTemperature } from '../units.ts';
import { BACK_PRESS_S, MATERIAL_KINDS, MAX_LAYERS, type MaterialKind, type Peel, PRE_PRESS_S, PRESS_DEFAULTS, type PressProfile } from './press-defaults.ts';

export const PRESS_TYPES = ['handheld', 'clamshell'] as const;
export type PressType = (typeof PRESS_TYPES)[number];

const pressSetting = z.object({ tempC: z.number().min(100).max(220), timeS: z.number().min(1).max(120) });
/** A seller's edits to one material's profile; anything left out comes from the defaults table. */
export const layerProfileSchema = z.object({
  handheld: pressSetting.partial().optional(),
  clamshell: pressSetting.partial().optional(),
  tackS: z.number().min(0).max(60).optional(),
  peel: z.enum(['hot', 'warm', 'cold', 'hot or cold']).optional(),
  topOnly: z.boolean().optional(),
  /**
   * The temperatures this material accepts, if its maker gives a range. The defaults table gives
   * one temperature per press type, so without a range a layer accepts exactly that temperature.
   */
  tempRangeC: z
    .object({ minC: z.number().min(100).max(220), maxC: z.number().min(100).max(220) })
    .refine((r) => r.minC <= r.maxC, 'The lowest temperature must not exceed the highest.')
    .optional(),
});
export type LayerProfile = z.infer<typeof layerProfileSchema>;

export const pressCardInputSchema = z.object({
  pressType: z.enum(PRESS_TYPES),
  /** Bottom → top. */
  layers: z
    .array(
      z.object({
        layerId: z.string().min(1).max(128),
        materialKind: z.enum(MATERIAL_KINDS),
        colourName: z.string().trim().min(1).max(40),
        profile: layerProfileSchema.optional(),
      }),
    )
    .min(1, 'An item needs at least one layer.')
    .max(12),
  blank: z.object({
    kind: z.string().min(1).max(40),
    name: z.string().max(80).optional(),
    topOffsetMm: z.number().min(0).max(1000),
    topOffsetFrom: z.enum(['top edge', 'collar']).optional(),
  }),
  backPress: z.boolean().optional(),
  /** The seller's own final press time, instead of the top layer's. */
  finalTimeS: z.number().min(1).max(120).optional(),
});
export type PressCardInput = z.input<typeof pressCardInputSchema>;

export type StepKind = 'pre_press' | 'place' | 'tack' | 'final_press' | 'back_press';

export interface PressStep {
  kind: StepKind;
  /** Short, printable instruction. */
  text: string;
  layerId?: string;
  tempC?: number;
  /** Exact conversion of tempC (NIST SP 811); round only for display. */
  tempF?: number;
  timeS?: number;
  protectiveSheet: boolean;
  /** After this step, peel the carrier of the layer just pressed: hot, warm or cold. */
  peel?: Peel;
}

export type PressWarningCode = 'temperatures_do_not_overlap' | 'top_only_not_last' | 'too_many_layers';
export interface PressWarning {
  code: PressWarningCode;
  message: string;
  layerIds?: string[];
}

export interface ResolvedLayer {
  layerId: string;
  materialKind: MaterialKind;
  colourName: string;
  tempC: number;
  timeS: number;
  minC: number;
  maxC: number;
  tackS: number;
  peel: Peel;
  topOnly: boolean;
}

export interface PressCard {
  pressType: PressType;
  /** The final press temperature: the lowest every layer accepts. */
  tempC: number;
  tempF: number;
  /** "157 °C (315 °F)" */
  tempLabel: string;
  finalTimeS: number;
  peel: Peel;
  layers: ResolvedLayer[];
  steps: PressStep[];
  warnings: PressWarning[];
  placementNote: string;
  /** "common practice" / "from memory": where the default settings come from (DEVELOPERS.md, "Pressing"). */
  notes: string[];
}

/** A material's settings: the defaults table row, overridden field by field by the seller's profile. */
export function resolveLayer(
  pressType: PressType,
  layer: { layerId: string; materialKind: MaterialKind; colourName: string; profile?: LayerProfile },
  table: Readonly<Record<MaterialKind, PressProfile>> = PRESS_DEFAULTS,
): ResolvedLayer {
  const base = table[layer.materialKind];
  const p = layer.profile ?? {};
  const setting = { ...base[pressType], ...(p[pressType] ?? {}) };
  const range = p.tempRangeC ?? { minC: setting.tempC, maxC: setting.tempC };
  return {
    layerId: layer.layerId,
    materialKind: layer.materialKind,
    colourName: layer.colourName,
    tempC: setting.tempC,
    timeS: setting.timeS,
    minC: Math.min(range.minC, range.maxC),
    maxC: Math.max(range.minC, range.maxC),
    tackS: p.tackS ?? base.tackS,
    peel: p.peel ?? base.peel,
    topOnly: p.topOnly ?? base.topOnly,
  };
}

const layerName = (l: ResolvedLayer) => `${l.colourName} ${l.materialKind}`;

/** Placement: centred horizontally, the top of the design `topOffsetMm` below the top edge or collar. */
export function placementNote(blank: { kind: string; name?: string; topOffsetMm: number; topOffsetFrom?: 'top edge' | 'collar' }): string {
  const isTee = /tee|shirt/i.test(blank.kind);
  const from = blank.topOffsetFrom ?? (isTee ? 'collar' : 'top edge');
  let note = `Centre the design horizontally on the ${blank.name ?? blank.kind.replace(/_/g, ' ')}; its top sits ${formatLength(blank.topOffsetMm)} below the ${from}.`;
  // Common practice: a tote rests on the ground; keep the design off its lower part.
  if (/tote|bag/i.test(blank.kind)) note += ' Keep the design in the upper half, off the lower part of the bag, which rests on the ground.';
  note += ' Lay the pieces on the blank to check the placement before any heat.';
  return note;
}

/** Builds the press card. Throws a ZodError on invalid input. */
export function pressCard(input: PressCardInput, table: Readonly<Record<MaterialKind, PressProfile>> = PRESS_DEFAULTS): PressCard {
  const inp = pressCardInputSchema.parse(input);
  const layers = inp.layers.map((l) => resolveLayer(inp.pressType, l, table));
  const top = layers.at(-1);
  if (!top) throw new Error('pressCard: the input schema requires at least one layer');
  const warnings: PressWarning[] = [];

  // The lowest temperature every layer accepts: the highest of the lowest each one accepts.
  const lo = Math.max(...layers.map((l) => l.minC));
  const hi = Math.min(...layers.map((l) => l.maxC));
  const tempC = lo;
  if (lo > hi) {
    warnings.push({
      code: 'temperatures_do_not_overlap',
      message:
        `The layers' temperatures don't overlap (${layers.map((l) => `${layerName(l)} ${formatTemperature(l.tempC)}`).join(', ')}). ` +
        `The card uses ${formatTemperature(tempC)}; check each maker's instructions, or give the materials a temperature range in their press profiles.`,
      layerIds: layers.filter((l) => l.maxC < lo || l.minC > hi).map((l) => l.layerId),
    });
  }
  const misplaced = layers.slice(0, -1).filter((l) => l.topOnly);
  if (misplaced.length) {
    warnings.push({
      code: 'top_only_not_last',
      message: `${misplaced.map(layerName).join(', ')} must be the top layer: nothing may be pressed onto ${misplaced.length > 1 ? 'them' : 'it'}.`,
      layerIds: misplaced.map((l) => l.layerId),
    });
  }
  if (layers.length > MAX_LAYERS) {
    warnings.push({ code: 'too_many_layers', message: `${layers.length} layers: keep to at most ${MAX_LAYERS} on one item.` });
  }

  const temp = { tempC, tempF: cToF(tempC) };
  const t = formatTemperature(tempC);
  const steps: PressStep[] = [
    { kind: 'pre_press', text: `Pre-press the blank at ${t} for about ${PRE_PRESS_S} s to drive out moisture and flatten it; let it cool.`, ...temp, timeS: PRE_PRESS_S, protectiveSheet: false },
  ];
  // The first layer goes down with its carrier on top; once that carrier is peeled, every later
  // press touches bare vinyl somewhere, so it needs the protective sheet.
  let bareVinyl = false;
  layers.forEach((l, i) => {
    const last = i === layers.length - 1;
    steps.push({ kind: 'place', text: `Place layer ${i + 1} of ${layers.length}: ${layerName(l)}, carrier up.`, layerId: l.layerId, protectiveSheet: false });
    if (!last) {
      steps.push({
        kind: 'tack',
        text: `Tack ${layerName(l)} for ${l.tackS} s at ${t}${bareVinyl ? ' under a protective sheet' : ''}; peel its carrier ${l.peel}.`,
        layerId: l.layerId,
        ...temp,
        timeS: l.tackS,
        protectiveSheet: bareVinyl,
        peel: l.peel,
      });
      bareVinyl = true;
    }
  });
  const finalTimeS = inp.finalTimeS ?? top.timeS;
  steps.push({
    kind: 'final_press',
    text: `Final press at ${t} for ${finalTimeS} s${bareVinyl ? ' under a protective sheet' : ''}; peel ${top.peel}. If the vinyl lifts, let it cool and peel again — more heat is not the fix.`,
    layerId: top.layerId,
    ...temp,
    timeS: finalTimeS,
    protectiveSheet: bareVinyl,
    peel: top.peel,
  });
  if (inp.backPress) {
    steps.push({
      kind: 'back_press',
      text: `Turn the item over and press from the back at ${t} for about ${BACK_PRESS_S} s, under a protective sheet.`,
      ...temp,
      timeS: BACK_PRESS_S,
      protectiveSheet: true,
    });
  }

  const kinds = new Set(layers.map((l) => l.materialKind));
  const notes = [
    kinds.has('smooth') ? 'Smooth PU settings: common practice (no published source).' : '',
    [...kinds].some((k) => k !== 'smooth') ? "Other materials: defaults from memory; follow the maker's instructions where they differ." : '',
    inp.layers.some((l) => l.profile) ? "Some settings come from the shop's own press profiles." : '',
  ].filter(Boolean);

  return {
    pressType: inp.pressType,
    ...temp,
    tempLabel: t,
    finalTimeS,
    peel: top.peel,
    layers,
    steps,
    warnings,
    placementNote: placementNote(inp.blank),
    notes,
  };
}
