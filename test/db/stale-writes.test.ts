/**
 * Issue 8, defect 1: ids were reused, so a stale screen deleted or overwrote someone else's record.
 * Ids now come from AUTOINCREMENT (sqlite.org/autoinc.html: "the ROWID chosen for the new row is
 * at least one larger than the largest ROWID that has ever before existed in that same table"), and
 * every update and delete carries the `updatedAt` the user saw. Real SQLite files throughout.
 */
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { StoreError } from '../../db/errors.js';
import { closeStore, openStore } from '../../db/open.js';
import { createRepositories, type Repositories } from '../../db/repositories/index.js';
import { coilIn, engineIn, planIn, readingIn, tempDir } from './samples.js';
import type Database from 'better-sqlite3';

function storeError(fn: () => unknown): StoreError {
  try {
    fn();
  } catch (err) {
    if (err instanceof StoreError) return err;
    throw err;
  }
  throw new Error('expected a StoreError, but the call succeeded');
}

let db: Database.Database;
let repos: Repositories;
let cleanup: () => void;
beforeEach(() => {
  const t = tempDir('stale');
  cleanup = t.cleanup;
  db = openStore(join(t.dir, 'workshop.sqlite3'));
  repos = createRepositories(db);
});
afterEach(() => {
  closeStore(db);
  cleanup();
});

describe('ids are never handed out twice', () => {
  it("the issue's case: a stale delete of deleted engine A cannot remove engine B and its plan", () => {
    const a = repos.engines.create({ ...engineIn(), name: 'Engine A' });
    repos.engines.delete(a.id, { deletePlansToo: false, expectedUpdatedAt: a.updatedAt });
    const b = repos.engines.create({ ...engineIn(), name: 'Engine B' });
    const plan = repos.plans.create(planIn(b.id));
    expect(b.id).not.toBe(a.id);
    // The stale screen still shows engine A and sends what it saw.
    const err = storeError(() => repos.engines.delete(a.id, { deletePlansToo: true, expectedUpdatedAt: a.updatedAt }));
    expect(err.code).toBe('NOT_FOUND');
    expect(repos.engines.get(b.id).name).toBe('Engine B');
    expect(repos.plans.get(plan.id).name).toBe(plan.name);
  });

  it('parts, plans and readings do not reuse the id of the newest deleted row either', () => {
    const coil = repos.parts.create(coilIn);
    repos.parts.delete(coil.id, coil.updatedAt);
    expect(repos.parts.create(coilIn).id).toBeGreaterThan(coil.id);
    const e = repos.engines.create(engineIn());
    const p = repos.plans.create(planIn(e.id));
    const r = repos.readings.add(readingIn(p.id));
    repos.readings.delete(r.id, r.updatedAt);
    expect(repos.readings.add(readingIn(p.id)).id).toBeGreaterThan(r.id);
    repos.plans.delete(p.id, p.updatedAt);
    expect(repos.plans.create(planIn(e.id)).id).toBeGreaterThan(p.id);
  });
});

describe('a write from a stale screen is refused and changes nothing', () => {
  it('engines: the second window’s save does not overwrite the first window’s', () => {
    const seen = repos.engines.create(engineIn());
    const first = repos.engines.update(seen.id, { ...engineIn(), name: 'Saved by window one' }, seen.updatedAt);
    const err = storeError(() => repos.engines.update(seen.id, { ...engineIn(), name: 'Saved by window two' }, seen.updatedAt));
    expect(err.code).toBe('STALE');
    expect(err.message).toMatch(/changed somewhere else after you opened it, so your changes were not saved.*Reload/);
    expect(repos.engines.get(seen.id)).toEqual(first);
    const del = storeError(() => repos.engines.delete(seen.id, { deletePlansToo: true, expectedUpdatedAt: seen.updatedAt }));
    expect(del.code).toBe('STALE');
    expect(del.message).toMatch(/was not deleted/);
    expect(repos.engines.get(seen.id)).toEqual(first);
  });

  it('parts, plans and readings likewise', () => {
    const coil = repos.parts.create(coilIn);
    const coil2 = repos.parts.update(coil.id, { ...coilIn, name: 'Renamed' }, coil.updatedAt);
    expect(storeError(() => repos.parts.update(coil.id, coilIn, coil.updatedAt)).code).toBe('STALE');
    expect(storeError(() => repos.parts.delete(coil.id, coil.updatedAt)).code).toBe('STALE');
    expect(repos.parts.get(coil.id)).toEqual(coil2);

    const e = repos.engines.create(engineIn());
    const p = repos.plans.create(planIn(e.id));
    const p2 = repos.plans.update(p.id, { ...planIn(e.id), name: 'Renamed plan' }, p.updatedAt);
    expect(storeError(() => repos.plans.update(p.id, planIn(e.id), p.updatedAt)).code).toBe('STALE');
    expect(storeError(() => repos.plans.delete(p.id, p.updatedAt)).code).toBe('STALE');
    expect(repos.plans.get(p.id)).toEqual(p2);

    const r = repos.readings.add(readingIn(p.id, 3.1));
    const r2 = repos.readings.update(r.id, readingIn(p.id, 3.2), r.updatedAt);
    expect(storeError(() => repos.readings.update(r.id, readingIn(p.id, 9), r.updatedAt)).code).toBe('STALE');
    expect(storeError(() => repos.readings.delete(r.id, r.updatedAt)).code).toBe('STALE');
    expect(repos.readings.get(r.id)).toEqual(r2);
  });

  it('gives every save a new version even when two saves fall in the same millisecond', () => {
    const e = repos.engines.create(engineIn());
    let seen = e;
    const versions = new Set([e.updatedAt]);
    for (let i = 0; i < 20; i++) {
      seen = repos.engines.update(e.id, { ...engineIn(), name: `Save ${i}` }, seen.updatedAt);
      versions.add(seen.updatedAt);
    }
    expect(versions.size).toBe(21);
  });

  it('moving a plan’s status (weighing, the sheet) does not make an open plan editor stale', () => {
    const e = repos.engines.create(engineIn());
    const p = repos.plans.create(planIn(e.id));
    repos.plans.setStatus(p.id, 'checked');
    const saved = repos.plans.update(p.id, { ...planIn(e.id), status: undefined, name: 'Edited' }, p.updatedAt);
    expect(saved).toMatchObject({ name: 'Edited', status: 'checked' });
  });
});
