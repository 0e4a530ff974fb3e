/**
 * SIGKILL during a backup, an import and a restore leaves the workshop whole. Each round starts
 * test/db/crash/child.ts on a real data folder, waits for its "ready", kills it with SIGKILL after
 * a random delay spread over the time the work takes (measured first by a run that is not
 * killed), and then checks on disk:
 * - `PRAGMA integrity_check` is "ok" on the workshop file and on every finished backup;
 * - an import is all or nothing: the engines are the ones before or the ones before plus every
 *   engine of the file, never some;
 * - a restore leaves the old workshop or the restored one, never a mix or nothing.
 * SQLite's promise under test: a transaction is atomic across a crash (sqlite.org/atomiccommit.html),
 * and rename(2) replaces a file atomically (POSIX). The figures (tried, failed, lost) go to stdout.
 */
import Database from 'better-sqlite3';
import { spawn } from 'node:child_process';
import { mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { backupsDir, createBackup } from '../../db/backup.js';
import { exportWorkshop } from '../../db/exchange/index.js';
import { storeFileIn } from '../../db/location.js';
import { closeStore, openStore } from '../../db/open.js';
import { createRepositories } from '../../db/repositories/index.js';
import { coilIn, engineIn, planIn, readingIn } from './samples.js';

const repoRoot = resolve(import.meta.dirname, '../..');
/** Rounds per kind; CRASH_ROUNDS=50 for a longer run. */
const ROUNDS = Number(process.env['CRASH_ROUNDS'] ?? 6);
const root = mkdtempSync(join(tmpdir(), 'crash-safety-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

type Run = { killed: boolean; ms: number | null };

/** Starts the child; after "ready", kills it `killAfterMs` later (null: lets it finish). */
function runChild(args: string[], killAfterMs: number | null): Promise<Run> {
  return new Promise((resolvePromise, reject) => {
    const child = spawn(process.execPath, ['--import', 'tsx', 'test/db/crash/child.ts', ...args], { cwd: repoRoot, stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    let err = '';
    let killed = false;
    child.stdout.on('data', (b: Buffer) => {
      out += b.toString();
      if (out.startsWith('ready\n') && killAfterMs !== null && !killed) {
        killed = true;
        setTimeout(() => child.kill('SIGKILL'), killAfterMs);
      }
    });
    child.stderr.on('data', (b: Buffer) => (err += b.toString()));
    child.on('error', reject);
    child.on('exit', (code, signal) => {
      const done = /done ([\d.]+)/.exec(out);
      if (signal !== 'SIGKILL' && code !== 0) reject(new Error(`child failed (${code}): ${err}`));
      else resolvePromise({ killed: signal === 'SIGKILL', ms: done ? Number(done[1]) : null });
    });
  });
}

/**
 * Opens the file the way the next start does (read-write, so SQLite replays a write-ahead log a kill
 * left behind; a read-only connection cannot rebuild the log's index and says "attempt to write a
 * readonly database"), then reads it.
 */
function inspect(file: string): { integrity: string; engines: string[] } {
  const db = new Database(file, { fileMustExist: true });
  try {
    return {
      integrity: String(db.pragma('integrity_check', { simple: true })),
      engines: (db.prepare('SELECT name FROM engines ORDER BY name').all() as Array<{ name: string }>).map((r) => r.name),
    };
  } finally {
    db.close();
  }
}

/** A workshop with `engines` engines, each with two plans and readings, in a new folder. */
function seed(dir: string, prefix: string, engines: number): void {
  const db = openStore(storeFileIn(dir));
  const repos = createRepositories(db);
  repos.transaction(() => {
    const coil = repos.parts.create({ ...coilIn, name: `${prefix} coil` });
    for (let i = 0; i < engines; i++) {
      const e = repos.engines.create({ ...engineIn({ coilId: coil.id }), name: `${prefix} engine ${i}` });
      for (const n of ['first', 'second']) {
        const p = repos.plans.create({ ...planIn(e.id, { coilId: coil.id }), name: `${prefix} plan ${n}` });
        for (let k = 0; k < 3; k++) repos.readings.add(readingIn(p.id, 2 + k / 10));
      }
    }
  });
  closeStore(db);
}

const delay = (maxMs: number): number => Math.random() * maxMs;
/** Per kind: rounds tried, killed before the child said done, failing integrity_check, losing records; `applied` = rounds that ended with the new state. */
const figures: Record<string, { tried: number; killedMidWork: number; failed: number; lost: number; applied: number }> = {};

describe('SIGKILL leaves the workshop whole', () => {
  it('during an import: all of the file or none of it', async () => {
    const dir = join(root, 'import');
    const src = join(root, 'import-src');
    seed(dir, 'Kept', 5);
    seed(src, 'Brought', 150);
    const srcDb = openStore(storeFileIn(src));
    const file = join(root, 'workshop.json');
    writeFileSync(file, JSON.stringify(exportWorkshop(srcDb).workshop));
    closeStore(srcDb);
    const broughtNames = Array.from({ length: 150 }, (_, i) => `Brought engine ${i}`);

    // How long an import takes here, on a copy.
    const probe = join(root, 'import-probe');
    seed(probe, 'Kept', 5);
    const timing = await runChild(['import', probe, file], null);
    const span = (timing.ms ?? 200) * 1.3;

    const f = (figures['import'] = { tried: 0, killedMidWork: 0, failed: 0, lost: 0, applied: 0 });
    const expected = inspect(storeFileIn(dir)).engines;
    for (let round = 0; round < ROUNDS; round++) {
      // Each round from the five kept engines again, so every kill meets a real import.
      rmSync(dir, { recursive: true, force: true });
      seed(dir, 'Kept', 5);
      const run = await runChild(['import', dir, file], delay(span));
      f.tried++;
      if (run.ms === null) f.killedMidWork++;
      const after = inspect(storeFileIn(dir));
      if (after.integrity !== 'ok') f.failed++;
      const whole = after.engines.length === expected.length || after.engines.length === expected.length + broughtNames.length;
      if (after.engines.length === expected.length + broughtNames.length) f.applied++;
      if (!whole || !expected.every((n) => after.engines.includes(n))) f.lost++;
      expect(after.integrity).toBe('ok');
      expect(whole, `round ${round}: ${after.engines.length} engines after, ${expected.length} before`).toBe(true);
    }
    expect(f.lost).toBe(0);
  }, 120_000);

  it('during a restore: the old workshop or the restored one, whole', async () => {
    const dir = join(root, 'restore');
    seed(dir, 'Old', 120);
    const side = join(root, 'restore-side');
    seed(side, 'Restored', 120);
    const sideDb = openStore(storeFileIn(side));
    const backup = (await createBackup(sideDb, side, 'manual')).file;
    closeStore(sideDb);
    const oldNames = inspect(storeFileIn(dir)).engines;
    const newNames = inspect(backup).engines;

    const probe = join(root, 'restore-probe');
    seed(probe, 'Old', 120);
    const timing = await runChild(['restore', probe, backup], null);
    const span = (timing.ms ?? 200) * 1.3;

    const f = (figures['restore'] = { tried: 0, killedMidWork: 0, failed: 0, lost: 0, applied: 0 });
    for (let round = 0; round < ROUNDS; round++) {
      // Start each round from the old workshop again, so each kill can land before or after the switch.
      rmSync(dir, { recursive: true, force: true });
      seed(dir, 'Old', 120);
      const run = await runChild(['restore', dir, backup], delay(span));
      f.tried++;
      if (run.ms === null) f.killedMidWork++;
      const after = inspect(storeFileIn(dir));
      if (after.integrity !== 'ok') f.failed++;
      const same = (a: string[], b: string[]) => a.length === b.length && a.every((n, i) => n === b[i]);
      if (!same(after.engines, oldNames) && !same(after.engines, newNames)) f.lost++;
      if (same(after.engines, newNames)) f.applied++;
      expect(after.integrity).toBe('ok');
      expect(same(after.engines, oldNames) || same(after.engines, newNames), `round ${round}: ${after.engines.length} engines`).toBe(true);
    }
    expect(f.lost).toBe(0);
  }, 120_000);

  it('during a backup: the workshop and every finished backup pass integrity_check', async () => {
    const dir = join(root, 'backup');
    seed(dir, 'Kept', 150);
    const names = inspect(storeFileIn(dir)).engines;
    const timing = await runChild(['backup', dir], null);
    const span = (timing.ms ?? 200) * 1.3;
    const f = (figures['backup'] = { tried: 0, killedMidWork: 0, failed: 0, lost: 0, applied: 0 });
    for (let round = 0; round < ROUNDS; round++) {
      const run = await runChild(['backup', dir], delay(span));
      f.tried++;
      if (run.ms === null) f.killedMidWork++;
      const after = inspect(storeFileIn(dir));
      if (after.integrity !== 'ok') f.failed++;
      if (after.engines.join('|') !== names.join('|')) f.lost++;
      if (run.ms !== null) f.applied++;
      expect(after.integrity).toBe('ok');
      expect(after.engines).toEqual(names);
      for (const n of readdirSync(backupsDir(dir)).filter((x) => x.startsWith('workshop-'))) {
        const b = inspect(join(backupsDir(dir), n));
        if (b.integrity !== 'ok' || b.engines.length !== names.length) f.failed++;
        expect(b.integrity, n).toBe('ok');
        expect(b.engines).toHaveLength(names.length);
      }
    }
    expect(f.failed).toBe(0);
  }, 120_000);

  afterAll(() => {
    for (const [kind, f] of Object.entries(figures)) {
      console.log(
        `[crash-safety] ${kind}: tried ${f.tried}, killed before the child said done ${f.killedMidWork}, ended with the work done ${f.applied}, failed ${f.failed}, lost ${f.lost}`,
      );
    }
  });
});
