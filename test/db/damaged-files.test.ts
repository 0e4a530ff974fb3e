/**
 * Issue 8, defect 5: 20 damaged or unusable workshop folders, each opened the way both hosts open
 * one (`openBackend`), each with the sentence the person sees (db/startup-problem.ts) and, where the
 * file was refused, the proof that it was not changed (same SHA-256, no -wal file left). Damage is
 * made with real bytes on real files: SQLite's file format (sqlite.org/fileformat2.html: the 16-byte
 * magic "SQLite format 3\0", the page size at offset 16, the schema on page 1), gzip, and raw SQL.
 * Also: choosing the newest backup moves the damaged file aside with the date, unchanged.
 */
import Database from 'better-sqlite3';
import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { chmodSync, existsSync, mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { createBackup } from '../../db/backup.js';
import { LOCK_FILE_NAME } from '../../db/lock.js';
import { SCHEMA_VERSION } from '../../db/open.js';
import { replaceWithNewestBackup } from '../../db/recover.js';
import { describeStartupProblem } from '../../db/startup-problem.js';
import { openBackend } from '../../electron/ipc/backend.js';
import { tempDir } from './samples.js';

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
const root = process.getuid?.() === 0;

/** A good workshop file (the demo, closed cleanly), as bytes. */
let good: Buffer;
let goodDir: string;
beforeAll(() => {
  goodDir = tempDir('good').dir;
  openBackend({ dataDir: goodDir, host: 'browser', version: 'test' }).close();
  good = readFileSync(join(goodDir, 'workshop.sqlite3'));
});
afterAll(() => execFileSync('rm', ['-rf', goodDir]));

/** Opens the folder as a host does; answers the sentence shown, or null if it opened. */
function sentenceFor(dir: string): string | null {
  try {
    openBackend({ dataDir: dir, host: 'browser', version: 'test' }).close();
    return null;
  } catch (err) {
    return describeStartupProblem(err, join(dir, 'workshop.sqlite3'), dir).sentence;
  }
}

const damaged = (file: string): string =>
  `The workshop file ${file} is damaged: SQLite cannot read it as a database. It was not changed. Open the newest backup (the damaged file is kept beside it, renamed with today's date), open it read-only to export what can still be read, or choose another folder.`;

/** A folder with `workshop.sqlite3` holding these bytes. */
function folderWith(label: string, bytes: Buffer): { dir: string; file: string } {
  const dir = temp(label);
  const file = join(dir, 'workshop.sqlite3');
  writeFileSync(file, bytes);
  return { dir, file };
}

function withRawSql(label: string, sql: (db: Database.Database) => void): { dir: string; file: string } {
  const f = folderWith(label, good);
  const db = new Database(f.file);
  sql(db);
  db.close();
  return f;
}

const pageSize = (): number => good.readUInt16BE(16);

const damagedCases: Array<[string, () => { dir: string; file: string }]> = [
  ['random bytes', () => folderWith('random', Buffer.from(Array.from({ length: 8192 }, (_, i) => (i * 7919 + 13) % 251)))],
  ['a text file', () => folderWith('text', Buffer.from('Shopping list: points, condenser, rotor arm.\n'.repeat(200)))],
  ['the header only (first 100 bytes)', () => folderWith('header', good.subarray(0, 100))],
  ['a file cut to half its length', () => folderWith('half', good.subarray(0, Math.floor(good.length / pageSize() / 2) * pageSize()))],
  ['a zeroed page in the middle', () => {
    const b = Buffer.from(good);
    const p = Math.floor(b.length / pageSize() / 2);
    b.fill(0, p * pageSize(), (p + 1) * pageSize());
    return folderWith('zeroed', b);
  }],
  ['page 1 (the schema) overwritten after the header', () => {
    const b = Buffer.from(good);
    b.fill(0x5a, 100, pageSize());
    return folderWith('schema', b);
  }],
  ['the workshop file gzipped', () => folderWith('gzip', gzipSync(good))],
  ['a page size of 3 bytes in the header', () => {
    const b = Buffer.from(good);
    b.writeUInt16BE(3, 16);
    return folderWith('pagesize', b);
  }],
  ["the parts table's first page zeroed", () => {
    const probe = folderWith('probe', good);
    const db = new Database(probe.file, { readonly: true });
    const { rootpage } = db.prepare("SELECT rootpage FROM sqlite_master WHERE name = 'parts'").get() as { rootpage: number };
    db.close();
    const b = Buffer.from(good);
    b.fill(0, (rootpage - 1) * pageSize(), rootpage * pageSize());
    return folderWith('rootpage', b);
  }],
  ['every page after the first zeroed', () => {
    const b = Buffer.from(good);
    b.fill(0, pageSize());
    return folderWith('allzero', b);
  }],
];

describe('damaged workshop files: refused with a sentence, never changed', () => {
  it.each(damagedCases)('%s', (_what, make) => {
    const { dir, file } = make();
    const before = sha(file);
    expect(sentenceFor(dir)).toBe(damaged(file));
    expect(sha(file)).toBe(before);
    expect(existsSync(`${file}-wal`)).toBe(false);
    expect(existsSync(join(dir, LOCK_FILE_NAME))).toBe(false);
  });
});

describe('files and folders that cannot be used', () => {
  it('11. a file from a newer app', () => {
    const { dir, file } = withRawSql('newer', (db) => db.pragma('user_version = 99'));
    const before = sha(file);
    expect(sentenceFor(dir)).toBe(
      `This workshop file was written by a newer version of the app (schema 99; this app knows up to ${SCHEMA_VERSION}). Update the app; the file was not changed. (${file})`,
    );
    expect(sha(file)).toBe(before);
  });

  it("12. another program's database", () => {
    const { dir, file } = folderWith('foreign', Buffer.alloc(0));
    const db = new Database(file);
    db.exec('CREATE TABLE invoices (id INTEGER PRIMARY KEY, total REAL)');
    db.close();
    const before = sha(file);
    expect(sentenceFor(dir)).toBe(`The file ${file} is not a workshop file: it is another program's database (table invoices). It was not opened and not changed. Choose another data folder for the workshop.`);
    expect(sha(file)).toBe(before);
  });

  it('13. the data folder is a file', () => {
    const parent = temp('notdir');
    const dir = join(parent, 'not-a-folder');
    writeFileSync(dir, 'x');
    const file = join(dir, 'workshop.sqlite3');
    expect(sentenceFor(dir)).toBe(
      `The workshop file ${file} could not be opened: the data folder ${dir} is missing, is not a folder, or the file's name is taken by a folder. Nothing was changed. Check the folder, or choose another one.`,
    );
  });

  it("14. the workshop file's name is taken by a folder", () => {
    const dir = temp('isdir');
    const file = join(dir, 'workshop.sqlite3');
    mkdirSync(file);
    expect(sentenceFor(dir)).toBe(
      `The workshop file ${file} could not be opened: the data folder ${dir} is missing, is not a folder, or the file's name is taken by a folder. Nothing was changed. Check the folder, or choose another one.`,
    );
  });

  // Root ignores permission bits, so as root the immutable attribute (chattr +i) stands in for them.
  function readOnly(path: string, on: boolean): void {
    if (root) execFileSync('chattr', [on ? '+i' : '-i', path]);
    else chmodSync(path, on ? 0o555 : 0o755);
  }

  it('15. a read-only workshop file that needs an upgrade ("attempt to write a readonly database")', () => {
    const { dir, file } = withRawSql('readonly', (db) => db.pragma('user_version = 3'));
    // Opening it must write (WAL, then the version 3 -> 4 upgrade); SQLite opens an unwritable file read-only.
    readOnly(file, true);
    cleanups.push(() => readOnly(file, false));
    const before = sha(file);
    expect(sentenceFor(dir)).toBe(
      `The workshop file ${file} cannot be written: the file, its folder or the disk is read-only. Nothing was changed. Make the folder writable, choose another folder, or open the file read-only to export what it holds.`,
    );
    expect(sha(file)).toBe(before);
  });

  it('16. a data folder the app may not write in (EACCES / EPERM)', () => {
    const { dir } = folderWith('noaccess', good);
    readOnly(dir, true);
    cleanups.push(() => readOnly(dir, false));
    expect(sentenceFor(dir)).toBe(`The app is not allowed to use the data folder ${dir} (the system refused access). Nothing was changed. Give your user access to it, or choose another folder.`);
  });

  it('17. a folder another running copy holds', () => {
    const { dir } = folderWith('locked', good);
    // Process 1 (init) always runs.
    writeFileSync(join(dir, LOCK_FILE_NAME), JSON.stringify({ pid: 1, host: 'desktop', startedAt: '2026-12-01T08:00:00.000Z' }));
    expect(sentenceFor(dir)).toBe(
      `The workshop in ${dir} is already open in the desktop app (process 1, started 2026-12-01T08:00:00.000Z). Close that one first, or choose another data folder; only one copy may use a folder at a time.`,
    );
  });
});

describe('damage the app survives', () => {
  it('18. a garbage -wal file beside a good file: opens with every record (SQLite ignores a WAL whose checksums fail)', () => {
    const { dir, file } = folderWith('badwal', good);
    writeFileSync(`${file}-wal`, Buffer.alloc(5000, 0x33));
    expect(sentenceFor(dir)).toBeNull();
    const b = openBackend({ dataDir: dir, host: 'browser', version: 'test' });
    return b
      .dispatch('engines.list', {})
      .then((r) => {
        const original = new Database(join(goodDir, 'workshop.sqlite3'), { readonly: true });
        const n = (original.prepare('SELECT COUNT(*) AS n FROM engines').get() as { n: number }).n;
        original.close();
        expect(r).toMatchObject({ ok: true });
        expect((r as { value: unknown[] }).value).toHaveLength(n);
      })
      .finally(() => b.close());
  });

  it('19. one damaged row: the workshop opens, and the one record is named as unreadable', async () => {
    const { dir } = withRawSql('row', (db) => db.prepare("UPDATE parts SET data = '{}' WHERE id = (SELECT min(id) FROM parts)").run());
    expect(sentenceFor(dir)).toBeNull();
    const b = openBackend({ dataDir: dir, host: 'browser', version: 'test' });
    try {
      const r = (await b.dispatch('store.unreadable', {})) as { ok: true; value: { rows: Array<{ message: string }> } };
      expect(r.value.rows).toHaveLength(1);
      expect(r.value.rows[0]!.message).toMatch(/^The row with id \d+ in the parts table could not be read/);
    } finally {
      b.close();
    }
  });

  it('20. an empty (0-byte) file: a new workshop', () => {
    const { dir } = folderWith('empty', Buffer.alloc(0));
    expect(sentenceFor(dir)).toBeNull();
  });
});

describe('the way out: the newest backup', () => {
  it('moves the damaged file aside with the date, unchanged, and puts the newest backup in place', async () => {
    const dir = temp('recover');
    const b = openBackend({ dataDir: dir, host: 'browser', version: 'test' });
    const engines = ((await b.dispatch('engines.list', {})) as { value: unknown[] }).value;
    b.close();
    const db = new Database(join(dir, 'workshop.sqlite3'));
    await createBackup(db, dir, 'manual');
    db.close();
    const file = join(dir, 'workshop.sqlite3');
    writeFileSync(file, Buffer.from('not a database any more '.repeat(300)));
    const damagedSha = sha(file);
    expect(sentenceFor(dir)).toBe(damaged(file));

    const now = new Date('2026-12-02T04:15:30.000Z');
    const r = replaceWithNewestBackup(dir, now);
    expect(r.movedTo).toBe(join(dir, 'workshop-damaged-2026-12-02T04-15-30Z.sqlite3'));
    expect(sha(r.movedTo)).toBe(damagedSha);
    expect(readdirSync(dir).filter((n) => n.startsWith('.recover'))).toEqual([]);
    const again = openBackend({ dataDir: dir, host: 'browser', version: 'test' });
    try {
      expect(((await again.dispatch('engines.list', {})) as { value: unknown[] }).value).toEqual(engines);
    } finally {
      again.close();
    }
  });
});
