/**
 * The tachometer rule in words, cell by cell of its table (common practice, see rules/tach.ts):
 *   senses               | points | magneto       | inductive module | CD
 *   coil supply current  | works  | reads nothing | usually works    | usually not; needs an adaptor
 *   coil negative pulses | works  | works         | works            | needs the module's tach output
 *   module tach output   | n/a    | n/a           | works            | works
 *   cable from the engine| works  | works         | works            | works
 * (A magneto generates its own primary current, so no battery feed runs to it: common practice.)
 * and the fail test against the rule's own verdict on every cell. Pulses per revolution: cylinders / 2
 * on a four-stroke (each cylinder fires once in two revolutions), cylinders on a two-stroke.
 * Written against the mutation-testing survivors (npm run mutate).
 */
import { describe, expect, it } from 'vitest';
import { analyse, createSession } from '../../electron/checker/session.js';
import type { RuleContext } from '../../electron/checker/rules/context.js';
import { tachFails, tachRule } from '../../electron/checker/rules/tach.js';
import type { EngineSpec, ModuleSpec, SetupSpec, TachSenses } from '../../electron/checker/index.js';
import { cdModule, fourCylinder, module, moduleSetup, pointsSetup } from './fixtures.js';

function ctxOf(setup: SetupSpec, engine: EngineSpec = fourCylinder): RuleContext {
  return analyse(createSession(engine, undefined, { rpmPoints: 12 }), setup, null, false).ctx;
}
const tach = (senses: TachSenses) => ({ name: 'Tach', senses });
const magneto = (senses: TachSenses | null) => ctxOf(pointsSetup({ switching: 'magneto', magneto: { ratedCurrentA: 0.2, fullOutputRpm: 2000 }, tach: senses ? tach(senses) : null }));
const points = (senses: TachSenses | null) => ctxOf(pointsSetup({ tach: senses ? tach(senses) : null }));
const ind = (senses: TachSenses, over: Partial<ModuleSpec> = {}) => ctxOf(moduleSetup(module(over), { tach: tach(senses) }));
const multiCd = (rpm: number) => ({ cd: { capacitorF: 1e-6, chargeVoltageV: 400, chargerPowerW: 40, multiSparkBelowRpm: rpm } });
const cd = (senses: TachSenses, over: Partial<ModuleSpec> = {}) => ctxOf(moduleSetup(cdModule(over), { tach: tach(senses) }));

const WHY = 'A tachometer reads the ignition\'s pulses; a system that changes the pulses can leave it dead, erratic or reading double.';

describe('the tachometer rule names itself and its one figure', () => {
  it('id, title, and pulses per revolution as a plain count (no unit)', () => {
    const r = tachRule(points(null));
    expect(r.id).toBe('tach');
    expect(r.title).toBe('Tachometer');
    // Four-stroke four: 4 / 2 = 2 pulses per revolution.
    expect(r.figures).toEqual([{ name: 'pulses per revolution', value: 4 / 2, unit: '' }]);
    expect(r.verdict).toBe('pass');
    expect(r.why).toBe('No tachometer is recorded for this engine.');
    expect(r.action).toBe('Nothing to do.');
  });
});

describe('a tachometer that reads a module tach output', () => {
  it('on points: n/a, because points have no output', () => {
    const r = tachRule(points('module-output'));
    expect(r.verdict).toBe('fail');
    expect(r.why).toBe('This tachometer needs a module tach output, and points have none.');
    expect(r.action).toBe('Keep the module it was fitted for, or change the tachometer.');
  });
  it('a current-sensing tachometer on a magneto: no battery feed to sense, so it reads nothing (common practice)', () => {
    const r = tachRule(magneto('coil-supply-current'));
    expect(r.verdict).toBe('fail');
    expect(r.why).toMatch(/no battery feed/);
    expect(tachFails(magneto('coil-supply-current'))).toBe(true);
    // Its contact breaker's pulses are there as on points.
    expect(tachRule(magneto('coil-negative-pulses')).verdict).toBe('pass');
  });
  it('on a magneto: a magneto fires from its own points, so the same answer as points', () => {
    const r = tachRule(magneto('module-output'));
    expect(r.verdict).toBe('fail');
    expect(r.why).toBe('This tachometer needs a module tach output, and points have none.');
    expect(r.action).toBe('Keep the module it was fitted for, or change the tachometer.');
    expect(tachFails(magneto('module-output'))).toBe(true);
  });
  it('on a module without an output: choose one that has it', () => {
    const r = tachRule(ind('module-output', { tachOutput: false }));
    expect(r.why).toBe('This tachometer needs a tach output and the module has none.');
    expect(r.action).toBe('Choose a module with a tach output, or fit a tach adaptor.');
  });
  it('on a multi-spark CD module with an output: check the reading below the multi-spark speed', () => {
    const r = tachRule(cd('module-output', multiCd(3000)));
    expect(r.verdict).toBe('caution');
    expect(r.figures).toEqual([
      { name: 'pulses per revolution', value: 2, unit: '' },
      { name: 'multi-spark below', value: 3000, unit: 'rpm' },
    ]);
    expect(r.why).toBe('The module\'s tach output should give one pulse per firing; check it does below the multi-spark speed.');
    expect(r.action).toBe('Compare the reading with a hand-held tachometer at idle.');
  });
  it('on a module with an output: connect it there', () => {
    for (const r of [tachRule(ind('module-output', { tachOutput: true })), tachRule(cd('module-output'))]) {
      expect(r.verdict).toBe('pass');
      expect(r.why).toBe(WHY);
      expect(r.action).toBe('Connect the tachometer to the module\'s tach output.');
    }
  });
});

describe('a conventional tachometer on a CD system', () => {
  it('the coil negative carries hundreds of volts: fail without the module\'s output', () => {
    const r = tachRule(cd('coil-negative-pulses', { tachOutput: false }));
    expect(r.verdict).toBe('fail');
    expect(r.why).toBe('The coil negative of a CD system carries pulses of hundreds of volts that a conventional tachometer is not built for.');
    expect(r.action).toBe('Choose a CD module with a tach output, or fit an adaptor.');
  });
  it('a multi-spark module over-reads below its multi-spark rpm, and the figure says where', () => {
    const r = tachRule(cd('coil-negative-pulses', multiCd(2500)));
    expect(r.verdict).toBe('caution');
    expect(r.figures).toEqual([
      { name: 'pulses per revolution', value: 2, unit: '' },
      { name: 'multi-spark below', value: 2500, unit: 'rpm' },
    ]);
    expect(r.why).toBe('Below 2500 rpm the module fires several sparks per event; a pulse-counting tachometer over-reads there.');
    expect(r.action).toBe('Connect the tachometer to the module\'s tach output and expect a high reading at idle if it counts every spark.');
  });
  it('a single-spark module with an output: move the lead to it', () => {
    const r = tachRule(cd('coil-negative-pulses'));
    expect(r.figures).toEqual([{ name: 'pulses per revolution', value: 2, unit: '' }]);
    expect(r.why).toBe(WHY);
    expect(r.action).toBe('Move the tachometer lead from the coil negative to the module\'s tach output.');
  });
});

describe('a current-sensing tachometer on an inductive module', () => {
  it('usually works, but may read unsteadily: check it by hand', () => {
    const r = tachRule(ind('coil-supply-current'));
    expect(r.verdict).toBe('caution');
    expect(r.why).toBe('A current-sensing tachometer usually works with an inductive module, but a module that changes dwell with speed can make it read unsteadily.');
    expect(r.action).toBe('Check the reading against a hand-held tachometer after the conversion.');
  });
});

describe('the fail test agrees with the rule on every cell of the table', () => {
  const senses: TachSenses[] = ['cable', 'module-output', 'coil-supply-current', 'coil-negative-pulses'];
  it('points, magneto, inductive modules and CD modules, with and without a tach output', () => {
    const cases: Array<[string, (s: TachSenses) => RuleContext]> = [
      ['points', (s) => points(s)],
      ['magneto', (s) => magneto(s)],
      // The checker takes any setup it is given: points with a module record left on them still have
      // no module in the circuit, so its tach output cannot serve the tachometer.
      ['points with a module record', (s) => ctxOf(pointsSetup({ module: module({ tachOutput: true }), tach: tach(s) }))],
      ['inductive, no output', (s) => ind(s, { tachOutput: false })],
      ['inductive, output', (s) => ind(s, { tachOutput: true })],
      ['CD, no output', (s) => cd(s, { tachOutput: false })],
      ['CD, output', (s) => cd(s)],
      ['CD multi-spark, output', (s) => cd(s, multiCd(3000))],
    ];
    for (const [label, make] of cases) {
      for (const s of senses) {
        const ctx = make(s);
        expect(tachFails(ctx), `${label}, ${s}`).toBe(tachRule(ctx).verdict === 'fail');
      }
    }
    // The table's n/a cell holds whatever module record rides along.
    expect(tachFails(ctxOf(pointsSetup({ module: module({ tachOutput: true }), tach: tach('module-output') })))).toBe(true);
  });
});
