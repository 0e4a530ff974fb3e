/**
 * The setups the ngspice reference tests run: every demo engine's existing setup, every demo
 * plan, and further demo-part combinations so that every module type appears (points,
 * transistor-assisted points, fixed duty, current-limited, capacitive discharge).
 */
import type { Plan } from '../../db/schema.js';
import { checkSetup, type ConditionInputs, type EngineSpec, type SetupReport, type SetupSpec } from '../../electron/checker/index.js';
import { conditionInputs, engineSpec, existingSetupSpec, planSetupSpec } from '../../electron/setup/index.js';
import { demoWorkshop } from './demo-workshop.js';

export interface ReferenceSetup {
  label: string;
  engine: EngineSpec;
  conditions: ConditionInputs;
  spec: SetupSpec;
  report: SetupReport;
}

/** Extra combinations of demo parts: engine name, module name, coil name, ballast name or null. */
const extraCombinations: ReadonlyArray<readonly [string, string, string, string | null]> = [
  ['Green four-door saloon', 'Points-triggered transistor unit', 'Canister coil, 1.5 ohm, for use with ballast', 'Iron-wire ballast, 1.5 ohm'],
  ['Green four-door saloon', 'Capacitive-discharge unit, 0.8 uF at 350 V, single spark', 'Canister coil, 3.0 ohm, full 12 V', null],
  ['White eight-cylinder coupe', 'Breakerless unit, current-limited', 'Low-resistance performance coil, 0.7 ohm', null],
  ['Green four-door saloon', 'Breakerless unit, fixed duty, negative earth only', 'Sports canister coil, 3.3 ohm', null],
  ['White eight-cylinder coupe', 'Points-triggered transistor unit', 'Canister coil, 1.5 ohm, for use with ballast', 'Ceramic ballast block, 1.6 ohm'],
];

export function referenceSetups(rpmPoints = 200): ReferenceSetup[] {
  const w = demoWorkshop();
  const out: ReferenceSetup[] = [];
  const options = { rpmPoints, skipGapSuggestion: true };
  const add = (engineId: number, spec: SetupSpec): void => {
    const e = w.engines.find((x) => x.id === engineId)!;
    const engine = engineSpec(e);
    const conditions = conditionInputs(e);
    out.push({ label: `${e.name}: ${spec.label}`, engine, conditions, spec, report: checkSetup(engine, spec, conditions, options) });
  };
  for (const e of w.engines) add(e.id, existingSetupSpec(e, w.parts));
  for (const p of w.plans) add(p.engineId, planSetupSpec(w.engines.find((e) => e.id === p.engineId)!, p, w.parts));
  let nextId = 1000;
  for (const [engineName, moduleName, coilName, ballastName] of extraCombinations) {
    const e = w.engines.find((x) => x.name === engineName)!;
    const id = (kind: string, name: string | null): number | null =>
      name === null ? null : w.parts.find((p) => p.kind === kind && p.name === name)!.id;
    const plan: Plan = {
      id: nextId++,
      engineId: e.id,
      name: `${moduleName} with ${coilName}${ballastName ? ` and ${ballastName}` : ''}`,
      notes: '',
      status: 'draft',
      moduleId: id('module', moduleName),
      coilId: id('coil', coilName),
      ballastId: id('ballast', ballastName),
      crankingBypass: ballastName !== null,
      moduleFeed: 'switched-15',
      tachId: null,
      leadsId: null,
      plugId: null,
      plugGapMm: 0.8,
      updatedAt: '2024-01-01T00:00:00.000Z',
    };
    add(e.id, planSetupSpec(e, plan, w.parts));
  }
  return out;
}
