/**
 * Meter readings taken while carrying out a plan; they belong to the plan and go with it. A
 * reading typed in an accepted alternative unit (mohm, mV, inch ...) is stored converted to its
 * quantity's one unit (`readingUnits` in schema.ts), so every stored value means what it says.
 */
import { reading as readingSchema, readingInput, toStoredUnit, type Reading, type ReadingInput } from '../schema.js';
import { StoreError } from '../errors.js';
import { checkVersion, INVALID_SENTENCE, nextStamp, nowIso, parseInput, parseStored, readAll, writeTx, type RepoContext } from './shared.js';

export type ReadingsRepository = {
  /** NOT_FOUND if the plan does not exist. Oldest first. */
  list(planId: number): Reading[];
  get(id: number): Reading;
  add(input: ReadingInput): Reading;
  /** Replaces a reading's quantity, value, unit, date and note; it stays with its plan. STALE if it changed since `expectedUpdatedAt`. */
  update(id: number, input: ReadingInput, expectedUpdatedAt: string): Reading;
  /** STALE as update; works on a row that no longer parses. Answers the plan it belonged to. */
  delete(id: number, expectedUpdatedAt: string): { deleted: true; planId: number };
  count(): number;
};

type ReadingRow = { id: number; plan_id: number; quantity: string; value: number; unit: string; taken_on: string; note: string; updated_at: string };

function fromRow(row: ReadingRow): Reading {
  return parseStored(readingSchema, 'readings', row.id, {
    id: row.id,
    planId: row.plan_id,
    quantity: row.quantity,
    value: row.value,
    unit: row.unit,
    takenOn: row.taken_on,
    note: row.note,
    updatedAt: row.updated_at,
  });
}

/** Parse what a caller wants to store and convert it to the quantity's unit. */
function validate(input: unknown): ReadingInput {
  const r = parseInput(readingInput, input);
  const stored = toStoredUnit(r.quantity, r.value, r.unit);
  // readingInput has already refused a unit that cannot be converted; this keeps the store honest on its own.
  if (!stored.ok) throw new StoreError('INVALID_INPUT', INVALID_SENTENCE, { unit: stored.message });
  return { ...r, value: stored.value, unit: stored.unit };
}

export function createReadingsRepository(ctx: RepoContext): ReadingsRepository {
  const { db } = ctx;
  const select = 'SELECT id, plan_id, quantity, value, unit, taken_on, note, updated_at FROM readings';
  // Prepared on first use (as plans and ticks are), so repositories can be built over an older file
  // (without readings.updated_at, before migration 004) while its migrations run.
  let prepared: ReturnType<typeof prepare> | undefined;
  const prepare = () => ({
    byPlan: db.prepare<[number], ReadingRow>(`${select} WHERE plan_id = ? ORDER BY taken_on, id`),
    get: db.prepare<[number], ReadingRow>(`${select} WHERE id = ?`),
    planExists: db.prepare<[number], { id: number }>('SELECT id FROM plans WHERE id = ?'),
    insert: db.prepare(
      'INSERT INTO readings (plan_id, quantity, value, unit, taken_on, note, created_at, updated_at) VALUES (@planId, @quantity, @value, @unit, @takenOn, @note, @now, @now)',
    ),
    update: db.prepare('UPDATE readings SET quantity = @quantity, value = @value, unit = @unit, taken_on = @takenOn, note = @note, updated_at = @now WHERE id = @id'),
    remove: db.prepare('DELETE FROM readings WHERE id = ?'),
    count: db.prepare<[], { n: number }>('SELECT COUNT(*) AS n FROM readings'),
  });
  const st = (): ReturnType<typeof prepare> => (prepared ??= prepare());

  function read(id: number): Reading {
    const row = st().get.get(id);
    if (!row) throw new StoreError('NOT_FOUND', `There is no reading with id ${id}; it may have been deleted.`);
    return fromRow(row);
  }

  return {
    list: (planId) => {
      if (!st().planExists.get(planId)) throw new StoreError('NOT_FOUND', `There is no plan with id ${planId}; it may have been deleted.`);
      return readAll(ctx, 'readings', st().byPlan.all(planId), fromRow);
    },
    get: (id) => read(id),
    add: (input) =>
      writeTx(db, () => {
        const r = validate(input);
        if (!st().planExists.get(r.planId)) throw new StoreError('INVALID_INPUT', INVALID_SENTENCE, { planId: `There is no plan with id ${r.planId}.` });
        return read(Number(st().insert.run({ ...r, now: nowIso() }).lastInsertRowid));
      }),
    update: (id, input, expectedUpdatedAt) =>
      writeTx(db, () => {
        const row = st().get.get(id);
        if (!row) throw new StoreError('NOT_FOUND', `There is no reading with id ${id}; it may have been deleted.`);
        checkVersion('reading', id, row.updated_at, expectedUpdatedAt, false);
        const r = validate(input);
        if (r.planId !== row.plan_id) {
          throw new StoreError('INVALID_INPUT', INVALID_SENTENCE, {
            planId: `This reading belongs to plan ${row.plan_id}; a reading stays with its plan (delete it and add it to the other plan instead).`,
          });
        }
        st().update.run({ ...r, now: nextStamp(row.updated_at), id });
        return read(id);
      }),
    delete: (id, expectedUpdatedAt) =>
      writeTx(db, () => {
        // The raw row only: a reading that no longer parses can still be deleted.
        const row = st().get.get(id);
        if (!row) throw new StoreError('NOT_FOUND', `There is no reading with id ${id}; it may have been deleted.`);
        checkVersion('reading', id, row.updated_at, expectedUpdatedAt, true);
        st().remove.run(id);
        return { deleted: true as const, planId: row.plan_id };
      }),
    count: () => st().count.get()!.n,
  };
}
