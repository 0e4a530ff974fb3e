/**
 * The wiring-sheet requests over the store: 'sheet.get', 'sheet.tick', and the plan status moving
 * forward when the work on the sheet reached it. The sheet is built by `buildSheet`
 * (electron/checklist) from the adapter's `sheetInput`, which runs the checker on the plan with its
 * readings; ticks and readings are judged with `sheetProgress` and `judgeReading`.
 *
 * Status: 'check.plans' moves a weighed plan from draft to checked; a tick or a reading moves it
 * forward to 'wired' (every fitting step ticked) or 'done' (also every check reading in its band),
 * never backwards; 'plans.setStatus' sets any status by hand.
 */
import { StoreError } from '../../db/errors.js';
import type { Plan, PlanStatus, Reading } from '../../db/schema.js';
import type { Repositories } from '../../db/repositories/index.js';
import { buildSheet, judgeReading, sheetProgress, stepForQuantity } from '../checklist/index.js';
import { SheetInputError } from '../checklist/errors.js';
import type { Sheet, SheetProgress, TakenReading } from '../checklist/types.js';
import { localDate, sheetInput } from '../setup/sheet.js';
import type { SheetAnswer } from './channels.js';
import { adapting } from './check-handlers.js';
import { AppFailure } from './failure.js';

const RANK: Record<PlanStatus, number> = { draft: 0, checked: 1, wired: 2, done: 3 };

type Built = { plan: Plan; sheet: Sheet; readings: Reading[] };

/** The plan's sheet as it stands, with the readings it was built from. */
function build(repos: Repositories, planId: number): Built {
  const plan = repos.plans.get(planId);
  const engine = repos.engines.get(plan.engineId);
  const parts = repos.parts.list();
  const readings = repos.readings.list(planId);
  const sheet = adapting(() => {
    try {
      return buildSheet(sheetInput(engine, plan, parts, readings, localDate()));
    } catch (err) {
      if (err instanceof SheetInputError) throw new AppFailure('INVALID_INPUT', `The wiring sheet for “${plan.name}” cannot be made yet: ${err.message}`);
      throw err;
    }
  });
  return { plan, sheet, readings };
}

const stepKeysOf = (sheet: Sheet): Set<string> => new Set(sheet.stages.flatMap((s) => s.steps.map((step) => step.key)));

const taken = (readings: readonly Reading[]): TakenReading[] =>
  readings.map((r) => ({ id: r.id, quantity: r.quantity, value: r.value, unit: r.unit, takenOn: r.takenOn }));

/**
 * Moves the plan forward to what the work reached, never backwards; returns the plan as it is
 * afterwards. A plan already past that point is left alone.
 */
function moveForward(repos: Repositories, plan: Plan, progress: SheetProgress): Plan {
  if (progress.reached === 'none' || RANK[plan.status] >= RANK[progress.reached]) return plan;
  return repos.plans.setStatus(plan.id, progress.reached);
}

/** The answer for a built sheet; with `advance`, the status first moves forward if the work reached it. */
function answer(repos: Repositories, built: Built, advance: boolean): SheetAnswer {
  const { sheet, readings } = built;
  const keys = stepKeysOf(sheet);
  // Ticks of steps the sheet no longer has (the plan's parts changed) stay stored but are not shown or counted.
  const ticked = repos.ticks.list(built.plan.id).map((t) => t.stepKey).filter((k) => keys.has(k));
  const progress = sheetProgress(sheet, new Set(ticked), taken(readings));
  const plan = advance ? moveForward(repos, built.plan, progress) : built.plan;
  const judged: SheetAnswer['judged'] = [];
  for (const r of readings) {
    if (r.quantity === 'other') continue;
    const step = stepForQuantity(sheet, r.quantity);
    if (!step?.reading) continue;
    judged.push({ stepKey: step.key, readingId: r.id, value: r.value, unit: r.unit, band: judgeReading(step.reading, r.value) });
  }
  return { sheet, ticked, readings, judged, progress, status: plan.status, planUpdatedAt: plan.updatedAt };
}

export function getSheet(repos: Repositories, planId: number): SheetAnswer {
  return answer(repos, build(repos, planId), false);
}

export function tickStep(repos: Repositories, req: { planId: number; stepKey: string; ticked: boolean }): SheetAnswer {
  const built = build(repos, req.planId);
  if (!stepKeysOf(built.sheet).has(req.stepKey)) {
    throw new AppFailure('INVALID_INPUT', 'Some values need correcting before this can be saved.', {
      stepKey: `The sheet of “${built.plan.name}” has no step “${req.stepKey}”; open the sheet again, the plan may have changed.`,
    });
  }
  return repos.transaction(() => {
    repos.ticks.set(req.planId, req.stepKey, req.ticked);
    return answer(repos, built, true);
  });
}

/**
 * After a reading was added, changed or deleted: moves the plan forward if the work reached it.
 * Best effort: a plan whose sheet cannot be built (a part missing, say) keeps its status, and the
 * reading stays saved either way.
 */
export function advanceAfterReading(repos: Repositories, planId: number): void {
  try {
    answer(repos, build(repos, planId), true);
  } catch (err) {
    // A sentence for the person (adapter, checker, store) means the sheet cannot be built yet; anything else is ours.
    if (!(err instanceof AppFailure || err instanceof StoreError)) console.warn('[sheet] status not moved after a reading:', err);
  }
}

/** 'check.plans' weighed these plans: each still a draft becomes checked. */
export function markChecked(repos: Repositories, planIds: readonly number[]): void {
  repos.transaction(() => {
    for (const id of planIds) {
      if (repos.plans.get(id).status === 'draft') repos.plans.setStatus(id, 'checked');
    }
  });
}
