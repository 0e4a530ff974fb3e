/**
 * Version 4: ids are never handed out twice, and readings carry the time they last changed.
 *
 * Up to version 3 the tables used a plain `INTEGER PRIMARY KEY`, and SQLite gives a new row the
 * largest id + 1, so deleting the newest engine and adding another gave the new one the same id: a
 * screen still showing the deleted engine then deleted or overwrote the new one. With
 * `AUTOINCREMENT` SQLite keeps the largest id ever used in `sqlite_sequence` and never hands it out
 * again (sqlite.org/autoinc.html). SQLite cannot add AUTOINCREMENT to a table, so engines, parts,
 * plans and readings are rebuilt in SQLite's documented order (sqlite.org/lang_altertable.html,
 * "other kinds of table schema changes"): new table, copy every row with its id, drop the old one,
 * rename, recreate the indexes. The runner does this with foreign keys off and checks
 * `foreign_key_check` before it commits. `advance_points` and `sheet_ticks` keep their rows; their
 * references name the tables, which exist again under the same names.
 *
 * readings.updated_at: every update and delete now carries the version of the record the user saw
 * (its `updatedAt`), and readings had only `created_at`. Existing readings start with their
 * creation time.
 *
 * Ids deleted before this upgrade above the largest id still stored cannot be known, so the very
 * next id may repeat one of those; from then on none repeats.
 */
import type { Migration } from './types.js';

export const migration004: Migration = {
  version: 4,
  name: 'ids never reused; readings.updated_at',
  rebuildsTables: true,
  destructiveBecause:
    'rebuilds engines, parts, plans and readings to add AUTOINCREMENT; every row is copied with its id before the old table is dropped, and foreign_key_check runs before commit',
  sql: `
CREATE TABLE parts_v4 (
  id         INTEGER PRIMARY KEY AUTOINCREMENT,
  kind       TEXT NOT NULL,
  name       TEXT NOT NULL,
  notes      TEXT NOT NULL DEFAULT '',
  data       TEXT NOT NULL CHECK (json_valid(data)),
  created_at TEXT NOT NULL,
  updated_at TEXT NOT NULL
) STRICT;
INSERT INTO parts_v4 (id, kind, name, notes, data, created_at, updated_at)
  SELECT id, kind, name, notes, data, created_at, updated_at FROM parts;
DROP TABLE parts;
ALTER TABLE parts_v4 RENAME TO parts;
CREATE INDEX parts_by_kind ON parts (kind, name);

CREATE TABLE engines_v4 (
  id                     INTEGER PRIMARY KEY AUTOINCREMENT,
  name                   TEXT NOT NULL,
  notes                  TEXT NOT NULL DEFAULT '',
  year_text              TEXT NOT NULL DEFAULT '',
  model_text             TEXT NOT NULL DEFAULT '',
  cylinders              INTEGER NOT NULL CHECK (cylinders BETWEEN 1 AND 16),
  cycle                  TEXT NOT NULL CHECK (cycle IN ('four-stroke', 'two-stroke')),
  firing_order           TEXT NOT NULL,
  bore_mm                REAL NOT NULL,
  stroke_mm              REAL NOT NULL,
  con_rod_mm             REAL NOT NULL,
  compression_ratio      REAL NOT NULL,
  idle_rpm               REAL NOT NULL,
  cranking_rpm           REAL NOT NULL,
  redline_rpm            REAL NOT NULL,
  system_voltage_v       INTEGER NOT NULL CHECK (system_voltage_v IN (6, 12)),
  earth_polarity         TEXT NOT NULL CHECK (earth_polarity IN ('negative', 'positive')),
  charging               TEXT NOT NULL CHECK (charging IN ('dynamo', 'alternator')),
  points_dwell_deg       REAL NOT NULL,
  points_gap_mm          REAL NOT NULL,
  points_float_rpm       REAL,
  static_timing_deg_btdc REAL NOT NULL,
  existing               TEXT NOT NULL CHECK (json_valid(existing)),
  conditions             TEXT NOT NULL DEFAULT '{}' CHECK (json_valid(conditions)),
  created_at             TEXT NOT NULL,
  updated_at             TEXT NOT NULL
) STRICT;
INSERT INTO engines_v4 (id, name, notes, year_text, model_text, cylinders, cycle, firing_order, bore_mm, stroke_mm, con_rod_mm,
    compression_ratio, idle_rpm, cranking_rpm, redline_rpm, system_voltage_v, earth_polarity, charging, points_dwell_deg,
    points_gap_mm, points_float_rpm, static_timing_deg_btdc, existing, conditions, created_at, updated_at)
  SELECT id, name, notes, year_text, model_text, cylinders, cycle, firing_order, bore_mm, stroke_mm, con_rod_mm,
    compression_ratio, idle_rpm, cranking_rpm, redline_rpm, system_voltage_v, earth_polarity, charging, points_dwell_deg,
    points_gap_mm, points_float_rpm, static_timing_deg_btdc, existing, conditions, created_at, updated_at FROM engines;
DROP TABLE engines;
ALTER TABLE engines_v4 RENAME TO engines;

CREATE TABLE plans_v4 (
  id              INTEGER PRIMARY KEY AUTOINCREMENT,
  engine_id       INTEGER NOT NULL REFERENCES engines (id) ON DELETE CASCADE,
  name            TEXT NOT NULL,
  notes           TEXT NOT NULL DEFAULT '',
  status          TEXT NOT NULL CHECK (status IN ('draft', 'checked', 'wired', 'done')),
  module_id       INTEGER REFERENCES parts (id) ON DELETE RESTRICT,
  coil_id         INTEGER REFERENCES parts (id) ON DELETE RESTRICT,
  ballast_id      INTEGER REFERENCES parts (id) ON DELETE RESTRICT,
  tach_id         INTEGER REFERENCES parts (id) ON DELETE RESTRICT,
  leads_id        INTEGER REFERENCES parts (id) ON DELETE RESTRICT,
  plug_id         INTEGER REFERENCES parts (id) ON DELETE RESTRICT,
  cranking_bypass INTEGER NOT NULL CHECK (cranking_bypass IN (0, 1)),
  module_feed     TEXT NOT NULL CHECK (module_feed IN ('switched-15', 'after-ballast')),
  coil_wiring     TEXT NOT NULL DEFAULT 'as-marked-for-earth' CHECK (coil_wiring IN ('as-marked-for-earth', 'reversed')),
  plug_gap_mm     REAL NOT NULL,
  created_at      TEXT NOT NULL,
  updated_at      TEXT NOT NULL
) STRICT;
INSERT INTO plans_v4 (id, engine_id, name, notes, status, module_id, coil_id, ballast_id, tach_id, leads_id, plug_id,
    cranking_bypass, module_feed, coil_wiring, plug_gap_mm, created_at, updated_at)
  SELECT id, engine_id, name, notes, status, module_id, coil_id, ballast_id, tach_id, leads_id, plug_id,
    cranking_bypass, module_feed, coil_wiring, plug_gap_mm, created_at, updated_at FROM plans;
DROP TABLE plans;
ALTER TABLE plans_v4 RENAME TO plans;
CREATE INDEX plans_by_engine ON plans (engine_id);
CREATE INDEX plans_by_module ON plans (module_id);
CREATE INDEX plans_by_coil ON plans (coil_id);
CREATE INDEX plans_by_ballast ON plans (ballast_id);
CREATE INDEX plans_by_tach ON plans (tach_id);
CREATE INDEX plans_by_leads ON plans (leads_id);
CREATE INDEX plans_by_plug ON plans (plug_id);

CREATE TABLE readings_v4 (
  id         INTEGER PRIMARY KEY AUTOINCREMENT,
  plan_id    INTEGER NOT NULL REFERENCES plans (id) ON DELETE CASCADE,
  quantity   TEXT NOT NULL,
  value      REAL NOT NULL,
  unit       TEXT NOT NULL,
  taken_on   TEXT NOT NULL,
  note       TEXT NOT NULL DEFAULT '',
  created_at TEXT NOT NULL,
  updated_at TEXT NOT NULL
) STRICT;
INSERT INTO readings_v4 (id, plan_id, quantity, value, unit, taken_on, note, created_at, updated_at)
  SELECT id, plan_id, quantity, value, unit, taken_on, note, created_at, created_at FROM readings;
DROP TABLE readings;
ALTER TABLE readings_v4 RENAME TO readings;
CREATE INDEX readings_by_plan ON readings (plan_id);
`,
};
