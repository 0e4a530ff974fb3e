/**
 * Version 5: the person's settings kept in the store, and how many of each part is on the shelf.
 *
 * - settings: one row per key, the value as JSON. The keys and their shapes are `settingsShape`
 *   in db/schema.ts (zod); the repository (db/repositories/settings.ts) refuses any other key and
 *   re-parses every value on read. They live in the workshop file, not in the browser, because the
 *   browser host starts on a new port each run and a browser keeps its storage per address.
 * - parts.quantity: how many of the part the shelf holds (a whole number of at least 1). Every part
 *   stored before this version reads as one, which is what every earlier version assumed.
 */
import type { Migration } from './types.js';

export const migration005: Migration = {
  version: 5,
  name: 'settings; parts.quantity',
  sql: `
CREATE TABLE settings (
  key        TEXT PRIMARY KEY,
  value      TEXT NOT NULL CHECK (json_valid(value)),
  updated_at TEXT NOT NULL
) STRICT;
ALTER TABLE parts ADD COLUMN quantity INTEGER NOT NULL DEFAULT 1 CHECK (quantity >= 1);
`,
};
