/**
 * The shape of everything the store keeps, as zod schemas with their inferred types.
 *
 * Units live in the field names (`boreMm`, `primaryResistanceOhm20C`) so that no reader has to
 * guess. Gaps and lengths are stored in millimetres; the UI converts to inches for display only.
 * These schemas are the contract between the store, the bridge, the renderer and the checker
 * adapter: every value that crosses a boundary is parsed with one of them.
 */
import { z } from 'zod';
import { conditionDescriptors, conditionKeys, rangeMessage, type ConditionDescriptor, type ConditionKey } from './conditions.js';
export { conditionByKey, conditionDescriptors, conditionGroupTitles, conditionKeys, conditionText, rangeMessage, toStored, toTyped } from './conditions.js';
export type { ConditionContext, ConditionDescriptor, ConditionGroup, ConditionKey, DefaultSource } from './conditions.js';
import { textRules } from './text-rules.js';
export { textProblem } from './text-rules.js';

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

/**
 * Operating conditions the user may override per engine; absent means "use the default". Built
 * from the descriptors in db/conditions.ts (words, typed unit, range with its reason): every key
 * optional, a value outside its range refused with the reason, an unknown key refused.
 */
function conditionNumber(d: ConditionDescriptor): z.ZodNumber {
  const message = rangeMessage(d);
  const base = numberOf(d.label);
  return (d.minExclusive ? base.gt(d.min, message) : base.min(d.min, message)).max(d.max, message);
}
export const conditionOverrides = z.strictObject(
  Object.fromEntries(conditionDescriptors.map((d) => [d.key, conditionNumber(d).optional()])) as { [K in ConditionKey]: z.ZodOptional<z.ZodNumber> },
  { error: (issue) => (issue.code === 'unrecognized_keys' ? unknownConditionMessage(issue.keys) : undefined) },
);

function unknownConditionMessage(keys: readonly string[]): string {
  return `Unknown working condition ${keys.map((k) => `"${k}"`).join(', ')}: the conditions are ${conditionKeys.join(', ')}.`;
}

/**
 * Which coil terminal goes to the supply side: as marked for this car's earth (on negative earth
 * + / SW / 15 to the feed; on positive earth - / CB / 1 to the feed), or the other way round.
 */
export const coilWirings = ['as-marked-for-earth', 'reversed'] as const;
export const coilWiring = z.enum(coilWirings, { error: 'The coil is wired as marked for this earth, or reversed.' });

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
  /** Absent in rows stored before it existed: read as 'as-marked-for-earth'. */
  coilWiring: coilWiring.optional(),
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

/** The highest rpm an advance-curve row may name: the same limit as the redline field. */
export const ADVANCE_RPM_MAX = 20000;

/**
 * Checks only what a form or an import sends (never rows already stored, which must stay readable):
 * the text fields and the advance curve's rpm.
 */
function engineInputRules(e: z.infer<typeof engineFields>, ctx: z.RefinementCtx): void {
  textRules([
    { key: 'name', words: 'The name', visible: true },
    { key: 'notes', words: 'The notes', multiLine: true },
    { key: 'yearText', words: 'The year' },
    { key: 'modelText', words: 'The model' },
  ])(e, ctx);
  e.advanceCurve.forEach((p, i) => {
    if (p.rpm > ADVANCE_RPM_MAX) ctx.addIssue({ code: 'custom', path: ['advanceCurve', i, 'rpm'], message: `An advance-curve rpm above ${ADVANCE_RPM_MAX} is not plausible.` });
  });
}

/** What a form or an import sends to create or replace an engine. */
export const engineInput = engineFields.superRefine(engineRules).superRefine(engineInputRules);
/** An engine as stored, with its id. */
/** An engine as stored, with its id and when it last changed (sent back with an update or delete so a stale screen cannot overwrite a newer save). */
export const engine = engineFields.extend({ id, updatedAt: z.string() }).superRefine(engineRules);

// ---------------------------------------------------------------------------------------------
// Parts: one kind each, told apart by `kind`.

/** The most of one part the shelf may hold (a number this large is a typing slip). */
export const PART_QUANTITY_MAX = 999;

const partBase = {
  name: z.string().trim().min(1, 'Give the part a name.').max(120, 'Keep the name under 120 characters.'),
  notes: text(2000),
  /** How many of this part the shelf holds (migration 005); left out, it is one. */
  quantity: z
    .number({ error: 'How many you have must be a whole number.' })
    .int('How many you have must be a whole number.')
    .min(1, 'How many you have must be at least 1 (delete the part when none is left).')
    .max(PART_QUANTITY_MAX, `How many you have must be ${PART_QUANTITY_MAX} or fewer.`)
    .default(1),
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
  /**
   * Rated secondary (insulation) voltage in kV, as printed on a coil box; absent or null means the
   * checker's labelled default (30 kV, or 40 kV with a capacitive-discharge unit; from memory).
   */
  ratedSecondaryKv: positive('Rated secondary voltage', 100).nullable().optional(),
  /** Coupling between the windings, when the maker gives it; absent or null: the engine's condition. */
  couplingK: numberOf('Coupling').gt(0.9, 'A coupling of 0.9 or less is not plausible for an ignition coil.').lt(1, 'The coupling must be below 1.').nullable().optional(),
});
/** How far a given turns ratio may stray from sqrt(Ls/Lp) when both are given (ideal-transformer relation, n^2 = Ls/Lp). */
export const TURNS_RATIO_TOLERANCE = 0.1;
export const coil = coilFields.superRefine((c, ctx) => {
  if (c.turnsRatio === null && c.secondaryInductanceH === null) {
    ctx.addIssue({ code: 'custom', path: ['turnsRatio'], message: 'Give the turns ratio or the secondary inductance.' });
    return;
  }
  if (c.turnsRatio !== null && c.secondaryInductanceH !== null && c.primaryInductanceH > 0) {
    const fromL = Math.sqrt(c.secondaryInductanceH / c.primaryInductanceH);
    if (Math.abs(c.turnsRatio - fromL) > TURNS_RATIO_TOLERANCE * fromL) {
      ctx.addIssue({
        code: 'custom',
        path: ['turnsRatio'],
        message: `The turns ratio ${c.turnsRatio} disagrees with the inductances: the square root of secondary over primary inductance gives ${fromL.toFixed(0)}. Correct one of them, or leave the secondary inductance blank.`,
      });
    }
  }
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
  if (m.currentLimitA !== null && m.currentLimitA > m.maxCurrentA) {
    ctx.addIssue({ code: 'custom', path: ['currentLimitA'], message: `The current limit cannot be above the module's own maximum current (${m.maxCurrentA} A).` });
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

const partChecked = z.discriminatedUnion('kind', [coil, ballast, ignitionModule, tach, leads, plug], {
  error: 'Unknown part kind: use coil, ballast, module, tach, leads or plug.',
}).superRefine((p, ctx) => {
  if (p.kind === 'plug' && !(p.gapMinMm <= p.gapMaxMm)) {
    ctx.addIssue({ code: 'custom', path: ['gapMaxMm'], message: 'The largest gap must not be below the smallest.' });
  }
});
/** What a form or an import sends; the text rules apply to input only (stored rows stay readable). */
export const partInput = partChecked.superRefine(
  textRules([
    { key: 'name', words: 'The name', visible: true },
    { key: 'notes', words: 'The notes', multiLine: true },
  ]),
);
export const part = z.intersection(partChecked, z.object({ id, updatedAt: z.string() }));
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
  /** Which coil terminal goes to the supply side; absent means 'as-marked-for-earth'. */
  coilWiring: coilWiring.optional(),
  tachId: id.nullable(),
  leadsId: id.nullable(),
  plugId: id.nullable(),
  plugGapMm: positive('Plug gap', 3),
});
const planTextRules = textRules([
  { key: 'name', words: 'The plan name', visible: true },
  { key: 'notes', words: 'The notes', multiLine: true },
]);
export const planInput = planFields.superRefine(planTextRules);
/**
 * What an edit of a plan sends: the same fields, the status optional. The status moves with the
 * work (weighed, wired, done) and by hand through its own request, so an editor that was opened
 * before the plan moved on leaves it out and cannot put the old status back.
 */
export const planUpdateInput = planFields.extend({ status: planStatus.optional() }).superRefine(planTextRules);
export const plan = planFields.extend({ id, updatedAt: z.string() });

// ---------------------------------------------------------------------------------------------
// Readings: each quantity has one workshop unit (the contract's table, design note "Expected
// readings"). A reading typed in another accepted unit is converted to it before it is stored, and
// a unit that cannot be converted is refused, so a stored value is never read in the wrong unit.

export const readingQuantities = [
  'battery-voltage-resting',
  'coil-primary-resistance',
  'coil-secondary-resistance',
  'ballast-resistance',
  'ht-lead-resistance',
  'key-on-current',
  'coil-feed-voltage-key-on',
  'coil-switch-voltage-key-on',
  'coil-voltage-after-shut-off',
  'supply-voltage-cranking',
  'coil-feed-voltage-cranking',
  'module-supply-voltage-cranking',
  'supply-voltage-running',
  'dwell-angle',
  'tach-idle-rpm',
  'timing-idle',
  'timing-advanced',
  'plug-gap',
  'other',
] as const;
export type ReadingQuantity = (typeof readingQuantities)[number];

/** The one unit each quantity is stored in. 'other' keeps whatever unit was typed, unconverted (''). */
export const readingUnits = {
  'battery-voltage-resting': 'V',
  'coil-primary-resistance': 'ohm',
  'coil-secondary-resistance': 'kohm',
  'ballast-resistance': 'ohm',
  'ht-lead-resistance': 'kohm',
  'key-on-current': 'A',
  'coil-feed-voltage-key-on': 'V',
  'coil-switch-voltage-key-on': 'V',
  'coil-voltage-after-shut-off': 'V',
  'supply-voltage-cranking': 'V',
  'coil-feed-voltage-cranking': 'V',
  'module-supply-voltage-cranking': 'V',
  'supply-voltage-running': 'V',
  'dwell-angle': 'deg',
  'tach-idle-rpm': 'rpm',
  'timing-idle': 'deg',
  'timing-advanced': 'deg',
  'plug-gap': 'mm',
  other: '',
} as const satisfies Record<ReadingQuantity, 'V' | 'A' | 'ohm' | 'kohm' | 'deg' | 'rpm' | 'mm' | ''>;
export type ReadingUnit = (typeof readingUnits)[ReadingQuantity];

/** Each quantity in plain words, for messages and labels. */
export const readingWords: Record<ReadingQuantity, string> = {
  'battery-voltage-resting': 'Battery voltage at rest',
  'coil-primary-resistance': 'Coil primary resistance',
  'coil-secondary-resistance': 'Coil secondary resistance',
  'ballast-resistance': 'Ballast resistance',
  'ht-lead-resistance': 'HT lead resistance',
  'key-on-current': 'Current with the key on',
  'coil-feed-voltage-key-on': 'Coil feed voltage with the key on',
  'coil-switch-voltage-key-on': 'Coil switch-side voltage with the key on',
  'coil-voltage-after-shut-off': 'Coil voltage after the module shuts off',
  'supply-voltage-cranking': 'Battery voltage while cranking',
  'coil-feed-voltage-cranking': 'Coil feed voltage while cranking',
  'module-supply-voltage-cranking': 'Module supply voltage while cranking',
  'supply-voltage-running': 'Battery voltage while running',
  'dwell-angle': 'Dwell angle',
  'tach-idle-rpm': 'Tachometer reading at idle',
  'timing-idle': 'Timing at idle',
  'timing-advanced': 'Timing with the advance in',
  'plug-gap': 'Plug gap',
  other: 'Other reading',
};

type UnitFamily = 'resistance' | 'voltage' | 'current' | 'length' | 'angle' | 'speed';
type Prefix = '' | 'm' | 'k' | 'M';
/** value in the stored unit = value typed x mul / div (integers, so 1400 mohm gives exactly 1.4 ohm). */
type Scale = readonly [mul: number, div: number];

/**
 * What each stored unit accepts. SI prefixes (BIPM, The International System of Units, 9th
 * edition, table 7): milli is a lower-case m (1e-3), kilo k (1e3), mega an upper-case M (1e6).
 * Inch = 25.4 mm exactly (international yard and pound agreement, 1959); thou = 0.001 inch.
 * Migration 002 applies the same table in SQL to the readings stored before it.
 */
const unitTable: Record<Exclude<ReadingUnit, ''>, { family: UnitFamily; scales: Partial<Record<string, Scale>>; accepted: string }> = {
  ohm: { family: 'resistance', scales: { '': [1, 1], m: [1, 1000], k: [1000, 1], M: [1000000, 1] }, accepted: 'ohm, mohm (milliohm), kohm or Mohm (megohm); Ω works too' },
  kohm: { family: 'resistance', scales: { '': [1, 1000], m: [1, 1000000], k: [1, 1], M: [1000, 1] }, accepted: 'kohm, ohm, mohm (milliohm) or Mohm (megohm); Ω works too' },
  V: { family: 'voltage', scales: { '': [1, 1], m: [1, 1000] }, accepted: 'V or mV' },
  A: { family: 'current', scales: { '': [1, 1], m: [1, 1000] }, accepted: 'A or mA' },
  mm: { family: 'length', scales: { mm: [1, 1], in: [254, 10], thou: [254, 10000] }, accepted: 'mm, in (inch) or thou' },
  deg: { family: 'angle', scales: { '': [1, 1] }, accepted: 'deg (degrees, °)' },
  rpm: { family: 'speed', scales: { '': [1, 1] }, accepted: 'rpm (r/min)' },
};

/** Lower-cases A-Z only, as SQLite's lower() does, so the store and migration 002 agree. */
const asciiLower = (s: string): string => s.replace(/[A-Z]/g, (c) => c.toLowerCase());
const OHM_SIGNS = ['Ω', 'Ω']; // Greek capital omega, and the ohm sign U+2126
const baseWords: Array<[UnitFamily, readonly string[]]> = [
  ['resistance', ['ohm', 'ohms']],
  ['voltage', ['v', 'volt', 'volts']],
  ['current', ['a', 'amp', 'amps', 'ampere', 'amperes']],
];
function baseFamily(word: string): UnitFamily | null {
  if (OHM_SIGNS.includes(word)) return 'resistance';
  const w = asciiLower(word);
  return baseWords.find(([, words]) => words.includes(w))?.[0] ?? null;
}

type ParsedUnit = { family: UnitFamily; key: string } | { ambiguous: true } | null;

/** A typed unit as a family and a key into `unitTable`'s scales; null when it is no unit we know. */
function parseUnit(unit: string): ParsedUnit {
  const lower = asciiLower(unit);
  if (unit === 'mm') return { family: 'length', key: 'mm' };
  if (['in', 'inch', 'inches'].includes(lower)) return { family: 'length', key: 'in' };
  if (lower === 'thou') return { family: 'length', key: 'thou' };
  if (['deg', 'degree', 'degrees'].includes(lower) || unit === '°') return { family: 'angle', key: '' };
  if (['rpm', 'r/min'].includes(lower)) return { family: 'speed', key: '' };
  const whole = baseFamily(unit);
  if (whole) return { family: whole, key: '' };
  const first = unit.slice(0, 1);
  const rest = unit.slice(1);
  const family = baseFamily(rest);
  if (!family) return null;
  if (first === 'm') return { family, key: 'm' };
  if (first === 'k' || first === 'K') return { family, key: 'k' };
  if (first === 'M') {
    // "Mohm" and "MΩ" are mega; "MOHM", "MV" or "MA" could be a milli typed with caps lock: refuse rather than guess.
    if (OHM_SIGNS.includes(rest) || rest !== rest.toUpperCase()) return { family, key: 'M' };
    return { ambiguous: true };
  }
  return null;
}

export type StoredUnit = { ok: true; value: number; unit: string } | { ok: false; message: string };

/**
 * A reading as typed, in the unit its quantity is stored in: converted when the unit is one of the
 * accepted alternatives, refused (with a sentence naming the accepted units) otherwise. 'other'
 * keeps its unit as typed and is never converted.
 */
export function toStoredUnit(quantity: ReadingQuantity, value: number, typedUnit: string): StoredUnit {
  const unit = typedUnit.trim();
  const target = readingUnits[quantity];
  if (target === '') return { ok: true, value, unit };
  const spec = unitTable[target];
  const kept = `${readingWords[quantity]} is kept in ${target}; write the unit as ${spec.accepted}.`;
  if (unit === '') return { ok: false, message: `Give the unit. ${kept}` };
  if (unit === target) return { ok: true, value, unit: target };
  const parsed = parseUnit(unit);
  if (parsed && 'ambiguous' in parsed) {
    return { ok: false, message: `"${unit}" could mean milli or mega: write a lower-case m for milli (mohm, mV, mA) and an upper-case M only for mega (Mohm). ${kept}` };
  }
  const scale = parsed && parsed.family === spec.family ? spec.scales[parsed.key] : undefined;
  if (!scale) return { ok: false, message: `"${unit}" is not a unit this reading can be kept in. ${kept}` };
  return { ok: true, value: (value * scale[0]) / scale[1], unit: target };
}

/** A real day on the (proleptic Gregorian) calendar, written YYYY-MM-DD. */
export function isCalendarDate(text: string): boolean {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(text);
  if (!m) return false;
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const leap = (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0;
  const days = [31, leap ? 29 : 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31][mo - 1];
  return days !== undefined && d >= 1 && d <= days;
}

/**
 * The values a workshop meter can plausibly show for each quantity, in its stored unit. Checked on
 * what is typed only (a stored reading outside stays readable). From memory / common practice:
 * a 6 or 12 V car's circuits read well inside +-100 V and +-50 A on a workshop multimeter; coil
 * primaries, ballasts and leads are ohms to tens of kilohms; dwell is at most a full distributor
 * turn (360 degrees); timing marks run from after TDC to well under 90 degrees before it.
 */
export const readingRanges: Partial<Record<ReadingQuantity, { min: number; max: number; why: string }>> = (() => {
  const volts = { min: -100, max: 100, why: 'a 6 or 12 V car reads well inside this' };
  const amps = { min: -50, max: 50, why: 'an ignition circuit draws far less' };
  const ohms = { min: 0, max: 100000, why: 'a resistance is not negative, and a coil, ballast or lead is far below 100 kohm' };
  const kohms = { min: 0, max: 1000, why: 'a resistance is not negative, and a secondary winding or lead is far below 1 Mohm' };
  return {
    'battery-voltage-resting': volts,
    'coil-primary-resistance': ohms,
    'coil-secondary-resistance': kohms,
    'ballast-resistance': ohms,
    'ht-lead-resistance': kohms,
    'key-on-current': amps,
    'coil-feed-voltage-key-on': volts,
    'coil-switch-voltage-key-on': volts,
    'coil-voltage-after-shut-off': volts,
    'supply-voltage-cranking': volts,
    'coil-feed-voltage-cranking': volts,
    'module-supply-voltage-cranking': volts,
    'supply-voltage-running': volts,
    'dwell-angle': { min: 0, max: 360, why: 'dwell is part of one distributor turn' },
    'tach-idle-rpm': { min: 0, max: 20000, why: 'the same limit as the redline' },
    'timing-idle': { min: -30, max: 90, why: 'timing marks run from after TDC to well under 90 degrees before it' },
    'timing-advanced': { min: -30, max: 90, why: 'timing marks run from after TDC to well under 90 degrees before it' },
    'plug-gap': { min: 0, max: 5, why: 'a plug gap is a fraction of a millimetre to a few millimetres' },
    other: { min: -1e9, max: 1e9, why: 'a meter shows nothing larger' },
  };
})();

const readingFields = z.strictObject({
  planId: id,
  quantity: z.enum(readingQuantities, { error: 'Pick what was measured from the list.' }),
  value: z.number({ error: 'The reading must be a number.' }).finite('The reading must be a finite number.'),
  /** Blank only for 'other'; checked against the quantity below. */
  unit: z.string().trim().max(16, 'Keep the unit under 16 characters.'),
  takenOn: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Write the date as YYYY-MM-DD.'),
  /**
   * The same limit as a stored reading's: migration 002 put a sentence of about 100 characters
   * before the note of a reading it could not convert, and such a note must survive a workshop file
   * going out and coming back in.
   */
  note: text(1000),
});

/**
 * What a form sends: the unit must be the quantity's own or one the store converts (the
 * repository converts it before storing), and the date a real one.
 */
export const readingInput = readingFields.superRefine((r, ctx) => {
  if (!isCalendarDate(r.takenOn)) {
    ctx.addIssue({ code: 'custom', path: ['takenOn'], message: `${r.takenOn} is not a day on the calendar; write a real date as YYYY-MM-DD.` });
  }
  const stored = toStoredUnit(r.quantity, r.value, r.unit);
  if (!stored.ok) ctx.addIssue({ code: 'custom', path: ['unit'], message: stored.message });
  else {
    const range = readingRanges[r.quantity];
    if (range && !(stored.value >= range.min && stored.value <= range.max)) {
      const unit = readingUnits[r.quantity];
      ctx.addIssue({
        code: 'custom',
        path: ['value'],
        message: `${readingWords[r.quantity]} must be between ${range.min} and ${range.max}${unit ? ` ${unit}` : ''} (${range.why}).`,
      });
    }
  }
  textRules([
    { key: 'note', words: 'The note', multiLine: true },
    { key: 'unit', words: 'The unit' },
  ])(r, ctx);
});

/**
 * A reading as stored: always in its quantity's unit (the repository converts, migration 002
 * converted the older rows). The note may be longer than a form allows because migration 002
 * prefixes a sentence to the note of a reading it had to move to 'other'.
 */
export const reading = readingFields.extend({ id, updatedAt: z.string() }).superRefine((r, ctx) => {
  const target = readingUnits[r.quantity];
  if (target !== '' && r.unit !== target) {
    ctx.addIssue({ code: 'custom', path: ['unit'], message: `${readingWords[r.quantity]} is kept in ${target}, but this row says ${r.unit || 'no unit'}.` });
  }
});

/** A step key of a wiring sheet ("measure.coil-primary"): short text without control characters. */
export const stepKey = z
  .string({ error: 'Name the step by its key.' })
  .min(1, 'Name the step by its key.')
  .max(80, 'A step key is at most 80 characters.')
  .refine((s) => !/[\u0000-\u001f\u007f-\u009f]/.test(s), 'A step key cannot hold control characters.');

/** A ticked step of a plan's wiring sheet; `tickedOn` is when it was ticked (ISO 8601). */
export const sheetTick = z.strictObject({ planId: id, stepKey, tickedOn: z.string() });

// ---------------------------------------------------------------------------------------------
// Settings: what the person chose, kept in the store (migration 005, db/repositories/settings.ts).

export const lengthUnits = ['mm', 'inch'] as const;
/** The screens a reload or a new start may return to (renderer/app/routes.ts names them). */
export const settingScreens = ['engines', 'parts', 'combination', 'sheet', 'records'] as const;
/** At most this many plans are ticked to weigh at once (besides the ignition fitted now). */
export const MAX_WEIGHED_PLANS = 3;

/** One schema per key; a key not listed here is refused, never dropped. */
export const settingShapes = {
  /** Gaps and lengths shown and typed in millimetres or inches (stored values stay mm). */
  lengthUnit: z.enum(lengthUnits, { error: 'The length unit is "mm" or "inch".' }),
  /** The engine being worked on (the top bar's "Working on"), or null for none yet. */
  workingEngineId: z
    .number({ error: 'The engine being worked on is an engine id (a whole number above zero), or null.' })
    .int('The engine being worked on is an engine id (a whole number above zero), or null.')
    .positive('The engine being worked on is an engine id (a whole number above zero), or null.')
    .nullable(),
  /** The weighing screen's ticked plans, per engine: engine id (as text) -> up to three plan ids. */
  weighTicks: z.record(
    z.string().regex(/^[1-9][0-9]{0,15}$/, 'Each key of the ticked plans must be an engine id.'),
    z
      .array(id, { error: 'The ticked plans of an engine are a list of plan ids.' })
      .max(MAX_WEIGHED_PLANS, `Tick at most ${MAX_WEIGHED_PLANS} plans of one engine.`)
      .refine((ids) => new Set(ids).size === ids.length, 'Each plan can be ticked only once.'),
    { error: 'The ticked plans are a map from engine id to a list of plan ids.' },
  ),
  /** The first-run guide on the first screen is put away. */
  firstRunHidden: z.boolean({ error: 'Whether the first-run guide is hidden is true or false.' }),
  /** The screen the person was last on, opened again at the next start. */
  lastScreen: z.enum(settingScreens, { error: `The last screen is one of ${settingScreens.join(', ')}.` }),
  /** The plan on the bench (the top bar's chip to its wiring sheet), or null for none. */
  benchPlanId: z
    .number({ error: 'The plan on the bench is a plan id (a whole number above zero), or null.' })
    .int('The plan on the bench is a plan id (a whole number above zero), or null.')
    .positive('The plan on the bench is a plan id (a whole number above zero), or null.')
    .nullable(),
  /** The paper the wiring sheet and the comparison are laid out and printed on. */
  pageSize: z.enum(['A4', 'Letter'], { error: 'The page size is A4 or Letter.' }),
} as const;

export const settings = z.strictObject(settingShapes);
/**
 * What 'settings.set' takes: any of the keys, each checked. An unknown key is refused (not dropped),
 * with the key itself as the field so the message sits on it.
 */
export const settingsPatch = z
  .looseObject(settingShapes)
  .partial()
  .superRefine(
    (v, ctx) => {
      for (const key of Object.keys(v)) {
        if (!Object.hasOwn(settingShapes, key)) {
          ctx.addIssue({ code: 'custom', path: [key], message: `There is no setting called “${key}”; the settings are ${Object.keys(settingShapes).join(', ')}.` });
        }
      }
    },
    // Also when a known key is wrong, so every problem is listed at once.
    { when: (payload) => typeof payload.value === 'object' && payload.value !== null && !Array.isArray(payload.value) },
  )
  .transform((v): Partial<Settings> => v);
export type Settings = z.infer<typeof settings>;
export type SettingsPatch = Partial<Settings>;
export type SettingKey = keyof Settings;
export const settingKeys = Object.keys(settingShapes) as SettingKey[];
/** What a key holds until it is first set. */
export const settingDefaults: Settings = { lengthUnit: 'mm', workingEngineId: null, weighTicks: {}, firstRunHidden: false, lastScreen: 'engines', benchPlanId: null, pageSize: 'A4' };

export type AdvancePoint = z.infer<typeof advancePoint>;
export type ConditionOverrides = z.infer<typeof conditionOverrides>;
export type ExistingSetup = z.infer<typeof existingSetup>;
export type CoilWiringChoice = z.infer<typeof coilWiring>;
export type EngineInput = z.infer<typeof engineInput>;
export type Engine = z.infer<typeof engine>;
export type Coil = z.infer<typeof coil>;
export type Ballast = z.infer<typeof ballast>;
export type IgnitionModule = z.infer<typeof ignitionModule>;
export type Tach = z.infer<typeof tach>;
export type Leads = z.infer<typeof leads>;
export type Plug = z.infer<typeof plug>;
/** What may be sent: `quantity` may be left out (it is then 1). */
export type PartInput = z.input<typeof partInput>;
export type Part = z.infer<typeof part>;
export type PartKind = z.infer<typeof partKind>;
export type PlanInput = z.infer<typeof planInput>;
export type PlanUpdateInput = z.infer<typeof planUpdateInput>;
export type Plan = z.infer<typeof plan>;
export type PlanStatus = z.infer<typeof planStatus>;
export type ReadingInput = z.infer<typeof readingInput>;
export type Reading = z.infer<typeof reading>;
export type StepKey = z.infer<typeof stepKey>;
export type SheetTick = z.infer<typeof sheetTick>;

/** Turn zod's issues into `{ "existing.plugGapMm": "message" }` for showing beside form fields. */
export function fieldMessages(error: z.ZodError): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.map(String).join('.') || '_';
    if (!(key in out)) out[key] = issue.message;
  }
  return out;
}
