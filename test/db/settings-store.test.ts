/**
 * Store version 5 on real SQLite files in the system temp folder: the settings table (keys and
 * values checked with their zod schemas, unknown keys refused naming the key, all or nothing,
 * kept across a reopen) and the parts' quantity (a version-4 file with data upgrades with nothing
 * lost and every part counted as one; the repository keeps a typed count and refuses a bad one).
 */
import Database from 'better-sqlite3';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { StoreError } from '../../db/errors.js';
import { migrations } from '../../db/migrations/index.js';
import { migrate, readUserVersion } from '../../db/migrations/runner.js';
import { closeStore, openStore, SCHEMA_VERSION } from '../../db/open.js';
import { createEnginesRepository } from '../../db/repositories/engines.js';
import { createRepositories } from '../../db/repositories/index.js';
import { createPlansRepository } from '../../db/repositories/plans.js';
import { createReadingsRepository } from '../../db/repositories/readings.js';
import { createTicksRepository } from '../../db/repositories/ticks.js';
import type { CorruptRow } from '../../db/repositories/shared.js';
import { settingDefaults } from '../../db/schema.js';
import { coilIn, engineIn, moduleIn, planIn, readingIn, tempDir } from './samples.js';

const cleanups: Array<() => void> = [];
afterEach(() => {
  while (cleanups.length) cleanups.pop()!();
});
function storeFile(label: string): string {
  const t = tempDir(label);
  cleanups.push(t.cleanup);
  return join(t.dir, 'workshop.sqlite3');
}
function refusal(fn: () => unknown): StoreError {
  try {
    fn();
  } catch (err) {
    if (err instanceof StoreError) return err;
    throw err;
  }
  throw new Error('expected a refusal');
}

describe('settings', () => {
  it('start at their defaults and keep what is set across closing and reopening the file', () => {
    const file = storeFile('settings-keep');
    let db = openStore(file);
    let repos = createRepositories(db);
    expect(repos.settings.get()).toEqual({ lengthUnit: 'mm', workingEngineId: null, weighTicks: {}, firstRunHidden: false, lastScreen: 'engines', benchPlanId: null, pageSize: 'A4' });
    const answer = repos.settings.set({ lengthUnit: 'inch', workingEngineId: 4, weighTicks: { '4': [9, 7] }, lastScreen: 'combination' });
    expect(answer).toEqual({ lengthUnit: 'inch', workingEngineId: 4, weighTicks: { '4': [9, 7] }, firstRunHidden: false, lastScreen: 'combination', benchPlanId: null, pageSize: 'A4' });
    // A later write of one key leaves the others alone.
    repos.settings.set({ firstRunHidden: true, benchPlanId: 12, pageSize: 'Letter' });
    closeStore(db);

    db = openStore(file);
    repos = createRepositories(db);
    expect(repos.settings.get()).toEqual({ lengthUnit: 'inch', workingEngineId: 4, weighTicks: { '4': [9, 7] }, firstRunHidden: true, lastScreen: 'combination', benchPlanId: 12, pageSize: 'Letter' });
    repos.settings.set({ workingEngineId: null });
    expect(repos.settings.get().workingEngineId).toBeNull();
    closeStore(db);
  });

  it('refuse an unknown key by its name, and write nothing of that request', () => {
    const db = openStore(storeFile('settings-unknown'));
    const repos = createRepositories(db);
    const err = refusal(() => repos.settings.set({ lengthUnit: 'inch', colour: 'red' }));
    expect(err.code).toBe('INVALID_INPUT');
    expect(Object.keys(err.fields ?? {})).toEqual(['colour']);
    expect(err.fields!['colour']).toMatch(/no setting called “colour”/);
    // The valid key in the same request was not written either.
    expect(repos.settings.get()).toEqual(settingDefaults);
    expect(db.prepare('SELECT COUNT(*) AS n FROM settings').get()).toEqual({ n: 0 });
    closeStore(db);
  });

  it.each([
    ['lengthUnit', { lengthUnit: 'cm' }, 'lengthUnit', /"mm" or "inch"/],
    ['lengthUnit', { lengthUnit: null }, 'lengthUnit', /"mm" or "inch"/],
    ['workingEngineId', { workingEngineId: 0 }, 'workingEngineId', /engine id/],
    ['workingEngineId', { workingEngineId: 2.5 }, 'workingEngineId', /engine id/],
    ['weighTicks', { weighTicks: { '3': [1, 2, 3, 4] } }, 'weighTicks.3', /at most 3/],
    ['weighTicks', { weighTicks: { '3': [5, 5] } }, 'weighTicks.3', /only once/],
    ['weighTicks', { weighTicks: { first: [1] } }, 'weighTicks.first', /engine id/],
    ['firstRunHidden', { firstRunHidden: 'yes' }, 'firstRunHidden', /true or false/],
    ['lastScreen', { lastScreen: 'garage' }, 'lastScreen', /engines, parts, combination, sheet, records/],
    ['benchPlanId', { benchPlanId: -1 }, 'benchPlanId', /plan id/],
    ['pageSize', { pageSize: 'A3' }, 'pageSize', /A4 or Letter/],
  ])('refuse a bad %s value with a message on that field: %j', (_key, patch, field, message) => {
    const db = openStore(storeFile('settings-bad'));
    const repos = createRepositories(db);
    const err = refusal(() => repos.settings.set(patch));
    expect(err.code).toBe('INVALID_INPUT');
    expect(err.fields?.[field]).toMatch(message);
    expect(repos.settings.get()).toEqual(settingDefaults);
    closeStore(db);
  });

  it('read a damaged stored value as its default and say so, keeping the other keys', () => {
    const file = storeFile('settings-damaged');
    const db = openStore(file);
    const seen: CorruptRow[] = [];
    const repos = createRepositories(db, { onCorruptRow: (r) => seen.push(r) });
    repos.settings.set({ lengthUnit: 'inch', lastScreen: 'parts' });
    // As a hand edit or another program might leave it: valid JSON, wrong value.
    db.prepare(`UPDATE settings SET value = '"furlong"' WHERE key = 'lengthUnit'`).run();
    expect(repos.settings.get()).toEqual({ ...settingDefaults, lastScreen: 'parts' });
    expect(seen.map((r) => r.message)).toEqual([expect.stringMatching(/“lengthUnit” could not be read/)]);
    closeStore(db);
  });
});

describe('part quantity', () => {
  it('is one unless typed, is kept, and a count below one or not whole is refused naming the field', () => {
    const db = openStore(storeFile('quantity'));
    const repos = createRepositories(db);
    const one = repos.parts.create(coilIn);
    expect(one.quantity).toBe(1);
    const three = repos.parts.create({ ...moduleIn, quantity: 3 });
    expect(repos.parts.get(three.id).quantity).toBe(3);
    expect(db.prepare('SELECT quantity, json_extract(data, \'$.quantity\') AS inData FROM parts WHERE id = ?').get(three.id)).toEqual({ quantity: 3, inData: null });
    for (const bad of [0, -2, 1.5, '2']) {
      const err = refusal(() => repos.parts.update(one.id, { ...coilIn, quantity: bad as number }, repos.parts.get(one.id).updatedAt));
      expect(err.code).toBe('INVALID_INPUT');
      expect(err.fields?.['quantity']).toMatch(/How many you have must be/);
    }
    expect(repos.parts.get(one.id).quantity).toBe(1);
    repos.parts.update(one.id, { ...coilIn, quantity: 2 }, repos.parts.get(one.id).updatedAt);
    expect(repos.parts.get(one.id).quantity).toBe(2);
    closeStore(db);
  });

  it('a version-4 file with data upgrades to version 5 with nothing lost and every part counted as one', () => {
    const file = storeFile('v4-upgrade');
    // Build a version-4 file the way that version wrote it: parts in raw SQL (today's parts
    // repository writes the new column), the rest through the repositories that did not change.
    const v4 = new Database(file);
    v4.pragma('foreign_keys = ON');
    migrate(v4, migrations, 4);
    const insertPart = v4.prepare("INSERT INTO parts (kind, name, notes, data, created_at, updated_at) VALUES (?, ?, '', ?, '2024-05-01T10:00:00.000Z', '2024-05-01T10:00:00.000Z')");
    const { kind: ck, name: cn, notes: _cnotes, ...coilData } = coilIn;
    const { kind: mk, name: mn, notes: _mnotes, ...moduleData } = moduleIn as typeof moduleIn & { notes: string };
    const coilId = Number(insertPart.run(ck, cn, JSON.stringify(coilData)).lastInsertRowid);
    const moduleId = Number(insertPart.run(mk, mn, JSON.stringify(moduleData)).lastInsertRowid);
    const ctx = { db: v4, onCorruptRow: (r: CorruptRow) => { throw new Error(r.message); } };
    const engine = createEnginesRepository(ctx).create(engineIn({ coilId }));
    const plan = createPlansRepository(ctx).create(planIn(engine.id, { moduleId, coilId }));
    const reading = createReadingsRepository(ctx).add(readingIn(plan.id, 3.05));
    createTicksRepository(ctx).set(plan.id, 'fit.coil', true);
    const tables = ['parts', 'engines', 'advance_points', 'plans', 'readings', 'sheet_ticks'];
    const rows = (db: Database.Database, t: string) => db.prepare(`SELECT * FROM ${t} ORDER BY 1, 2`).all() as Array<Record<string, unknown>>;
    const before = Object.fromEntries(tables.map((t) => [t, rows(v4, t)]));
    expect(readUserVersion(v4)).toBe(4);
    v4.close();

    const db = openStore(file);
    expect(readUserVersion(db)).toBe(SCHEMA_VERSION);
    expect(SCHEMA_VERSION).toBe(5);
    for (const t of tables) {
      const expected = t === 'parts' ? before[t]!.map((r) => ({ ...r, quantity: 1 })) : before[t];
      expect(rows(db, t), t).toEqual(expected);
    }
    const seen: CorruptRow[] = [];
    const repos = createRepositories(db, { onCorruptRow: (r) => seen.push(r) });
    expect(repos.parts.list().map((p) => [p.id, p.name, p.quantity])).toEqual([
      [coilId, coilIn.name, 1],
      [moduleId, moduleIn.name, 1],
    ]);
    expect(repos.parts.get(coilId)).toMatchObject({ ...coilIn, quantity: 1 });
    expect(repos.engines.get(engine.id)).toMatchObject({ name: engine.name, existing: { coilPartId: coilId } });
    expect(repos.plans.get(plan.id)).toMatchObject({ moduleId, coilId, updatedAt: plan.updatedAt });
    expect(repos.readings.list(plan.id)).toEqual([reading]);
    expect(repos.ticks.list(plan.id).map((t) => t.stepKey)).toEqual(['fit.coil']);
    expect(repos.settings.get()).toEqual(settingDefaults);
    expect(seen).toEqual([]);
    closeStore(db);
  });
});
