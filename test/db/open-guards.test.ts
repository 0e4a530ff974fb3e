/**
 * Issue 8, defects 3 and 4, on real SQLite files: another program's database is refused and left
 * byte-for-byte as it was; write transactions begin IMMEDIATE so a second connection cannot slip a
 * commit between our read and our write (sqlite.org/lang_transaction.html: a deferred transaction
 * that started reading and then tries to write after another connection committed gets
 * SQLITE_BUSY_SNAPSHOT, sqlite.org/rescode.html#busy_snapshot); the migration re-reads the version
 * under its write lock; one app per data folder (a lock file).
 */
import Database from 'better-sqlite3';
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { StoreError } from '../../db/errors.js';
import { LOCK_FILE_NAME, lockDataDir } from '../../db/lock.js';
import { migrations } from '../../db/migrations/index.js';
import { applyOne, migrate, readUserVersion } from '../../db/migrations/runner.js';
import { closeStore, openStore } from '../../db/open.js';
import { createRepositories } from '../../db/repositories/index.js';
import { engineIn, tempDir } from './samples.js';

const cleanups: Array<() => void> = [];
afterEach(() => {
  while (cleanups.length) cleanups.pop()!();
});
function temp(label: string): string {
  const t = tempDir(label);
  cleanups.push(t.cleanup);
  return t.dir;
}
const sha = (file: string): string => createHash('sha256').update(readFileSync(file)).digest('hex');

function caught(fn: () => unknown): StoreError {
  try {
    fn();
  } catch (err) {
    if (err instanceof StoreError) return err;
    throw err;
  }
  throw new Error('expected a StoreError');
}

describe("another program's database", () => {
  it('is refused with a sentence naming the file, left byte-for-byte unchanged, and not switched to WAL', () => {
    const file = join(temp('foreign'), 'workshop.sqlite3');
    const other = new Database(file);
    other.exec("CREATE TABLE contacts (id INTEGER PRIMARY KEY, name TEXT); INSERT INTO contacts (name) VALUES ('someone'); CREATE TABLE parts (x);");
    other.close();
    const before = sha(file);
    const err = caught(() => openStore(file));
    expect(err.code).toBe('FOREIGN_FILE');
    expect(err.message).toBe(
      `The file ${file} is not a workshop file: it is another program's database (tables contacts, parts). It was not opened and not changed. Choose another data folder for the workshop.`,
    );
    expect(sha(file)).toBe(before);
    expect(existsSync(`${file}-wal`)).toBe(false);
    const again = new Database(file, { readonly: true });
    expect(again.pragma('journal_mode', { simple: true })).toBe('delete');
    expect(again.prepare("SELECT name FROM sqlite_master WHERE type = 'table' ORDER BY name").all()).toEqual([{ name: 'contacts' }, { name: 'parts' }]);
    again.close();
  });

  it('is refused even when it holds only a view or an index-free table with no rows', () => {
    const file = join(temp('foreign-view'), 'workshop.sqlite3');
    const other = new Database(file);
    other.exec('CREATE VIEW answer AS SELECT 42 AS n;');
    other.close();
    expect(caught(() => openStore(file)).code).toBe('FOREIGN_FILE');
  });

  it('an empty file (or none) is still a new workshop', () => {
    const dir = temp('empty');
    writeFileSync(join(dir, 'empty.sqlite3'), '');
    for (const name of ['empty.sqlite3', 'missing.sqlite3']) {
      const db = openStore(join(dir, name));
      expect(readUserVersion(db)).toBe(migrations.length);
      closeStore(db);
    }
  });
});

describe('write transactions begin IMMEDIATE', () => {
  it('another connection cannot commit between our read and our write; ours then commits instead of failing with BUSY_SNAPSHOT', () => {
    const file = join(temp('immediate'), 'workshop.sqlite3');
    const db = openStore(file);
    const repos = createRepositories(db);
    const other = new Database(file);
    other.pragma('busy_timeout = 0'); // fail at once instead of waiting, so the test sees who holds the lock
    let otherResult = '';
    const saved = repos.transaction(() => {
      repos.engines.list(); // a read first: a deferred transaction would now hold only a read snapshot
      try {
        other.prepare("INSERT INTO meta (key, value) VALUES ('other', 'x')").run();
        otherResult = 'committed';
      } catch (err) {
        otherResult = (err as { code?: string }).code ?? String(err);
      }
      return repos.engines.create(engineIn());
    });
    expect(otherResult).toBe('SQLITE_BUSY');
    expect(repos.engines.get(saved.id).name).toBe(saved.name);
    other.close();
    closeStore(db);
  });

  it('a migration re-reads the version under its write lock: one another process already applied is skipped, a gap is refused', () => {
    const file = join(temp('race'), 'workshop.sqlite3');
    const first = new Database(file);
    const second = new Database(file);
    // Both saw version 0; the first applies migration 1, then the second reaches it.
    applyOne(first, migrations[0]!);
    expect(() => applyOne(second, migrations[0]!)).not.toThrow();
    expect(readUserVersion(second)).toBe(1);
    expect(() => applyOne(second, migrations[2]!)).toThrow(/expected the file at version 2, found 1/);
    migrate(second, migrations);
    expect(readUserVersion(first)).toBe(migrations.length);
    first.close();
    second.close();
  });
});

describe('one app per data folder', () => {
  it('a second lock on the folder is refused, naming who holds it; after release it can be taken', () => {
    const dir = temp('lock');
    const lock = lockDataDir(dir, 'browser');
    const err = caught(() => lockDataDir(dir, 'desktop'));
    expect(err.code).toBe('LOCKED');
    expect(err.message).toMatch(new RegExp(`^The workshop in ${dir.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')} is already open in a browser host \\(process ${process.pid}, started .+\\)\\. Close that one first, or choose another data folder`));
    lock.release();
    expect(existsSync(join(dir, LOCK_FILE_NAME))).toBe(false);
    lockDataDir(dir, 'desktop').release();
  });

  it('takes over a lock left by a process that no longer runs (killed, power cut)', () => {
    const dir = temp('stale-lock');
    // Pid 2^22 + 1 is above Linux's largest pid (pid_max at most 2^22, man 5 proc), so no process has it.
    writeFileSync(join(dir, LOCK_FILE_NAME), JSON.stringify({ pid: 4194305, host: 'browser', startedAt: '2024-01-01T00:00:00.000Z' }));
    const lock = lockDataDir(dir, 'desktop');
    expect(JSON.parse(readFileSync(join(dir, LOCK_FILE_NAME), 'utf8'))).toMatchObject({ pid: process.pid, host: 'desktop' });
    lock.release();
  });
});
