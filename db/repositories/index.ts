/**
 * The store's repositories: the only code that writes SQL. Statements are prepared once here;
 * callers get plain typed objects and `StoreError`s, never rows or SQLite errors they must decode.
 */
import type Database from 'better-sqlite3';
import { createEnginesRepository, type EnginesRepository } from './engines.js';
import { createMetaRepository, type MetaRepository } from './meta.js';
import { createPartsRepository, type PartsRepository } from './parts.js';
import { createPlansRepository, type PlansRepository } from './plans.js';
import { createReadingsRepository, type ReadingsRepository } from './readings.js';
import { createRemovedBin, type RemovedKind, type RemovedSummary } from './removed.js';
import { createSettingsRepository, type SettingsRepository } from './settings.js';
import { writeTx, type CorruptRow, type RepoContext } from './shared.js';
import { createTicksRepository, type TicksRepository } from './ticks.js';
import { scanUnreadable, type UnreadableRow } from './unreadable.js';

/** Each delete also answers `undoToken`, which `removed.restore` takes to put the record back. */
type Undoable<R extends { delete: (...args: never[]) => object }> = Omit<R, 'delete'> & {
  delete: (...args: Parameters<R['delete']>) => ReturnType<R['delete']> & { undoToken: number };
};

export type Repositories = {
  engines: Undoable<EnginesRepository>;
  parts: Undoable<PartsRepository>;
  plans: Undoable<PlansRepository>;
  readings: Undoable<ReadingsRepository>;
  /** What was deleted since the app started, to undo (kept in memory only). */
  removed: { list(): RemovedSummary[]; restore(token: number): { kind: RemovedKind; id: number; label: string } };
  /** The ticked steps of each plan's wiring sheet. */
  ticks: TicksRepository;
  meta: MetaRepository;
  /** The person's settings (mm/inch, the engine worked on, ticked plans, the last screen...). */
  settings: SettingsRepository;
  /** Every engine, part, plan and reading that no longer parses (lists leave them out), with its label, version and reason. */
  unreadable(): UnreadableRow[];
  /** Run `fn` in one write transaction, begun IMMEDIATE (nested calls become savepoints); any throw rolls all of it back. */
  transaction<T>(fn: () => T): T;
};

export type RepositoryOptions = {
  /** Told about each row a list skipped because it could not be read. Default: a warning on stderr. */
  onCorruptRow?: (row: CorruptRow) => void;
};

export function createRepositories(db: Database.Database, options: RepositoryOptions = {}): Repositories {
  const ctx: RepoContext = {
    db,
    onCorruptRow: options.onCorruptRow ?? ((row) => console.warn(`[store] skipped unreadable row: ${row.message}`)),
  };
  const engines = createEnginesRepository(ctx);
  const parts = createPartsRepository(ctx);
  const plans = createPlansRepository(ctx);
  const readings = createReadingsRepository(ctx);
  const bin = createRemovedBin(db);
  /** The delete, with a copy of what it removes taken in the same transaction and kept once it commits. */
  const undoable = <A extends unknown[], T extends object>(kind: RemovedKind, del: (id: number, ...rest: A) => T) =>
    (id: number, ...rest: A): T & { undoToken: number } => {
      let copy: ReturnType<typeof bin.capture> = null;
      const result = writeTx(db, () => {
        copy = bin.capture(kind, id);
        return del(id, ...rest);
      });
      // `del` throws NOT_FOUND when the row is missing, so a result means a copy was taken.
      return { ...result, undoToken: copy ? bin.keep(copy) : 0 };
    };
  return {
    engines: { ...engines, delete: undoable('engine', engines.delete) },
    parts: { ...parts, delete: undoable('part', parts.delete) },
    plans: { ...plans, delete: undoable('plan', plans.delete) },
    readings: { ...readings, delete: undoable('reading', readings.delete) },
    removed: { list: () => bin.list(), restore: (token) => bin.restore(token) },
    ticks: createTicksRepository(ctx),
    meta: createMetaRepository(ctx),
    settings: createSettingsRepository(ctx),
    unreadable: () =>
      db.transaction(() =>
        scanUnreadable(ctx, { engines: (id) => engines.get(id), parts: (id) => parts.get(id), plans: (id) => plans.get(id), readings: (id) => readings.get(id) }),
      )(),
    transaction: (fn) => writeTx(db, fn),
  };
}

export type { CorruptRow } from './shared.js';
export type { UnreadableRow, UnreadableTable } from './unreadable.js';
export { UNREADABLE_TABLES } from './unreadable.js';
export type { EngineSummary, EnginesRepository } from './engines.js';
export type { PartsRepository } from './parts.js';
export type { PlansRepository } from './plans.js';
export type { ReadingsRepository } from './readings.js';
export type { TicksRepository } from './ticks.js';
export type { RemovedKind, RemovedSummary } from './removed.js';
export type { MetaRepository } from './meta.js';
export type { SettingsRepository } from './settings.js';
