/**
 * The person's settings, kept in the store ('settings.get' / 'settings.set'), not in the browser:
 * the browser host starts on a new port each run and a browser keeps its storage per address, so
 * anything kept there would be lost at the next start. Read once when the app starts
 * (`loadSettings`, which the frame waits for before it shows a screen), then held here; a change is
 * shown at once and written in the background. A refused write puts the stored value back and
 * tells the listeners why.
 */
import { useSyncExternalStore } from 'react';
import { settingDefaults, type Settings, type SettingsPatch } from '../../db/schema.js';
import { call } from './bridge.js';

let current: Settings = settingDefaults;
let loaded = false;
let lastProblem: string | null = null;
const listeners = new Set<() => void>();
const notify = (): void => {
  for (const l of listeners) l();
};

let reading: Promise<Settings> | null = null;

/**
 * Reads the stored settings once (main.tsx starts it before the first render); later calls share
 * that read. Never throws: a failure keeps the defaults and says why in `settingsProblem`.
 */
export function loadSettings(): Promise<Settings> {
  reading ??= call('settings.get', {}).then((r) => {
    loaded = true;
    if (r.ok) current = r.value;
    else lastProblem = `Your settings could not be read, so the defaults are used: ${r.error.message}`;
    notify();
    return current;
  });
  return reading;
}

export function settingsNow(): Settings {
  return current;
}

export function settingsLoaded(): boolean {
  return loaded;
}

/** Why the last read or write of the settings failed, or null. */
export function settingsProblem(): string | null {
  return lastProblem;
}

// Writes go one after another, so the store ends with the last change made.
let queue: Promise<unknown> = Promise.resolve();

/** Shows the change at once and writes it; resolves when it is stored (or refused, and undone). */
export function saveSettings(patch: SettingsPatch): Promise<void> {
  current = { ...current, ...patch };
  notify();
  const write = queue.then(async () => {
    const r = await call('settings.set', patch);
    if (r.ok) {
      lastProblem = null;
    } else {
      lastProblem = `Your setting was not kept: ${r.error.message}`;
      const back = await call('settings.get', {});
      if (back.ok) current = back.value;
    }
    notify();
  });
  queue = write;
  return write;
}

function subscribe(l: () => void): () => void {
  listeners.add(l);
  return () => listeners.delete(l);
}

/** The settings, re-rendering when they change. */
export function useSettings(): Settings {
  return useSyncExternalStore(subscribe, settingsNow, () => settingDefaults);
}

