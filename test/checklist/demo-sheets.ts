/**
 * Sheet inputs drawn from the demo workshop (db/demo, resolved as the reference tests resolve it):
 * every demo plan, plus plans of other demo-part combinations so every kind of plan appears
 * (points kept, transistor-assisted points, breakerless fixed duty and current limited, capacitive
 * discharge; iron, ceramic and harness-wire ballasts; with and without the bypass; each tach kind;
 * a magneto as today's setup). This is the input side only: the expected values are worked out in
 * the tests themselves.
 */
import type { Engine, Part, Plan } from '../../db/schema.js';
import { compareSetups } from '../../electron/checker/index.js';
import type { SheetInput } from '../../electron/checklist/types.js';
import { buildSheet } from '../../electron/checklist/index.js';
import type { Sheet } from '../../electron/checklist/types.js';
import { conditionInputs, engineSpec, existingSetupSpec, planSetupSpec } from '../../electron/setup/index.js';
import { demoWorkshop } from '../reference/demo-workshop.js';

export const GREEN = 'Green four-door saloon';
export const BLUE = 'Blue six-cylinder tourer';
export const RED = 'Red flat-twin light car';
export const WHITE = 'White eight-cylinder coupe';

export interface SheetCase {
  label: string;
  engine: Engine;
  plan: Plan;
  parts: Part[];
  input: SheetInput;
  sheet: Sheet;
}

const w = demoWorkshop();
export const demoParts = w.parts;

export function partNamed<K extends Part['kind']>(kind: K, name: string): Extract<Part, { kind: K }> {
  const p = w.parts.find((x) => x.kind === kind && x.name === name);
  if (!p) throw new Error(`no demo ${kind} "${name}"`);
  return p as Extract<Part, { kind: K }>;
}

export function engineNamed(name: string): Engine {
  const e = w.engines.find((x) => x.name === name);
  if (!e) throw new Error(`no demo engine "${name}"`);
  return structuredClone(e);
}

/** The sheet input as the store's helper builds it: the comparison of today's setup with this plan. */
export function sheetInputFor(engine: Engine, plan: Plan, parts: readonly Part[], printedOn = '2024-05-01'): SheetInput {
  const eSpec = engineSpec(engine);
  const existing = existingSetupSpec(engine, parts);
  const setup = planSetupSpec(engine, plan, parts);
  const compared = compareSetups({ engine: eSpec, existing, candidates: [setup], conditions: conditionInputs(engine), options: { rpmPoints: 60 } });
  return {
    engine: eSpec,
    about: { yearText: engine.yearText, modelText: engine.modelText, firingOrder: engine.firingOrder, charging: engine.charging, pointsGapMm: engine.pointsGapMm },
    existing,
    plan: { name: plan.name, status: plan.status },
    setup,
    report: compared.candidates[0]!,
    existingReport: compared.existing,
    conditions: compared.conditions,
    printedOn,
  };
}

export interface PlanChoice {
  module?: string | null;
  coil?: string | null;
  ballast?: string | null;
  crankingBypass?: boolean;
  moduleFeed?: Plan['moduleFeed'];
  tach?: string | null;
  leads?: string | null;
  plug?: string | null;
  plugGapMm?: number;
}

let nextId = 500;
export function planOf(engine: Engine, name: string, c: PlanChoice): Plan {
  const id = (kind: Part['kind'], n: string | null | undefined): number | null => (n ? partNamed(kind, n).id : null);
  return {
    id: nextId++,
    engineId: engine.id,
    name,
    notes: '',
    status: 'draft',
    moduleId: id('module', c.module),
    coilId: id('coil', c.coil),
    ballastId: id('ballast', c.ballast),
    crankingBypass: c.crankingBypass ?? false,
    moduleFeed: c.moduleFeed ?? 'switched-15',
    tachId: id('tach', c.tach),
    leadsId: id('leads', c.leads),
    plugId: id('plug', c.plug),
    plugGapMm: c.plugGapMm ?? 0.8,
    updatedAt: '2024-01-01T00:00:00.000Z',
  };
}

function make(label: string, engine: Engine, plan: Plan, parts: Part[] = w.parts): SheetCase {
  const input = sheetInputFor(engine, plan, parts);
  return { label, engine, plan, parts, input, sheet: buildSheet(input) };
}

/** An engine with its ambient condition set (the bench temperature of the copper-law reading). */
export function withAmbient(e: Engine, ambientC: number | undefined): Engine {
  const copy = structuredClone(e);
  if (ambientC !== undefined) copy.conditions = { ...copy.conditions, ambientC };
  return copy;
}

/** A copy of a demo engine whose ignition today is a magneto (no coil part: the armature default). */
export function magnetoEngine(ambientC?: number): Engine {
  const e = withAmbient(engineNamed(BLUE), ambientC);
  e.existing = { ...e.existing, trigger: 'magneto', coilPartId: null, ballast: 'none', ballastPartId: null, crankingBypass: false, condenserUf: null, magnetoRatedCurrentA: 3, magnetoFullOutputRpm: 1500 };
  return e;
}

/** Every demo plan, then the other combinations; `ambientC` overrides every engine's bench temperature. */
export function allCases(ambientC?: number): SheetCase[] {
  const eng = (n: string): Engine => withAmbient(engineNamed(n), ambientC);
  const cases: SheetCase[] = w.plans.map((p) => {
    const e = w.engines.find((x) => x.id === p.engineId)!;
    return make(`demo plan: ${p.name}`, withAmbient(e, ambientC), p);
  });
  const green = eng(GREEN);
  const blue = eng(BLUE);
  const red = eng(RED);
  const white = eng(WHITE);
  cases.push(
    make('points kept, iron ballast with bypass', green, planOf(green, 'Points kept, iron ballast', { coil: 'Canister coil, 1.5 ohm, for use with ballast', ballast: 'Iron-wire ballast, 1.5 ohm', crankingBypass: true })),
    make('points kept, ceramic ballast without bypass', white, planOf(white, 'Points kept, ceramic ballast', { coil: 'Canister coil, 1.5 ohm, for use with ballast', ballast: 'Ceramic ballast block, 1.6 ohm', crankingBypass: false, tach: 'Pulse tachometer on coil negative' })),
    make('points kept, positive earth, no ballast', blue, planOf(blue, 'Points kept, plain coil', { coil: 'Canister coil, 3.0 ohm, full 12 V' })),
    make('points kept, 6 V', red, planOf(red, 'Points kept, 6 V coil', { coil: 'Six-volt canister coil, 1.4 ohm', plugGapMm: 0.6 })),
    make('points kept, harness wire, current-sensing tach', white, planOf(white, 'Points kept as today', { coil: 'Canister coil, 1.5 ohm, for use with ballast', ballast: 'Resistive feed wire in the loom, 1.4 ohm', crankingBypass: true })),
    make('transistor points, iron ballast with bypass', green, planOf(green, 'Transistor on points, iron ballast', { module: 'Points-triggered transistor unit', coil: 'Canister coil, 1.5 ohm, for use with ballast', ballast: 'Iron-wire ballast, 1.5 ohm', crankingBypass: true })),
    make('transistor points, harness wire, fed after the ballast', white, planOf(white, 'Transistor on points, feed after ballast', { module: 'Points-triggered transistor unit', coil: 'Canister coil, 1.5 ohm, for use with ballast', ballast: 'Resistive feed wire in the loom, 1.4 ohm', crankingBypass: true, moduleFeed: 'after-ballast' })),
    make('transistor points, positive earth, module-output tach', blue, planOf(blue, 'Transistor on points, tach needs output', { module: 'Points-triggered transistor unit', coil: 'Canister coil, 3.0 ohm, full 12 V', tach: 'Tachometer for a module tach output' })),
    make('current-limited, module tach output', white, planOf(white, 'Current-limited, own tach output', { module: 'Breakerless unit, current-limited', coil: 'Canister coil, 3.0 ohm, full 12 V', tach: 'Tachometer for a module tach output' })),
    make('fixed duty, ceramic ballast with bypass', green, planOf(green, 'Fixed duty behind a ballast', { module: 'Breakerless unit, fixed duty, negative earth only', coil: 'Canister coil, 1.5 ohm, for use with ballast', ballast: 'Ceramic ballast block, 1.6 ohm', crankingBypass: true, tach: 'Current-sensing tachometer (coil feed loops through it)' })),
    make('capacitive discharge, pulse tach on its output', green, planOf(green, 'CD with pulse tach', { module: 'Capacitive-discharge unit, 0.8 uF at 350 V, single spark', coil: 'Canister coil, 3.0 ohm, full 12 V', tach: 'Pulse tachometer on coil negative' })),
    make('magneto today, current-limited plan', magnetoEngine(ambientC), planOf(magnetoEngine(ambientC), 'From magneto to a current-limited module', { module: 'Breakerless unit, current-limited', coil: 'Canister coil, 3.0 ohm, full 12 V' })),
  );
  return cases;
}
