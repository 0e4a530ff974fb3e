/**
 * Rules about the primary circuit's resistance and current: the module's coil-resistance floor,
 * peak current against its rating, and what to do with the ballast.
 */
import { fig, fmt, isModuleKind, maxOver, result, type FailTest, type Rule, type RuleContext } from './context.js';

/** Points break current that fails: they pit fast above about 5 A, and 7 A is well past it (from memory). */
export const POINTS_FAIL_A = 7;

/**
 * A switching transistor is rated for a minimum load resistance: below it the current at key-on or
 * at low rpm exceeds what the transistor survives. The cold coil is the lowest resistance it meets.
 */
/** The module's coil-resistance floor, or null where none applies (points, CD, no floor given). */
function floorOf(ctx: RuleContext): number | null {
  const m = ctx.setup.module;
  if (!isModuleKind(ctx) || !m || !(m.minCoilResistanceOhm > 0) || ctx.p.kind === 'capacitive-discharge') return null;
  return m.minCoilResistanceOhm;
}

export const coilResistanceFloor: Rule = (ctx) => {
  const { p, setup } = ctx;
  const id = 'coil-resistance-floor';
  const title = 'Coil resistance against the module minimum';
  const floor = floorOf(ctx);
  if (floor === null) {
    return result(id, title, 'pass', [fig('coil primary, cold', p.coilColdOhm, 'ohm')], 'Points and capacitive-discharge systems have no coil-resistance floor.', 'Nothing to do.');
  }
  const hasBallast = setup.ballast !== null;
  const runCold = p.coilColdOhm + p.ballastColdOhm;
  const runHot = p.coilHotOhm + p.ballastHotOhm;
  const crank = p.coilColdOhm + (hasBallast && !setup.crankingBypass ? p.ballastColdOhm : 0);
  const figures = [
    fig('module minimum', floor, 'ohm'),
    fig('coil alone, cold', p.coilColdOhm, 'ohm'),
    fig('coil alone, hot', p.coilHotOhm, 'ohm'),
    fig('coil and ballast, cold', runCold, 'ohm'),
    fig('coil and ballast, hot', runHot, 'ohm'),
    fig('while cranking', crank, 'ohm'),
  ];
  const why = 'Below the module\'s minimum the coil draws more current than the switching transistor is built for; it overheats or fails, often at key-on or idle.';
  if (runCold < floor) {
    return result(id, title, 'fail', figures, `${why} Here the coil circuit reads ${fmt(runCold, 2)} ohm cold against a minimum of ${fmt(floor, 2)} ohm.`, hasBallast ? 'Choose a coil of higher primary resistance, or a module rated for this coil.' : 'Fit a ballast that brings the total above the minimum, or choose a higher-resistance coil.', hasBallast ? ['coil-resistance:raise'] : ['ballast:add', 'coil-resistance:raise']);
  }
  if (crank < floor) {
    return result(id, title, 'caution', figures, `${why} With the cranking bypass the ballast is shorted out while the starter turns, leaving ${fmt(crank, 2)} ohm.`, 'Brief cranking is usually tolerated; check the module maker\'s note on cranking bypass, or drop the bypass wire.', ['bypass:remove']);
  }
  if (hasBallast && p.coilColdOhm < floor) {
    return result(id, title, 'caution', figures, `${why} The coil alone (${fmt(p.coilColdOhm, 2)} ohm) is below the minimum; only the ballast keeps it safe.`, 'Keep the ballast in circuit and never bridge it out.', ['ballast:keep']);
  }
  return result(id, title, 'pass', figures, why, 'Nothing to do: the coil circuit stays above the module minimum hot and cold.');
};

export const coilResistanceFloorFails: FailTest = (ctx) => {
  const floor = floorOf(ctx);
  return floor !== null && ctx.p.coilColdOhm + ctx.p.ballastColdOhm < floor;
};

/** Peak current at break against the module's (or the points') rating. */
export const peakCurrent: Rule = (ctx) => {
  const { p, ws, setup, keyOn } = ctx;
  const id = 'peak-current';
  const title = 'Peak coil current';
  const peak = maxOver(ws.currentA, 0, ws.n - 1);
  const rpm = ctx.grid.rpm[peak.index]!;
  if (p.kind === 'capacitive-discharge' || p.kind === 'magneto') {
    return result(id, title, 'pass', [fig('peak current at break', peak.value, 'A')], 'A capacitive-discharge module or a magneto does not draw steady coil current from the battery.', 'Nothing to do.');
  }
  const m = setup.module;
  if (!isModuleKind(ctx) || !m) {
    // Points contacts are generally reckoned good for about 4 to 5 A before they pit fast (from memory).
    const figures = [fig('peak current at break', peak.value, 'A'), fig('at rpm', rpm, 'rpm'), fig('points comfortable limit (from memory)', 5, 'A'), fig('key-on current', keyOn.currentA, 'A')];
    const why = 'Points contacts burn and pit faster the more current they break; above about 5 A they need frequent dressing.';
    if (peak.value > POINTS_FAIL_A) return result(id, title, 'fail', figures, why, 'Fit the ballast the coil needs, or a higher-resistance coil.', ['ballast:add', 'coil-resistance:raise']);
    if (peak.value > 5) return result(id, title, 'caution', figures, why, 'Expect short points life; a transistor-assisted switch would relieve the contacts.');
    return result(id, title, 'pass', figures, why, 'Nothing to do.');
  }
  const worst = Math.max(peak.value, keyOn.currentA);
  const figures = [fig('peak current at break', peak.value, 'A'), fig('at rpm', rpm, 'rpm'), fig('key-on current', keyOn.currentA, 'A'), fig('module rating', m.maxCurrentA, 'A')];
  const why = 'A switching transistor driven beyond its rated current fails, often without warning and usually on the road.';
  if (worst > m.maxCurrentA) {
    return result(id, title, 'fail', figures, `${why} The coil would reach ${fmt(worst, 2)} A against a rating of ${fmt(m.maxCurrentA, 2)} A.`, 'Add ballast resistance, or choose a higher-resistance coil or a module rated for more current.', ['ballast:add', 'coil-resistance:raise']);
  }
  if (worst > 0.9 * m.maxCurrentA) {
    return result(id, title, 'caution', figures, `${why} The coil comes within 10 % of the rating.`, 'Leave headroom: a little more resistance in the coil circuit costs little spark.', ['ballast:add']);
  }
  return result(id, title, 'pass', figures, why, 'Nothing to do.');
};

export const peakCurrentFails: FailTest = (ctx) => {
  const { p, setup } = ctx;
  if (p.kind === 'capacitive-discharge' || p.kind === 'magneto') return false;
  const peak = maxOver(ctx.ws.currentA, 0, ctx.ws.n - 1).value;
  const m = setup.module;
  if (!isModuleKind(ctx) || !m) return peak > POINTS_FAIL_A;
  return Math.max(peak, ctx.keyOn.currentA) > m.maxCurrentA;
};

/**
 * What to do with the ballast: keep it (a coil built for one, on a module that does not limit
 * current), add or keep a cranking bypass, or remove it (a current-limited or CD module, or a
 * full-voltage coil).
 */
/** A coil wound for about half the supply: built for a ballast, or a 6 V coil on a 12 V car. */
const needsBallastOf = ({ setup: { coil }, engine }: RuleContext): boolean => coil.forBallast || (coil.ratedVoltageV === 6 && engine.systemVoltageV === 12);

export const ballastPlan: Rule = (ctx) => {
  const { p, setup } = ctx;
  const id = 'ballast-plan';
  const title = 'Ballast resistor';
  const b = setup.ballast;
  const figures = [
    fig('coil primary, cold', p.coilColdOhm, 'ohm'),
    fig('ballast, cold', p.ballastColdOhm, 'ohm'),
    fig('ballast, hot running', p.ballastHotOhm, 'ohm'),
    fig('ballast temperature, running', p.ballastHotK - 273.15, 'degC'),
  ];
  if (p.kind === 'magneto') return result(id, title, 'pass', figures, 'A magneto has no battery feed and no ballast.', 'Nothing to do.');
  const needsBallast = needsBallastOf(ctx);
  const why = 'A ballast coil is wound for about half the battery voltage: without its resistor it overheats, with it and no cranking bypass it sparks weakly while the starter pulls the battery down.';
  if (p.kind === 'capacitive-discharge') {
    if (b) return result(id, title, 'caution', figures, 'A capacitive-discharge module wants the full battery voltage; a ballast only starves its charger.', 'Remove the ballast, or bridge it, and feed the module from terminal 15.', ['ballast:remove']);
    return result(id, title, 'pass', figures, 'No ballast, as a capacitive-discharge module wants.', 'Nothing to do.');
  }
  if (p.kind === 'breakerless-current-limited') {
    const floor = setup.module?.minCoilResistanceOhm ?? 0;
    if (b && p.coilColdOhm >= floor) {
      return result(id, title, 'caution', figures, 'This module limits the coil current itself; the ballast only lowers the energy at high rpm.', 'Remove the ballast (or bridge it), which the module\'s own current limit makes safe for this coil.', ['ballast:remove']);
    }
    if (b) return result(id, title, 'pass', figures, 'The coil alone is below the module\'s minimum resistance, so the ballast stays.', 'Keep the ballast in circuit.');
    return result(id, title, 'pass', figures, 'The module limits the coil current; no ballast is needed.', 'Nothing to do.');
  }
  if (needsBallast && !b) {
    return result(id, title, 'fail', figures, why, 'Keep or fit the ballast this coil is made for (or choose a full-voltage coil).', ['ballast:add']);
  }
  if (needsBallast && b && !setup.crankingBypass) {
    return result(id, title, 'caution', figures, why, 'Keep the ballast and add a cranking bypass from the starter solenoid to the coil, so it gets full battery voltage while cranking.', ['ballast:keep', 'bypass:add']);
  }
  if (!needsBallast && b) {
    return result(id, title, 'caution', figures, 'This coil is made for the full system voltage; a ballast in front of it only weakens the spark.', 'Remove the ballast (or bridge it) for this coil.', ['ballast:remove']);
  }
  return result(id, title, 'pass', figures, b ? 'The ballast suits this coil and the cranking bypass restores full voltage while cranking.' : 'No ballast, and this coil does not need one.', b ? 'Keep the ballast and the cranking bypass.' : 'Nothing to do.');
};

/** Only a coil that needs a ballast and has none fails; magneto, CD and current-limited modules never do. */
export const ballastPlanFails: FailTest = (ctx) => {
  const k = ctx.p.kind;
  if (k === 'magneto' || k === 'capacitive-discharge' || k === 'breakerless-current-limited') return false;
  return needsBallastOf(ctx) && ctx.setup.ballast === null;
};
