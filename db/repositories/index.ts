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
import { writeTx, type CorruptRow, type RepoContext } from './shared.js';
import { createTicksRepository, type TicksRepository } from './ticks.js';
import { scanUnreadable, type UnreadableRow } from './unreadable.js';

export type Repositories = {
  engines: EnginesRepository;
  parts: PartsRepository;
  plans: PlansRepository;
  readings: ReadingsRepository;
  /** The ticked steps of each plan's wiring sheet. */
  ticks: TicksRepository;
  meta: MetaRepository;
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
  return {
    engines,
    parts,
    plans,
    readings,
    ticks: createTicksRepository(ctx),
    meta: createMetaRepository(ctx),
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
export type { MetaRepository } from './meta.js';
