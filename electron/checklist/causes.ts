/**
 * Likely causes when a reading is out of its band, most likely first, each with what to check
 * next. Trade knowledge, in our own words; the ones that are common practice say so.
 */
import type { SheetContext } from './context.js';

export function batteryRestCauses(): string[] {
  return [
    'Low: the battery is not fully charged; charge it, leave it an hour off charge and measure again (common practice).',
    'Low again after a full charge: a failing cell or a drain with everything switched off; have the battery load-tested.',
    'High: measured straight off charge (surface charge); switch the headlamps on for a minute, off, and measure again (common practice).',
  ];
}

export function coilPrimaryCauses(): string[] {
  return [
    'Low by more than 15 %: shorted turns in the primary; replace the coil before fitting a module.',
    'High: the meter leads were not zeroed, or the terminals are dirty; clean them, zero the leads and measure again.',
    'Open or far too high: a broken winding or internal joint; replace the coil.',
    'Far off either way: the coil fitted may not be the one the plan names; check its markings.',
  ];
}

export function coilSecondaryCauses(): string[] {
  return [
    'No reading (open): a broken secondary winding or internal joint; replace the coil.',
    'Low: shorted turns or tracking inside the tower; replace the coil.',
    'High: a corroded contact in the tower socket; clean it and measure again.',
  ];
}

export function ballastCauses(ctx: SheetContext): string[] {
  const iron = ctx.ballast?.ballastType === 'iron-wire';
  return [
    'High: a loose or corroded terminal, or a broken strand; clean and tighten the ends and measure again.',
    ...(iron ? ['High: still warm from running (iron wire reads higher hot); let it cool and measure again.'] : []),
    'Low: a shorted section, or a ballast of another value than the plan names; check its marking.',
  ];
}

export function leadCauses(): string[] {
  return [
    'High: carbon and spiral cores rise with age; twice the figure or more: replace the lead (from memory).',
    'Open (no reading): a broken core or a loose end fitting; replace the lead.',
    'Near 0 ohm: a copper-core lead, not the suppression lead the plan names; a module that wants suppressed leads needs them.',
  ];
}

export function keyOnCurrentCauses(ctx: SheetContext): string[] {
  const out = [
    'Low: a poor connection or a wrong ballast between 15 and the coil; measure the drop across each connection in turn.',
  ];
  if (ctx.kind === 'points') out.push('Low or nothing: the points are not closed or are burnt; turn the engine by hand until they close, clean them and measure again.');
  else out.push('Nothing: the module has not switched on; check its supply, its earth and its trigger wiring.');
  if (ctx.ballast) out.push("High: the ballast is bridged, or the cranking bypass is live all the time; check the bypass wire goes to the starter solenoid's ignition terminal, not to 15.");
  out.push('High: a coil of lower resistance than the plan names; check the coil marking.');
  return out;
}

export function coilFeedKeyOnCauses(ctx: SheetContext): string[] {
  return [
    'Low: a poor connection or a wrong ballast between 15 and the coil; measure the drop across each connection in turn.',
    'Low: a tired ignition switch; measure across it from 30 to 15 with the key on.',
    ...(ctx.ballast ? ['Near the battery voltage: the ballast is bridged or the bypass is live all the time; check where the bypass wire lands.'] : []),
    ctx.kind === 'points'
      ? 'Near the battery voltage: no current flows because the points are open; turn the engine until they close.'
      : 'Near the battery voltage: no current flows because the module has not switched on; check its trigger and earth.',
  ];
}

export function coilSwitchCauses(ctx: SheetContext): string[] {
  if (ctx.kind === 'points') {
    return [
      'Above 0.3 V with the points closed: burnt or dirty points, or a poor earth of the distributor base plate (common practice); clean the contacts and check the base-plate earth strap.',
      'Near the battery voltage: the points are open, or the wire from 1 to the points is broken.',
    ];
  }
  return [
    "High: a poor module earth; measure from the module's earth to 31 (it should read almost nothing).",
    'Near the battery voltage: the module is not switching on; check its supply and trigger wiring and its instructions.',
    "Near 0 V: a module output shorted to earth, or one with a lower saturation voltage than its data; check the module maker's figures.",
  ];
}

export function afterShutOffCauses(): string[] {
  return [
    'Coil 1 low while 15 reads the battery: the module still holds the coil on (no stall shut-off working) or its output is shorted to earth; switch off and check the wiring and its instructions.',
    'Both low: a poor feed to 15; measure across the ignition switch and each connection in turn.',
    'The coil gets warm with the key on: the module does not shut off; do not leave the key on until it is sorted.',
  ];
}

export function crankingSupplyCauses(): string[] {
  return [
    'Low: a discharged or tired battery, or a poor battery cable or earth strap; charge the battery, then measure the drop along each heavy cable while cranking (common practice).',
    'Low on a cold morning: a battery gives less when cold; charge it and measure again.',
  ];
}

export function coilFeedCrankingCauses(ctx: SheetContext): string[] {
  const out: string[] = [];
  if (ctx.bypass) out.push('Far below the battery: the cranking bypass is not connected or its wire goes to the wrong starter terminal.');
  out.push('Low: a poor connection between 15 and the coil; measure the drop across each connection while cranking.');
  out.push('Low together with the battery: the battery or its cables sag while cranking; check them first.');
  return out;
}

export function moduleSupplyCrankingCauses(ctx: SheetContext): string[] {
  return [
    "Below the module's minimum: it may not fire while cranking; feed it from 15 by a short, heavy wire and check the battery and its cables.",
    ...(ctx.moduleAfterBallast ? ['Fed after the ballast: move the feed to 15, as most module makers say.'] : []),
    "Above the module's maximum: a charging fault or a wrong meter range; check the charging voltage at fast idle.",
  ];
}

export function runningSupplyCauses(ctx: SheetContext): string[] {
  const gen = ctx.input.about.charging === 'dynamo' ? 'dynamo' : 'alternator';
  return [
    `Low: a slipping fan belt, a worn ${gen} or a regulator set low; check the belt tension first (common practice).`,
    `High: a regulator fault; charging above the range boils the battery and can harm the module.`,
  ];
}

export function dwellCauses(ctx: SheetContext): string[] {
  if (ctx.kind === 'points' || ctx.kind === 'transistor-points') {
    return [
      'Steady but off: reset the points gap (a smaller gap gives more dwell) and check again.',
      'Wandering at steady idle: a worn distributor shaft or bushes.',
    ];
  }
  return [
    'Wandering at steady idle: a failing pickup, or worn distributor bushes moving the trigger.',
    "Steady but off: some dwell meters misread a module's dwell; compare with the module data before changing anything.",
  ];
}

export function tachCauses(): string[] {
  return [
    'Dead after the conversion: the tach needs an adaptor for this module (see the tach rule).',
    'Reads double or half: the tachometer is set for another number of cylinders, or a multi-spark module is firing several sparks per event.',
    'Erratic: a poor connection on the tach wire, or a module that changes dwell with speed; check the wire, then compare with the reference again.',
  ];
}

export function timingIdleCauses(): string[] {
  return [
    'Steady but off: turn the distributor body to set it, then lock the clamp and check again.',
    'Wandering: a worn distributor drive or bushes, or a loose pickup or points plate.',
    'Too far advanced: the idle is too fast and the advance has started; bring the idle down first.',
  ];
}

export function timingAdvancedCauses(): string[] {
  return [
    'Too little: the advance weights stick; clean and lubricate them (common practice).',
    'Too much: stretched or broken advance springs; replace them.',
    'Off by the same amount as at idle: set the idle timing first.',
  ];
}

export function plugGapCauses(): string[] {
  return [
    'Out of band: bend the side electrode with a gapping tool, never the centre, and check again.',
    'Worn, rounded electrodes: replace the plug rather than close the gap.',
  ];
}
