/**
 * Stored engine + parts + plan to the checker's setups and inputs. The existing setup comes from
 * the engine record; a plan names the module, coil and ballast to fit and how they are wired,
 * and anything it leaves out (coil, tach, leads, plug) stays as the engine has it today.
 */
import type { Engine, Part, Plan, Reading } from '../../db/schema.js';
import type { BallastSpec, CheckOptions, CoilSpec, ComparisonInput, SearchInput, SetupSpec } from '../checker/types.js';
import { conditionInputs, engineSpec } from './engine.js';
import { SetupAdapterError } from './errors.js';
import { ballastSpec, coilSpec, defaultHarnessWire, latestReading, leadsSpec, moduleSpec, partOf, plugSpec, tachSpec } from './parts.js';

/** A magneto whose armature is not described by a coil part (from memory; labelled in the report). */
export function defaultMagnetoArmature(): CoilSpec {
  return {
    name: 'Magneto armature (assumed)',
    primaryResistanceOhm20C: { value: 0.6, provenance: 'default (from memory)' },
    primaryInductanceH: 0.01,
    secondaryResistanceOhm: 5000,
    turnsRatio: 60,
    secondaryInductanceH: null,
    forBallast: false,
    ratedVoltageV: 12,
    maxDissipationW: null,
  };
}

function ambientOf(e: Engine): number {
  return e.conditions.ambientC ?? 20;
}

export function existingSetupSpec(e: Engine, parts: readonly Part[]): SetupSpec {
  const x = e.existing;
  let coil: CoilSpec;
  if (x.coilPartId !== null) coil = coilSpec(partOf(parts, x.coilPartId, 'coil', 'existing coil'), undefined, ambientOf(e));
  else if (x.trigger === 'magneto') coil = defaultMagnetoArmature();
  else throw new SetupAdapterError('INVALID_INPUT', `Pick the coil fitted to ${e.name} today, so the new setup can be compared with it.`);
  let ballast: BallastSpec | null = null;
  if (x.ballast !== 'none') {
    ballast = x.ballastPartId !== null ? ballastSpec(partOf(parts, x.ballastPartId, 'ballast', 'existing ballast')) : x.ballast === 'harness-wire' ? defaultHarnessWire() : null;
    if (!ballast) throw new SetupAdapterError('INVALID_INPUT', 'Pick the ballast resistor fitted, or set the ballast to none.');
  }
  return {
    label: 'Existing setup',
    switching: x.trigger,
    coil,
    ballast,
    crankingBypass: x.crankingBypass,
    moduleFeed: 'switched-15',
    module: null,
    condenserF: x.condenserUf !== null ? x.condenserUf * 1e-6 : null,
    tach: x.tachPartId !== null ? tachSpec(partOf(parts, x.tachPartId, 'tach', 'tachometer')) : null,
    leads: x.leadsPartId !== null ? leadsSpec(partOf(parts, x.leadsPartId, 'leads', 'ignition leads')) : null,
    plug: x.plugPartId !== null ? plugSpec(partOf(parts, x.plugPartId, 'plug', 'spark plug')) : null,
    plugGapM: x.plugGapMm / 1000,
    magneto:
      x.trigger === 'magneto' && x.magnetoRatedCurrentA != null && x.magnetoFullOutputRpm != null
        ? { ratedCurrentA: x.magnetoRatedCurrentA, fullOutputRpm: x.magnetoFullOutputRpm }
        : null,
    coilWiring: x.coilWiring ?? 'as-marked-for-earth',
  };
}

/**
 * A plan's setup. Readings taken on the plan (a coil resistance, a ballast resistance, an HT lead
 * resistance, a plug gap) override the catalogue values and are marked measured.
 */
export function planSetupSpec(e: Engine, plan: Plan, parts: readonly Part[], readings?: readonly Reading[]): SetupSpec {
  if (plan.engineId !== e.id) throw new SetupAdapterError('INVALID_INPUT', `The plan "${plan.name}" belongs to another engine.`);
  const existing = existingSetupSpec(e, parts);
  const mod = plan.moduleId !== null ? moduleSpec(partOf(parts, plan.moduleId, 'module', 'ignition module')) : null;
  const coilPart = plan.coilId !== null ? partOf(parts, plan.coilId, 'coil', 'coil') : e.existing.coilPartId !== null ? partOf(parts, e.existing.coilPartId, 'coil', 'existing coil') : null;
  if (!coilPart) throw new SetupAdapterError('INVALID_INPUT', `The plan "${plan.name}" needs a coil: pick one, or record the coil fitted today.`);
  const gapReading = latestReading(readings, 'plug-gap');
  return {
    label: plan.name,
    switching: mod ? mod.moduleType : 'points',
    coil: coilSpec(coilPart, readings, ambientOf(e)),
    ballast: plan.ballastId !== null ? ballastSpec(partOf(parts, plan.ballastId, 'ballast', 'ballast'), readings) : null,
    crankingBypass: plan.crankingBypass,
    moduleFeed: plan.moduleFeed,
    module: mod,
    // A module switches the coil itself; the points condenser comes off (the checklist says so).
    condenserF: mod ? null : (existing.condenserF ?? 0.22e-6),
    tach: plan.tachId !== null ? tachSpec(partOf(parts, plan.tachId, 'tach', 'tachometer')) : existing.tach,
    // The leads on the car (the plan's, or today's kept): a measured lead resistance wins either way.
    leads:
      plan.leadsId !== null
        ? leadsSpec(partOf(parts, plan.leadsId, 'leads', 'ignition leads'), readings)
        : e.existing.leadsPartId !== null
          ? leadsSpec(partOf(parts, e.existing.leadsPartId, 'leads', 'ignition leads'), readings)
          : null,
    plug: plan.plugId !== null ? plugSpec(partOf(parts, plan.plugId, 'plug', 'spark plug')) : existing.plug,
    plugGapM: gapReading && gapReading.value > 0 && gapReading.value <= 3 ? gapReading.value / 1000 : plan.plugGapMm / 1000,
    magneto: null,
    coilWiring: plan.coilWiring ?? 'as-marked-for-earth',
  };
}

/** The comparison for an engine and up to three of its plans. */
export function comparisonInput(e: Engine, plans: readonly Plan[], parts: readonly Part[], readingsByPlan?: ReadonlyMap<number, readonly Reading[]>, options?: CheckOptions): ComparisonInput {
  if (plans.length > 3) throw new SetupAdapterError('INVALID_INPUT', 'Compare at most three plans with the existing setup at once.');
  const allReadings = plans.flatMap((p) => readingsByPlan?.get(p.id) ?? []);
  const input: ComparisonInput = {
    engine: engineSpec(e),
    existing: existingSetupSpec(e, parts),
    candidates: plans.map((p) => planSetupSpec(e, p, parts, readingsByPlan?.get(p.id))),
    conditions: conditionInputs(e, allReadings),
  };
  if (options) input.options = options;
  return input;
}

/** The parts-bin search for an engine: every coil, module and ballast in `parts`, and the shelf's tachs, leads and plugs. */
export function searchInput(e: Engine, parts: readonly Part[], topN = 5, options?: CheckOptions): SearchInput {
  const existing = existingSetupSpec(e, parts);
  const input: SearchInput = {
    engine: engineSpec(e),
    existing,
    coils: parts.flatMap((p) => (p.kind === 'coil' ? [coilSpec(p, undefined, ambientOf(e))] : [])),
    modules: parts.flatMap((p) => (p.kind === 'module' ? [moduleSpec(p)] : [])),
    ballasts: parts.flatMap((p) => (p.kind === 'ballast' ? [ballastSpec(p)] : [])),
    tach: existing.tach,
    leads: existing.leads,
    plug: existing.plug,
    plugGapM: existing.plugGapM,
    // The shelf's other tachs, leads and plugs, tried where today's make a combination fail.
    shelf: {
      tachs: parts.flatMap((p) => (p.kind === 'tach' ? [tachSpec(p)] : [])),
      leads: parts.flatMap((p) => (p.kind === 'leads' ? [leadsSpec(p)] : [])),
      plugs: parts.flatMap((p) => (p.kind === 'plug' ? [plugSpec(p)] : [])),
    },
    conditions: conditionInputs(e),
    topN,
  };
  if (options) input.options = options;
  return input;
}
