/**
 * The migration chain and the way the file is opened. Real SQLite throughout: `:memory:` for each
 * migration on its own, real files under the system temp folder for the chain, reopening and the
 * refusal of a newer file. Pragma meanings are from the SQLite documentation (sqlite.org/pragma.html):
 * synchronous FULL = 2, NORMAL = 1; journal_mode of an in-memory database is "memory".
 */
import Database from 'better-sqlite3';
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { StoreError } from '../../db/errors.js';
import { migrations, type Migration } from '../../db/migrations/index.js';
import { checkMigrationList, migrate, readUserVersion } from '../../db/migrations/runner.js';
import { BUSY_TIMEOUT_MS, SCHEMA_VERSION, closeStore, openStore } from '../../db/open.js';
import { createRepositories } from '../../db/repositories/index.js';
import { coilIn, engineIn, tempDir } from './samples.js';

const cleanups: Array<() => void> = [];
afterEach(() => {
  while (cleanups.length) cleanups.pop()!();
});
function temp(label: string): string {
  const t = tempDir(label);
  cleanups.push(t.cleanup);
  return t.dir;
}
function sha(file: string): string {
  return createHash('sha256').update(readFileSync(file)).digest('hex');
}
function rawMemory(): Database.Database {
  const db = new Database(':memory:');
  db.pragma('foreign_keys = ON');
  return db;
}
function tables(db: Database.Database): string[] {
  return db
    .prepare<[], { name: string }>("SELECT name FROM sqlite_master WHERE type = 'table' ORDER BY name")
    .all()
    .map((r) => r.name);
}
const NOW = '2024-01-01T00:00:00.000Z';

/** For each version: seed rows the way that version's schema expects, then assert what it promises. */
const perVersion: Record<number, (db: Database.Database) => void> = {
  1: (db) => {
    expect(tables(db)).toEqual(['advance_points', 'engines', 'meta', 'parts', 'plans', 'readings']);
    db.prepare("INSERT INTO parts (kind, name, data, created_at, updated_at) VALUES ('coil', 'c', '{}', ?, ?)").run(NOW, NOW);
    db.prepare(
      `INSERT INTO engines (name, cylinders, cycle, firing_order, bore_mm, stroke_mm, con_rod_mm, compression_ratio,
         idle_rpm, cranking_rpm, redline_rpm, system_voltage_v, earth_polarity, charging, points_dwell_deg, points_gap_mm,
         static_timing_deg_btdc, existing, created_at, updated_at)
       VALUES ('e', 4, 'four-stroke', '1-3-4-2', 80, 80, 130, 8.5, 800, 150, 6000, 12, 'negative', 'dynamo', 60, 0.4, 8, '{}', ?, ?)`,
    ).run(NOW, NOW);
    db.prepare('INSERT INTO advance_points (engine_id, position, rpm, advance_deg) VALUES (1, 0, 800, 0), (1, 1, 2000, 12)').run();
    db.prepare(
      `INSERT INTO plans (engine_id, name, status, coil_id, cranking_bypass, module_feed, plug_gap_mm, created_at, updated_at)
       VALUES (1, 'p', 'draft', 1, 0, 'switched-15', 0.8, ?, ?)`,
    ).run(NOW, NOW);
    db.prepare("INSERT INTO readings (plan_id, quantity, value, unit, taken_on, created_at) VALUES (1, 'other', 1, 'V', '2024-01-01', ?)").run(NOW);

    // A part a plan uses cannot be deleted, even by raw SQL (ON DELETE RESTRICT).
    expect(() => db.prepare('DELETE FROM parts WHERE id = 1').run()).toThrow(/FOREIGN KEY/);
    // STRICT tables refuse a wrong type rather than storing it.
    expect(() => db.prepare("UPDATE engines SET cylinders = 'four' WHERE id = 1").run()).toThrow(/cannot store TEXT/);
    // CHECK constraints refuse an unknown plan status and JSON that is not JSON.
    expect(() => db.prepare("UPDATE plans SET status = 'finished' WHERE id = 1").run()).toThrow(/CHECK/);
    expect(() => db.prepare("UPDATE parts SET data = '{not json' WHERE id = 1").run()).toThrow(/CHECK/);
    // Deleting the engine takes its curve, its plans and their readings with it (ON DELETE CASCADE).
    db.prepare('DELETE FROM engines WHERE id = 1').run();
    for (const t of ['advance_points', 'plans', 'readings']) {
      expect(db.prepare(`SELECT COUNT(*) AS n FROM ${t}`).get()).toEqual({ n: 0 });
    }
    expect(db.prepare('SELECT COUNT(*) AS n FROM parts').get()).toEqual({ n: 1 });
  },
  2: (db) => {
    expect(tables(db)).toEqual(['advance_points', 'engines', 'meta', 'parts', 'plans', 'readings', 'sheet_ticks']);
    seedPlan(db);
    db.prepare("INSERT INTO sheet_ticks (plan_id, step_key, ticked_on) VALUES (1, 'fit.coil', ?), (1, 'fit.module', ?)").run(NOW, NOW);
    // One tick per step of a plan (the primary key), only for a plan that exists, and STRICT types.
    expect(() => db.prepare("INSERT INTO sheet_ticks (plan_id, step_key, ticked_on) VALUES (1, 'fit.coil', ?)").run(NOW)).toThrow(/UNIQUE/);
    expect(() => db.prepare("INSERT INTO sheet_ticks (plan_id, step_key, ticked_on) VALUES (99, 'fit.coil', ?)").run(NOW)).toThrow(/FOREIGN KEY/);
    expect(() => db.prepare("INSERT INTO sheet_ticks (plan_id, step_key, ticked_on) VALUES ('one', 'x', ?)").run(NOW)).toThrow(/cannot store TEXT/);
    // Deleting the plan takes its ticks (ON DELETE CASCADE).
    db.prepare('DELETE FROM plans WHERE id = 1').run();
    expect(db.prepare('SELECT COUNT(*) AS n FROM sheet_ticks').get()).toEqual({ n: 0 });

    // Readings stored by version 1 in other units come out of the upgrade in their quantity's unit.
    const old = rawMemory();
    migrate(old, migrations, 1);
    seedPlan(old);
    const add = old.prepare("INSERT INTO readings (plan_id, quantity, value, unit, taken_on, note, created_at) VALUES (1, ?, ?, ?, '2024-03-09', ?, ?)");
    const seeded: Array<[string, number, string, string]> = [
      ['coil-primary-resistance', 1400, 'mohm', 'bench'], // milli = 1e-3 (BIPM SI Brochure, 9th ed., table 7): 1400 x 1e-3 = 1.4 ohm
      ['coil-primary-resistance', 3.1, 'Ohms', ''],
      ['ballast-resistance', 1.5, 'Ω', ''],
      ['ballast-resistance', 0.0015, 'kohm', ''], // kilo = 1e3: 0.0015 x 1e3 = 1.5 ohm
      ['ht-lead-resistance', 5600, 'ohm', ''], // 5600 ohm / 1e3 = 5.6 kohm
      ['ht-lead-resistance', 0.0056, 'Mohm', ''], // mega = 1e6: 0.0056 x 1e6 / 1e3 = 5.6 kohm
      ['battery-voltage-resting', 12600, 'mV', ''], // 12600 x 1e-3 = 12.6 V
      ['supply-voltage-cranking', 9.8, 'v', ''],
      ['dwell-angle', 54, 'degrees', ''],
      ['plug-gap', 0.025, 'in', ''], // inch = 25.4 mm exactly (1959 agreement): 0.025 x 25.4 = 0.635 mm
      ['plug-gap', 35, 'thou', ''], // thou = 0.001 inch = 0.0254 mm: 35 x 0.0254 = 0.889 mm
      ['coil-primary-resistance', 1400, 'MOHM', 'caps lock?'], // milli or mega: not guessed at
      ['supply-voltage-running', 14, 'furlong', ''],
      ['other', 1, 'V', 'kept'],
      ['coil-primary-resistance', 3.0, 'ohm', 'already right'],
    ];
    for (const [q, v, u, note] of seeded) add.run(q, v, u, note, NOW);
    migrate(old, migrations, 2);
    const rows = old.prepare<[], { quantity: string; value: number; unit: string; note: string }>('SELECT quantity, value, unit, note FROM readings ORDER BY id').all();
    const expected: Array<[string, number, string]> = [
      ['coil-primary-resistance', 1400 * 1e-3, 'ohm'],
      ['coil-primary-resistance', 3.1, 'ohm'],
      ['ballast-resistance', 1.5, 'ohm'],
      ['ballast-resistance', 0.0015 * 1e3, 'ohm'],
      ['ht-lead-resistance', 5600 / 1e3, 'kohm'],
      ['ht-lead-resistance', (0.0056 * 1e6) / 1e3, 'kohm'],
      ['battery-voltage-resting', 12600 * 1e-3, 'V'],
      ['supply-voltage-cranking', 9.8, 'V'],
      ['dwell-angle', 54, 'deg'],
      ['plug-gap', 0.025 * 25.4, 'mm'],
      ['plug-gap', 35 * 0.0254, 'mm'],
      ['other', 1400, 'MOHM'],
      ['other', 14, 'furlong'],
      ['other', 1, 'V'],
      ['coil-primary-resistance', 3.0, 'ohm'],
    ];
    expect(rows).toHaveLength(expected.length);
    rows.forEach((row, i) => {
      const [q, v, u] = expected[i]!;
      expect(row.quantity, `row ${i + 1}`).toBe(q);
      expect(row.value, `row ${i + 1}`).toBeCloseTo(v, 9);
      expect(row.unit, `row ${i + 1}`).toBe(u);
    });
    // A moved reading keeps its value and unit, and its note says what it was recorded as.
    expect(rows[11]!.note).toMatch(/^\(Recorded as coil-primary-resistance in "MOHM", which could not be converted to ohm\.\) caps lock\?$/);
    expect(rows[12]!.note).toMatch(/supply-voltage-running in "furlong".*to V\.\) $/);
    expect(rows[13]!.note).toBe('kept');
    // Every row reads back through today's repositories (none skipped as unreadable) once the file is current.
    migrate(old, migrations);
    const corrupt: unknown[] = [];
    expect(createRepositories(old, { onCorruptRow: (r) => corrupt.push(r) }).readings.list(1)).toHaveLength(expected.length);
    expect(corrupt).toEqual([]);
    old.close();
  },
  3: (db) => {
    expect(tables(db)).toEqual(['advance_points', 'engines', 'meta', 'parts', 'plans', 'readings', 'sheet_ticks']);
    seedPlan(db);
    // A plan written without the column (as versions 1 and 2 wrote every plan) reads as wired as marked.
    expect(db.prepare('SELECT coil_wiring FROM plans WHERE id = 1').get()).toEqual({ coil_wiring: 'as-marked-for-earth' });
    db.prepare("UPDATE plans SET coil_wiring = 'reversed' WHERE id = 1").run();
    // Only the two wirings, and never NULL.
    expect(() => db.prepare("UPDATE plans SET coil_wiring = 'sideways' WHERE id = 1").run()).toThrow(/CHECK/);
    expect(() => db.prepare('UPDATE plans SET coil_wiring = NULL WHERE id = 1').run()).toThrow(/NOT NULL/);

    // Plans stored by version 2 keep every field through the upgrade and read back through the repository.
    const old = rawMemory();
    migrate(old, migrations, 2);
    seedPlan(old);
    migrate(old, migrations, 3);
    expect(old.prepare('SELECT coil_wiring FROM plans WHERE id = 1').get()).toEqual({ coil_wiring: 'as-marked-for-earth' });
    // Today's repositories read a current file, so bring it up to date first.
    migrate(old, migrations);
    const corrupt: unknown[] = [];
    const plan = createRepositories(old, { onCorruptRow: (r) => corrupt.push(r) }).plans.get(1);
    expect(corrupt).toEqual([]);
    expect(plan).toMatchObject({ name: 'p', coilId: 1, moduleFeed: 'switched-15', plugGapMm: 0.8, coilWiring: 'as-marked-for-earth' });
    old.close();
  },
  4: (db) => {
    expect(tables(db)).toEqual(['advance_points', 'engines', 'meta', 'parts', 'plans', 'readings', 'sheet_ticks', 'sqlite_sequence']);
    seedPlan(db);
    // The defect this version fixes: delete the newest engine, add another; SQLite's plain rowid
    // would hand out the same id again (largest + 1), AUTOINCREMENT never does (sqlite.org/autoinc.html).
    db.prepare('DELETE FROM plans WHERE id = 1').run();
    db.prepare('DELETE FROM engines WHERE id = 1').run();
    seedPlan(db);
    expect(db.prepare('SELECT id FROM engines').all()).toEqual([{ id: 2 }]);
    expect(db.prepare('SELECT id FROM plans').all()).toEqual([{ id: 2 }]);
    expect(db.prepare('SELECT id FROM parts ORDER BY id').all()).toEqual([{ id: 1 }, { id: 2 }]);
    db.prepare("INSERT INTO readings (plan_id, quantity, value, unit, taken_on, created_at, updated_at) VALUES (2, 'other', 1, 'V', '2024-01-01', ?, ?)").run(NOW, NOW);
    db.prepare('DELETE FROM readings').run();
    db.prepare("INSERT INTO readings (plan_id, quantity, value, unit, taken_on, created_at, updated_at) VALUES (2, 'other', 1, 'V', '2024-01-01', ?, ?)").run(NOW, NOW);
    expect(db.prepare('SELECT id FROM readings').all()).toEqual([{ id: 2 }]);
    expect(() => db.prepare("INSERT INTO readings (plan_id, quantity, value, unit, taken_on, created_at) VALUES (2, 'other', 1, 'V', '2024-01-01', ?)").run(NOW)).toThrow(/NOT NULL/);

    // A version-3 file keeps every row, id and reference through the rebuild; readings get updated_at = created_at.
    const old = rawMemory();
    migrate(old, migrations, 3);
    seedPlan(old);
    old.prepare('INSERT INTO advance_points (engine_id, position, rpm, advance_deg) VALUES (1, 0, 800, 0), (1, 1, 2000, 12)').run();
    old.prepare("UPDATE plans SET coil_wiring = 'reversed' WHERE id = 1").run();
    old.prepare("INSERT INTO readings (id, plan_id, quantity, value, unit, taken_on, note, created_at) VALUES (7, 1, 'other', 1, 'V', '2024-01-01', 'kept', '2024-02-02T00:00:00.000Z')").run();
    old.prepare("INSERT INTO sheet_ticks (plan_id, step_key, ticked_on) VALUES (1, 'fit.coil', ?)").run(NOW);
    const before = (t: string) => old.prepare(`SELECT * FROM ${t} ORDER BY 1`).all();
    const kept = Object.fromEntries(['parts', 'engines', 'plans', 'advance_points', 'sheet_ticks'].map((t) => [t, before(t)]));
    migrate(old, migrations, 4);
    for (const [t, rows] of Object.entries(kept)) expect(before(t), t).toEqual(rows);
    expect(old.prepare('SELECT id, note, created_at, updated_at FROM readings').all()).toEqual([
      { id: 7, note: 'kept', created_at: '2024-02-02T00:00:00.000Z', updated_at: '2024-02-02T00:00:00.000Z' },
    ]);
    expect(old.pragma('foreign_key_check')).toEqual([]);
    const indexes = old.prepare<[], { name: string }>("SELECT name FROM sqlite_master WHERE type = 'index' AND name NOT LIKE 'sqlite_%' ORDER BY name").all().map((r) => r.name);
    expect(indexes).toEqual(['parts_by_kind', 'plans_by_ballast', 'plans_by_coil', 'plans_by_engine', 'plans_by_leads', 'plans_by_module', 'plans_by_plug', 'plans_by_tach', 'readings_by_plan']);
    // The references still guard and cascade after the rename.
    expect(() => old.prepare('DELETE FROM parts WHERE id = 1').run()).toThrow(/FOREIGN KEY/);
    old.prepare('DELETE FROM engines WHERE id = 1').run();
    for (const t of ['advance_points', 'plans', 'readings', 'sheet_ticks']) expect(old.prepare(`SELECT COUNT(*) AS n FROM ${t}`).get(), t).toEqual({ n: 0 });
    // The deleted engine's and reading's ids are not handed out again.
    seedPlan(old);
    expect(old.prepare('SELECT id FROM engines').all()).toEqual([{ id: 2 }]);
    old.close();
  },
  5: (db) => {
    expect(tables(db)).toEqual(['advance_points', 'engines', 'meta', 'parts', 'plans', 'readings', 'settings', 'sheet_ticks', 'sqlite_sequence']);
    seedPlan(db);
    // A part written without the column (as every earlier version wrote parts) is one on the shelf.
    expect(db.prepare('SELECT quantity FROM parts WHERE id = 1').get()).toEqual({ quantity: 1 });
    db.prepare('UPDATE parts SET quantity = 3 WHERE id = 1').run();
    expect(() => db.prepare('UPDATE parts SET quantity = 0 WHERE id = 1').run()).toThrow(/CHECK/);
    expect(() => db.prepare('UPDATE parts SET quantity = NULL WHERE id = 1').run()).toThrow(/NOT NULL/);
    // STRICT: an integer column refuses text.
    expect(() => db.prepare("UPDATE parts SET quantity = 'two' WHERE id = 1").run()).toThrow(/cannot store TEXT/);
    // settings: one row a key, the value JSON.
    db.prepare("INSERT INTO settings (key, value, updated_at) VALUES ('lengthUnit', '\"inch\"', ?)").run(NOW);
    expect(() => db.prepare("INSERT INTO settings (key, value, updated_at) VALUES ('lengthUnit', '\"mm\"', ?)").run(NOW)).toThrow(/UNIQUE|PRIMARY KEY/);
    expect(() => db.prepare("INSERT INTO settings (key, value, updated_at) VALUES ('lastScreen', 'not json', ?)").run(NOW)).toThrow(/CHECK/);

    // A version-4 file keeps every row through the upgrade; its parts read back as one each.
    const old = rawMemory();
    migrate(old, migrations, 4);
    seedPlan(old);
    const before = (t: string) => old.prepare(`SELECT * FROM ${t} ORDER BY 1`).all() as Array<Record<string, unknown>>;
    const kept = Object.fromEntries(['engines', 'plans', 'readings', 'sheet_ticks'].map((t) => [t, before(t)]));
    const parts = before('parts');
    migrate(old, migrations, 5);
    for (const [t, rows] of Object.entries(kept)) expect(before(t), t).toEqual(rows);
    expect(before('parts')).toEqual(parts.map((p) => ({ ...p, quantity: 1 })));
    expect(before('settings')).toEqual([]);
    old.close();
  },
};

/** An engine with one plan (id 1), in raw SQL, as versions 1 and 2 store them. */
function seedPlan(db: Database.Database): void {
  db.prepare("INSERT INTO parts (kind, name, data, created_at, updated_at) VALUES ('coil', 'c', '{}', ?, ?)").run(NOW, NOW);
  db.prepare(
    `INSERT INTO engines (name, cylinders, cycle, firing_order, bore_mm, stroke_mm, con_rod_mm, compression_ratio,
       idle_rpm, cranking_rpm, redline_rpm, system_voltage_v, earth_polarity, charging, points_dwell_deg, points_gap_mm,
       static_timing_deg_btdc, existing, created_at, updated_at)
     VALUES ('e', 4, 'four-stroke', '1-3-4-2', 80, 80, 130, 8.5, 800, 150, 6000, 12, 'negative', 'dynamo', 60, 0.4, 8, '{}', ?, ?)`,
  ).run(NOW, NOW);
  db.prepare(
    `INSERT INTO plans (engine_id, name, status, coil_id, cranking_bypass, module_feed, plug_gap_mm, created_at, updated_at)
     VALUES ((SELECT max(id) FROM engines), 'p', 'draft', (SELECT max(id) FROM parts), 0, 'switched-15', 0.8, ?, ?)`,
  ).run(NOW, NOW);
}

describe('the migration list', () => {
  it('has a seed-and-assert spec in this file for every migration', () => {
    expect(Object.keys(perVersion).map(Number)).toEqual(migrations.map((m) => m.version));
  });

  it('numbers its migrations 1, 2, 3 ... so versions only go up', () => {
    expect(() => checkMigrationList(migrations)).not.toThrow();
    expect(SCHEMA_VERSION).toBe(migrations.length);
  });

  it('rejects a list with a gap or a repeat', () => {
    const m1 = migrations[0]!;
    expect(() => checkMigrationList([m1, { ...m1, version: 3 }])).toThrow(/expected 2/);
    expect(() => checkMigrationList([m1, m1])).toThrow(/expected 2/);
  });
});

describe.each(migrations.map((m) => [m.version, m] as const))('migration %i', (version, m) => {
  it(`migrates a fresh in-memory database to version ${version} (${m.name}), then holds and guards its seed rows`, () => {
    const db = rawMemory();
    migrate(db, migrations, version);
    expect(readUserVersion(db)).toBe(version);
    perVersion[version]!(db);
    db.close();
  });
});

describe('the runner', () => {
  it('leaves the file at the previous version, with none of its tables, when a migration fails half-way', () => {
    const broken: Migration = { version: 2, name: 'broken', sql: 'CREATE TABLE half_done (x INTEGER); INSERT INTO no_such_table VALUES (1);' };
    const db = rawMemory();
    expect(() => migrate(db, [...migrations.slice(0, 1), broken])).toThrow(/no such table/);
    expect(readUserVersion(db)).toBe(1);
    expect(tables(db)).not.toContain('half_done');
    db.close();
  });

  // A table rebuild in SQLite's documented order (sqlite.org/lang_altertable.html): new table,
  // copy, drop old, rename. Here it adds a CHECK on part names to a seeded version-1 file.
  const rebuildParts = (copyWhere: string): Migration => ({
    version: 2,
    name: 'rebuild parts with a name check',
    rebuildsTables: true,
    destructiveBecause: 'test only: rebuilds parts; every row is copied before the old table is dropped',
    sql: `CREATE TABLE parts_new (id INTEGER PRIMARY KEY, kind TEXT NOT NULL, name TEXT NOT NULL CHECK (length(name) > 0),
            notes TEXT NOT NULL DEFAULT '', data TEXT NOT NULL CHECK (json_valid(data)), created_at TEXT NOT NULL, updated_at TEXT NOT NULL) STRICT;
          INSERT INTO parts_new SELECT * FROM parts WHERE ${copyWhere};
          DROP TABLE parts;
          ALTER TABLE parts_new RENAME TO parts;`,
  });
  it('rebuilds a table with foreign keys off, keeps every reference, and turns foreign keys back on', () => {
    const db = rawMemory();
    migrate(db, migrations, 1);
    // Raw SQL: today's repositories write columns a version-1 file does not have.
    seedPlan(db);
    const coil = { id: 1 };
    migrate(db, [...migrations.slice(0, 1), rebuildParts('1')]);
    expect(readUserVersion(db)).toBe(2);
    expect(db.pragma('foreign_keys', { simple: true })).toBe(1);
    expect(db.pragma('foreign_key_check')).toEqual([]);
    expect(() => db.prepare('DELETE FROM parts WHERE id = ?').run(coil.id)).toThrow(/FOREIGN KEY/);
    db.close();
  });

  it('rolls a rebuild back whole when it would orphan a plan’s part reference', () => {
    const db = rawMemory();
    migrate(db, migrations, 1);
    // Raw SQL: today's repositories write columns a version-1 file does not have.
    seedPlan(db);
    expect(() => migrate(db, [...migrations.slice(0, 1), rebuildParts('0')])).toThrow(/broken reference/);
    expect(readUserVersion(db)).toBe(1);
    expect(db.prepare('SELECT name FROM parts WHERE id = 1').get()).toEqual({ name: 'c' });
    expect(db.pragma('foreign_keys', { simple: true })).toBe(1);
    db.close();
  });

  it('refuses to migrate a database that is newer than the list', () => {
    const db = rawMemory();
    db.pragma('user_version = 7');
    expect(() => migrate(db, migrations)).toThrow(StoreError);
    expect(tables(db)).toEqual([]);
    db.close();
  });
});

describe('opening a real file', () => {
  it('replays the whole chain on a new file and sets user_version to the newest schema', () => {
    const file = join(temp('chain'), 'workshop.sqlite3');
    const db = openStore(file);
    expect(readUserVersion(db)).toBe(SCHEMA_VERSION);
    expect(tables(db)).toEqual(['advance_points', 'engines', 'meta', 'parts', 'plans', 'readings', 'settings', 'sheet_ticks', 'sqlite_sequence']);
    closeStore(db);
    expect(existsSync(file)).toBe(true);
  });

  it('keeps every record when an existing file is reopened', () => {
    const file = join(temp('reopen'), 'workshop.sqlite3');
    const first = openStore(file);
    const repos = createRepositories(first);
    const coil = repos.parts.create(coilIn);
    const engine = repos.engines.create(engineIn({ coilId: coil.id }));
    closeStore(first);

    const again = openStore(file);
    const reread = createRepositories(again);
    expect(reread.parts.get(coil.id)).toEqual(coil);
    expect(reread.engines.get(engine.id)).toEqual(engine);
    expect(readUserVersion(again)).toBe(SCHEMA_VERSION);
    closeStore(again);
  });

  it('refuses a file written by a newer app, names both versions, and leaves the file byte-for-byte unchanged', () => {
    const file = join(temp('newer'), 'workshop.sqlite3');
    const db = openStore(file);
    createRepositories(db).parts.create(coilIn);
    closeStore(db);
    const raw = new Database(file);
    raw.pragma(`user_version = ${SCHEMA_VERSION + 2}`);
    raw.close();
    const before = sha(file);

    let caught: unknown;
    try {
      openStore(file);
    } catch (err) {
      caught = err;
    }
    expect(caught).toBeInstanceOf(StoreError);
    expect((caught as StoreError).code).toBe('STORE_TOO_NEW');
    expect((caught as StoreError).message).toBe(
      `This workshop file was written by a newer version of the app (schema ${SCHEMA_VERSION + 2}; this app knows up to ${SCHEMA_VERSION}). Update the app; the file was not changed.`,
    );
    expect(sha(file)).toBe(before);
  });

  it('refuses a newer file kept in rollback-journal mode without switching it to WAL (that would rewrite its header)', () => {
    const file = join(temp('newer-delete'), 'workshop.sqlite3');
    const raw = new Database(file);
    raw.exec('CREATE TABLE from_the_future (x TEXT); INSERT INTO from_the_future VALUES (1);');
    raw.pragma(`user_version = ${SCHEMA_VERSION + 1}`);
    raw.close();
    const before = sha(file);
    expect(() => openStore(file)).toThrow(expect.objectContaining({ code: 'STORE_TOO_NEW' }));
    expect(sha(file)).toBe(before);
    expect(existsSync(`${file}-wal`)).toBe(false);
  });

  it('refuses a file that is not a database with a CORRUPT error and does not touch it', () => {
    const file = join(temp('notdb'), 'workshop.sqlite3');
    writeFileSync(file, 'this is a shopping list, not a database\n'.repeat(200));
    const before = sha(file);
    expect(() => openStore(file)).toThrow(expect.objectContaining({ code: 'CORRUPT' }));
    expect(sha(file)).toBe(before);
  });

  it('sets WAL, foreign keys, a busy timeout and synchronous FULL on a file', () => {
    const db = openStore(join(temp('pragmas'), 'workshop.sqlite3'));
    expect(db.pragma('journal_mode', { simple: true })).toBe('wal');
    expect(db.pragma('foreign_keys', { simple: true })).toBe(1);
    expect(db.pragma('busy_timeout', { simple: true })).toBe(BUSY_TIMEOUT_MS);
    expect(db.pragma('synchronous', { simple: true })).toBe(2);
    closeStore(db);
    expect(db.open).toBe(false);
    expect(() => closeStore(db)).not.toThrow();
  });

  it('sets the same pragmas on :memory: except WAL, which an in-memory database cannot use', () => {
    const db = openStore(':memory:');
    expect(db.pragma('journal_mode', { simple: true })).toBe('memory');
    expect(db.pragma('foreign_keys', { simple: true })).toBe(1);
    expect(db.pragma('busy_timeout', { simple: true })).toBe(BUSY_TIMEOUT_MS);
    expect(db.pragma('synchronous', { simple: true })).toBe(2);
    closeStore(db);
  });
});

/**
 * A migration that drops or renames, or adds a NOT NULL column without a default (which fails on
 * any table that already has rows), can lose a restorer's records. Such a migration must say why
 * it is safe in `destructiveBecause`.
 */
function destructiveStatements(sql: string): string[] {
  const code = sql.replace(/--[^\n]*/g, '').replace(/\/\*[\s\S]*?\*\//g, '');
  const found: string[] = [];
  for (const stmt of code.split(';').map((s) => s.trim()).filter(Boolean)) {
    const flat = stmt.replace(/\s+/g, ' ');
    if (/\bDROP\b/i.test(flat)) found.push(flat);
    else if (/\bRENAME\b/i.test(flat)) found.push(flat);
    else if (/^ALTER TABLE\b.*\bADD\b/i.test(flat) && /\bNOT NULL\b/i.test(flat) && !/\bDEFAULT\b/i.test(flat)) found.push(flat);
  }
  return found;
}

describe('additive migrations', () => {
  it('the scanner spots drops, renames and NOT NULL additions without a default, and lets a defaulted one pass', () => {
    expect(destructiveStatements('DROP TABLE parts;')).toHaveLength(1);
    expect(destructiveStatements('ALTER TABLE parts RENAME TO bits;')).toHaveLength(1);
    expect(destructiveStatements('ALTER TABLE parts RENAME COLUMN name TO label;')).toHaveLength(1);
    expect(destructiveStatements('ALTER TABLE parts ADD COLUMN maker TEXT NOT NULL;')).toHaveLength(1);
    expect(destructiveStatements("ALTER TABLE parts ADD COLUMN maker TEXT NOT NULL DEFAULT '';")).toHaveLength(0);
    expect(destructiveStatements('-- DROP TABLE parts;\nCREATE TABLE x (a TEXT NOT NULL);')).toHaveLength(0);
  });

  it.each(migrations.map((m) => [m.version, m] as const))('migration %i is additive or says why it is not', (_v, m) => {
    const found = destructiveStatements(m.sql);
    if (found.length > 0) {
      expect(m.destructiveBecause, `destructive statements need a reason: ${found.join(' | ')}`).toMatch(/\S{10,}/);
    } else {
      expect(found).toEqual([]);
    }
  });
});
