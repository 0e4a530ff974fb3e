/**
 * The rows a list had to leave out because they no longer parse (a file edited by hand, a bad
 * import by another tool), so the screen can say how many there are and offer to remove each.
 * Every row of engines, parts, plans and readings is read with the same parsers the repositories
 * use; what fails is reported with what can still be read from its plain columns: a label to show,
 * its version (`updated_at`, for the delete) and the reason. Deleting works on such a row: the
 * repositories check it exists from its plain columns without parsing it.
 */
import { StoreError } from '../errors.js';
import type { RepoContext } from './shared.js';

export const UNREADABLE_TABLES = ['engines', 'parts', 'plans', 'readings'] as const;
export type UnreadableTable = (typeof UNREADABLE_TABLES)[number];

export type UnreadableRow = { table: UnreadableTable; id: number; label: string; updatedAt: string; message: string };

type Plain = { id: number; label: string; updated_at: string };

const LABELS: Record<UnreadableTable, string> = {
  engines: "SELECT id, name AS label, updated_at FROM engines ORDER BY id",
  parts: "SELECT id, kind || ': ' || name AS label, updated_at FROM parts ORDER BY id",
  plans: "SELECT id, name AS label, updated_at FROM plans ORDER BY id",
  readings: "SELECT id, quantity || ' on ' || taken_on AS label, updated_at FROM readings ORDER BY id",
};

/** `readers` reads one row by id the way its repository does (throws CORRUPT when it does not parse). */
export function scanUnreadable(ctx: RepoContext, readers: Record<UnreadableTable, (id: number) => unknown>): UnreadableRow[] {
  const out: UnreadableRow[] = [];
  for (const table of UNREADABLE_TABLES) {
    for (const row of ctx.db.prepare<[], Plain>(LABELS[table]).all()) {
      try {
        readers[table](row.id);
      } catch (err) {
        if (!(err instanceof StoreError && err.code === 'CORRUPT')) throw err;
        out.push({ table, id: row.id, label: String(row.label ?? ''), updatedAt: String(row.updated_at ?? ''), message: err.message });
      }
    }
  }
  return out;
}
