/**
 * Press cards: one item's pressing steps from its layers' materials and the shop's press type.
 * The rules (from memory unless DEVELOPERS.md, "Pressing", marks them): pre-press about 5 s; layers in
 * press steps from the geometry (press-order.ts: layers that don't overlap share a step, overlapping
 * ones go bottom → top), every step but the last gets a short tack (the longest tack time of its
 * materials), then its carriers are peeled, after a cool-down for a warm or cold peel; a protective sheet whenever the press touches vinyl without a carrier; the final press
 * at the lowest temperature every layer accepts, for the top layer's time unless the seller
 * overrides; optional back press about 15 s; warnings for non-overlapping temperatures, a top-only
 * material with an overlapping layer above it (no valid order), and more than 4 layers. Settings come from a seller-editable table
 * (press-defaults.ts, the materials table); a layer's own profile overrides it. Pure.
 * Temperatures are kept in °C; °F is derived per NIST SP 811 (t/°F = 1.8 · t/°C + 32).
 */
import { z } from 'zod';
import { cToF, formatLength, formatTemperature } from '../units.ts';
import { BACK_PRESS_S, MATERIAL_KINDS, MAX_LAYERS, type MaterialKind, type Peel, PRE_PRESS_S, PRESS_DEFAULTS, type PressProfile } from './press-defaults.ts';
import { pressOrder } from './press-order.ts';

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
  coolS: z.number().min(0).max(120).optional(),
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
  /**
   * Pairs of layer ids whose vinyl overlaps, from the design's geometry (press-order.ts
   * `layerOverlaps`). Left out: the geometry is unknown and every pair is taken to overlap.
   */
  overlaps: z
    .array(z.tuple([z.string().min(1).max(128), z.string().min(1).max(128)]))
    .max(78)
    .optional(),
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
  /** Every layer the step places or presses together (layers that don't overlap share a step). */
  layerIds?: string[];
  tempC?: number;
  /** Exact conversion of tempC (NIST SP 811); round only for display. */
  tempF?: number;
  timeS?: number;
  protectiveSheet: boolean;
  /** After this step, peel the carrier of the layer just pressed: hot, warm or cold. */
  peel?: Peel;
  /** Seconds to let it cool before a warm or cold peel (from the press tables); absent for a hot peel. */
  coolS?: number;
}

export type PressWarningCode = 'temperatures_do_not_overlap' | 'top_only_covered' | 'too_many_layers';
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
  coolS: number;
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
  /** Press steps bottom → top, each the layer ids pressed together (press-order.ts). */
  groups: string[][];
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
    coolS: p.coolS ?? base.coolS ?? 0,
    topOnly: p.topOnly ?? base.topOnly,
  };
}

const layerName = (l: ResolvedLayer) => `${l.colourName} ${l.materialKind}`;

const PEEL_COOLNESS: Record<Peel, number> = { 'hot or cold': 0, hot: 1, warm: 2, cold: 3 };
/** The peel for layers pressed together: the coolest any of them needs ('hot or cold' suits any). */
function groupPeel(g: ResolvedLayer[]): Peel {
  return g.reduce<Peel>((p, l) => (PEEL_COOLNESS[l.peel] > PEEL_COOLNESS[p] ? l.peel : p), 'hot or cold');
}
/** The cool-down before that peel: the longest of the layers that ask for a warm or cold peel. */
function coolFor(g: ResolvedLayer[], peel: Peel): number {
  if (peel !== 'warm' && peel !== 'cold') return 0;
  return Math.max(0, ...g.filter((l) => l.peel === 'warm' || l.peel === 'cold').map((l) => l.coolS));
}
const peelWords = (peel: Peel, coolS: number) => (coolS ? `let it cool ${coolS} s, then peel ${peel}` : `peel ${peel}`);

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
  const order = pressOrder(layers, inp.overlaps ?? null);
  const byId = new Map(layers.map((l) => [l.layerId, l]));
  const named = (ids: string[]) => ids.map((id) => layerName(byId.get(id)!)).join(' and ');
  for (const c of order.conflicts) {
    warnings.push({
      code: 'top_only_covered',
      message:
        `${named([c.layerId])} must stay on top where layers overlap, but this design puts ${named(c.coveredBy)} over it, ` +
        'so no press order works: nothing may be pressed onto it. Change the design, or use a material that takes another layer, before cutting.',
      layerIds: [c.layerId, ...c.coveredBy],
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
  // The first step's layers go down with their carriers on top; once those are peeled, every later
  // press touches bare vinyl somewhere, so it needs the protective sheet.
  let bareVinyl = false;
  let placed = 0;
  const groups = order.groups.map((ids) => ids.map((id) => byId.get(id)!));
  groups.forEach((g, i) => {
    const last = i === groups.length - 1;
    const ids = g.map((l) => l.layerId);
    const nums = g.map((_, k) => placed + k + 1);
    placed += g.length;
    const which = g.length === 1 ? `layer ${nums[0]} of ${layers.length}` : `layers ${nums.join(', ')} of ${layers.length} together (they don't overlap)`;
    steps.push({ kind: 'place', text: `Place ${which}: ${named(ids)}, carrier up.`, layerId: ids[0], layerIds: ids, protectiveSheet: false });
    if (!last) {
      const tackS = Math.max(...g.map((l) => l.tackS));
      const peel = groupPeel(g);
      const coolS = coolFor(g, peel);
      steps.push({
        kind: 'tack',
        text: `Tack ${named(ids)} for ${tackS} s at ${t}${bareVinyl ? ' under a protective sheet' : ''}; ${peelWords(peel, coolS)}.`,
        layerId: ids[0],
        layerIds: ids,
        ...temp,
        timeS: tackS,
        protectiveSheet: bareVinyl,
        peel,
        ...(coolS ? { coolS } : {}),
      });
      bareVinyl = true;
    }
  });
  const topGroup = groups.at(-1)!;
  const finalTimeS = inp.finalTimeS ?? Math.max(...topGroup.map((l) => l.timeS));
  const finalPeel = groupPeel(topGroup);
  const finalCool = coolFor(topGroup, finalPeel);
  steps.push({
    kind: 'final_press',
    text: `Final press at ${t} for ${finalTimeS} s${bareVinyl ? ' under a protective sheet' : ''}; ${peelWords(finalPeel, finalCool)}. If the vinyl lifts, let it cool and peel again — more heat is not the fix.`,
    layerId: topGroup[0]!.layerId,
    layerIds: topGroup.map((l) => l.layerId),
    ...temp,
    timeS: finalTimeS,
    protectiveSheet: bareVinyl,
    peel: finalPeel,
    ...(finalCool ? { coolS: finalCool } : {}),
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
    peel: finalPeel,
    layers,
    groups: order.groups,
    steps,
    warnings,
    placementNote: placementNote(inp.blank),
    notes,
  };
}
