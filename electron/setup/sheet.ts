/**
 * A stored engine, plan, parts and readings to the wiring sheet's input (`SheetInput`,
 * electron/checklist/types.ts). The checker runs here once, on the existing setup beside this plan
 * with its readings applied (the same comparison `check.plans` makes), so the expected readings
 * with the car wired come from the circuit the plan will really have; the bench measurements
 * (coil, ballast, leads) are expected to match the catalogue, so `setup` is the plan without readings.
 */
import type { Engine, Part, Plan, Reading } from '../../db/schema.js';
import { compareSetups } from '../checker/index.js';
import type { SheetInput } from '../checklist/types.js';
import { comparisonInput, planSetupSpec } from './setups.js';

/** Today in the local calendar, YYYY-MM-DD: the date printed on the sheet. */
export function localDate(d = new Date()): string {
  const two = (n: number): string => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${two(d.getMonth() + 1)}-${two(d.getDate())}`;
}

export function sheetInput(engine: Engine, plan: Plan, parts: readonly Part[], readings: readonly Reading[], printedOn: string): SheetInput {
  const input = comparisonInput(engine, [plan], parts, new Map([[plan.id, readings]]));
  const compared = compareSetups(input);
  const report = compared.candidates[0];
  if (!report) throw new Error('The checker returned no report for the plan.');
  return {
    engine: input.engine,
    about: {
      yearText: engine.yearText,
      modelText: engine.modelText,
      firingOrder: engine.firingOrder,
      charging: engine.charging,
      pointsGapMm: engine.pointsGapMm,
    },
    existing: input.existing,
    plan: { name: plan.name, status: plan.status },
    setup: planSetupSpec(engine, plan, parts),
    report,
    existingReport: compared.existing,
    conditions: compared.conditions,
    printedOn,
  };
}
