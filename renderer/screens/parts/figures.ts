/**
 * The figures a restorer picks a part by, as short text with units, for the parts list. Stored
 * SI values are shown in workshop units: inductance in mH, duty in per cent, gaps in mm or inch.
 */
import type { Ballast, Coil, IgnitionModule, Leads, Plug, Tach } from '../../../db/schema.js';
import { numberToText } from '../../app/numbers.js';
import { gapText, unitLabel, type GapUnit } from '../../app/units.js';
import { ballastTypeWords, coreWords, earthListWords, moduleTypeWords, sensesWords } from './labels.js';

const n = (v: number, decimals = 3): string => numberToText(v, decimals);
/** Resistances from a fraction of an ohm to tens of kilohms, in the unit a meter would show. */
export const ohms = (v: number): string => (v >= 1000 ? `${n(v / 1000, 2)} kΩ` : `${n(v)} Ω`);

export function coilFigures(c: Coil) {
  return {
    primary: `${n(c.primaryResistanceOhm20C)} Ω`,
    inductance: `${n(c.primaryInductanceH * 1000, 2)} mH`,
    secondary: ohms(c.secondaryResistanceOhm),
    ratio: c.turnsRatio !== null ? `${n(c.turnsRatio, 1)} to 1` : c.secondaryInductanceH !== null ? `secondary ${n(c.secondaryInductanceH, 2)} H` : '—',
    feed: c.forBallast ? 'Behind a ballast' : 'Full supply',
    rated: `${c.ratedVoltageV} V`,
  };
}

export function ballastFigures(b: Ballast) {
  return {
    type: ballastTypeWords[b.ballastType],
    cold: `${n(b.coldResistanceOhm)} Ω`,
    thermal: b.thermalResistanceKPerW === null ? 'not given' : `${n(b.thermalResistanceKPerW, 1)} K/W`,
  };
}

export function moduleFigures(m: IgnitionModule) {
  const pct = (v: number | null): string => (v === null ? '?' : `${n(v * 100, 1)} %`);
  const dwell =
    m.moduleType === 'breakerless-current-limited'
      ? `Limits at ${m.currentLimitA === null ? '?' : n(m.currentLimitA, 2)} A; duty up to ${pct(m.maxDutyFraction)}`
      : m.moduleType === 'breakerless-fixed-duty'
        ? `Fixed ${pct(m.fixedDutyFraction)} duty; no current limit`
        : m.moduleType === 'transistor-points'
          ? 'Points set the dwell; no current limit'
          : m.cd
            ? `${n(m.cd.capacitorUf, 2)} µF charged to ${n(m.cd.chargeVoltageV, 0)} V${m.cd.multiSparkBelowRpm !== null ? `; several sparks below ${n(m.cd.multiSparkBelowRpm, 0)} rpm` : ''}`
            : 'CD stage not given';
  return {
    type: moduleTypeWords[m.moduleType],
    supply: `${n(m.supplyMinV, 1)} to ${n(m.supplyMaxV, 1)} V`,
    minCoil: `${n(m.minCoilResistanceOhm, 2)} Ω`,
    maxCurrent: `${n(m.maxCurrentA, 2)} A`,
    dwell,
    earth: earthListWords(m.earthPolarities),
  };
}

export function tachFigures(t: Tach) {
  return { senses: sensesWords[t.senses] };
}

export function leadsFigures(l: Leads) {
  return { core: coreWords[l.core], perLead: ohms(l.resistancePerLeadOhm) };
}

export function plugFigures(p: Plug, unit: GapUnit) {
  return {
    resistor: p.resistor ? `Yes, ${ohms(p.resistorOhm)}` : 'No',
    gaps: `${gapText(p.gapMinMm, unit)} to ${gapText(p.gapMaxMm, unit)} ${unitLabel(unit)}`,
  };
}
