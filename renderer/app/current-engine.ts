/** The engine the person is working on, remembered on this computer between visits. */
export type CurrentEngine = { id: number; name: string };
const key = 'ignition-planner.currentEngine';

export function loadCurrentEngine(): CurrentEngine | null {
  try {
    const raw = window.localStorage.getItem(key);
    if (!raw) return null;
    const v = JSON.parse(raw) as unknown;
    if (v && typeof v === 'object' && Number.isInteger((v as CurrentEngine).id) && typeof (v as CurrentEngine).name === 'string') {
      return { id: (v as CurrentEngine).id, name: (v as CurrentEngine).name };
    }
  } catch {
    // unreadable: start without one
  }
  return null;
}

export function saveCurrentEngine(c: CurrentEngine | null): void {
  try {
    if (c) window.localStorage.setItem(key, JSON.stringify(c));
    else window.localStorage.removeItem(key);
  } catch {
    // storage refused: remembered for this page only
  }
}
