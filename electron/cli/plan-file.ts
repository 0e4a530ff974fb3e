/**
 * The files the command line reads, as zod schemas built from the store's own schemas
 * (db/schema.ts): an engine, its existing setup and up to three candidates with every part
 * written inline (plan file), or an engine and a parts bin (bin file). Both are turned into the
 * stored shapes (engine, parts, plans with ids) that the setup adapter already knows.
 */
import { z } from 'zod';
import { engineInput, existingSetup, partInput, planFields, type Engine, type Part, type PartKind, type Plan } from '../../db/schema.js';
import { MAX_RPM_POINTS, MIN_RPM_POINTS } from '../checker/grid.js';
import { CliInputError } from './errors.js';
import { unknownSettings } from './unknown-keys.js';

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/** A part written inline; `notes` may be left out. */
const inlinePart = z.preprocess((v) => (isObject(v) && !('notes' in v) ? { ...v, notes: '' } : v), partInput);
type InlinePart = z.infer<typeof partInput>;

const options = z
  .object({
    rpmPoints: z
      .number()
      .int('rpmPoints must be a whole number.')
      .min(MIN_RPM_POINTS, `At least ${MIN_RPM_POINTS} rpm points.`)
      .max(MAX_RPM_POINTS, `At most ${MAX_RPM_POINTS} rpm points.`)
      .optional(),
    breakdownModel: z.enum(['empirical-air', 'paschen']).optional(),
  })
  .strict();

const existingFile = z
  .object({
    trigger: existingSetup.shape.trigger,
    /** The coil fitted today; null only for a magneto (its armature is assumed). */
    coil: inlinePart.nullable(),
    ballast: existingSetup.shape.ballast,
    ballastPart: inlinePart.nullable().default(null),
    crankingBypass: z.boolean({ error: 'crankingBypass must be true or false.' }),
    condenserUf: existingSetup.shape.condenserUf,
    tach: inlinePart.nullable().default(null),
    leads: inlinePart.nullable().default(null),
    plug: inlinePart.nullable().default(null),
    plugGapMm: existingSetup.shape.plugGapMm,
    magnetoRatedCurrentA: existingSetup.shape.magnetoRatedCurrentA,
    magnetoFullOutputRpm: existingSetup.shape.magnetoFullOutputRpm,
    /** Which coil terminal goes to the supply side; default as marked for the car's earth. */
    coilWiring: existingSetup.shape.coilWiring,
  })
  .strict();

const candidateFile = z
  .object({
    name: planFields.shape.name,
    notes: z.string().max(4000).default(''),
    module: inlinePart.nullable(),
    /** Null keeps the coil fitted today. */
    coil: inlinePart.nullable().default(null),
    ballast: inlinePart.nullable().default(null),
    crankingBypass: z.boolean({ error: 'crankingBypass must be true or false.' }).default(false),
    moduleFeed: planFields.shape.moduleFeed.default('switched-15'),
    coilWiring: planFields.shape.coilWiring,
    tach: inlinePart.nullable().default(null),
    leads: inlinePart.nullable().default(null),
    plug: inlinePart.nullable().default(null),
    plugGapMm: planFields.shape.plugGapMm,
  })
  .strict();

export const planFile = z
  .object({
    engine: z.record(z.string(), z.unknown(), { error: 'engine must be an object with the engine\'s fields.' }),
    existing: existingFile,
    candidates: z.array(candidateFile).max(3, 'Compare at most three candidates with the existing setup.').default([]),
    options: options.default({}),
  })
  .strict();

export const binFile = z
  .object({
    engine: z.record(z.string(), z.unknown(), { error: 'engine must be an object with the engine\'s fields.' }),
    existing: existingFile,
    parts: z.array(inlinePart).min(1, 'Put at least one coil and one module in the parts bin.'),
    topN: z.number().int().min(1).max(50).optional(),
    options: options.default({}),
  })
  .strict();

export interface Workshop {
  engine: Engine;
  parts: Part[];
  plans: Plan[];
  options: z.infer<typeof options>;
  topN?: number;
}

/** Turn zod issues into `path: why` lines; a missing field says so. */
function issueLines(error: z.ZodError, raw: unknown, prefix: (path: (string | number)[]) => string, keepUnknown = false): string[] {
  const seen = new Set<string>();
  const lines: string[] = [];
  for (const issue of error.issues) {
    // Unknown keys are reported by unknownSettings, with a suggestion; zod's own line would repeat them.
    if (issue.code === 'unrecognized_keys' && !keepUnknown) continue;
    const path = issue.path.map((p) => (typeof p === 'symbol' ? String(p) : p));
    const key = prefix(path);
    if (seen.has(key)) continue;
    seen.add(key);
    const missing = issue.code === 'invalid_type' && valueAt(raw, path) === undefined;
    lines.push(`${key}: ${missing ? `this field is missing. ${issue.message}` : issue.message}`);
  }
  return lines;
}

function valueAt(raw: unknown, path: readonly (string | number)[]): unknown {
  let v: unknown = raw;
  for (const p of path) {
    if (Array.isArray(v) && typeof p === 'number') v = v[p];
    else if (isObject(v)) v = v[String(p)];
    else return undefined;
  }
  return v;
}

const dotted = (path: readonly (string | number)[]): string => path.map(String).join('.') || '(the file)';

class PartList {
  readonly parts: Part[] = [];
  add(p: InlinePart): number {
    const id = this.parts.length + 1;
    this.parts.push({ ...p, id } as Part);
    return id;
  }
}

function expectKind(p: InlinePart | null, kind: PartKind, path: string, problems: string[]): InlinePart | null {
  if (p !== null && p.kind !== kind) problems.push(`${path}: expected a ${kind} part here, got a ${p.kind}.`);
  return p;
}

/** Fill the engine's free-text fields and conditions when the file leaves them out. */
function engineWithDefaults(raw: Record<string, unknown>): Record<string, unknown> {
  return { notes: '', yearText: '', modelText: '', advanceCurve: [], conditions: {}, ...raw };
}

function buildEngine(rawEngine: Record<string, unknown>, existing: Engine['existing'], problems: string[]): Engine | null {
  const { existing: _ignored, ...rest } = rawEngine;
  const candidate = { ...engineWithDefaults(rest), existing };
  const parsed = engineInput.safeParse(candidate);
  if (!parsed.success) {
    problems.push(
      ...issueLines(parsed.error, candidate, (path) => {
        if (path[0] === 'existing') return path[1] === 'ballastPartId' ? 'existing.ballastPart' : dotted(path);
        return `engine.${dotted(path)}`;
      }, true),
    );
    return null;
  }
  return { ...parsed.data, id: 1, updatedAt: new Date(0).toISOString() };
}

function buildExisting(x: z.infer<typeof existingFile>, list: PartList, problems: string[]): Engine['existing'] {
  const ref = (p: InlinePart | null, kind: PartKind, path: string): number | null => {
    const checked = expectKind(p, kind, path, problems);
    return checked ? list.add(checked) : null;
  };
  if (x.coil === null && x.trigger !== 'magneto') problems.push('existing.coil: give the coil fitted today (only a magneto may leave it out).');
  return {
    trigger: x.trigger,
    coilPartId: ref(x.coil, 'coil', 'existing.coil'),
    ballast: x.ballast,
    ballastPartId: ref(x.ballastPart, 'ballast', 'existing.ballastPart'),
    crankingBypass: x.crankingBypass,
    condenserUf: x.condenserUf,
    tachPartId: ref(x.tach, 'tach', 'existing.tach'),
    leadsPartId: ref(x.leads, 'leads', 'existing.leads'),
    plugPartId: ref(x.plug, 'plug', 'existing.plug'),
    plugGapMm: x.plugGapMm,
    magnetoRatedCurrentA: x.magnetoRatedCurrentA ?? null,
    magnetoFullOutputRpm: x.magnetoFullOutputRpm ?? null,
    coilWiring: x.coilWiring ?? 'as-marked-for-earth',
  };
}

/** The engine as a file gives it: the stored engine's fields, without `existing` (that sits beside it). */
const { existing: _existingInEngine, ...engineFileShape } = engineInput.shape;
const engineFile = z.object(engineFileShape);
const hints = { 'engine.existing': 'the existing setup goes at the top of the file, beside "engine"' };

/**
 * Parse the file. Unknown settings anywhere in it come back as problems, and the rest of the file
 * is read without them, so the caller reports every problem at once; a file whose known settings
 * do not parse is refused here with both.
 */
function parseWith<T extends z.ZodType>(schema: T, raw: unknown): { data: z.infer<T>; unknown: string[] } {
  const { lines: unknown, known } = unknownSettings(raw, schema, { engine: engineFile }, hints);
  const parsed = schema.safeParse(known);
  if (!parsed.success) throw new CliInputError([...unknown, ...issueLines(parsed.error, known, dotted, true)]);
  return { data: parsed.data, unknown };
}

/** A plan file: the engine, its existing setup and up to three candidates. */
export function readPlanFile(raw: unknown): Workshop {
  const { data: f, unknown } = parseWith(planFile, raw);
  const problems: string[] = [...unknown];
  const list = new PartList();
  const existing = buildExisting(f.existing, list, problems);
  const plans: Plan[] = f.candidates.map((c, i) => {
    const at = `candidates.${i}`;
    const ref = (p: InlinePart | null, kind: PartKind, path: string): number | null => {
      const checked = expectKind(p, kind, `${at}.${path}`, problems);
      return checked ? list.add(checked) : null;
    };
    return {
      id: i + 1,
      engineId: 1,
      name: c.name,
      notes: c.notes,
      status: 'draft',
      moduleId: ref(c.module, 'module', 'module'),
      coilId: ref(c.coil, 'coil', 'coil'),
      ballastId: ref(c.ballast, 'ballast', 'ballast'),
      crankingBypass: c.crankingBypass,
      moduleFeed: c.moduleFeed,
      coilWiring: c.coilWiring ?? 'as-marked-for-earth',
      tachId: ref(c.tach, 'tach', 'tach'),
      leadsId: ref(c.leads, 'leads', 'leads'),
      plugId: ref(c.plug, 'plug', 'plug'),
      plugGapMm: c.plugGapMm,
      updatedAt: new Date(0).toISOString(),
    };
  });
  const engine = buildEngine(f.engine, existing, problems);
  if (problems.length > 0 || engine === null) throw new CliInputError(problems);
  return { engine, parts: list.parts, plans, options: f.options };
}

/** A bin file: the engine, its existing setup, and the parts to search. */
export function readBinFile(raw: unknown): Workshop {
  const { data: f, unknown } = parseWith(binFile, raw);
  const problems: string[] = [...unknown];
  const list = new PartList();
  const existing = buildExisting(f.existing, list, problems);
  for (const p of f.parts) list.add(p);
  if (!f.parts.some((p) => p.kind === 'module')) problems.push('parts: put at least one module in the parts bin.');
  const engine = buildEngine(f.engine, existing, problems);
  if (problems.length > 0 || engine === null) throw new CliInputError(problems);
  const w: Workshop = { engine, parts: list.parts, plans: [], options: f.options };
  if (f.topN !== undefined) w.topN = f.topN;
  return w;
}
