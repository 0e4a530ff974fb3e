/**
 * The way out of a workshop file that will not open: put the newest backup in its place. The
 * damaged file is never overwritten or deleted: it (and its -wal / -shm companions) is renamed
 * beside it with the date and time in its name (`workshop-damaged-2026-12-02T04-15-30Z.sqlite3`),
 * and only then is the backup copied in (through SQLite: read whole, written to a temporary file,
 * flushed, renamed into place). Called only when the person chose it.
 */
import Database from 'better-sqlite3';
import { closeSync, existsSync, fsyncSync, openSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { listBackups } from './backup.js';
import { StoreError } from './errors.js';
import { storeFileIn } from './location.js';

export function damagedName(now: Date): string {
  return `workshop-damaged-${now.toISOString().slice(0, 19).replace(/:/g, '-')}Z.sqlite3`;
}

/** The newest backup that reads (listBackups gives newest first), or null. */
export function newestUsableBackup(dataDir: string): { file: string; createdAt: string } | null {
  const b = listBackups(dataDir).find((x) => x.problem === undefined && x.counts !== null);
  return b ? { file: b.file, createdAt: b.createdAt } : null;
}

export function replaceWithNewestBackup(dataDir: string, now = new Date()): { movedTo: string; restoredFrom: string } {
  const backup = newestUsableBackup(dataDir);
  if (!backup) throw new StoreError('NOT_FOUND', `There is no readable backup in ${path.join(dataDir, 'backups')}. Nothing was changed.`);
  const file = storeFileIn(dataDir);
  let movedTo = path.join(dataDir, damagedName(now));
  for (let n = 2; existsSync(movedTo); n++) movedTo = path.join(dataDir, damagedName(now).replace('.sqlite3', `-${n}.sqlite3`));
  const source = new Database(backup.file, { readonly: true, fileMustExist: true });
  let image: Buffer;
  try {
    image = source.serialize();
  } finally {
    source.close();
  }
  const temp = path.join(dataDir, `.recover-${process.pid}.sqlite3`);
  writeFileSync(temp, image);
  const fd = openSync(temp, 'r+');
  try {
    fsyncSync(fd);
  } finally {
    closeSync(fd);
  }
  if (existsSync(file)) {
    renameSync(file, movedTo);
    for (const side of ['-wal', '-shm']) if (existsSync(file + side)) renameSync(file + side, movedTo + side);
  }
  try {
    renameSync(temp, file);
  } catch (err) {
    rmSync(temp, { force: true });
    throw err;
  }
  return { movedTo, restoredFrom: backup.file };
}
