/**
 * How far a running search has got: the checker tells after each module-and-coil pair, the worker
 * passes it on, and 'check.progress' answers the share of the oldest search. Telling changes
 * nothing in the answer. Real worker threads and a real store.
 */
import { describe, expect, it } from 'vitest';
import { searchBest } from '../../electron/checker/index.js';
import { generatedSearch } from '../checker/generated-bin.js';
import { backendPerTest } from './backend-per-test.js';

const store = backendPerTest('search-progress');

describe('search progress', () => {
  it('is told once per module-and-coil pair, in order, ending at the whole, and the answer is the same', () => {
    const input = generatedSearch({ coils: 4, modules: 3, ballasts: 2, seed: 7, rpmPoints: 40 });
    const told: Array<[number, number]> = [];
    const withProgress = searchBest(input, (done, total) => told.push([done, total]));
    // 3 modules x 4 coils = 12 pairs, each told once.
    expect(told).toEqual(Array.from({ length: 12 }, (_, k) => [k + 1, 12]));
    expect(withProgress).toEqual(searchBest(input));
  });

  it('through the bridge: a share between 0 and 1 while running, nothing after', async () => {
    const [engine] = await store.ok('engines.list', {});
    const search = store.call('check.search', { engineId: engine.id, top: 5 });
    const seen: number[] = [];
    let settled = false;
    void search.then(() => (settled = true));
    while (!settled) {
      const p = await store.ok('check.progress', {});
      if (p.running > 0) seen.push(p.share);
      await new Promise((r) => setTimeout(r, 5));
    }
    expect((await search).ok).toBe(true);
    for (const share of seen) expect(share >= 0 && share <= 1).toBe(true);
    for (let k = 1; k < seen.length; k++) expect(seen[k]!).toBeGreaterThanOrEqual(seen[k - 1]!);
    expect(await store.ok('check.progress', {})).toEqual({ running: 0, elapsedMs: 0, share: 0 });
  }, 60_000);
});
