/**
 * Fit and wire, one terminal (one wire) per step: points or pickup, the ballast and the bypass,
 * the coil and its polarity for the car's earth, the module, the tachometer by the way it senses,
 * the HT leads and the plugs. Every step here is a fitting step.
 */
import type { SheetContext } from '../context.js';
import { doStep, sentences } from '../step.js';
import type { SheetStage, SheetStep } from '../types.js';
import { num, POSITIVE_EARTH_SENTENCE } from '../words.js';

function distributorSteps(ctx: SheetContext): SheetStep[] {
  const w = ctx.words;
  const gap = `${num(ctx.input.about.pointsGapMm)} mm`;
  if (ctx.kind === 'points') {
    return [
      doStep('fit', 'points', 'Points', `Clean the points and set their gap to ${gap}.`, [w.points]),
      doStep('fit', 'condenser', 'Keep the condenser', 'Keep the condenser across the points: its lead on the points terminal, its body bolted to the base plate (earth). Check both are clean and tight.', [w.points, w.t31]),
    ];
  }
  if (ctx.keepsPoints) {
    return [
      doStep('fit', 'points', 'Points as the trigger', `Clean the points and set their gap to ${gap}; from now on they only signal the module.`, [w.points]),
      doStep('fit', 'condenser-off', 'Condenser off', 'Take the condenser off the points and remove it: the module switches the coil, and a condenser left on the trigger can upset it.', [w.points]),
    ];
  }
  const fromMagneto = ctx.existing.switching === 'magneto';
  return [
    ...(fromMagneto ? [] : [doStep('fit', 'points-out', 'Points and condenser out', 'Take the points and the condenser out of the distributor; keep them with the car.', [w.points])]),
    doStep('fit', 'pickup', 'Fit the pickup', "Fit the pickup and its trigger on the distributor shaft as the module maker's instructions say; set its air gap if it has one.", [w.pickup]),
  ];
}

function ballastSteps(ctx: SheetContext): SheetStep[] {
  const w = ctx.words;
  const out: SheetStep[] = [];
  const today = ctx.existing.ballast;
  if (ctx.removesBallast && today) {
    out.push(
      doStep('fit', 'ballast-out', today.ballastType === 'harness-wire' ? 'Resistive feed wire out' : 'Ballast out', today.ballastType === 'harness-wire'
        ? 'This plan has no ballast: replace the resistive feed wire with a plain wire of at least the same size from 15 to coil 15 (or bridge it as the service data says).'
        : 'This plan has no ballast: take the ballast out (or bridge its two terminals) so coil 15 is fed straight from 15.', [w.t15, w.t15a]),
    );
  }
  const b = ctx.ballast;
  if (b) {
    const keep = today !== null && today.name === b.name;
    const wire = b.ballastType === 'harness-wire';
    out.push(
      doStep('fit', 'ballast-feed', wire ? 'Resistive feed wire from 15' : 'Ballast from 15', sentences(
        wire ? `${keep ? 'Keep' : 'Fit'} the resistive feed wire (${b.name}): its switch end on 15.` : `${keep ? 'Keep' : 'Fit'} the ballast (${b.name}): wire 15 from the ignition switch to its 15 end.`,
        b.ballastType === 'iron-wire' && 'It runs hot: mount it clear of the loom and fuel lines.',
      ), [w.t15]),
    );
  }
  return out;
}

function bypassSteps(ctx: SheetContext): SheetStep[] {
  const w = ctx.words;
  if (ctx.removesBypass) {
    return [
      doStep('fit', 'bypass-off', 'Cranking bypass wire off', sentences(
        ctx.setup.crankingBypass ? 'The plan asks for a cranking bypass but has no ballast to bypass.' : 'This plan has no cranking bypass.',
        "Take the bypass wire off the starter solenoid's ignition bypass terminal and off the coil, and remove it: a loose end is live every time the starter turns.",
      ), [w.bypass, w.coil15]),
    ];
  }
  if (!ctx.bypass) return [];
  const keep = ctx.existing.ballast !== null && ctx.existing.crankingBypass;
  return [
    doStep('fit', 'bypass', 'Cranking bypass', `${keep ? 'Keep' : 'Run'} the cranking bypass wire from the starter solenoid's ignition bypass terminal (the small terminal beside 50 that is live only while the starter turns) to the coil side of the ballast, 15a at coil 15.`, [w.bypass, w.t15a]),
  ];
}

function coilSteps(ctx: SheetContext): SheetStep[] {
  const w = ctx.words;
  const feed = ctx.ballast
    ? doStep('fit', 'coil-feed', 'Coil feed from 15a', 'Wire 15a (the coil end of the ballast) to coil 15.', [w.t15a, w.coil15])
    : doStep('fit', 'coil-feed', 'Coil feed from 15', sentences('Wire 15 from the ignition switch straight to coil 15.', ctx.tachRoute === 'coil-feed' && 'Keep it looped through the tachometer (next steps).'), [w.t15, w.coil15]);
  const polarity = doStep('fit', 'coil-polarity', 'Coil polarity for the earth', sentences(
    ctx.positiveEarth
      ? `${POSITIVE_EARTH_SENTENCE} So coil 15 (supply side) is the terminal marked -, and coil 1 (switch side) the one marked +; that keeps the plug's centre electrode negative.`
      : 'Negative earth: coil 15 (supply side) is the terminal marked +, and coil 1 (switch side) the one marked -; that keeps the plug\'s centre electrode negative.',
    ctx.setup.coilWiring === 'reversed' && 'The plan records this coil wired the other way round: the checker counts a weaker spark for it; swap the two wires if you can.',
  ), [w.coil15, w.coil1]);
  return [feed, polarity];
}

function moduleSteps(ctx: SheetContext): SheetStep[] {
  const w = ctx.words;
  const m = ctx.module;
  if (!m) {
    return [doStep('fit', 'coil-switch', 'Coil 1 to the points', 'Wire coil 1 to the points terminal on the distributor (the condenser lead shares it).', [w.coil1, w.points])];
  }
  const pe = ctx.positiveEarth && `${POSITIVE_EARTH_SENTENCE} Follow the module maker's positive-earth wiring.`;
  const supply = ctx.moduleAfterBallast
    ? doStep('fit', 'module-supply', 'Module supply (after the ballast, as planned)', sentences(
        'The plan feeds the module from 15a, after the ballast. Most module makers want it from 15: after the ballast it loses the ballast drop and may not fire while cranking.',
        "Wire it to 15a only if the module's instructions call for that; otherwise take it from 15.",
        pe,
      ), [w.moduleSupply, w.t15a])
    : doStep('fit', 'module-supply', 'Module supply from 15', sentences('Run the module supply from 15 (the ignition switch side, before any ballast), fused close to 15.', pe), [w.moduleSupply, w.t15]);
  return [
    doStep('fit', 'module-mount', 'Mount the module', `Mount the module (${m.name}) on clean bare metal, away from exhaust heat and the fan.`, [w.moduleEarth]),
    doStep('fit', 'module-earth', 'Module earth', sentences('Wire the module earth to 31 on clean bare metal, with a toothed washer under the terminal.', pe), [w.moduleEarth, w.t31]),
    supply,
    ctx.keepsPoints
      ? doStep('fit', 'module-trigger', 'Module trigger from the points', 'Connect the module trigger input to the points terminal (the lead that used to go to coil 1).', [w.moduleTrigger, w.points])
      : doStep('fit', 'module-trigger', 'Module trigger from the pickup', 'Connect the pickup wires to the module trigger input, the way round its instructions show.', [w.moduleTrigger, w.pickup]),
    doStep('fit', 'module-output', 'Module output to coil 1', sentences(
      'Wire the module output to coil 1.',
      ctx.kind === 'capacitive-discharge' && 'It drives the coil with pulses of several hundred volts: never touch it with the ignition on.',
    ), [w.moduleOutput, w.coil1]),
  ];
}

function tachSteps(ctx: SheetContext): SheetStep[] {
  const w = ctx.words;
  const t = ctx.tach;
  if (!t || !ctx.tachRoute) return [];
  if (ctx.tachRoute === 'cable') return [doStep('fit', 'tach', 'Tachometer', `${t.name} is cable-driven: nothing to wire.`, [], false)];
  const source = ctx.tachRoute === 'module-tach-output' ? w.moduleTach : ctx.tachRoute === 'coil-feed' ? w.coil15 : w.coil1;
  const sourceWords = ctx.tachRoute === 'module-tach-output' ? 'the module tach output' : ctx.tachRoute === 'coil-feed' ? 'the coil feed' : '1 (coil switch side)';
  if (ctx.tachAdaptor) {
    const action = ctx.tachRule?.action ?? '';
    return [
      doStep('fit', 'tach-adaptor', 'Tach adaptor', sentences(
        `The checker's tach rule says: ${action}`,
        `Fit a tach adaptor made for this module between ${sourceWords} and the tach wire, as the adaptor's instructions say.`,
      ), [source, 'tach adaptor']),
      doStep('fit', 'tach', 'Tach wire to the adaptor', `Connect the tach wire of ${t.name} to the adaptor's output.`, ['tach adaptor', w.tachWire]),
    ];
  }
  if (ctx.tachRoute === 'coil-feed') {
    return [doStep('fit', 'tach', 'Coil feed through the tachometer', `${t.name} senses the current in the coil feed: keep the feed from 15 looped through it on its way to coil 15.`, [w.t15, w.tachWire])];
  }
  return [doStep('fit', 'tach', 'Tach wire', `Connect the tach wire of ${t.name} to ${sourceWords}.`, [source, w.tachWire])];
}

function hightensionSteps(ctx: SheetContext): SheetStep[] {
  const w = ctx.words;
  const order = ctx.firingOrder.join('-');
  const wantsSuppressed = ctx.module?.needsSuppressedLeads === true && (ctx.setup.leads?.core === 'copper' || !ctx.setup.plug?.resistor);
  return [
    doStep('fit', 'leads', 'HT leads', sentences(
      `Fit the HT leads: coil 4 to the cap centre, then the cap to the plugs in the firing order ${order}.`,
      wantsSuppressed && 'This module wants suppressed leads or resistor plugs (see the checker).',
    ), [w.coil4, w.capCentre]),
    doStep('fit', 'plugs', 'Plugs', 'Fit the plugs, gapped as measured, and push each lead fully home.', ['spark plugs']),
  ];
}

export function fitStage(ctx: SheetContext): SheetStage {
  return {
    id: 'fit',
    title: 'Fit and wire',
    intro: 'Battery earth lead still off. One wire at a time: tick each step when its wire is on and tight.',
    steps: [...distributorSteps(ctx), ...ballastSteps(ctx), ...bypassSteps(ctx), ...coilSteps(ctx), ...moduleSteps(ctx), ...tachSteps(ctx), ...hightensionSteps(ctx)],
  };
}
