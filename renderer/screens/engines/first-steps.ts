/**
 * The first-run path on the engines screen: four steps from a bare workshop to a sheet at the car,
 * each ticked off from what the store holds, never from what the person clicked. The demo
 * workshop's own engines, parts and plans (db/demo, matched by name: demo-names.ts) do not count: the steps are
 * about the person's car. Pure, so it is tested on its own.
 */
import { demoEngineNames, demoPartNames, demoPlanNames } from './demo-names.js';
import type { Route } from '../../app/routes.js';

export type StepId = 'engine' | 'shelf' | 'weigh' | 'sheet';

/** What the store shows, as fetched through the bridge. `plansWorked`: plans of the person's own with a ticked step or a reading. */
export type Evidence = {
  engines: readonly { name: string }[];
  parts: readonly { kind: string; name: string }[];
  plans: readonly { id: number; name: string; status: string }[];
  plansWorked: number;
};

export type Step = { id: StepId; title: string; what: string; link: string; route: Route; done: boolean; doneWords: string };

const demoEngines = new Set(demoEngineNames);
const demoPartKeys = new Set(demoPartNames.map(([kind, name]) => `${kind}\u0000${name}`));
const demoPlans = new Set(demoPlanNames);

export const ownEngines = <E extends { name: string }>(engines: readonly E[]): E[] => engines.filter((e) => !demoEngines.has(e.name));
export const ownParts = <P extends { kind: string; name: string }>(parts: readonly P[]): P[] => parts.filter((p) => !demoPartKeys.has(`${p.kind}\u0000${p.name}`));
export const ownPlans = <P extends { name: string }>(plans: readonly P[]): P[] => plans.filter((p) => !demoPlans.has(p.name));

const count = (n: number, one: string, many: string): string => `${n} ${n === 1 ? one : many}`;

export function firstSteps(e: Evidence): Step[] {
  const engines = ownEngines(e.engines).length;
  const parts = ownParts(e.parts).length;
  const plans = ownPlans(e.plans);
  const wiredOrFinished = plans.filter((p) => p.status === 'wired' || p.status === 'done').length;
  const worked = Math.max(e.plansWorked, wiredOrFinished);
  return [
    {
      id: 'engine',
      title: 'Catalogue your car',
      what: 'Its engine: bore, stroke, speeds, and the ignition it has today.',
      link: engines > 0 ? 'Add another engine' : 'Add your engine',
      route: { to: 'new-engine' },
      done: engines > 0,
      doneWords: `${count(engines, 'engine', 'engines')} of yours in the workshop.`,
    },
    {
      id: 'shelf',
      title: 'Put the parts you have on the shelf',
      what: 'Coils, ballasts, modules, leads and plugs, with the figures from the box or your meter.',
      link: 'Open the shelf',
      route: { to: 'parts' },
      done: parts > 0,
      doneWords: `${count(parts, 'part', 'parts')} of yours on the shelf.`,
    },
    {
      id: 'weigh',
      title: 'Weigh a combination',
      what: 'Make a plan from the shelf and see it beside what the car has now.',
      link: 'Weigh a combination',
      route: { to: 'combination' },
      done: plans.length > 0,
      doneWords: `${count(plans.length, 'plan', 'plans')} of yours made.`,
    },
    {
      id: 'sheet',
      title: 'Print the sheet and work through it',
      what: 'Take the wiring sheet to the car; tick the steps and write in your readings.',
      link: 'Open the wiring sheet',
      route: { to: 'sheet' },
      done: worked > 0,
      doneWords: `Steps ticked or readings taken on ${count(worked, 'plan', 'plans')} of yours.`,
    },
  ];
}
