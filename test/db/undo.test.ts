/**
 * Undo of a delete, on a real SQLite file: every delete keeps a copy of what it removed (the record
 * and all that went with it by ON DELETE CASCADE) until the app is closed, and `removed.restore`
 * puts it back with the same ids, byte for byte. What a restore needs that is gone since is named.
 */
import type Database from 'better-sqlite3';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { StoreError } from '../../db/errors.js';
import { closeStore, openStore } from '../../db/open.js';
import { createRepositories, type Repositories } from '../../db/repositories/index.js';
import { coilIn, engineIn, moduleIn, planIn, readingIn, tempDir } from './samples.js';

type Store = { db: Database.Database; repos: Repositories; cleanup(): void };
let s: Store;

beforeEach(() => {
  const t = tempDir('undo');
  const db = openStore(join(t.dir, 'workshop.sqlite3'));
  s = { db, repos: createRepositories(db, { onCorruptRow: () => undefined }), cleanup: () => (closeStore(db), t.cleanup()) };
});
afterEach(() => s.cleanup());

/** Every row of every table of ours, in a fixed order: what "the same records" means here. */
function dump(db: Database.Database): Record<string, unknown[]> {
  const out: Record<string, unknown[]> = {};
  for (const t of ['engines', 'advance_points', 'parts', 'plans', 'readings', 'sheet_ticks']) {
    out[t] = db.prepare(`SELECT * FROM ${t} ORDER BY 1, 2`).all();
  }
  return out;
}

function refusal(fn: () => unknown): StoreError {
  try {
    fn();
  } catch (e) {
    if (e instanceof StoreError) return e;
    throw e;
  }
  throw new Error('expected a refusal');
}

/** An engine with a coil, a module, two plans, three readings on the first and one sheet tick. */
function workshop() {
  const { repos, db } = s;
  const coil = repos.parts.create({ ...coilIn, name: 'Shelf coil' });
  const module = repos.parts.create({ ...moduleIn, name: 'Shelf module' });
  const engine = repos.engines.create({ ...engineIn({ coilId: coil.id }), name: 'Barn twin' });
  const first = repos.plans.create({ ...planIn(engine.id, { coilId: coil.id, moduleId: module.id }), name: 'First try' });
  const second = repos.plans.create({ ...planIn(engine.id, { coilId: coil.id }), name: 'Second try' });
  const readings = [3.1, 3.2, 3.3].map((v) => repos.readings.add(readingIn(first.id, v)));
  db.prepare("INSERT INTO sheet_ticks (plan_id, step_key, ticked_on) VALUES (?, 'before.battery-off', '2026-12-01')").run(first.id);
  return { coil, module, engine: repos.engines.get(engine.id), first, second, readings };
}

describe('undo of a delete', () => {
  it('an engine comes back with its curve, plans, readings and ticks, same ids, every column the same', () => {
    const w = workshop();
    const before = dump(s.db);
    const gone = s.repos.engines.delete(w.engine.id, { deletePlansToo: true, expectedUpdatedAt: w.engine.updatedAt });
    expect(gone.plansDeleted).toBe(2);
    expect(dump(s.db)['plans']).toEqual([]);
    expect(s.repos.removed.list()).toEqual([
      expect.objectContaining({ token: gone.undoToken, kind: 'engine', id: w.engine.id, label: 'Barn twin', plans: 2, readings: 3 }),
    ]);
    expect(s.repos.removed.restore(gone.undoToken)).toEqual({ kind: 'engine', id: w.engine.id, label: 'Barn twin' });
    expect(dump(s.db)).toEqual(before);
    expect(s.repos.removed.list()).toEqual([]);
  });

  it('a new record made after the delete takes a new id, and the restored one gets its own id back', () => {
    const w = workshop();
    const gone = s.repos.engines.delete(w.engine.id, { deletePlansToo: true, expectedUpdatedAt: w.engine.updatedAt });
    const newer = s.repos.engines.create({ ...engineIn({ coilId: w.coil.id }), name: 'Newer engine' });
    expect(newer.id).toBeGreaterThan(w.engine.id);
    s.repos.removed.restore(gone.undoToken);
    expect(s.repos.engines.get(w.engine.id).name).toBe('Barn twin');
    expect(s.repos.engines.get(newer.id).name).toBe('Newer engine');
  });

  it('a plan, a reading and a part each come back on their own', () => {
    const w = workshop();
    const before = dump(s.db);
    const reading = s.repos.readings.delete(w.readings[1]!.id, w.readings[1]!.updatedAt);
    const plan = s.repos.plans.delete(w.second.id, w.second.updatedAt);
    expect(s.repos.removed.list().map((r) => r.kind)).toEqual(['plan', 'reading']);
    s.repos.removed.restore(plan.undoToken);
    s.repos.removed.restore(reading.undoToken);
    expect(dump(s.db)).toEqual(before);

    const spare = s.repos.parts.create({ ...coilIn, name: 'Spare coil' });
    const part = s.repos.parts.delete(spare.id, spare.updatedAt);
    s.repos.removed.restore(part.undoToken);
    expect(s.repos.parts.get(spare.id)).toEqual(spare);
  });

  it('a plan whose part was removed after it is refused, naming the part, until the part is back', () => {
    const w = workshop();
    const plan = s.repos.plans.delete(w.first.id, w.first.updatedAt);
    const module = s.repos.parts.delete(w.module.id, w.module.updatedAt);
    const e = refusal(() => s.repos.removed.restore(plan.undoToken));
    expect(e.code).toBe('NOT_FOUND');
    expect(e.message).toContain('"Shelf module"');
    expect(e.message).toContain('Bring that back first');
    // Nothing half-restored: the plan and its readings are still out.
    expect(s.db.prepare('SELECT COUNT(*) AS n FROM readings').get()).toEqual({ n: 0 });
    s.repos.removed.restore(module.undoToken);
    s.repos.removed.restore(plan.undoToken);
    expect(s.repos.readings.list(w.first.id)).toHaveLength(3);
  });

  it('a plan whose engine is gone for good says so', () => {
    const w = workshop();
    const plan = s.repos.plans.delete(w.second.id, w.second.updatedAt);
    // The engine removed with a plain DELETE, as if the app had been restarted in between (nothing kept).
    s.db.prepare('DELETE FROM engines WHERE id = ?').run(w.engine.id);
    const e = refusal(() => s.repos.removed.restore(plan.undoToken));
    expect(e.message).toContain('removed for good');
  });

  it('undo twice: the second is refused with a sentence, nothing doubled', () => {
    const w = workshop();
    const gone = s.repos.readings.delete(w.readings[0]!.id, w.readings[0]!.updatedAt);
    s.repos.removed.restore(gone.undoToken);
    const e = refusal(() => s.repos.removed.restore(gone.undoToken));
    expect(e.message).toContain('no longer in the recently removed list');
    expect(s.repos.readings.list(w.first.id)).toHaveLength(3);
  });

  it('a refused delete (stale screen) keeps nothing to undo', () => {
    const w = workshop();
    refusal(() => s.repos.engines.delete(w.engine.id, { deletePlansToo: true, expectedUpdatedAt: '2000-01-01T00:00:00.000Z' }));
    refusal(() => s.repos.engines.delete(w.engine.id, { deletePlansToo: false, expectedUpdatedAt: w.engine.updatedAt }));
    expect(s.repos.removed.list()).toEqual([]);
  });

  it('a row that no longer parses is deleted and comes back unchanged', () => {
    const w = workshop();
    s.db.prepare(`UPDATE parts SET data = json_set(data, '$.primaryResistanceOhm20C', 'lots') WHERE id = ?`).run(w.coil.id);
    const raw = () => s.db.prepare('SELECT * FROM parts WHERE id = ?').get(w.coil.id);
    const row = raw();
    s.repos.engines.delete(w.engine.id, { deletePlansToo: true, expectedUpdatedAt: w.engine.updatedAt });
    const gone = s.repos.parts.delete(w.coil.id, (row as { updated_at: string }).updated_at);
    s.repos.removed.restore(gone.undoToken);
    expect(raw()).toEqual(row);
  });
});
