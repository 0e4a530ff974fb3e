/** Which parts the plan's diagram shows, each in its slot, with its terminals labelled. */
import type { SheetContext } from '../context.js';
import type { DiagramPart } from '../types.js';
import { makePart, type PinSpec } from './geometry.js';
import { distributorRows, SLOT } from './layout.js';

export function diagramParts(ctx: SheetContext): DiagramPart[] {
  const pe = ctx.positiveEarth;
  const volts = ctx.engine.systemVoltageV;
  const parts: DiagramPart[] = [];
  const earth = (id: string, slot: (typeof SLOT)[keyof typeof SLOT]): DiagramPart => makePart(id, 'earth', 'Earth', slot, [['e', '31', 'top', slot.width / 2]]);

  parts.push(
    makePart('battery', 'battery', `Battery ${volts} V (${pe ? 'positive' : 'negative'} earth)`, SLOT.battery, [
      ['30', pe ? '30 (-)' : '30 (+)', 'right', 30],
      ['31', pe ? '31 (+, earth)' : '31 (-, earth)', 'bottom', 60],
    ]),
    earth('earth-battery', SLOT.batteryEarth),
  );
  const switchPins: PinSpec[] = [
    ['30', '30', 'left', 25],
    ['15', '15', 'right', 25],
  ];
  if (ctx.bypass) switchPins.push(['50', '50', 'bottom', 50]);
  parts.push(makePart('switch', 'ignition-switch', 'Ignition switch', SLOT.ignitionSwitch, switchPins));
  if (ctx.bypass) {
    parts.push(
      makePart('solenoid', 'starter-solenoid', 'Starter solenoid', SLOT.solenoid, [
        ['50', '50', 'top', 90],
        ['bypass', 'ignition bypass', 'right', 25],
      ]),
    );
  }
  if (ctx.tachRoute === 'coil-feed' && ctx.tach) {
    parts.push(
      makePart('tach', 'tach', 'Tachometer (coil feed loops through)', SLOT.feedTach, [
        ['in', 'feed in', 'left', 25],
        ['out', 'feed out', 'right', 25],
      ]),
    );
  }
  if (ctx.ballast) {
    const label = ctx.ballast.ballastType === 'harness-wire' ? 'Resistive feed wire' : 'Ballast';
    parts.push(
      makePart('ballast', 'ballast', `${label} ${ctx.ballast.coldResistanceOhm.value.toFixed(1)} ohm cold`, SLOT.ballast, [
        ['15', '15', 'left', 25],
        ['15a', '15a', 'right', 25],
      ]),
    );
  }
  parts.push(
    makePart('coil', 'coil', 'Coil', SLOT.coil, [
      ['15', '15 (supply side)', 'left', 40],
      ['1', '1 (switch side)', 'bottom', 40],
      ['4', '4 (HT)', 'right', 40],
    ]),
  );
  if (ctx.module) {
    const pins: PinSpec[] = [
      ['supply', 'module supply', 'top', 30],
      ['earth', 'module earth', 'bottom', 30],
      ['trigger', 'module trigger input', 'left', 60],
      ['output', 'module output', 'right', 30],
    ];
    if (ctx.tachRoute === 'module-tach-output') pins.push(['tach', 'module tach output', 'right', 90]);
    parts.push(makePart('module', 'module', 'Module', SLOT.module, pins), earth('earth-module', SLOT.moduleEarth));
  }
  if (ctx.keepsPoints) {
    const pins: PinSpec[] = [['lt', ctx.module ? 'points (trigger)' : 'points (to 1)', 'right', 30]];
    if (ctx.keepsCondenser) pins.push(['cond', 'condenser', 'left', 30], ['earth', '31', 'bottom', 60]);
    parts.push(makePart('points', 'points', ctx.module ? 'Points (trigger only)' : 'Points', SLOT.trigger, pins));
    if (ctx.keepsCondenser) {
      parts.push(
        earth('earth-points', SLOT.triggerEarth),
        makePart('condenser', 'condenser', 'Condenser', SLOT.condenser, [
          ['lead', 'condenser lead', 'right', 30],
          ['body', '31', 'bottom', 50],
        ]),
        earth('earth-condenser', SLOT.condenserEarth),
      );
    }
  } else if (ctx.pickup) {
    parts.push(makePart('pickup', 'pickup', 'Pickup (in the distributor)', SLOT.trigger, [['signal', 'pickup wires', 'right', 30]]));
  }
  if (ctx.tach && ctx.tachRoute !== 'cable' && ctx.tachRoute !== 'coil-feed') {
    if (ctx.tachAdaptor) {
      parts.push(
        makePart('tach-adaptor', 'tach-adaptor', 'Tach adaptor', SLOT.tachUpper, [
          ['in', 'from ignition', 'top', 100],
          ['out', 'to tach', 'bottom', 60],
        ]),
        makePart('tach', 'tach', 'Tachometer', SLOT.tachLower, [['signal', 'tach wire', 'top', 60]]),
      );
    } else {
      parts.push(makePart('tach', 'tach', 'Tachometer', SLOT.tachUpper, [['signal', 'tach wire', 'top', 100]]));
    }
  }
  const rows = distributorRows(ctx.engine.cylinders);
  parts.push(
    makePart(
      'distributor',
      'distributor',
      'Distributor cap',
      rows.box,
      [['centre', '4 (centre)', 'top', 30], ...ctx.firingOrder.map((cyl, i): PinSpec => [`cyl-${cyl}`, `${cyl}`, 'right', rows.rowY[i]! - rows.box.y])],
    ),
  );
  ctx.firingOrder.forEach((cyl, i) => {
    const y = rows.rowY[i]!;
    parts.push(
      makePart(`plug-${cyl}`, 'plug', `Cyl ${cyl}`, { x: rows.plugX, y: y - rows.plugHeight / 2, width: rows.plugWidth, height: rows.plugHeight }, [['in', `cyl ${cyl}`, 'left', rows.plugHeight / 2]]),
    );
  });
  return parts;
}
