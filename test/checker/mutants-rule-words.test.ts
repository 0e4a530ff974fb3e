/**
 * What each rule tells the restorer: its title, the names of the figures it shows, and the gist of
 * each sentence on each verdict path, so that a rule that loses a sentence or a figure, or shows
 * another path's words, fails here. Written against the mutation-testing survivors (npm run mutate).
 */
import { describe, expect, it } from 'vitest';
import { analyse, createSession } from '../../electron/checker/session.js';
import type { RuleContext } from '../../electron/checker/rules/context.js';
import { keyOnHeat, moduleHeat } from '../../electron/checker/rules/heat.js';
import { ballastPlan, coilResistanceFloor, peakCurrent } from '../../electron/checker/rules/resistance.js';
import { crankingSupply, earthPolarity, moduleSupplyMax, sixVolt } from '../../electron/checker/rules/supply.js';
import { coilPolarity } from '../../electron/checker/rules/polarity.js';
import { totalAdvance, totalAdvanceDeg } from '../../electron/checker/rules/advance.js';
import { condenser, setupComplete, suppressedLeads } from '../../electron/checker/rules/wiring.js';
import type { EngineSpec, RuleResult, SetupSpec } from '../../electron/checker/index.js';
import { ballastCoil, cdModule, coil, fourCylinder, ironBallast, module, moduleSetup, pointsSetup } from './fixtures.js';

function ctxOf(setup: SetupSpec, engine: EngineSpec = fourCylinder): RuleContext {
  return analyse(createSession(engine, undefined, { rpmPoints: 24 }), setup, null, true).ctx;
}
const names = (r: RuleResult): string[] => r.figures.map((f) => f.name);
const fixedDuty = (over = {}) => module({ name: 'Fixed duty', moduleType: 'breakerless-fixed-duty', currentLimitA: null, maxDutyFraction: null, fixedDutyFraction: 0.6, ...over });
const keyOn = (ctx: RuleContext, coilW: number, moduleW: number, flows = true): RuleContext => ({ ...ctx, keyOn: { currentFlows: flows, currentA: 6.25, coilDissipationW: coilW, ballastDissipationW: 1.5, moduleDissipationW: moduleW } });
const moduleW = (ctx: RuleContext, w: number): RuleContext => ({ ...ctx, ws: { ...ctx.ws, moduleW: new Float64Array(ctx.ws.n).fill(w) } });

describe('key-on heat, in words', () => {
  const points = (): RuleContext => ctxOf(pointsSetup());
  it('names the figures and says nothing flows with a CD module', () => {
    const r = keyOnHeat(keyOn(points(), 10, 0, false));
    expect(r.title).toBe('Key on, engine stopped');
    expect(names(r)).toEqual(['current', 'coil dissipation', 'ballast dissipation', 'module dissipation', 'coil limit']);
    expect(r.figures.map((f) => f.value)).toEqual([6.25, 10, 1.5, 0, 80]);
    expect(r.figures.map((f) => f.unit)).toEqual(['A', 'W', 'W', 'W', 'W']);
    expect(r.why).toBe('No coil current flows with the engine stopped.');
    expect(r.action).toBe('Nothing to do.');
  });
  it('fails with the current, the heat and the limit in the sentence', () => {
    const r = keyOnHeat(keyOn(points(), 120, 0));
    expect(r.why).toMatch(/^With the key on and the engine stopped the coil can carry its full current indefinitely/);
    expect(r.why).toContain('Here it would carry 6.3 A and the coil would dissipate 120 W against about 80 W it can shed.');
    expect(r.action).toMatch(/^Fit the ballast this coil needs, or a module with a stall shut-off/);
    expect(r.intents).toEqual(['ballast:add']);
  });
  it('cautions with the heat named, or as modest', () => {
    const hot = keyOnHeat(keyOn(points(), 50, 0));
    expect(hot.why).toContain('Here the coil would dissipate 50 W.');
    expect(hot.why).toMatch(/split and leak its oil/);
    expect(hot.action).toBe('Do not leave the key on with the engine stopped; a module with a stall shut-off removes the risk.');
    expect(hot.intents).toBeUndefined();
    const mild = keyOnHeat(keyOn(points(), 12, 0));
    expect(mild.why).toContain('The heat here is modest (12 W), but current still flows.');
    expect(mild.why).toMatch(/split and leak its oil/);
  });
});

describe('module heat, in words', () => {
  const mod = (): RuleContext => ctxOf(moduleSetup(module()));
  it('names the figures, and says why on each path', () => {
    const pass = moduleHeat(moduleW(mod(), 3));
    expect(pass.title).toBe('Module heat while running');
    expect(names(pass)).toEqual(['highest module dissipation', 'at rpm']);
    expect(pass.figures.map((f) => f.unit)).toEqual(['W', 'rpm']);
    expect(pass.why).toMatch(/^A module that limits current burns the excess as heat in its transistor/);
    expect(pass.action).toBe('Nothing to do.');
    const caution = moduleHeat(moduleW(mod(), 20));
    expect(caution.why).toContain('It would dissipate 20.0 W.');
    expect(caution.action).toBe('Mount the module on bare metal away from the exhaust, with heat-sink compound.');
    const fail = moduleHeat(moduleW(mod(), 40));
    expect(fail.why).toContain('It would dissipate 40.0 W.');
    expect(fail.why).toMatch(/^A module that limits current/);
    expect(fail.action).toMatch(/^Add resistance to the coil circuit/);
    const none = moduleHeat(ctxOf(pointsSetup()));
    expect(none.why).toBe('This setup has no electronic module, so there is no module transistor to overheat.');
    expect(none.action).toBe('Nothing to do.');
  });
});

describe('coil resistance, peak current and ballast, in words', () => {
  it('coil-resistance floor: title, figures and sentences', () => {
    const none = coilResistanceFloor(ctxOf(pointsSetup()));
    expect(none.title).toBe('Coil resistance against the module minimum');
    expect(names(none)).toEqual(['coil primary, cold']);
    expect(none.why).toBe('Points and capacitive-discharge systems have no coil-resistance floor.');
    expect(none.action).toBe('Nothing to do.');
    const pass = coilResistanceFloor(ctxOf(moduleSetup(fixedDuty({ minCoilResistanceOhm: 2 }))));
    expect(names(pass)).toEqual(['module minimum', 'coil alone, cold', 'coil alone, hot', 'coil and ballast, cold', 'coil and ballast, hot', 'while cranking']);
    expect(pass.why).toMatch(/^Below the module's minimum the coil draws more current/);
    expect(pass.action).toBe('Nothing to do: the coil circuit stays above the module minimum hot and cold.');
    const fail = coilResistanceFloor(ctxOf(moduleSetup(fixedDuty({ minCoilResistanceOhm: 4 }))));
    expect(fail.why).toMatch(/^Below the module's minimum/);
    expect(fail.action).toBe('Fit a ballast that brings the total above the minimum, or choose a higher-resistance coil.');
    const failBallast = coilResistanceFloor(ctxOf(moduleSetup(fixedDuty({ minCoilResistanceOhm: 4 }), { coil: ballastCoil(), ballast: ironBallast() })));
    expect(failBallast.action).toBe('Choose a coil of higher primary resistance, or a module rated for this coil.');
    const bypass = coilResistanceFloor(ctxOf(moduleSetup(fixedDuty({ minCoilResistanceOhm: 2.5 }), { coil: ballastCoil(), ballast: ironBallast(), crankingBypass: true })));
    expect(bypass.why).toMatch(/^Below the module's minimum/);
    expect(bypass.action).toMatch(/^Brief cranking is usually tolerated/);
    const keep = coilResistanceFloor(ctxOf(moduleSetup(fixedDuty({ minCoilResistanceOhm: 2.5 }), { coil: ballastCoil(), ballast: ironBallast() })));
    expect(keep.why).toMatch(/^Below the module's minimum/);
    expect(keep.action).toBe('Keep the ballast in circuit and never bridge it out.');
  });
  it('coil-resistance floor: the hot figures follow the copper law, the ceramic ballast holds its value', () => {
    // Copper law at the 80 degC under-bonnet default: 1.5 x (1 + 0.00393 x 60) = 1.85370 ohm; a
    // ceramic ballast keeps its 1.5 ohm hot and cold.
    const r = coilResistanceFloor(ctxOf(moduleSetup(fixedDuty({ minCoilResistanceOhm: 2.5 }), { coil: ballastCoil(), ballast: ironBallast({ ballastType: 'ceramic' }) })));
    const v = (name: string): number => r.figures.find((f) => f.name === name)!.value;
    expect(v('coil alone, cold')).toBe(1.5);
    expect(v('coil alone, hot')).toBeCloseTo(1.5 * (1 + 0.00393 * 60), 12);
    expect(v('coil and ballast, cold')).toBe(3);
    expect(v('coil and ballast, hot')).toBeCloseTo(1.5 * (1 + 0.00393 * 60) + 1.5, 12);
    expect(v('while cranking')).toBe(3);
    expect(r.figures.every((f) => f.unit === 'ohm')).toBe(true);
  });
  it('peak current: title, figures and sentences', () => {
    const cd = peakCurrent(ctxOf(moduleSetup(cdModule())));
    expect(cd.title).toBe('Peak coil current');
    expect(names(cd)).toEqual(['peak current at break']);
    expect(cd.action).toBe('Nothing to do.');
    const ptsCtx = ctxOf(pointsSetup());
    const pts = peakCurrent({ ...ptsCtx, keyOn: { ...ptsCtx.keyOn, currentA: 4.25 } });
    expect(names(pts)).toEqual(['peak current at break', 'at rpm', 'points comfortable limit (from memory)', 'key-on current']);
    expect(pts.figures.map((f) => f.unit)).toEqual(['A', 'rpm', 'A', 'A']);
    expect(pts.figures[3]!.value).toBe(4.25);
    expect(pts.why).toBe('Points contacts burn and pit faster the more current they break; above about 5 A they need frequent dressing.');
    expect(pts.action).toBe('Nothing to do.');
    const hot = ctxOf(pointsSetup());
    const big = peakCurrent({ ...hot, ws: { ...hot.ws, currentA: new Float64Array(hot.ws.n).fill(8) } });
    expect(big.action).toBe('Fit the ballast the coil needs, or a higher-resistance coil.');
    const mod = peakCurrent(ctxOf(moduleSetup(fixedDuty())));
    expect(names(mod)).toEqual(['peak current at break', 'at rpm', 'key-on current', 'module rating']);
    expect(mod.figures.map((f) => f.unit)).toEqual(['A', 'rpm', 'A', 'A']);
    expect(cd.figures.map((f) => f.unit)).toEqual(['A']);
    expect(cd.why).toBe('A capacitive-discharge module or a magneto does not draw steady coil current from the battery.');
    expect(mod.why).toBe('A switching transistor driven beyond its rated current fails, often without warning and usually on the road.');
    expect(mod.action).toBe('Nothing to do.');
    const near = ctxOf(moduleSetup(fixedDuty()));
    const r = peakCurrent({ ...near, keyOn: { ...near.keyOn, currentA: 7.5 } });
    expect(r.why).toMatch(/^A switching transistor driven beyond its rated current fails/);
    expect(r.action).toMatch(/^Leave headroom/);
    const over = peakCurrent({ ...near, keyOn: { ...near.keyOn, currentA: 9 } });
    expect(over.why).toMatch(/^A switching transistor driven beyond/);
    expect(over.action).toMatch(/^Add ballast resistance/);
  });
  it('ballast plan: title, figures and sentences', () => {
    const mag = ballastPlan(ctxOf(pointsSetup({ switching: 'magneto', magneto: { ratedCurrentA: 4, fullOutputRpm: 1500 }, condenserF: 0.22e-6 })));
    expect(mag.title).toBe('Ballast resistor');
    expect(names(mag)).toEqual(['coil primary, cold', 'ballast, cold', 'ballast, hot running', 'ballast temperature, running']);
    expect(mag.why).toBe('A magneto has no battery feed and no ballast.');
    expect(mag.action).toBe('Nothing to do.');
    const cdWith = ballastPlan(ctxOf(moduleSetup(cdModule(), { ballast: ironBallast() })));
    expect(cdWith.why).toMatch(/^A capacitive-discharge module wants the full battery voltage/);
    expect(cdWith.action).toMatch(/^Remove the ballast, or bridge it, and feed the module from terminal 15/);
    const cdWithout = ballastPlan(ctxOf(moduleSetup(cdModule())));
    expect(cdWithout.why).toBe('No ballast, as a capacitive-discharge module wants.');
    expect(cdWithout.action).toBe('Nothing to do.');
    const limited = ballastPlan(ctxOf(moduleSetup(module(), { coil: ballastCoil(), ballast: ironBallast() })));
    expect(limited.why).toMatch(/^This module limits the coil current itself/);
    expect(limited.action).toMatch(/^Remove the ballast \(or bridge it\), which the module's own current limit/);
    const keep = ballastPlan(ctxOf(moduleSetup(module({ minCoilResistanceOhm: 2 }), { coil: ballastCoil(), ballast: ironBallast() })));
    expect(keep.why).toMatch(/^The coil alone is below the module's minimum resistance/);
    const noneNeeded = ballastPlan(ctxOf(moduleSetup(module())));
    expect(noneNeeded.why).toBe('The module limits the coil current; no ballast is needed.');
    expect(noneNeeded.action).toBe('Nothing to do.');
    const missing = ballastPlan(ctxOf(pointsSetup({ coil: ballastCoil() })));
    expect(missing.why).toMatch(/^A ballast coil is wound for about half the battery voltage/);
    expect(missing.action).toMatch(/^Keep or fit the ballast this coil is made for/);
    const noBypass = ballastPlan(ctxOf(pointsSetup({ coil: ballastCoil(), ballast: ironBallast() })));
    expect(noBypass.why).toMatch(/^A ballast coil is wound for about half the battery voltage/);
    expect(noBypass.action).toMatch(/^Keep the ballast and add a cranking bypass/);
    const full = ballastPlan(ctxOf(pointsSetup({ ballast: ironBallast() })));
    expect(full.why).toMatch(/^This coil is made for the full system voltage/);
    expect(full.action).toBe('Remove the ballast (or bridge it) for this coil.');
    const good = ballastPlan(ctxOf(pointsSetup({ coil: ballastCoil(), ballast: ironBallast(), crankingBypass: true })));
    expect(good.why).toMatch(/^The ballast suits this coil and the cranking bypass/);
    expect(ballastPlan(ctxOf(pointsSetup())).why).toBe('No ballast, and this coil does not need one.');
    // The running ballast temperature is shown in degC: the hot kelvin less 273.15.
    expect(good.figures[3]!.value).toBeCloseTo(ctxOf(pointsSetup({ coil: ballastCoil(), ballast: ironBallast(), crankingBypass: true })).p.ballastHotK - 273.15, 9);
  });
});

describe('the supply rules, in words', () => {
  it('cranking supply: title, figures and sentences', () => {
    const pts = crankingSupply(ctxOf(pointsSetup()));
    expect(pts.title).toBe('Module supply while cranking');
    expect(names(pts)).toEqual(['cranking supply']);
    expect(pts.why).toBe('Points need no minimum supply to switch.');
    expect(pts.action).toBe('Nothing to do.');
    const c = ctxOf(moduleSetup(fixedDuty()));
    const pass = crankingSupply(c);
    expect(names(pass)).toEqual(['battery while cranking', 'module sees while cranking', 'module sees running', 'module minimum']);
    expect(pass.figures[2]!.value).toBe(c.p.moduleSupplyRunningV);
    expect(pass.why).toMatch(/^While the starter turns, the battery sags/);
    expect(pass.action).toBe('Nothing to do.');
    const fail = crankingSupply({ ...c, p: { ...c.p, moduleSupplyCrankingV: 5 } });
    expect(fail.why).toMatch(/^While the starter turns, the battery sags/);
    expect(fail.action).toMatch(/^Improve the feed \(a relay from the battery, a better earth\)/);
    const near = crankingSupply({ ...c, p: { ...c.p, moduleSupplyCrankingV: 6.1 } });
    expect(near.why).toMatch(/^While the starter turns/);
    expect(near.action).toBe('A cold morning or a tired battery will take it below; improve the feed.');
    // "Fed after the ballast" with no ballast fitted is the plain terminal-15 feed.
    const noBallast = crankingSupply(ctxOf(moduleSetup(fixedDuty(), { moduleFeed: 'after-ballast' })));
    expect(noBallast.verdict).toBe('pass');
    expect(crankingSupply({ ...c, setup: { ...c.setup, moduleFeed: 'after-ballast' }, p: { ...c.p, moduleSupplyCrankingV: 5 } }).action).toMatch(/^Improve the feed/);
    const after = ctxOf(moduleSetup(fixedDuty({ supplyMinV: 4, minCoilResistanceOhm: 0 }), { coil: ballastCoil(), ballast: ironBallast(), crankingBypass: true, moduleFeed: 'after-ballast' }));
    expect(crankingSupply(after).why).toBe('The module takes its supply after the ballast, so it sags every time the coil draws current.');
  });
  it('module supply maximum: title, figures and sentences', () => {
    const pts = moduleSupplyMax(ctxOf(pointsSetup()));
    expect(pts.title).toBe('Module supply against its maximum');
    expect(names(pts)).toEqual(['running supply']);
    expect(pts.why).toBe('Points and magnetos have no electronic supply limit.');
    const c = ctxOf(moduleSetup(fixedDuty()));
    const pass = moduleSupplyMax(c);
    expect(names(pass)).toEqual(['running (charging) supply', 'module maximum', 'caution from']);
    expect(pass.why).toContain('The running supply of 14.00 V is well within the module\'s maximum of 16.00 V.');
    expect(pass.why).toMatch(/^A module run above its maximum supply overheats/);
    const near = moduleSupplyMax({ ...c, p: { ...c.p, runningSupplyV: 15.5 } });
    expect(near.why).toContain('The running supply of 15.50 V is within 5 % of the module\'s maximum of 16.00 V.');
    expect(near.why).toMatch(/^A module run above/);
    expect(near.action).toMatch(/^Have the charging voltage checked/);
    const over = moduleSupplyMax({ ...c, p: { ...c.p, runningSupplyV: 17 } });
    expect(over.why).toContain('the supply is 17.00 V, above the module\'s maximum of 16.00 V.');
    expect(over.why).toMatch(/^A module run above/);
  });
  it('earth polarity and system voltage: titles and sentences', () => {
    const pts = earthPolarity(ctxOf(pointsSetup()));
    expect(pts.title).toBe('Earth polarity');
    expect(pts.figures).toEqual([]);
    expect(pts.why).toBe('Points and magnetos work with either earth polarity.');
    expect(pts.action).toBe('Nothing to do.');
    const wrong = earthPolarity(ctxOf(moduleSetup(fixedDuty()), { ...fourCylinder, earthPolarity: 'positive' }));
    expect(wrong.why).toMatch(/^Transistors conduct one way only/);
    expect(wrong.figures).toEqual([]);
    expect(wrong.action).toMatch(/^Choose a module for this earth polarity/);
    const both = earthPolarity(ctxOf(moduleSetup(fixedDuty({ earthPolarities: ['positive', 'negative'] })), { ...fourCylinder, earthPolarity: 'positive' }));
    expect(both.why).toMatch(/^Transistors conduct one way only/);
    expect(both.action).toBe('Nothing to do.');
    expect(both.figures).toEqual([]);
    const twelve = sixVolt(ctxOf(pointsSetup()));
    expect(twelve.title).toBe('System voltage');
    expect(names(twelve)).toEqual(['system voltage', 'coil rated for', 'running supply']);
    expect(twelve.why).toBe('A 12 V system: no 6 V limits apply.');
    const six = { ...fourCylinder, systemVoltageV: 6 as const };
    const fail = sixVolt(ctxOf(moduleSetup(fixedDuty({ supplyMinV: 8 })), six));
    expect(names(fail)).toEqual(['system voltage', 'coil rated for', 'running supply', 'module minimum']);
    expect(fail.why).toBe('The module needs more than a 6 V system gives even when charging.');
    expect(fail.action).toBe('Choose a module made for 6 V.');
    const big = sixVolt(ctxOf(pointsSetup(), six));
    expect(big.why).toBe('A 12 V coil on 6 V charges to about half its current and a quarter of its energy.');
    expect(big.action).toMatch(/^Use a 6 V coil/);
    const ok = sixVolt(ctxOf(pointsSetup({ coil: coil({ ratedVoltageV: 6 }) }), six));
    expect(ok.why).toBe('The parts suit a 6 V system.');
    expect(ok.action).toBe('Nothing to do.');
    const onTwelve = sixVolt(ctxOf(pointsSetup({ coil: coil({ ratedVoltageV: 6 }) })));
    expect(onTwelve.why).toMatch(/^A 6 V coil on 12 V carries about twice its design current/);
    expect(onTwelve.action).toMatch(/^Fit a ballast or a current-limited module/);
    const limited = sixVolt(ctxOf(moduleSetup(module(), { coil: coil({ ratedVoltageV: 6 }) })));
    expect(limited.action).toMatch(/^Choose a 12 V coil, or label the coil/);
    const mag = sixVolt(ctxOf(pointsSetup({ switching: 'magneto', magneto: { ratedCurrentA: 4, fullOutputRpm: 1500 } }), six));
    expect(mag.why).toBe('A magneto does not depend on the battery voltage.');
    expect(mag.verdict).toBe('pass');
  });
});

describe('coil polarity and total advance, in words', () => {
  it('coil polarity: the wiring to check on each earth, and the cost of reversing it', () => {
    const neg = coilPolarity(ctxOf(pointsSetup()));
    expect(neg.title).toBe('Coil polarity');
    expect(neg.verdict).toBe('pass');
    expect(names(neg)).toEqual(['worst reserve ratio']);
    expect(neg.figures[0]!.unit).toBe('');
    expect(neg.why).toBe('Wired for this earth polarity, the plug centre electrode fires negative, which needs the least voltage.');
    expect(neg.action).toBe('On negative earth, the coil terminal marked + (SW, 15) goes to the ignition feed and the one marked - (CB, 1) to the points or module.');
    const pos = coilPolarity(ctxOf(pointsSetup(), { ...fourCylinder, earthPolarity: 'positive' }));
    expect(pos.action).toBe('On positive earth, the coil terminal marked - (CB, 1) goes to the ignition feed and the one marked + (SW, 15) to the points or module (the reverse of the markings for negative earth).');
    const c = ctxOf(pointsSetup({ coilWiring: 'reversed' }), { ...fourCylinder, earthPolarity: 'positive' });
    const rev = coilPolarity({ ...c, worstRatio: 1.5 });
    expect(names(rev)).toEqual(['worst reserve ratio', 'extra voltage the plug needs']);
    expect(rev.figures[0]!.value).toBe(1.5);
    expect(rev.figures[1]!.unit).toBe('%');
    // 1 / 0.9 - 1 = 11 % (club technical literature, from memory).
    expect(rev.why).toBe("With the coil wired for the other earth the plug's centre electrode fires positive and needs about 11 % more voltage, eating into the reserve. The worst reserve ratio with this wiring is 1.50.");
    expect(rev.action).toMatch(/^Swap the two low-tension leads on the coil\. On positive earth, the coil terminal marked - \(CB, 1\)/);
  });
  it('total advance: figures in crank degrees and the sentence on each side of 60', () => {
    const pass = totalAdvance(ctxOf(pointsSetup()));
    expect(pass.title).toBe('Total advance');
    expect(names(pass)).toEqual(['static timing', 'total at full advance', 'most any engine uses (from memory)']);
    expect(pass.figures.map((f) => f.unit)).toEqual(['deg BTDC', 'deg BTDC', 'deg']);
    // 8 degrees static plus the curve's 24 at most: 32.
    expect(pass.figures.map((f) => f.value)).toEqual([8, 32, 60]);
    expect(pass.why).toBe('The spark timing sets the cylinder pressure at the spark, and so the voltage the plug needs. Static timing plus the advance curve come to 32 crank degrees.');
    expect(pass.action).toBe('Nothing to do.');
    const odd = { ...fourCylinder, staticTimingDegBtdc: 12, advanceCurve: [{ rpm: 1000, advanceDeg: 0 }, { rpm: 3000, advanceDeg: 52 }] };
    const caution = totalAdvance(ctxOf(pointsSetup(), odd));
    expect(caution.why).toBe('The spark timing sets the cylinder pressure at the spark, and so the voltage the plug needs. Static timing plus the advance curve come to 64 crank degrees, more than any engine uses, so the figures below are unreliable.');
    expect(caution.action).toMatch(/^Check the advance curve against the service data/);
    // The largest row counts wherever it sits in the curve.
    expect(totalAdvanceDeg(ctxOf(pointsSetup(), { ...fourCylinder, advanceCurve: [{ rpm: 1000, advanceDeg: 30 }, { rpm: 3000, advanceDeg: 10 }] }))).toBe(38);
    expect(totalAdvanceDeg(ctxOf(pointsSetup(), { ...fourCylinder, advanceCurve: [] }))).toBe(8);
  });
});

describe('the wiring rules, in words', () => {
  it('condenser: microfarads shown, and the sentence for points, an inductive module and a CD unit', () => {
    const ok = condenser(ctxOf(pointsSetup()));
    expect(ok.title).toBe('Condenser');
    expect(names(ok)).toEqual(['condenser']);
    // 0.22e-6 F shown as 0.22 uF.
    expect(ok.figures[0]!.value).toBeCloseTo(0.22, 12);
    expect(ok.figures[0]!.unit).toBe('uF');
    expect(ok.why).toMatch(/^The condenser across the points stops them arcing as they open/);
    expect(ok.action).toBe('Nothing to do.');
    const missing = condenser(ctxOf(pointsSetup({ condenserF: null })));
    expect(missing.why).toMatch(/^The condenser across the points/);
    expect(missing.action).toBe('Fit a condenser across the points (about 0.2 uF).');
    const odd = condenser(ctxOf(pointsSetup({ condenserF: 1e-6 })));
    expect(odd.why).toContain('This one is outside the usual 0.18 to 0.25 uF.');
    expect(odd.why).toMatch(/^The condenser across the points/);
    expect(odd.action).toBe('Fit a condenser of about 0.2 uF.');
    const left = condenser(ctxOf(moduleSetup(module(), { condenserF: 0.22e-6 })));
    expect(left.why).toMatch(/^A module switches the coil itself; a condenser left across the coil negative/);
    expect(left.action).toBe('Disconnect the condenser lead from the coil negative (or remove the condenser).');
    const cd = condenser(ctxOf(moduleSetup(cdModule(), { condenserF: 0.22e-6 })));
    expect(cd.why).toBe('A condenser across a CD coil primary swallows the discharge pulse.');
    const none = condenser(ctxOf(moduleSetup(module())));
    expect(none.why).toMatch(/^A module switches the coil itself/);
    expect(none.action).toBe('Make sure the old condenser is disconnected from the coil negative.');
  });
  it('suppressed leads and a complete setup: titles and sentences', () => {
    const plain = suppressedLeads(ctxOf(pointsSetup()));
    expect(plain.title).toBe('Suppressed leads');
    expect(names(plain)).toEqual(['lead resistance']);
    expect(plain.figures[0]!.unit).toBe('ohm');
    expect(plain.why).toBe('The module does not call for suppressed leads.');
    const needs = module({ needsSuppressedLeads: true });
    const copper = suppressedLeads(ctxOf(moduleSetup(needs, { leads: { name: 'Copper', core: 'copper', resistancePerLeadOhm: 0 } })));
    expect(copper.verdict).toBe('fail');
    expect(copper.why).toMatch(/^Spark interference can trigger the module falsely or damage it/);
    expect(copper.action).toBe('Fit suppressed leads or resistor plugs before running the engine with this module.');
    const none = suppressedLeads(ctxOf(moduleSetup(needs, { leads: null })));
    expect(none.figures).toEqual([]);
    expect(none.why).toMatch(/^Spark interference can trigger/);
    expect(none.action).toBe('Record the leads fitted; use suppressed leads or resistor plugs.');
    const good = suppressedLeads(ctxOf(moduleSetup(needs)));
    expect(good.why).toMatch(/^Spark interference can trigger/);
    expect(good.action).toBe('Nothing to do.');
    const complete = setupComplete(ctxOf(pointsSetup()));
    expect(complete.id).toBe('setup-complete');
    expect(complete.title).toBe('Setup complete');
    expect(complete.why).toBe('Every part the setup needs is described.');
    const broken = setupComplete(ctxOf(moduleSetup(module(), { module: null })));
    expect(broken.id).toBe('setup-complete');
    expect(broken.title).toBe('Setup complete');
    expect(broken.why).toMatch(/^The setup cannot be checked properly: A breakerless-current-limited setup needs a module; none is chosen\./);
    expect(broken.action).toMatch(/^Complete the missing part details/);
  });
});
