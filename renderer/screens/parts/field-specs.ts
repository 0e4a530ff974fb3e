/**
 * Each numeric field of a part: the words used in its messages, the unit it is typed in, and how
 * that unit relates to the stored one. The store keeps SI units named in the schema's field names
 * (henries, fractions, mm, µF for the CD capacitor); the form lets a person type what a data sheet
 * or a meter shows (mH, per cent, mm or inch).
 */
import type { z } from 'zod';
import { numberToText } from '../../app/numbers.js';
import { mmToUnit, unitLabel, type GapUnit } from '../../app/units.js';

export type FieldSpec = {
  label: string;
  /** The unit the person types, as shown in the label ('' for a plain ratio). */
  unit: string;
  /** Typed units per stored unit: 1000 for mH against H, 100 for per cent against a fraction. */
  per?: number;
  /** Gaps are typed in the chosen gap unit and stored in mm. */
  gap?: true;
};

export const fieldSpecs: Record<string, FieldSpec> = {
  quantity: { label: 'How many you have', unit: '' },
  primaryResistanceOhm20C: { label: 'Primary resistance', unit: 'Ω' },
  primaryInductanceH: { label: 'Primary inductance', unit: 'mH', per: 1000 },
  secondaryResistanceOhm: { label: 'Secondary resistance', unit: 'Ω' },
  turnsRatio: { label: 'Turns ratio', unit: '' },
  secondaryInductanceH: { label: 'Secondary inductance', unit: 'H' },
  maxDissipationW: { label: 'Maximum dissipation', unit: 'W' },
  ratedSecondaryKv: { label: 'Rated secondary voltage', unit: 'kV' },
  couplingK: { label: 'Coupling between the windings', unit: '' },
  coldResistanceOhm: { label: 'Cold resistance', unit: 'Ω' },
  thermalResistanceKPerW: { label: 'Thermal resistance', unit: 'K/W' },
  supplyMinV: { label: 'Lowest supply', unit: 'V' },
  supplyMaxV: { label: 'Highest supply', unit: 'V' },
  minCoilResistanceOhm: { label: 'Smallest coil resistance', unit: 'Ω' },
  maxCurrentA: { label: 'Maximum current', unit: 'A' },
  currentLimitA: { label: 'Current limit', unit: 'A' },
  switchSaturationV: { label: 'Switch voltage drop', unit: 'V' },
  primaryClampV: { label: 'Primary clamp voltage', unit: 'V' },
  fixedDutyFraction: { label: 'Fixed duty', unit: '%', per: 100 },
  maxDutyFraction: { label: 'Maximum duty', unit: '%', per: 100 },
  maxSparkRateHz: { label: 'Maximum spark rate', unit: 'sparks a second' },
  'cd.capacitorUf': { label: 'Capacitor', unit: 'µF' },
  'cd.chargeVoltageV': { label: 'Charge voltage', unit: 'V' },
  'cd.chargerPowerW': { label: 'Charger power', unit: 'W' },
  'cd.multiSparkBelowRpm': { label: 'Multi-spark below', unit: 'rpm' },
  resistancePerLeadOhm: { label: 'Resistance per lead', unit: 'Ω' },
  resistorOhm: { label: 'Resistor', unit: 'Ω' },
  gapMinMm: { label: 'Smallest gap', unit: 'mm', gap: true },
  gapMaxMm: { label: 'Largest gap', unit: 'mm', gap: true },
};

/** A stored value shown in the unit it is typed in. */
export function toTyped(spec: FieldSpec, stored: number, unit: GapUnit): number {
  if (spec.gap) return mmToUnit(stored, unit);
  return spec.per ? stored * spec.per : stored;
}

/** A typed value turned into the stored unit (division keeps 5.5 mH exactly 0.0055 H). */
export function toStored(spec: FieldSpec, typed: number): number {
  return spec.per ? typed / spec.per : typed;
}

const typedUnit = (spec: FieldSpec, unit: GapUnit): string => (spec.gap ? unitLabel(unit) : spec.unit);

/**
 * zod's message for an issue, in the units the person typed. The schema's own sentences are kept;
 * a bare range message ("Too big: expected number to be <=20", or the schema's "must be a number"
 * that zod also attaches to an unlabelled range check) is rewritten with the field's words, the
 * limit in the typed unit, and the unit.
 */
export function plainMessage(issue: z.ZodError['issues'][number], unit: GapUnit): string {
  const path = issue.path.map(String).join('.');
  const spec = fieldSpecs[path];
  const bare = /^Too (big|small)\b/.test(issue.message) || /must be a number\.$/.test(issue.message);
  if (!spec || !bare || (issue.code !== 'too_big' && issue.code !== 'too_small')) return issue.message;
  const limit = Number(issue.code === 'too_big' ? issue.maximum : issue.minimum);
  const u = typedUnit(spec, unit);
  const shown = `${numberToText(toTyped(spec, limit, unit), 4)}${u ? ` ${u}` : ''}`;
  if (issue.code === 'too_big') return issue.inclusive ? `${spec.label} must be ${shown} or less.` : `${spec.label} must be below ${shown}.`;
  return issue.inclusive ? `${spec.label} must be at least ${shown}.` : `${spec.label} must be more than ${shown}.`;
}
