/**
 * Engines: one row in `engines` plus its advance curve in `advance_points`. Every write that
 * touches both tables is one transaction, so an engine is never stored without its curve.
 */
import { engine as engineSchema, engineInput, type Engine, type EngineInput } from '../schema.js';
import { StoreError } from '../errors.js';
import { checkVersion, nextStamp, nowIso, parseInput, parseJsonColumn, parseStored, partRefChecker, plural, writeTx, type RepoContext } from './shared.js';

/** What the engine list shows; the same shape as `engineSummary` in electron/ipc/channels.ts. */
export type EngineSummary = {
  id: number;
  name: string;
  yearText: string;
  modelText: string;
  cylinders: number;
  systemVoltageV: number;
  earthPolarity: string;
  planCount: number;
  /** The engine's version, sent back with a delete from the list. */
  updatedAt: string;
};

export type EnginesRepository = {
  list(): EngineSummary[];
  get(id: number): Engine;
  create(input: EngineInput): Engine;
  /** `expectedUpdatedAt` is the `updatedAt` the user saw: if the engine changed since, STALE and nothing is written. */
  update(id: number, input: EngineInput, expectedUpdatedAt: string): Engine;
  /**
   * Refused with IN_USE while plans use the engine, unless `deletePlansToo` (then plans and their readings go too);
   * STALE if the engine changed since the user saw it. Works on a row that no longer parses.
   */
  delete(id: number, opts: { deletePlansToo: boolean; expectedUpdatedAt: string }): { deleted: true; plansDeleted: number };
  /** What a delete would take with the engine: its plans and their readings. NOT_FOUND if there is no such engine. */
  contents(id: number): { plans: number; readings: number };
  count(): number;
};

type EngineRow = {
  id: number;
  name: string;
  notes: string;
  year_text: string;
  model_text: string;
  cylinders: number;
  cycle: string;
  firing_order: string;
  bore_mm: number;
  stroke_mm: number;
  con_rod_mm: number;
  compression_ratio: number;
  idle_rpm: number;
  cranking_rpm: number;
  redline_rpm: number;
  system_voltage_v: number;
  earth_polarity: string;
  charging: string;
  points_dwell_deg: number;
  points_gap_mm: number;
  points_float_rpm: number | null;
  static_timing_deg_btdc: number;
  existing: string;
  conditions: string;
  updated_at: string;
};

const COLUMNS = `name, notes, year_text, model_text, cylinders, cycle, firing_order, bore_mm, stroke_mm, con_rod_mm,
  compression_ratio, idle_rpm, cranking_rpm, redline_rpm, system_voltage_v, earth_polarity, charging,
  points_dwell_deg, points_gap_mm, points_float_rpm, static_timing_deg_btdc, existing, conditions`;
const PARAMS = `@name, @notes, @yearText, @modelText, @cylinders, @cycle, @firingOrder, @boreMm, @strokeMm, @conRodMm,
  @compressionRatio, @idleRpm, @crankingRpm, @redlineRpm, @systemVoltageV, @earthPolarity, @charging,
  @pointsDwellDeg, @pointsGapMm, @pointsFloatRpm, @staticTimingDegBtdc, @existing, @conditions`;

function toParams(e: EngineInput): Record<string, unknown> {
  const { advanceCurve: _curve, existing, conditions, pointsFloatRpm, ...plain } = e;
  return { ...plain, pointsFloatRpm: pointsFloatRpm ?? null, existing: JSON.stringify(existing), conditions: JSON.stringify(conditions) };
}

export function createEnginesRepository(ctx: RepoContext): EnginesRepository {
  const { db } = ctx;
  const checkParts = partRefChecker(db);
  const s = {
    list: db.prepare<[], EngineSummary>(
      `SELECT e.id, e.name, e.year_text AS yearText, e.model_text AS modelText, e.cylinders,
              e.system_voltage_v AS systemVoltageV, e.earth_polarity AS earthPolarity,
              (SELECT COUNT(*) FROM plans p WHERE p.engine_id = e.id) AS planCount, e.updated_at AS updatedAt
         FROM engines e ORDER BY e.name COLLATE NOCASE, e.id`,
    ),
    get: db.prepare<[number], EngineRow>(`SELECT id, ${COLUMNS}, updated_at FROM engines WHERE id = ?`),
    version: db.prepare<[number], { updated_at: string }>('SELECT updated_at FROM engines WHERE id = ?'),
    curve: db.prepare<[number], { rpm: number; advanceDeg: number }>(
      'SELECT rpm, advance_deg AS advanceDeg FROM advance_points WHERE engine_id = ? ORDER BY position',
    ),
    insert: db.prepare(`INSERT INTO engines (${COLUMNS}, created_at, updated_at) VALUES (${PARAMS}, @now, @now)`),
    update: db.prepare(
      `UPDATE engines SET (${COLUMNS}, updated_at) = (${PARAMS}, @now) WHERE id = @id`,
    ),
    insertPoint: db.prepare('INSERT INTO advance_points (engine_id, position, rpm, advance_deg) VALUES (?, ?, ?, ?)'),
    clearCurve: db.prepare('DELETE FROM advance_points WHERE engine_id = ?'),
    planCount: db.prepare<[number], { n: number }>('SELECT COUNT(*) AS n FROM plans WHERE engine_id = ?'),
    readingCount: db.prepare<[number], { n: number }>('SELECT COUNT(*) AS n FROM readings WHERE plan_id IN (SELECT id FROM plans WHERE engine_id = ?)'),
    remove: db.prepare('DELETE FROM engines WHERE id = ?'),
    count: db.prepare<[], { n: number }>('SELECT COUNT(*) AS n FROM engines'),
  };

  function read(id: number): Engine {
    const row = s.get.get(id);
    if (!row) throw new StoreError('NOT_FOUND', `There is no engine with id ${id}; it may have been deleted.`);
    const value = {
      id: row.id,
      name: row.name,
      notes: row.notes,
      yearText: row.year_text,
      modelText: row.model_text,
      cylinders: row.cylinders,
      cycle: row.cycle,
      firingOrder: row.firing_order,
      boreMm: row.bore_mm,
      strokeMm: row.stroke_mm,
      conRodMm: row.con_rod_mm,
      compressionRatio: row.compression_ratio,
      idleRpm: row.idle_rpm,
      crankingRpm: row.cranking_rpm,
      redlineRpm: row.redline_rpm,
      systemVoltageV: row.system_voltage_v,
      earthPolarity: row.earth_polarity,
      charging: row.charging,
      pointsDwellDeg: row.points_dwell_deg,
      pointsGapMm: row.points_gap_mm,
      pointsFloatRpm: row.points_float_rpm,
      staticTimingDegBtdc: row.static_timing_deg_btdc,
      advanceCurve: s.curve.all(id),
      existing: parseJsonColumn('engines', id, 'existing setup', row.existing),
      conditions: parseJsonColumn('engines', id, 'conditions', row.conditions),
      updatedAt: row.updated_at,
    };
    return parseStored(engineSchema, 'engines', id, value);
  }

  function validate(input: unknown): EngineInput {
    const e = parseInput(engineInput, input);
    checkParts([
      { field: 'existing.coilPartId', id: e.existing.coilPartId, kind: 'coil' },
      { field: 'existing.ballastPartId', id: e.existing.ballastPartId, kind: 'ballast' },
      { field: 'existing.tachPartId', id: e.existing.tachPartId, kind: 'tach' },
      { field: 'existing.leadsPartId', id: e.existing.leadsPartId, kind: 'leads' },
      { field: 'existing.plugPartId', id: e.existing.plugPartId, kind: 'plug' },
    ]);
    return e;
  }

  function writeCurve(id: number, e: EngineInput): void {
    s.clearCurve.run(id);
    e.advanceCurve.forEach((p, i) => s.insertPoint.run(id, i, p.rpm, p.advanceDeg));
  }

  const notFound = (id: number) => new StoreError('NOT_FOUND', `There is no engine with id ${id}; it may have been deleted.`);

  const createTx = (e: EngineInput): number => {
    const id = Number(s.insert.run({ ...toParams(e), now: nowIso() }).lastInsertRowid);
    writeCurve(id, e);
    return id;
  };

  const updateTx = (id: number, e: EngineInput, expected: string): void => {
    const stored = s.version.get(id);
    if (!stored) throw notFound(id);
    checkVersion('engine', id, stored.updated_at, expected, false);
    s.update.run({ ...toParams(e), now: nextStamp(stored.updated_at), id });
    writeCurve(id, e);
  };

  // Checks the row exists from its version column alone, so a row that no longer parses can be deleted.
  const deleteTx = (id: number, deletePlansToo: boolean, expected: string) => {
    const stored = s.version.get(id);
    if (!stored) throw notFound(id);
    checkVersion('engine', id, stored.updated_at, expected, true);
    const plans = s.planCount.get(id)!.n;
    if (plans > 0 && !deletePlansToo) {
      throw new StoreError(
        'IN_USE',
        `${plural(plans, 'plan uses', 'plans use')} this engine. Delete ${plans === 1 ? 'it' : 'them'} too, or move ${plans === 1 ? 'it' : 'them'} to another engine first.`,
      );
    }
    // plans.engine_id and readings.plan_id cascade, so one DELETE removes the engine, its curve,
    // its plans and their readings together.
    s.remove.run(id);
    return { deleted: true as const, plansDeleted: plans };
  };

  return {
    list: () => s.list.all(),
    get: (id) => db.transaction(() => read(id))(),
    // Validation runs inside the transaction so a referenced part cannot vanish between check and write.
    create: (input) => writeTx(db, () => read(createTx(validate(input)))),
    update: (id, input, expectedUpdatedAt) =>
      writeTx(db, () => {
        updateTx(id, validate(input), expectedUpdatedAt);
        return read(id);
      }),
    delete: (id, opts) => writeTx(db, () => deleteTx(id, opts.deletePlansToo, opts.expectedUpdatedAt)),
    contents: (id) =>
      db.transaction(() => {
        if (!s.version.get(id)) throw notFound(id);
        return { plans: s.planCount.get(id)!.n, readings: s.readingCount.get(id)!.n };
      })(),
    count: () => s.count.get()!.n,
  };
}
