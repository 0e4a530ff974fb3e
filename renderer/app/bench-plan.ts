/**
 * The plan on the bench: the plan being worked on, one click from anywhere (the top bar's chip).
 * Its id is kept in the store's settings (`benchPlanId`), like the engine being worked on, so the
 * browser host's new address at each start does not lose it; its name and engine are read from the
 * plan itself.
 */
import { call } from './bridge.js';
import { saveSettings, settingsNow } from './settings.js';

export type BenchPlan = { id: number; name: string; engineId: number };

/** The remembered plan read from the store, or null (none, or it has been deleted since: then forgotten). */
export async function loadBenchPlan(): Promise<BenchPlan | null> {
  const id = settingsNow().benchPlanId;
  if (id === null) return null;
  const r = await call('plans.get', { id });
  if (r.ok) return { id: r.value.id, name: r.value.name, engineId: r.value.engineId };
  if (r.error.code === 'NOT_FOUND') void saveSettings({ benchPlanId: null });
  return null;
}

export function saveBenchPlan(p: BenchPlan | null): void {
  if (settingsNow().benchPlanId !== (p?.id ?? null)) void saveSettings({ benchPlanId: p?.id ?? null });
}
