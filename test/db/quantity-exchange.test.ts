/**
 * The parts' quantity (store version 5) in the workshop file and the parts CSV: written out,
 * read back, and one when an older file has no such field or column. Real SQLite files.
 */
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { StoreError } from '../../db/errors.js';
import { exportWorkshop, partsCsvExport, partsCsvImport, workshopImport } from '../../db/exchange/index.js';
import { closeStore, openStore } from '../../db/open.js';
import { createRepositories } from '../../db/repositories/index.js';
import { coilIn, leadsIn, tempDir } from './samples.js';

const cleanups: Array<() => void> = [];
afterEach(() => {
  while (cleanups.length) cleanups.pop()!();
});
function store(label: string) {
  const t = tempDir(label);
  const db = openStore(join(t.dir, 'workshop.sqlite3'));
  cleanups.push(() => {
    closeStore(db);
    t.cleanup();
  });
  return { db, repos: createRepositories(db) };
}

describe('quantity in the workshop file', () => {
  it('is written for every part and read back', () => {
    const src = store('qty-src');
    src.repos.parts.create({ ...coilIn, quantity: 4 });
    src.repos.parts.create(leadsIn);
    const { workshop } = exportWorkshop(src.db);
    expect(workshop.parts.map((p) => [p['name'], p['quantity']])).toEqual([
      [coilIn.name, 4],
      [leadsIn.name, 1],
    ]);
    const dst = store('qty-dst');
    workshopImport(dst.db, JSON.parse(JSON.stringify(workshop)));
    expect(dst.repos.parts.list().map((p) => [p.name, p.quantity])).toEqual([
      [coilIn.name, 4],
      [leadsIn.name, 1],
    ]);
  });

  it('reads a file written before quantities existed as one of each, and matches it to the same part already stored', () => {
    const src = store('qty-old');
    src.repos.parts.create(coilIn);
    const { workshop } = exportWorkshop(src.db);
    const old = JSON.parse(JSON.stringify(workshop)) as { parts: Array<Record<string, unknown>> };
    for (const p of old.parts) delete p['quantity'];
    const dst = store('qty-old-dst');
    const summary = workshopImport(dst.db, old);
    expect(summary.added.parts).toBe(1);
    expect(dst.repos.parts.list().map((p) => p.quantity)).toEqual([1]);
    // A second import of the same old file finds the part already there (quantity 1 both sides).
    expect(workshopImport(dst.db, old).skipped).toBe(1);
  });

  it('refuses a bad quantity in the file naming the record and the field', () => {
    const src = store('qty-bad');
    src.repos.parts.create(coilIn);
    const { workshop } = exportWorkshop(src.db);
    const bad = JSON.parse(JSON.stringify(workshop)) as { parts: Array<Record<string, unknown>> };
    bad.parts[0]!['quantity'] = 0;
    const dst = store('qty-bad-dst');
    let err: unknown;
    try {
      workshopImport(dst.db, bad);
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(StoreError);
    expect((err as StoreError).fields?.['parts.0.quantity']).toMatch(/at least 1/);
    expect(dst.repos.parts.count()).toBe(0);
  });
});

describe('quantity in the parts CSV', () => {
  it('has a "how many" column, read back as written', () => {
    const src = store('csv-qty');
    src.repos.parts.create({ ...coilIn, quantity: 2 });
    const { csv } = partsCsvExport(src.db, 'coil');
    const [header, row] = csv.trim().split('\n');
    expect(header!.split(',').at(-1)).toBe('how many');
    expect(row!.split(',').at(-1)).toBe('2');
    const dst = store('csv-qty-dst');
    partsCsvImport(dst.db, 'coil', csv);
    expect(dst.repos.parts.list().map((p) => p.quantity)).toEqual([2]);
  });

  it('reads a CSV without the column, or with it blank, as one of each; a count of 1.5 names row and column', () => {
    const src = store('csv-old');
    src.repos.parts.create({ ...coilIn, quantity: 2 });
    const { csv } = partsCsvExport(src.db, 'coil');
    const lines = csv.trim().split('\n').map((l) => l.split(','));
    const withoutColumn = lines.map((cells) => cells.slice(0, -1).join(',')).join('\n');
    const dst = store('csv-old-dst');
    partsCsvImport(dst.db, 'coil', withoutColumn);
    expect(dst.repos.parts.list().map((p) => p.quantity)).toEqual([1]);

    const blank = lines.map((cells, i) => (i === 0 ? cells : [...cells.slice(0, -1), ''])).map((c) => c.join(',')).join('\n');
    const dst2 = store('csv-blank-dst');
    partsCsvImport(dst2.db, 'coil', blank);
    expect(dst2.repos.parts.list().map((p) => p.quantity)).toEqual([1]);

    const half = lines.map((cells, i) => (i === 0 ? cells : [...cells.slice(0, -1), '1.5'])).map((c) => c.join(',')).join('\n');
    let err: unknown;
    try {
      partsCsvImport(dst2.db, 'coil', half);
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(StoreError);
    expect(Object.entries((err as StoreError).fields ?? {})).toEqual([['row 2, how many you have', 'must be a whole number.']]);
  });
});
