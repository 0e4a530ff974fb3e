/**
 * The one function that opens the workshop file. Every connection gets the same settings:
 * - journal_mode = WAL (files only): readers never block the writer, and a crash mid-write
 *   leaves the last committed state intact.
 * - foreign_keys = ON: SQLite leaves it off by default, which would let a plan point at a deleted part.
 * - busy_timeout: wait for another connection's write instead of failing at once.
 * - synchronous = FULL: a save the user saw succeed survives a power cut; the workshop writes a
 *   few rows at a time, so the extra fsync costs nothing anyone notices.
 * The version check runs before anything writes, so a file from a newer app is left byte-for-byte
 * as it was. So does the check that the file is ours: `user_version` 0 means a new workshop only
 * when the file holds nothing at all; another program's database (tables, but user_version 0) is
 * refused and left as it was. WAL is switched on only after both checks pass (switching rewrites
 * the file header).
 */
import Database from 'better-sqlite3';
import { dirname } from 'node:path';
import { backupBeforeMigration } from './backup.js';
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
    if (found === 0) refuseForeign(db, file);
    // A damaged file is found here, before anything writes (WAL, migrations), so it is never changed.
    if (found > 0 && !db.memory) quickCheck(db, file);
    if (!db.memory) db.pragma('journal_mode = WAL');
    db.pragma('synchronous = FULL');
    // A file about to be upgraded is backed up first (db/backup.ts); a new file has nothing to lose.
    if (found > 0 && found < SCHEMA_VERSION) backupBeforeMigration(db, dirname(file));
    migrate(db, migrations);
    return db;
  } catch (err) {
    db.close();
    throw err;
  }
}

/** PRAGMA quick_check (sqlite.org/pragma.html#pragma_quick_check): every page and record readable, in O(N). */
function quickCheck(db: Database.Database, file: string): void {
  const rows = db.pragma('quick_check(5)', { simple: false }) as Array<{ quick_check: string }>;
  if (rows.length === 1 && rows[0]!.quick_check === 'ok') return;
  throw new StoreError('CORRUPT', `The workshop file ${file} is damaged (${rows.map((r) => r.quick_check).join('; ').slice(0, 200)}). It was not changed.`);
}

/**
 * Opens the file read-only, without checks or migrations, to export what can still be read from a
 * file that will not open normally. Nothing is written (SQLite's read-only mode).
 */
export function openReadOnly(file: string): Database.Database {
  const db = new Database(file, { readonly: true, fileMustExist: true });
  db.pragma(`busy_timeout = ${BUSY_TIMEOUT_MS}`);
  return db;
}

/** Anything in sqlite_master (a table, index, view or trigger) in a file without our version is someone else's. */
function refuseForeign(db: Database.Database, file: string): void {
  const objects = db.prepare<[], { type: string; name: string }>("SELECT type, name FROM sqlite_master WHERE name NOT LIKE 'sqlite_%' ORDER BY type, name").all();
  if (objects.length === 0) return;
  const tables = objects.filter((o) => o.type === 'table').map((o) => o.name);
  const shown = tables.slice(0, 3).join(', ') + (tables.length > 3 ? ', ...' : '');
  throw new StoreError(
    'FOREIGN_FILE',
    `The file ${file} is not a workshop file: it is another program's database${tables.length > 0 ? ` (${tables.length === 1 ? 'table' : 'tables'} ${shown})` : ''}. It was not opened and not changed. Choose another data folder for the workshop.`,
  );
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
