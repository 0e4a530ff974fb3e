/**
 * The person's settings (migration 005): one row per key, the value as JSON. Only the keys of
 * `settingShapes` (db/schema.ts) may be written, each value checked with its own schema; an unknown
 * key or a bad value is refused with INVALID_INPUT naming the key, and nothing of that request is
 * written. On reading, a row whose value no longer parses (or a key this version does not know, left
 * by a newer app) is reported through `onCorruptRow` and the key reads as its default, so one bad
 * row never takes the others with it.
 */
import { settingDefaults, settingKeys, settingShapes, settingsPatch, type SettingKey, type Settings, type SettingsPatch } from '../schema.js';
import { nowIso, parseInput, writeTx, type RepoContext } from './shared.js';

export type SettingsRepository = {
  /** Every setting: the stored value, or the default where none is stored (or it cannot be read). */
  get(): Settings;
  /** Writes the keys given (all or none) and answers every setting afterwards. */
  set(patch: unknown): Settings;
};

type Row = { key: string; value: string };

export function createSettingsRepository(ctx: RepoContext): SettingsRepository {
  const { db } = ctx;
  const s = {
    all: db.prepare<[], Row>('SELECT key, value FROM settings ORDER BY key'),
    put: db.prepare('INSERT INTO settings (key, value, updated_at) VALUES (@key, @value, @now) ON CONFLICT (key) DO UPDATE SET value = excluded.value, updated_at = excluded.updated_at'),
  };

  const isKey = (key: string): key is SettingKey => (settingKeys as string[]).includes(key);

  function read(): Settings {
    const out: Settings = { ...settingDefaults, weighTicks: { ...settingDefaults.weighTicks } };
    for (const row of s.all.all()) {
      if (!isKey(row.key)) {
        ctx.onCorruptRow({ table: 'settings', id: 0, message: `The settings table holds a key this version does not know (“${row.key}”); it is left alone.` });
        continue;
      }
      let value: unknown;
      try {
        value = JSON.parse(row.value);
      } catch {
        value = undefined;
      }
      const parsed = settingShapes[row.key].safeParse(value);
      if (parsed.success) (out as Record<SettingKey, unknown>)[row.key] = parsed.data;
      else ctx.onCorruptRow({ table: 'settings', id: 0, message: `The setting “${row.key}” could not be read, so its default is used until it is set again.` });
    }
    return out;
  }

  return {
    get: () => read(),
    set: (patch) =>
      writeTx(db, () => {
        const values: SettingsPatch = parseInput(settingsPatch, patch);
        const now = nowIso();
        for (const [key, value] of Object.entries(values)) {
          if (value !== undefined) s.put.run({ key, value: JSON.stringify(value), now });
        }
        return read();
      }),
  };
}
