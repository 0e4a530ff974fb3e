/**
 * The store's part of the wiring sheet, on real SQLite files under the temp folder: readings kept
 * in their quantity's one unit (converted or refused), real calendar dates, correcting a reading,
 * the sheet's ticks, the plan status set by hand, and a version-1 file upgraded on opening.
 * Unit factors are the SI prefixes (BIPM, The International System of Units, 9th edition, table 7:
 * milli 1e-3, kilo 1e3, mega 1e6) and the international inch (25.4 mm exactly, 1959 agreement).
 */
import Database from 'better-sqlite3';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { StoreError } from '../../db/errors.js';
import { migrations } from '../../db/migrations/index.js';
import { migrate } from '../../db/migrations/runner.js';
import { SCHEMA_VERSION, closeStore, openStore } from '../../db/open.js';
import { createEnginesRepository } from '../../db/repositories/engines.js';
import { createRepositories, type Repositories } from '../../db/repositories/index.js';
import { readingQuantities, readingUnits, type Plan, type ReadingInput } from '../../db/schema.js';
import { coilIn, engineIn, planIn, readingIn, tempDir } from './samples.js';

function storeError(fn: () => unknown): StoreError {
  try {
    fn();
  } catch (err) {
    if (err instanceof StoreError) return err;
    throw err;
  }
  throw new Error('expected a StoreError, but the call succeeded');
}

let cleanup: () => void = () => {};
let dir = '';
let db: Database.Database;
let repos: Repositories;
let plan: Plan;

beforeEach(() => {
  ({ dir, cleanup } = tempDir('sheet-store'));
  db = openStore(join(dir, 'workshop.sqlite3'));
  repos = createRepositories(db);
  const coil = repos.parts.create(coilIn);
  const engine = repos.engines.create(engineIn({ coilId: coil.id }));
  plan = repos.plans.create(planIn(engine.id, { coilId: coil.id }));
});
afterEach(() => {
  closeStore(db);
  cleanup();
});

const rows = (): number => (db.prepare('SELECT COUNT(*) AS n FROM readings').get() as { n: number }).n;
const at = (quantity: ReadingInput['quantity'], value: number, unit: string): ReadingInput => ({ ...readingIn(plan.id), quantity, value, unit });

describe('reading units', () => {
  it('gives every quantity exactly one unit, from the contract table', () => {
    expect(Object.keys(readingUnits).sort()).toEqual([...readingQuantities].sort());
    // The contract's table (notes/contract.md), written out here by hand.
    expect(readingUnits).toMatchObject({
      'coil-primary-resistance': 'ohm',
      'coil-secondary-resistance': 'kohm',
      'ballast-resistance': 'ohm',
      'ht-lead-resistance': 'kohm',
      'key-on-current': 'A',
      'supply-voltage-cranking': 'V',
      'dwell-angle': 'deg',
      'tach-idle-rpm': 'rpm',
      'timing-idle': 'deg',
      'plug-gap': 'mm',
      other: '',
    });
  });

  it('stores a coil read as 1400 mohm as 1.4 ohm, never as 1400 ohm', () => {
    const r = repos.readings.add(at('coil-primary-resistance', 1400, 'mohm'));
    expect(r.unit).toBe('ohm');
    expect(r.value).toBeCloseTo(1400 * 1e-3, 12);
    expect(repos.readings.list(plan.id)).toEqual([r]);
  });

  it.each([
    // [quantity, typed value, typed unit, stored value worked out by hand, stored unit]
    ['coil-primary-resistance', 1400, 'mΩ', 1400 * 1e-3, 'ohm'],
    ['coil-primary-resistance', 3.1, ' Ohms ', 3.1, 'ohm'],
    ['ballast-resistance', 0.0015, 'kohm', 0.0015 * 1e3, 'ohm'],
    ['ballast-resistance', 1.5, 'Ω', 1.5, 'ohm'],
    ['coil-secondary-resistance', 8200, 'ohm', 8200 / 1e3, 'kohm'],
    ['coil-secondary-resistance', 8.2, 'kΩ', 8.2, 'kohm'],
    ['ht-lead-resistance', 0.0056, 'Mohm', (0.0056 * 1e6) / 1e3, 'kohm'],
    ['ht-lead-resistance', 5.6, 'KOHM', 5.6, 'kohm'],
    ['battery-voltage-resting', 12600, 'mV', 12600 * 1e-3, 'V'],
    ['coil-switch-voltage-key-on', 250, 'mv', 250 * 1e-3, 'V'],
    ['key-on-current', 3900, 'mA', 3900 * 1e-3, 'A'],
    ['plug-gap', 0.025, 'in', 0.025 * 25.4, 'mm'],
    ['plug-gap', 0.025, 'Inch', 0.025 * 25.4, 'mm'],
    ['plug-gap', 35, 'thou', 35 * 0.001 * 25.4, 'mm'],
    ['dwell-angle', 54, '°', 54, 'deg'],
    ['tach-idle-rpm', 850, 'RPM', 850, 'rpm'],
  ] as const)('converts %s typed as %s %s to its own unit', (quantity, value, unit, stored, storedUnit) => {
    const r = repos.readings.add(at(quantity, value, unit));
    expect(r.unit).toBe(storedUnit);
    expect(r.value).toBeCloseTo(stored, 9);
  });

  it("keeps an 'other' reading's unit as typed, unconverted", () => {
    const r = repos.readings.add(at('other', 1400, 'mohm'));
    expect(r).toMatchObject({ quantity: 'other', value: 1400, unit: 'mohm' });
    expect(repos.readings.add(at('other', 3, ''))).toMatchObject({ unit: '' });
  });

  it.each([
    ['coil-primary-resistance', 'furlong', /"furlong" is not a unit.*kept in ohm.*ohm, mohm \(milliohm\), kohm or Mohm/],
    ['coil-primary-resistance', 'MOHM', /could mean milli or mega/],
    ['battery-voltage-resting', 'MV', /could mean milli or mega.*V or mV/],
    ['battery-voltage-resting', 'kV', /"kV" is not a unit.*V or mV/],
    ['key-on-current', 'ohm', /kept in A.*A or mA/],
    ['plug-gap', 'MM', /kept in mm.*mm, in \(inch\) or thou/],
    ['plug-gap', 'cm', /kept in mm/],
    ['dwell-angle', 'rad', /kept in deg/],
    ['supply-voltage-cranking', '', /Give the unit/],
  ] as const)('refuses %s in "%s" with a sentence on unit naming what it accepts, and stores nothing', (quantity, unit, message) => {
    const before = rows();
    const err = storeError(() => repos.readings.add(at(quantity, 12, unit)));
    expect(err.code).toBe('INVALID_INPUT');
    expect(Object.keys(err.fields ?? {})).toEqual(['unit']);
    expect(err.fields!.unit).toMatch(message);
    expect(rows()).toBe(before);
  });

  it('refuses a date that is not on the calendar, on takenOn', () => {
    for (const takenOn of ['2024-99-99', '2023-02-29', '2024-04-31', '2024-00-10']) {
      const err = storeError(() => repos.readings.add({ ...readingIn(plan.id), takenOn }));
      expect(err.fields, takenOn).toEqual({ takenOn: expect.stringMatching(/not a day on the calendar/) });
    }
    // 2024 is a leap year (divisible by 4, not by 100): 29 February exists; 2000 too (divisible by 400).
    expect(repos.readings.add({ ...readingIn(plan.id), takenOn: '2024-02-29' }).takenOn).toBe('2024-02-29');
    expect(repos.readings.add({ ...readingIn(plan.id), takenOn: '2000-02-29' }).takenOn).toBe('2000-02-29');
    expect(rows()).toBe(2);
  });

  it('refuses unknown keys in a reading rather than dropping them', () => {
    const err = storeError(() => repos.readings.add({ ...readingIn(plan.id), colour: 'red' } as ReadingInput));
    expect(err.code).toBe('INVALID_INPUT');
    expect(rows()).toBe(0);
  });
});

describe('correcting a reading', () => {
  it('replaces the reading, converting the unit, and keeps its id and plan', () => {
    const r = repos.readings.add(readingIn(plan.id, 3.1));
    const changed = repos.readings.update(r.id, { ...at('coil-primary-resistance', 2900, 'mohm'), takenOn: '2024-03-10', note: 'again, warm' }, r.updatedAt);
    expect(changed).toMatchObject({ id: r.id, planId: plan.id, unit: 'ohm', takenOn: '2024-03-10', note: 'again, warm' });
    expect(changed.value).toBeCloseTo(2900 * 1e-3, 12);
    expect(repos.readings.list(plan.id)).toEqual([changed]);
  });

  it('refuses a bad unit, another plan or a missing reading, and leaves the stored one as it was', () => {
    const r = repos.readings.add(readingIn(plan.id, 3.1));
    expect(storeError(() => repos.readings.update(r.id, at('coil-primary-resistance', 3, 'furlong'), r.updatedAt)).fields).toHaveProperty('unit');
    const other = repos.plans.create({ ...planIn(plan.engineId), name: 'Other' });
    expect(storeError(() => repos.readings.update(r.id, readingIn(other.id, 3), r.updatedAt)).fields).toHaveProperty('planId');
    expect(storeError(() => repos.readings.update(r.id + 100, readingIn(plan.id), r.updatedAt)).code).toBe('NOT_FOUND');
    expect(repos.readings.get(r.id)).toEqual(r);
  });
});

describe('sheet ticks', () => {
  it('ticks, keeps the first tick time, unticks, and lists in the order ticked', () => {
    expect(repos.ticks.list(plan.id)).toEqual([]);
    const first = repos.ticks.set(plan.id, 'fit.coil', true);
    expect(first).toEqual([{ planId: plan.id, stepKey: 'fit.coil', tickedOn: expect.stringMatching(/^\d{4}-\d{2}-\d{2}T/) }]);
    expect(repos.ticks.set(plan.id, 'fit.coil', true)).toEqual(first);
    expect(repos.ticks.set(plan.id, 'fit.module', true).map((t) => t.stepKey)).toEqual(['fit.coil', 'fit.module']);
    expect(repos.ticks.set(plan.id, 'fit.coil', false).map((t) => t.stepKey)).toEqual(['fit.module']);
    expect(repos.ticks.set(plan.id, 'fit.coil', false).map((t) => t.stepKey)).toEqual(['fit.module']);
  });

  it('refuses a blank, long or control-character key, and a plan that does not exist', () => {
    expect(storeError(() => repos.ticks.set(plan.id, '', true)).fields).toHaveProperty('stepKey');
    expect(storeError(() => repos.ticks.set(plan.id, 'x'.repeat(81), true)).fields).toEqual({ stepKey: expect.stringMatching(/80/) });
    expect(storeError(() => repos.ticks.set(plan.id, 'fit.coil\n', true)).fields).toEqual({ stepKey: expect.stringMatching(/control/) });
    expect(storeError(() => repos.ticks.set(plan.id, 'fit\u0000coil', true)).fields).toHaveProperty('stepKey');
    expect(repos.ticks.set(plan.id, 'x'.repeat(80), true)).toHaveLength(1);
    expect(storeError(() => repos.ticks.set(plan.id + 100, 'fit.coil', true)).code).toBe('NOT_FOUND');
    expect(storeError(() => repos.ticks.list(plan.id + 100)).code).toBe('NOT_FOUND');
  });

  it('goes with its plan, and survives closing and reopening the file', () => {
    repos.ticks.set(plan.id, 'fit.coil', true);
    closeStore(db);
    db = openStore(join(dir, 'workshop.sqlite3'));
    repos = createRepositories(db);
    expect(repos.ticks.list(plan.id).map((t) => t.stepKey)).toEqual(['fit.coil']);
    repos.plans.delete(plan.id, plan.updatedAt);
    expect(db.prepare('SELECT COUNT(*) AS n FROM sheet_ticks').get()).toEqual({ n: 0 });
  });
});

describe('plan status by hand', () => {
  it('sets any status in any direction and refuses one that is not a status', () => {
    expect(repos.plans.setStatus(plan.id, 'done').status).toBe('done');
    expect(repos.plans.setStatus(plan.id, 'draft').status).toBe('draft');
    expect(repos.plans.get(plan.id).status).toBe('draft');
    expect(storeError(() => repos.plans.setStatus(plan.id, 'finished' as Plan['status'])).fields).toEqual({ status: 'The status is draft, checked, wired or done.' });
    expect(storeError(() => repos.plans.setStatus(plan.id + 100, 'done')).code).toBe('NOT_FOUND');
    expect(repos.plans.get(plan.id)).toMatchObject({ ...planIn(plan.engineId, { coilId: plan.coilId }), status: 'draft' });
  });
});

describe('a version-1 file', () => {
  it('is upgraded on opening: its readings are converted, its records kept', () => {
    const file = join(dir, 'old.sqlite3');
    const raw = new Database(file);
    raw.pragma('foreign_keys = ON');
    migrate(raw, migrations, 1);
    // The part in raw SQL too: today's parts repository writes `quantity` (version 5), which a version-1 file lacks.
    const { kind: _k, name: coilName, notes: _n, ...coilData } = coilIn;
    const coil = {
      id: Number(
        raw
          .prepare("INSERT INTO parts (kind, name, notes, data, created_at, updated_at) VALUES ('coil', ?, '', ?, '2024-03-09T00:00:00Z', '2024-03-09T00:00:00Z')")
          .run(coilName, JSON.stringify(coilData)).lastInsertRowid,
      ),
    };
    const engine = createEnginesRepository({ db: raw, onCorruptRow: () => {} }).create(engineIn({ coilId: coil.id }));
    // The plan as version 1 wrote it (today's repository writes columns a version-1 file lacks).
    const p = {
      id: Number(
        raw
          .prepare("INSERT INTO plans (engine_id, name, status, coil_id, cranking_bypass, module_feed, plug_gap_mm, created_at, updated_at) VALUES (?, 'p', 'draft', ?, 0, 'switched-15', 0.8, '2024-03-09T00:00:00Z', '2024-03-09T00:00:00Z')")
          .run(engine.id, coil.id).lastInsertRowid,
      ),
    };
    const insert = raw.prepare("INSERT INTO readings (plan_id, quantity, value, unit, taken_on, note, created_at) VALUES (?, ?, ?, ?, '2024-03-09', '', '2024-03-09T00:00:00Z')");
    insert.run(p.id, 'coil-primary-resistance', 1400, 'mohm');
    insert.run(p.id, 'plug-gap', 0.025, 'inch');
    raw.close();

    const upgraded = openStore(file);
    const r = createRepositories(upgraded).readings.list(p.id);
    expect(r.map((x) => [x.quantity, x.unit])).toEqual([
      ['coil-primary-resistance', 'ohm'],
      ['plug-gap', 'mm'],
    ]);
    expect(r[0]!.value).toBeCloseTo(1400 * 1e-3, 12);
    expect(r[1]!.value).toBeCloseTo(0.025 * 25.4, 12);
    expect(upgraded.pragma('user_version', { simple: true })).toBe(SCHEMA_VERSION);
    expect(createRepositories(upgraded).parts.get(coil.id)).toMatchObject({ ...coilIn, quantity: 1 });
    closeStore(upgraded);
  });
});
