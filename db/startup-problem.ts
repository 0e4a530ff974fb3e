/**
 * Why the workshop could not be opened, in a sentence a restorer can act on, with the file's path,
 * and the ways out the app offers. SQLite's own words ("database disk image is malformed",
 * "attempt to write a readonly database", "unable to open database file") and the system's error
 * codes (EACCES, EROFS, ENOSPC ...) never reach the person as they are. Result codes from
 * sqlite.org/rescode.html; system error names from POSIX (errno.h).
 *
 * Ways out, in the order offered:
 * - 'newest-backup': open the newest backup (the damaged file is moved aside with the date in its
 *   name, never overwritten or deleted);
 * - 'read-only-export': open the file read-only to export what can still be read;
 * - 'other-folder': choose another data folder;
 * - 'close-other': close the other copy of the app that holds the folder;
 * - 'update-app': install a newer version of the app.
 */
import { StoreError } from './errors.js';

export type WayOut = 'newest-backup' | 'read-only-export' | 'other-folder' | 'close-other' | 'update-app';

export type StartupProblem = {
  kind: 'damaged' | 'not-ours' | 'too-new' | 'read-only' | 'no-access' | 'cannot-open' | 'locked' | 'disk-full' | 'busy' | 'unknown';
  /** The sentence shown: what is wrong, with the path, and that the file was not changed. */
  sentence: string;
  waysOut: WayOut[];
};

function codeOf(err: unknown): string {
  const code = typeof err === 'object' && err !== null ? (err as { code?: unknown }).code : undefined;
  return typeof code === 'string' ? code : '';
}

export function describeStartupProblem(err: unknown, file: string, dataDir: string): StartupProblem {
  const code = codeOf(err);
  if (err instanceof StoreError) {
    switch (err.code) {
      case 'LOCKED':
        return { kind: 'locked', sentence: err.message, waysOut: ['close-other', 'other-folder'] };
      case 'STORE_TOO_NEW':
        return { kind: 'too-new', sentence: `${err.message} (${file})`, waysOut: ['update-app', 'other-folder'] };
      case 'FOREIGN_FILE':
        return { kind: 'not-ours', sentence: err.message, waysOut: ['other-folder'] };
      case 'CORRUPT':
        return damaged(file);
      default:
        return { kind: 'unknown', sentence: `The workshop file ${file} could not be opened: ${err.message}`, waysOut: ['newest-backup', 'other-folder'] };
    }
  }
  if (code === 'SQLITE_NOTADB' || code.startsWith('SQLITE_CORRUPT') || code === 'SQLITE_IOERR_SHORT_READ') return damaged(file);
  if (code.startsWith('SQLITE_READONLY') || code === 'EROFS') {
    return {
      kind: 'read-only',
      sentence: `The workshop file ${file} cannot be written: the file, its folder or the disk is read-only. Nothing was changed. Make the folder writable, choose another folder, or open the file read-only to export what it holds.`,
      waysOut: ['read-only-export', 'other-folder'],
    };
  }
  if (code === 'EACCES' || code === 'EPERM' || code === 'SQLITE_PERM' || code === 'SQLITE_AUTH') {
    return {
      kind: 'no-access',
      sentence: `The app is not allowed to use the data folder ${dataDir} (the system refused access). Nothing was changed. Give your user access to it, or choose another folder.`,
      waysOut: ['other-folder'],
    };
  }
  if (code === 'ENOSPC' || code === 'SQLITE_FULL') {
    return { kind: 'disk-full', sentence: `The disk holding ${file} is full, so the workshop could not be opened. Nothing was changed. Free some space, or choose a folder on another disk.`, waysOut: ['other-folder'] };
  }
  if (code.startsWith('SQLITE_BUSY') || code.startsWith('SQLITE_LOCKED')) {
    return { kind: 'busy', sentence: `The workshop file ${file} is held by another program, which did not let go within 5 seconds. Nothing was changed. Close the other program and start again.`, waysOut: ['close-other', 'other-folder'] };
  }
  if (code === 'ENOTDIR' || code === 'EEXIST' || code === 'EISDIR' || code.startsWith('SQLITE_CANTOPEN') || code === 'ENOENT') {
    return {
      kind: 'cannot-open',
      sentence: `The workshop file ${file} could not be opened: the data folder ${dataDir} is missing, is not a folder, or the file's name is taken by a folder. Nothing was changed. Check the folder, or choose another one.`,
      waysOut: ['other-folder'],
    };
  }
  if (code.startsWith('SQLITE_IOERR')) {
    return { kind: 'damaged', sentence: `The disk failed while reading the workshop file ${file}. It was not changed. Open the newest backup, or copy the file off this disk and choose another folder.`, waysOut: ['newest-backup', 'read-only-export', 'other-folder'] };
  }
  const message = err instanceof Error ? err.message : String(err);
  return { kind: 'unknown', sentence: `The workshop file ${file} could not be opened (${message}). It was not changed.`, waysOut: ['newest-backup', 'other-folder'] };
}

function damaged(file: string): StartupProblem {
  return {
    kind: 'damaged',
    sentence: `The workshop file ${file} is damaged: SQLite cannot read it as a database. It was not changed. Open the newest backup (the damaged file is kept beside it, renamed with today's date), open it read-only to export what can still be read, or choose another folder.`,
    waysOut: ['newest-backup', 'read-only-export', 'other-folder'],
  };
}
