/**
 * Backups on real SQLite files: made through SQLite (online backup API, or serialize before a
 * migration), whole and self-contained, listed with their counts, thinned to the newest 10 plus
 * the newest of each month, made once a day, and restored in a way that keeps a copy of what was
 * replaced. Expected counts are read by the test's own SQL on the files; nothing is mocked.
 */
import Database from 'better-sqlite3';
import { existsSync, readdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import {
  backupBeforeMigration,
  backupFileFor,
  backupsDir,
  backupsToRemove,
  createBackup,
  dailyBackupIfDue,
  listBackups,
  restoreBackup,
  type LiveStore,
} from '../../db/backup.js';
import { StoreError } from '../../db/errors.js';
import { closeStore, openStore } from '../../db/open.js';
import { storeFileIn } from '../../db/location.js';
import { createRepositories } from '../../db/repositories/index.js';
import { coilIn, engineIn, planIn, tempDir } from './samples.js';

const cleanups: Array<() => void> = [];
afterEach(() => {
  while (cleanups.length) cleanups.pop()!();
});

function workshop(label: string) {
  const { dir, cleanup } = tempDir(label);
  const file = storeFileIn(dir);
  let db = openStore(file);
  const live: LiveStore & { repos(): ReturnType<typeof createRepositories> } = {
    get db() {
      return db;
    },
    file,
    close: () => closeStore(db),
    reopen: () => {
      db = openStore(file);
    },
    repos: () => createRepositories(db, { onCorruptRow: () => {} }),
  };
  cleanups.push(() => {
    closeStore(db);
    cleanup();
  });
  return { dir, live };
}

/** Rows per table in a file, by the test's own SQL through a read-only connection. */
function countsIn(file: string): { engines: number; parts: number; plans: number } {
  const db = new Database(file, { readonly: true, fileMustExist: true });
  try {
    const n = (t: string): number => (db.prepare(`SELECT COUNT(*) AS n FROM ${t}`).get() as { n: number }).n;
    return { engines: n('engines'), parts: n('parts'), plans: n('plans') };
  } finally {
    db.close();
  }
}

function engineNames(db: Database.Database): string[] {
  return (db.prepare('SELECT name FROM engines ORDER BY name').all() as Array<{ name: string }>).map((r) => r.name);
}

describe('making a backup', () => {
  it('writes a whole, self-contained file named with the date and time, holding what the store held', async () => {
    const { dir, live } = workshop('backup-make');
    const repos = live.repos();
    const coil = repos.parts.create(coilIn);
    const e = repos.engines.create(engineIn({ coilId: coil.id }));
    repos.plans.create(planIn(e.id, { coilId: coil.id }));
    const at = new Date('2026-03-04T05:06:07.089Z');
    const info = await createBackup(live.db, dir, 'manual', at);
    expect(info.name).toBe('workshop-2026-03-04T05-06-07-089Z-manual.sqlite3');
    expect(info.createdAt).toBe(at.toISOString());
    expect(info.counts).toEqual({ engines: 1, parts: 1, plans: 1 });
    expect(countsIn(info.file)).toEqual(countsIn(live.file));
    const copy = new Database(info.file, { readonly: true });
    // The rollback journal, not WAL: one file that opens read-only anywhere (sqlite.org/wal.html, "read-only databases").
    expect(copy.pragma('journal_mode', { simple: true })).toBe('delete');
    expect(copy.pragma('integrity_check', { simple: true })).toBe('ok');
    copy.close();
    expect(readdirSync(backupsDir(dir)).filter((n) => !n.endsWith('.sqlite3'))).toEqual([]);
  });

  it('before a migration: a copy through serialize; nothing for a file with no tables', () => {
    const { dir, live } = workshop('backup-migration');
    live.repos().parts.create(coilIn);
    const info = backupBeforeMigration(live.db, dir, new Date('2026-01-01T00:00:00.000Z'))!;
    expect(info.reason).toBe('before-migration');
    expect(countsIn(info.file)).toEqual({ engines: 0, parts: 1, plans: 0 });
    const empty = new Database(join(dir, 'empty.sqlite3'));
    expect(backupBeforeMigration(empty, dir)).toBeNull();
    empty.close();
  });

  it('lists backups newest first with their counts', async () => {
    const { dir, live } = workshop('backup-list');
    const repos = live.repos();
    await createBackup(live.db, dir, 'manual', new Date('2026-05-01T10:00:00.000Z'));
    repos.parts.create(coilIn);
    await createBackup(live.db, dir, 'manual', new Date('2026-05-02T10:00:00.000Z'));
    const list = listBackups(dir);
    expect(list.map((b) => b.createdAt)).toEqual(['2026-05-02T10:00:00.000Z', '2026-05-01T10:00:00.000Z']);
    expect(list.map((b) => b.counts?.parts)).toEqual([1, 0]);
  });
});

describe('keeping backups', () => {
  const name = (iso: string): string => `workshop-${iso.replace(/:/g, '-').replace('.', '-')}-daily.sqlite3`;

  it('keeps the newest 10 and the newest of each month', () => {
    // 12 daily backups in June, 3 in May, 2 in April.
    const june = Array.from({ length: 12 }, (_, i) => `2026-06-${String(i + 1).padStart(2, '0')}T08:00:00.000Z`);
    const may = ['2026-05-10T08:00:00.000Z', '2026-05-20T08:00:00.000Z', '2026-05-30T08:00:00.000Z'];
    const april = ['2026-04-01T08:00:00.000Z', '2026-04-15T08:00:00.000Z'];
    const all = [...june, ...may, ...april].map(name);
    // By hand: the newest 10 are 3-12 June; the newest of June is among them; of May the 30th; of April the 15th.
    // So removed: 1 and 2 June, 10 and 20 May, 1 April.
    const expected = ['2026-06-02T08:00:00.000Z', '2026-06-01T08:00:00.000Z', '2026-05-20T08:00:00.000Z', '2026-05-10T08:00:00.000Z', '2026-04-01T08:00:00.000Z'].map(name);
    expect(backupsToRemove(all).sort()).toEqual(expected.sort());
    // The limits are settable: keep 2, no monthly.
    expect(backupsToRemove(all, 2, false)).toHaveLength(all.length - 2);
  });

  it('thins the folder as backups are made', async () => {
    const { dir, live } = workshop('backup-prune');
    live.repos().parts.create(coilIn);
    for (let day = 1; day <= 13; day++) await createBackup(live.db, dir, 'daily', new Date(Date.UTC(2026, 6, day, 9)));
    await createBackup(live.db, dir, 'daily', new Date(Date.UTC(2026, 5, 30, 9))); // an older one from June
    const names = readdirSync(backupsDir(dir)).sort();
    // Newest 10 of July (4-13) plus the newest of June (the 30th, kept as its month's last).
    expect(names).toHaveLength(11);
    expect(names[0]).toContain('2026-06-30');
    expect(names[1]).toContain('2026-07-04');
  });

  it('once a day: a backup on the first open of the day, none on the second; none for an empty store', async () => {
    const { dir, live } = workshop('backup-daily');
    expect(await dailyBackupIfDue(live.db, dir, new Date('2026-02-02T07:00:00.000Z'))).toBeNull();
    live.repos().parts.create(coilIn);
    expect((await dailyBackupIfDue(live.db, dir, new Date('2026-02-02T07:00:00.000Z')))?.reason).toBe('daily');
    expect(await dailyBackupIfDue(live.db, dir, new Date('2026-02-02T21:00:00.000Z'))).toBeNull();
    expect((await dailyBackupIfDue(live.db, dir, new Date('2026-02-03T06:00:00.000Z')))?.reason).toBe('daily');
    expect(listBackups(dir)).toHaveLength(2);
  });
});

describe('restoring a backup', () => {
  it('brings the backed-up workshop back and first keeps a copy of the one it replaces', async () => {
    const { dir, live } = workshop('restore');
    const repos = live.repos();
    const a = repos.engines.create({ ...engineIn(), name: 'Engine kept in the backup' });
    const backup = await createBackup(live.db, dir, 'manual');
    repos.engines.delete(a.id, { deletePlansToo: true, expectedUpdatedAt: a.updatedAt });
    repos.engines.create({ ...engineIn(), name: 'Engine added after' });

    const result = await restoreBackup(live, dir, backupFileFor(dir, backup.name));
    expect(engineNames(live.db)).toEqual(['Engine kept in the backup']);
    expect(live.db.pragma('integrity_check', { simple: true })).toBe('ok');
    expect(live.db.pragma('journal_mode', { simple: true })).toBe('wal');
    // The copy made first holds the workshop as it was before the restore.
    const safety = new Database(result.safetyBackup.file, { readonly: true });
    expect(engineNames(safety)).toEqual(['Engine added after']);
    safety.close();
    expect(readdirSync(dir).filter((n) => n.startsWith('.restore-'))).toEqual([]);
  });

  it('refuses a damaged backup and changes nothing', async () => {
    const { dir, live } = workshop('restore-bad');
    live.repos().engines.create({ ...engineIn(), name: 'Stays' });
    const bad = join(backupsDir(dir), 'workshop-2026-01-01T00-00-00-000Z-manual.sqlite3');
    await createBackup(live.db, dir, 'manual');
    writeFileSync(bad, 'this is not a database');
    await expect(restoreBackup(live, dir, bad)).rejects.toBeInstanceOf(StoreError);
    expect(engineNames(live.db)).toEqual(['Stays']);
  });

  it('refuses while another connection holds the file, and keeps the workshop as it was', async () => {
    const { dir, live } = workshop('restore-busy');
    live.repos().engines.create({ ...engineIn(), name: 'Before' });
    const backup = await createBackup(live.db, dir, 'manual');
    live.repos().engines.create({ ...engineIn(), name: 'After' });
    const other = new Database(live.file);
    other.prepare('SELECT COUNT(*) FROM engines').get();
    await expect(restoreBackup(live, dir, backup.file)).rejects.toThrow(/Another program/);
    other.close();
    expect(engineNames(live.db)).toEqual(['After', 'Before']);
  });

  it('takes only a backup name from the list, never a path', () => {
    const { dir } = workshop('restore-name');
    expect(() => backupFileFor(dir, '../workshop.sqlite3')).toThrow(StoreError);
    expect(() => backupFileFor(dir, 'workshop-2026-01-01T00-00-00-000Z-manual.sqlite3')).toThrow(/no backup/);
    expect(existsSync(backupsDir(dir))).toBe(false);
  });
});
