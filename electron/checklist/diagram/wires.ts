/** The wires between the parts, each along fixed lanes of the grid (see layout.ts). */
import type { SheetContext } from '../context.js';
import type { DiagramPart, DiagramWire, WireStyle } from '../types.js';
import { makeWire, terminalOf } from './geometry.js';
import { LANE } from './layout.js';

export function diagramWires(ctx: SheetContext, parts: readonly DiagramPart[]): DiagramWire[] {
  const wires: DiagramWire[] = [];
  const has = (id: string): boolean => parts.some((p) => p.id === id);
  const at = (ref: string): { x: number; y: number } => terminalOf(parts, ref);
  const w = (id: string, from: string, to: string, style: WireStyle, corners: ReadonlyArray<readonly [number, number]>, label = ''): void => {
    wires.push(makeWire(parts, id, from, to, style, corners, label));
  };

  w('battery-switch', 'battery.30', 'switch.30', 'supply', []);
  w('battery-earth', 'battery.31', 'earth-battery.e', 'earth', []);

  // The coil feed: 15 from the switch, through the tachometer if it senses the feed current, the ballast if fitted.
  let feedFrom = 'switch.15';
  if (ctx.tachRoute === 'coil-feed' && has('tach')) {
    w('switch-tach', 'switch.15', 'tach.in', 'switched', []);
    feedFrom = 'tach.out';
  }
  if (has('ballast')) {
    w('feed-ballast', feedFrom, 'ballast.15', 'switched', []);
    feedFrom = 'ballast.15a';
  }
  const coil15 = at('coil.15');
  w('feed-coil', feedFrom, 'coil.15', 'switched', [
    [LANE.feedDropX, at(feedFrom).y],
    [LANE.feedDropX, coil15.y],
  ]);

  if (ctx.bypass) {
    w('switch-solenoid', 'switch.50', 'solenoid.50', 'cranking', [], 'start position');
    const b = at('solenoid.bypass');
    w('bypass', 'solenoid.bypass', 'coil.15', 'cranking', [
      [coil15.x, b.y],
    ], 'only while cranking');
  }

  const coil1 = at('coil.1');
  if (ctx.module) {
    const supplyFrom = ctx.moduleAfterBallast ? 'ballast.15a' : 'switch.15';
    const s = at(supplyFrom);
    const ms = at('module.supply');
    w('module-supply', supplyFrom, 'module.supply', 'switched', [
      [s.x, LANE.moduleSupplyY],
      [ms.x, LANE.moduleSupplyY],
    ], ctx.moduleAfterBallast ? 'after the ballast (as planned)' : '');
    w('module-earth', 'module.earth', 'earth-module.e', 'earth', []);
    const out = at('module.output');
    w('module-output', 'module.output', 'coil.1', 'low-tension', [[coil1.x, out.y]]);
    const trigFrom = has('points') ? 'points.lt' : has('pickup') ? 'pickup.signal' : null;
    if (trigFrom) {
      const t = at(trigFrom);
      const mt = at('module.trigger');
      w('trigger', trigFrom, 'module.trigger', 'signal', [
        [LANE.triggerX, t.y],
        [LANE.triggerX, mt.y],
      ]);
    }
  } else if (has('points')) {
    const p = at('points.lt');
    w('points-coil', 'points.lt', 'coil.1', 'low-tension', [[coil1.x, p.y]]);
  }
  if (has('condenser')) {
    w('condenser-points', 'condenser.lead', 'points.cond', 'low-tension', []);
    w('condenser-earth', 'condenser.body', 'earth-condenser.e', 'earth', []);
    w('points-earth', 'points.earth', 'earth-points.e', 'earth', []);
  }

  // The tachometer's signal, through the adaptor when the tach rule asks for one.
  if (has('tach') && ctx.tachRoute !== 'coil-feed') {
    const end = has('tach-adaptor') ? 'tach-adaptor.in' : 'tach.signal';
    if (has('tach-adaptor')) w('adaptor-tach', 'tach-adaptor.out', 'tach.signal', 'signal', [], 'tach wire');
    const e = at(end);
    if (ctx.tachRoute === 'module-tach-output') {
      const mt = at('module.tach');
      w('tach-source', 'module.tach', end, 'signal', [
        [LANE.tachToModuleX, mt.y],
        [LANE.tachToModuleX, LANE.tachToModuleY],
        [e.x, LANE.tachToModuleY],
      ]);
    } else {
      w('tach-source', 'coil.1', end, 'signal', [
        [LANE.tachOuterX, coil1.y],
        [LANE.tachOuterX, LANE.tachRiseY],
        [e.x, LANE.tachRiseY],
      ]);
    }
  }

  // High tension: coil 4 to the cap centre, the cap to each plug.
  const centre = at('distributor.centre');
  w('coil-cap', 'coil.4', 'distributor.centre', 'high-tension', [[centre.x, at('coil.4').y]]);
  for (const cyl of ctx.firingOrder) w(`cap-plug-${cyl}`, `distributor.cyl-${cyl}`, `plug-${cyl}.in`, 'high-tension', []);
  return wires;
}
