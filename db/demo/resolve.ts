/**
 * The demo names its parts rather than numbering them; these turn a demo engine or plan into the
 * stored shape once the parts have ids. The loader and the tests that draw setups from the demo
 * both resolve through here, so they can never disagree about what the demo means.
 */
import type { EngineInput, PartKind, PlanInput, ReadingInput } from '../schema.js';
import type { DemoEngine } from './engines.js';
import type { DemoPlan } from './plans.js';

/** Looks up a demo part's id by kind and name (null stays null); throws if the demo names a missing part. */
export type PartRef = (kind: PartKind, name: string | null) => number | null;

export function resolveDemoEngine(e: DemoEngine, ref: PartRef): EngineInput {
  const { coilPart, ballastPart, tachPart, leadsPart, plugPart, ...existing } = e.existing;
  return {
    ...e,
    existing: {
      ...existing,
      coilPartId: ref('coil', coilPart),
      ballastPartId: ref('ballast', ballastPart),
      tachPartId: ref('tach', tachPart),
      leadsPartId: ref('leads', leadsPart),
      plugPartId: ref('plug', plugPart),
    },
  };
}

export function resolveDemoPlan(p: DemoPlan, engineId: number, ref: PartRef): { plan: PlanInput; readings: Omit<ReadingInput, 'planId'>[] } {
  const { engine: _engine, module, coil, ballast, tach, leads, plug, readings, ...rest } = p;
  return {
    plan: {
      ...rest,
      engineId,
      moduleId: ref('module', module),
      coilId: ref('coil', coil),
      ballastId: ref('ballast', ballast),
      tachId: ref('tach', tach),
      leadsId: ref('leads', leads),
      plugId: ref('plug', plug),
    },
    readings,
  };
}
