/**
 * Backups of the workshop file, kept in `<dataDir>/backups/`, one file each, named with the UTC
 * date and time and why it was made (`workshop-2026-12-02T04-15-30-123Z-manual.sqlite3`).
 *
 * - Made through SQLite itself, never by copying the file: a copy taken while the app writes can
 *   catch half a transaction, or miss what still sits in the WAL file. The on-demand, daily and
 *   before-restore backups use the driver's online backup API (`db.backup`, sqlite.org/backup.html);
 *   the one before a migration runs while the file is being opened, which is synchronous, so it
 *   uses `db.serialize()` (sqlite3_serialize: the same consistent read through SQLite's pager).
 * - Each is written under a temporary name, checked (`PRAGMA quick_check`), switched to the plain
 *   rollback journal (so it is one self-contained file that opens read-only anywhere), flushed to
 *   disk and only then renamed to its final name: a backup in the list is always whole.
 * - Kept: the newest KEEP_LAST, plus the newest of each calendar month; older ones are removed.
 * - Restore: the current file is backed up first; the chosen backup is copied through the backup
 *   API into a temporary file in the data folder, checked and flushed, the live connection is
 *   closed (SQLite folds the WAL into the file and removes it), and the temporary file is renamed
 *   over the workshop file (rename is atomic on one file system), then the caller reopens. A kill
 *   at any moment leaves the old workshop or the new one, whole.
 *
 * This file imports nothing from open.ts, so open.ts may call `backupBeforeMigration`.
 */
import Database from 'better-sqlite3';
import { closeSync, existsSync, fsyncSync, mkdirSync, openSync, readdirSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { StoreError } from './errors.js';
import { migrations } from './migrations/index.js';
import { countRecords, type RecordCounts } from './repositories/counts.js';

/** How many of the newest backups are always kept. */
export const KEEP_LAST = 10;
/** Keep the newest backup of every calendar month as well, however old. */
export const KEEP_MONTHLY = true;
export const BACKUP_FOLDER = 'backups';

export const backupReasons = ['manual', 'daily', 'before-migration', 'before-restore', 'before-import'] as const;
export type BackupReason = (typeof backupReasons)[number];

export type BackupInfo = {
  /** The file name inside the backups folder; the handle used to restore it. */
  name: string;
  file: string;
  /** When it was made (ISO 8601, UTC), read from its name. */
  createdAt: string;
  reason: BackupReason;
  sizeBytes: number;
  /** Null when the file could not be read (then `problem` says why). */
  counts: RecordCounts | null;
  schemaVersion: number | null;
  problem?: string;
};

const NAME = /^workshop-(\d{4})-(\d{2})-(\d{2})T(\d{2})-(\d{2})-(\d{2})-(\d{3})Z-([a-z-]+?)(?:-(\d+))?\.sqlite3$/;
const TEMP_PREFIX = '.partial-';
const RESTORE_PREFIX = '.restore-';

export function backupsDir(dataDir: string): string {
  return join(dataDir, BACKUP_FOLDER);
}

function stamp(d: Date): string {
  return d.toISOString().replace(/:/g, '-').replace('.', '-');
}

function parseName(name: string): { createdAt: string; reason: BackupReason } | null {
  const m = NAME.exec(name);
  if (!m) return null;
  const reason = m[8] as BackupReason;
  if (!backupReasons.includes(reason)) return null;
  const createdAt = `${m[1]}-${m[2]}-${m[3]}T${m[4]}:${m[5]}:${m[6]}.${m[7]}Z`;
  if (Number.isNaN(Date.parse(createdAt))) return null;
  return { createdAt, reason };
}

function freshName(dir: string, reason: BackupReason, now: Date): string {
  const base = `workshop-${stamp(now)}-${reason}`;
  let name = `${base}.sqlite3`;
  for (let n = 2; existsSync(join(dir, name)); n++) name = `${base}-${n}.sqlite3`;
  return name;
}

function fsyncFile(file: string): void {
  const fd = openSync(file, 'r+');
  try {
    fsyncSync(fd);
  } finally {
    closeSync(fd);
  }
}

/** Makes a rename durable: the directory entry is flushed too (POSIX; ignored where not supported). */
function fsyncDir(dir: string): void {
  try {
    const fd = openSync(dir, 'r');
    try {
      fsyncSync(fd);
    } finally {
      closeSync(fd);
    }
  } catch {
    // Some platforms cannot open a directory for fsync; the rename itself is still atomic there.
  }
}

/** Checks a finished copy, makes it one self-contained file (rollback journal), and flushes it. */
function sealCopy(file: string): void {
  const db = new Database(file, { fileMustExist: true });
  try {
    const check = db.pragma('quick_check', { simple: true });
    if (check !== 'ok') throw new StoreError('CORRUPT', `The copy ${basename(file)} did not pass SQLite's check (${String(check)}); it was not kept.`);
    db.pragma('journal_mode = DELETE');
  } finally {
    db.close();
  }
  fsyncFile(file);
}

/** Moves a sealed temporary copy to its final name in `dir`, durably. */
function publish(temp: string, dir: string, final: string): string {
  const target = join(dir, final);
  renameSync(temp, target);
  fsyncDir(dir);
  return target;
}

/**
 * A backup of the open store through the online backup API, then the old ones thinned out.
 * Returns the new backup's info.
 */
export async function createBackup(db: Database.Database, dataDir: string, reason: BackupReason, now = new Date()): Promise<BackupInfo> {
  const dir = backupsDir(dataDir);
  mkdirSync(dir, { recursive: true });
  const final = freshName(dir, reason, now);
  const temp = join(dir, `${TEMP_PREFIX}${final}`);
  try {
    await db.backup(temp);
    sealCopy(temp);
    publish(temp, dir, final);
  } catch (err) {
    rmSync(temp, { force: true });
    rmSync(`${temp}-journal`, { force: true });
    throw err;
  }
  pruneBackups(dataDir);
  return describe(dir, final);
}

/**
 * The backup made just before a migration changes the file (synchronous: the open is). Call it
 * with the connection that is about to migrate, before the first migration's transaction.
 * Returns null when the file holds no tables yet (a new file has nothing to lose).
 */
export function backupBeforeMigration(db: Database.Database, dataDir: string, now = new Date()): BackupInfo | null {
  if (db.memory) return null;
  const tables = db.prepare("SELECT COUNT(*) AS n FROM sqlite_schema WHERE type = 'table'").get() as { n: number };
  if (tables.n === 0) return null;
  const dir = backupsDir(dataDir);
  mkdirSync(dir, { recursive: true });
  const final = freshName(dir, 'before-migration', now);
  const temp = join(dir, `${TEMP_PREFIX}${final}`);
  try {
    writeFileSync(temp, db.serialize());
    sealCopy(temp);
    publish(temp, dir, final);
  } catch (err) {
    for (const f of [temp, `${temp}-wal`, `${temp}-shm`, `${temp}-journal`]) rmSync(f, { force: true });
    throw err;
  }
  pruneBackups(dataDir);
  return describe(dir, final);
}

/** The day (UTC) of a date, YYYY-MM-DD. */
const dayOf = (iso: string): string => iso.slice(0, 10);

/**
 * Once a day: a backup if none was made today (UTC) of any kind. A store with no engines, parts or
 * plans is not backed up (there is nothing to lose). Returns the backup made, or null.
 */
export async function dailyBackupIfDue(db: Database.Database, dataDir: string, now = new Date()): Promise<BackupInfo | null> {
  const today = dayOf(now.toISOString());
  if (backupNames(backupsDir(dataDir)).some((n) => dayOf(parseName(n)!.createdAt) === today)) return null;
  const c = countRecords(db);
  if (c.engines + c.parts + c.plans === 0) return null;
  return createBackup(db, dataDir, 'daily', now);
}

function backupNames(dir: string): string[] {
  if (!existsSync(dir)) return [];
  return readdirSync(dir).filter((n) => parseName(n) !== null);
}

function describe(dir: string, name: string): BackupInfo {
  const file = join(dir, name);
  const parsed = parseName(name)!;
  const info: BackupInfo = { name, file, createdAt: parsed.createdAt, reason: parsed.reason, sizeBytes: statSync(file).size, counts: null, schemaVersion: null };
  try {
    const db = new Database(file, { readonly: true, fileMustExist: true });
    try {
      info.schemaVersion = db.pragma('user_version', { simple: true }) as number;
      info.counts = countRecords(db);
    } finally {
      db.close();
    }
  } catch (err) {
    info.problem = `This backup cannot be read (${err instanceof Error ? err.message : String(err)}).`;
  }
  return info;
}

/** Every backup, newest first, with its date and the engines, parts and plans it holds (opened read-only). */
export function listBackups(dataDir: string): BackupInfo[] {
  const dir = backupsDir(dataDir);
  return backupNames(dir)
    .map((n) => describe(dir, n))
    .sort((a, b) => (a.createdAt < b.createdAt ? 1 : a.createdAt > b.createdAt ? -1 : b.name.localeCompare(a.name)));
}

/**
 * Which backups to keep: the newest `keepLast`, and (if `keepMonthly`) the newest of each month.
 * Pure, so the rule can be tested on names alone.
 */
export function backupsToRemove(names: readonly string[], keepLast = KEEP_LAST, keepMonthly = KEEP_MONTHLY): string[] {
  const dated = names
    .map((name) => ({ name, at: parseName(name)?.createdAt }))
    .filter((d): d is { name: string; at: string } => d.at !== undefined)
    .sort((a, b) => (a.at < b.at ? 1 : a.at > b.at ? -1 : b.name.localeCompare(a.name)));
  const keep = new Set(dated.slice(0, keepLast).map((d) => d.name));
  if (keepMonthly) {
    const seen = new Set<string>();
    for (const d of dated) {
      const month = d.at.slice(0, 7);
      if (!seen.has(month)) {
        seen.add(month);
        keep.add(d.name);
      }
    }
  }
  return dated.filter((d) => !keep.has(d.name)).map((d) => d.name);
}

export function pruneBackups(dataDir: string, keepLast = KEEP_LAST, keepMonthly = KEEP_MONTHLY): string[] {
  const dir = backupsDir(dataDir);
  const gone = backupsToRemove(backupNames(dir), keepLast, keepMonthly);
  for (const name of gone) rmSync(join(dir, name), { force: true });
  // Temporary files of a backup that was interrupted (the process died) are of no use to anyone;
  // one younger than an hour may belong to a backup still running, so it is left alone.
  if (existsSync(dir)) {
    for (const n of readdirSync(dir)) {
      if (!n.startsWith(TEMP_PREFIX)) continue;
      const file = join(dir, n);
      try {
        if (Date.now() - statSync(file).mtimeMs > 3_600_000) rmSync(file, { force: true });
      } catch {
        // gone already
      }
    }
  }
  return gone;
}

/** The backup file for a name from the list; refuses anything that is not a backup in the folder. */
export function backupFileFor(dataDir: string, name: string): string {
  if (basename(name) !== name || parseName(name) === null) {
    throw new StoreError('INVALID_INPUT', 'Some values need correcting before this can be saved.', { name: `"${name}" is not the name of a backup in the list.` });
  }
  const file = join(backupsDir(dataDir), name);
  if (!existsSync(file)) throw new StoreError('NOT_FOUND', `There is no backup called ${name}; it may have been removed.`);
  return file;
}

/** Refuses a backup that is damaged, not a workshop, or from a newer app; says why. */
function checkRestorable(file: string): void {
  let db: Database.Database;
  try {
    db = new Database(file, { readonly: true, fileMustExist: true });
  } catch (err) {
    throw new StoreError('CORRUPT', `The backup ${basename(file)} cannot be opened (${err instanceof Error ? err.message : String(err)}). Nothing was changed.`);
  }
  try {
    const check = db.pragma('quick_check', { simple: true });
    if (check !== 'ok') throw new StoreError('CORRUPT', `The backup ${basename(file)} is damaged (${String(check)}). Nothing was changed.`);
    const version = db.pragma('user_version', { simple: true }) as number;
    if (version > migrations.length) {
      throw new StoreError('STORE_TOO_NEW', `The backup ${basename(file)} was made by a newer version of the app (schema ${version}). Nothing was changed.`);
    }
    const hasEngines = db.prepare("SELECT 1 FROM sqlite_schema WHERE type = 'table' AND name = 'engines'").get();
    if (version < 1 || !hasEngines) throw new StoreError('CORRUPT', `The file ${basename(file)} is not a workshop backup. Nothing was changed.`);
  } catch (err) {
    if (err instanceof StoreError) throw err;
    throw new StoreError('CORRUPT', `The backup ${basename(file)} cannot be read (${err instanceof Error ? err.message : String(err)}). Nothing was changed.`);
  } finally {
    db.close();
  }
}

export type LiveStore = {
  /** The open connection to the workshop file. */
  db: Database.Database;
  /** The workshop file's path. */
  file: string;
  /** Closes the live connection (the caller's own close, which may also stop other users of it). */
  close(): void;
  /** Opens the workshop file again (with the app's usual settings and migrations). */
  reopen(): void;
};

/**
 * Replaces the workshop with the chosen backup (see the top of this file for the steps). The
 * caller's `reopen` runs in every case after the live connection was closed, so the app keeps a
 * working store whether the restore went through or not.
 */
export async function restoreBackup(live: LiveStore, dataDir: string, backupFile: string): Promise<{ restored: string; safetyBackup: BackupInfo }> {
  checkRestorable(backupFile);
  const folder = dirname(live.file);
  for (const n of readdirSync(folder)) if (n.startsWith(RESTORE_PREFIX)) rmSync(join(folder, n), { force: true });
  const safetyBackup = await createBackup(live.db, dataDir, 'before-restore');
  const temp = join(folder, `${RESTORE_PREFIX}${Date.now()}.sqlite3`);
  const cleanTemp = (): void => {
    for (const f of [temp, `${temp}-journal`, `${temp}-wal`, `${temp}-shm`]) rmSync(f, { force: true });
  };
  try {
    const source = new Database(backupFile, { readonly: true, fileMustExist: true });
    try {
      await source.backup(temp);
    } finally {
      source.close();
    }
    sealCopy(temp);
  } catch (err) {
    cleanTemp();
    throw err;
  }
  live.close();
  try {
    const wal = `${live.file}-wal`;
    if (existsSync(wal) && statSync(wal).size > 0) {
      cleanTemp();
      throw new StoreError(
        'CORRUPT',
        'Another program still has the workshop file open, so it cannot be replaced safely. Close it and try again; nothing was changed.',
      );
    }
    rmSync(wal, { force: true });
    rmSync(`${live.file}-shm`, { force: true });
    renameSync(temp, live.file);
    fsyncDir(folder);
  } finally {
    live.reopen();
  }
  return { restored: basename(backupFile), safetyBackup };
}
