/**
 * Heat rules: key on with the engine stopped, and the module's own dissipation while running.
 */
import { fig, fmt, isModuleKind, maxOver, result, type FailTest, type Rule, type RuleContext } from './context.js';

/** Module dissipation a finned module base sheds comfortably (from memory). */
export const MODULE_COMFORT_W = 15;

/** What the coil sheds continuously: its own rating, else the labelled default. */
const coilLimitW = (ctx: RuleContext): number => ctx.setup.coil.maxDissipationW ?? ctx.c.coilDissipationLimitW.value;
/** Key-on module dissipation that fails: twice the comfortable figure (no module: no limit). */
const keyOnModuleLimitW = (ctx: RuleContext): number => (ctx.setup.module ? 2 * MODULE_COMFORT_W : Infinity);

export const keyOnHeat: Rule = (ctx) => {
  const { keyOn } = ctx;
  const id = 'key-on-heat';
  const title = 'Key on, engine stopped';
  const limit = coilLimitW(ctx);
  const figures = [
    fig('current', keyOn.currentA, 'A'),
    fig('coil dissipation', keyOn.coilDissipationW, 'W'),
    fig('ballast dissipation', keyOn.ballastDissipationW, 'W'),
    fig('module dissipation', keyOn.moduleDissipationW, 'W'),
    fig('coil limit', limit, 'W'),
  ];
  if (!keyOn.currentFlows) return result(id, title, 'pass', figures, 'No coil current flows with the engine stopped.', 'Nothing to do.');
  const why = 'With the key on and the engine stopped the coil can carry its full current indefinitely; a coil that overheats can split and leak its oil.';
  if (keyOn.coilDissipationW > limit || keyOn.moduleDissipationW > keyOnModuleLimitW(ctx)) {
    return result(id, title, 'fail', figures, `${why} Here it would carry ${fmt(keyOn.currentA)} A and the coil would dissipate ${fmt(keyOn.coilDissipationW, 0)} W against about ${fmt(limit, 0)} W it can shed.`, 'Fit the ballast this coil needs, or a module with a stall shut-off; never leave the key on with the engine stopped.', ['ballast:add']);
  }
  if (keyOn.coilDissipationW > 0.5 * limit || keyOn.moduleDissipationW > MODULE_COMFORT_W) {
    return result(id, title, 'caution', figures, `${why} Here the coil would dissipate ${fmt(keyOn.coilDissipationW, 0)} W.`, 'Do not leave the key on with the engine stopped; a module with a stall shut-off removes the risk.');
  }
  return result(id, title, 'caution', figures, `${why} The heat here is modest (${fmt(keyOn.coilDissipationW, 0)} W), but current still flows.`, 'Switch off when the engine stops.');
};

export const keyOnHeatFails: FailTest = (ctx) =>
  ctx.keyOn.currentFlows && (ctx.keyOn.coilDissipationW > coilLimitW(ctx) || ctx.keyOn.moduleDissipationW > keyOnModuleLimitW(ctx));

export const moduleHeat: Rule = (ctx) => {
  const { ws, grid } = ctx;
  const id = 'module-heat';
  const title = 'Module heat while running';
  if (!isModuleKind(ctx)) return result(id, title, 'pass', [], 'This setup has no electronic module, so there is no module transistor to overheat.', 'Nothing to do.');
  const peak = maxOver(ws.moduleW, 0, ws.n - 1);
  const figures = [fig('highest module dissipation', peak.value, 'W'), fig('at rpm', grid.rpm[peak.index]!, 'rpm')];
  const why = 'A module that limits current burns the excess as heat in its transistor; it needs a cool, flat, metal mounting.';
  if (peak.value > 2 * MODULE_COMFORT_W) return result(id, title, 'fail', figures, `${why} It would dissipate ${fmt(peak.value)} W.`, 'Add resistance to the coil circuit or choose a coil of higher resistance so the module limits less.', ['ballast:add', 'coil-resistance:raise']);
  if (peak.value > MODULE_COMFORT_W) return result(id, title, 'caution', figures, `${why} It would dissipate ${fmt(peak.value)} W.`, 'Mount the module on bare metal away from the exhaust, with heat-sink compound.');
  return result(id, title, 'pass', figures, why, 'Nothing to do.');
};

export const moduleHeatFails: FailTest = (ctx) => isModuleKind(ctx) && maxOver(ctx.ws.moduleW, 0, ctx.ws.n - 1).value > 2 * MODULE_COMFORT_W;
