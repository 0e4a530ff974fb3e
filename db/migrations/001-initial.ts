/**
 * Version 1: the workshop as first shipped.
 *
 * - engines: one row per engine, with plain columns for everything the list and the checker read
 *   often, and JSON for the nested existing setup and the condition overrides (re-parsed with zod
 *   on every read, so a hand-edited file cannot slip a bad value past the checker).
 * - advance_points: the distributor's advance curve, one row per point, removed with its engine.
 * - parts: one table for every kind; the kind-specific fields live in `data` (JSON). `kind` has no
 *   CHECK list on purpose: the zod schema checks it on every write and read, and a new part kind
 *   then needs no table rebuild (SQLite cannot alter a CHECK).
 * - plans: a proposed conversion for one engine. Part references RESTRICT deletion, so the store
 *   itself refuses to delete a part a plan still uses even if a caller skipped the check.
 * - readings: meter readings taken while carrying a plan out, removed with their plan.
 * - meta: small key/value facts about the file itself (for example `demo_loaded`).
 * STRICT tables make SQLite refuse a wrong type instead of storing it.
 */
import type { Migration } from './types.js';

export const migration001: Migration = {
  version: 1,
  name: 'initial workshop tables',
  sql: `
CREATE TABLE meta (
  key   TEXT PRIMARY KEY,
  value TEXT NOT NULL
) STRICT;

CREATE TABLE parts (
  id         INTEGER PRIMARY KEY,
  kind       TEXT NOT NULL,
  name       TEXT NOT NULL,
  notes      TEXT NOT NULL DEFAULT '',
  data       TEXT NOT NULL CHECK (json_valid(data)),
  created_at TEXT NOT NULL,
  updated_at TEXT NOT NULL
) STRICT;
CREATE INDEX parts_by_kind ON parts (kind, name);

CREATE TABLE engines (
  id                     INTEGER PRIMARY KEY,
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

CREATE TABLE advance_points (
  engine_id   INTEGER NOT NULL REFERENCES engines (id) ON DELETE CASCADE,
  position    INTEGER NOT NULL CHECK (position >= 0),
  rpm         REAL NOT NULL,
  advance_deg REAL NOT NULL,
  PRIMARY KEY (engine_id, position)
) STRICT;

CREATE TABLE plans (
  id              INTEGER PRIMARY KEY,
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
  plug_gap_mm     REAL NOT NULL,
  created_at      TEXT NOT NULL,
  updated_at      TEXT NOT NULL
) STRICT;
CREATE INDEX plans_by_engine ON plans (engine_id);
CREATE INDEX plans_by_module ON plans (module_id);
CREATE INDEX plans_by_coil ON plans (coil_id);
CREATE INDEX plans_by_ballast ON plans (ballast_id);
CREATE INDEX plans_by_tach ON plans (tach_id);
CREATE INDEX plans_by_leads ON plans (leads_id);
CREATE INDEX plans_by_plug ON plans (plug_id);

CREATE TABLE readings (
  id         INTEGER PRIMARY KEY,
  plan_id    INTEGER NOT NULL REFERENCES plans (id) ON DELETE CASCADE,
  quantity   TEXT NOT NULL,
  value      REAL NOT NULL,
  unit       TEXT NOT NULL,
  taken_on   TEXT NOT NULL,
  note       TEXT NOT NULL DEFAULT '',
  created_at TEXT NOT NULL
) STRICT;
CREATE INDEX readings_by_plan ON readings (plan_id);
`,
};
