/**
 * The records commands as a child process on real data folders: parts-csv import of the shipped
 * examples, backup, export -> import into a fresh folder (with a preview that writes nothing),
 * restore (only with --yes), and refusals (exit 2, `where: why`, nothing written). Counts are read
 * by the test's own SQL on the store file.
 */
import Database from 'better-sqlite3';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { repoRoot, runCli, tempFile } from './run-cli.js';

const fixtures = join(repoRoot, 'test/fixtures/csv');

function partCount(dir: string): number {
  const db = new Database(join(dir, 'workshop.sqlite3'), { readonly: true });
  try {
    return (db.prepare('SELECT COUNT(*) AS n FROM parts').get() as { n: number }).n;
  } finally {
    db.close();
  }
}

function okJson(args: string[]): any {
  const r = runCli(args);
  expect(r.code, r.stderr).toBe(0);
  return JSON.parse(r.stdout);
}

describe('records on the command line', () => {
  it('CSV import, backup, export -> import into a fresh folder, restore', () => {
    const dir = mkdtempSync(join(tmpdir(), 'cli-records-'));
    const fresh = mkdtempSync(join(tmpdir(), 'cli-records-fresh-'));

    expect(okJson(['parts-csv', 'import', join(fixtures, 'coils-example.csv'), '--kind', 'coil', '--data-dir', dir]).added.parts).toBe(3);
    const backup = okJson(['backup', '--data-dir', dir]);
    expect(backup.counts).toEqual({ engines: 0, parts: 3, plans: 0 });
    expect(okJson(['parts-csv', 'import', join(fixtures, 'plugs-example.csv'), '--kind', 'plug', '--data-dir', dir]).added.parts).toBe(2);

    const out = join(dir, 'export.json');
    expect(okJson(['export', '--data-dir', dir, '--out', out]).counts.parts).toBe(5);
    const preview = okJson(['import', out, '--data-dir', fresh, '--preview']);
    expect(preview.preview).toBe(true);
    expect(preview.added.parts).toBe(5);
    expect(partCount(fresh)).toBe(0);
    expect(okJson(['import', out, '--data-dir', fresh]).added.parts).toBe(5);
    expect(partCount(fresh)).toBe(5);

    const asked = runCli(['restore', backup.name, '--data-dir', dir]);
    expect(asked.code).toBe(2);
    expect(asked.stderr).toContain('--yes:');
    expect(partCount(dir)).toBe(5);
    const restored = okJson(['restore', backup.name, '--data-dir', dir, '--yes']);
    expect(restored.safetyBackup.counts.parts).toBe(5);
    expect(partCount(dir)).toBe(3);
    const list = okJson(['backup', '--list', '--data-dir', dir]);
    expect(list.backups.map((b: any) => b.reason).sort()).toEqual(['before-restore', 'manual']);
  }, 300_000);

  it('refuses a CSV with one bad row whole, naming the row, and writes nothing', () => {
    const dir = mkdtempSync(join(tmpdir(), 'cli-records-bad-'));
    const header = 'name,notes,primary resistance at 20 C (ohm),primary inductance (mH),secondary resistance (ohm),turns ratio (secondary to primary),secondary inductance (H),for use with a ballast (yes/no),rated voltage (V),maximum dissipation (W)';
    const csv = tempFile([header, 'Good,,3,8,7500,80,,no,12,', 'Bad,,0,8,7500,80,,no,12,'].join('\n'));
    const r = runCli(['parts-csv', 'import', csv, '--kind', 'coil', '--data-dir', dir]);
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toContain('row 3, primary resistance: must be more than zero.');
    expect(r.stderr).not.toMatch(/\n\s+at .+:\d+:\d+/);
    expect(partCount(dir)).toBe(0);
  }, 120_000);

  it('refuses a bad workshop file with every problem by field, and a missing data folder', () => {
    const dir = mkdtempSync(join(tmpdir(), 'cli-records-badfile-'));
    const file = tempFile({ format: 'ignition-planner-workshop', version: 1, parts: [{ id: 1, kind: 'tach', name: '', notes: '', senses: 'cable', colour: 'red' }], engines: [] });
    const r = runCli(['import', file, '--data-dir', dir]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('parts.0.name: Give the part a name.');
    const noDir = runCli(['export', '--data-dir', join(dir, 'nowhere')]);
    expect(noDir.code).toBe(2);
    expect(noDir.stderr).toContain('--data-dir: there is no workshop');
  }, 120_000);
});
