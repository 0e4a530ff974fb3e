/**
 * The recently removed records: each delete keeps a copy of the rows it took away (the record and
 * every row that went with it through ON DELETE CASCADE: an engine's advance curve, plans, readings
 * and sheet ticks) so the delete can be undone until the app is closed. Kept in memory only; a
 * restart empties it (backups are the way back after that).
 *
 * Rows are copied raw, column by column, so a record that no longer parses can be deleted and put
 * back unchanged. Which rows go with a record is read from SQLite's own foreign-key list
 * (PRAGMA foreign_key_list), so a table added by a later migration is followed without a change here.
 */
import type Database from 'better-sqlite3';
import { StoreError } from '../errors.js';
import { nowIso, writeTx } from './shared.js';

export type RemovedKind = 'engine' | 'part' | 'plan' | 'reading';

const TABLE_OF: Record<RemovedKind, string> = { engine: 'engines', part: 'parts', plan: 'plans', reading: 'readings' };
const KIND_OF: Record<string, RemovedKind> = { engines: 'engine', parts: 'part', plans: 'plan', readings: 'reading' };

/** What the screen shows of one removed record. */
export type RemovedSummary = {
  /** Names this removal for `restore`; never reused while the app runs. */
  token: number;
  kind: RemovedKind;
  /** The record's id (it gets the same id back). */
  id: number;
  label: string;
  removedAt: string;
  /** How many plans and readings went with it. */
  plans: number;
  readings: number;
};

type Row = Record<string, unknown>;
type TableRows = { table: string; rows: Row[] };
type Entry = RemovedSummary & { copy: TableRows[] };

export type RemovedBin = {
  /** Copies the record's rows (call inside the delete's transaction, before the DELETE). */
  capture(kind: RemovedKind, id: number): Entry | null;
  /** Keeps a captured copy once its delete has committed; returns its token. */
  keep(entry: Entry): number;
  /** Newest first. */
  list(): RemovedSummary[];
  /** Puts the rows back with their ids; refused with a sentence if something they need is gone or they are back already. */
  restore(token: number): { kind: RemovedKind; id: number; label: string };
};

/** At most this many removals are kept; the oldest goes first. */
export const REMOVED_KEPT = 100;

type ForeignKey = { table: string; from: string; to: string; onDelete: string };

export function createRemovedBin(db: Database.Database): RemovedBin {
  const entries: Entry[] = [];
  let nextToken = 1;

  const quote = (name: string) => `"${name.replace(/"/g, '""')}"`;
  const tables = (): string[] =>
    db
      .prepare<[], { name: string }>("SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%'")
      .all()
      .map((r) => r.name);
  const keysOf = (table: string): ForeignKey[] =>
    (db.pragma(`foreign_key_list(${quote(table)})`) as Array<{ table: string; from: string; to: string; on_delete: string }>).map((k) => ({
      table: k.table,
      from: k.from,
      to: k.to,
      onDelete: k.on_delete,
    }));
  /** Tables whose rows are deleted with a row of `parent` (ON DELETE CASCADE), with the joining columns. */
  const cascadeChildren = (parent: string): Array<{ child: string; key: ForeignKey }> =>
    tables().flatMap((child) => keysOf(child).filter((k) => k.table === parent && k.onDelete === 'CASCADE').map((key) => ({ child, key })));

  const gather = (table: string, rows: Row[], into: TableRows[]): void => {
    if (rows.length === 0) return;
    into.push({ table, rows });
    for (const { child, key } of cascadeChildren(table)) {
      const select = db.prepare(`SELECT * FROM ${quote(child)} WHERE ${quote(key.from)} = ?`);
      const childRows = rows.flatMap((r) => select.all(r[key.to]) as Row[]);
      gather(child, childRows, into);
    }
  };

  const labelOf = (kind: RemovedKind, row: Row): string => {
    if (kind === 'reading') return `${String(row['quantity'])} ${String(row['value'])} ${String(row['unit'])} (${String(row['taken_on'])})`;
    return String(row['name'] ?? `${kind} ${String(row['id'])}`);
  };

  const capture = (kind: RemovedKind, id: number): Entry | null => {
    const table = TABLE_OF[kind];
    const root = db.prepare(`SELECT * FROM ${quote(table)} WHERE id = ?`).get(id) as Row | undefined;
    if (!root) return null;
    const copy: TableRows[] = [];
    gather(table, [root], copy);
    const count = (t: string) => copy.filter((c) => c.table === t).reduce((n, c) => n + c.rows.length, 0);
    return {
      token: 0,
      kind,
      id,
      label: labelOf(kind, root),
      removedAt: nowIso(),
      plans: kind === 'plan' ? 0 : count('plans'),
      readings: kind === 'reading' ? 0 : count('readings'),
      copy,
    };
  };

  const keep = (entry: Entry): number => {
    entry.token = nextToken++;
    entries.unshift(entry);
    entries.splice(REMOVED_KEPT);
    return entry.token;
  };

  const summary = ({ copy: _copy, ...s }: Entry): RemovedSummary => s;

  /** Refuses when a row the copy points at (a part a plan uses, the engine of a plan) is gone now. */
  const checkNeeds = (entry: Entry): void => {
    const inCopy = new Set(entry.copy.map((c) => c.table));
    for (const { table, rows } of entry.copy) {
      for (const key of keysOf(table)) {
        if (inCopy.has(key.table) && key.table !== table) continue;
        const exists = db.prepare(`SELECT 1 FROM ${quote(key.table)} WHERE ${quote(key.to)} = ?`);
        for (const row of rows) {
          const value = row[key.from];
          if (value === null || value === undefined || exists.get(value)) continue;
          const kind = KIND_OF[key.table] ?? key.table;
          const waiting = entries.find((e) => e.kind === kind && e.id === value);
          throw new StoreError(
            'NOT_FOUND',
            waiting
              ? `"${entry.label}" cannot come back yet: it needs the ${kind} "${waiting.label}", which was removed after it. Bring that back first (it is in the recently removed list), then this.`
              : `"${entry.label}" cannot come back: the ${kind} it uses (id ${String(value)}) has been removed for good. Restore a backup to get both back.`,
          );
        }
      }
    }
  };

  const restore = (token: number) => {
    const at = entries.findIndex((e) => e.token === token);
    if (at < 0) throw new StoreError('NOT_FOUND', 'That removal is no longer in the recently removed list (it is kept until the app is closed); restore a backup to get it back.');
    const entry = entries[at]!;
    writeTx(db, () => {
      const table = TABLE_OF[entry.kind];
      if (db.prepare(`SELECT 1 FROM ${quote(table)} WHERE id = ?`).get(entry.id)) {
        throw new StoreError('IN_USE', `"${entry.label}" is back already.`);
      }
      checkNeeds(entry);
      for (const { table: t, rows } of entry.copy) {
        for (const row of rows) {
          const cols = Object.keys(row);
          db.prepare(`INSERT INTO ${quote(t)} (${cols.map(quote).join(', ')}) VALUES (${cols.map(() => '?').join(', ')})`).run(...cols.map((c) => row[c]));
        }
      }
    });
    entries.splice(at, 1);
    return { kind: entry.kind, id: entry.id, label: entry.label };
  };

  return { capture, keep, list: () => entries.map(summary), restore };
}
