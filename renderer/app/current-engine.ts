/**
 * The engine the person is working on. Its id is kept in the store's settings (`workingEngineId`),
 * so it survives a reload and a new start of the browser host on another port; the name shown in
 * the top bar is read from the engine itself.
 */
import { call } from './bridge.js';
import { saveSettings, settingsNow } from './settings.js';

export type CurrentEngine = { id: number; name: string };

/**
 * The remembered engine with its name as stored now, or null when none is remembered or it has
 * been deleted (then the setting is cleared). Call after `loadSettings`.
 */
export async function loadCurrentEngine(): Promise<CurrentEngine | null> {
  const id = settingsNow().workingEngineId;
  if (id === null) return null;
  const r = await call('engines.get', { id });
  if (r.ok) return { id: r.value.id, name: r.value.name };
  if (r.error.code === 'NOT_FOUND') void saveSettings({ workingEngineId: null });
  return null;
}

export function saveCurrentEngine(c: CurrentEngine | null): void {
  const id = c?.id ?? null;
  if (settingsNow().workingEngineId !== id) void saveSettings({ workingEngineId: id });
}
