/**
 * The one function that opens the workshop file. Every connection gets the same settings:
 * - journal_mode = WAL (files only): readers never block the writer, and a crash mid-write
 *   leaves the last committed state intact.
 * - foreign_keys = ON: SQLite leaves it off by default, which would let a plan point at a deleted part.
 * - busy_timeout: wait for another connection's write instead of failing at once.
 * - synchronous = FULL: a save the user saw succeed survives a power cut; the workshop writes a
 *   few rows at a time, so the extra fsync costs nothing anyone notices.
 * The version check runs before anything writes, so a file from a newer app is left byte-for-byte
 * as it was.
 */
import Database from 'better-sqlite3';
import { StoreError } from './errors.js';
import { migrations } from './migrations/index.js';
import { migrate, readUserVersion, tooNewMessage } from './migrations/runner.js';

export const SCHEMA_VERSION: number = migrations.length;
export const BUSY_TIMEOUT_MS = 5000;

export function openStore(file: string): Database.Database {
  const db = new Database(file);
  try {
    db.pragma(`busy_timeout = ${BUSY_TIMEOUT_MS}`);
    db.pragma('foreign_keys = ON');
    let found: number;
    try {
      found = readUserVersion(db);
    } catch (err) {
      if (isNotADatabase(err)) {
        throw new StoreError('CORRUPT', `The file ${file} is not a workshop file (SQLite could not read it). It was not changed.`);
      }
      throw err;
    }
    if (found > SCHEMA_VERSION) throw new StoreError('STORE_TOO_NEW', tooNewMessage(found, SCHEMA_VERSION));
    if (!db.memory) db.pragma('journal_mode = WAL');
    db.pragma('synchronous = FULL');
    migrate(db, migrations);
    return db;
  } catch (err) {
    db.close();
    throw err;
  }
}

/** Lets SQLite refresh its query statistics, then closes. Safe to call twice. */
export function closeStore(db: Database.Database): void {
  if (!db.open) return;
  try {
    db.pragma('optimize');
  } finally {
    db.close();
  }
}

function isNotADatabase(err: unknown): boolean {
  return typeof err === 'object' && err !== null && (err as { code?: unknown }).code === 'SQLITE_NOTADB';
}
