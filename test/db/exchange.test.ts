/**
 * The workshop file: a round trip export -> import into a fresh folder gives the same records
 * (a fast-check property over generated workshops), import into a workshop that already holds
 * records matches by kind and name / engine name / plan name within its engine, the preview says
 * what the write will do, and a bad file is refused whole with every problem by row and field.
 * Real SQLite files throughout.
 */
import Database from 'better-sqlite3';
import fc from 'fast-check';
import { afterEach, describe, expect, it } from 'vitest';
import { StoreError } from '../../db/errors.js';
import { exportWorkshop, workshopImport, workshopImportPreview, type ExportedWorkshop } from '../../db/exchange/index.js';
import { storeFileIn } from '../../db/location.js';
import { closeStore, openStore } from '../../db/open.js';
import { createRepositories } from '../../db/repositories/index.js';
import type { PartInput } from '../../db/schema.js';
import { ballastIn, cdModuleIn, coilIn, engineIn, leadsIn, moduleIn, planIn, plugIn, tachIn, tempDir } from './samples.js';

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

/** Rows per table by the test's own SQL. */
function counts(db: Database.Database): Record<string, number> {
  const out: Record<string, number> = {};
  for (const t of ['engines', 'advance_points', 'parts', 'plans', 'readings', 'sheet_ticks']) out[t] = (db.prepare(`SELECT COUNT(*) AS n FROM ${t}`).get() as { n: number }).n;
  return out;
}

/**
 * An export with every id replaced by what identifies the record to a person (a part by kind and
 * name), lists sorted, and the export time dropped: two workshops with the same records give the
 * same value, whatever ids their files handed out.
 */
function comparable(w: ExportedWorkshop): unknown {
  const partName = new Map<number, string>();
  for (const p of w.parts) partName.set(p['id'] as number, `${String(p['kind'])}:${String(p['name'])}`);
  const ref = (id: unknown): unknown => (typeof id === 'number' ? partName.get(id) : id);
  const byName = (a: Record<string, unknown>, b: Record<string, unknown>): number => String(a['name']).localeCompare(String(b['name']));
  const parts = w.parts.map(({ id: _id, ...p }) => p).sort((a, b) => `${String(a['kind'])}:${String(a['name'])}`.localeCompare(`${String(b['kind'])}:${String(b['name'])}`));
  const engines = w.engines
    .map(({ id: _id, ...e }) => {
      const existing = { ...(e['existing'] as Record<string, unknown>) };
      for (const k of ['coilPartId', 'ballastPartId', 'tachPartId', 'leadsPartId', 'plugPartId']) existing[k] = ref(existing[k]);
      const plans = (e['plans'] as Array<Record<string, unknown>>)
        .map(({ id: _pid, ...p }) => {
          const out: Record<string, unknown> = { ...p };
          for (const k of ['moduleId', 'coilId', 'ballastId', 'tachId', 'leadsId', 'plugId']) out[k] = ref(p[k]);
          return out;
        })
        .sort(byName);
      return { ...e, existing, plans };
    })
    .sort(byName);
  return { parts, engines };
}

const kinds: PartInput[] = [coilIn, ballastIn, moduleIn, cdModuleIn, tachIn, leadsIn, plugIn];
const stepKeys = ['measure.coil-primary', 'wire.coil-feed', 'check.timing', 'fit.module'];
const quantities = [
  ['coil-primary-resistance', 'ohm'],
  ['battery-voltage-resting', 'V'],
  ['plug-gap', 'mm'],
  ['other', 'clicks'],
] as const;

/** A generated workshop: parts of every kind, engines with plans, readings and ticks. */
const workshopArb = fc.record({
  parts: fc.uniqueArray(fc.record({ sample: fc.nat(kinds.length - 1), suffix: fc.integer({ min: 1, max: 40 }), notes: fc.stringMatching(/^[A-Za-z0-9 .,-]{0,20}$/) }), {
    maxLength: 8,
    selector: (p) => `${p.sample}:${p.suffix}`,
  }),
  engines: fc.uniqueArray(
    fc.record({
      name: fc.stringMatching(/^[A-Za-z][A-Za-z0-9 ]{0,14}[A-Za-z0-9]$/),
      idleRpm: fc.integer({ min: 600, max: 1100 }),
      useCoil: fc.boolean(),
      plans: fc.uniqueArray(
        fc.record({
          name: fc.stringMatching(/^[A-Za-z][A-Za-z0-9 -]{0,10}[a-z0-9]$/),
          status: fc.constantFrom('draft', 'checked', 'wired', 'done'),
          useCoil: fc.boolean(),
          readings: fc.array(fc.record({ q: fc.nat(quantities.length - 1), value: fc.double({ min: 0.01, max: 4.99, noNaN: true }) }), { maxLength: 3 }),
          ticks: fc.uniqueArray(fc.constantFrom(...stepKeys), { maxLength: 3 }),
        }),
        { maxLength: 3, selector: (p) => p.name.trim() },
      ),
    }),
    { maxLength: 3, selector: (e) => e.name.trim() },
  ),
});

type WorkshopShape = typeof workshopArb extends fc.Arbitrary<infer T> ? T : never;

function build(db: Database.Database, w: WorkshopShape): void {
  const repos = createRepositories(db);
  const coils: number[] = [];
  for (const p of w.parts) {
    const sample = kinds[p.sample]!;
    const made = repos.parts.create({ ...sample, name: `${sample.name} ${p.suffix}`, notes: p.notes });
    if (made.kind === 'coil') coils.push(made.id);
  }
  for (const e of w.engines) {
    const coilId = e.useCoil && coils.length > 0 ? coils[0]! : null;
    const engine = repos.engines.create({ ...engineIn({ coilId }), name: e.name, idleRpm: e.idleRpm });
    for (const p of e.plans) {
      const plan = repos.plans.create({ ...planIn(engine.id, { coilId: p.useCoil && coils.length > 0 ? coils[coils.length - 1]! : null }), name: p.name, status: p.status });
      for (const r of p.readings) {
        const [quantity, unit] = quantities[r.q]!;
        repos.readings.add({ planId: plan.id, quantity, value: r.value, unit, takenOn: '2025-06-01', note: '' });
      }
      for (const k of p.ticks) repos.ticks.set(plan.id, k, true);
    }
  }
}

describe('workshop file round trip', () => {
  it('export -> import into a fresh folder -> export gives the same records (property)', () => {
    let tried = 0;
    fc.assert(
      fc.property(workshopArb, (w) => {
        tried++;
        const source = freshStore('exchange-src');
        const target = freshStore('exchange-dst');
        build(source, w);
        const first = exportWorkshop(source).workshop;
        // Through JSON text, as a file would go.
        workshopImport(target, JSON.parse(JSON.stringify(first)));
        const second = exportWorkshop(target).workshop;
        expect(comparable(second)).toEqual(comparable(first));
        const a = counts(source);
        const b = counts(target);
        expect(b).toEqual(a);
        while (open.length) open.pop()!();
      }),
      { numRuns: 40 },
    );
    expect(tried).toBe(40);
  });

  it('a reading note that migration 002 lengthened (over 500 characters) goes out and comes back whole', () => {
    const source = freshStore('exchange-long-src');
    const target = freshStore('exchange-long-dst');
    const repos = createRepositories(source);
    const engine = repos.engines.create(engineIn());
    const plan = repos.plans.create(planIn(engine.id));
    // A 500-character note (the most a form took before) with the migration's sentence in front.
    const note = `(Recorded as coil-primary-resistance in "furlong", which could not be converted to ohm.) ${'n'.repeat(500)}`;
    expect(note.length).toBeGreaterThan(500);
    source
      .prepare("INSERT INTO readings (plan_id, quantity, value, unit, taken_on, note, created_at, updated_at) VALUES (?, 'other', 3, 'furlong', '2024-05-01', ?, '2024-05-01T00:00:00.000Z', '2024-05-01T00:00:00.000Z')")
      .run(plan.id, note);
    const file = JSON.parse(JSON.stringify(exportWorkshop(source).workshop)) as ExportedWorkshop;
    workshopImport(target, file);
    expect((target.prepare('SELECT note FROM readings').all() as Array<{ note: string }>).map((r) => r.note)).toEqual([note]);
  });
});

describe('importing into a workshop that already holds records', () => {
  it('skips what is the same, renames what differs under a taken name, and the preview says so before anything is written', () => {
    const source = freshStore('exchange-merge-src');
    const target = freshStore('exchange-merge-dst');
    const src = createRepositories(source);
    const coil = src.parts.create(coilIn);
    src.parts.create(plugIn);
    const e = src.engines.create({ ...engineIn({ coilId: coil.id }), name: 'Shared engine' });
    src.plans.create({ ...planIn(e.id, { coilId: coil.id }), name: 'Plan A' });
    const file = exportWorkshop(source).workshop;

    const dst = createRepositories(target);
    dst.parts.create(coilIn); // same kind, name and fields: skipped
    dst.parts.create({ ...(plugIn as Extract<PartInput, { kind: 'plug' }>), gapMaxMm: 1.0 }); // same name, other gap: the import's is renamed
    const before = counts(target);

    const preview = workshopImportPreview(target, file);
    expect(counts(target)).toEqual(before); // the preview writes nothing
    expect(preview.items).toEqual([
      { record: 'part', kind: 'coil', name: coilIn.name, outcome: 'skipped' },
      { record: 'part', kind: 'plug', name: plugIn.name, outcome: 'renamed', newName: `${plugIn.name} (imported)` },
      { record: 'engine', name: 'Shared engine', outcome: 'added' },
      { record: 'plan', engine: 'Shared engine', name: 'Plan A', outcome: 'added' },
    ]);

    const done = workshopImport(target, file);
    expect(done).toEqual(preview);
    expect(counts(target)).toEqual({ ...before, parts: before['parts']! + 1, engines: 1, plans: 1, advance_points: 4 });
    // The engine's coil is the one already on the shelf (matched), not a copy.
    const engineRow = target.prepare("SELECT json_extract(existing, '$.coilPartId') AS coil FROM engines WHERE name = 'Shared engine'").get() as { coil: number };
    const coilRow = target.prepare("SELECT id FROM parts WHERE kind = 'coil'").all() as Array<{ id: number }>;
    expect(coilRow).toHaveLength(1);
    expect(engineRow.coil).toBe(coilRow[0]!.id);

    // A second import of the same file adds nothing: everything now matches.
    const again = workshopImport(target, file);
    expect(again.added).toEqual({ parts: 0, engines: 0, plans: 0, readings: 0, ticks: 0 });
    expect(again.items.every((i) => i.outcome === 'skipped')).toBe(true);
  });
});

describe('a bad workshop file', () => {
  function refusal(db: Database.Database, raw: unknown): Record<string, string> {
    try {
      workshopImport(db, raw);
    } catch (err) {
      expect(err).toBeInstanceOf(StoreError);
      return (err as StoreError).fields ?? {};
    }
    throw new Error('the file was accepted');
  }

  it('is refused whole with every problem by row and field, and nothing is written', () => {
    const source = freshStore('exchange-bad-src');
    const src = createRepositories(source);
    const coil = src.parts.create(coilIn);
    const e = src.engines.create({ ...engineIn({ coilId: coil.id }), name: 'Good engine' });
    src.plans.create({ ...planIn(e.id), name: 'Good plan' });
    const file = JSON.parse(JSON.stringify(exportWorkshop(source).workshop)) as ExportedWorkshop;
    const target = freshStore('exchange-bad-dst');
    const before = counts(target);

    const bad = structuredClone(file) as any;
    bad.parts[0].primaryResistanceOhm20C = -1;
    bad.parts[0].colour = 'red';
    bad.engines[0].plans[0].plugGapMm = 'wide';
    bad.engines[0].plans[0].readings = [{ quantity: 'plug-gap', value: 0.8, unit: 'mm', takenOn: '2024-99-99', note: '' }];
    bad.engines.push({ ...bad.engines[0], name: '', plans: [] });
    const fields = refusal(target, bad);
    expect(fields).toMatchObject({
      'parts.0.primaryResistanceOhm20C': expect.stringMatching(/more than zero/),
      'parts.0.colour': expect.stringMatching(/not a field here/),
      'engines.0.plans.0.plugGapMm': expect.any(String),
      'engines.0.plans.0.readings.0.takenOn': expect.stringMatching(/not a day on the calendar/),
      'engines.1.name': expect.any(String),
    });
    // Unknown keys alone, at any depth.
    const onlyUnknown = structuredClone(file) as any;
    onlyUnknown.parts[0].colour = 'red';
    onlyUnknown.engines[0].existing.sparkColour = 'blue';
    expect(Object.keys(refusal(target, onlyUnknown)).sort()).toEqual(['engines.0.existing.sparkColour', 'parts.0.colour']);
    expect(counts(target)).toEqual(before);
  });

  it('refuses another format, a newer version, a dangling part reference and a wrong kind', () => {
    const target = freshStore('exchange-bad-head');
    expect(Object.keys(refusal(target, { format: 'something-else', version: 1, parts: [], engines: [] }))).toEqual(['format']);
    expect(Object.keys(refusal(target, { format: 'ignition-planner-workshop', version: 2, parts: [], engines: [] }))).toEqual(['version']);
    const plan = { ...planIn(1, { coilId: 9, moduleId: 1 }), name: 'P' } as Record<string, unknown>;
    delete plan['engineId'];
    const fields = refusal(target, {
      format: 'ignition-planner-workshop',
      version: 1,
      parts: [{ id: 1, ...plugIn }],
      engines: [{ ...engineIn(), plans: [plan] }],
    });
    expect(fields['engines.0.plans.0.coilId']).toMatch(/No part in the file has the id 9/);
    expect(fields['engines.0.plans.0.moduleId']).toMatch(/is a plug, not a module/);
    expect(counts(target)['engines']).toBe(0);
  });
});
