/** Small facts about the file itself, such as whether the demo workshop was ever loaded. */
import type { RepoContext } from './shared.js';

export type MetaRepository = {
  get(key: string): string | null;
  set(key: string, value: string): void;
};

export function createMetaRepository(ctx: RepoContext): MetaRepository {
  const get = ctx.db.prepare<[string], { value: string }>('SELECT value FROM meta WHERE key = ?');
  const set = ctx.db.prepare('INSERT INTO meta (key, value) VALUES (?, ?) ON CONFLICT (key) DO UPDATE SET value = excluded.value');
  return {
    get: (key) => get.get(key)?.value ?? null,
    set: (key, value) => {
      set.run(key, value);
    },
  };
}
