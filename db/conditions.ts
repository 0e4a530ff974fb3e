/**
 * The working conditions a person may set per engine, one descriptor each: the words and unit
 * shown in the app, the factor from the typed unit to the stored SI value (the key carries the SI
 * unit: `ambientPressurePa` is stored in pascal, typed in kPa), the plausible range with a plain
 * sentence, and the checker's default with its label, for showing beside an empty box.
 *
 * One list serves the store's schema (`conditionOverrides` in schema.ts: every key optional, out
 * of range refused, unknown keys refused), the setup adapter (`electron/setup/engine.ts`) and the
 * engine editor. `electron/setup/condition-keys-check.ts` holds the keys equal to the checker's
 * ConditionName at compile time; `test/db/conditions.test.ts` holds the defaults equal to the
 * checker's own.
 *
 * The six conditions the store has always kept (running and cranking supply, loom resistance, air
 * and under-bonnet temperature, volumetric efficiency) keep the ranges they were stored under, so
 * no engine saved before becomes unreadable; the others take the checker's suggested ranges.
 */

export const conditionKeys = [
  'runningSupplyV',
  'crankingSupplyV',
  'restingBatteryV',
  'dynamoCutInRpm',
  'harnessResistanceOhm',
  'pointsContactResistanceOhm',
  'ambientC',
  'ambientPressurePa',
  'underBonnetC',
  'inletChargeC',
  'volumetricEfficiency',
  'polytropicIndex',
  'secondaryCapacitanceF',
  'transferEfficiency',
  'couplingK',
  'secondaryCeilingV',
  'arcVoltageV',
  'fouledShuntOhm',
  'coilDissipationLimitW',
  'currentLimitHoldS',
  'ballastThermalResistanceKPerW',
  'marginRatio',
] as const;

export type ConditionKey = (typeof conditionKeys)[number];

/** Where a default comes from, worded exactly as the checker labels it in a report. */
export type DefaultSource = 'default (workshop documentation)' | 'default (from memory)' | 'default (common practice)' | 'default (standard value)';

/** What a default may depend on: the engine's system voltage and the air temperature in use. */
export type ConditionContext = { systemVoltageV: 6 | 12; ambientC: number };

export type ConditionGroup = 'electrics' | 'air' | 'coil' | 'judgement';

export const conditionGroupTitles: Record<ConditionGroup, string> = {
  electrics: 'Battery, charging and wiring',
  air: 'Air and charge',
  coil: 'Coil and spark',
  judgement: 'How much margin to ask for',
};

export interface ConditionDescriptor {
  key: ConditionKey;
  group: ConditionGroup;
  /** Plain words, as a restorer would say them. */
  label: string;
  /** The unit typed and shown in the app ('' for a plain ratio). */
  unit: string;
  /** Stored SI value of one typed unit: stored = typed x perUnit. */
  perUnit: number;
  /** Plausible range of the stored value, inclusive (exclusive at the bottom when minExclusive). */
  min: number;
  max: number;
  minExclusive?: boolean;
  /** Why that range, in a plain sentence. */
  why: string;
  /** When the checker uses it at all, if not always. */
  usedWhen?: string;
  /** A reading taken on a plan's wiring sheet wins over it when that plan is weighed. */
  measurable?: boolean;
  /** The checker's default (stored unit) and its label. */
  byDefault: (c: ConditionContext) => { value: number; source: DefaultSource };
}

const WORKSHOP: DefaultSource = 'default (workshop documentation)';
const MEMORY: DefaultSource = 'default (from memory)';
const PRACTICE: DefaultSource = 'default (common practice)';
const STANDARD: DefaultSource = 'default (standard value)';

/**
 * Battery load-test pass floor against temperature as printed in workshop manuals (9.6 V at
 * 21 degC down to 8.5 V at -18 degC), held flat beyond the table: the checker's cranking default.
 */
const CRANKING_FLOOR: ReadonlyArray<readonly [number, number]> = [
  [-18, 8.5],
  [-12, 8.7],
  [-1, 9.1],
  [10, 9.4],
  [21, 9.6],
];

function crankingFloorV(ambientC: number): number {
  const t = CRANKING_FLOOR;
  if (!(ambientC > t[0]![0])) return t[0]![1];
  for (let i = 1; i < t.length; i++) {
    const [c1, v1] = t[i]!;
    if (ambientC <= c1) {
      const [c0, v0] = t[i - 1]!;
      return v0 + ((v1 - v0) * (ambientC - c0)) / (c1 - c0);
    }
  }
  return t[t.length - 1]![1];
}

const fixed = (value: number, source: DefaultSource) => (): { value: number; source: DefaultSource } => ({ value, source });

export const conditionDescriptors: readonly ConditionDescriptor[] = [
  {
    key: 'runningSupplyV', group: 'electrics', label: 'Supply while running', unit: 'V', perUnit: 1, min: 0, minExclusive: true, max: 20,
    why: 'A charging 6 V or 12 V car runs at 6 to 15 V.', measurable: true,
    byDefault: (c) => (c.systemVoltageV === 6 ? { value: 7.2, source: MEMORY } : { value: 14, source: WORKSHOP }),
  },
  {
    key: 'crankingSupplyV', group: 'electrics', label: 'Supply while cranking', unit: 'V', perUnit: 1, min: 0, minExclusive: true, max: 20,
    why: 'A battery under the starter sits below its resting voltage.', measurable: true,
    byDefault: (c) => (c.systemVoltageV === 6 ? { value: crankingFloorV(c.ambientC) / 2, source: MEMORY } : { value: crankingFloorV(c.ambientC), source: WORKSHOP }),
  },
  {
    key: 'restingBatteryV', group: 'electrics', label: 'Battery at rest (not charging)', unit: 'V', perUnit: 1, min: 4, max: 14,
    why: 'A 6 V battery rests near 6.3 V and a 12 V one near 12.6 V when full.', usedWhen: 'Used below the dynamo cut-in speed on a dynamo car.',
    byDefault: (c) => (c.systemVoltageV === 6 ? { value: 6.2, source: PRACTICE } : { value: 12.4, source: PRACTICE }),
  },
  {
    key: 'dynamoCutInRpm', group: 'electrics', label: 'Engine speed where the dynamo starts charging', unit: 'rpm', perUnit: 1, min: 300, max: 3000,
    why: 'Dynamos cut in somewhere about 1,000 to 1,200 engine rpm.', usedWhen: 'Used only when the engine charges with a dynamo.',
    byDefault: fixed(1100, MEMORY),
  },
  {
    key: 'harnessResistanceOhm', group: 'electrics', label: 'Loom resistance, switch to coil', unit: 'Ω', perUnit: 1, min: 0, max: 5,
    why: 'A sound loom from switch to coil is a few tenths of an ohm; resistive ballast wire is counted as a ballast, not here.',
    byDefault: fixed(0.1, MEMORY),
  },
  {
    key: 'pointsContactResistanceOhm', group: 'electrics', label: 'Points contact resistance', unit: 'Ω', perUnit: 1, min: 0, max: 1,
    why: 'Clean points measure well under a tenth of an ohm; burnt ones a few tenths.', usedWhen: 'Used only where points switch the coil.',
    byDefault: fixed(0.1, MEMORY),
  },
  {
    key: 'ambientC', group: 'air', label: 'Air temperature', unit: '°C', perUnit: 1, min: -40, max: 60,
    why: 'That covers the coldest start and the hottest day a car is driven on.',
    byDefault: fixed(20, PRACTICE),
  },
  {
    key: 'ambientPressurePa', group: 'air', label: 'Air pressure', unit: 'kPa', perUnit: 1000, min: 50_000, max: 110_000,
    why: 'Sea level is 101.3 kPa; 50 kPa is higher than any road.',
    byDefault: fixed(101_325, STANDARD),
  },
  {
    key: 'underBonnetC', group: 'air', label: 'Under-bonnet temperature', unit: '°C', perUnit: 1, min: -40, max: 150,
    why: 'A hot engine bay reaches about 80 to 120 °C.',
    byDefault: fixed(80, PRACTICE),
  },
  {
    key: 'inletChargeC', group: 'air', label: 'Charge temperature at inlet closing', unit: '°C', perUnit: 1, min: -40, max: 150,
    why: 'The charge warms on the manifold and valves, to about 50 to 80 °C in a warm engine.',
    byDefault: fixed(57, MEMORY),
  },
  {
    key: 'volumetricEfficiency', group: 'air', label: 'Volumetric efficiency', unit: '', perUnit: 1, min: 0.3, max: 1.3,
    why: 'A fraction of the swept volume filled: about 0.8 to 0.9 at full load, up to 1.3 supercharged.',
    byDefault: fixed(0.85, MEMORY),
  },
  {
    key: 'polytropicIndex', group: 'air', label: 'Polytropic index of compression', unit: '', perUnit: 1, min: 1.1, max: 1.4,
    why: 'Between 1.1 (heavy heat loss) and 1.4 (no heat loss, air).',
    byDefault: fixed(1.3, MEMORY),
  },
  {
    key: 'secondaryCapacitanceF', group: 'coil', label: 'Capacitance of coil tower, lead and plug', unit: 'pF', perUnit: 1e-12, min: 10e-12, max: 500e-12,
    why: 'Coil tower, lead and plug together are some 50 to 100 pF.',
    byDefault: fixed(70e-12, MEMORY),
  },
  {
    key: 'transferEfficiency', group: 'coil', label: 'Coil transfer efficiency', unit: '', perUnit: 1, min: 0.3, max: 1,
    why: 'A fraction of the modelled secondary peak a real coil delivers, at most 1.',
    byDefault: fixed(0.8, MEMORY),
  },
  {
    key: 'couplingK', group: 'coil', label: 'Coil coupling between windings', unit: '', perUnit: 1, min: 0.9, max: 0.9999,
    why: 'Oil-filled canister coils are 0.98 to 0.999; it is always below 1.', usedWhen: 'Moves the capacitive-discharge peak most.',
    byDefault: fixed(0.995, MEMORY),
  },
  {
    key: 'secondaryCeilingV', group: 'coil', label: 'Coil secondary rating when the coil gives none', unit: 'kV', perUnit: 1000, min: 10_000, max: 80_000,
    why: 'Canister coils are built for about 30 to 40 kV.', usedWhen: 'Used for a coil whose own record gives no rating; left blank, 30 kV is taken (40 kV with a capacitive-discharge unit).',
    byDefault: fixed(30_000, MEMORY),
  },
  {
    key: 'arcVoltageV', group: 'coil', label: 'Spark arc voltage', unit: 'V', perUnit: 1, min: 200, max: 3000,
    why: 'The glow phase of an inductive spark runs at 0.5 to 1 kV.',
    byDefault: fixed(700, MEMORY),
  },
  {
    key: 'fouledShuntOhm', group: 'coil', label: 'Fouled-plug leakage resistance', unit: 'kΩ', perUnit: 1000, min: 10_000, max: 100e6,
    why: 'A carbon-fouled plug leaks through some hundreds of kilohm.',
    byDefault: fixed(500_000, MEMORY),
  },
  {
    key: 'coilDissipationLimitW', group: 'coil', label: 'Coil heat limit', unit: 'W', perUnit: 1, min: 10, max: 300,
    why: 'What a coil sheds for good without damage: tens of watts.',
    byDefault: fixed(80, MEMORY),
  },
  {
    key: 'currentLimitHoldS', group: 'coil', label: 'Current-limit hold time', unit: 'ms', perUnit: 1e-3, min: 0, max: 5e-3,
    why: 'A current-limited module holds its limit a fraction of a millisecond before the break.', usedWhen: 'Used only for a current-limited module.',
    byDefault: fixed(0.5e-3, MEMORY),
  },
  {
    key: 'ballastThermalResistanceKPerW', group: 'coil', label: 'Ballast thermal resistance', unit: 'K/W', perUnit: 1, min: 1, max: 50,
    why: 'A finned open iron ballast in free air is near 8 K/W.', usedWhen: 'Used for an iron-wire ballast whose own record gives none.',
    byDefault: fixed(8, MEMORY),
  },
  {
    key: 'marginRatio', group: 'judgement', label: 'Voltage margin wanted', unit: '', perUnit: 1, min: 1, max: 3,
    why: 'The available voltage over the voltage needed; 1.25 is the usual reserve, 1 means none.',
    byDefault: fixed(1.25, PRACTICE),
  },
];

/** The descriptors by key. */
export const conditionByKey = Object.fromEntries(conditionDescriptors.map((d) => [d.key, d])) as Record<ConditionKey, ConditionDescriptor>;

/** A stored value in the typed unit, without float noise (70e-12 F -> 70 pF). */
export function toTyped(d: ConditionDescriptor, stored: number): number {
  return Number((stored / d.perUnit).toPrecision(12));
}

/** A typed value in the stored unit, without float noise (70 pF -> 7e-11 F). */
export function toStored(d: ConditionDescriptor, typed: number): number {
  return Number((typed * d.perUnit).toPrecision(12));
}

/** "14 V", "101.3 kPa", "0.85": a stored value written in the typed unit, to four significant figures. */
export function conditionText(d: ConditionDescriptor, stored: number): string {
  const v = Number(toTyped(d, stored).toPrecision(4));
  return d.unit ? `${v} ${d.unit}` : String(v);
}

/** The message for a value outside the plausible range, in the typed unit (and the stored one where they differ). */
export function rangeMessage(d: ConditionDescriptor): string {
  const lo = toTyped(d, d.min);
  const hi = toTyped(d, d.max);
  const unit = d.unit ? ` ${d.unit}` : '';
  const stored = d.perUnit === 1 ? '' : ` (in the file, ${d.key} from ${d.min} to ${d.max})`;
  const span = d.minExclusive ? `more than ${lo} and at most ${hi}${unit}` : `from ${lo} to ${hi}${unit}`;
  return `${d.label} must be ${span}${stored}. ${d.why}`;
}
