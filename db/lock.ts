/**
 * One app per data folder. The desktop app and the browser host each hold `workshop.lock` in the
 * data folder while the store is open; a second one on the same folder is told plainly who holds
 * it and does not start. (SQLite's own locking keeps the file consistent with two writers, but two
 * apps would each show a screen the other silently changes under it, and would race migrations.)
 *
 * The lock file holds `{ pid, host, startedAt }`. It is created whole or not at all: written to a
 * private temporary name, then hard-linked to `workshop.lock`, which fails if the name exists
 * (link(2) is atomic). A lock left by a process that no longer runs (killed, power cut) is taken
 * over; one whose process still runs is refused.
 */
import { linkSync, readFileSync, unlinkSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { StoreError } from './errors.js';

export const LOCK_FILE_NAME = 'workshop.lock';

export type FolderLock = { file: string; release(): void };

type Holder = { pid: number; host: string; startedAt: string };

function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    // EPERM: the process exists but belongs to someone else.
    return (err as NodeJS.ErrnoException).code === 'EPERM';
  }
}

function readHolder(file: string): Holder | null {
  try {
    const h = JSON.parse(readFileSync(file, 'utf8')) as Partial<Holder>;
    return typeof h.pid === 'number' && Number.isInteger(h.pid) && h.pid > 0
      ? { pid: h.pid, host: typeof h.host === 'string' ? h.host : 'another copy', startedAt: typeof h.startedAt === 'string' ? h.startedAt : '' }
      : null;
  } catch {
    return null;
  }
}

export function lockedMessage(dataDir: string, h: Holder): string {
  const who = h.host === 'desktop' ? 'the desktop app' : h.host === 'browser' ? 'a browser host' : h.host;
  const since = h.startedAt ? `, started ${h.startedAt}` : '';
  return `The workshop in ${dataDir} is already open in ${who} (process ${h.pid}${since}). Close that one first, or choose another data folder; only one copy may use a folder at a time.`;
}

/** Takes the folder's lock for this process, or throws StoreError('LOCKED') naming who holds it. */
export function lockDataDir(dataDir: string, host: string): FolderLock {
  const file = path.join(dataDir, LOCK_FILE_NAME);
  const mine: Holder = { pid: process.pid, host, startedAt: new Date().toISOString() };
  const temp = path.join(dataDir, `.${LOCK_FILE_NAME}.${process.pid}.${Math.random().toString(16).slice(2)}`);
  writeFileSync(temp, JSON.stringify(mine));
  try {
    for (let attempt = 0; attempt < 2; attempt++) {
      try {
        linkSync(temp, file);
        let released = false;
        return {
          file,
          release: () => {
            if (released) return;
            released = true;
            // Remove it only if it is still ours.
            const h = readHolder(file);
            if (h && h.pid === mine.pid && h.startedAt === mine.startedAt) unlinkSync(file);
          },
        };
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code !== 'EEXIST') throw err;
      }
      const holder = readHolder(file);
      if (holder && alive(holder.pid)) throw new StoreError('LOCKED', lockedMessage(dataDir, holder));
      // Left behind by a process that has ended (or unreadable): take it over, once.
      try {
        unlinkSync(file);
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code !== 'ENOENT') throw err;
      }
    }
    const holder = readHolder(file);
    throw new StoreError('LOCKED', holder ? lockedMessage(dataDir, holder) : `The workshop in ${dataDir} is being opened by another copy of the app at this moment. Close it first, or choose another data folder.`);
  } finally {
    unlinkSync(temp);
  }
}
