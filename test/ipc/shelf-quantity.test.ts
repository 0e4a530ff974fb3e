/**
 * "Best from the shelf" respects how many of each part the shelf holds: a part that plans marked
 * as fitted (wired or done) on other engines use, one each, up to its quantity, is left out of the
 * search, and the answer says why. Real store file, real search (in this thread), nothing mocked.
 *
 * Hand-worked example. The search tries every module x coil x ballast choice, where the ballast
 * choice is "none" or each ballast with and without a cranking bypass (DEVELOPERS.md, check.search),
 * so a shelf without ballasts is tried modules x coils x 1 times:
 *   2 coils (five of the second, which the plans below also use), modules M1 (you have 1) and
 *   M2 (you have 2)                                             -> 2 x 2 x 1 = 4 combinations;
 *   M1 in a plan on engine B marked wired                       -> M1's 1 is used up: 1 x 2 x 1 = 2;
 *   M2 in a plan on engine B marked done (1 of 2 used)          -> M2 stays: still 2;
 *   M2 in a draft plan on engine C (a draft is not fitted)      -> still 2;
 *   M2 in a plan on engine C marked wired (2 of 2 used)         -> M2 left out too: 0 x 2 x 1 = 0.
 * Plans on the engine searched for never count (fitting it here is what the search is about).
 */
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { closeStore, openStore } from '../../db/open.js';
import { createRepositories, type Repositories } from '../../db/repositories/index.js';
import type { PartInput } from '../../db/schema.js';
import { searchShelf } from '../../electron/ipc/check-handlers.js';
import { coilIn, engineIn, moduleIn, planIn, tempDir } from '../db/samples.js';

let cleanup = (): void => {};
let repos: Repositories;
let close = (): void => {};
beforeEach(() => {
  const t = tempDir('shelf-quantity');
  cleanup = t.cleanup;
  const db = openStore(join(t.dir, 'workshop.sqlite3'));
  close = () => closeStore(db);
  repos = createRepositories(db);
});
afterEach(() => {
  close();
  cleanup();
});

const module = moduleIn as Extract<PartInput, { kind: 'module' }>;

describe('best from the shelf with quantities', () => {
  it('leaves out a part whose every one is fitted to plans marked wired or done on other engines, and says why', async () => {
    const c1 = repos.parts.create({ ...coilIn, name: 'Coil one' });
    // Five of coil two: the plans on B and C below use it too, three at most, so it is never used up.
    const c2 = repos.parts.create({ ...coilIn, name: 'Coil two', primaryResistanceOhm20C: 3, forBallast: false, quantity: 5 });
    const m1 = repos.parts.create({ ...module, name: 'Module one', quantity: 1 });
    const m2 = repos.parts.create({ ...module, name: 'Module two', maxCurrentA: 9, quantity: 2 });
    const a = repos.engines.create({ ...engineIn({ coilId: c1.id }), name: 'Engine A' });
    const b = repos.engines.create({ ...engineIn({ coilId: c2.id }), name: 'Engine B' });
    const c = repos.engines.create({ ...engineIn({ coilId: c2.id }), name: 'Engine C' });

    const search = () => searchShelf(repos, { engineId: a.id, top: 10 });
    const moduleIds = (answer: Awaited<ReturnType<typeof search>>) => [...new Set(answer.suggestions.map((s) => s.moduleId))].sort();

    let answer = await search();
    expect(answer.evaluated).toBe(2 * 2 * 1);
    expect(answer.leftOut).toEqual([]);
    expect(moduleIds(answer)).toEqual([m1.id, m2.id].sort());

    // A plan on this engine, even marked wired, does not count against the shelf.
    const here = repos.plans.create({ ...planIn(a.id, { moduleId: m1.id, coilId: c1.id }), name: 'Here' });
    repos.plans.setStatus(here.id, 'wired');
    expect((await search()).evaluated).toBe(4);

    const onB = repos.plans.create({ ...planIn(b.id, { moduleId: m1.id, coilId: c2.id }), name: 'Module one on B' });
    // Drafted and weighed only: nothing is fitted yet.
    repos.plans.setStatus(onB.id, 'checked');
    expect((await search()).evaluated).toBe(4);
    repos.plans.setStatus(onB.id, 'wired');
    answer = await search();
    expect(answer.evaluated).toBe(1 * 2 * 1);
    expect(moduleIds(answer)).toEqual([m2.id]);
    expect(answer.leftOut).toEqual([
      {
        partId: m1.id,
        partName: 'Module one',
        kind: 'module',
        quantity: 1,
        fittedTo: [{ planId: onB.id, planName: 'Module one on B', engineId: b.id, engineName: 'Engine B', status: 'wired' }],
        reason: 'Your only one is fitted to “Module one on B” on Engine B (marked wired).',
      },
    ]);

    // Module two: 1 of 2 used on B, a draft on C does not count, then a second fitted on C uses the last.
    const m2OnB = repos.plans.create({ ...planIn(b.id, { moduleId: m2.id, coilId: c2.id }), name: 'Module two on B' });
    repos.plans.setStatus(m2OnB.id, 'done');
    const m2OnC = repos.plans.create({ ...planIn(c.id, { moduleId: m2.id, coilId: c2.id }), name: 'Module two on C' });
    expect((await search()).evaluated).toBe(2);
    repos.plans.setStatus(m2OnC.id, 'wired');
    answer = await search();
    expect(answer.evaluated).toBe(0 * 2 * 1);
    expect(answer.suggestions).toEqual([]);
    expect(answer.leftOut.map((p) => [p.partId, p.reason])).toEqual([
      [m1.id, 'Your only one is fitted to “Module one on B” on Engine B (marked wired).'],
      [m2.id, 'Both of your 2 are fitted: to “Module two on B” on Engine B (marked done) and “Module two on C” on Engine C (marked wired).'],
    ]);

    // One more on the shelf and the module is tried again: 1 x 2 x 1 = 2.
    repos.parts.update(m2.id, { ...module, name: 'Module two', maxCurrentA: 9, quantity: 3 }, repos.parts.get(m2.id).updatedAt);
    answer = await search();
    expect(answer.evaluated).toBe(2);
    expect(moduleIds(answer)).toEqual([m2.id]);
  });

  it('keeps the parts of the searched engine’s own existing setup even when fitted elsewhere', async () => {
    const coil = repos.parts.create({ ...coilIn, name: 'Shared coil' });
    const mod = repos.parts.create({ ...module, name: 'Only module' });
    const a = repos.engines.create({ ...engineIn({ coilId: coil.id }), name: 'Engine A' });
    const b = repos.engines.create({ ...engineIn({ coilId: coil.id }), name: 'Engine B' });
    const onB = repos.plans.create({ ...planIn(b.id, { moduleId: mod.id, coilId: coil.id }), name: 'On B' });
    repos.plans.setStatus(onB.id, 'done');
    const answer = await searchShelf(repos, { engineId: a.id, top: 5 });
    // The coil is engine A's own (its existing setup), so it stays; the module is on B: 0 x 1 x 1 = 0.
    expect(answer.leftOut.map((p) => p.partName)).toEqual(['Only module']);
    expect(answer.evaluated).toBe(0);
  });
});
