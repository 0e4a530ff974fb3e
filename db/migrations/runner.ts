/**
 * Brings a database up to the newest schema this app knows. Each migration runs in its own
 * transaction together with the `user_version` bump, so a failure leaves the file at the last
 * version that finished, never half-way through one.
 */
import type Database from 'better-sqlite3';
import { StoreError } from '../errors.js';
import type { Migration } from './types.js';

/** Throws unless versions run 1, 2, 3, ... with no gaps or repeats. A programming error, not a user's. */
export function checkMigrationList(list: readonly Migration[]): void {
  list.forEach((m, i) => {
    if (m.version !== i + 1) {
      throw new Error(`Migration "${m.name}" has version ${m.version}; expected ${i + 1}. Versions must start at 1 and only go up by one.`);
    }
  });
}

export function readUserVersion(db: Database.Database): number {
  return db.pragma('user_version', { simple: true }) as number;
}

export function tooNewMessage(found: number, known: number): string {
  return `This workshop file was written by a newer version of the app (schema ${found}; this app knows up to ${known}). Update the app; the file was not changed.`;
}

/**
 * Applies the migrations after the file's current version, up to `target` (default: the last).
 * Refuses, without writing anything, a file whose version is above the newest known one.
 * Returns the version the file is at afterwards.
 */
export function migrate(db: Database.Database, list: readonly Migration[], target?: number): number {
  checkMigrationList(list);
  const newest = list.length;
  const goal = target ?? newest;
  if (!Number.isInteger(goal) || goal < 0 || goal > newest) {
    throw new Error(`Cannot migrate to version ${goal}; known versions are 0 to ${newest}.`);
  }
  const current = readUserVersion(db);
  if (current > newest) throw new StoreError('STORE_TOO_NEW', tooNewMessage(current, newest));
  if (current > goal) throw new Error(`The file is at version ${current}, past the requested ${goal}; migrations only go up.`);
  for (const m of list.slice(current, goal)) applyOne(db, m);
  return readUserVersion(db);
}

/** Applies one migration if the file is just below it (read again under the write lock); exported for the race test. */
export function applyOne(db: Database.Database, m: Migration): void {
  // foreign_keys cannot change inside a transaction, so it is switched around it.
  const keysWereOn = db.pragma('foreign_keys', { simple: true }) === 1;
  if (m.rebuildsTables) db.pragma('foreign_keys = OFF');
  try {
    // IMMEDIATE takes the write lock at BEGIN; the version is read again under it, so when two
    // processes open a file at once the second waits, finds the migration done, and skips it.
    db.transaction(() => {
      const now = readUserVersion(db);
      if (now >= m.version) return;
      if (now !== m.version - 1) throw new Error(`Migration ${m.version} (${m.name}) expected the file at version ${m.version - 1}, found ${now}.`);
      db.exec(m.sql);
      if (m.rebuildsTables) {
        const broken = db.pragma('foreign_key_check') as unknown[];
        if (broken.length > 0) {
          throw new Error(`Migration ${m.version} (${m.name}) would leave ${broken.length} broken reference(s); it was rolled back.`);
        }
      }
      // user_version is part of the file header and is written inside this transaction.
      db.pragma(`user_version = ${m.version}`);
    }).immediate();
  } finally {
    if (m.rebuildsTables && keysWereOn) db.pragma('foreign_keys = ON');
  }
}
