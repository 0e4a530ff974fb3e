/** The plan on the bench: the plan being worked on, remembered on this computer between visits (like the engine). */
export type BenchPlan = { id: number; name: string; engineId: number };
const key = 'ignition-planner.benchPlan';

export function loadBenchPlan(): BenchPlan | null {
  try {
    const raw = window.localStorage.getItem(key);
    if (!raw) return null;
    const v = JSON.parse(raw) as Partial<BenchPlan> | null;
    if (v && Number.isInteger(v.id) && Number.isInteger(v.engineId) && typeof v.name === 'string') return { id: v.id!, name: v.name, engineId: v.engineId! };
  } catch {
    // unreadable: start without one
  }
  return null;
}

export function saveBenchPlan(p: BenchPlan | null): void {
  try {
    if (p) window.localStorage.setItem(key, JSON.stringify(p));
    else window.localStorage.removeItem(key);
  } catch {
    // storage refused: remembered for this page only
  }
}
