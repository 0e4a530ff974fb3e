/**
 * What the "weigh a combination" screen receives: the checker's reports trimmed to what a person
 * reads, in display units (mJ, kV, mm), every number finite. These schemas import only zod and the
 * store's condition schema, so the renderer may use them through channels.ts; the dispatcher checks
 * every answer against them.
 */
import { z } from 'zod';
import { conditionOverrides } from '../../db/schema.js';

const id = z.number().int().positive();
const finite = z.number().finite();

export const verdictValue = z.enum(['pass', 'caution', 'fail']);

/** A figure behind a rule or an input: `measured` when it came from the person's own meter. */
export const shownFigure = z.object({
  name: z.string(),
  value: finite,
  unit: z.string(),
  measured: z.boolean(),
  /** Where an input came from ("catalogue", "default (from memory)", ...); null for computed figures. */
  source: z.string().nullable(),
});

export const shownRule = z.object({
  id: z.string(),
  title: z.string(),
  verdict: verdictValue,
  figures: z.array(shownFigure),
  why: z.string(),
  action: z.string(),
});

/** One operating point in display units. */
export const shownPoint = z.object({
  rpm: finite,
  supplyV: finite,
  currentA: finite,
  dwellMs: finite,
  energyMj: finite,
  availableKv: finite,
  requiredKv: finite,
  reserveRatio: finite,
  /** Why there is no spark here (the module's own supply is below what it needs), or null when it sparks. */
  noSparkReason: z.string().nullable(),
  /** Energy delivered to the spark itself and how long it lasts: what compares kinds fairly (Heywood 1988, ch. 9). */
  sparkEnergyMj: finite,
  sparkDurationMs: finite,
  /** True where the coil's rated secondary voltage caps the available voltage. */
  cappedAtCeiling: z.boolean(),
});

/**
 * The sweep for charts, downsampled; equal-length columns over the same rpm. The first
 * `crankingCount` points are on the cranking supply (a chart shows them apart from the running line).
 */
export const shownSeries = z.object({
  rpm: z.array(finite),
  energyMj: z.array(finite),
  availableKv: z.array(finite),
  requiredKv: z.array(finite),
  crankingCount: z.number().int().min(0),
  /** True where the module does not switch (no spark: energy and available voltage are 0 there). */
  noSpark: z.array(z.boolean()),
  /** Why, for the first such point; null when every point sparks. */
  noSparkNote: z.string().nullable(),
});

export const shownSetup = z.object({
  kind: z.enum(['existing', 'plan', 'suggestion']),
  /** The stored plan this setup is, when it is one. */
  planId: id.nullable(),
  name: z.string(),
  verdict: verdictValue,
  counts: z.object({ pass: z.number().int().min(0), caution: z.number().int().min(0), fail: z.number().int().min(0) }),
  rules: z.array(shownRule),
  /** What to do, merged from the rules: fails first, then cautions, each once, none undoing another. */
  actions: z.array(z.string()),
  keyPoints: z.object({ cranking: shownPoint, idle: shownPoint, mid: shownPoint, redline: shownPoint }),
  /** Lowest running rpm where available / required falls below the margin; null if it never does. */
  belowMarginFromRpm: finite.nullable(),
  worstReserveRatio: finite,
  worstReserveRpm: finite,
  plugGapMm: finite,
  /** Largest gap that keeps the margin at the worst rpm; null when none does (or it was not searched). */
  suggestedGapMm: finite.nullable(),
  /** Values taken from the person's readings, which won over the catalogue. */
  measured: z.array(shownFigure),
  /** Figures worked out for this setup (time to the current limit, CD recharge, cylinder state at the spark ...). */
  setupFigures: z.array(shownFigure),
  series: shownSeries,
});

export const shownCaution = z.object({ id: z.string(), text: z.string() });

export const comparisonAnswer = z.object({
  engineId: id,
  engineName: z.string(),
  marginRatio: finite,
  /** The conditions every setup was computed under, with where each came from. */
  conditions: z.array(shownFigure),
  existing: shownSetup,
  candidates: z.array(shownSetup).max(3),
  cautions: z.array(shownCaution).min(1),
});

export const shelfSuggestion = z.object({
  rank: z.number().int().min(1),
  moduleId: id,
  moduleName: z.string(),
  coilId: id,
  coilName: z.string(),
  ballastId: id.nullable(),
  ballastName: z.string().nullable(),
  crankingBypass: z.boolean(),
  /** A tach, leads or plugs from the shelf fitted instead of today's (where today's would fail); null keeps today's. */
  tachId: id.nullable(),
  leadsId: id.nullable(),
  plugId: id.nullable(),
  /** A plan name of at most 120 characters, for "make this a plan". */
  planName: z.string().min(1).max(120),
  setup: shownSetup,
});

/** A part the search left out because plans marked as fitted on other engines use every one the shelf holds. */
export const leftOutPart = z.object({
  partId: id,
  partName: z.string(),
  kind: z.string(),
  quantity: z.number().int().min(1),
  fittedTo: z.array(z.object({ planId: id, planName: z.string(), engineId: id, engineName: z.string(), status: z.string() })),
  /** The sentence the screen shows: "Your only one is fitted to “Plan” on Engine (marked wired)." */
  reason: z.string(),
});

export const searchAnswer = z.object({
  engineId: id,
  engineName: z.string(),
  marginRatio: finite,
  evaluated: z.number().int().min(0),
  withoutFail: z.number().int().min(0),
  suggestions: z.array(shelfSuggestion),
  /** How many combinations each rule failed (one combination can count under several). */
  rejectedByRule: z.array(z.object({ id: z.string(), title: z.string(), count: z.number().int().min(0) })),
  cautions: z.array(shownCaution).min(1),
  /** Parts not tried because every one of them is fitted elsewhere (shelf-stock.ts). */
  leftOut: z.array(leftOutPart),
});

export const checkPlansRequest = z.strictObject({
  engineId: id,
  planIds: z
    .array(id)
    .max(3, 'Compare at most three plans with the existing setup at once.')
    .refine((ids) => new Set(ids).size === ids.length, 'Each plan can be ticked only once.'),
  /**
   * Weigh with these working conditions in place of the engine's stored ones (the whole set: a
   * condition left out takes its default). The weighing screen sends the air temperature just
   * typed here while the engine's own copy is being saved, so the charts need not wait for the save.
   */
  conditions: conditionOverrides.optional(),
});

export const checkSearchRequest = z.strictObject({
  engineId: id,
  top: z.number().int('Ask for a whole number of suggestions.').min(1, 'Ask for at least one suggestion.').max(10, 'Ask for at most ten suggestions.').optional(),
});

export type ShownFigure = z.infer<typeof shownFigure>;
export type ShownRule = z.infer<typeof shownRule>;
export type ShownPoint = z.infer<typeof shownPoint>;
export type ShownSeries = z.infer<typeof shownSeries>;
export type ShownSetup = z.infer<typeof shownSetup>;
export type ComparisonAnswer = z.infer<typeof comparisonAnswer>;
export type SearchAnswer = z.infer<typeof searchAnswer>;
export type ShelfSuggestion = z.infer<typeof shelfSuggestion>;
export type LeftOutPartShown = z.infer<typeof leftOutPart>;
export type VerdictValue = z.infer<typeof verdictValue>;
