/**
 * The spark-energy rule at its limits (1 mJ fail and 3 mJ caution delivered, 0.5 ms duration,
 * 75 % of the existing setup's energy and 50 % of its duration), the tachometer table, and the
 * merged "what to do" list. Written against the mutation-testing survivors (npm run mutate).
 *
 * The energy limits are reached exactly with the CD delivered-energy law of the checker's model
 * (cd.ts): E = eta x V_a x 2 C (V - V_a), V_a = V_arc / n. With V_arc = 1000 V and n = 100,
 * V_a = 10 V; with eta = 0.5, C = 1 uF and V = 110 V: E = 0.5 x 10 x 2 x 1e-6 x 100 = 1 mJ, and with
 * C = 3 uF the same charge gives 3 mJ (both exact in floating point, worked out beside the check).
 */
import { describe, expect, it } from 'vitest';
import { analyse, createSession } from '../../electron/checker/session.js';
import type { Baseline, RuleContext } from '../../electron/checker/rules/context.js';
import { DELIVERED_ENERGY_CAUTION_J, DELIVERED_ENERGY_FAIL_J, SPARK_DURATION_CAUTION_S, BASELINE_DURATION_CAUTION_RATIO, BASELINE_ENERGY_CAUTION_RATIO, lowestDeliveredEnergy, sparkEnergy, sparkEnergyFails } from '../../electron/checker/rules/spark.js';
import { tachFails, tachRule } from '../../electron/checker/rules/tach.js';
import { contradicts, CONTRADICTIONS, whatToDo } from '../../electron/checker/advice.js';
import type { EngineSpec, Intent, RuleResult, SetupSpec, TachSenses } from '../../electron/checker/index.js';
import { cdModule, coil, fourCylinder, ironBallast, module, moduleSetup, pointsSetup, ballastCoil, uniformBaseline } from './fixtures.js';

function ctxOf(setup: SetupSpec, engine: EngineSpec = fourCylinder): RuleContext {
  return analyse(createSession(engine, undefined, { rpmPoints: 24 }), setup, null, true).ctx;
}

/** A CD context whose delivered energy is eta V_a 2 C (V - V_a) with eta 0.5, V_a 10 V, C given, charge V at every point. */
function cdAt(capacitorF: number, chargeV: number, over: { at?: Record<number, number>; durationS?: number; durationAt?: Record<number, number>; worstRatio?: number; baseline?: Baseline | null } = {}): RuleContext {
  const c = ctxOf(moduleSetup(cdModule()));
  const n = c.ws.n;
  const charge = new Float64Array(n).fill(chargeV);
  for (const [i, v] of Object.entries(over.at ?? {})) charge[Number(i)] = v;
  const duration = new Float64Array(n).fill(over.durationS ?? 1e-3);
  for (const [i, v] of Object.entries(over.durationAt ?? {})) duration[Number(i)] = v;
  return {
    ...c,
    p: { ...c.p, n: 100, arcV: 1000, eta: 0.5, cd: { ...c.p.cd!, capacitorF } },
    ws: { ...c.ws, cdChargeV: charge, durationS: duration, availableV: new Float64Array(n).fill(20_000), noSpark: new Uint8Array(n), energyJ: new Float64Array(n).fill(0.01) },
    worstRatio: over.worstRatio ?? 2,
    baseline: over.baseline ?? null,
  };
}

const figure = (r: RuleResult, name: string): number => {
  const f = r.figures.find((x) => x.name === name);
  if (!f) throw new Error(`no figure '${name}': ${r.figures.map((x) => x.name).join(', ')}`);
  return f.value;
};

describe('delivered spark energy: fail below 1 mJ, caution below 3 mJ (from memory)', () => {
  it('the limits are the remembered figures', () => {
    expect(DELIVERED_ENERGY_FAIL_J).toBe(1e-3);
    expect(DELIVERED_ENERGY_CAUTION_J).toBe(3e-3);
    expect(SPARK_DURATION_CAUTION_S).toBe(0.5e-3);
  });
  it('does not fail at exactly 1 mJ and fails just below', () => {
    expect(0.5 * 10 * 2 * 1e-6 * (110 - 10)).toBe(1e-3);
    const at = cdAt(1e-6, 110);
    expect(lowestDeliveredEnergy(at).value).toBe(1e-3);
    expect(sparkEnergyFails(at)).toBe(false);
    expect(sparkEnergy(at).verdict).toBe('caution');
    const below = cdAt(1e-6, 110 * (1 - 1e-9));
    expect(sparkEnergyFails(below)).toBe(true);
    expect(sparkEnergy(below).verdict).toBe('fail');
    expect(sparkEnergy(below).why).toContain('below the 1.0 mJ that even a good mixture');
  });
  it('passes exactly 3 mJ everywhere and cautions just below', () => {
    expect(0.5 * 10 * 2 * 3e-6 * (110 - 10)).toBe(3e-3);
    const at = cdAt(3e-6, 110);
    expect(sparkEnergy(at).verdict).toBe('pass');
    expect(sparkEnergy(at).action).toBe('Nothing to do.');
    expect(figure(sparkEnergy(at), 'lowest delivered spark energy, idle to redline')).toBeCloseTo(3, 12);
    expect(figure(sparkEnergy(at), 'delivered spark energy at cranking')).toBeCloseTo(3, 12);
    const below = cdAt(3e-6, 110 * (1 - 1e-9));
    expect(sparkEnergy(below).verdict).toBe('caution');
    expect(sparkEnergy(below).why).toContain('It delivers as little as');
  });
  it('finds the lowest point from idle to redline only, and tells a weak cranking spark apart', () => {
    const base = cdAt(3e-6, 200);
    const lowAt = (i: number) => cdAt(3e-6, 200, { at: { [i]: 60 } });
    // 0.5 x 10 x 2 x 3e-6 x (60 - 10) = 1.5 mJ at the point changed.
    expect(lowestDeliveredEnergy(lowAt(base.idleIndex)).value).toBeCloseTo(1.5e-3, 15);
    expect(lowestDeliveredEnergy(lowAt(base.idleIndex)).index).toBe(base.idleIndex);
    expect(lowestDeliveredEnergy(lowAt(base.redlineIndex)).value).toBeCloseTo(1.5e-3, 15);
    if (base.redlineIndex + 1 < base.ws.n) expect(lowestDeliveredEnergy(lowAt(base.redlineIndex + 1)).value).toBeCloseTo(0.5 * 10 * 2 * 3e-6 * 190, 15);
    // The cranking point (index 0) is below idle: it is the cranking figure, not the running one.
    const crank = sparkEnergy(lowAt(0));
    expect(crank.verdict).toBe('caution');
    expect(crank.why).toContain('While cranking it delivers only 1.50 mJ to the spark.');
    expect(crank.action).toBe('Expect hard starting; check the battery and the cranking supply.');
  });
  it('counts a point without a spark as no energy, and says so', () => {
    const c = cdAt(3e-6, 200);
    const i = c.idleIndex + 2;
    const avail = c.ws.availableV.slice();
    avail[i] = 0;
    const dead = { ...c, ws: { ...c.ws, availableV: avail } };
    expect(lowestDeliveredEnergy(dead)).toEqual({ value: 0, index: i });
    expect(sparkEnergy(dead).verdict).toBe('fail');
    const noSpark = dead.ws.noSpark.slice();
    noSpark[i] = 1;
    const r = sparkEnergy({ ...dead, ws: { ...dead.ws, noSpark } });
    expect(r.why).toContain('so there is no spark at all');
    expect(r.intents).toEqual(['feed:improve']);
  });
  it('cautions a cranking point where the module does not switch', () => {
    const c = cdAt(3e-6, 200);
    const noSpark = c.ws.noSpark.slice();
    noSpark[0] = 1;
    const r = sparkEnergy({ ...c, ws: { ...c.ws, noSpark } });
    expect(r.verdict).toBe('caution');
    expect(r.intents).toEqual(['feed:improve']);
    expect(r.why).toContain('no spark to start on');
  });
});

describe('spark duration (caution below 0.5 ms, from memory) and the advice on a weak spark', () => {
  it('passes exactly 0.5 ms and cautions just under', () => {
    expect(sparkEnergy(cdAt(3e-6, 200, { durationS: 0.5e-3 })).verdict).toBe('pass');
    const short = sparkEnergy(cdAt(3e-6, 200, { durationS: 0.5e-3 * (1 - 1e-9) }));
    expect(short.verdict).toBe('caution');
    expect(short.why).toContain('Its spark lasts only 0.50 ms');
  });
  it('reads the shortest spark idle to redline, skipping points without a spark', () => {
    const c = cdAt(3e-6, 200, { durationAt: { 0: 1e-6 } });
    expect(sparkEnergy(c).verdict).toBe('pass');
    const r = sparkEnergy(cdAt(3e-6, 200, { durationAt: { [c.idleIndex + 1]: 0.2e-3 } }));
    expect(figure(r, 'shortest spark, idle to redline')).toBeCloseTo(0.2, 12);
    expect(figure(r, 'shortest at rpm')).toBe(c.grid.rpm[c.idleIndex + 1]);
  });
  it('calls a weak spark acceptable while the reserve holds (at the margin too), and not otherwise', () => {
    const weak = (worstRatio: number) => sparkEnergy(cdAt(3e-6, 100, { worstRatio }));
    expect(weak(1.25).action).toContain('Acceptable: the voltage reserve holds (worst 1.25 against the 1.25 margin)');
    expect(weak(1.25).action).toContain('A CD unit that fires several sparks');
    expect(weak(1.25 * (1 - 1e-9)).action).toContain('Not to be relied on: the voltage reserve does not hold either');
    expect(weak(1.2).action).toContain('a larger capacitor or a stronger charger');
  });
});

describe('against the existing setup (caution under 75 % of its energy or 50 % of its duration, our limits)', () => {
  const baseline = (energyJ: number, durationS: number, n = cdAt(3e-6, 110).ws.n): Baseline => uniformBaseline(energyJ, durationS, n);
  it('passes 3 mJ against 4 mJ (exactly 75 %) and cautions against a little more', () => {
    expect(BASELINE_ENERGY_CAUTION_RATIO).toBe(0.75);
    expect(3e-3 / 4e-3).toBe(0.75);
    const at = sparkEnergy(cdAt(3e-6, 110, { baseline: baseline(4e-3, 1e-3) }));
    expect(at.verdict).toBe('pass');
    expect(figure(at, 'delivered energy relative to the existing setup, worst')).toBe(75);
    const under = sparkEnergy(cdAt(3e-6, 110, { baseline: baseline(4e-3 * (1 + 1e-9), 1e-3) }));
    expect(under.verdict).toBe('caution');
    expect(under.why).toContain('% of the spark energy of the existing setup (3.00 mJ against 4.00 mJ)');
  });
  it('passes 1 ms against 2 ms (exactly 50 %) and cautions against a little more', () => {
    expect(BASELINE_DURATION_CAUTION_RATIO).toBe(0.5);
    const at = sparkEnergy(cdAt(3e-6, 110, { baseline: baseline(1e-3, 2e-3) }));
    expect(at.verdict).toBe('pass');
    expect(figure(at, 'spark duration relative to the existing setup, worst')).toBe(50);
    const under = sparkEnergy(cdAt(3e-6, 110, { baseline: baseline(1e-3, 2e-3 * (1 + 1e-9)) }));
    expect(under.verdict).toBe('caution');
    expect(under.why).toContain('as long as that of the existing setup (1.00 ms against 2.00 ms)');
  });
  it('compares only where the existing setup has a spark, and only idle to redline', () => {
    const b = baseline(0, 0);
    const r = sparkEnergy(cdAt(3e-6, 110, { baseline: b }));
    expect(r.figures.some((f) => f.name.startsWith('delivered energy relative'))).toBe(false);
    expect(r.figures.some((f) => f.name.startsWith('spark duration relative'))).toBe(false);
    const c = cdAt(3e-6, 110);
    const strong = baseline(1e-3, 1e-3);
    strong.sparkEnergyJ[0] = 1; // the cranking point is not compared
    strong.durationS[0] = 1;
    expect(sparkEnergy({ ...c, baseline: strong }).verdict).toBe('pass');
    const worst = baseline(1e-3, 1e-3);
    worst.sparkEnergyJ[c.redlineIndex] = 5e-3;
    const rr = sparkEnergy({ ...c, baseline: worst });
    expect(figure(rr, 'delivered energy relative to the existing setup, worst')).toBeCloseTo(60, 9);
    expect(figure(rr, 'worst at rpm')).toBe(c.grid.rpm[c.redlineIndex]);
  });
});

describe('what to do about too little energy, in the words of the system', () => {
  // A 60 ohm primary barely charges: 14 V / 60 ohm is about 0.23 A, well under a millijoule.
  const weakCoil = coil({ primaryResistanceOhm20C: { value: 60, provenance: 'catalogue' } });
  it('points: a lower-resistance coil or a longer dwell', () => {
    const r = sparkEnergy(ctxOf(pointsSetup({ coil: weakCoil })));
    expect(r.verdict).toBe('fail');
    expect(r.action).toMatch(/set the dwell at the top of its range/);
    expect(r.intents).toEqual(['coil-resistance:lower', 'dwell:longer']);
  });
  it('a module: a lower-resistance coil or a module that charges it longer', () => {
    const r = sparkEnergy(ctxOf(moduleSetup(module(), { coil: weakCoil })));
    expect(r.verdict).toBe('fail');
    expect(r.action).toBe('Choose a coil of lower inductance or resistance, or a module that charges it longer.');
  });
  it('a magneto: have it recharged; a CD unit: a stronger charger', () => {
    const mag = sparkEnergy(ctxOf(pointsSetup({ switching: 'magneto', magneto: { ratedCurrentA: 0.2, fullOutputRpm: 2000 } })));
    expect(mag.verdict).toBe('fail');
    expect(mag.action).toMatch(/magneto's magnet recharged/);
    expect(mag.intents).toBeUndefined();
    const cd = sparkEnergy(cdAt(1e-6, 50));
    expect(cd.action).toBe('Choose a capacitive-discharge unit with a stronger charger or a larger capacitor.');
  });
  it('suggests a cranking bypass for a weak cranking spark behind a ballast', () => {
    const c = ctxOf(pointsSetup({ coil: ballastCoil(), ballast: ironBallast() }));
    const crank = c.ws.currentA.slice();
    crank[0] = 0.05;
    const r = sparkEnergy({ ...c, ws: { ...c.ws, currentA: crank } });
    expect(r.action).toContain('consider a cranking bypass past the ballast');
  });
});

describe('tachometer (common-practice table)', () => {
  const tach = (senses: TachSenses) => ({ name: 'Tach', senses });
  const ind = (senses: TachSenses, over = {}) => tachRule(ctxOf(moduleSetup(module(over), { tach: tach(senses) })));
  const cd = (senses: TachSenses, over = {}) => ctxOf(moduleSetup(cdModule(over), { tach: tach(senses) }));
  const pts = (senses: TachSenses) => ctxOf(pointsSetup({ tach: tach(senses) }));
  it('counts pulses per revolution: cylinders / 2 on a four-stroke, cylinders on a two-stroke', () => {
    expect(tachRule(pts('cable')).figures[0]!.value).toBe(2);
    expect(tachRule(ctxOf(pointsSetup({ tach: tach('cable') }), { ...fourCylinder, cycle: 'two-stroke', cylinders: 3 })).figures[0]!.value).toBe(3);
  });
  it('passes a cable-driven tach and no tach on anything', () => {
    expect(tachRule(cd('cable', { tachOutput: false })).verdict).toBe('pass');
    expect(tachFails(cd('cable', { tachOutput: false }))).toBe(false);
    expect(tachRule(ctxOf(pointsSetup())).action).toBe('Nothing to do.');
  });
  it('a module-output tach: fails on points and on a module without one, cautions a multi-spark CD', () => {
    expect(tachRule(pts('module-output')).verdict).toBe('fail');
    expect(tachFails(pts('module-output'))).toBe(true);
    expect(ind('module-output', { tachOutput: false }).verdict).toBe('fail');
    expect(tachFails(ctxOf(moduleSetup(module({ tachOutput: false }), { tach: tach('module-output') })))).toBe(true);
    expect(ind('module-output', { tachOutput: true }).verdict).toBe('pass');
    expect(tachFails(ctxOf(moduleSetup(module({ tachOutput: true }), { tach: tach('module-output') })))).toBe(false);
    const multi = cd('module-output', { cd: { capacitorF: 1e-6, chargeVoltageV: 400, chargerPowerW: 40, multiSparkBelowRpm: 3000 } });
    expect(tachRule(multi).verdict).toBe('caution');
    expect(tachRule(multi).figures.find((f) => f.name === 'multi-spark below')!.value).toBe(3000);
  });
  it('a CD system: the coil feed carries no pulses and its coil negative too many volts', () => {
    expect(tachRule(cd('coil-supply-current')).verdict).toBe('fail');
    expect(tachFails(cd('coil-supply-current'))).toBe(true);
    expect(tachRule(cd('coil-negative-pulses', { tachOutput: false })).verdict).toBe('fail');
    expect(tachFails(cd('coil-negative-pulses', { tachOutput: false }))).toBe(true);
    expect(tachRule(cd('coil-negative-pulses')).verdict).toBe('caution');
    expect(tachRule(cd('coil-negative-pulses')).action).toMatch(/module's tach output/);
    expect(tachFails(cd('coil-negative-pulses'))).toBe(false);
    const multi = cd('coil-negative-pulses', { cd: { capacitorF: 1e-6, chargeVoltageV: 400, chargerPowerW: 40, multiSparkBelowRpm: 2500 } });
    expect(tachRule(multi).why).toContain('Below 2500 rpm the module fires several sparks per event');
  });
  it('an inductive module: a current-sensing tach may read unsteadily, pulses work; points read everything', () => {
    expect(ind('coil-supply-current').verdict).toBe('caution');
    expect(tachFails(ctxOf(moduleSetup(module(), { tach: tach('coil-supply-current') })))).toBe(false);
    expect(ind('coil-negative-pulses').verdict).toBe('pass');
    expect(tachRule(pts('coil-supply-current')).verdict).toBe('pass');
    expect(tachRule(pts('coil-negative-pulses')).action).toBe('Nothing to do: this tachometer reads this system.');
    expect(tachFails(pts('coil-negative-pulses'))).toBe(false);
  });
});

describe('the merged list of what to do', () => {
  const r = (title: string, verdict: RuleResult['verdict'], action: string, intents?: Intent[]): RuleResult => ({ id: 'tach', title, verdict, figures: [], why: 'because', action, ...(intents ? { intents } : {}) });
  it('puts fails before cautions, each in report order, leaves out passes and repeats', () => {
    const out = whatToDo([r('A', 'caution', 'do a'), r('B', 'fail', 'do b'), r('C', 'pass', 'do c'), r('D', 'fail', 'do d'), r('E', 'caution', 'do a')]);
    expect(out).toEqual(['do b', 'do d', 'do a']);
  });
  it('drops a caution that contradicts what is listed, and says so for a fail', () => {
    expect(whatToDo([r('Fit', 'fail', 'fit a ballast', ['ballast:add']), r('Remove', 'caution', 'remove it', ['ballast:remove'])])).toEqual(['fit a ballast']);
    const out = whatToDo([r('Fit', 'fail', 'fit a ballast', ['ballast:add']), r('Remove', 'fail', 'remove it', ['ballast:remove']), r('Remove again', 'fail', 'remove it', ['ballast:remove'])]);
    expect(out).toEqual(['fit a ballast', '"Fit" and "Remove" pull opposite ways, so no single change to these parts cures both: choose a different coil or module.', '"Fit" and "Remove again" pull opposite ways, so no single change to these parts cures both: choose a different coil or module.']);
  });
  it('knows every contradicting pair both ways round, and nothing else', () => {
    expect(CONTRADICTIONS.length).toBe(7);
    for (const [a, b] of CONTRADICTIONS) {
      expect(contradicts([a], [b])).toBe(true);
      expect(contradicts([b], [a])).toBe(true);
      expect(contradicts([a], [a])).toBe(false);
    }
    expect(contradicts(['ballast:keep'], ['ballast:remove'])).toBe(true);
    expect(contradicts(['ballast:add', 'gap:close'], ['dwell:longer', 'gap:widen'])).toBe(true);
    expect(contradicts(['feed:improve'], ['ballast:remove'])).toBe(false);
  });
});
