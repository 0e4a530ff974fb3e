/**
 * Issue 8, defect 5: the desktop app's question when the workshop will not open. One button per
 * way out that can work (no "newest backup" button without a readable backup), then Quit; the
 * sentence names the file. The problems are built by describeStartupProblem from real errors.
 */
import Database from 'better-sqlite3';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { describeStartupProblem } from '../../db/startup-problem.js';
import { startupChoices } from '../../electron/shell/startup-choices.js';

const dir = mkdtempSync(path.join(os.tmpdir(), 'ignition-choices-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function realNotADatabaseError(): unknown {
  const file = path.join(dir, 'workshop.sqlite3');
  writeFileSync(file, 'not a database '.repeat(100));
  try {
    new Database(file).pragma('user_version');
  } catch (err) {
    return err;
  }
  throw new Error('SQLite read a text file as a database');
}

describe('startupChoices', () => {
  const file = path.join(dir, 'workshop.sqlite3');
  const problem = describeStartupProblem(realNotADatabaseError(), file, dir);

  it('offers the newest backup first when there is one, and says when it was made', () => {
    const q = startupChoices(problem, { createdAt: '2026-12-01T07:45:00.000Z' });
    expect(q.buttons).toEqual(['Open the newest backup', 'Open read-only and export…', 'Choose another folder…', 'Quit']);
    expect(q.choices).toEqual(['newest-backup', 'read-only-export', 'other-folder', 'quit']);
    expect(q.detail).toContain(file);
    expect(q.detail).toMatch(/The newest backup was made 2026-12-01 at 07:45 \(UTC\)\.$/);
  });

  it('leaves the backup out when there is none', () => {
    const q = startupChoices(problem, null);
    expect(q.choices).toEqual(['read-only-export', 'other-folder', 'quit']);
    expect(q.detail).toBe(problem.sentence);
  });
});
