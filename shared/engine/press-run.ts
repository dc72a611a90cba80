/**
 * The press run's steps: one item's press card turned into what the maker does beside the press,
 * one thing at a time — a timed press (pre-press, tack, final press, back press), a counted
 * cool-down before a warm or cold peel, or an action to confirm (place the layers, peel). Every
 * time comes from the card, which takes it from the seller-editable press tables; nothing here
 * has a time of its own. Pure.
 */
import { formatTemperature } from '../units.ts';
import type { PressCard } from './press-card.ts';

export type RunStepKind = 'pre_press' | 'place' | 'tack' | 'cool' | 'peel' | 'final_press' | 'back_press';

export interface RunStep {
  kind: RunStepKind;
  /** a few large words: "Tack 2 s", "Peel warm" */
  title: string;
  /** the card's full instruction for the step */
  detail: string;
  /** seconds the step's timer runs; null: the maker confirms it is done */
  timerS: number | null;
  /** the layers the step handles, bottom → top */
  layerIds: string[];
  /** the press's temperature for a pressing step */
  tempLabel?: string;
  protectiveSheet: boolean;
}

const PRESS_TITLES = { pre_press: 'Pre-press', tack: 'Tack', final_press: 'Final press', back_press: 'Back press' } as const;

/** The run's steps for one item, in order. */
export function pressRunSteps(card: PressCard): RunStep[] {
  const name = new Map(card.layers.map((l) => [l.layerId, `${l.colourName} ${l.materialKind}`]));
  const names = (ids: string[]) => ids.map((id) => name.get(id) ?? id).join(' + ');
  const out: RunStep[] = [];
  for (const s of card.steps) {
    const ids = s.layerIds ?? (s.layerId ? [s.layerId] : []);
    if (s.kind === 'place') {
      out.push({ kind: 'place', title: `Place ${names(ids)}`, detail: s.text, timerS: null, layerIds: ids, protectiveSheet: false });
      continue;
    }
    out.push({
      kind: s.kind,
      title: `${PRESS_TITLES[s.kind]} ${s.timeS ?? 0} s`,
      detail: s.text,
      timerS: s.timeS ?? 0,
      layerIds: ids,
      ...(s.tempC !== undefined ? { tempLabel: formatTemperature(s.tempC) } : {}),
      protectiveSheet: s.protectiveSheet,
    });
    if (s.peel) {
      if (s.coolS) out.push({ kind: 'cool', title: `Cool ${s.coolS} s`, detail: `Let it cool ${s.coolS} s before a ${s.peel} peel.`, timerS: s.coolS, layerIds: ids, protectiveSheet: false });
      out.push({
        kind: 'peel',
        title: `Peel ${s.peel}`,
        detail: `Peel the carrier of ${names(ids)} ${s.peel}. If the vinyl lifts, let it cool and peel again — more heat is not the fix.`,
        timerS: null,
        layerIds: ids,
        protectiveSheet: false,
      });
    }
  }
  return out;
}
