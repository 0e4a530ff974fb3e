/** Which kinds the parts list shows, remembered for this window so "back to the list" returns to it. */
import { partKinds, type PartKind } from '../../../db/schema.js';

export type Shown = PartKind | 'all';
const key = 'ignition-planner.partsShown';

export function loadShown(): Shown {
  try {
    const v = window.sessionStorage.getItem(key);
    return v !== null && (partKinds as readonly string[]).includes(v) ? (v as PartKind) : 'all';
  } catch {
    return 'all';
  }
}

export function saveShown(v: Shown): void {
  try {
    window.sessionStorage.setItem(key, v);
  } catch {
    // storage refused: remembered while this screen is open only
  }
}
