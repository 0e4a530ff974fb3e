/**
 * The demo workshop (db/demo) as stored records, without a database: parts numbered 1..N in
 * their demo order, engines resolved from part names to ids the way the demo loader does. Used
 * by the reference and command-line tests to draw setups from the demo parts.
 */
import type { Engine, Part, PartKind, Plan } from '../../db/schema.js';
import { demoEngines, demoParts, demoPlans } from '../../db/demo/index.js';

export interface DemoWorkshop {
  parts: Part[];
  engines: Engine[];
  plans: Plan[];
}

export function demoWorkshop(): DemoWorkshop {
  const parts = demoParts.map((p, i) => ({ ...p, id: i + 1 }) as Part);
  const ref = (kind: PartKind, name: string | null): number | null => {
    if (name === null) return null;
    const found = parts.find((p) => p.kind === kind && p.name === name);
    if (!found) throw new Error(`The demo names a ${kind} "${name}" that is not in its parts bin.`);
    return found.id;
  };
  const engines: Engine[] = demoEngines.map((e, i) => {
    const { coilPart, ballastPart, tachPart, leadsPart, plugPart, ...existing } = e.existing;
    return {
      ...e,
      id: i + 1,
      existing: {
        ...existing,
        coilPartId: ref('coil', coilPart),
        ballastPartId: ref('ballast', ballastPart),
        tachPartId: ref('tach', tachPart),
        leadsPartId: ref('leads', leadsPart),
        plugPartId: ref('plug', plugPart),
      },
    };
  });
  const plans: Plan[] = demoPlans.map(({ engine, module, coil, ballast, tach, leads, plug, readings: _readings, ...rest }, i) => {
    const e = engines.find((x) => x.name === engine);
    if (!e) throw new Error(`The demo plan "${rest.name}" names an engine "${engine}" that is not in the demo.`);
    return {
      ...rest,
      id: i + 1,
      engineId: e.id,
      moduleId: ref('module', module),
      coilId: ref('coil', coil),
      ballastId: ref('ballast', ballast),
      tachId: ref('tach', tach),
      leadsId: ref('leads', leads),
      plugId: ref('plug', plug),
      updatedAt: '2024-01-01T00:00:00.000Z',
    };
  });
  return { parts, engines, plans };
}

export function partsOfKind<K extends Part['kind']>(parts: readonly Part[], kind: K): Extract<Part, { kind: K }>[] {
  return parts.filter((p): p is Extract<Part, { kind: K }> => p.kind === kind);
}
