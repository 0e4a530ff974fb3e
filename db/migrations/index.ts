/**
 * Every migration, oldest first. To change the schema, add a file `NNN-what.ts` and append it
 * here; never edit one that has shipped (DEVELOPERS.md, "How to add a migration").
 */
import { migration001 } from './001-initial.js';
import { migration002 } from './002-sheet-ticks-and-reading-units.js';
import { migration003 } from './003-coil-wiring.js';
import { migration004 } from './004-ids-never-reused.js';
import { migration005 } from './005-settings-and-quantity.js';
import type { Migration } from './types.js';

export const migrations: readonly Migration[] = [migration001, migration002, migration003, migration004, migration005];

export type { Migration } from './types.js';
