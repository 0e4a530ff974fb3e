/**
 * The demo workshop (db/demo) as stored records, without a database: parts numbered 1..N in
 * their demo order, engines and plans resolved from part names to ids by the demo loader's own resolver. Used
 * by the reference and command-line tests to draw setups from the demo parts.
 */
import type { Engine, Part, Plan } from '../../db/schema.js';
import { demoEngines, demoParts, demoPlans, resolveDemoEngine, resolveDemoPlan, type PartRef } from '../../db/demo/index.js';

export interface DemoWorkshop {
  parts: Part[];
  engines: Engine[];
  plans: Plan[];
}

export function demoWorkshop(): DemoWorkshop {
  const parts = demoParts.map((p, i) => ({ ...p, id: i + 1, updatedAt: '2024-01-01T00:00:00.000Z' }) as Part);
  const ref: PartRef = (kind, name) => {
    if (name === null) return null;
    const found = parts.find((p) => p.kind === kind && p.name === name);
    if (!found) throw new Error(`The demo names a ${kind} "${name}" that is not in its parts bin.`);
    return found.id;
  };
  const engines: Engine[] = demoEngines.map((e, i) => ({ ...resolveDemoEngine(e, ref), id: i + 1, updatedAt: '2024-01-01T00:00:00.000Z' }));
  const plans: Plan[] = demoPlans.map((p, i) => {
    const e = engines.find((x) => x.name === p.engine);
    if (!e) throw new Error(`The demo plan "${p.name}" names an engine "${p.engine}" that is not in the demo.`);
    return { ...resolveDemoPlan(p, e.id, ref).plan, id: i + 1, updatedAt: '2024-01-01T00:00:00.000Z' };
  });
  return { parts, engines, plans };
}

export function partsOfKind<K extends Part['kind']>(parts: readonly Part[], kind: K): Extract<Part, { kind: K }>[] {
  return parts.filter((p): p is Extract<Part, { kind: K }> => p.kind === kind);
}
