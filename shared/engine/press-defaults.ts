/**
 * Default press profiles per material kind (DEVELOPERS.md, "Pressing"; defaults from memory; the
 * smooth PU press values are common practice). Every value is a seller-editable default, never a
 * hard-wired rule. Temperatures in °C (stored), times in seconds.
 */
export const MATERIAL_KINDS = ['smooth', 'glitter', 'flock', 'metallic', 'patterned'] as const;
export type MaterialKind = (typeof MATERIAL_KINDS)[number];

export type Peel = 'hot' | 'warm' | 'cold' | 'hot or cold';

export interface PressProfile {
  handheld: { tempC: number; timeS: number };
  clamshell: { tempC: number; timeS: number };
  /** short tack between layers, when this material is not the top layer */
  tackS: number;
  peel: Peel;
  /** nothing may be pressed onto this material where layers overlap: it must be on top there */
  topOnly: boolean;
  /** seconds to let it cool before a warm or cold peel (0 for a hot peel); optional in stored profiles */
  coolS?: number;
}

export const PRESS_DEFAULTS: Readonly<Record<MaterialKind, PressProfile>> = Object.freeze({
  smooth: { handheld: { tempC: 157, timeS: 30 }, clamshell: { tempC: 155, timeS: 10 }, tackS: 2, peel: 'hot', topOnly: false, coolS: 0 },
  glitter: { handheld: { tempC: 160, timeS: 30 }, clamshell: { tempC: 160, timeS: 15 }, tackS: 5, peel: 'hot or cold', topOnly: true, coolS: 0 },
  flock: { handheld: { tempC: 160, timeS: 30 }, clamshell: { tempC: 160, timeS: 15 }, tackS: 5, peel: 'hot', topOnly: true, coolS: 0 },
  metallic: { handheld: { tempC: 150, timeS: 25 }, clamshell: { tempC: 150, timeS: 10 }, tackS: 2, peel: 'cold', topOnly: true, coolS: 30 },
  patterned: { handheld: { tempC: 155, timeS: 30 }, clamshell: { tempC: 155, timeS: 10 }, tackS: 2, peel: 'warm', topOnly: true, coolS: 10 },
});

/** A fresh copy of the default profile for a kind (callers may edit it). */
export function defaultPressProfile(kind: MaterialKind): PressProfile {
  return structuredClone(PRESS_DEFAULTS[kind]) as PressProfile;
}

/**
 * Where each row of the defaults comes from: the smooth PU row's press values
 * and tack are "common practice" (practitioners, no published source); the rest of the table is
 * "from memory" (the team's recollection; a seller may correct it). Kept apart from PressProfile so
 * stored profiles and their schema stay as they are.
 */
export type PressSource = 'common practice' | 'from memory';
export const PRESS_DEFAULT_SOURCES: Readonly<Record<MaterialKind, PressSource>> = Object.freeze({
  smooth: 'common practice',
  glitter: 'from memory',
  flock: 'from memory',
  metallic: 'from memory',
  patterned: 'from memory',
});

export type PressDefaultRow = PressProfile & { source: PressSource };

/** The Materials table as rows with their source: `{ handheld, clamshell, tackS, peel, topOnly, source }`. */
export function pressDefaultRow(kind: MaterialKind): PressDefaultRow {
  return { ...defaultPressProfile(kind), source: PRESS_DEFAULT_SOURCES[kind] };
}

/** About 5 s to drive out moisture and flatten the blank (common practice). */
export const PRE_PRESS_S = 5;
/** Some makers ask for a second press from the back, about 15 s (common practice). */
export const BACK_PRESS_S = 15;
/** At most 4 layers on one item (from memory). */
export const MAX_LAYERS = 4;
