/**
 * The ticked steps of a plan's wiring sheet (`sheet_ticks`, migration 002): one row per ticked
 * step key, removed with the plan. The store knows nothing of the sheet itself; the bridge checks
 * that a key names a step of the plan's sheet before it ticks it.
 */
import { z } from 'zod';
import { sheetTick as sheetTickSchema, stepKey as stepKeySchema, type SheetTick } from '../schema.js';
import { StoreError } from '../errors.js';
import { nowIso, parseInput, parseStored, readAll, writeTx, type RepoContext } from './shared.js';

export type TicksRepository = {
  /** The plan's ticked steps, in the order they were ticked. NOT_FOUND if the plan does not exist. */
  list(planId: number): SheetTick[];
  /** Ticks (keeping the first tick's time) or unticks one step; returns the plan's ticks afterwards. */
  set(planId: number, stepKey: string, ticked: boolean): SheetTick[];
};

type TickRow = { rowid: number; plan_id: number; step_key: string; ticked_on: string };

const setArgs = z.strictObject({ stepKey: stepKeySchema, ticked: z.boolean({ error: 'Say whether the step is ticked (true or false).' }) });

export function createTicksRepository(ctx: RepoContext): TicksRepository {
  const { db } = ctx;
  // Prepared on first use, so repositories can still be built over an older file during a migration test.
  let prepared: ReturnType<typeof prepare> | undefined;
  const prepare = () => ({
    byPlan: db.prepare<[number], TickRow>('SELECT rowid, plan_id, step_key, ticked_on FROM sheet_ticks WHERE plan_id = ? ORDER BY ticked_on, rowid'),
    planExists: db.prepare<[number], { id: number }>('SELECT id FROM plans WHERE id = ?'),
    tick: db.prepare('INSERT INTO sheet_ticks (plan_id, step_key, ticked_on) VALUES (?, ?, ?) ON CONFLICT (plan_id, step_key) DO NOTHING'),
    untick: db.prepare('DELETE FROM sheet_ticks WHERE plan_id = ? AND step_key = ?'),
  });
  const statements = (): ReturnType<typeof prepare> => (prepared ??= prepare());

  const fromRow = (row: TickRow): SheetTick =>
    parseStored(sheetTickSchema, 'sheet_ticks', row.rowid, { planId: row.plan_id, stepKey: row.step_key, tickedOn: row.ticked_on });

  function list(planId: number): SheetTick[] {
    const s = statements();
    if (!s.planExists.get(planId)) throw new StoreError('NOT_FOUND', `There is no plan with id ${planId}; it may have been deleted.`);
    return readAll(ctx, 'sheet_ticks', s.byPlan.all(planId).map((r) => ({ ...r, id: r.rowid })), fromRow);
  }

  return {
    list,
    set: (planId, stepKey, ticked) =>
      writeTx(db, () => {
        const args = parseInput(setArgs, { stepKey, ticked });
        const s = statements();
        if (!s.planExists.get(planId)) throw new StoreError('NOT_FOUND', `There is no plan with id ${planId}; it may have been deleted.`);
        if (args.ticked) s.tick.run(planId, args.stepKey, nowIso());
        else s.untick.run(planId, args.stepKey);
        return list(planId);
      }),
  };
}
