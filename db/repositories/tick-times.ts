/**
 * Puts back the time a sheet step was ticked, for an import: `ticks.set` stamps a tick with the
 * moment it is made, but a tick brought in from a workshop file keeps the time it was first made.
 */
import type Database from 'better-sqlite3';
import { z } from 'zod';
import { StoreError } from '../errors.js';

const when = z.string().min(1).max(40);

export function createTickTimes(db: Database.Database): { setTime(planId: number, stepKey: string, tickedOn: string): void } {
  const update = db.prepare('UPDATE sheet_ticks SET ticked_on = ? WHERE plan_id = ? AND step_key = ?');
  return {
    setTime(planId, stepKey, tickedOn) {
      const t = when.safeParse(tickedOn);
      if (!t.success) throw new StoreError('INVALID_INPUT', 'Some values need correcting before this can be saved.', { tickedOn: 'Give the time the step was ticked.' });
      update.run(t.data, planId, stepKey);
    },
  };
}
