/**
 * What the wiring-sheet screen receives: the sheet as `buildSheet` makes it (the model in
 * electron/checklist/types.ts), the ticks, the readings judged against their steps, and the
 * progress. These schemas import only zod and the store's schema, so the renderer may use them
 * through channels.ts; the dispatcher checks every answer against them. `sheet-shapes-check.ts` fails the type check when
 * a shape here and its type in electron/checklist/types.ts drift apart.
 */
import { z } from 'zod';
import { planStatus, readingQuantities } from '../../db/schema.js';

const id = z.number().int().positive();
const finite = z.number().finite();
const count = z.number().int().min(0);

/** The store's list (db/schema.ts), which `ReadingQuantity` in the checklist must equal (sheet-shapes-check.ts). */
export const sheetReadingQuantity = z.enum(readingQuantities);
export const workshopUnit = z.enum(['V', 'A', 'ohm', 'kohm', 'deg', 'rpm', 'mm', '']);
export const sheetPlanStatus = planStatus;
export const stageId = z.enum(['magneto', 'before', 'measure', 'fit', 'static', 'cranking', 'running', 'finish']);

export const expectedReading = z.object({
  quantity: sheetReadingQuantity,
  unit: workshopUnit,
  expected: finite,
  min: finite,
  max: finite,
  probes: z.string(),
  state: z.string(),
  how: z.string(),
  source: z.string(),
  ifOutOfRange: z.array(z.string()),
});

export const sheetStep = z.object({
  key: z.string().min(1).max(80),
  stage: stageId,
  title: z.string(),
  text: z.string(),
  terminals: z.array(z.string()),
  fitting: z.boolean(),
  reading: expectedReading.nullable(),
});

export const sheetStage = z.object({ id: stageId, title: z.string(), intro: z.string(), steps: z.array(sheetStep) });

export const sheetHeader = z.object({
  engine: z.object({
    name: z.string(),
    yearText: z.string(),
    modelText: z.string(),
    cylinders: z.number().int().min(1),
    systemVoltageV: z.union([z.literal(6), z.literal(12)]),
    earthPolarity: z.enum(['negative', 'positive']),
    charging: z.enum(['dynamo', 'alternator']),
    firingOrder: z.string(),
  }),
  plan: z.object({
    name: z.string(),
    status: sheetPlanStatus,
    switching: z.string(),
    coil: z.string(),
    ballast: z.string(),
    crankingBypass: z.boolean(),
    moduleFeed: z.string(),
    tach: z.string(),
    leads: z.string(),
    plug: z.string(),
    plugGapMm: finite,
    suggestedGapMm: finite.nullable(),
  }),
  verdict: z.object({ verdict: z.enum(['pass', 'caution', 'fail']), line: z.string() }),
  existingLine: z.string(),
  printedOn: z.string(),
});

export const diagramPartKind = z.enum([
  'battery',
  'earth',
  'ignition-switch',
  'starter-solenoid',
  'ballast',
  'coil',
  'points',
  'condenser',
  'module',
  'pickup',
  'tach',
  'tach-adaptor',
  'distributor',
  'plug',
  'magneto',
]);
export const diagramTerminal = z.object({ id: z.string(), label: z.string(), x: finite, y: finite });
export const diagramPart = z.object({
  id: z.string(),
  kind: diagramPartKind,
  label: z.string(),
  x: finite,
  y: finite,
  width: finite,
  height: finite,
  terminals: z.array(diagramTerminal),
});
export const wireStyle = z.enum(['supply', 'switched', 'low-tension', 'high-tension', 'cranking', 'earth', 'signal']);
export const diagramWire = z.object({
  id: z.string(),
  from: z.string(),
  to: z.string(),
  style: wireStyle,
  path: z.array(z.object({ x: finite, y: finite })),
  label: z.string(),
});
export const diagram = z.object({ width: finite, height: finite, parts: z.array(diagramPart), wires: z.array(diagramWire), notes: z.array(z.string()) });

export const sheet = z.object({
  header: sheetHeader,
  /** Never empty: a sheet that tells someone to touch the ignition shows the cautions first. */
  cautions: z.array(z.object({ id: z.string(), text: z.string() })).min(1),
  stages: z.array(sheetStage),
  diagram,
});

export const band = z.enum(['in', 'low', 'high']);

export const sheetProgress = z.object({
  fittingSteps: count,
  fittingTicked: count,
  checkSteps: count,
  checksInBand: count,
  reached: z.enum(['none', 'wired', 'done']),
});

/** One stored reading against the step that asks for its quantity. */
export const judgedReading = z.object({
  stepKey: z.string(),
  readingId: id,
  value: finite,
  unit: z.string(),
  band,
});

/**
 * The sheet answer without the stored readings (channels.ts adds them with the store's `reading`
 * schema): the sheet, the ticked step keys that name steps of it, every reading whose quantity a
 * step asks for judged against that step's band, the progress (judged on the latest reading per
 * quantity), the plan's status and when the plan was last changed.
 */
export const sheetAnswerFields = z.object({
  sheet,
  ticked: z.array(z.string()),
  judged: z.array(judgedReading),
  progress: sheetProgress,
  status: sheetPlanStatus,
  planUpdatedAt: z.string(),
});

export const pageSize = z.enum(['A4', 'Letter'], { error: 'The page size is A4 or Letter.' });
export const printRequest = z.strictObject({ pageSize });
/** `saved` false with `path` null when the person cancelled the save dialogue. */
export const printAnswer = z.object({ saved: z.boolean(), path: z.string().nullable() });

export type SheetShape = z.infer<typeof sheet>;
export type JudgedReading = z.infer<typeof judgedReading>;
export type SheetProgressShape = z.infer<typeof sheetProgress>;
export type PageSize = z.infer<typeof pageSize>;
export type PrintAnswer = z.infer<typeof printAnswer>;
