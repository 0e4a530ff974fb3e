/**
 * Each rule's limits, tried just inside and just outside (and at the limit itself, where the rule
 * says "above" or "below"), so a shifted or loosened threshold fails here. The rule sees a real
 * context (the checker's own session on an invented engine and parts), with the one figure the
 * limit reads set by hand; each limit is written out in the test with where it comes from.
 * Written against the mutation-testing survivors (npm run mutate).
 */
import { describe, expect, it } from 'vitest';
import { analyse, createSession } from '../../electron/checker/session.js';
import type { RuleContext } from '../../electron/checker/rules/context.js';
import { coilResistanceFloor, coilResistanceFloorFails, peakCurrent, peakCurrentFails, POINTS_FAIL_A, ballastPlan, ballastPlanFails } from '../../electron/checker/rules/resistance.js';
import { keyOnHeat, keyOnHeatFails, moduleHeat, moduleHeatFails, MODULE_COMFORT_W } from '../../electron/checker/rules/heat.js';
import { crankingSupply, crankingSupplyFails, moduleSupplyMax, moduleSupplyMaxFails, SUPPLY_MAX_CAUTION_FRACTION, earthPolarity, earthPolarityFails, sixVolt, sixVoltFails } from '../../electron/checker/rules/supply.js';
import { offTime, offTimeFails, OFF_TIME_FAIL_RATIO, plugGap, plugGapFails, sparkRate, sparkRateFails, voltageReserve, voltageReserveFails } from '../../electron/checker/rules/spark.js';
import { condenser, condenserFails, setupComplete, setupCompleteFails, suppressedLeads, suppressedLeadsFails } from '../../electron/checker/rules/wiring.js';
import { totalAdvance, totalAdvanceDeg, totalAdvanceFails, TOTAL_ADVANCE_MAX_DEG } from '../../electron/checker/rules/advance.js';
import { coilPolarity, coilPolarityFails } from '../../electron/checker/rules/polarity.js';
import type { EngineSpec, RuleResult, SetupSpec } from '../../electron/checker/index.js';
import { ballastCoil, cdModule, coil, fourCylinder, ironBallast, module, moduleSetup, pointsSetup } from './fixtures.js';

/** The rule context the checker builds for a setup (a short rpm grid keeps it quick). */
function ctxOf(setup: SetupSpec, engine: EngineSpec = fourCylinder): RuleContext {
  return analyse(createSession(engine, undefined, { rpmPoints: 24 }), setup, null, true).ctx;
}

/** A copy of the context with one sweep column replaced (every point `fill`, then `at` overrides). */
function withColumn(ctx: RuleContext, column: 'currentA' | 'moduleW' | 'offS' | 'durationS' | 'availableV' | 'requiredV', fill: number, at: Record<number, number> = {}): RuleContext {
  const a = new Float64Array(ctx.ws.n).fill(fill);
  for (const [i, v] of Object.entries(at)) a[Number(i)] = v;
  return { ...ctx, ws: { ...ctx.ws, [column]: a, noSpark: new Uint8Array(ctx.ws.n) } };
}

const figure = (r: RuleResult, name: string): number => {
  const f = r.figures.find((x) => x.name === name);
  if (!f) throw new Error(`no figure '${name}' in ${r.id}: ${r.figures.map((x) => x.name).join(', ')}`);
  return f.value;
};

const fixedDuty = (over = {}) => module({ name: 'Fixed duty', moduleType: 'breakerless-fixed-duty', currentLimitA: null, maxDutyFraction: null, fixedDutyFraction: 0.6, ...over });

describe('peak current against the module rating (fail above it, caution above 0.9 of it: within 10 %)', () => {
  const rating = 8; // the fixture module's maximum current
  const base = (): RuleContext => ctxOf(moduleSetup(fixedDuty({ maxCurrentA: rating })));
  const at = (peakA: number, keyOnA = 0): RuleContext => {
    const c = withColumn(base(), 'currentA', 0, { 3: peakA });
    return { ...c, keyOn: { ...c.keyOn, currentA: keyOnA } };
  };
  it('fails just above the rating and not at it', () => {
    expect(peakCurrent(at(rating * (1 + 1e-9))).verdict).toBe('fail');
    expect(peakCurrentFails(at(rating * (1 + 1e-9)))).toBe(true);
    expect(peakCurrent(at(rating)).verdict).toBe('caution');
    expect(peakCurrentFails(at(rating))).toBe(false);
  });
  it('cautions just above 0.9 of the rating and passes at it', () => {
    expect(peakCurrent(at(0.9 * rating * (1 + 1e-9))).verdict).toBe('caution');
    expect(peakCurrent(at(0.9 * rating)).verdict).toBe('pass');
  });
  it('judges the larger of the peak at break and the key-on current', () => {
    expect(peakCurrent(at(0, rating + 0.01)).verdict).toBe('fail');
    expect(peakCurrentFails(at(0, rating + 0.01))).toBe(true);
    expect(peakCurrent(at(rating + 0.01, 0)).verdict).toBe('fail');
    const r = peakCurrent(at(5, 1));
    expect(figure(r, 'peak current at break')).toBe(5);
    expect(figure(r, 'key-on current')).toBe(1);
    expect(figure(r, 'module rating')).toBe(rating);
    expect(figure(r, 'at rpm')).toBe(base().grid.rpm[3]);
  });
  it('names the figures and the advice in the failing and the caution sentence', () => {
    const fail = peakCurrent(at(9.5));
    expect(fail.why).toContain('9.50 A against a rating of 8.00 A');
    expect(fail.intents).toEqual(['ballast:add', 'coil-resistance:raise']);
    expect(fail.action).toMatch(/ballast/i);
    const caution = peakCurrent(at(7.5));
    expect(caution.why).toContain('within 10 %');
    expect(caution.intents).toEqual(['ballast:add']);
    expect(peakCurrent(at(1)).action).toBe('Nothing to do.');
  });
});

describe('points break current (fail above 7 A, caution above 5 A; from memory)', () => {
  const base = (): RuleContext => ctxOf(pointsSetup());
  const at = (peakA: number): RuleContext => withColumn(base(), 'currentA', 0, { 5: peakA });
  it('fails above 7 A, cautions from just above 5 A up to 7 A, passes at 5 A', () => {
    expect(POINTS_FAIL_A).toBe(7);
    expect(peakCurrent(at(7 + 1e-9)).verdict).toBe('fail');
    expect(peakCurrentFails(at(7 + 1e-9))).toBe(true);
    expect(peakCurrent(at(7)).verdict).toBe('caution');
    expect(peakCurrentFails(at(7))).toBe(false);
    expect(peakCurrent(at(5 + 1e-9)).verdict).toBe('caution');
    expect(peakCurrent(at(5)).verdict).toBe('pass');
  });
  it('reports the 5 A comfortable limit, the rpm of the peak and the advice', () => {
    const r = peakCurrent(at(7.5));
    expect(figure(r, 'points comfortable limit (from memory)')).toBe(5);
    expect(figure(r, 'at rpm')).toBe(base().grid.rpm[5]);
    expect(r.intents).toEqual(['ballast:add', 'coil-resistance:raise']);
    expect(peakCurrent(at(6)).action).toMatch(/transistor-assisted/);
    expect(peakCurrent(at(6)).why).toMatch(/about 5 A/);
  });
  it('never judges current on a CD module or a magneto', () => {
    const cd = withColumn(ctxOf(moduleSetup(cdModule())), 'currentA', 100);
    expect(peakCurrent(cd).verdict).toBe('pass');
    expect(peakCurrent(cd).why).toMatch(/capacitive-discharge/);
    expect(peakCurrentFails(cd)).toBe(false);
  });
});

describe('coil-resistance floor (fail below the module minimum, cold)', () => {
  // At the default 20 degC surroundings the copper law gives the cold coil its 20 degC value
  // exactly: R = R20 (1 + 0.00393 x 0).
  it('passes a 3 ohm coil on a floor of exactly 3 ohm, fails one a hair above', () => {
    const at = ctxOf(moduleSetup(fixedDuty({ minCoilResistanceOhm: 3 })));
    expect(at.p.coilColdOhm).toBe(3);
    expect(coilResistanceFloor(at).verdict).toBe('pass');
    expect(coilResistanceFloorFails(at)).toBe(false);
    const above = ctxOf(moduleSetup(fixedDuty({ minCoilResistanceOhm: 3 * (1 + 1e-9) })));
    expect(coilResistanceFloor(above).verdict).toBe('fail');
    expect(coilResistanceFloorFails(above)).toBe(true);
    expect(coilResistanceFloor(above).why).toContain('3.00 ohm cold against a minimum of 3.00 ohm');
    expect(coilResistanceFloor(above).intents).toEqual(['ballast:add', 'coil-resistance:raise']);
  });
  it('counts the cold ballast: 1.5 + 1.5 ohm meets a 3 ohm floor, and the caution says the ballast carries it', () => {
    const c = ctxOf(moduleSetup(fixedDuty({ minCoilResistanceOhm: 3 }), { coil: ballastCoil(), ballast: ironBallast(), crankingBypass: false }));
    expect(c.p.coilColdOhm + c.p.ballastColdOhm).toBe(3);
    const r = coilResistanceFloor(c);
    expect(r.verdict).toBe('caution');
    expect(r.intents).toEqual(['ballast:keep']);
    expect(r.why).toContain('1.50 ohm');
    expect(coilResistanceFloorFails(c)).toBe(false);
    expect(figure(r, 'coil and ballast, cold')).toBe(3);
    expect(figure(r, 'while cranking')).toBe(3);
    expect(figure(r, 'module minimum')).toBe(3);
  });
  it('cautions the bypass that takes the cranking circuit under the floor, with the cranking resistance', () => {
    const c = ctxOf(moduleSetup(fixedDuty({ minCoilResistanceOhm: 2.5 }), { coil: ballastCoil(), ballast: ironBallast(), crankingBypass: true }));
    const r = coilResistanceFloor(c);
    expect(r.verdict).toBe('caution');
    expect(r.intents).toEqual(['bypass:remove']);
    expect(figure(r, 'while cranking')).toBe(1.5);
    expect(r.why).toContain('leaving 1.50 ohm');
    // With a ballast the failing advice is the coil, not another ballast.
    const low = ctxOf(moduleSetup(fixedDuty({ minCoilResistanceOhm: 3.2 }), { coil: ballastCoil(), ballast: ironBallast() }));
    expect(coilResistanceFloor(low).verdict).toBe('fail');
    expect(coilResistanceFloor(low).intents).toEqual(['coil-resistance:raise']);
  });
  it('has no floor on points, on a CD module, or where the module gives none', () => {
    expect(coilResistanceFloor(ctxOf(pointsSetup({ coil: ballastCoil() }))).verdict).toBe('pass');
    expect(coilResistanceFloorFails(ctxOf(moduleSetup(cdModule({ minCoilResistanceOhm: 100 }))))).toBe(false);
    expect(coilResistanceFloor(ctxOf(moduleSetup(cdModule({ minCoilResistanceOhm: 100 })))).verdict).toBe('pass');
    expect(coilResistanceFloor(ctxOf(moduleSetup(fixedDuty({ minCoilResistanceOhm: 0 }), { coil: ballastCoil() }))).verdict).toBe('pass');
  });
});

describe('ballast plan', () => {
  it('fails a 6 V coil on a 12 V car with points and no ballast; passes it on a 6 V car', () => {
    const six = coil({ ratedVoltageV: 6 });
    expect(ballastPlanFails(ctxOf(pointsSetup({ coil: six })))).toBe(true);
    expect(ballastPlan(ctxOf(pointsSetup({ coil: six }))).verdict).toBe('fail');
    expect(ballastPlan(ctxOf(pointsSetup({ coil: six }))).intents).toEqual(['ballast:add']);
    const sixCar = { ...fourCylinder, systemVoltageV: 6 as const };
    expect(ballastPlanFails(ctxOf(pointsSetup({ coil: six }), sixCar))).toBe(false);
    expect(ballastPlan(ctxOf(pointsSetup({ coil: six }), sixCar)).verdict).toBe('pass');
  });
  it('keeps the ballast on a current-limited module when the coil alone is under its floor', () => {
    const c = ctxOf(moduleSetup(module({ minCoilResistanceOhm: 2 }), { coil: ballastCoil(), ballast: ironBallast() }));
    expect(ballastPlan(c).verdict).toBe('pass');
    expect(ballastPlan(c).action).toBe('Keep the ballast in circuit.');
    // Coil exactly at the floor: the limiter makes the ballast unnecessary.
    const at = ctxOf(moduleSetup(module({ minCoilResistanceOhm: 1.5 }), { coil: ballastCoil(), ballast: ironBallast() }));
    expect(at.p.coilColdOhm).toBe(1.5);
    expect(ballastPlan(at).verdict).toBe('caution');
    expect(ballastPlan(at).intents).toEqual(['ballast:remove']);
    expect(ballastPlanFails(ctxOf(moduleSetup(module(), { coil: ballastCoil() })))).toBe(false);
  });
  it('asks for a cranking bypass with the ballast, and removes a ballast in front of a full-voltage coil', () => {
    const noBypass = ballastPlan(ctxOf(pointsSetup({ coil: ballastCoil(), ballast: ironBallast() })));
    expect(noBypass.intents).toEqual(['ballast:keep', 'bypass:add']);
    const full = ballastPlan(ctxOf(pointsSetup({ ballast: ironBallast() })));
    expect(full.intents).toEqual(['ballast:remove']);
    const good = ballastPlan(ctxOf(pointsSetup({ coil: ballastCoil(), ballast: ironBallast(), crankingBypass: true })));
    expect(good.action).toBe('Keep the ballast and the cranking bypass.');
    expect(ballastPlan(ctxOf(pointsSetup())).action).toBe('Nothing to do.');
    const cd = ballastPlan(ctxOf(moduleSetup(cdModule(), { ballast: ironBallast() })));
    expect(cd.intents).toEqual(['ballast:remove']);
    expect(ballastPlanFails(ctxOf(moduleSetup(cdModule(), { coil: ballastCoil() })))).toBe(false);
  });
});

describe('key-on heat (fail above the coil limit or twice the 15 W module comfort, caution above half the coil limit or above 15 W)', () => {
  // The coil limit is the coil's own rating, else the 80 W default (from memory).
  const base = (): RuleContext => ctxOf(moduleSetup(fixedDuty({ stallShutOff: false })));
  const on = (coilW: number, moduleW = 0, ctx = base()): RuleContext => ({ ...ctx, keyOn: { currentFlows: true, currentA: 4, coilDissipationW: coilW, ballastDissipationW: 0, moduleDissipationW: moduleW } });
  it('fails just above 80 W in the coil and not at 80 W', () => {
    expect(keyOnHeat(on(80 * (1 + 1e-9))).verdict).toBe('fail');
    expect(keyOnHeatFails(on(80 * (1 + 1e-9)))).toBe(true);
    expect(keyOnHeat(on(80)).verdict).toBe('caution');
    expect(keyOnHeatFails(on(80))).toBe(false);
    expect(figure(keyOnHeat(on(80)), 'coil limit')).toBe(80);
  });
  it('warns "do not leave the key on" just above half the limit (40 W), and only mildly at 40 W', () => {
    expect(keyOnHeat(on(40 * (1 + 1e-9))).action).toMatch(/^Do not leave the key on/);
    expect(keyOnHeat(on(40)).action).toBe('Switch off when the engine stops.');
    expect(keyOnHeat(on(40)).verdict).toBe('caution');
  });
  it('fails a module above 2 x 15 W = 30 W, warns above 15 W', () => {
    expect(MODULE_COMFORT_W).toBe(15);
    expect(keyOnHeat(on(0, 30 * (1 + 1e-9))).verdict).toBe('fail');
    expect(keyOnHeatFails(on(0, 30 * (1 + 1e-9)))).toBe(true);
    expect(keyOnHeat(on(0, 30)).verdict).toBe('caution');
    expect(keyOnHeatFails(on(0, 30))).toBe(false);
    expect(keyOnHeat(on(0, 30)).action).toMatch(/^Do not leave the key on/);
    expect(keyOnHeat(on(0, 15 * (1 + 1e-9))).action).toMatch(/^Do not leave the key on/);
    expect(keyOnHeat(on(0, 15)).action).toBe('Switch off when the engine stops.');
  });
  it('sets no module limit on points, and uses the coil\'s own rating when it has one', () => {
    const points = ctxOf(pointsSetup());
    expect(keyOnHeat(on(0, 1000, points)).verdict).toBe('caution');
    expect(keyOnHeatFails(on(0, 1000, points))).toBe(false);
    const rated = ctxOf(pointsSetup({ coil: coil({ maxDissipationW: 20 }) }));
    expect(keyOnHeat(on(20.5, 0, rated)).verdict).toBe('fail');
    expect(figure(keyOnHeat(on(20.5, 0, rated)), 'coil limit')).toBe(20);
    expect(keyOnHeat(on(20.5, 0, rated)).why).toContain('21 W against about 20 W');
  });
  it('passes when no current flows, whatever the figures say', () => {
    const off = { ...on(500, 500), keyOn: { currentFlows: false, currentA: 0, coilDissipationW: 500, ballastDissipationW: 0, moduleDissipationW: 500 } };
    expect(keyOnHeat(off).verdict).toBe('pass');
    expect(keyOnHeatFails(off)).toBe(false);
  });
});

describe('module heat while running (fail above 30 W, caution above 15 W)', () => {
  const base = (): RuleContext => ctxOf(moduleSetup(module()));
  const at = (w: number, i = 4): RuleContext => withColumn(base(), 'moduleW', 0, { [i]: w });
  it('judges the highest dissipation against 2 x 15 W and 15 W, strictly above', () => {
    expect(moduleHeat(at(30 * (1 + 1e-9))).verdict).toBe('fail');
    expect(moduleHeatFails(at(30 * (1 + 1e-9)))).toBe(true);
    expect(moduleHeat(at(30)).verdict).toBe('caution');
    expect(moduleHeatFails(at(30))).toBe(false);
    expect(moduleHeat(at(15 * (1 + 1e-9))).verdict).toBe('caution');
    expect(moduleHeat(at(15)).verdict).toBe('pass');
  });
  it('finds the peak at the last point too, and says where', () => {
    const last = base().ws.n - 1;
    const r = moduleHeat(at(31, last));
    expect(r.verdict).toBe('fail');
    expect(figure(r, 'at rpm')).toBe(base().grid.rpm[last]);
    expect(r.why).toContain('31.0 W');
    expect(r.intents).toEqual(['ballast:add', 'coil-resistance:raise']);
  });
  it('has nothing to judge without a module', () => {
    const points = withColumn(ctxOf(pointsSetup()), 'moduleW', 100);
    expect(moduleHeat(points).verdict).toBe('pass');
    expect(moduleHeat(points).figures).toEqual([]);
    expect(moduleHeatFails(points)).toBe(false);
  });
});

describe('module supply while cranking (fail below its minimum, caution under 5 % above it)', () => {
  const min = 6; // the fixture module's minimum supply
  const base = (): RuleContext => ctxOf(moduleSetup(fixedDuty({ supplyMinV: min })));
  const at = (v: number, ctx = base()): RuleContext => ({ ...ctx, p: { ...ctx.p, moduleSupplyCrankingV: v } });
  it('fails just below the minimum and not at it', () => {
    expect(crankingSupply(at(min * (1 - 1e-9))).verdict).toBe('fail');
    expect(crankingSupplyFails(at(min * (1 - 1e-9)))).toBe(true);
    expect(crankingSupply(at(min)).verdict).toBe('caution');
    expect(crankingSupplyFails(at(min))).toBe(false);
  });
  it('cautions just under 1.05 x the minimum and passes at it', () => {
    expect(crankingSupply(at(1.05 * min * (1 - 1e-9))).verdict).toBe('caution');
    expect(crankingSupply(at(1.05 * min * (1 - 1e-9))).why).toContain('under 5 %');
    expect(crankingSupply(at(1.05 * min)).verdict).toBe('pass');
  });
  it('names the figures and tells a module fed after the ballast to move its feed', () => {
    const r = crankingSupply(at(5));
    expect(r.why).toContain('5.00 V against a minimum of 6.00 V');
    expect(figure(r, 'module minimum')).toBe(min);
    expect(figure(r, 'module sees while cranking')).toBe(5);
    const after = ctxOf(moduleSetup(fixedDuty({ supplyMinV: min, minCoilResistanceOhm: 0 }), { coil: ballastCoil(), ballast: ironBallast(), moduleFeed: 'after-ballast' }));
    expect(crankingSupply(at(5, after)).action).toMatch(/terminal 15/);
    expect(crankingSupply(at(9, after)).verdict).toBe('caution');
    expect(crankingSupply(at(9, after)).action).toMatch(/terminal 15, before the ballast/);
  });
  it('does not apply to points', () => {
    expect(crankingSupply(ctxOf(pointsSetup())).verdict).toBe('pass');
    expect(crankingSupplyFails(ctxOf(pointsSetup()))).toBe(false);
  });
});

describe('module supply against its maximum (fail above it, caution above 0.95 of it)', () => {
  const max = 16; // the fixture module's maximum supply
  const base = (): RuleContext => ctxOf(moduleSetup(fixedDuty({ supplyMaxV: max })));
  const at = (v: number): RuleContext => ({ ...base(), p: { ...base().p, runningSupplyV: v } });
  it('fails just above the maximum and not at it', () => {
    expect(SUPPLY_MAX_CAUTION_FRACTION).toBe(0.95);
    expect(moduleSupplyMax(at(max * (1 + 1e-9))).verdict).toBe('fail');
    expect(moduleSupplyMaxFails(at(max * (1 + 1e-9)))).toBe(true);
    expect(moduleSupplyMax(at(max)).verdict).toBe('caution');
    expect(moduleSupplyMaxFails(at(max))).toBe(false);
  });
  it('cautions just above 0.95 x 16 = 15.2 V and passes at it', () => {
    expect(moduleSupplyMax(at(0.95 * max * (1 + 1e-9))).verdict).toBe('caution');
    expect(moduleSupplyMax(at(0.95 * max)).verdict).toBe('pass');
    expect(figure(moduleSupplyMax(at(14)), 'caution from')).toBeCloseTo(15.2, 12);
  });
  it('names the car\'s system voltage in the advice', () => {
    expect(moduleSupplyMax(at(17)).action).toContain("this car's 12 V system");
    expect(moduleSupplyMax(at(17)).action).toContain('above 17.0 V');
  });
});

describe('earth polarity and six volt', () => {
  it('fails a negative-earth module on a positive-earth car and says both', () => {
    const c = ctxOf(moduleSetup(fixedDuty()), { ...fourCylinder, earthPolarity: 'positive' });
    expect(earthPolarityFails(c)).toBe(true);
    expect(earthPolarity(c).why).toContain('This car is positive earth and the module supports negative earth only.');
    const both = ctxOf(moduleSetup(fixedDuty({ earthPolarities: ['negative', 'positive'] })), { ...fourCylinder, earthPolarity: 'positive' });
    expect(earthPolarityFails(both)).toBe(false);
    expect(earthPolarity(both).why).toContain('supports positive earth');
    expect(earthPolarityFails(ctxOf(pointsSetup(), { ...fourCylinder, earthPolarity: 'positive' }))).toBe(false);
  });
  it('fails a module needing more than a 6 V car gives (7.2 V charging, from memory), passes one that needs 7.2 V', () => {
    const six = { ...fourCylinder, systemVoltageV: 6 as const };
    const needs = (v: number) => ctxOf(moduleSetup(fixedDuty({ supplyMinV: v })), six);
    expect(needs(7.2).p.runningSupplyV).toBe(7.2);
    expect(sixVolt(needs(7.2 * (1 + 1e-9))).verdict).toBe('fail');
    expect(sixVoltFails(needs(7.2 * (1 + 1e-9)))).toBe(true);
    expect(sixVolt(needs(7.2)).verdict).toBe('caution'); // a 12 V coil on 6 V
    expect(sixVoltFails(needs(7.2))).toBe(false);
    expect(sixVolt(ctxOf(pointsSetup({ coil: coil({ ratedVoltageV: 6 }) }), six)).verdict).toBe('pass');
    // The same module on a 12 V car is not this rule's business.
    expect(sixVoltFails(ctxOf(moduleSetup(fixedDuty({ supplyMinV: 13 }))))).toBe(false);
  });
  it('cautions a 6 V coil on 12 V without a ballast, differently behind a current-limited module, and passes it behind a ballast', () => {
    const six = coil({ ratedVoltageV: 6 });
    const points = sixVolt(ctxOf(pointsSetup({ coil: six })));
    expect(points.verdict).toBe('caution');
    expect(points.intents).toEqual(['ballast:add']);
    const limited = sixVolt(ctxOf(moduleSetup(module(), { coil: six })));
    expect(limited.verdict).toBe('caution');
    expect(limited.why).toMatch(/only because the module limits the current/);
    expect(sixVolt(ctxOf(pointsSetup({ coil: six, ballast: ironBallast() }))).verdict).toBe('pass');
    expect(sixVolt(ctxOf(moduleSetup(cdModule(), { coil: six }))).verdict).toBe('pass');
  });
});

describe('voltage reserve (fail below 1, caution below the 1.25 margin, common practice)', () => {
  const base = (): RuleContext => ctxOf(pointsSetup());
  const at = (ratio: number, index = 5): RuleContext => ({ ...withColumn(base(), 'availableV', 20_000), worstRatio: ratio, worstIndex: index });
  it('fails just below 1, cautions at 1 and just below 1.25, passes at 1.25', () => {
    expect(base().margin).toBe(1.25);
    expect(voltageReserve(at(1 - 1e-9)).verdict).toBe('fail');
    expect(voltageReserveFails(at(1 - 1e-9))).toBe(true);
    expect(voltageReserve(at(1)).verdict).toBe('caution');
    expect(voltageReserveFails(at(1))).toBe(false);
    expect(voltageReserve(at(1.25 * (1 - 1e-9))).verdict).toBe('caution');
    expect(voltageReserve(at(1.25)).verdict).toBe('pass');
  });
  it('says "while cranking" at the first point and the rpm elsewhere', () => {
    expect(voltageReserve(at(0.5, 0)).why).toContain('while cranking');
    expect(voltageReserve(at(0.5, 5)).why).toContain(`at ${base().grid.rpm[5]!.toFixed(0)} rpm`);
    expect(voltageReserve(at(1.1, 5)).why).toContain('the reserve ratio is 1.10, under the 1.25 margin');
    expect(voltageReserve(at(0.5)).intents).toEqual(['gap:close']);
    expect(figure(voltageReserve(at(0.5)), 'available there')).toBe(20);
  });
});

describe('spark rate at redline (fail above the module limit, caution above 0.9 of it)', () => {
  // Four-stroke: rpm x cylinders / 120 sparks a second. 6750 rpm x 4 / 120 = 225 Hz = 0.9 x 250 Hz.
  const engine = { ...fourCylinder, redlineRpm: 6750 };
  const rate = (6750 * 4) / 120;
  const at = (limitHz: number) => ctxOf(moduleSetup(fixedDuty({ maxSparkRateHz: limitHz })), engine);
  it('passes a 250 Hz module at 225 Hz (exactly 0.9 of it), cautions a hair under 250 Hz', () => {
    expect(rate).toBe(225);
    expect(figure(sparkRate(at(250)), 'spark rate at redline')).toBe(225);
    expect(sparkRate(at(250)).verdict).toBe('pass');
    expect(sparkRate(at(250 * (1 - 1e-9))).verdict).toBe('caution');
  });
  it('fails just under 225 Hz and not at it', () => {
    expect(sparkRate(at(225)).verdict).toBe('caution');
    expect(sparkRateFails(at(225))).toBe(false);
    expect(sparkRate(at(225 * (1 - 1e-9))).verdict).toBe('fail');
    expect(sparkRateFails(at(225 * (1 - 1e-9)))).toBe(true);
    expect(sparkRate(at(200)).why).toContain('225 sparks a second against a limit of 200');
  });
  it('counts a two-stroke\'s sparks at rpm x cylinders / 60', () => {
    const two = { ...fourCylinder, cycle: 'two-stroke' as const, cylinders: 2, redlineRpm: 6000 };
    // 6000 x 2 / 60 = 200 Hz.
    expect(figure(sparkRate(ctxOf(moduleSetup(fixedDuty({ maxSparkRateHz: 1000 })), two)), 'spark rate at redline')).toBe(200);
    expect(sparkRateFails(ctxOf(moduleSetup(fixedDuty({ maxSparkRateHz: 199 })), two))).toBe(true);
  });
  it('cautions points that float below redline, not at redline', () => {
    const float = (rpm: number) => sparkRate(ctxOf(pointsSetup(), { ...fourCylinder, pointsFloatRpm: rpm }));
    expect(float(5999).verdict).toBe('caution');
    expect(figure(float(5999), 'points float from')).toBe(5999);
    expect(float(6000).verdict).toBe('pass');
    expect(sparkRateFails(ctxOf(pointsSetup()))).toBe(false);
  });
});

describe('off time against the spark duration (fail below 0.3, caution below 1; our limits)', () => {
  const base = (): RuleContext => ctxOf(moduleSetup(fixedDuty()));
  // Every point: 1 s off, 1 s of spark (ratio 1); one point changed.
  const at = (offS: number, i = 5, ctx = base()): RuleContext => {
    const c = withColumn(ctx, 'durationS', 1);
    return withColumn(c, 'offS', 1, { [i]: offS });
  };
  it('fails just below 0.3, cautions at 0.3 and just below 1, passes at 1', () => {
    expect(OFF_TIME_FAIL_RATIO).toBe(0.3);
    expect(offTime(at(0.3 * (1 - 1e-9))).verdict).toBe('fail');
    expect(offTimeFails(at(0.3 * (1 - 1e-9)))).toBe(true);
    expect(offTime(at(0.3)).verdict).toBe('caution');
    expect(offTimeFails(at(0.3))).toBe(false);
    expect(offTime(at(1 - 1e-9)).verdict).toBe('caution');
    expect(offTime(at(1)).verdict).toBe('pass');
  });
  it('looks from the cranking point to redline, and no further', () => {
    expect(offTime(at(0.1, 0)).verdict).toBe('fail');
    expect(offTime(at(0.1, base().redlineIndex)).verdict).toBe('fail');
    if (base().redlineIndex + 1 < base().ws.n) expect(offTime(at(0.1, base().redlineIndex + 1)).verdict).toBe('pass');
    const r = offTime(at(0.2, 7));
    expect(figure(r, 'least off time / spark duration')).toBeCloseTo(0.2, 12);
    expect(figure(r, 'at rpm')).toBe(base().grid.rpm[7]);
    expect(figure(r, 'off time there')).toBeCloseTo(200, 9);
    expect(figure(r, 'spark duration there')).toBe(1000);
  });
  it('skips points without a spark, and words the advice for the system', () => {
    const none = withColumn(base(), 'durationS', 0);
    expect(offTime(none).verdict).toBe('pass');
    expect(offTime(none).figures).toEqual([]);
    expect(offTimeFails(none)).toBe(false);
    expect(offTime(at(0.1)).action).toMatch(/^Choose a module with a lower fixed duty/);
    expect(offTime(at(0.5)).action).toContain('a module with a lower fixed duty would cure it');
    expect(offTime(at(0.1, 5, ctxOf(moduleSetup(module())))).action).toMatch(/^Choose a module with a lower maximum duty/);
    expect(offTime(at(0.5, 5, ctxOf(moduleSetup(module())))).action).toContain('a lower maximum duty would cure it');
    expect(offTime(at(0.1, 5, ctxOf(pointsSetup()))).action).toMatch(/^Set the dwell at the low end/);
    expect(offTime(at(0.5, 5, ctxOf(pointsSetup()))).action).toContain('a slightly smaller dwell');
    expect(offTime(at(0.1)).intents).toEqual(['dwell:shorter']);
    const cd = at(0.1, 5, ctxOf(moduleSetup(cdModule())));
    expect(offTime(cd).verdict).toBe('pass');
    expect(offTimeFails(cd)).toBe(false);
  });
});

describe('plug gap against the plug\'s range (0.1 % either side allowed) and the suggestion', () => {
  const base = (): RuleContext => ctxOf(pointsSetup());
  const plug = pointsSetup().plug!; // 0.5 to 1.1 mm
  const suggestion = { suggestedGapM: 1.0e-3, searchedFromM: plug.gapMinM, searchedToM: plug.gapMaxM, marginRatio: 1.25 };
  const at = (gapM: number, gap: typeof suggestion | null = suggestion): RuleContext => ({ ...base(), setup: { ...base().setup, plugGapM: gapM }, gap });
  it('cautions a gap under 0.999 x the smallest, not one at it', () => {
    expect(plugGap(at(plug.gapMinM * 0.999 * (1 - 1e-9))).verdict).toBe('caution');
    expect(plugGap(at(plug.gapMinM * 0.999 * (1 - 1e-9))).intents).toEqual(['gap:widen']);
    expect(plugGap(at(plug.gapMinM * 0.999)).verdict).toBe('pass');
  });
  it('cautions a gap over 1.001 x the largest, not one at it', () => {
    const wide = { ...suggestion, suggestedGapM: 2e-3 };
    expect(plugGap(at(plug.gapMaxM * 1.001 * (1 + 1e-9), wide)).verdict).toBe('caution');
    expect(plugGap(at(plug.gapMaxM * 1.001 * (1 + 1e-9), wide)).action).toContain('at most 1.10 mm');
    expect(plugGap(at(plug.gapMaxM * 1.001, wide)).verdict).toBe('pass');
  });
  it('cautions a gap over 1.001 x the suggested one, not at it', () => {
    expect(plugGap(at(1.0e-3 * 1.001 * (1 + 1e-9))).verdict).toBe('caution');
    expect(plugGap(at(1.0e-3 * 1.001 * (1 + 1e-9))).action).toBe('Close the gap to 1.00 mm.');
    expect(plugGap(at(1.0e-3 * 1.001)).verdict).toBe('pass');
    expect(plugGap(at(0.8e-3)).action).toContain('up to 1.00 mm would too');
    expect(figure(plugGap(at(0.8e-3)), 'suggested gap')).toBeCloseTo(1.0, 12);
    expect(figure(plugGap(at(0.8e-3)), 'plug range from')).toBeCloseTo(0.5, 12);
  });
  it('says when no gap meets the margin, and when nothing was computed; never fails', () => {
    const none = plugGap(at(0.8e-3, { ...suggestion, suggestedGapM: null } as never));
    expect(none.verdict).toBe('caution');
    expect(none.why).toContain('No gap from 0.50 to 1.10 mm meets the 1.25 margin');
    expect(plugGap(at(0.8e-3, null)).action).toBe('No gap suggestion was computed.');
    expect(plugGapFails(at(5e-3))).toBe(false);
  });
});

describe('condenser (points: 0.12 to 0.4 uF accepted; the usual 0.18 to 0.25 uF, from memory)', () => {
  const points = (uF: number | null) => ctxOf(pointsSetup({ condenserF: uF === null ? null : uF * 1e-6 }));
  it('accepts 0.12 uF and cautions just under it; cautions just over 0.4 uF', () => {
    expect(condenser(points(0.12)).verdict).toBe('pass');
    expect(condenser(points(0.12 * (1 - 1e-9))).verdict).toBe('caution');
    expect(condenser(points(0.4 * (1 - 1e-9))).verdict).toBe('pass');
    expect(condenser(points(0.4 * (1 + 1e-6))).verdict).toBe('caution');
  });
  it('fails points without one, a CD coil with one, and cautions one left on an inductive module', () => {
    expect(condenser(points(null)).verdict).toBe('fail');
    expect(condenserFails(points(null))).toBe(true);
    expect(condenser(points(null)).intents).toEqual(['condenser:fit']);
    const cd = ctxOf(moduleSetup(cdModule(), { condenserF: 0.22e-6 }));
    expect(condenser(cd).verdict).toBe('fail');
    expect(condenserFails(cd)).toBe(true);
    const ind = ctxOf(moduleSetup(module(), { condenserF: 0.22e-6 }));
    expect(condenser(ind).verdict).toBe('caution');
    expect(condenserFails(ind)).toBe(false);
    expect(condenser(ind).intents).toEqual(['condenser:remove']);
    expect(condenser(ctxOf(moduleSetup(module()))).verdict).toBe('pass');
    expect(condenserFails(ctxOf(moduleSetup(cdModule())))).toBe(false);
  });
});

describe('suppressed leads (a resistive or spiral core, or at least 1 kohm a lead: common practice)', () => {
  const needs = fixedDuty({ needsSuppressedLeads: true });
  const leads = (core: 'copper' | 'carbon' | 'spiral', ohm: number, resistorPlug = false) =>
    ctxOf(moduleSetup(needs, { leads: { name: 'Leads', core, resistancePerLeadOhm: ohm }, plug: { name: 'Plug', resistor: resistorPlug, resistorOhm: resistorPlug ? 5000 : 0, gapMinM: 0.5e-3, gapMaxM: 1.1e-3 } }));
  it('accepts copper leads of 1000 ohm and fails 999 ohm', () => {
    expect(suppressedLeads(leads('copper', 1000)).verdict).toBe('pass');
    expect(suppressedLeadsFails(leads('copper', 1000))).toBe(false);
    expect(suppressedLeads(leads('copper', 999)).verdict).toBe('fail');
    expect(suppressedLeadsFails(leads('copper', 999))).toBe(true);
  });
  it('accepts a spiral core of any resistance and resistor plugs with copper leads', () => {
    expect(suppressedLeads(leads('spiral', 0)).verdict).toBe('pass');
    expect(suppressedLeads(leads('copper', 0, true)).verdict).toBe('pass');
    expect(suppressedLeadsFails(leads('copper', 0, true))).toBe(false);
  });
  it('asks for a record of the leads when none is given, unless resistor plugs are fitted', () => {
    const none = ctxOf(moduleSetup(needs, { leads: null }));
    expect(suppressedLeads(none).verdict).toBe('caution');
    expect(suppressedLeadsFails(none)).toBe(false);
    const plugs = ctxOf(moduleSetup(needs, { leads: null, plug: { name: 'Plug', resistor: true, resistorOhm: 5000, gapMinM: 0.5e-3, gapMaxM: 1.1e-3 } }));
    expect(suppressedLeads(plugs).verdict).toBe('pass');
    expect(suppressedLeads(plugs).action).toMatch(/Resistor plugs/);
    expect(suppressedLeads(ctxOf(moduleSetup(fixedDuty(), { leads: { name: 'Copper', core: 'copper', resistancePerLeadOhm: 0 } }))).verdict).toBe('pass');
  });
});

describe('total advance (caution above 60 crank degrees, from memory) and coil polarity', () => {
  it('passes exactly 60 degrees in all and cautions 60 and a little', () => {
    const curve = (most: number) => ({ ...fourCylinder, staticTimingDegBtdc: 10, advanceCurve: [{ rpm: 1000, advanceDeg: -4 }, { rpm: 3000, advanceDeg: most }, { rpm: 4000, advanceDeg: most - 5 }] });
    expect(TOTAL_ADVANCE_MAX_DEG).toBe(60);
    expect(totalAdvanceDeg(ctxOf(pointsSetup(), curve(50)))).toBe(60);
    expect(totalAdvance(ctxOf(pointsSetup(), curve(50))).verdict).toBe('pass');
    expect(totalAdvance(ctxOf(pointsSetup(), curve(50.5))).verdict).toBe('caution');
    expect(totalAdvanceFails(ctxOf(pointsSetup(), curve(80)))).toBe(false);
    // A curve that only retards adds nothing: the total is the static timing.
    expect(totalAdvanceDeg(ctxOf(pointsSetup(), { ...fourCylinder, advanceCurve: [{ rpm: 1000, advanceDeg: -3 }] }))).toBe(8);
  });
  it('fails a reversed coil only where the reserve is short of the margin, and tells which lead goes where', () => {
    const c = ctxOf(pointsSetup({ coilWiring: 'reversed' }));
    const short = { ...c, worstRatio: 1.25 * (1 - 1e-9) };
    const enough = { ...c, worstRatio: 1.25 };
    expect(coilPolarity(short).verdict).toBe('fail');
    expect(coilPolarityFails(short)).toBe(true);
    expect(coilPolarity(enough).verdict).toBe('caution');
    expect(coilPolarityFails(enough)).toBe(false);
    // 1 / 0.9 - 1 = 11.1 % more voltage (club technical literature, from memory).
    expect(figure(coilPolarity(enough), 'extra voltage the plug needs')).toBeCloseTo((1 / 0.9 - 1) * 100, 9);
    expect(coilPolarity(enough).action).toMatch(/^Swap the two low-tension leads on the coil\. On negative earth/);
    const pos = ctxOf(pointsSetup(), { ...fourCylinder, earthPolarity: 'positive' });
    expect(coilPolarity(pos).action).toMatch(/^On positive earth, the coil terminal marked - \(CB, 1\) goes to the ignition feed/);
    expect(coilPolarityFails({ ...ctxOf(pointsSetup()), worstRatio: 0.5 })).toBe(false);
  });
  it('fails an incomplete setup and lists why', () => {
    const c = ctxOf(pointsSetup({ coil: coil({ primaryInductanceH: 0 }) }));
    expect(setupCompleteFails(c)).toBe(true);
    expect(setupComplete(c).why).toContain('The coil primary inductance is missing or not a positive number; 0.008 was assumed.');
    expect(setupCompleteFails(ctxOf(pointsSetup()))).toBe(false);
    expect(setupComplete(ctxOf(pointsSetup())).verdict).toBe('pass');
  });
});
