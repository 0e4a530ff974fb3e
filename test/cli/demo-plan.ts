/** Plan and bin files for the command line, written from the demo workshop's records. */
import { demoEngines, demoParts, type DemoEngine } from '../../db/demo/index.js';
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

export { demoEngines, demoParts };
