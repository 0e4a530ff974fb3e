/**
 * The supply rules (rules/supply.ts), the resistance rules (rules/resistance.ts) and the shared
 * helpers they stand on (rules/context.ts): the units each figure is shown in, the advice on the
 * paths the other mutant tests leave unread, the fail tests on setups that carry a module they do
 * not use, and the column helpers on small arrays.
 * Sources beside each check: the rule's own documented threshold or sentence (the doc comment or
 * the words the restorer reads), Ohm's law, the inductor-energy law E = 0.5 L i^2, and the copper
 * law R = R20 (1 + 0.00393 (T - 20)).
 * Written against the mutation-testing survivors (npm run mutate); see
 * mutants-rule-limits.test.ts and mutants-rule-words.test.ts for the thresholds and most sentences.
 */
import { describe, expect, it } from 'vitest';
import { analyse, baselineOf, createSession } from '../../electron/checker/session.js';
import { createWorkspace } from '../../electron/checker/sweep.js';
import { fmt, isModuleKind, maxOver, minOver, type RuleContext } from '../../electron/checker/rules/context.js';
import { ballastPlan, ballastPlanFails, coilResistanceFloor, coilResistanceFloorFails, peakCurrent, peakCurrentFails } from '../../electron/checker/rules/resistance.js';
import { crankingSupply, crankingSupplyFails, earthPolarity, earthPolarityFails, moduleSupplyMax, moduleSupplyMaxFails, sixVolt, sixVoltFails } from '../../electron/checker/rules/supply.js';
import type { EngineSpec, RuleResult, SetupSpec } from '../../electron/checker/index.js';
import { ballastCoil, coil, fourCylinder, ironBallast, module, moduleSetup, pointsSetup } from './fixtures.js';

/** The rule context the checker builds for a setup (a short rpm grid keeps it quick). */
function ctxOf(setup: SetupSpec, engine: EngineSpec = fourCylinder): RuleContext {
  return analyse(createSession(engine, undefined, { rpmPoints: 24 }), setup, null, true).ctx;
}
const units = (r: RuleResult): string[] => r.figures.map((f) => f.unit);
const names = (r: RuleResult): string[] => r.figures.map((f) => f.name);
const fixedDuty = (over = {}) => module({ name: 'Fixed duty', moduleType: 'breakerless-fixed-duty', currentLimitA: null, maxDutyFraction: null, fixedDutyFraction: 0.6, ...over });
const magnetoSetup = (over: Partial<SetupSpec> = {}): SetupSpec => pointsSetup({ switching: 'magneto', magneto: { ratedCurrentA: 4, fullOutputRpm: 1500 }, condenserF: 0.22e-6, ...over });
const sixVoltCar: EngineSpec = { ...fourCylinder, systemVoltageV: 6 };
const positiveEarthCar: EngineSpec = { ...fourCylinder, earthPolarity: 'positive' };
/** The cranking supply the module sees, set by hand (the one figure the cranking rule reads). */
const cranking = (ctx: RuleContext, v: number): RuleContext => ({ ...ctx, p: { ...ctx.p, moduleSupplyCrankingV: v } });

describe('the supply rules show every supply in volts', () => {
  it('cranking supply: volts on the points path and on the four module figures', () => {
    expect(units(crankingSupply(ctxOf(pointsSetup())))).toEqual(['V']);
    const r = crankingSupply(ctxOf(moduleSetup(fixedDuty())));
    expect(names(r)).toEqual(['battery while cranking', 'module sees while cranking', 'module sees running', 'module minimum']);
    expect(units(r)).toEqual(['V', 'V', 'V', 'V']);
  });
  it('module supply maximum: volts on the points path and on the three module figures', () => {
    expect(units(moduleSupplyMax(ctxOf(pointsSetup())))).toEqual(['V']);
    const r = moduleSupplyMax(ctxOf(moduleSetup(fixedDuty())));
    expect(names(r)).toEqual(['running (charging) supply', 'module maximum', 'caution from']);
    expect(units(r)).toEqual(['V', 'V', 'V']);
  });
  it('system voltage: volts on the three figures, and on the module minimum when it fails on 6 V', () => {
    expect(units(sixVolt(ctxOf(pointsSetup())))).toEqual(['V', 'V', 'V']);
    // Rule sentence: "The module needs more than a 6 V system gives even when charging" (8 V > 7.2 V).
    const fail = sixVolt(ctxOf(moduleSetup(fixedDuty({ supplyMinV: 8 })), sixVoltCar));
    expect(fail.verdict).toBe('fail');
    expect(names(fail)).toEqual(['system voltage', 'coil rated for', 'running supply', 'module minimum']);
    expect(units(fail)).toEqual(['V', 'V', 'V', 'V']);
    expect(fail.figures[3]!.value).toBe(8);
  });
});

describe('cranking supply: only a module fed after a fitted ballast is told to move its feed', () => {
  // Rule: "fed after the ballast" counts only when the feed is after the ballast AND a ballast is
  // fitted; a terminal-15 feed with a ballast in the coil circuit is the plain feed.
  const min = 6; // the fixture module's minimum supply
  const fed15 = (): RuleContext => ctxOf(moduleSetup(fixedDuty({ supplyMinV: min, minCoilResistanceOhm: 0 }), { coil: ballastCoil(), ballast: ironBallast(), crankingBypass: true, moduleFeed: 'switched-15' }));
  it('passes a terminal-15 feed with a ballast fitted, 9 V against a 6 V minimum (above 1.05 x 6 = 6.3 V)', () => {
    const r = crankingSupply(cranking(fed15(), 9));
    expect(r.verdict).toBe('pass');
    expect(r.why).toBe('While the starter turns, the battery sags; a module below its minimum supply gives no spark or a weak one, which reads as a non-starter.');
    expect(r.action).toBe('Nothing to do.');
  });
  it('asks a terminal-15 feed with a ballast, below the minimum, for a better feed, not to move it to terminal 15', () => {
    const r = crankingSupply(cranking(fed15(), 5));
    expect(r.verdict).toBe('fail');
    expect(r.why).toContain('It would see 5.00 V against a minimum of 6.00 V.');
    expect(r.action).toBe('Improve the feed (a relay from the battery, a better earth) or choose a module that works at a lower voltage.');
  });
  it('the same setup fed after the ballast: cautions at 9 V and, below the minimum, says to feed from terminal 15', () => {
    const after = (v: number): RuleContext => {
      const c = cranking(fed15(), v);
      return { ...c, setup: { ...c.setup, moduleFeed: 'after-ballast' } };
    };
    expect(crankingSupply(after(9)).verdict).toBe('caution');
    expect(crankingSupply(after(5)).action).toBe('Feed the module from terminal 15 (before the ballast), not from the coil side.');
  });
});

describe('the fail tests agree with their rules on a points setup that still names a module', () => {
  // prepare.ts: "Points and magneto setups switch the coil themselves; the module chosen is ignored."
  // Each rule passes such a setup on its points path; its fail test must say false.
  it('module supply maximum: a 4.5-9 V six-volt unit named on a 12 V points car (14 V running) does not fail', () => {
    const c = ctxOf(pointsSetup({ module: fixedDuty({ supplyMinV: 4.5, supplyMaxV: 9 }) }));
    expect(c.p.runningSupplyV).toBe(14); // the running (charging) supply on 12 V, above the unit's 9 V
    const r = moduleSupplyMax(c);
    expect(r.verdict).toBe('pass');
    expect(r.why).toBe('Points and magnetos have no electronic supply limit.');
    expect(moduleSupplyMaxFails(c)).toBe(false);
  });
  it('earth polarity: a negative-earth unit named on a positive-earth points car does not fail', () => {
    const c = ctxOf(pointsSetup({ module: fixedDuty() }), positiveEarthCar);
    const r = earthPolarity(c);
    expect(r.verdict).toBe('pass');
    expect(r.why).toBe('Points and magnetos work with either earth polarity.');
    expect(earthPolarityFails(c)).toBe(false);
  });
  it('cranking supply: a unit named on points does not fail even if the module supply figure reads under its minimum', () => {
    const c = cranking(ctxOf(pointsSetup({ module: fixedDuty({ supplyMinV: 6 }) })), 5);
    const r = crankingSupply(c);
    expect(r.verdict).toBe('pass');
    expect(r.why).toBe('Points need no minimum supply to switch.');
    expect(crankingSupplyFails(c)).toBe(false);
  });
});

describe('earth polarity: the module\'s polarities are listed joined by "and"', () => {
  it('names each listed polarity in the failing sentence', () => {
    // The parts schema (db/schema.ts) asks for at least one polarity and does not refuse a repeat;
    // a list the car's polarity is not in is read out in full.
    const c = ctxOf(moduleSetup(fixedDuty({ earthPolarities: ['negative', 'negative'] })), positiveEarthCar);
    const r = earthPolarity(c);
    expect(r.verdict).toBe('fail');
    expect(r.why).toBe('Transistors conduct one way only: a module made for the other earth polarity does not switch, and can be destroyed the moment it is connected. This car is positive earth and the module supports negative and negative earth only.');
    expect(earthPolarityFails(c)).toBe(true);
  });
});

describe('system voltage on a 12 V car: the current-limited caution is for a 6 V coil with no ballast only', () => {
  it('passes a 12 V coil on a current-limited module with no ballast', () => {
    const r = sixVolt(ctxOf(moduleSetup(module())));
    expect(r.verdict).toBe('pass');
    expect(r.why).toBe('A 12 V system: no 6 V limits apply.');
    expect(r.action).toBe('Nothing to do.');
  });
  it('passes a 6 V coil on a current-limited module when a ballast is fitted', () => {
    const r = sixVolt(ctxOf(moduleSetup(module({ minCoilResistanceOhm: 0 }), { coil: coil({ ratedVoltageV: 6 }), ballast: ironBallast() })));
    expect(r.verdict).toBe('pass');
    expect(r.why).toBe('A 12 V system: no 6 V limits apply.');
  });
  it('cautions a 6 V coil on a current-limited module with no ballast (the limiter is all that protects it)', () => {
    const r = sixVolt(ctxOf(moduleSetup(module(), { coil: coil({ ratedVoltageV: 6 }) })));
    expect(r.verdict).toBe('caution');
    expect(r.why).toBe('A 6 V coil on a 12 V car is safe here only because the module limits the current; if the module fails or the car goes back to points, the coil sees the full 12 V and overheats.');
  });
  it('a magneto: nothing to do', () => {
    const r = sixVolt(ctxOf(magnetoSetup(), sixVoltCar));
    expect(r.action).toBe('Nothing to do.');
    expect(units(r)).toEqual(['V', 'V', 'V']);
  });
});

describe('system voltage fail test: only a 6 V system fails a module for its minimum supply', () => {
  // Rule doc: "Only a module that needs more than a 6 V system gives fails." On 12 V the running
  // supply is 14 V; a module wanting 15 V is the supply-maximum and cranking rules' business.
  it('does not fail a 15 V-minimum module on a 12 V car, though 15 V > 14 V', () => {
    const c = ctxOf(moduleSetup(fixedDuty({ supplyMinV: 15 })));
    expect(c.p.runningSupplyV).toBe(14);
    expect(c.setup.module!.supplyMinV).toBeGreaterThan(c.p.runningSupplyV);
    expect(sixVolt(c).verdict).toBe('pass');
    expect(sixVoltFails(c)).toBe(false);
  });
  it('fails the same module on a 6 V car (7.2 V running)', () => {
    const c = ctxOf(moduleSetup(fixedDuty({ supplyMinV: 15, supplyMaxV: 16 })), sixVoltCar);
    expect(c.p.runningSupplyV).toBe(7.2);
    expect(sixVoltFails(c)).toBe(true);
    expect(sixVolt(c).verdict).toBe('fail');
  });
});

describe('coil-resistance floor: a module that gives no floor (0 ohm) is treated as having none', () => {
  // floorOf: "The module's coil-resistance floor, or null where none applies (points, CD, no floor given)."
  it('shows the cold coil alone, in ohm, with the no-floor sentence', () => {
    const c = ctxOf(moduleSetup(fixedDuty({ minCoilResistanceOhm: 0 })));
    const r = coilResistanceFloor(c);
    expect(r.verdict).toBe('pass');
    expect(names(r)).toEqual(['coil primary, cold']);
    expect(units(r)).toEqual(['ohm']);
    // Copper law at the 20 degC default surroundings: 3.0 x (1 + 0.00393 x 0) = 3.0 ohm.
    expect(r.figures[0]!.value).toBeCloseTo(3.0 * (1 + 0.00393 * (20 - 20)), 12);
    expect(r.why).toBe('Points and capacitive-discharge systems have no coil-resistance floor.');
    expect(coilResistanceFloorFails(c)).toBe(false);
  });
  it('the points path shows the coil in ohm too', () => {
    expect(units(coilResistanceFloor(ctxOf(pointsSetup())))).toEqual(['ohm']);
  });
});

describe('peak current and ballast on a magneto', () => {
  // Rule: "A capacitive-discharge module or a magneto does not draw steady coil current from the
  // battery": a magneto's break current is never judged against the 7 A points figure.
  it('passes a magneto whatever its break current, with the one figure', () => {
    const c = ctxOf(magnetoSetup());
    const hot: RuleContext = { ...c, ws: { ...c.ws, currentA: new Float64Array(c.ws.n).fill(9) } };
    const r = peakCurrent(hot);
    expect(r.verdict).toBe('pass');
    expect(names(r)).toEqual(['peak current at break']);
    expect(r.figures[0]!.value).toBe(9);
    expect(r.why).toBe('A capacitive-discharge module or a magneto does not draw steady coil current from the battery.');
    expect(peakCurrentFails(hot)).toBe(false);
  });
  it('never fails the ballast plan of a magneto, even with a ballast coil and no ballast', () => {
    // Rule: "A magneto has no battery feed and no ballast."
    const c = ctxOf(magnetoSetup({ coil: ballastCoil() }));
    expect(ballastPlan(c).verdict).toBe('pass');
    expect(ballastPlanFails(c)).toBe(false);
  });
  it('the ballast plan shows resistances in ohm and the running ballast temperature in degC', () => {
    const r = ballastPlan(ctxOf(pointsSetup({ coil: ballastCoil(), ballast: ironBallast(), crankingBypass: true })));
    expect(units(r)).toEqual(['ohm', 'ohm', 'ohm', 'degC']);
  });
});

describe('isModuleKind: a module fitted and switching the coil (not points, not a magneto)', () => {
  it('is true for a module setup, including transistor-assisted points', () => {
    expect(isModuleKind(ctxOf(moduleSetup(fixedDuty())))).toBe(true);
    expect(isModuleKind(ctxOf(moduleSetup(module())))).toBe(true);
    expect(isModuleKind(ctxOf(moduleSetup(fixedDuty({ moduleType: 'transistor-points' }))))).toBe(true);
  });
  it('is false for a module kind with no module chosen', () => {
    expect(isModuleKind(ctxOf(moduleSetup(fixedDuty(), { module: null })))).toBe(false);
  });
  it('is false for points or a magneto that still name a module', () => {
    expect(isModuleKind(ctxOf(pointsSetup({ module: fixedDuty() })))).toBe(false);
    expect(isModuleKind(ctxOf(magnetoSetup({ module: fixedDuty() })))).toBe(false);
  });
});

describe('column helpers: largest and smallest over [from, to], first index on a tie', () => {
  const col = (...v: number[]): Float64Array => Float64Array.from(v);
  it('maxOver keeps the first of equal largest values', () => {
    expect(maxOver(col(2, 1, 2), 0, 2)).toEqual({ value: 2, index: 0 });
    expect(maxOver(col(1, 5, 3, 5), 1, 3)).toEqual({ value: 5, index: 1 });
  });
  it('minOver finds the smallest anywhere in the range, its first index on a tie, and nothing outside it', () => {
    expect(minOver(col(3, 1, 2), 0, 2)).toEqual({ value: 1, index: 1 });
    expect(minOver(col(3, 2, 1), 0, 2)).toEqual({ value: 1, index: 2 });
    expect(minOver(col(1, 2, 1), 0, 2)).toEqual({ value: 1, index: 0 });
    expect(minOver(col(0, 4, 6, 5, 0), 1, 3)).toEqual({ value: 4, index: 1 });
    expect(minOver(col(7), 0, 0)).toEqual({ value: 7, index: 0 });
  });
  it('minOver of an empty range is +Infinity at from', () => {
    expect(minOver(col(1, 2), 1, 0)).toEqual({ value: Infinity, index: 1 });
  });
  it('peak current reports the rpm of the first of equal peaks', () => {
    const c = ctxOf(pointsSetup());
    const flat: RuleContext = { ...c, ws: { ...c.ws, currentA: new Float64Array(c.ws.n).fill(4) } };
    const r = peakCurrent(flat);
    expect(r.figures.find((f) => f.name === 'at rpm')!.value).toBe(c.grid.rpm[0]);
  });
});

describe('fmt: a number that is not finite reads as a dash', () => {
  it('NaN and infinities print "-", finite numbers their fixed digits', () => {
    expect(fmt(NaN)).toBe('-');
    expect(fmt(Infinity, 2)).toBe('-');
    expect(fmt(-Infinity)).toBe('-');
    expect(fmt(1.25, 1)).toBe('1.3');
    expect(fmt(2)).toBe('2.0');
  });
});

describe('a baseline keeps its own copy of the stored energy', () => {
  // compare.ts analyses the candidates into the workspace the existing setup was swept in; the
  // baseline must not change when they overwrite it. Stored energy per point is 0.5 L i^2.
  it('still holds the existing setup\'s 0.5 L i^2 after a candidate is swept into the same workspace', () => {
    const s = createSession(fourCylinder, undefined, { rpmPoints: 24 });
    const ws = createWorkspace(s.grids.sweep.n);
    const keyWs = createWorkspace(s.grids.key.n);
    const existing = pointsSetup(); // 8 mH primary (fixtures.ts)
    const ex = analyse(s, existing, null, false, ws, keyWs);
    const currentA = ws.currentA.slice();
    const base = baselineOf(ex);
    analyse(s, moduleSetup(module(), { coil: ballastCoil() }), base, false, ws, keyWs); // 5 mH, other currents
    expect(base.energyJ.length).toBe(s.grids.sweep.n);
    for (let i = 0; i < s.grids.sweep.n; i++) {
      expect(base.energyJ[i]).toBeCloseTo(0.5 * 0.008 * currentA[i]! * currentA[i]!, 15);
    }
    // The candidate did change the workspace (otherwise the check above would prove nothing).
    expect(Array.from(ws.energyJ)).not.toEqual(Array.from(base.energyJ));
  });
});
