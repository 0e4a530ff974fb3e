/** Plan and bin files for the command line, written from the demo workshop's records. */
import { demoEngines, demoParts, type DemoEngine } from '../../db/demo/index.js';
import type { DemoPlan } from '../../db/demo/plans.js';
import type { PartInput } from '../../db/schema.js';

export function demoPart(kind: PartInput['kind'], name: string): PartInput {
  const p = demoParts.find((x) => x.kind === kind && x.name === name);
  if (!p) throw new Error(`No demo ${kind} named "${name}".`);
  return p;
}

export function existingOf(e: DemoEngine): Record<string, unknown> {
  const x = e.existing;
  return {
    trigger: x.trigger,
    coil: x.coilPart ? demoPart('coil', x.coilPart) : null,
    ballast: x.ballast,
    ballastPart: x.ballastPart ? demoPart('ballast', x.ballastPart) : null,
    crankingBypass: x.crankingBypass,
    condenserUf: x.condenserUf,
    tach: x.tachPart ? demoPart('tach', x.tachPart) : null,
    leads: x.leadsPart ? demoPart('leads', x.leadsPart) : null,
    plug: x.plugPart ? demoPart('plug', x.plugPart) : null,
    plugGapMm: x.plugGapMm,
    ...(x.magnetoRatedCurrentA != null ? { magnetoRatedCurrentA: x.magnetoRatedCurrentA } : {}),
    ...(x.magnetoFullOutputRpm != null ? { magnetoFullOutputRpm: x.magnetoFullOutputRpm } : {}),
  };
}

export function engineOf(e: DemoEngine): Record<string, unknown> {
  const { existing: _existing, ...engine } = e;
  return engine;
}

/** A plan file for `engine` with each named module as a candidate on the coil fitted today. */
export function planWithModules(e: DemoEngine, moduleNames: readonly string[]): Record<string, unknown> {
  return {
    engine: engineOf(e),
    existing: existingOf(e),
    candidates: moduleNames.map((name) => ({
      name: `${name} on the existing coil`,
      module: demoPart('module', name),
      coil: null,
      ballast: null,
      crankingBypass: false,
      moduleFeed: 'switched-15',
      plugGapMm: e.existing.plugGapMm,
    })),
    options: { rpmPoints: 60 },
  };
}

/** A plan file holding one demo plan as its only candidate, every part written inline. */
export function planFileOf(plan: DemoPlan): Record<string, unknown> {
  const engine = demoEngines.find((e) => e.name === plan.engine)!;
  const part = (kind: Parameters<typeof demoPart>[0], name: string | null) => (name ? demoPart(kind, name) : null);
  return {
    engine: engineOf(engine),
    existing: existingOf(engine),
    candidates: [
      {
        name: plan.name,
        module: part('module', plan.module),
        coil: part('coil', plan.coil),
        ballast: part('ballast', plan.ballast),
        crankingBypass: plan.crankingBypass,
        moduleFeed: plan.moduleFeed,
        tach: part('tach', plan.tach),
        leads: part('leads', plan.leads),
        plug: part('plug', plan.plug),
        plugGapMm: plan.plugGapMm,
      },
    ],
    options: { rpmPoints: 60 },
  };
}

export { demoEngines, demoParts };
