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
import type { CorruptRow, RepoContext } from './shared.js';
import { createTicksRepository, type TicksRepository } from './ticks.js';

export type Repositories = {
  engines: EnginesRepository;
  parts: PartsRepository;
  plans: PlansRepository;
  readings: ReadingsRepository;
  /** The ticked steps of each plan's wiring sheet. */
  ticks: TicksRepository;
  meta: MetaRepository;
  /** Run `fn` in one transaction (nested calls become savepoints); any throw rolls all of it back. */
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
  return {
    engines: createEnginesRepository(ctx),
    parts: createPartsRepository(ctx),
    plans: createPlansRepository(ctx),
    readings: createReadingsRepository(ctx),
    ticks: createTicksRepository(ctx),
    meta: createMetaRepository(ctx),
    transaction: (fn) => db.transaction(fn)(),
  };
}

export type { CorruptRow } from './shared.js';
export type { EngineSummary, EnginesRepository } from './engines.js';
export type { PartsRepository } from './parts.js';
export type { PlansRepository } from './plans.js';
export type { ReadingsRepository } from './readings.js';
export type { TicksRepository } from './ticks.js';
export type { MetaRepository } from './meta.js';
