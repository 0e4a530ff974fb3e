/**
 * The repositories against real SQLite, both in memory and in a real file under the temp folder.
 * No mocks: a failure half-way is forced with a real trigger, corruption with a real UPDATE.
 */
import type Database from 'better-sqlite3';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { StoreError } from '../../db/errors.js';
import { closeStore, openStore } from '../../db/open.js';
import { createRepositories, type CorruptRow, type Repositories } from '../../db/repositories/index.js';
import { ballastIn, cdModuleIn, coilIn, engineIn, everyKind, leadsIn, moduleIn, planIn, plugIn, readingIn, tachIn, tempDir } from './samples.js';

const NOW = '2024-01-01T00:00:00.000Z';
type Store = { db: Database.Database; repos: Repositories; corrupt: CorruptRow[]; close(): void };

function open(where: 'memory' | 'file'): Store {
  const t = where === 'file' ? tempDir('repos') : null;
  const db = openStore(t ? join(t.dir, 'workshop.sqlite3') : ':memory:');
  const corrupt: CorruptRow[] = [];
  const repos = createRepositories(db, { onCorruptRow: (row) => corrupt.push(row) });
  return {
    db,
    repos,
    corrupt,
    close: () => {
      closeStore(db);
      t?.cleanup();
    },
  };
}

function counts(db: Database.Database): Record<string, number> {
  const out: Record<string, number> = {};
  for (const t of ['engines', 'advance_points', 'parts', 'plans', 'readings']) {
    out[t] = (db.prepare(`SELECT COUNT(*) AS n FROM ${t}`).get() as { n: number }).n;
  }
  return out;
}

/** Run `fn`, expecting a StoreError; return it for closer checks. */
function storeError(fn: () => unknown): StoreError {
  try {
    fn();
  } catch (err) {
    if (err instanceof StoreError) return err;
    throw err;
  }
  throw new Error('expected a StoreError, but the call succeeded');
}

describe.each(['memory', 'file'] as const)('repositories on %s', (where) => {
  let s: Store;
  beforeEach(() => {
    s = open(where);
  });
  afterEach(() => s.close());

  it.each(everyKind.map((p) => [p.kind, p] as const))('creates, reads, updates and deletes a %s part', (_kind, input) => {
    const created = s.repos.parts.create(input);
    // A part sent without `quantity` is one on the shelf (store version 5).
    expect(created).toEqual({ ...input, quantity: 1, id: created.id, updatedAt: created.updatedAt });
    expect(s.repos.parts.get(created.id)).toEqual(created);
    expect(s.repos.parts.list(input.kind).map((p) => p.id)).toEqual([created.id]);

    const renamed = s.repos.parts.update(created.id, { ...input, name: 'Renamed', notes: 'changed' }, created.updatedAt);
    expect(renamed).toEqual({ ...input, quantity: 1, name: 'Renamed', notes: 'changed', id: created.id, updatedAt: renamed.updatedAt });
    expect(renamed.updatedAt > created.updatedAt).toBe(true);
    expect(s.repos.parts.delete(created.id, renamed.updatedAt)).toEqual({ deleted: true, undoToken: expect.any(Number) });
    expect(storeError(() => s.repos.parts.get(created.id)).code).toBe('NOT_FOUND');
  });

  it('lists parts of one kind only when asked, and all kinds otherwise', () => {
    for (const p of everyKind) s.repos.parts.create(p);
    expect(s.repos.parts.list()).toHaveLength(everyKind.length);
    expect(s.repos.parts.list('module').map((p) => p.name).sort()).toEqual(['Test CD module', 'Test module']);
  });

  it('creates, reads, updates and deletes an engine with its advance curve', () => {
    const coil = s.repos.parts.create(coilIn);
    const ballast = s.repos.parts.create(ballastIn);
    const input = engineIn({ coilId: coil.id, ballastId: ballast.id });
    const created = s.repos.engines.create(input);
    expect(created).toEqual({ ...input, id: created.id, updatedAt: created.updatedAt });
    expect(s.repos.engines.get(created.id)).toEqual(created);
    expect(s.repos.engines.list()).toEqual([
      { id: created.id, name: 'Test four', yearText: 'about 1965', modelText: 'saloon', cylinders: 4, systemVoltageV: 12, earthPolarity: 'negative', planCount: 0, updatedAt: created.updatedAt },
    ]);

    const shorter = { ...input, name: 'Test four, re-curved', advanceCurve: [{ rpm: 1000, advanceDeg: 2 }, { rpm: 3000, advanceDeg: 20 }] };
    const saved = s.repos.engines.update(created.id, shorter, created.updatedAt);
    expect(saved).toEqual({ ...shorter, id: created.id, updatedAt: saved.updatedAt });
    expect(counts(s.db).advance_points).toBe(2);

    expect(s.repos.engines.delete(created.id, { deletePlansToo: false, expectedUpdatedAt: saved.updatedAt })).toEqual({ deleted: true, undoToken: expect.any(Number), plansDeleted: 0 });
    expect(counts(s.db)).toMatchObject({ engines: 0, advance_points: 0 });
  });

  it('creates, reads, updates and deletes a plan, and deleting it takes its readings', () => {
    const engine = s.repos.engines.create(engineIn());
    const module = s.repos.parts.create(moduleIn);
    const coil = s.repos.parts.create(coilIn);
    const input = planIn(engine.id, { moduleId: module.id, coilId: coil.id });
    const created = s.repos.plans.create(input);
    expect(created).toMatchObject({ ...input, id: created.id });
    expect(Number.isNaN(Date.parse(created.updatedAt))).toBe(false);
    expect(s.repos.plans.get(created.id)).toEqual(created);
    expect(s.repos.plans.list(engine.id)).toEqual([created]);
    expect(s.repos.engines.list()[0]!.planCount).toBe(1);

    const updated = s.repos.plans.update(created.id, { ...input, status: 'checked', crankingBypass: true }, created.updatedAt);
    expect(updated).toMatchObject({ status: 'checked', crankingBypass: true });

    const r1 = s.repos.readings.add(readingIn(created.id, 3.1));
    const r2 = s.repos.readings.add({ ...readingIn(created.id, 12.6), quantity: 'battery-voltage-resting', unit: 'V' });
    expect(s.repos.readings.list(created.id)).toEqual([r1, r2]);
    expect(s.repos.readings.delete(r1.id, r1.updatedAt)).toEqual({ deleted: true, undoToken: expect.any(Number), planId: created.id });
    expect(s.repos.readings.list(created.id)).toEqual([r2]);

    expect(s.repos.plans.delete(created.id, updated.updatedAt)).toEqual({ deleted: true, undoToken: expect.any(Number), readingsDeleted: 1 });
    expect(counts(s.db)).toMatchObject({ plans: 0, readings: 0 });
  });

  it('leaves nothing behind when an engine save fails at its third advance-curve row', () => {
    const before = counts(s.db);
    // A real trigger makes the third advance-point insert fail after the engine row went in.
    s.db.exec(`CREATE TEMP TRIGGER refuse_third_point BEFORE INSERT ON advance_points
               WHEN NEW.position = 2 BEGIN SELECT RAISE(ABORT, 'forced failure for the test'); END;`);
    expect(() => s.repos.engines.create(engineIn())).toThrow(/forced failure/);
    expect(counts(s.db)).toEqual(before);

    // And an update that fails the same way keeps the old curve and the old name.
    s.db.exec('DROP TRIGGER refuse_third_point');
    const engine = s.repos.engines.create({ ...engineIn(), advanceCurve: [{ rpm: 900, advanceDeg: 0 }] });
    s.db.exec(`CREATE TEMP TRIGGER refuse_third_point BEFORE INSERT ON advance_points
               WHEN NEW.position = 2 BEGIN SELECT RAISE(ABORT, 'forced failure for the test'); END;`);
    expect(() => s.repos.engines.update(engine.id, { ...engineIn(), name: 'Half-saved' }, engine.updatedAt)).toThrow(/forced failure/);
    expect(s.repos.engines.get(engine.id)).toEqual(engine);
  });
});

describe('references, refusals and cascades', () => {
  let s: Store;
  beforeEach(() => {
    s = open('memory');
  });
  afterEach(() => s.close());

  it('refuses to delete an engine its plans use, naming how many, and changes nothing', () => {
    const engine = s.repos.engines.create(engineIn());
    for (let i = 0; i < 3; i++) s.repos.plans.create({ ...planIn(engine.id), name: `Plan ${i}` });
    const before = counts(s.db);
    const err = storeError(() => s.repos.engines.delete(engine.id, { deletePlansToo: false, expectedUpdatedAt: engine.updatedAt }));
    expect(err.code).toBe('IN_USE');
    expect(err.message).toMatch(/^3 plans use this engine\./);
    expect(counts(s.db)).toEqual(before);
  });

  it('deletes the engine, its plans and their readings together once the user confirms', () => {
    const engine = s.repos.engines.create(engineIn());
    const other = s.repos.engines.create({ ...engineIn(), name: 'Other' });
    const p1 = s.repos.plans.create(planIn(engine.id));
    const p2 = s.repos.plans.create(planIn(engine.id));
    const kept = s.repos.plans.create(planIn(other.id));
    s.repos.readings.add(readingIn(p1.id));
    s.repos.readings.add(readingIn(p2.id));
    s.repos.readings.add(readingIn(kept.id));
    expect(s.repos.engines.delete(engine.id, { deletePlansToo: true, expectedUpdatedAt: engine.updatedAt })).toEqual({ deleted: true, undoToken: expect.any(Number), plansDeleted: 2 });
    expect(counts(s.db)).toMatchObject({ engines: 1, plans: 1, readings: 1 });
    expect(s.repos.plans.list()).toEqual([kept]);
  });

  it('refuses to delete a part a plan uses, or one named in an engine’s existing setup', () => {
    const coil = s.repos.parts.create(coilIn);
    const tach = s.repos.parts.create(tachIn);
    const engine = s.repos.engines.create({ ...engineIn(), existing: { ...engineIn().existing, tachPartId: tach.id } });
    s.repos.plans.create({ ...planIn(engine.id, { coilId: coil.id }), name: 'Coil swap' });

    const byPlan = storeError(() => s.repos.parts.delete(coil.id, coil.updatedAt));
    expect(byPlan.code).toBe('IN_USE');
    expect(byPlan.message).toContain('1 plan (Coil swap)');
    const byEngine = storeError(() => s.repos.parts.delete(tach.id, tach.updatedAt));
    expect(byEngine.code).toBe('IN_USE');
    expect(byEngine.message).toContain('existing setup of 1 engine (Test four)');
    expect(counts(s.db).parts).toBe(2);
  });

  it('refuses a plan whose coilId names a module, and one whose parts do not exist, field by field', () => {
    const engine = s.repos.engines.create(engineIn());
    const module = s.repos.parts.create(moduleIn);
    const err = storeError(() => s.repos.plans.create(planIn(engine.id, { coilId: module.id, plugId: 999 })));
    expect(err.code).toBe('INVALID_INPUT');
    expect(err.fields).toEqual({
      coilId: `Part ${module.id} is an ignition module, not a coil.`,
      plugId: 'There is no part with id 999 in the parts bin.',
    });
    const noEngine = storeError(() => s.repos.plans.create(planIn(42)));
    expect(noEngine.fields).toEqual({ engineId: 'There is no engine with id 42.' });
    expect(counts(s.db).plans).toBe(0);
  });

  it('refuses an engine whose existing coil is a ballast resistor', () => {
    const ballast = s.repos.parts.create(ballastIn);
    const err = storeError(() => s.repos.engines.create(engineIn({ coilId: ballast.id })));
    expect(err.fields).toEqual({ 'existing.coilPartId': `Part ${ballast.id} is a ballast resistor, not a coil.` });
    expect(counts(s.db).engines).toBe(0);
  });

  it('refuses to change the kind of a part that is in use, and allows it when the part is free', () => {
    const coil = s.repos.parts.create(coilIn);
    const engine = s.repos.engines.create(engineIn({ coilId: coil.id }));
    expect(storeError(() => s.repos.parts.update(coil.id, { ...plugIn }, coil.updatedAt)).fields).toHaveProperty('kind');
    s.repos.engines.update(engine.id, engineIn(), engine.updatedAt);
    const plug = s.repos.parts.update(coil.id, plugIn, coil.updatedAt);
    expect(plug).toEqual({ ...plugIn, quantity: 1, id: coil.id, updatedAt: plug.updatedAt });
  });

  it('validates input at the store boundary even if the bridge was skipped', () => {
    const bad = { ...engineIn(), cylinders: 4, pointsDwellDeg: 95 }; // 4 cylinders: dwell must stay below 90 degrees
    const err = storeError(() => s.repos.engines.create(bad));
    expect(err.code).toBe('INVALID_INPUT');
    expect(err.fields?.['pointsDwellDeg']).toMatch(/below 90/);
    expect(storeError(() => s.repos.parts.create({ ...coilIn, primaryResistanceOhm20C: -1 })).fields).toHaveProperty('primaryResistanceOhm20C');
    expect(storeError(() => s.repos.readings.add({ ...readingIn(1), takenOn: '9 March' })).fields).toHaveProperty('takenOn');
    expect(counts(s.db)).toEqual({ engines: 0, advance_points: 0, parts: 0, plans: 0, readings: 0 });
  });

  it('answers NOT_FOUND for ids that name nothing', () => {
    expect(storeError(() => s.repos.engines.get(5)).code).toBe('NOT_FOUND');
    expect(storeError(() => s.repos.engines.update(5, engineIn(), NOW)).code).toBe('NOT_FOUND');
    expect(storeError(() => s.repos.engines.delete(5, { deletePlansToo: true, expectedUpdatedAt: NOW })).code).toBe('NOT_FOUND');
    expect(storeError(() => s.repos.parts.update(5, coilIn, NOW)).code).toBe('NOT_FOUND');
    expect(storeError(() => s.repos.parts.delete(5, NOW)).code).toBe('NOT_FOUND');
    expect(storeError(() => s.repos.plans.get(5)).code).toBe('NOT_FOUND');
    expect(storeError(() => s.repos.plans.delete(5, NOW)).code).toBe('NOT_FOUND');
    expect(storeError(() => s.repos.plans.list(5)).code).toBe('NOT_FOUND');
    expect(storeError(() => s.repos.readings.list(5)).code).toBe('NOT_FOUND');
    expect(storeError(() => s.repos.readings.delete(5, NOW)).code).toBe('NOT_FOUND');
  });
});

describe('rows that no longer match the schema', () => {
  let s: Store;
  beforeEach(() => {
    s = open('file');
  });
  afterEach(() => s.close());

  it('names the table and id of a part whose JSON was edited out of shape, and lists the rest', () => {
    const good = s.repos.parts.create(coilIn);
    const bad = s.repos.parts.create(cdModuleIn);
    // Valid JSON (so the CHECK lets it in) but the CD stage's capacitor is now a word.
    s.db.prepare(`UPDATE parts SET data = json_set(data, '$.cd.capacitorUf', 'one') WHERE id = ?`).run(bad.id);

    const err = storeError(() => s.repos.parts.get(bad.id));
    expect(err.code).toBe('CORRUPT');
    expect(err.message).toContain(`id ${bad.id} in the parts table`);
    expect(err.message).toContain('cd.capacitorUf');

    expect(s.repos.parts.list()).toEqual([good]);
    expect(s.corrupt).toEqual([{ table: 'parts', id: bad.id, message: err.message }]);
  });

  it('gives CORRUPT, not a crash, for an engine whose existing setup lost a field', () => {
    const engine = s.repos.engines.create(engineIn());
    s.db.prepare(`UPDATE engines SET existing = json_remove(existing, '$.plugGapMm') WHERE id = ?`).run(engine.id);
    const err = storeError(() => s.repos.engines.get(engine.id));
    expect(err.code).toBe('CORRUPT');
    expect(err.message).toMatch(/id \d+ in the engines table could not be read \(existing\.plugGapMm/);
    // The list reads only plain columns, so the engine still shows and can be opened to repair or delete.
    expect(s.repos.engines.list().map((e) => e.id)).toEqual([engine.id]);
    expect(s.repos.engines.delete(engine.id, { deletePlansToo: false, expectedUpdatedAt: engine.updatedAt })).toEqual({ deleted: true, undoToken: expect.any(Number), plansDeleted: 0 });
  });
});

describe('the shared transaction', () => {
  it('rolls back every repository write made inside it when one of them fails', () => {
    const s = open('memory');
    expect(() =>
      s.repos.transaction(() => {
        s.repos.parts.create(coilIn);
        s.repos.parts.create(leadsIn);
        s.repos.engines.create({ ...engineIn(), boreMm: -1 });
      }),
    ).toThrow(StoreError);
    expect(counts(s.db).parts).toBe(0);
    s.close();
  });
});
