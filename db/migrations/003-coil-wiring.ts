/**
 * Version 3: which coil terminal a plan puts on the supply side.
 *
 * - plans.coil_wiring: 'as-marked-for-earth' (on negative earth the terminal marked + / SW / 15 to
 *   the feed, on positive earth the one marked - / CB / 1) or 'reversed' (wired for the other
 *   earth). Every plan stored before this version reads as wired as marked, which is what the
 *   checker assumed for them until now, so no verdict changes on upgrade.
 *
 * The engine's existing setup keeps the same choice in its `existing` JSON (`coilWiring`), which
 * needs no migration: the key is optional there and a row without it reads as wired as marked.
 */
import type { Migration } from './types.js';

export const migration003: Migration = {
  version: 3,
  name: 'coil wiring on plans',
  sql: `ALTER TABLE plans ADD COLUMN coil_wiring TEXT NOT NULL DEFAULT 'as-marked-for-earth' CHECK (coil_wiring IN ('as-marked-for-earth', 'reversed'));`,
};
