/**
 * Conversion plans: which module, coil, ballast, tach, leads and plug one engine would get.
 * Each part reference must name a stored part of the right kind (a coil in `coilId`, and so on).
 */
import { z } from 'zod';
import { plan as planSchema, planInput, planStatus, type Plan, type PlanInput, type PlanStatus, type PlanUpdateInput } from '../schema.js';
import { StoreError } from '../errors.js';
import { checkVersion, INVALID_SENTENCE, nextStamp, nowIso, parseInput, parseStored, partRefChecker, readAll, writeTx, type RepoContext } from './shared.js';

export type PlansRepository = {
  /** Every plan, or one engine's (NOT_FOUND if that engine does not exist). */
  list(engineId?: number): Plan[];
  get(id: number): Plan;
  create(input: PlanInput): Plan;
  /** Without a status in `input`, the stored status stays. STALE if the plan changed since `expectedUpdatedAt`. */
  update(id: number, input: PlanUpdateInput, expectedUpdatedAt: string): Plan;
  /**
   * Sets the status alone (by hand in any direction, or moved forward by the work on the sheet). It
   * leaves `updatedAt` as it was: that is the version of the fields an editor writes, and an editor
   * never writes the status, so weighing a plan does not make an open editor stale.
   */
  setStatus(id: number, status: PlanStatus): Plan;
  /** Deletes the plan and its readings together; STALE if it changed since `expectedUpdatedAt`. Works on a row that no longer parses. */
  delete(id: number, expectedUpdatedAt: string): { deleted: true; readingsDeleted: number };
  count(): number;
};

type PlanRow = {
  id: number;
  engine_id: number;
  name: string;
  notes: string;
  status: string;
  module_id: number | null;
  coil_id: number | null;
  ballast_id: number | null;
  tach_id: number | null;
  leads_id: number | null;
  plug_id: number | null;
  cranking_bypass: number;
  module_feed: string;
  coil_wiring: string;
  plug_gap_mm: number;
  updated_at: string;
};

const statusOnly = z.strictObject({ status: z.enum(planStatus.options, { error: 'The status is draft, checked, wired or done.' }) });

const COLUMNS = `engine_id, name, notes, status, module_id, coil_id, ballast_id, tach_id, leads_id, plug_id,
  cranking_bypass, module_feed, coil_wiring, plug_gap_mm`;
const PARAMS = `@engineId, @name, @notes, @status, @moduleId, @coilId, @ballastId, @tachId, @leadsId, @plugId,
  @crankingBypass, @moduleFeed, @coilWiring, @plugGapMm`;

function fromRow(row: PlanRow): Plan {
  return parseStored(planSchema, 'plans', row.id, {
    id: row.id,
    engineId: row.engine_id,
    name: row.name,
    notes: row.notes,
    status: row.status,
    moduleId: row.module_id,
    coilId: row.coil_id,
    ballastId: row.ballast_id,
    tachId: row.tach_id,
    leadsId: row.leads_id,
    plugId: row.plug_id,
    crankingBypass: row.cranking_bypass === 1,
    moduleFeed: row.module_feed,
    coilWiring: row.coil_wiring,
    plugGapMm: row.plug_gap_mm,
    updatedAt: row.updated_at,
  });
}

export function createPlansRepository(ctx: RepoContext): PlansRepository {
  const { db } = ctx;
  const checkParts = partRefChecker(db);
  const select = `SELECT id, ${COLUMNS}, updated_at FROM plans`;
  // Prepared on first use (as the ticks repository does), so a store opened at an older version can
  // still build the repositories while its migrations run.
  let prepared: ReturnType<typeof prepare> | undefined;
  const prepare = () => ({
    all: db.prepare<[], PlanRow>(`${select} ORDER BY id`),
    byEngine: db.prepare<[number], PlanRow>(`${select} WHERE engine_id = ? ORDER BY id`),
    get: db.prepare<[number], PlanRow>(`${select} WHERE id = ?`),
    engineExists: db.prepare<[number], { id: number }>('SELECT id FROM engines WHERE id = ?'),
    version: db.prepare<[number], { updated_at: string }>('SELECT updated_at FROM plans WHERE id = ?'),
    insert: db.prepare(`INSERT INTO plans (${COLUMNS}, created_at, updated_at) VALUES (${PARAMS}, @now, @now)`),
    update: db.prepare(`UPDATE plans SET (${COLUMNS}, updated_at) = (${PARAMS}, @now) WHERE id = @id`),
    setStatus: db.prepare('UPDATE plans SET status = @status WHERE id = @id'),
    readingCount: db.prepare<[number], { n: number }>('SELECT COUNT(*) AS n FROM readings WHERE plan_id = ?'),
    remove: db.prepare('DELETE FROM plans WHERE id = ?'),
    count: db.prepare<[], { n: number }>('SELECT COUNT(*) AS n FROM plans'),
  });
  const st = (): ReturnType<typeof prepare> => (prepared ??= prepare());

  function read(id: number): Plan {
    const row = st().get.get(id);
    if (!row) throw new StoreError('NOT_FOUND', `There is no plan with id ${id}; it may have been deleted.`);
    return fromRow(row);
  }

  function validate(input: unknown): Record<string, unknown> {
    const p = parseInput(planInput, input);
    if (!st().engineExists.get(p.engineId)) {
      throw new StoreError('INVALID_INPUT', INVALID_SENTENCE, { engineId: `There is no engine with id ${p.engineId}.` });
    }
    checkParts([
      { field: 'moduleId', id: p.moduleId, kind: 'module' },
      { field: 'coilId', id: p.coilId, kind: 'coil' },
      { field: 'ballastId', id: p.ballastId, kind: 'ballast' },
      { field: 'tachId', id: p.tachId, kind: 'tach' },
      { field: 'leadsId', id: p.leadsId, kind: 'leads' },
      { field: 'plugId', id: p.plugId, kind: 'plug' },
    ]);
    return { ...p, crankingBypass: p.crankingBypass ? 1 : 0, coilWiring: p.coilWiring ?? 'as-marked-for-earth', now: nowIso() };
  }

  const notFound = (id: number) => new StoreError('NOT_FOUND', `There is no plan with id ${id}; it may have been deleted.`);

  /** The stored version, checked against the one the user saw; read without parsing the row. */
  function versionOf(id: number, expected: string, deleting: boolean): string {
    const stored = st().version.get(id);
    if (!stored) throw notFound(id);
    checkVersion('plan', id, stored.updated_at, expected, deleting);
    return stored.updated_at;
  }

  const deleteTx = (id: number, expected: string) => {
    versionOf(id, expected, true);
    const readingsDeleted = st().readingCount.get(id)!.n;
    st().remove.run(id); // readings.plan_id cascades
    return { deleted: true as const, readingsDeleted };
  };

  return {
    list: (engineId) => {
      if (engineId === undefined) return readAll(ctx, 'plans', st().all.all(), fromRow);
      if (!st().engineExists.get(engineId)) throw new StoreError('NOT_FOUND', `There is no engine with id ${engineId}; it may have been deleted.`);
      return readAll(ctx, 'plans', st().byEngine.all(engineId), fromRow);
    },
    get: (id) => read(id),
    create: (input) => writeTx(db, () => read(Number(st().insert.run(validate(input)).lastInsertRowid))),
    update: (id, input, expectedUpdatedAt) =>
      writeTx(db, () => {
        const previous = versionOf(id, expectedUpdatedAt, false);
        const stored = read(id);
        const withStatus = typeof input === 'object' && input !== null && (input as { status?: unknown }).status === undefined ? { ...input, status: stored.status } : input;
        st().update.run({ ...validate(withStatus), now: nextStamp(previous), id });
        return read(id);
      }),
    setStatus: (id, status) =>
      writeTx(db, () => {
        const { status: s2 } = parseInput(statusOnly, { status });
        read(id);
        st().setStatus.run({ status: s2, id });
        return read(id);
      }),
    delete: (id, expectedUpdatedAt) => writeTx(db, () => deleteTx(id, expectedUpdatedAt)),
    count: () => st().count.get()!.n,
  };
}
