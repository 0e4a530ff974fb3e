/**
 * The workshop file: every engine, part, plan, reading and sheet tick in one JSON document of our
 * own format. Records are checked with the store's own schemas (db/schema.ts), so a file holds
 * nothing the app could not have saved; unknown keys are refused at every depth.
 *
 * {
 *   "format": "ignition-planner-workshop", "version": 1,
 *   "exportedAt": "2026-12-02T04:15:30.123Z",          (optional, informative)
 *   "parts":   [ { "id": 7, "kind": "coil", "name": ..., <the kind's fields> } ],
 *   "engines": [ { "id": 3, <engine fields>, "plans": [ { "id": 9, <plan fields without engineId>,
 *                  "readings": [ { quantity, value, unit, takenOn, note } ],
 *                  "ticks": [ { "stepKey": ..., "tickedOn": ... } ] } ] } ]
 * }
 *
 * `id`s are the file's own: a part's id is what the engines' existing setups and the plans refer
 * to; an engine's or plan's id is informative only. Import gives every record a new id.
 */
import { z } from 'zod';
import { engineInput, partInput, planInput, readingInput, stepKey, type EngineInput, type PartInput, type PartKind, type PlanInput, type ReadingInput } from '../schema.js';
import { unknownKeyProblems, unknownKeysBeside, zodProblems, type Problem } from './problems.js';

export const WORKSHOP_FORMAT = 'ignition-planner-workshop';
export const WORKSHOP_FORMAT_VERSION = 1;

const fileId = z.number({ error: 'The id must be a whole number.' }).int('The id must be a whole number.').positive('The id must be above zero.');

const top = z.strictObject({
  format: z.literal(WORKSHOP_FORMAT, { error: `This is not a workshop file: "format" must be "${WORKSHOP_FORMAT}".` }),
  version: z.literal(WORKSHOP_FORMAT_VERSION, { error: `This app reads version ${WORKSHOP_FORMAT_VERSION} of the workshop file.` }),
  exportedAt: z.string().max(40).optional(),
  appSchemaVersion: z.number().int().optional(),
  parts: z.array(z.unknown(), { error: '"parts" must be a list.' }),
  engines: z.array(z.unknown(), { error: '"engines" must be a list.' }),
});

export const fileTick = z.strictObject({ stepKey, tickedOn: z.string().max(40, 'Keep the tick time under 40 characters.') });
export type FileTick = z.infer<typeof fileTick>;

export type FilePlan = { plan: Omit<PlanInput, 'engineId'>; readings: Array<Omit<ReadingInput, 'planId'>>; ticks: FileTick[] };
export type FileEngine = { engine: EngineInput; plans: FilePlan[] };
export type FilePart = { fileId: number; part: PartInput };
export type WorkshopFile = { parts: FilePart[]; engines: FileEngine[] };

export type ParseResult = { ok: true; file: WorkshopFile } | { ok: false; problems: Problem[] };

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/** Parses one record with `schema`, adding zod's and the unknown-key problems under `where`. */
function record<S extends z.ZodType>(schema: S, raw: unknown, where: string, problems: Problem[]): z.output<S> | null {
  const parsed = schema.safeParse(raw);
  if (!parsed.success) {
    problems.push(...zodProblems(where, parsed.error), ...unknownKeysBeside(where, schema, raw));
    return null;
  }
  const unknown = unknownKeyProblems(where, raw, parsed.data);
  problems.push(...unknown);
  return unknown.length === 0 ? parsed.data : null;
}

/** Takes the listed keys out of a raw record, refusing the ones the file must not set. */
function split(raw: unknown, where: string, what: string, own: readonly string[], forbidden: Record<string, string>, problems: Problem[]) {
  if (!isObject(raw)) {
    problems.push({ where, message: `Each ${what} must be an object with its fields.` });
    return null;
  }
  const taken: Record<string, unknown> = {};
  const rest: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(raw)) {
    if (own.includes(k)) taken[k] = v;
    else if (k in forbidden) problems.push({ where: `${where}.${k}`, message: forbidden[k]! });
    else rest[k] = v;
  }
  return { taken, rest };
}

const PART_REFS_ENGINE: Array<[keyof EngineInput['existing'], PartKind]> = [
  ['coilPartId', 'coil'],
  ['ballastPartId', 'ballast'],
  ['tachPartId', 'tach'],
  ['leadsPartId', 'leads'],
  ['plugPartId', 'plug'],
];
export const PART_REFS_PLAN: Array<[keyof PlanInput, PartKind]> = [
  ['moduleId', 'module'],
  ['coilId', 'coil'],
  ['ballastId', 'ballast'],
  ['tachId', 'tach'],
  ['leadsId', 'leads'],
  ['plugId', 'plug'],
];
export { PART_REFS_ENGINE };

/** Checks a whole workshop file; every problem is listed, by row and field. */
export function parseWorkshopFile(raw: unknown): ParseResult {
  const problems: Problem[] = [];
  const head = top.safeParse(raw);
  if (!head.success) return { ok: false, problems: [...zodProblems('', head.error)] };

  const parts: FilePart[] = [];
  const kindOf = new Map<number, PartKind>();
  head.data.parts.forEach((rawPart, i) => {
    const where = `parts.${i}`;
    const s = split(rawPart, where, 'part', ['id'], {}, problems);
    if (!s) return;
    const id = record(fileId, s.taken['id'], `${where}.id`, problems);
    const part = record(partInput, s.rest, where, problems);
    if (id !== null && kindOf.has(id)) problems.push({ where: `${where}.id`, message: `Two parts in the file have the id ${id}; each part needs its own.` });
    if (id !== null && part) {
      kindOf.set(id, part.kind);
      parts.push({ fileId: id, part });
    }
  });

  const refCheck = (where: string, id: number | null | undefined, kind: PartKind): void => {
    if (id === null || id === undefined) return;
    const found = kindOf.get(id);
    if (found === undefined) problems.push({ where, message: `No part in the file has the id ${id}.` });
    else if (found !== kind) problems.push({ where, message: `The part with id ${id} is a ${found}, not a ${kind}.` });
  };

  const engines: FileEngine[] = [];
  head.data.engines.forEach((rawEngine, i) => {
    const where = `engines.${i}`;
    const s = split(rawEngine, where, 'engine', ['id', 'plans'], {}, problems);
    if (!s) return;
    if (s.taken['id'] !== undefined) record(fileId, s.taken['id'], `${where}.id`, problems);
    const engine = record(engineInput, s.rest, where, problems);
    if (engine) for (const [key, kind] of PART_REFS_ENGINE) refCheck(`${where}.existing.${key}`, engine.existing[key] as number | null, kind);
    const rawPlans = s.taken['plans'] ?? [];
    if (!Array.isArray(rawPlans)) {
      problems.push({ where: `${where}.plans`, message: '"plans" must be a list.' });
      return;
    }
    const plans: FilePlan[] = [];
    rawPlans.forEach((rawPlan, j) => {
      const pw = `${where}.plans.${j}`;
      const ps = split(rawPlan, pw, 'plan', ['id', 'readings', 'ticks'], { engineId: 'A plan belongs to the engine it is listed under; leave "engineId" out.' }, problems);
      if (!ps) return;
      if (ps.taken['id'] !== undefined) record(fileId, ps.taken['id'], `${pw}.id`, problems);
      const plan = record(planInput, { ...ps.rest, engineId: 1 }, pw, problems);
      if (plan) for (const [key, kind] of PART_REFS_PLAN) refCheck(`${pw}.${key}`, plan[key] as number | null, kind);
      const readings: FilePlan['readings'] = [];
      const rawReadings = ps.taken['readings'] ?? [];
      if (!Array.isArray(rawReadings)) problems.push({ where: `${pw}.readings`, message: '"readings" must be a list.' });
      else
        rawReadings.forEach((rawReading, k) => {
          const rw = `${pw}.readings.${k}`;
          const rs = split(rawReading, rw, 'reading', [], { planId: 'A reading belongs to the plan it is listed under; leave "planId" out.', id: 'Leave "id" out of a reading.' }, problems);
          if (!rs) return;
          const r = record(readingInput, { ...rs.rest, planId: 1 }, rw, problems);
          if (r) {
            const { planId: _p, ...rest } = r;
            readings.push(rest);
          }
        });
      const ticks: FileTick[] = [];
      const rawTicks = ps.taken['ticks'] ?? [];
      if (!Array.isArray(rawTicks)) problems.push({ where: `${pw}.ticks`, message: '"ticks" must be a list.' });
      else
        rawTicks.forEach((rawTick, k) => {
          const t = record(fileTick, rawTick, `${pw}.ticks.${k}`, problems);
          if (t) ticks.push(t);
        });
      if (plan) {
        const { engineId: _e, ...rest } = plan;
        plans.push({ plan: rest, readings, ticks });
      }
    });
    if (engine) engines.push({ engine, plans });
  });

  return problems.length > 0 ? { ok: false, problems } : { ok: true, file: { parts, engines } };
}
