/**
 * Check before starting: battery back on, ignition on, engine stopped. The battery at rest, then
 * either the key-on current and the voltages it sets up (points, or a module that holds current at
 * a standstill), or, for a module with a stall shut-off, both coil terminals at the battery voltage.
 */
import { afterShutOffCauses, batteryRestCauses, coilFeedKeyOnCauses, coilSwitchCauses, keyOnCurrentCauses } from '../causes.js';
import type { SheetContext } from '../context.js';
import { keyOnCircuit, restingBattery, type KeyOnCircuit } from '../expected.js';
import { checkStep, doStep, sentences } from '../step.js';
import type { SheetStage, SheetStep } from '../types.js';
import { batteryProbes, num, ohmSum, POSITIVE_EARTH_SENTENCE, probesToEarth } from '../words.js';

/** Most a clean, closed set of points drops with the coil current through it (common practice). */
const POINTS_DROP_MAX_V = 0.3;

const KEY_ON = 'Ignition on, engine stopped, the first seconds after switching on.';

function batteryRest(ctx: SheetContext): SheetStep {
  const w = ctx.words;
  const f = restingBattery(ctx.six);
  return checkStep('static', 'battery-rest', 'Battery at rest', sentences('With the ignition off, measure across the battery posts.', ctx.positiveEarth && POSITIVE_EARTH_SENTENCE), [w.t30, w.t31], {
    quantity: 'battery-voltage-resting',
    ...f,
    probes: batteryProbes(ctx.positiveEarth),
    state: 'Ignition off, engine stopped, an hour off charge.',
    how: ctx.six
      ? `a charged 6 V battery at rest reads ${num(f.min)} to ${num(f.max)} V.`
      : `a charged 12 V battery at rest reads ${num(f.min)} to ${num(f.max)} V.`,
    source: 'common practice',
    ifOutOfRange: batteryRestCauses(),
  });
}

/** "(12.60 - 1.80) V" for a transistor switch, "12.60 V" for points. */
function drive(k: KeyOnCircuit): string {
  return k.switchV > 0 ? `(${num(k.restV)} - ${num(k.switchV)}) V` : `${num(k.restV)} V`;
}

function keyOnSteps(ctx: SheetContext): SheetStep[] {
  const w = ctx.words;
  const k = keyOnCircuit(ctx);
  const points = ctx.kind === 'points';
  const sumCold = ohmSum([k.harnessOhm, k.ballastColdOhm, k.coilOhm, k.contactOhm]);
  const sumHot = ohmSum([k.harnessOhm, k.ballastHotOhm, k.coilOhm, k.contactOhm]);
  const twoEnds = k.ironBallast && k.ballastHotOhm !== k.ballastColdOhm;
  const terms = `harness ${num(k.harnessOhm)}${ctx.ballast ? ` + ballast ${num(k.ballastColdOhm)}` : ''} + coil ${num(k.coilOhm)}${points ? ` + points contact ${num(k.contactOhm)}` : ''} ohm`;
  let currentHow = `${drive(k)} / ${sumCold} = ${num(k.currentColdA)} A (${terms}, battery at rest ${num(k.restV)} V${k.switchV > 0 ? `, module switch drop ${num(k.switchV)} V` : ''})`;
  if (twoEnds) currentHow += `; as the iron ballast warms to ${num(k.ballastHotOhm)} ohm (the checker's hot equilibrium): ${drive(k)} / ${sumHot} = ${num(k.currentHotA)} A`;
  if (k.limited) currentHow += `; the module holds its limit of ${num(k.limitA ?? 0)} A`;
  currentHow += '; +/- 10 % (from memory).';
  const lo = Math.min(k.currentColdA, k.currentHotA);
  const hi = Math.max(k.currentColdA, k.currentHotA);
  const setUp = points ? 'Turn the engine by hand (in gear, or on the crank pulley) until the points are closed.' : 'The module holds the coil switched on at a standstill.';
  const current = checkStep('static', 'key-on-current', 'Key-on current', sentences(setUp, 'Put the meter in series in the coil feed at coil 15, switch on and read at once; switch off within a minute.'), [w.coil15], {
    quantity: 'key-on-current',
    expected: k.currentColdA,
    min: lo * 0.9,
    max: hi * 1.1,
    probes: `Meter on its 10 A range in series: the feed wire off ${w.coil15}, one probe on the wire, the other on the terminal.`,
    state: KEY_ON,
    how: currentHow,
    source: "Ohm's law",
    ifOutOfRange: keyOnCurrentCauses(ctx),
  });
  const feedCold = k.coilFeedColdV;
  const feedHot = k.coilFeedHotV;
  const restSum = ohmSum([k.coilOhm, k.contactOhm]);
  let feedHow = points
    ? `${num(k.restV)} V x ${restSum} / ${sumCold} = ${num(feedCold)} V (voltage divider)`
    : `${num(k.restV)} V - ${num(k.currentColdA)} A x ${ohmSum([k.harnessOhm, k.ballastColdOhm])} = ${num(feedCold)} V`;
  if (twoEnds) {
    feedHow += points
      ? `; with the ballast warm: ${num(k.restV)} V x ${restSum} / ${sumHot} = ${num(feedHot)} V`
      : `; with the ballast warm: ${num(k.restV)} V - ${num(k.currentHotA)} A x ${ohmSum([k.harnessOhm, k.ballastHotOhm])} = ${num(feedHot)} V`;
  }
  feedHow += '; +/- 10 % (from memory).';
  const feed = checkStep('static', 'coil-feed', 'Coil 15 with the key on', 'With the current flowing, measure from coil 15 to earth.', [w.coil15, w.t31], {
    quantity: 'coil-feed-voltage-key-on',
    expected: feedCold,
    min: Math.min(feedCold, feedHot) * 0.9,
    max: Math.min(k.restV, Math.max(feedCold, feedHot) * 1.1),
    probes: probesToEarth(w.coil15, ctx.positiveEarth),
    state: KEY_ON,
    how: feedHow,
    source: "Ohm's law (voltage divider)",
    ifOutOfRange: coilFeedKeyOnCauses(ctx),
  });
  const sw = points
    ? checkStep('static', 'coil-switch', 'Coil 1 with the points closed', 'Measure from coil 1 to earth with the points closed.', [w.coil1, w.t31], {
        quantity: 'coil-switch-voltage-key-on',
        // Clean points read 0.3 V or less; the checker's remembered contact figure is a worn set
        // and can work out above that, so the expected value is the lower of the two.
        expected: Math.min(k.coilSwitchV, POINTS_DROP_MAX_V),
        min: 0,
        max: POINTS_DROP_MAX_V,
        probes: probesToEarth(w.coil1, ctx.positiveEarth),
        state: `${KEY_ON} Points closed.`,
        how: sentences(
          `${num(k.currentColdA)} A x ${num(k.contactOhm, 3)} ohm points contact = ${num(k.coilSwitchV)} V; at most 0.3 V (common practice).`,
          k.coilSwitchV > POINTS_DROP_MAX_V && "The checker's contact figure (from memory) is a worn set; clean points read well under it.",
        ),
        source: "Ohm's law; limit common practice",
        ifOutOfRange: coilSwitchCauses(ctx),
      })
    : checkStep('static', 'coil-switch', 'Coil 1 with the module switched on', 'Measure from coil 1 to earth while the module holds the coil on.', [w.coil1, w.t31], {
        quantity: 'coil-switch-voltage-key-on',
        expected: k.switchV,
        min: k.switchV * 0.7,
        max: k.switchV * 1.3,
        probes: probesToEarth(w.coil1, ctx.positiveEarth),
        state: KEY_ON,
        how: `the module's switch saturation voltage, ${num(k.switchV)} V; +/- 30 % (from memory).`,
        source: 'module data',
        ifOutOfRange: coilSwitchCauses(ctx),
      });
  return [current, feed, sw];
}

function afterShutOff(ctx: SheetContext): SheetStep {
  const w = ctx.words;
  const rest = restingBattery(ctx.six);
  return checkStep('static', 'after-shut-off', 'Coil 15 and 1 after the module shuts off', 'Switch on, wait until the module has shut the coil off (its instructions say how long), then measure coil 1 to earth and coil 15 to earth: both should read the battery.', [w.coil15, w.coil1, w.t31], {
    quantity: 'coil-voltage-after-shut-off',
    expected: rest.expected,
    min: rest.min - 0.2,
    max: rest.max,
    probes: `${probesToEarth(w.coil1, ctx.positiveEarth)} Then the same on ${w.coil15}.`,
    state: 'Ignition on, engine stopped, after the module has shut off.',
    how: `no current flows after the stall shut-off, so nothing drops in the harness or coil: coil 1 = coil 15 = the battery at rest, ${num(rest.expected)} V (band ${num(rest.min)} to ${num(rest.max)} V, less 0.2 V for the meter and connections, from memory).`,
    source: 'module data',
    ifOutOfRange: afterShutOffCauses(),
  });
}

export function staticStage(ctx: SheetContext): SheetStage {
  const w = ctx.words;
  const steps: SheetStep[] = [
    doStep('static', 'battery-on', 'Battery earth lead back on', sentences('Check every new wire once more, then reconnect the battery earth lead (31) last.', ctx.positiveEarth && POSITIVE_EARTH_SENTENCE), [w.t31]),
    batteryRest(ctx),
  ];
  if (ctx.keyOnFlows) steps.push(...keyOnSteps(ctx));
  else if (ctx.afterShutOff) steps.push(afterShutOff(ctx));
  else if (ctx.kind === 'capacitive-discharge') {
    steps.push(doStep('static', 'cd-charging', 'Switch on: the module charges', 'Switch the ignition on: the module charges its capacitor (some hum or whine faintly) and no current flows in the coil. Keep clear of its output and the coil; switch off again.', [w.moduleSupply]));
  }
  return {
    id: 'static',
    title: 'Check before starting',
    intro: 'Battery back on, ignition on, engine stopped. Switch off between readings: the coil must not sit with current in it.',
    steps,
  };
}
