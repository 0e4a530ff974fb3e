/**
 * Cranking: the battery while the starter turns (the checker's cranking supply), coil 15 (with the
 * bypass: the cranking supply less the harness drop; without: the divider at the cranking supply),
 * and the module's own supply against its minimum.
 */
import { coilFeedCrankingCauses, crankingSupplyCauses, moduleSupplyCrankingCauses } from '../causes.js';
import type { SheetContext } from '../context.js';
import { crankingFeed, restingBattery } from '../expected.js';
import { checkStep } from '../step.js';
import type { SheetStage, SheetStep } from '../types.js';
import { batteryProbes, num, ohmSum, probesToEarth, provenanceWords } from '../words.js';

const CRANKING = 'Starter turning the engine; ignition on. Have a helper crank for no more than ten seconds.';

function battery(ctx: SheetContext): SheetStep {
  const w = ctx.words;
  const v = ctx.circuit.crankingSupplyV;
  const rest = restingBattery(ctx.six);
  const prov = ctx.input.conditions.crankingSupplyV.provenance;
  return checkStep('cranking', 'battery', 'Battery while cranking', 'Measure across the battery posts while a helper cranks the engine.', [w.t30, w.t31], {
    quantity: 'supply-voltage-cranking',
    expected: v,
    min: v * 0.95,
    max: Math.max(rest.max, v * 1.05),
    probes: batteryProbes(ctx.positiveEarth),
    state: CRANKING,
    how: `the checker's cranking supply, ${num(v)} V (${provenanceWords(prov)}); no lower than 5 % under it, and never above the battery at rest.`,
    source: 'checker',
    ifOutOfRange: crankingSupplyCauses(),
  });
}

function coilFeed(ctx: SheetContext): SheetStep | null {
  if (ctx.kind === 'capacitive-discharge') return null;
  const w = ctx.words;
  const f = crankingFeed(ctx);
  const drive = ctx.circuit.switchDropV > 0 ? `(${num(f.supplyV)} - ${num(ctx.circuit.switchDropV)}) V` : `${num(f.supplyV)} V`;
  const current = `I = ${drive} / ${ohmSum(f.resistances)} = ${num(f.currentA)} A`;
  const how = ctx.bypass
    ? `with the bypass the ballast is out of the path: ${current}; coil 15 = ${num(f.supplyV)} V - ${num(f.currentA)} A x ${num(f.dropOhm)} ohm harness = ${num(f.coilFeedV)} V (switch closed; +/- 10 %, from memory).`
    : `${current}; coil 15 = ${num(f.supplyV)} V - ${num(f.currentA)} A x ${ohmSum([ctx.circuit.harnessResistanceOhm, ctx.ballast ? ctx.circuit.ballastResistanceColdOhm : 0])} = ${num(f.coilFeedV)} V (${ctx.ballast ? 'harness and ballast' : 'harness'} drop at the cranking supply; switch closed; +/- 10 %, from memory).`;
  return checkStep('cranking', 'coil-feed', 'Coil 15 while cranking', 'Measure from coil 15 to earth while a helper cranks.', [w.coil15, w.t31], {
    quantity: 'coil-feed-voltage-cranking',
    expected: f.coilFeedV,
    min: f.coilFeedV * 0.9,
    max: f.coilFeedV * 1.1,
    probes: probesToEarth(w.coil15, ctx.positiveEarth),
    state: CRANKING,
    how,
    source: "Ohm's law; cranking supply from the checker",
    ifOutOfRange: coilFeedCrankingCauses(ctx),
  });
}

function moduleSupply(ctx: SheetContext): SheetStep | null {
  const m = ctx.module;
  const v = ctx.circuit.moduleSupplyCrankingV;
  if (!m || v === null) return null;
  const w = ctx.words;
  const below = v < m.supplyMinV;
  return checkStep('cranking', 'module-supply', 'Module supply while cranking', 'Measure from the module supply terminal to its earth while a helper cranks.', [w.moduleSupply, w.moduleEarth], {
    quantity: 'module-supply-voltage-cranking',
    expected: v,
    min: m.supplyMinV,
    max: m.supplyMaxV,
    probes: ctx.positiveEarth
      ? `Red probe on the ${w.moduleEarth} (31 side; battery positive on this car), black probe on the ${w.moduleSupply}.`
      : `Red probe on the ${w.moduleSupply}, black probe on the ${w.moduleEarth}.`,
    state: CRANKING,
    how: `the checker's module supply while cranking, ${num(v)} V (the cranking supply less the feed drop); the module needs ${num(m.supplyMinV)} to ${num(m.supplyMaxV)} V.${below ? ' That is below its minimum: the checker flags it.' : ''}`,
    source: 'module data',
    ifOutOfRange: moduleSupplyCrankingCauses(ctx),
  });
}

export function crankingStage(ctx: SheetContext): SheetStage {
  return {
    id: 'cranking',
    title: 'Cranking',
    intro: 'Ignition on, a helper on the starter; keep hands, leads and clothing clear of the fan and belts.',
    steps: [battery(ctx), coilFeed(ctx), moduleSupply(ctx)].filter((s): s is SheetStep => s !== null),
  };
}
