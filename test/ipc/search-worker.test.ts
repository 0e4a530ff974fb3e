/**
 * Issue 8, defect 7: the parts-bin search no longer blocks every other request. It runs in a
 * worker thread; meanwhile the store answers (measured by the order the answers arrive, not by
 * timing), it can be asked how long it has run and stopped, and it gives exactly the answer the
 * same search gives in the calling thread. Real store, real worker threads.
 */
import { describe, expect, it } from 'vitest';
import { createRepositories } from '../../db/repositories/index.js';
import { openStore, closeStore } from '../../db/open.js';
import { searchShelf } from '../../electron/ipc/check-handlers.js';
import { backendPerTest } from './backend-per-test.js';

const store = backendPerTest('search-worker');
const { ok, call } = store;

describe('the search in a worker thread', () => {
  it('lets engines.list answer while a search runs (the list answers first)', async () => {
    const [engine] = await ok('engines.list', {});
    const order: string[] = [];
    const search = call('check.search', { engineId: engine.id, top: 5 }).then((r) => {
      order.push('search');
      return r;
    });
    const list = call('engines.list', {}).then((r) => {
      order.push('list');
      return r;
    });
    const [s, l] = await Promise.all([search, list]);
    expect(l.ok).toBe(true);
    expect(s.ok).toBe(true);
    // A search run in this thread answers before a request sent after it; in a worker it does not.
    expect(order).toEqual(['list', 'search']);
  }, 60_000);

  it('gives the same answer as the same search run in this thread', async () => {
    const [engine] = await ok('engines.list', {});
    const fromWorker = await ok('check.search', { engineId: engine.id, top: 5 });
    store.backend.close();
    const db = openStore(store.backend.storeFile);
    try {
      const here = await searchShelf(createRepositories(db), { engineId: engine.id, top: 5 });
      expect(fromWorker).toEqual(JSON.parse(JSON.stringify(here)));
    } finally {
      closeStore(db);
      store.reopen('browser');
    }
  }, 60_000);

  it('says a search is running, stops it on request (CANCELLED, nothing changed), then says none is', async () => {
    const [engine] = await ok('engines.list', {});
    const before = store.counts();
    const search = call('check.search', { engineId: engine.id, top: 5 });
    expect((await ok('check.progress', {})).running).toBe(1);
    expect(await ok('check.cancel', {})).toEqual({ cancelled: 1 });
    expect(await search).toEqual({ ok: false, error: { code: 'CANCELLED', message: 'The search was stopped before it finished; nothing was changed.' } });
    expect(await ok('check.progress', {})).toEqual({ running: 0, elapsedMs: 0, share: 0 });
    expect(store.counts()).toEqual(before);
  }, 60_000);
});
