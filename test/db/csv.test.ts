/**
 * The parts list as CSV: the shipped examples read as written (units from their headers: 1 mH =
 * 0.001 H and 1 % = 0.01, SI prefixes, BIPM SI Brochure 9th ed. table 7), every kind survives
 * export -> import, and a file with one bad row is refused whole with the row and column named
 * and nothing added. Real SQLite files.
 */
import Database from 'better-sqlite3';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { StoreError } from '../../db/errors.js';
import { partsCsvExport, partsCsvImport, partsCsvPreview, partsFromCsv } from '../../db/exchange/index.js';
import { storeFileIn } from '../../db/location.js';
import { closeStore, openStore } from '../../db/open.js';
import { createRepositories } from '../../db/repositories/index.js';
import { partInput, type PartKind } from '../../db/schema.js';
import { everyKind, tempDir } from './samples.js';

const fixtures = join(import.meta.dirname, '../fixtures/csv');
const open: Array<() => void> = [];
afterEach(() => {
  while (open.length) open.pop()!();
});

function freshStore(label: string): Database.Database {
  const { dir, cleanup } = tempDir(label);
  const db = openStore(storeFileIn(dir));
  open.push(() => {
    closeStore(db);
    cleanup();
  });
  return db;
}
const partCount = (db: Database.Database): number => (db.prepare('SELECT COUNT(*) AS n FROM parts').get() as { n: number }).n;

function refusal(run: () => unknown): Record<string, string> {
  try {
    run();
  } catch (err) {
    expect(err).toBeInstanceOf(StoreError);
    return (err as StoreError).fields ?? {};
  }
  throw new Error('the CSV was accepted');
}

describe('the example CSV files', () => {
  it('read as written, with the header units applied', () => {
    const coils = partsFromCsv('coil', readFileSync(join(fixtures, 'coils-example.csv'), 'utf8'));
    expect(coils.ok).toBe(true);
    if (!coils.ok) return;
    expect(coils.parts.map((p) => p.name)).toEqual(['Canister coil 3 ohm', 'Ballasted coil 1.5 ohm', 'Six-volt coil']);
    const [canister, ballasted, sixVolt] = coils.parts as Array<Extract<(typeof coils.parts)[number], { kind: 'coil' }>>;
    expect(canister!.primaryInductanceH).toBeCloseTo(8 * 0.001, 12); // 8 mH typed
    expect(ballasted!.forBallast).toBe(true);
    expect(ballasted!.ratedSecondaryKv).toBe(35);
    expect(sixVolt!.turnsRatio).toBeNull();
    expect(sixVolt!.ratedVoltageV).toBe(6);
    const plugs = partsFromCsv('plug', readFileSync(join(fixtures, 'plugs-example.csv'), 'utf8'));
    expect(plugs.ok && plugs.parts.map((p) => p.kind === 'plug' && [p.resistor, p.resistorOhm, p.gapMinMm, p.gapMaxMm])).toEqual([
      [false, 0, 0.5, 0.7],
      [true, 5000, 0.6, 1.1],
    ]);
  });
});

describe('export and import', () => {
  it('every kind comes back with the same fields', () => {
    const source = freshStore('csv-src');
    const repos = createRepositories(source);
    for (const p of everyKind) repos.parts.create(p);
    const target = freshStore('csv-dst');
    const kinds = [...new Set(everyKind.map((p) => p.kind))] as PartKind[];
    for (const kind of kinds) {
      const { csv } = partsCsvExport(source, kind);
      partsCsvImport(target, kind, csv);
    }
    const fields = (db: Database.Database) =>
      createRepositories(db)
        .parts.list()
        .map((p) => partInput.parse(p));
    expect(fields(target)).toEqual(fields(source));
    // A second import of the same lists adds nothing: every row matches a part on the shelf.
    const preview = partsCsvPreview(target, 'coil', partsCsvExport(source, 'coil').csv);
    expect(preview.added.parts).toBe(0);
    expect(preview.skipped).toBe(1);
  });

  it('writes the unit into each header and the typed unit into each cell (mH, %)', () => {
    const db = freshStore('csv-units');
    const repos = createRepositories(db);
    for (const p of everyKind) repos.parts.create(p);
    const coilCsv = partsCsvExport(db, 'coil').csv.split('\n');
    expect(coilCsv[0]).toContain('primary inductance (mH)');
    // The sample coil's 0.006 H is 6 mH.
    expect(coilCsv[1]!.split(',')[3]).toBe('6');
    const moduleCsv = partsCsvExport(db, 'module').csv.split('\n');
    const maxDutyCol = moduleCsv[0]!.split(',').indexOf('maximum duty (%)');
    // The sample module's 0.75 is 75 %.
    const row = moduleCsv.find((line) => line.startsWith('Test module,'))!;
    expect(row.split(',')[maxDutyCol]).toBe('75');
  });
});

describe('a CSV with problems', () => {
  const header = readFileSync(join(fixtures, 'coils-example.csv'), 'utf8').split('\n')[0]!;
  const good = 'Good coil,,3,8,7500,80,,no,12,,';

  it('one bad row: the whole file is refused, the row and column named, nothing added', () => {
    const db = freshStore('csv-bad');
    const before = partCount(db);
    const text = [header, good, good.replace('Good coil', 'Second good'), 'Bad coil,,-1,8,7500,80,,no,12,,', ''].join('\n');
    const fields = refusal(() => partsCsvImport(db, 'coil', text));
    // Row 4: the header is row 1, as a spreadsheet counts.
    expect(fields).toEqual({ 'row 4, primary resistance': 'must be more than zero.' });
    expect(partCount(db)).toBe(before);
  });

  it('names each problem: not a number, a decimal comma, yes/no, an unknown or missing column', () => {
    const db = freshStore('csv-bad-many');
    const fields = refusal(() =>
      partsCsvImport(db, 'coil', [header, 'A,,x,8,7500,80,,no,12,,', 'B,,"3,5",8,7500,80,,maybe,12,,'].join('\n')),
    );
    expect(fields['row 2, primary resistance']).toMatch(/"x" is not a number/);
    expect(fields['row 3, primary resistance']).toMatch(/decimal comma/);
    expect(fields['row 3, for use with a ballast']).toMatch(/yes or no/);
    const columns = refusal(() => partsCsvImport(db, 'coil', `${header.replace('turns ratio (secondary to primary)', 'colour')}\n${good}`));
    expect(columns['row 1, column 6']).toMatch(/"colour" is not a column/);
    expect(columns['row 1']).toMatch(/"turns ratio \(secondary to primary\)" is missing/);
    expect(partCount(db)).toBe(0);
  });
});
