/**
 * The one channel map: every request the renderer may make, with a zod schema for the request
 * and one for the successful response. The desktop preload, the main-process handlers and the
 * browser host are all built from this map, so what the browser tests exercise is exactly what
 * the desktop app runs. Nothing outside this file decides what the renderer may ask for.
 */
import { z } from 'zod';
import { engine, engineInput, part, partInput, partKind, plan, planInput, planUpdateInput, planStatus, reading, readingInput, stepKey } from '../../db/schema.js';
import { settings, settingsPatch } from '../../db/schema.js';
import { checkPlansRequest, checkSearchRequest, comparisonAnswer, searchAnswer } from './check-shapes.js';
import { printAnswer, printRequest, sheetAnswerFields } from './sheet-shapes.js';
import { recordsChannels } from './records-shapes.js';

export * from './check-shapes.js';
export * from './sheet-shapes.js';
export * from './records-shapes.js';

const id = z.number().int().positive();
const byId = z.strictObject({ id });
/**
 * The `updatedAt` of the record as the screen showed it. Every update and delete carries it; if the
 * record changed since, the answer is STALE and nothing is written (the screen offers to reload).
 */
const expectedUpdatedAt = z.string({ error: 'Send the updatedAt of the record as it was shown.' }).min(1, 'Send the updatedAt of the record as it was shown.');
const byIdAt = z.strictObject({ id, expectedUpdatedAt });
/** Names one delete for 'removed.restore' (the undo). */
const undoToken = z.number().int().positive();
const removedKind = z.enum(['engine', 'part', 'plan', 'reading']);
export const removedSummary = z.object({
  token: undoToken,
  kind: removedKind,
  id,
  label: z.string(),
  removedAt: z.string(),
  plans: z.number().int().min(0),
  readings: z.number().int().min(0),
});
export type RemovedSummary = z.infer<typeof removedSummary>;

export const engineSummary = z.object({
  id,
  name: z.string(),
  yearText: z.string(),
  modelText: z.string(),
  cylinders: z.number(),
  systemVoltageV: z.number(),
  earthPolarity: z.string(),
  planCount: z.number().int().min(0),
  updatedAt: z.string(),
});

/** What 'sheet.get' and 'sheet.tick' answer: the sheet, its ticks, the plan's readings judged, the progress and the status. */
export const sheetAnswer = sheetAnswerFields.extend({ readings: z.array(reading) });
export type SheetAnswer = z.infer<typeof sheetAnswer>;

export const channels = {
  'app.info': {
    request: z.strictObject({}),
    response: z.object({ version: z.string(), dataDir: z.string(), schemaVersion: z.number().int(), host: z.enum(['desktop', 'browser']) }),
  },
  'demo.load': {
    request: z.strictObject({}),
    response: z.object({ enginesAdded: z.number().int(), partsAdded: z.number().int(), plansAdded: z.number().int() }),
  },
  'engines.list': { request: z.strictObject({}), response: z.array(engineSummary) },
  'engines.get': { request: byId, response: engine },
  'engines.create': { request: z.strictObject({ engine: engineInput }), response: engine },
  'engines.update': { request: z.strictObject({ id, expectedUpdatedAt, engine: engineInput }), response: engine },
  /** Refused with IN_USE while plans use the engine, unless the user has confirmed the cascade. */
  'engines.delete': {
    request: z.strictObject({ id, expectedUpdatedAt, deletePlansToo: z.boolean() }),
    response: z.object({ deleted: z.literal(true), plansDeleted: z.number().int(), undoToken }),
  },
  'parts.list': { request: z.strictObject({ kind: partKind.optional() }), response: z.array(part) },
  'parts.get': { request: byId, response: part },
  'parts.create': { request: z.strictObject({ part: partInput }), response: part },
  'parts.update': { request: z.strictObject({ id, expectedUpdatedAt, part: partInput }), response: part },
  'parts.delete': { request: byIdAt, response: z.object({ deleted: z.literal(true), undoToken }) },
  'plans.list': { request: z.strictObject({ engineId: id.optional() }), response: z.array(plan) },
  'plans.get': { request: byId, response: plan },
  'plans.create': { request: z.strictObject({ plan: planInput }), response: plan },
  /** The status may be left out: then the stored one stays (it moves by 'plans.setStatus' and the work). */
  'plans.update': { request: z.strictObject({ id, expectedUpdatedAt, plan: planUpdateInput }), response: plan },
  'plans.delete': { request: byIdAt, response: z.object({ deleted: z.literal(true), readingsDeleted: z.number().int(), undoToken }) },
  'readings.list': { request: z.strictObject({ planId: id }), response: z.array(reading) },
  'readings.add': { request: z.strictObject({ reading: readingInput }), response: reading },
  'readings.delete': { request: byIdAt, response: z.object({ deleted: z.literal(true), undoToken }) },
  /** What deleting would take or meet, asked before the one question: an engine's plans and readings, a part's users. */
  'engines.contents': { request: z.strictObject({ id }), response: z.object({ plans: z.number().int().min(0), readings: z.number().int().min(0) }) },
  'parts.usedBy': { request: z.strictObject({ id }), response: z.object({ usedBy: z.array(z.string()) }) },
  /** What was deleted since the app started, newest first (kept in memory until the app is closed). */
  'removed.list': { request: z.strictObject({}), response: z.object({ removed: z.array(removedSummary) }) },
  /** Puts a removed record back with its id (and everything that went with it). */
  'removed.restore': {
    request: z.strictObject({ token: undoToken }),
    response: z.object({ kind: removedKind, id, label: z.string() }),
  },
  /** A reading corrected: converted to its quantity's unit like 'readings.add'; it stays with its plan. */
  'readings.update': { request: z.strictObject({ id, expectedUpdatedAt, reading: readingInput }), response: reading },
  /** The status set by hand, in any direction (the work on the sheet only ever moves it forward). */
  'plans.setStatus': { request: z.strictObject({ id, status: planStatus }), response: plan },
  /**
   * The engines, parts, plans and readings that no longer parse (lists leave them out): each with a
   * label, its version (for the delete request) and the reason. The screen says how many and offers to remove each.
   */
  'store.unreadable': {
    request: z.strictObject({}),
    response: z.object({
      rows: z.array(z.object({ table: z.enum(['engines', 'parts', 'plans', 'readings']), id, label: z.string(), updatedAt: z.string(), message: z.string() })),
    }),
  },
  /** A plan's wiring sheet with its ticks, readings and progress. */
  'sheet.get': { request: z.strictObject({ planId: id }), response: sheetAnswer },
  /** Ticks or unticks one step of the plan's sheet; the status moves forward if the work reached 'wired' or 'done'. */
  'sheet.tick': { request: z.strictObject({ planId: id, stepKey, ticked: z.boolean() }), response: sheetAnswer },
  /** Prints the page shown (desktop: saved as a PDF); the browser host answers UNSUPPORTED and the page uses window.print(). */
  'app.print': { request: printRequest, response: printAnswer },
  /** Every setting (defaults where none is stored): mm/inch, the engine worked on, ticked plans per engine, the first-run guide, the last screen. */
  'settings.get': { request: z.strictObject({}), response: settings },
  /** Writes the keys given (all or none; an unknown key or a bad value is refused naming the key) and answers every setting. */
  'settings.set': { request: settingsPatch, response: settings },
  /** The engine's existing setup beside up to three of its plans, judged rule by rule. */
  'check.plans': { request: checkPlansRequest, response: comparisonAnswer },
  /** The best combinations of module, coil and ballast from the whole parts bin for one engine (in a worker thread). */
  'check.search': { request: checkSearchRequest, response: searchAnswer },
  /** Stops every running search; each answers CANCELLED. */
  'check.cancel': { request: z.strictObject({}), response: z.object({ cancelled: z.number().int().min(0) }) },
  /** How many searches are running, for how long the oldest has run (ms), and the share of its combinations tried. */
  'check.progress': {
    request: z.strictObject({}),
    response: z.object({ running: z.number().int().min(0), elapsedMs: z.number().min(0), share: z.number().min(0).max(1) }),
  },
  /** Backups, the workshop file and the parts lists as CSV (records-shapes.ts). */
  ...recordsChannels,
} as const;

export type Channels = typeof channels;
export type ChannelName = keyof Channels;
export type RequestOf<C extends ChannelName> = z.input<Channels[C]['request']>;
export type ResponseOf<C extends ChannelName> = z.output<Channels[C]['response']>;

export const errorCodes = [
  'INVALID_INPUT', // the request did not match its schema; `fields` says which and why
  'NOT_FOUND', // the id names nothing in the store
  'IN_USE', // deleting would orphan something; the user must confirm or move it first
  'STALE', // the record changed since the screen read it; nothing was written; offer to reload
  'UNKNOWN_CHANNEL', // no such request in the map
  'STORE_ERROR', // the database refused the write; nothing was changed
  'UNSUPPORTED', // the request needs the desktop shell (printing, for example)
  'CANCELLED', // the person stopped a long request (a search); nothing was changed
  'INTERNAL', // a fault of ours; the message says what to report
] as const;
export type ErrorCode = (typeof errorCodes)[number];

export const appError = z.object({
  code: z.enum(errorCodes),
  message: z.string(),
  fields: z.record(z.string(), z.string()).optional(),
});
export type AppError = z.infer<typeof appError>;

export type Result<T> = { ok: true; value: T } | { ok: false; error: AppError };

/** The function the renderer calls; the same signature on both transports. */
export type Invoke = <C extends ChannelName>(channel: C, request: RequestOf<C>) => Promise<Result<ResponseOf<C>>>;

export function isChannelName(name: unknown): name is ChannelName {
  return typeof name === 'string' && Object.prototype.hasOwnProperty.call(channels, name);
}

/** What the preload exposes and what the browser client builds: one function per channel. */
export type BridgeApi = { [C in ChannelName]: (request: RequestOf<C>) => Promise<Result<ResponseOf<C>>> };

/** The global name under which the bridge appears in the renderer. */
export const bridgeGlobalName = 'ignitionBridge';
