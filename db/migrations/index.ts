/**
 * Every migration, oldest first. To change the schema, add a file `NNN-what.ts` and append it
 * here; never edit one that has shipped (DEVELOPERS.md, "How to add a migration").
 */
import { migration001 } from './001-initial.js';
import type { Migration } from './types.js';

export const migrations: readonly Migration[] = [migration001];

export type { Migration } from './types.js';
