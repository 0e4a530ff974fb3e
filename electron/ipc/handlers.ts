/**
 * One handler per channel in channels.ts. Handlers receive requests the dispatcher has already
 * parsed; they call the repositories and translate the store's errors into the bridge's
 * `AppFailure` codes, so the renderer sees the same envelope whatever went wrong.
 */
import Database from 'better-sqlite3';
import { loadDemo } from '../../db/demo/index.js';
import { StoreError } from '../../db/errors.js';
import { SCHEMA_VERSION } from '../../db/open.js';
import { createRepositories, type Repositories } from '../../db/repositories/index.js';
import type { PageSize, PrintAnswer } from './channels.js';
import { checkPlans, searchShelf } from './check-handlers.js';
import { createSearchJobs } from './search-runner.js';
import type { Handlers } from './dispatch.js';
import { AppFailure } from './failure.js';
import { recordsHandlers, type RecordsStore } from './records-handlers.js';
import { advanceAfterReading, getSheet, markChecked, tickStep } from './sheet-handlers.js';

export type HostInfo = {
  version: string;
  dataDir: string;
  host: 'desktop' | 'browser';
  /** The desktop shell's printing (the page shown, as a PDF); without it 'app.print' answers UNSUPPORTED. */
  print?: (pageSize: PageSize) => Promise<PrintAnswer>;
  /** The live store for backups, import and export (the backend's); without it those answer UNSUPPORTED. */
  records?: RecordsStore;
};

export const PRINT_UNSUPPORTED =
  "Printing from here uses the browser's own print: pick the paper size (A4 or Letter) in the browser's print dialogue.";

export function createHandlers(db: Database.Database, info: HostInfo): Handlers {
  return handlersFor(createRepositories(db), info);
}

/** The same handlers over repositories the caller already built (the backend shares them with the demo loader). */
export function handlersFor(repos: Repositories, info: HostInfo): Handlers {
  // Searches run in worker threads; the rest of the app answers meanwhile.
  const searches = createSearchJobs();
  return {
    'app.info': () => ({ version: info.version, dataDir: info.dataDir, schemaVersion: SCHEMA_VERSION, host: info.host }),
    'demo.load': guard(undefined, () => loadDemo(repos)),

    'engines.list': guard(undefined, () => repos.engines.list()),
    'engines.get': guard(undefined, (r) => repos.engines.get(r.id)),
    'engines.create': guard('engine', (r) => repos.engines.create(r.engine)),
    'engines.update': guard('engine', (r) => repos.engines.update(r.id, r.engine, r.expectedUpdatedAt)),
    'engines.delete': guard(undefined, (r) => repos.engines.delete(r.id, { deletePlansToo: r.deletePlansToo, expectedUpdatedAt: r.expectedUpdatedAt })),

    'parts.list': guard(undefined, (r) => repos.parts.list(r.kind)),
    'parts.get': guard(undefined, (r) => repos.parts.get(r.id)),
    'parts.create': guard('part', (r) => repos.parts.create(r.part)),
    'parts.update': guard('part', (r) => repos.parts.update(r.id, r.part, r.expectedUpdatedAt)),
    'parts.delete': guard(undefined, (r) => repos.parts.delete(r.id, r.expectedUpdatedAt)),

    'plans.list': guard(undefined, (r) => repos.plans.list(r.engineId)),
    'plans.get': guard(undefined, (r) => repos.plans.get(r.id)),
    'plans.create': guard('plan', (r) => repos.plans.create(r.plan)),
    'plans.update': guard('plan', (r) => repos.plans.update(r.id, r.plan, r.expectedUpdatedAt)),
    'plans.delete': guard(undefined, (r) => repos.plans.delete(r.id, r.expectedUpdatedAt)),
    'plans.setStatus': guard(undefined, (r) => repos.plans.setStatus(r.id, r.status)),

    'readings.list': guard(undefined, (r) => repos.readings.list(r.planId)),
    'store.unreadable': guard(undefined, () => ({ rows: repos.unreadable() })),
    // After a reading is saved or removed, the plan's status moves forward if the work reached 'done'.
    'readings.add': guard('reading', (r) => {
      const saved = repos.readings.add(r.reading);
      advanceAfterReading(repos, saved.planId);
      return saved;
    }),
    'readings.update': guard('reading', (r) => {
      const saved = repos.readings.update(r.id, r.reading, r.expectedUpdatedAt);
      advanceAfterReading(repos, saved.planId);
      return saved;
    }),
    'readings.delete': guard(undefined, (r) => {
      const { planId, undoToken } = repos.readings.delete(r.id, r.expectedUpdatedAt);
      advanceAfterReading(repos, planId);
      return { deleted: true as const, undoToken };
    }),
    'engines.contents': guard(undefined, (r) => repos.engines.contents(r.id)),
    'parts.usedBy': guard(undefined, (r) => ({ usedBy: repos.parts.usedBy(r.id) })),
    'removed.list': guard(undefined, () => ({ removed: repos.removed.list() })),
    'removed.restore': guard(undefined, (r) => repos.removed.restore(r.token)),

    // Weighing a plan moves it from draft to checked.
    'check.plans': guard(undefined, (r) => {
      const answer = checkPlans(repos, r);
      markChecked(repos, r.planIds);
      return answer;
    }),
    'check.search': guardAsync(undefined, (r) => searchShelf(repos, r, searches.run)),
    'check.cancel': () => ({ cancelled: searches.cancelAll() }),
    'check.progress': () => searches.progress(),

    'settings.get': guard(undefined, () => repos.settings.get()),
    'settings.set': guard(undefined, (r) => repos.settings.set(r)),

    'sheet.get': guard(undefined, (r) => getSheet(repos, r.planId)),
    'sheet.tick': guard(undefined, (r) => tickStep(repos, r)),

    ...recordsHandlers(info.records, (err) => translateStoreError(err)),

    'app.print': async (r) => {
      if (!info.print) throw new AppFailure('UNSUPPORTED', PRINT_UNSUPPORTED);
      return info.print(r.pageSize);
    },
  };
}

/**
 * Runs a handler body and translates what the store throws. `fieldPrefix` is the request key
 * that holds the record ('engine', 'part', ...), so a repository's `existing.coilPartId` comes
 * back as `engine.existing.coilPartId`, the same path the dispatcher's own checks use.
 */
function guard<A, R>(fieldPrefix: string | undefined, body: (request: A) => R): (request: A) => R {
  return (request) => {
    try {
      return body(request);
    } catch (err) {
      throw translateStoreError(err, fieldPrefix);
    }
  };
}

/** The same for a handler that answers later (the store is read before the first await). */
function guardAsync<A, R>(fieldPrefix: string | undefined, body: (request: A) => Promise<R>): (request: A) => Promise<R> {
  return async (request) => {
    try {
      return await body(request);
    } catch (err) {
      throw translateStoreError(err, fieldPrefix);
    }
  };
}

export function translateStoreError(err: unknown, fieldPrefix?: string): unknown {
  if (err instanceof StoreError) {
    switch (err.code) {
      case 'NOT_FOUND':
      case 'IN_USE':
      case 'STALE':
        return new AppFailure(err.code, err.message);
      case 'INVALID_INPUT':
        return new AppFailure('INVALID_INPUT', err.message, prefixFields(err.fields ?? {}, fieldPrefix));
      case 'STORE_TOO_NEW':
      case 'CORRUPT':
      case 'FOREIGN_FILE':
      case 'LOCKED':
        return new AppFailure('STORE_ERROR', err.message);
    }
  }
  if (err instanceof Database.SqliteError) return new AppFailure('STORE_ERROR', sqliteSentence(err.code));
  return err;
}

function prefixFields(fields: Record<string, string>, prefix: string | undefined): Record<string, string> {
  if (prefix === undefined) return fields;
  return Object.fromEntries(Object.entries(fields).map(([k, v]) => [k === '_' ? prefix : `${prefix}.${k}`, v]));
}

function sqliteSentence(code: string): string {
  if (code.startsWith('SQLITE_BUSY') || code.startsWith('SQLITE_LOCKED')) {
    return 'The workshop file is busy (another copy of the app may be saving). Nothing was changed; try again in a moment.';
  }
  if (code.startsWith('SQLITE_READONLY')) return 'The workshop file cannot be written (it is read-only). Nothing was changed.';
  if (code.startsWith('SQLITE_FULL')) return 'The disk is full, so the workshop file could not grow. Nothing was changed.';
  return `The workshop file refused the change (${code}). Nothing was changed.`;
}
