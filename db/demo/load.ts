/**
 * Loading the demo workshop.
 *
 * First run: `loadDemoIfFirstRun` loads the demo only into an empty store and only once in the
 * file's life. The `demo_loaded` meta flag is set either way, so a user who deletes everything
 * gets an empty workshop next time, not the demo back.
 *
 * On demand: `loadDemo` adds whatever of the demo is missing, in one transaction. A part is matched
 * by kind and name, an engine by name, a plan by name within its engine; anything already there
 * is reused, not copied, so loading twice adds nothing the second time.
 */
import type { Part, PartKind } from '../schema.js';
import type { Repositories } from '../repositories/index.js';
import { demoEngines } from './engines.js';
import { demoParts } from './parts.js';
import { demoPlans } from './plans.js';
import { resolveDemoEngine, resolveDemoPlan, type PartRef } from './resolve.js';

export const DEMO_FLAG = 'demo_loaded';

export type DemoCounts = { enginesAdded: number; partsAdded: number; plansAdded: number };

export function loadDemo(repos: Repositories): DemoCounts {
  return repos.transaction(() => {
    const counts: DemoCounts = { enginesAdded: 0, partsAdded: 0, plansAdded: 0 };

    const partIds = new Map<string, number>();
    for (const p of demoParts) {
      let stored: Part | null = repos.parts.findByName(p.kind, p.name);
      if (!stored) {
        stored = repos.parts.create(p);
        counts.partsAdded++;
      }
      partIds.set(key(p.kind, p.name), stored.id);
    }
    const ref: PartRef = (kind, name) => {
      if (name === null) return null;
      const found = partIds.get(key(kind, name));
      if (found === undefined) throw new Error(`Demo data names a ${kind} "${name}" that is not in the demo parts bin.`);
      return found;
    };

    const engineIds = new Map<string, number>();
    const existingEngines = new Map(repos.engines.list().map((e) => [e.name, e.id]));
    for (const e of demoEngines) {
      let id = existingEngines.get(e.name);
      if (id === undefined) {
        id = repos.engines.create(resolveDemoEngine(e, ref)).id;
        counts.enginesAdded++;
      }
      engineIds.set(e.name, id);
    }

    for (const demoPlan of demoPlans) {
      const engineId = engineIds.get(demoPlan.engine);
      if (engineId === undefined) throw new Error(`Demo plan "${demoPlan.name}" names an engine "${demoPlan.engine}" that is not in the demo.`);
      if (repos.plans.list(engineId).some((p) => p.name === demoPlan.name)) continue;
      const { plan, readings } = resolveDemoPlan(demoPlan, engineId, ref);
      const stored = repos.plans.create(plan);
      counts.plansAdded++;
      for (const r of readings) repos.readings.add({ ...r, planId: stored.id });
    }

    repos.meta.set(DEMO_FLAG, `loaded ${new Date().toISOString()}`);
    return counts;
  });
}

/** Loads the demo into a brand-new, empty store; returns null when it did nothing. */
export function loadDemoIfFirstRun(repos: Repositories): DemoCounts | null {
  return repos.transaction(() => {
    if (repos.meta.get(DEMO_FLAG) !== null) return null;
    if (repos.engines.count() + repos.parts.count() + repos.plans.count() > 0) {
      // A file that already holds someone's work never gets the demo mixed in uninvited.
      repos.meta.set(DEMO_FLAG, 'skipped: the store already held data');
      return null;
    }
    return loadDemo(repos);
  });
}

function key(kind: PartKind, name: string): string {
  return `${kind}\u0000${name.trim()}`;
}
