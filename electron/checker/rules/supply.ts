/**
 * Rules about the supply: what the module sees while cranking, earth polarity, 6 V systems.
 */
import { fig, fmt, isModuleKind, result, type FailTest, type Rule, type RuleContext } from './context.js';

/** The module's own supply while the starter pulls the battery down, against its minimum. */
export const crankingSupply: Rule = (ctx) => {
  const { p, setup } = ctx;
  const id = 'cranking-supply';
  const title = 'Module supply while cranking';
  const m = setup.module;
  if (!isModuleKind(ctx) || !m || p.moduleSupplyCrankingV === null) {
    return result(id, title, 'pass', [fig('cranking supply', p.crankingSupplyV, 'V')], 'Points need no minimum supply to switch.', 'Nothing to do.');
  }
  const v = p.moduleSupplyCrankingV;
  const figures = [fig('battery while cranking', p.crankingSupplyV, 'V'), fig('module sees while cranking', v, 'V'), fig('module sees running', p.moduleSupplyRunningV ?? 0, 'V'), fig('module minimum', m.supplyMinV, 'V')];
  const afterBallast = setup.moduleFeed === 'after-ballast' && setup.ballast !== null;
  const why = 'While the starter turns, the battery sags; a module below its minimum supply gives no spark or a weak one, which reads as a non-starter.';
  if (v < m.supplyMinV) {
    return result(id, title, 'fail', figures, `${why} It would see ${fmt(v, 2)} V against a minimum of ${fmt(m.supplyMinV, 2)} V.`, afterBallast ? 'Feed the module from terminal 15 (before the ballast), not from the coil side.' : 'Improve the feed (a relay from the battery, a better earth) or choose a module that works at a lower voltage.');
  }
  if (afterBallast) {
    return result(id, title, 'caution', figures, 'The module takes its supply after the ballast, so it sags every time the coil draws current.', 'Move the module feed to terminal 15, before the ballast.');
  }
  if (v < 1.05 * m.supplyMinV) {
    return result(id, title, 'caution', figures, `${why} The margin is under 5 %.`, 'A cold morning or a tired battery will take it below; improve the feed.');
  }
  return result(id, title, 'pass', figures, why, 'Nothing to do.');
};

export const crankingSupplyFails: FailTest = (ctx) => {
  const m = ctx.setup.module;
  const v = ctx.p.moduleSupplyCrankingV;
  return isModuleKind(ctx) && m !== null && v !== null && v < m.supplyMinV;
};

/**
 * The running supply against the module's maximum. A regulator holds the running (charging) supply
 * at about 14 V on 12 V and 7.2 V on 6 V (the running-supply condition); a module whose maximum is
 * below that is driven over its rating every time the engine runs (a 4.5-9 V six-volt unit on a
 * 12 V car). Within 5 % of the maximum a tired or badly set regulator takes it over (common practice).
 */
export const SUPPLY_MAX_CAUTION_FRACTION = 0.95;

/** The highest supply the module sees: the running supply with the coil off (no harness drop). */
const runningSupplyOf = (ctx: RuleContext): number => ctx.p.runningSupplyV;

export const moduleSupplyMax: Rule = (ctx) => {
  const { setup, engine } = ctx;
  const id = 'module-supply-max';
  const title = 'Module supply against its maximum';
  const m = setup.module;
  const v = runningSupplyOf(ctx);
  if (!isModuleKind(ctx) || !m) return result(id, title, 'pass', [fig('running supply', v, 'V')], 'Points and magnetos have no electronic supply limit.', 'Nothing to do.');
  const figures = [fig('running (charging) supply', v, 'V'), fig('module maximum', m.supplyMaxV, 'V'), fig('caution from', SUPPLY_MAX_CAUTION_FRACTION * m.supplyMaxV, 'V')];
  const why = 'A module run above its maximum supply overheats its regulator and switching transistor and can fail outright, usually on the road.';
  if (v > m.supplyMaxV) {
    return result(id, title, 'fail', figures, `${why} While the engine runs and the battery charges the supply is ${fmt(v, 2)} V, above the module's maximum of ${fmt(m.supplyMaxV, 2)} V.`, `Choose a module rated for this car's ${engine.systemVoltageV} V system (its maximum must be above ${fmt(v, 1)} V).`);
  }
  if (v > SUPPLY_MAX_CAUTION_FRACTION * m.supplyMaxV) {
    return result(id, title, 'caution', figures, `${why} The running supply of ${fmt(v, 2)} V is within 5 % of the module's maximum of ${fmt(m.supplyMaxV, 2)} V.`, 'Have the charging voltage checked and set correctly, or choose a module with more headroom.');
  }
  return result(id, title, 'pass', figures, `${why} The running supply of ${fmt(v, 2)} V is well within the module's maximum of ${fmt(m.supplyMaxV, 2)} V.`, 'Nothing to do.');
};

export const moduleSupplyMaxFails: FailTest = (ctx) => {
  const m = ctx.setup.module;
  return isModuleKind(ctx) && m !== null && runningSupplyOf(ctx) > m.supplyMaxV;
};

/** A module built for negative earth will not work (or will be destroyed) on a positive-earth car. */
export const earthPolarity: Rule = (ctx) => {
  const { setup, engine } = ctx;
  const id = 'earth-polarity';
  const title = 'Earth polarity';
  const m = setup.module;
  if (!isModuleKind(ctx) || !m) return result(id, title, 'pass', [], 'Points and magnetos work with either earth polarity.', 'Nothing to do.');
  const ok = m.earthPolarities.includes(engine.earthPolarity);
  const why = 'Transistors conduct one way only: a module made for the other earth polarity does not switch, and can be destroyed the moment it is connected.';
  if (!ok) return result(id, title, 'fail', [], `${why} This car is ${engine.earthPolarity} earth and the module supports ${m.earthPolarities.join(' and ')} earth only.`, 'Choose a module for this earth polarity, or convert the car\'s polarity first (with everything else that depends on it).');
  return result(id, title, 'pass', [], `${why} The module supports ${engine.earthPolarity} earth.`, 'Nothing to do.');
};

export const earthPolarityFails: FailTest = (ctx) => {
  const m = ctx.setup.module;
  return isModuleKind(ctx) && m !== null && !m.earthPolarities.includes(ctx.engine.earthPolarity);
};

/** 6 V systems: module minimum supply and coil rating. */
export const sixVolt: Rule = (ctx) => {
  const { setup, engine, p } = ctx;
  const id = 'six-volt';
  const title = 'System voltage';
  const m = isModuleKind(ctx) ? setup.module : null;
  const coil = setup.coil;
  const figures = [fig('system voltage', engine.systemVoltageV, 'V'), fig('coil rated for', coil.ratedVoltageV, 'V'), fig('running supply', p.runningSupplyV, 'V')];
  if (p.kind === 'magneto') return result(id, title, 'pass', figures, 'A magneto does not depend on the battery voltage.', 'Nothing to do.');
  if (engine.systemVoltageV === 6) {
    if (m && m.supplyMinV > p.runningSupplyV) {
      return result(id, title, 'fail', [...figures, fig('module minimum', m.supplyMinV, 'V')], 'The module needs more than a 6 V system gives even when charging.', 'Choose a module made for 6 V.');
    }
    if (coil.ratedVoltageV === 12) {
      return result(id, title, 'caution', figures, 'A 12 V coil on 6 V charges to about half its current and a quarter of its energy.', 'Use a 6 V coil, unless the spark figures below are acceptable to you.');
    }
    return result(id, title, 'pass', figures, 'The parts suit a 6 V system.', 'Nothing to do.');
  }
  if (coil.ratedVoltageV === 6 && setup.ballast === null && p.kind !== 'breakerless-current-limited' && p.kind !== 'capacitive-discharge') {
    return result(id, title, 'caution', figures, 'A 6 V coil on 12 V carries about twice its design current unless something limits it.', 'Fit a ballast or a current-limited module, or choose a 12 V coil.', ['ballast:add']);
  }
  if (coil.ratedVoltageV === 6 && setup.ballast === null && p.kind === 'breakerless-current-limited') {
    // The module's limiter is then the only thing between the coil and twice its design current:
    // common practice treats that as workable but fragile (a failed module or a roadside return to
    // points leaves a 6 V coil on the full 12 V).
    return result(
      id,
      title,
      'caution',
      figures,
      'A 6 V coil on a 12 V car is safe here only because the module limits the current; if the module fails or the car goes back to points, the coil sees the full 12 V and overheats.',
      'Choose a 12 V coil, or label the coil so that nobody runs it without this module or a ballast.',
    );
  }
  return result(id, title, 'pass', figures, 'A 12 V system: no 6 V limits apply.', 'Nothing to do.');
};

/** Only a module that needs more than a 6 V system gives fails. */
export const sixVoltFails: FailTest = (ctx) => {
  if (ctx.p.kind === 'magneto' || ctx.engine.systemVoltageV !== 6 || !isModuleKind(ctx)) return false;
  const m = ctx.setup.module;
  return m !== null && m.supplyMinV > ctx.p.runningSupplyV;
};
