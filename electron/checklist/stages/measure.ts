/**
 * Measure what is there, engine stopped and battery disconnected: the coil's primary at the bench
 * temperature (copper law), its secondary, the ballast cold, the HT leads and the plug gap.
 * These compare the parts with their catalogue values (the plan's setup without readings).
 */
import { ballastCauses, coilPrimaryCauses, coilSecondaryCauses, leadCauses, plugGapCauses } from '../causes.js';
import type { SheetContext } from '../context.js';
import { band, COPPER_ALPHA, copperAt } from '../expected.js';
import { checkStep, doStep, sentences } from '../step.js';
import type { SheetStage, SheetStep } from '../types.js';
import { num } from '../words.js';

const STATE = 'Ignition off, battery earth lead off, leads off the coil, parts at the bench temperature.';

function coilPrimary(ctx: SheetContext): SheetStep {
  const w = ctx.words;
  const r20 = ctx.setup.coil.primaryResistanceOhm20C.value;
  const t = ctx.input.conditions.ambientC.value;
  const f = band(copperAt(r20, t), 0.1);
  return checkStep('measure', 'coil-primary', 'Coil primary resistance', 'Take the wires off the coil, zero the meter leads, and measure across the primary from 15 to 1.', [w.coil15, w.coil1], {
    quantity: 'coil-primary-resistance',
    ...f,
    probes: `One probe on ${w.coil15}, the other on ${w.coil1}; meter on its lowest ohm range, leads zeroed first.`,
    state: STATE,
    how: `${num(r20)} ohm at 20 degC x (1 + ${COPPER_ALPHA} x (${num(t, 1)} - 20)) = ${num(f.expected)} ohm at ${num(t, 1)} degC; +/- 10 % (tolerance from memory).`,
    source: 'copper law (IACS 0.00393 /K)',
    ifOutOfRange: coilPrimaryCauses(),
  });
}

function coilSecondary(ctx: SheetContext): SheetStep | null {
  const w = ctx.words;
  const ohm = ctx.setup.coil.secondaryResistanceOhm;
  if (!(Number.isFinite(ohm) && ohm > 0)) return null;
  const f = band(ohm / 1000, 0.15);
  return checkStep('measure', 'coil-secondary', 'Coil secondary resistance', 'With the wires still off, measure from the centre tower (4) to 1.', [w.coil4, w.coil1], {
    quantity: 'coil-secondary-resistance',
    ...f,
    probes: `One probe pressed into the centre tower, ${w.coil4}; the other on ${w.coil1} (some coils read to 15 instead: try both).`,
    state: STATE,
    how: `catalogue ${num(ohm, 0)} ohm = ${num(f.expected)} kohm; +/- 15 % (from memory).`,
    source: 'from memory',
    ifOutOfRange: coilSecondaryCauses(),
  });
}

function ballast(ctx: SheetContext): SheetStep | null {
  const b = ctx.setup.ballast;
  if (!b) return null;
  const f = band(b.coldResistanceOhm.value, 0.1);
  const wire = b.ballastType === 'harness-wire';
  const w = ctx.words;
  return checkStep('measure', 'ballast', wire ? 'Resistive feed wire, end to end' : 'Ballast resistance, cold', sentences(
    wire ? 'Disconnect both ends of the resistive feed wire and measure it end to end.' : 'Take the wires off the ballast and measure it end to end, cold.',
    b.ballastType === 'iron-wire' && 'An iron-wire ballast reads well under its working figure cold; that is expected.',
  ), [w.t15, w.t15a], {
    quantity: 'ballast-resistance',
    ...f,
    probes: `One probe on the ${wire ? 'switch end' : '15 end'}, the other on the ${wire ? 'coil end' : '15a end'}; leads zeroed first.`,
    state: 'Ignition off, battery earth lead off, engine cold (the ballast at the bench temperature).',
    how: `${b.name}: catalogue ${num(f.expected)} ohm cold; +/- 10 % (from memory).`,
    source: 'from memory',
    ifOutOfRange: ballastCauses(ctx),
  });
}

function leads(ctx: SheetContext): SheetStep | null {
  const l = ctx.setup.leads;
  if (!l) return null;
  const w = ctx.words;
  if (l.core === 'copper' || !(l.resistancePerLeadOhm > 1)) {
    return doStep('measure', 'ht-leads', 'HT leads', `${l.name}: copper-core leads read close to 0 ohm end to end; a lead that reads more than a few ohm has a broken core or a corroded end.`, [w.coil4], false);
  }
  const f = band(l.resistancePerLeadOhm / 1000, 0.2);
  return checkStep('measure', 'ht-leads', 'HT lead resistance', 'Take each HT lead off and measure it end to end; write down the worst.', [w.coil4, w.capCentre], {
    quantity: 'ht-lead-resistance',
    ...f,
    probes: 'One probe in each end fitting of the lead.',
    state: 'Leads off the car.',
    how: `${l.name}: catalogue ${num(l.resistancePerLeadOhm, 0)} ohm per lead = ${num(f.expected)} kohm; +/- 20 %, twice the figure: replace (from memory).`,
    source: 'from memory',
    ifOutOfRange: leadCauses(),
  });
}

function plugGap(ctx: SheetContext): SheetStep {
  const planMm = ctx.setup.plugGapM * 1000;
  const suggested = ctx.report.gap?.suggestedGapM;
  const useSuggested = typeof suggested === 'number' && Number.isFinite(suggested) && suggested > 0;
  const mm = useSuggested ? suggested * 1000 : planMm;
  const f = { expected: mm, min: mm - 0.05, max: mm + 0.05 };
  const how = useSuggested
    ? `the checker's suggested gap ${num(mm)} mm (the plan says ${num(planMm)} mm); +/- 0.05 mm.`
    : `the plan's gap ${num(planMm)} mm (the checker found no larger gap that keeps the margin); +/- 0.05 mm.`;
  return checkStep('measure', 'plug-gap', 'Plug gap', `Take the plugs out and check each gap with a feeler gauge; set them to ${num(mm)} mm.`, ['spark plugs'], {
    quantity: 'plug-gap',
    ...f,
    probes: 'Feeler gauge between the centre and side electrodes; it should slide through with a light drag.',
    state: 'Plugs out, engine stopped.',
    how,
    source: useSuggested ? 'checker' : 'the plan',
    ifOutOfRange: plugGapCauses(),
  });
}

export function measureStage(ctx: SheetContext): SheetStage {
  const steps = [coilPrimary(ctx), coilSecondary(ctx), ballast(ctx), leads(ctx), plugGap(ctx)].filter((s): s is SheetStep => s !== null);
  return {
    id: 'measure',
    title: 'Measure what is there',
    intro: 'Engine stopped, battery earth lead off: every reading here is a resistance or a gap, on the bench or on the car.',
    steps,
  };
}
