/**
 * The wiring sheet over the bridge, on a real store: `openBackend` on a fresh temp folder (which
 * loads the demo workshop), the real dispatcher, handlers, adapter, checker and sheet builder. Row
 * counts are read through a second, read-only connection to the same file.
 *
 * Physics used for expected values, worked out here by hand:
 * - copper law: R(T) = R20 (1 + 0.00393 (T - 20)) (IACS annealed copper, 0.00393 /K), so a coil read
 *   at the engine's ambient gives R20 = R(T) / (1 + 0.00393 (T - 20));
 * - SI prefixes (BIPM SI Brochure, 9th ed., table 7): milli 1e-3, kilo 1e3.
 */
import { describe, expect, it } from 'vitest';
import { closeStore, openStore } from '../../db/open.js';
import { createRepositories } from '../../db/repositories/index.js';
import { readingUnits, type Engine, type Plan, type Reading } from '../../db/schema.js';
import type { ComparisonAnswer, SheetAnswer } from '../../electron/ipc/channels.js';
import { createDispatcher } from '../../electron/ipc/dispatch.js';
import { handlersFor, PRINT_UNSUPPORTED } from '../../electron/ipc/handlers.js';
import { ignitionCautions } from '../../electron/safety/cautions.js';
import { backendPerTest } from './backend-per-test.js';

const store = backendPerTest('sheet');
const { counts, call, ok } = store;

const planNamed = async (fragment: string): Promise<Plan> => {
  const plans = await ok<Plan[]>('plans.list', {});
  const p = plans.find((x) => x.name.includes(fragment));
  if (!p) throw new Error(`no demo plan like ${fragment}`);
  return p;
};
const steps = (a: SheetAnswer) => a.sheet.stages.flatMap((s) => s.steps);
const reading = (planId: number, quantity: string, value: number, unit: string, takenOn = '2024-05-01') => ({ planId, quantity, value, unit, takenOn, note: '' });

describe('sheet.get', () => {
  it('answers every demo plan with the cautions first, then stages of steps whose readings use the store units', async () => {
    const plans = await ok<Plan[]>('plans.list', {});
    expect(plans.length).toBeGreaterThan(0);
    for (const p of plans) {
      const a = await ok<SheetAnswer>('sheet.get', { planId: p.id });
      // Safety rule: every checklist shows the cautions before the first step (electron/safety/cautions.ts).
      expect(Object.keys(a.sheet).indexOf('cautions')).toBeLessThan(Object.keys(a.sheet).indexOf('stages'));
      expect(a.sheet.cautions.map((c) => c.id)).toEqual(ignitionCautions.map((c) => c.id));
      const all = steps(a);
      expect(all.length, p.name).toBeGreaterThan(5);
      expect(new Set(all.map((s) => s.key)).size).toBe(all.length);
      const quantities = all.flatMap((s) => (s.reading ? [s.reading.quantity] : []));
      expect(new Set(quantities).size, 'each quantity on at most one step (contract)').toBe(quantities.length);
      for (const s of all) if (s.reading) expect(s.reading.unit, s.key).toBe(readingUnits[s.reading.quantity]);
      expect(a.status).toBe(p.status);
      expect(a.planUpdatedAt).toBe(p.updatedAt);
      expect(a.readings).toEqual(await ok('readings.list', { planId: p.id }));
      // Every reading a step asks for is judged against that step: 'in' exactly when min <= value <= max.
      for (const j of a.judged) {
        const step = all.find((s) => s.key === j.stepKey)!;
        const band = j.value < step.reading!.min ? 'low' : j.value > step.reading!.max ? 'high' : 'in';
        expect(j.band, j.stepKey).toBe(band);
      }
      expect(a.progress.fittingSteps).toBe(all.filter((s) => s.fitting).length);
      expect(a.progress.checkSteps).toBe(all.filter((s) => s.reading).length);
    }
  });

  it('answers NOT_FOUND for a plan that does not exist, and refuses unknown keys', async () => {
    expect(await call('sheet.get', { planId: 999999 })).toMatchObject({ ok: false, error: { code: 'NOT_FOUND' } });
    const p = await planNamed('Fixed-duty');
    expect(await call('sheet.get', { planId: p.id, format: 'pdf' })).toMatchObject({ ok: false, error: { code: 'INVALID_INPUT' } });
  });
});

describe('sheet.tick', () => {
  it('ticks a step, and the tick survives closing and reopening the store', async () => {
    const p = await planNamed('Fixed-duty');
    const first = steps(await ok<SheetAnswer>('sheet.get', { planId: p.id }))[0]!;
    const a = await ok<SheetAnswer>('sheet.tick', { planId: p.id, stepKey: first.key, ticked: true });
    expect(a.ticked).toEqual([first.key]);
    expect(counts().sheet_ticks).toBe(1);
    store.reopen('desktop');
    expect((await ok<SheetAnswer>('sheet.get', { planId: p.id })).ticked).toEqual([first.key]);
    expect((await ok<SheetAnswer>('sheet.tick', { planId: p.id, stepKey: first.key, ticked: false })).ticked).toEqual([]);
  });

  it('refuses a key that is not a step of the sheet, a control character and unknown keys, writing nothing', async () => {
    const p = await planNamed('Fixed-duty');
    const before = counts();
    const r = await call('sheet.tick', { planId: p.id, stepKey: 'fit.no-such-step', ticked: true });
    expect(r).toMatchObject({ ok: false, error: { code: 'INVALID_INPUT', fields: { stepKey: expect.stringMatching(/no step/) } } });
    expect(await call('sheet.tick', { planId: p.id, stepKey: 'fit\u0007', ticked: true })).toMatchObject({ ok: false, error: { fields: { stepKey: expect.any(String) } } });
    expect(await call('sheet.tick', { planId: p.id, stepKey: 'x', ticked: true, by: 'me' })).toMatchObject({ ok: false, error: { code: 'INVALID_INPUT' } });
    expect(counts()).toEqual(before);
  });
});

describe('readings and the next check', () => {
  it('a measured coil primary resistance, typed in mohm, is stored in ohm and used (marked measured) by the next check, also after reopening', async () => {
    const p = await planNamed('Fixed-duty');
    const engine = await ok<Engine>('engines.get', { id: p.engineId });
    const saved = await ok<Reading>('readings.add', { reading: reading(p.id, 'coil-primary-resistance', 2900, 'mohm') });
    expect(saved).toMatchObject({ quantity: 'coil-primary-resistance', unit: 'ohm' });
    expect(saved.value).toBeCloseTo(2900 * 1e-3, 12);
    const t = engine.conditions.ambientC ?? 20;
    const r20 = (2900 * 1e-3) / (1 + 0.00393 * (t - 20));
    for (const pass of ['before reopening', 'after reopening']) {
      const c = await ok<ComparisonAnswer>('check.plans', { engineId: p.engineId, planIds: [p.id] });
      const coil = c.candidates[0]!.measured.find((f) => /coil primary/.test(f.name));
      expect(coil, pass).toMatchObject({ measured: true, unit: 'ohm' });
      expect(coil!.value, pass).toBeCloseTo(r20, 4);
      expect(c.existing.measured.some((f) => /coil primary/.test(f.name)), 'the existing setup stays on catalogue values').toBe(false);
      store.reopen('desktop');
    }
  });

  it('a measured ballast and a measured HT lead win over the catalogue and are marked measured; kohm becomes the checker ohm', async () => {
    const p = await planNamed('Capacitive discharge');
    const before = await ok<ComparisonAnswer>('check.plans', { engineId: p.engineId, planIds: [p.id] });
    expect(before.candidates[0]!.measured.some((f) => /ballast|lead/i.test(f.name))).toBe(false);
    await ok('readings.add', { reading: reading(p.id, 'ballast-resistance', 1650, 'mohm') });
    await ok('readings.add', { reading: reading(p.id, 'ht-lead-resistance', 9.5, 'kohm') });
    store.reopen('desktop');
    const after = await ok<ComparisonAnswer>('check.plans', { engineId: p.engineId, planIds: [p.id] });
    const m = after.candidates[0]!.measured;
    const ballast = m.find((f) => /ballast resistance/.test(f.name));
    expect(ballast).toMatchObject({ measured: true, unit: 'ohm' });
    expect(ballast!.value).toBeCloseTo(1650 * 1e-3, 6);
    const lead = m.find((f) => /lead resistance/i.test(f.name));
    expect(lead).toMatchObject({ measured: true, unit: 'ohm' });
    expect(lead!.value).toBeCloseTo(9.5 * 1e3, 6);
  });

  it('converts or refuses a reading in another unit, on add and on update', async () => {
    const p = await planNamed('Fixed-duty');
    const before = counts();
    const refused = await call('readings.add', { reading: reading(p.id, 'coil-primary-resistance', 3, 'furlong') });
    expect(refused).toMatchObject({ ok: false, error: { code: 'INVALID_INPUT', fields: { 'reading.unit': expect.stringMatching(/ohm, mohm/) } } });
    const badDate = await call('readings.add', { reading: { ...reading(p.id, 'plug-gap', 0.7, 'mm'), takenOn: '2024-99-99' } });
    expect(badDate).toMatchObject({ ok: false, error: { fields: { 'reading.takenOn': expect.any(String) } } });
    expect(counts()).toEqual(before);
    const gap = await ok<Reading>('readings.add', { reading: reading(p.id, 'plug-gap', 28, 'thou') });
    expect(gap.unit).toBe('mm');
    expect(gap.value).toBeCloseTo(28 * 0.0254, 12); // thou = 0.001 in, in = 25.4 mm
    const fixed = await ok<Reading>('readings.update', { id: gap.id, expectedUpdatedAt: gap.updatedAt, reading: reading(p.id, 'plug-gap', 0.03, 'in') });
    expect(fixed).toMatchObject({ id: gap.id, unit: 'mm' });
    expect(fixed.value).toBeCloseTo(0.03 * 25.4, 12);
    const wrong = await call('readings.update', { id: gap.id, expectedUpdatedAt: fixed.updatedAt, reading: reading(p.id, 'plug-gap', 1, 'MM') });
    expect(wrong).toMatchObject({ ok: false, error: { fields: { 'reading.unit': expect.any(String) } } });
    expect(await call('readings.update', { id: gap.id, expectedUpdatedAt: fixed.updatedAt, reading: reading(p.id, 'plug-gap', 1, 'mm'), also: 1 })).toMatchObject({ ok: false, error: { code: 'INVALID_INPUT' } });
    expect(await ok('readings.list', { planId: p.id })).toEqual([fixed]);
  });
});

describe('plan status', () => {
  it('moves draft -> checked on weighing, -> wired when every fitting step is ticked, -> done when every check reading is in band; never back by itself', async () => {
    const p = await planNamed('Fixed-duty');
    expect(p.status).toBe('draft');
    await ok('check.plans', { engineId: p.engineId, planIds: [p.id] });
    expect((await ok<Plan>('plans.get', { id: p.id })).status).toBe('checked');

    let a = await ok<SheetAnswer>('sheet.get', { planId: p.id });
    const fitting = steps(a).filter((s) => s.fitting);
    const checks = steps(a).filter((s) => s.reading);
    expect(fitting.length).toBeGreaterThan(0);
    expect(checks.length).toBeGreaterThan(0);
    for (const [i, s] of fitting.entries()) {
      a = await ok<SheetAnswer>('sheet.tick', { planId: p.id, stepKey: s.key, ticked: true });
      expect(a.status, `after ${i + 1} of ${fitting.length} ticks`).toBe(i + 1 < fitting.length ? 'checked' : 'wired');
    }
    expect(a.progress).toMatchObject({ fittingSteps: fitting.length, fittingTicked: fitting.length, reached: 'wired' });

    // One reading in band per check step: the expected value itself (min <= expected <= max).
    for (const [i, s] of checks.entries()) {
      const r = s.reading!;
      expect(r.min).toBeLessThanOrEqual(r.expected);
      expect(r.expected).toBeLessThanOrEqual(r.max);
      await ok('readings.add', { reading: reading(p.id, r.quantity, r.expected, r.unit, '2024-06-01') });
      const status = (await ok<Plan>('plans.get', { id: p.id })).status;
      expect(status, `after ${i + 1} of ${checks.length} readings`).toBe(i + 1 < checks.length ? 'wired' : 'done');
    }
    a = await ok<SheetAnswer>('sheet.get', { planId: p.id });
    expect(a.progress).toMatchObject({ checkSteps: checks.length, checksInBand: checks.length, reached: 'done' });
    expect(a.judged.every((j) => j.band === 'in')).toBe(true);

    // Never backwards by itself: unticking a step leaves 'done'.
    a = await ok<SheetAnswer>('sheet.tick', { planId: p.id, stepKey: fitting[0]!.key, ticked: false });
    expect(a.status).toBe('done');
    expect(a.progress.reached).toBe('none');

    // By hand, any direction; a later tick that completes the work moves it forward again.
    expect((await ok<Plan>('plans.setStatus', { id: p.id, status: 'draft' })).status).toBe('draft');
    expect((await ok<SheetAnswer>('sheet.get', { planId: p.id })).status).toBe('draft');
    a = await ok<SheetAnswer>('sheet.tick', { planId: p.id, stepKey: fitting[0]!.key, ticked: true });
    expect(a.status).toBe('done');
    store.reopen('desktop');
    expect((await ok<Plan>('plans.get', { id: p.id })).status).toBe('done');
  });

  it('an edit that leaves the status out keeps the status the work reached; one that names it sets it', async () => {
    const p = await planNamed('Fixed-duty');
    await ok('check.plans', { engineId: p.engineId, planIds: [p.id] });
    // An editor opened before the weighing still holds 'draft': it sends the fields without a status.
    const { id: _id, updatedAt: _at, status: _status, ...fields } = p;
    const edited = await ok<Plan>('plans.update', { id: p.id, expectedUpdatedAt: p.updatedAt, plan: { ...fields, notes: 'Edited after weighing.' } });
    expect(edited.status).toBe('checked');
    expect(edited.notes).toBe('Edited after weighing.');
    expect((await ok<Plan>('plans.update', { id: p.id, expectedUpdatedAt: edited.updatedAt, plan: { ...fields, status: 'draft' } })).status).toBe('draft');
  });

  it('a reading out of band keeps the plan at wired (the latest reading per quantity counts)', async () => {
    const p = await planNamed('Fixed-duty');
    let a = await ok<SheetAnswer>('sheet.get', { planId: p.id });
    for (const s of steps(a).filter((x) => x.fitting)) a = await ok<SheetAnswer>('sheet.tick', { planId: p.id, stepKey: s.key, ticked: true });
    expect(a.status).toBe('wired');
    const checks = steps(a).filter((s) => s.reading);
    const [first, ...rest] = checks;
    for (const s of rest) await ok('readings.add', { reading: reading(p.id, s.reading!.quantity, s.reading!.expected, s.reading!.unit) });
    // Twice the top of the band is out of it (high) for any positive band.
    const high = await ok<Reading>('readings.add', { reading: reading(p.id, first!.reading!.quantity, Math.abs(first!.reading!.max) * 2 + 1, first!.reading!.unit, '2024-05-02') });
    a = await ok<SheetAnswer>('sheet.get', { planId: p.id });
    expect(a.status).toBe('wired');
    expect(a.judged.find((j) => j.readingId === high.id)).toMatchObject({ stepKey: first!.key, band: 'high' });
    // Corrected: the same reading, now in band, finishes the work.
    await ok('readings.update', { id: high.id, expectedUpdatedAt: high.updatedAt, reading: reading(p.id, first!.reading!.quantity, first!.reading!.expected, first!.reading!.unit, '2024-05-02') });
    expect((await ok<Plan>('plans.get', { id: p.id })).status).toBe('done');
  });

  it('plans.setStatus refuses a status that does not exist and unknown keys', async () => {
    const p = await planNamed('Fixed-duty');
    expect(await call('plans.setStatus', { id: p.id, status: 'finished' })).toMatchObject({ ok: false, error: { code: 'INVALID_INPUT', fields: { status: expect.any(String) } } });
    expect(await call('plans.setStatus', { id: p.id, status: 'done', note: 'x' })).toMatchObject({ ok: false, error: { code: 'INVALID_INPUT' } });
    expect(await call('plans.setStatus', { id: 999999, status: 'done' })).toMatchObject({ ok: false, error: { code: 'NOT_FOUND' } });
    expect((await ok<Plan>('plans.get', { id: p.id })).status).toBe('draft');
  });
});

describe('app.print', () => {
  it('answers UNSUPPORTED with the sentence in the browser host', async () => {
    expect(await call('app.print', { pageSize: 'A4' })).toEqual({ ok: false, error: { code: 'UNSUPPORTED', message: PRINT_UNSUPPORTED } });
    expect(PRINT_UNSUPPORTED).toMatch(/^Printing from here uses the browser's own print: /);
  });

  it("passes the page size to the host's print hook and answers what it did", async () => {
    const asked: string[] = [];
    const real = openStore(':memory:');
    const dispatch = createDispatcher(
      handlersFor(createRepositories(real), {
        version: 't',
        dataDir: store.dir,
        host: 'desktop',
        print: async (pageSize) => {
          asked.push(pageSize);
          return pageSize === 'A4' ? { saved: true, path: `${store.dir}/sheet.pdf` } : { saved: false, path: null };
        },
      }),
    );
    expect(await dispatch('app.print', { pageSize: 'A4' })).toEqual({ ok: true, value: { saved: true, path: `${store.dir}/sheet.pdf` } });
    expect(await dispatch('app.print', { pageSize: 'Letter' })).toEqual({ ok: true, value: { saved: false, path: null } });
    expect((await dispatch('app.print', { pageSize: 'A3' })).ok).toBe(false);
    expect(asked).toEqual(['A4', 'Letter']);
    closeStore(real);
  });
});
