/**
 * The shape of everything the store keeps, as zod schemas with their inferred types.
 *
 * Units live in the field names (`boreMm`, `primaryResistanceOhm20C`) so that no reader has to
 * guess. Gaps and lengths are stored in millimetres; the UI converts to inches for display only.
 * These schemas are the contract between the store, the bridge, the renderer and the checker
 * adapter: every value that crosses a boundary is parsed with one of them.
 */
import { z } from 'zod';

const id = z.number().int().positive();
const text = (max: number) => z.string().max(max, `Keep this under ${max} characters.`);
/**
 * A number field. The schema-level message is only for "not a number"; every range check carries
 * its own sentence, so a value that is too large never reads "must be a number".
 */
const numberOf = (what: string) =>
  z.number({ error: (issue) => (issue.code === 'invalid_type' ? `${what} must be a number.` : undefined) }).finite(`${what} must be a finite number.`);
const upTo = (schema: z.ZodNumber, what: string, max: number | undefined) =>
  max === undefined ? schema : schema.max(max, `${what} above ${max} is not plausible.`);
const positive = (what: string, max?: number) => upTo(numberOf(what).positive(`${what} must be more than zero.`), what, max);
const nonNegative = (what: string, max?: number) => upTo(numberOf(what).min(0, `${what} cannot be negative.`), what, max);

export const earthPolarity = z.enum(['negative', 'positive']);
export const systemVoltage = z.union([z.literal(6), z.literal(12)], {
  error: 'System voltage is 6 or 12.',
});

/** One row of the distributor's mechanical advance curve, in crankshaft degrees added to static. */
export const advancePoint = z.object({
  rpm: z.number().finite().min(0, 'Rpm cannot be negative.'),
  advanceDeg: z.number().finite().min(-10, 'Advance below -10 degrees is not plausible.').max(60, 'Advance above 60 degrees is not plausible.'),
});

/** Operating conditions the user may override per engine; absent means "use the default". */
export const conditionOverrides = z.object({
  runningSupplyV: positive('Running supply', 20).optional(),
  crankingSupplyV: positive('Cranking supply', 20).optional(),
  harnessResistanceOhm: nonNegative('Harness resistance', 5).optional(),
  ambientC: numberOf('Ambient temperature').min(-40, 'Ambient below -40 °C is not plausible.').max(60, 'Ambient above 60 °C is not plausible.').optional(),
  underBonnetC: numberOf('Under-bonnet temperature').min(-40, 'Under-bonnet below -40 °C is not plausible.').max(150, 'Under-bonnet above 150 °C is not plausible.').optional(),
  volumetricEfficiency: numberOf('Volumetric efficiency').min(0.3, 'Volumetric efficiency below 0.3 is not plausible.').max(1.3, 'Volumetric efficiency above 1.3 is not plausible.').optional(),
});

/** The ignition the engine has today: the baseline every candidate is compared with. */
export const existingSetup = z.object({
  trigger: z.enum(['points', 'magneto']),
  coilPartId: id.nullable(),
  ballast: z.enum(['none', 'discrete', 'harness-wire']),
  ballastPartId: id.nullable(),
  crankingBypass: z.boolean(),
  condenserUf: positive('Condenser', 2).nullable(),
  tachPartId: id.nullable(),
  leadsPartId: id.nullable(),
  plugPartId: id.nullable(),
  plugGapMm: positive('Plug gap').max(3, 'A plug gap over 3 mm is not plausible.'),
  /** Magneto only: the break current it reaches at full output, and the rpm where it gets there. */
  magnetoRatedCurrentA: positive('Magneto rated current', 10).nullable().optional(),
  magnetoFullOutputRpm: positive('Magneto full-output rpm', 10000).nullable().optional(),
});

const engineFields = z.object({
  name: z.string().trim().min(1, 'Give the engine a name.').max(120, 'Keep the name under 120 characters.'),
  notes: text(4000),
  yearText: text(40),
  modelText: text(120),
  cylinders: z.number({ error: 'Cylinders must be a number.' }).int('Cylinders must be a whole number.').min(1, 'At least one cylinder.').max(16, 'At most 16 cylinders.'),
  cycle: z.enum(['four-stroke', 'two-stroke']),
  firingOrder: z.string().trim().regex(/^\d+(-\d+)*$/, 'Write the firing order as numbers joined by dashes, for example 1-3-4-2.'),
  boreMm: positive('Bore').max(200, 'A bore over 200 mm is not plausible.'),
  strokeMm: positive('Stroke').max(250, 'A stroke over 250 mm is not plausible.'),
  conRodMm: positive('Connecting-rod length', 600),
  compressionRatio: z.number({ error: 'Compression ratio must be a number.' }).finite().gt(1, 'Compression ratio must be above 1.').max(25, 'A compression ratio over 25 is not plausible for a spark-ignition engine.'),
  idleRpm: positive('Idle speed', 3000),
  crankingRpm: positive('Cranking speed', 1000),
  redlineRpm: positive('Redline', 20000),
  systemVoltageV: systemVoltage,
  earthPolarity,
  charging: z.enum(['dynamo', 'alternator']),
  pointsDwellDeg: positive('Dwell angle', 120),
  pointsGapMm: positive('Points gap', 1.5),
  pointsFloatRpm: positive('Points float rpm', 20000).nullable().optional(),
  staticTimingDegBtdc: z.number().finite().min(-10, 'Static timing below 10 degrees after TDC is not plausible.').max(40, 'Static timing above 40 degrees BTDC is not plausible.'),
  advanceCurve: z.array(advancePoint).max(40, 'At most 40 rows in the advance curve.'),
  existing: existingSetup,
  conditions: conditionOverrides,
});

/** Cross-field checks, each reported on the field a person would correct. */
function engineRules(e: z.infer<typeof engineFields>, ctx: z.RefinementCtx): void {
  if (!(e.crankingRpm < e.idleRpm)) {
    ctx.addIssue({ code: 'custom', path: ['crankingRpm'], message: 'Cranking speed must be below idle speed.' });
  }
  if (!(e.idleRpm < e.redlineRpm)) {
    ctx.addIssue({ code: 'custom', path: ['redlineRpm'], message: 'Redline must be above idle speed.' });
  }
  if (!(e.conRodMm > e.strokeMm / 2)) {
    ctx.addIssue({ code: 'custom', path: ['conRodMm'], message: 'The connecting rod must be longer than half the stroke.' });
  }
  const firingPeriodDeg = 360 / e.cylinders;
  if (e.pointsDwellDeg >= firingPeriodDeg) {
    ctx.addIssue({
      code: 'custom',
      path: ['pointsDwellDeg'],
      message: `With ${e.cylinders} cylinders the dwell must be below ${firingPeriodDeg.toFixed(0)} distributor degrees.`,
    });
  }
  const order = e.firingOrder.split('-').map(Number);
  const sorted = [...order].sort((a, b) => a - b);
  if (order.length !== e.cylinders || sorted.some((n, i) => n !== i + 1)) {
    ctx.addIssue({
      code: 'custom',
      path: ['firingOrder'],
      message: `The firing order must name each cylinder 1 to ${e.cylinders} once.`,
    });
  }
  for (let i = 1; i < e.advanceCurve.length; i++) {
    if (!(e.advanceCurve[i]!.rpm > e.advanceCurve[i - 1]!.rpm)) {
      ctx.addIssue({ code: 'custom', path: ['advanceCurve', i, 'rpm'], message: 'Each row needs a higher rpm than the row above.' });
    }
  }
  if (e.existing.ballast !== 'none' && e.existing.ballast === 'discrete' && e.existing.ballastPartId === null) {
    ctx.addIssue({ code: 'custom', path: ['existing', 'ballastPartId'], message: 'Pick the ballast resistor fitted, or set the ballast to none.' });
  }
  if (e.existing.trigger === 'magneto' && (e.existing.magnetoRatedCurrentA == null || e.existing.magnetoFullOutputRpm == null)) {
    ctx.addIssue({ code: 'custom', path: ['existing', 'magnetoRatedCurrentA'], message: 'A magneto needs its rated break current and the rpm of full output.' });
  }
}

/** What a form or an import sends to create or replace an engine. */
export const engineInput = engineFields.superRefine(engineRules);
/** An engine as stored, with its id. */
export const engine = engineFields.extend({ id }).superRefine(engineRules);

// ---------------------------------------------------------------------------------------------
// Parts: one kind each, told apart by `kind`.

const partBase = {
  name: z.string().trim().min(1, 'Give the part a name.').max(120, 'Keep the name under 120 characters.'),
  notes: text(2000),
};

export const coilFields = z.object({
  kind: z.literal('coil'),
  ...partBase,
  primaryResistanceOhm20C: positive('Primary resistance', 20),
  primaryInductanceH: positive('Primary inductance').max(0.1, 'A primary inductance over 100 mH is not plausible.'),
  secondaryResistanceOhm: positive('Secondary resistance', 50000),
  turnsRatio: positive('Turns ratio', 400).min(10, 'A turns ratio below 10 is not plausible for an ignition coil.').nullable(),
  secondaryInductanceH: positive('Secondary inductance', 1000).nullable(),
  forBallast: z.boolean(),
  ratedVoltageV: systemVoltage,
  maxDissipationW: positive('Maximum dissipation', 500).nullable(),
});
export const coil = coilFields.refine((c) => c.turnsRatio !== null || c.secondaryInductanceH !== null, {
  path: ['turnsRatio'],
  message: 'Give the turns ratio or the secondary inductance.',
});

export const ballast = z.object({
  kind: z.literal('ballast'),
  ...partBase,
  ballastType: z.enum(['iron-wire', 'ceramic', 'harness-wire']),
  coldResistanceOhm: positive('Cold resistance', 10),
  thermalResistanceKPerW: positive('Thermal resistance', 200).nullable(),
});

export const moduleTypes = ['transistor-points', 'breakerless-fixed-duty', 'breakerless-current-limited', 'capacitive-discharge'] as const;

export const cdStage = z.object({
  capacitorUf: positive('Capacitor', 10),
  chargeVoltageV: positive('Charge voltage', 1000),
  chargerPowerW: positive('Charger power', 500),
  multiSparkBelowRpm: positive('Multi-spark rpm', 10000).nullable(),
});

export const moduleFields = z.object({
  kind: z.literal('module'),
  ...partBase,
  moduleType: z.enum(moduleTypes),
  supplyMinV: positive('Minimum supply', 20),
  supplyMaxV: positive('Maximum supply', 30),
  earthPolarities: z.array(earthPolarity).min(1, 'Tick at least one earth polarity.'),
  minCoilResistanceOhm: nonNegative('Minimum coil resistance', 20),
  maxCurrentA: positive('Maximum current', 30),
  currentLimitA: positive('Current limit', 30).nullable(),
  switchSaturationV: nonNegative('Switch saturation voltage', 5),
  primaryClampV: positive('Primary clamp voltage', 1000).nullable(),
  fixedDutyFraction: z.number().finite().gt(0).lt(1).nullable(),
  maxDutyFraction: z.number().finite().gt(0).lt(1).nullable(),
  stallShutOff: z.boolean(),
  maxSparkRateHz: positive('Maximum spark rate', 2000),
  tachOutput: z.boolean(),
  needsSuppressedLeads: z.boolean(),
  cd: cdStage.nullable(),
});
export const ignitionModule = moduleFields.superRefine((m, ctx) => {
  if (!(m.supplyMinV < m.supplyMaxV)) {
    ctx.addIssue({ code: 'custom', path: ['supplyMaxV'], message: 'The maximum supply must be above the minimum.' });
  }
  if (m.moduleType === 'capacitive-discharge' && m.cd === null) {
    ctx.addIssue({ code: 'custom', path: ['cd'], message: 'A capacitive-discharge module needs its capacitor, charge voltage and charger power.' });
  }
  if (m.moduleType === 'breakerless-fixed-duty' && m.fixedDutyFraction === null) {
    ctx.addIssue({ code: 'custom', path: ['fixedDutyFraction'], message: 'A fixed-duty module needs its duty fraction.' });
  }
  if (m.moduleType === 'breakerless-current-limited' && (m.currentLimitA === null || m.maxDutyFraction === null)) {
    ctx.addIssue({ code: 'custom', path: ['currentLimitA'], message: 'A current-limited module needs its current limit and maximum duty.' });
  }
});

export const tach = z.object({
  kind: z.literal('tach'),
  ...partBase,
  senses: z.enum(['coil-supply-current', 'coil-negative-pulses', 'module-output', 'cable']),
});

export const leads = z.object({
  kind: z.literal('leads'),
  ...partBase,
  core: z.enum(['copper', 'carbon', 'spiral']),
  resistancePerLeadOhm: nonNegative('Lead resistance', 100000),
});

export const plug = z.object({
  kind: z.literal('plug'),
  ...partBase,
  resistor: z.boolean(),
  resistorOhm: nonNegative('Resistor', 20000),
  gapMinMm: positive('Smallest gap', 3),
  gapMaxMm: positive('Largest gap', 3),
});

export const partInput = z.discriminatedUnion('kind', [coil, ballast, ignitionModule, tach, leads, plug], {
  error: 'Unknown part kind: use coil, ballast, module, tach, leads or plug.',
}).superRefine((p, ctx) => {
  if (p.kind === 'plug' && !(p.gapMinMm <= p.gapMaxMm)) {
    ctx.addIssue({ code: 'custom', path: ['gapMaxMm'], message: 'The largest gap must not be below the smallest.' });
  }
});
export const part = z.intersection(partInput, z.object({ id }));
export const partKinds = ['coil', 'ballast', 'module', 'tach', 'leads', 'plug'] as const;
export const partKind = z.enum(partKinds);

// ---------------------------------------------------------------------------------------------
// Conversion plans and the readings taken while carrying them out.

export const planStatus = z.enum(['draft', 'checked', 'wired', 'done']);

export const planFields = z.object({
  engineId: id,
  name: z.string().trim().min(1, 'Give the plan a name.').max(120, 'Keep the name under 120 characters.'),
  notes: text(4000),
  status: planStatus,
  moduleId: id.nullable(),
  coilId: id.nullable(),
  ballastId: id.nullable(),
  /** Whether the starter circuit feeds the coil directly while cranking (bypassing the ballast). */
  crankingBypass: z.boolean(),
  /** Where the module takes its own supply: straight from terminal 15, or (wrongly) after the ballast. */
  moduleFeed: z.enum(['switched-15', 'after-ballast']),
  tachId: id.nullable(),
  leadsId: id.nullable(),
  plugId: id.nullable(),
  plugGapMm: positive('Plug gap', 3),
});
export const planInput = planFields;
export const plan = planFields.extend({ id, updatedAt: z.string() });

export const readingQuantities = [
  'coil-primary-resistance',
  'ballast-resistance',
  'battery-voltage-resting',
  'supply-voltage-cranking',
  'supply-voltage-running',
  'coil-feed-voltage-key-on',
  'dwell-angle',
  'plug-gap',
  'ht-lead-resistance',
  'other',
] as const;

export const readingInput = z.object({
  planId: id,
  quantity: z.enum(readingQuantities),
  value: z.number({ error: 'The reading must be a number.' }).finite(),
  unit: z.string().trim().min(1, 'Give the unit.').max(16, 'Keep the unit under 16 characters.'),
  takenOn: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Write the date as YYYY-MM-DD.'),
  note: text(500),
});
export const reading = readingInput.extend({ id });

export type AdvancePoint = z.infer<typeof advancePoint>;
export type ConditionOverrides = z.infer<typeof conditionOverrides>;
export type ExistingSetup = z.infer<typeof existingSetup>;
export type EngineInput = z.infer<typeof engineInput>;
export type Engine = z.infer<typeof engine>;
export type Coil = z.infer<typeof coil>;
export type Ballast = z.infer<typeof ballast>;
export type IgnitionModule = z.infer<typeof ignitionModule>;
export type Tach = z.infer<typeof tach>;
export type Leads = z.infer<typeof leads>;
export type Plug = z.infer<typeof plug>;
export type PartInput = z.infer<typeof partInput>;
export type Part = z.infer<typeof part>;
export type PartKind = z.infer<typeof partKind>;
export type PlanInput = z.infer<typeof planInput>;
export type Plan = z.infer<typeof plan>;
export type PlanStatus = z.infer<typeof planStatus>;
export type ReadingInput = z.infer<typeof readingInput>;
export type Reading = z.infer<typeof reading>;

/** Turn zod's issues into `{ "existing.plugGapMm": "message" }` for showing beside form fields. */
export function fieldMessages(error: z.ZodError): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.map(String).join('.') || '_';
    if (!(key in out)) out[key] = issue.message;
  }
  return out;
}
