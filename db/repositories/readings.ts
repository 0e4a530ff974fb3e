/** Meter readings taken while carrying out a plan; they belong to the plan and go with it. */
import { reading as readingSchema, readingInput, type Reading, type ReadingInput } from '../schema.js';
import { StoreError } from '../errors.js';
import { INVALID_SENTENCE, nowIso, parseInput, parseStored, readAll, type RepoContext } from './shared.js';

export type ReadingsRepository = {
  /** NOT_FOUND if the plan does not exist. Oldest first. */
  list(planId: number): Reading[];
  add(input: ReadingInput): Reading;
  delete(id: number): { deleted: true };
  count(): number;
};

type ReadingRow = { id: number; plan_id: number; quantity: string; value: number; unit: string; taken_on: string; note: string };

function fromRow(row: ReadingRow): Reading {
  return parseStored(readingSchema, 'readings', row.id, {
    id: row.id,
    planId: row.plan_id,
    quantity: row.quantity,
    value: row.value,
    unit: row.unit,
    takenOn: row.taken_on,
    note: row.note,
  });
}

export function createReadingsRepository(ctx: RepoContext): ReadingsRepository {
  const { db } = ctx;
  const select = 'SELECT id, plan_id, quantity, value, unit, taken_on, note FROM readings';
  const s = {
    byPlan: db.prepare<[number], ReadingRow>(`${select} WHERE plan_id = ? ORDER BY taken_on, id`),
    get: db.prepare<[number], ReadingRow>(`${select} WHERE id = ?`),
    planExists: db.prepare<[number], { id: number }>('SELECT id FROM plans WHERE id = ?'),
    insert: db.prepare(
      'INSERT INTO readings (plan_id, quantity, value, unit, taken_on, note, created_at) VALUES (@planId, @quantity, @value, @unit, @takenOn, @note, @now)',
    ),
    remove: db.prepare('DELETE FROM readings WHERE id = ?'),
    count: db.prepare<[], { n: number }>('SELECT COUNT(*) AS n FROM readings'),
  };

  function read(id: number): Reading {
    const row = s.get.get(id);
    if (!row) throw new StoreError('NOT_FOUND', `There is no reading with id ${id}; it may have been deleted.`);
    return fromRow(row);
  }

  return {
    list: (planId) => {
      if (!s.planExists.get(planId)) throw new StoreError('NOT_FOUND', `There is no plan with id ${planId}; it may have been deleted.`);
      return readAll(ctx, 'readings', s.byPlan.all(planId), fromRow);
    },
    add: (input) =>
      db.transaction(() => {
        const r = parseInput(readingInput, input);
        if (!s.planExists.get(r.planId)) throw new StoreError('INVALID_INPUT', INVALID_SENTENCE, { planId: `There is no plan with id ${r.planId}.` });
        return read(Number(s.insert.run({ ...r, now: nowIso() }).lastInsertRowid));
      })(),
    delete: (id) =>
      db.transaction(() => {
        read(id);
        s.remove.run(id);
        return { deleted: true as const };
      })(),
    count: () => s.count.get()!.n,
  };
}
